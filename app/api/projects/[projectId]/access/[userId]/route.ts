import { perform } from "@/lib/actions/request";
import { crossSiteRefusal, isCrossSite, resultResponse } from "@/lib/http";
import { revokeViewerAccess } from "@/lib/sharing/access";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/** DELETE: revoke a client viewer's access (access.revoke); effective at their next request. */
export async function DELETE(req: Request, { params }: { params: Promise<{ projectId: string; userId: string }> }) {
  const { projectId, userId } = await params;
  if (isCrossSite(req)) return crossSiteRefusal();
  return resultResponse(await perform(revokeViewerAccess, { projectId, userId }));
}
