import "server-only";
import { db } from "@/db";
import { findApiAnalysisOfUser, insertApiAnalysis } from "@/db/queries/api-analyses";
import { writeAudit } from "@/db/queries/audit";
import { sendJob } from "@/lib/jobs/boss";
import { fitsLimits, lockAndCountOpenWork } from "@/lib/jobs/limits";
import { QUEUES } from "@/lib/jobs/queues";

/**
 * Data access of the analysis API (/api/v1/analyses): requests are the signed-in user's own; nothing of
 * a user's saved work is touched.
 */

/** Audit an analysis answered at once. */
export async function auditImmediateAnalysis(userId: string, detail: Record<string, unknown>): Promise<void> {
  await writeAudit(db, { actorId: userId, action: "analysis.api", targetType: "analysis", detail: { ...detail, mode: "sync" } });
}

export type QueuedAnalysis =
  | { ok: true; row: { id: string; status: string; createdAt: Date } }
  | { ok: false; message: string };

/**
 * Queue an analysis for a worker, under the user's limits on waiting work, in one transaction with its
 * job and audit row (all or nothing).
 */
export async function queueApiAnalysis(
  userId: string,
  req: { draws: number; inputsHash: string; input: unknown; options: number },
): Promise<QueuedAnalysis> {
  return db.transaction().execute(async (trx) => {
    const room = fitsLimits(await lockAndCountOpenWork(trx, userId), req.draws);
    if (!room.ok) return room;
    const row = await insertApiAnalysis(trx, { userId, draws: req.draws, inputsHash: req.inputsHash, input: req.input });
    await sendJob(trx, QUEUES.apiAnalysis, { kind: "apiAnalysis", analysisId: row.id }, { singletonKey: row.id });
    await writeAudit(trx, {
      actorId: userId,
      action: "analysis.api",
      targetType: "analysis",
      targetId: row.id,
      detail: { inputsHash: req.inputsHash, options: req.options, draws: req.draws, mode: "queued" },
    });
    return { ok: true as const, row };
  });
}

/** The user's own analysis request, or undefined (another user's id reads as unknown). */
export function findOwnApiAnalysis(userId: string, analysisId: string) {
  return findApiAnalysisOfUser(db, analysisId, userId);
}
