/**
 * WHO MAY DO WHAT — the reviewer's table, written out by hand from the product brief (shared roles:
 * consultant and firm admin of the project's firm, owner and finance invited to the project). Every
 * authorization test compares the code against THIS table, never against lib/auth/permissions.ts: a
 * change of the rules must be made in both places on purpose. An action missing here fails the suite.
 *
 * How each entry point answers a refusal (same for pages, server actions and route handlers):
 *   anonymous → 401 (pages: redirect to /signin) · no relation to the project (another firm's id) → 404
 *   · a relation without the right → 403 (client viewers asking for a draft: 404, no hint it exists)
 *   · bad input → 422 with field errors · a state conflict (stale save, nothing to issue) → 409.
 */
import type { Action } from "@/lib/auth/permissions";

const Y = true;
const _ = false;

// The columns are the point: one row per action, readable in one screen (prettier leaves it aligned).
//                                 admin consultant owner finance
// prettier-ignore
export const AUTHZ_TABLE = {
  "project.view":                [Y,    Y,         Y,    Y],
  "project.create":              [Y,    Y,         _,    _],
  "project.edit":                [Y,    Y,         _,    _],
  "project.delete":              [Y,    _,         _,    _],
  "climate.manage":              [Y,    Y,         _,    _],
  "scenario.viewDraft":          [Y,    Y,         _,    _],
  "scenario.edit":               [Y,    Y,         _,    _],
  "scenario.run":                [Y,    Y,         _,    _],
  "scenario.issue":              [Y,    Y,         _,    _],
  "scenario.viewIssued":         [Y,    Y,         Y,    Y],
  "scenario.whatIf":             [Y,    Y,         Y,    Y],
  "scenario.comment":            [Y,    Y,         Y,    Y],
  "scenario.viewCashFlows":      [Y,    Y,         _,    Y],
  "report.downloadPdf":          [Y,    Y,         Y,    Y],
  "report.downloadWorkbook":     [Y,    Y,         _,    Y],
  "access.share":                [Y,    Y,         _,    _],
  "access.revoke":               [Y,    Y,         _,    _],
  "audit.view":                  [Y,    Y,         _,    _],
  "firm.manageMembers":          [Y,    _,         _,    _],
} as const satisfies Record<Action, readonly [boolean, boolean, boolean, boolean]>;

export type TableRelation = "admin" | "consultant" | "owner" | "finance";
const COLUMN: Record<TableRelation, 0 | 1 | 2 | 3> = { admin: 0, consultant: 1, owner: 2, finance: 3 };

/** The table's answer; an action without a row throws (so a new action fails every matrix). */
export function expectedAllowed(relation: TableRelation | null, action: string): boolean {
  if (!relation) return false;
  const row = (AUTHZ_TABLE as Record<string, readonly boolean[]>)[action];
  if (!row) throw new Error(`Action ${action} has no row in tests/support/authz-table.ts`);
  return row[COLUMN[relation]]!;
}
