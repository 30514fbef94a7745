import { db } from "@/db";
import { currentViewer } from "@/lib/auth/session";
import { revokeViewerAccess } from "@/lib/sharing/access";
import { errorResponse, isCrossSite, outcomeResponse } from "@/lib/sharing/http";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/** DELETE: revoke a client viewer's access (access.revoke); effective at their next request. */
export async function DELETE(req: Request, { params }: { params: Promise<{ projectId: string; userId: string }> }) {
  const { projectId, userId } = await params;
  if (isCrossSite(req)) return errorResponse(403, "Cross-site request refused.");
  return outcomeResponse(await revokeViewerAccess(db, await currentViewer(), projectId, userId));
}
