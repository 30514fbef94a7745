/**
 * Role and unit-system strings, defined once for the database and the app (lib/auth/roles.ts re-exports
 * them). The migrations mirror them in CHECK constraints (a test compares both). Pure constants: safe in
 * the browser bundle.
 * Firm roles belong to consultants' firms; project roles are client viewers invited to one project.
 */
export const FIRM_ROLES = ["admin", "consultant"] as const;
export type FirmRole = (typeof FIRM_ROLES)[number];

export const PROJECT_ROLES = ["owner", "finance"] as const;
export type ProjectRole = (typeof PROJECT_ROLES)[number];

export const UNIT_SYSTEMS = ["SI", "IP"] as const;
export type UnitSystem = (typeof UNIT_SYSTEMS)[number];
