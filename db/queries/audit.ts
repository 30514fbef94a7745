import type { Executor } from "../schema";


export interface AuditInput {
  actorId: string | null;
  firmId?: string | null;
  projectId?: string | null;
  action: string;
  targetType?: string | null;
  targetId?: string | null;
  detail?: Record<string, unknown>;
}

export async function writeAudit(db: Executor, e: AuditInput): Promise<void> {
  await db
    .insertInto("audit_events")
    .values({
      actor_id: e.actorId,
      firm_id: e.firmId ?? null,
      project_id: e.projectId ?? null,
      action: e.action,
      target_type: e.targetType ?? null,
      target_id: e.targetId ?? null,
      detail: JSON.stringify(e.detail ?? {}),
    })
    .execute();
}

export async function listProjectAudit(db: Executor, projectId: string, limit = 100) {
  return db
    .selectFrom("audit_events")
    .leftJoin("users", "users.id", "audit_events.actor_id")
    .select([
      "audit_events.id",
      "audit_events.at",
      "audit_events.action",
      "audit_events.target_type as targetType",
      "audit_events.target_id as targetId",
      "audit_events.detail",
      "users.name as actorName",
      "users.email as actorEmail",
    ])
    .where("audit_events.project_id", "=", projectId)
    .orderBy("audit_events.at", "desc")
    .orderBy("audit_events.id", "desc")
    .limit(limit)
    .execute();
}
