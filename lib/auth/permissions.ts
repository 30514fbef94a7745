import type { FirmRole, ProjectRole } from "./roles";

/**
 * LoopLedger's permission rules: the single source of truth, pure and unit-tested.
 * Every page, server action and route handler asks `can()` through the DAL (lib/auth/session.ts).
 *
 * A viewer's relation to a project is the strongest of: admin or consultant of the project's firm,
 * or a client viewer (owner / finance) granted on that project.
 */
export const ACTIONS = [
  "project.view",
  "project.create",
  "project.edit",
  "project.delete",
  "climate.manage",
  "scenario.viewDraft",
  "scenario.edit",
  "scenario.run",
  "scenario.issue",
  "scenario.viewIssued",
  "scenario.whatIf",
  "scenario.comment",
  "scenario.viewCashFlows",
  "report.downloadPdf",
  "report.downloadWorkbook",
  "access.share",
  "access.revoke",
  "audit.view",
  "firm.manageMembers",
] as const;
export type Action = (typeof ACTIONS)[number];

export type ProjectRelation = FirmRole | ProjectRole;

const CLIENT_VIEWER: readonly Action[] = [
  "project.view",
  "scenario.viewIssued",
  "scenario.whatIf",
  "scenario.comment",
  "report.downloadPdf",
];

const RULES: Record<ProjectRelation, readonly Action[]> = {
  admin: ACTIONS,
  consultant: ACTIONS.filter((a) => a !== "firm.manageMembers" && a !== "project.delete"),
  owner: CLIENT_VIEWER,
  finance: [...CLIENT_VIEWER, "scenario.viewCashFlows", "report.downloadWorkbook"],
};

export interface Principal {
  userId: string;
  firms: { firmId: string; role: FirmRole }[];
}

export interface ProjectGrant {
  projectId: string;
  firmId: string;
  /** The viewer's client role on this project, if any (from project_access). */
  clientRole: ProjectRole | null;
}

/** The viewer's relation to a project, or null when they have none (the project does not exist for them). */
export function relationTo(principal: Principal, grant: ProjectGrant): ProjectRelation | null {
  const firmRole = principal.firms.find((f) => f.firmId === grant.firmId)?.role;
  if (firmRole) return firmRole;
  return grant.clientRole;
}

/** May a viewer with this relation do this action? */
export function allows(relation: ProjectRelation | null, action: Action): boolean {
  if (!relation) return false;
  return RULES[relation].includes(action);
}

/** May this principal do this action on this project? */
export function can(principal: Principal, grant: ProjectGrant, action: Action): boolean {
  return allows(relationTo(principal, grant), action);
}

/** Firm-level actions that need no project: creating projects and managing members. */
export function canInFirm(principal: Principal, firmId: string, action: "project.create" | "firm.manageMembers"): boolean {
  const role = principal.firms.find((f) => f.firmId === firmId)?.role;
  return allows(role ?? null, action);
}

/** Client viewers see issued versions only; the firm sees drafts too. */
export function seesDrafts(relation: ProjectRelation | null): boolean {
  return allows(relation, "scenario.viewDraft");
}

/** Navigation entries a signed-in user may see: client viewers get only their shared projects and account. */
export function navigationFor(principal: Principal): { href: string; label: string }[] {
  const items = [{ href: "/projects", label: "Projects" }];
  if (principal.firms.some((f) => allows(f.role, "project.create"))) items.push({ href: "/projects/new", label: "New project" });
  if (principal.firms.some((f) => allows(f.role, "firm.manageMembers"))) items.push({ href: "/firm", label: "Firm members" });
  items.push({ href: "/methods", label: "Methods" });
  items.push({ href: "/account", label: "Account" });
  return items;
}

export const PERMISSION_TABLE = RULES;
