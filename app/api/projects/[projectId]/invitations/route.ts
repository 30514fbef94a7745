import { db } from "@/db";
import { env } from "@/lib/env";
import { currentViewer } from "@/lib/auth/session";
import { accessOverview, createInvitation } from "@/lib/sharing/invitations";
import { success } from "@/lib/sharing/outcome";
import { errorResponse, isCrossSite, outcomeResponse, readJsonBody } from "@/lib/sharing/http";
import { kickMailer } from "@/lib/mail/worker";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

type Ctx = { params: Promise<{ projectId: string }> };

/** GET: the project's invitations with state and e-mail delivery (access.share). */
export async function GET(_req: Request, { params }: Ctx) {
  const { projectId } = await params;
  const r = await accessOverview(db, await currentViewer(), projectId);
  return outcomeResponse(r.ok ? success({ invitations: r.value.invitations }) : r);
}

/** POST { email, role }: invite (access.share); 201 with the invitation's id, state and expiry. */
export async function POST(req: Request, { params }: Ctx) {
  const { projectId } = await params;
  if (isCrossSite(req)) return errorResponse(403, "Cross-site request refused.");
  const r = await createInvitation(db, await currentViewer(), projectId, await readJsonBody(req), { appUrl: env().APP_URL });
  if (r.ok) kickMailer();
  return outcomeResponse(r, 201);
}
