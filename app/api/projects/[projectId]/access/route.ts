import { perform } from "@/lib/actions/request";
import { resultResponse } from "@/lib/http";
import { accessOverview } from "@/lib/sharing/invitations";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/** GET: the project's client viewers with role and since when (access.share). */
export async function GET(_req: Request, { params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const r = await perform(accessOverview, projectId);
  return resultResponse(r.ok ? { ok: true, value: { viewers: r.value.viewers } } : r);
}
