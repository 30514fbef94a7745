import { NextResponse } from "next/server";
import { findOwnApiAnalysis } from "@/lib/analyses/data";
import { currentViewer, isUuid } from "@/lib/auth/session";
import { jsonError } from "@/lib/http";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/**
 * A queued analysis API request, for the user who made it (anyone else gets 404, as for an unknown id).
 * While it waits or runs: 200 with its status and `Retry-After: 2`; when done, the same body as a
 * synchronous POST /api/v1/analyses answer plus `status: "done"`; when failed, the reason. Results are
 * kept for a day.
 */
export async function GET(_request: Request, { params }: { params: Promise<{ analysisId: string }> }) {
  const { analysisId } = await params;
  const viewer = await currentViewer();
  if (!viewer) return jsonError(401, "Sign in first.");
  if (!isUuid(analysisId)) return jsonError(404, "No such analysis.");
  const row = await findOwnApiAnalysis(viewer.id, analysisId);
  if (!row) return jsonError(404, "No such analysis.");
  const base = { id: row.id, status: row.status, createdAt: row.createdAt, startedAt: row.startedAt, finishedAt: row.finishedAt };
  if (row.status === "done") return NextResponse.json({ ...base, ...(row.result as object) }, { headers: { "cache-control": "no-store" } });
  if (row.status === "failed") return NextResponse.json({ ...base, error: row.error }, { headers: { "cache-control": "no-store" } });
  return NextResponse.json(base, { headers: { "cache-control": "no-store", "retry-after": "2" } });
}
