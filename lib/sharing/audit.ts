import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { authorizeProject, type Viewer } from "@/lib/auth/access";
import { listProjectAudit } from "@/db/queries/audit";
import { ok, type Result } from "@/lib/result";

/** Plain words for the audit trail; unknown actions show their code. */
export const AUDIT_LABELS: Record<string, string> = {
  "invitation.create": "invited",
  "invitation.revoke": "withdrew an invitation",
  "invitation.accept": "accepted an invitation",
  "access.revoke": "revoked access",
  "version.issue": "issued a version",
  "version.view": "viewed an issued version",
  "comment.create": "commented",
  "user.passwordChange": "changed their password",
  "scenario.issue": "issued a version",
  "scenario.create": "created a scenario",
  "scenario.save": "saved a scenario",
  "scenario.clone": "copied a scenario",
  "scenario.archive": "archived a scenario",
  "scenario.restore": "restored a scenario",
  "scenario.export": "exported a scenario",
  "scenario.results.view": "read results",
  "report.download": "downloaded",
  "project.create": "created the project",
  "project.edit": "edited the project",
  "climate.import": "imported climate data",
  "climate.view": "viewed climate data",
};

/** "climate.binsSave" → "climate bins save": readable enough for an action this table does not know yet. */
export function humanizeAction(action: string): string {
  return action
    .split(".")
    .map((p) => p.replace(/([a-z])([A-Z])/g, "$1 $2").toLowerCase())
    .join(" ");
}

/** The event kinds the trail groups by (filter chips on the project page). */
export function auditCategory(action: string): "shared" | "revoked" | "issued" | "viewed" | "downloaded" | "changed" | "commented" {
  if (action.startsWith("invitation.create") || action === "invitation.accept") return "shared";
  if (action.endsWith(".revoke")) return "revoked";
  if (action === "version.issue" || action === "scenario.issue") return "issued";
  if (action.endsWith(".view")) return "viewed";
  if (/download|export|report|workbook|csv/i.test(action)) return "downloaded";
  if (action.startsWith("comment.")) return "commented";
  return "changed";
}

export interface AuditEntry {
  id: string;
  at: Date;
  action: string;
  label: string;
  category: ReturnType<typeof auditCategory>;
  actorName: string | null;
  actorEmail: string | null;
  targetType: string | null;
  summary: string;
}

function summarize(detail: Record<string, unknown>): string {
  const parts: string[] = [];
  const pick = (k: string, f: (v: unknown) => string = String) => {
    if (detail[k] !== undefined && detail[k] !== null && detail[k] !== "") parts.push(f(detail[k]));
  };
  pick("email");
  pick("name");
  pick("role", (v) => `as ${String(v)}`);
  pick("scenarioName");
  pick("versionNumber", (v) => `v${String(v)}`);
  pick("version", (v) => `v${String(v)}`);
  pick("format");
  pick("reason", (v) => `(${String(v)})`);
  return parts.join(" · ");
}

/** The project's audit trail for the firm (audit.view): newest first, as readable rows, no raw detail. */
export async function projectAuditTrail(
  db: Kysely<Database>,
  viewer: Viewer | null,
  projectId: string,
  limit = 100,
): Promise<Result<AuditEntry[]>> {
  const auth = await authorizeProject(db, viewer, projectId, "audit.view");
  if (!auth.ok) return auth;
  const rows = await listProjectAudit(db, projectId, limit);
  return ok(
    rows.map((r) => ({
      id: String(r.id),
      at: r.at,
      action: r.action,
      label: AUDIT_LABELS[r.action] ?? humanizeAction(r.action),
      category: auditCategory(r.action),
      actorName: r.actorName,
      actorEmail: r.actorEmail,
      targetType: r.targetType,
      summary: summarize((r.detail ?? {}) as Record<string, unknown>),
    })),
  );
}
