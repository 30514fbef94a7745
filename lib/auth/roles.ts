import type { FirmRole, ProjectRole } from "@/db/enums";

/** Role strings live with the schema (db/enums.ts); the app reads them from here. */
export { FIRM_ROLES, PROJECT_ROLES, UNIT_SYSTEMS, type FirmRole, type ProjectRole, type UnitSystem } from "@/db/enums";

export const ROLE_LABELS: Record<FirmRole | ProjectRole, string> = {
  admin: "Firm admin",
  consultant: "Consultant",
  owner: "Owner (client viewer)",
  finance: "Finance (client viewer)",
};
