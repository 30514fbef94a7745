import { db } from "@/db";
import { currentViewer } from "@/lib/auth/session";
import { revokeInvitation } from "@/lib/sharing/invitations";
import { errorResponse, isCrossSite, outcomeResponse } from "@/lib/sharing/http";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/** DELETE: withdraw an open invitation (access.revoke). */
export async function DELETE(req: Request, { params }: { params: Promise<{ projectId: string; invitationId: string }> }) {
  const { projectId, invitationId } = await params;
  if (isCrossSite(req)) return errorResponse(403, "Cross-site request refused.");
  return outcomeResponse(await revokeInvitation(db, await currentViewer(), projectId, invitationId));
}
