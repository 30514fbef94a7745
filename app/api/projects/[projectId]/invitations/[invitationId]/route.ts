import { perform } from "@/lib/actions/request";
import { crossSiteRefusal, isCrossSite, resultResponse } from "@/lib/http";
import { revokeInvitation } from "@/lib/sharing/invitations";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/** DELETE: withdraw an open invitation (access.revoke). */
export async function DELETE(req: Request, { params }: { params: Promise<{ projectId: string; invitationId: string }> }) {
  const { projectId, invitationId } = await params;
  if (isCrossSite(req)) return crossSiteRefusal();
  return resultResponse(await perform(revokeInvitation, { projectId, invitationId }));
}
