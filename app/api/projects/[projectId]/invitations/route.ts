import { anonymousRefusal, perform } from "@/lib/actions/request";
import { crossSiteRefusal, failureResponse, isCrossSite, readJsonBody, resultResponse } from "@/lib/http";
import { accessOverview, createInvitation } from "@/lib/sharing/invitations";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

type Ctx = { params: Promise<{ projectId: string }> };

/** GET: the project's invitations with state and e-mail delivery (access.share). */
export async function GET(_req: Request, { params }: Ctx) {
  const { projectId } = await params;
  const r = await perform(accessOverview, projectId);
  return resultResponse(r.ok ? { ok: true, value: { invitations: r.value.invitations } } : r);
}

/** POST { email, role }: invite (access.share); 201 with the invitation's id, state and expiry. */
export async function POST(req: Request, { params }: Ctx) {
  const { projectId } = await params;
  if (isCrossSite(req)) return crossSiteRefusal();
  const anonymous = await anonymousRefusal();
  if (anonymous) return failureResponse(anonymous);
  const body = await readJsonBody(req, 16 * 1024);
  if (!body.ok) return resultResponse(body);
  const r = await perform(createInvitation, { ...asObject(body.value), projectId });
  return resultResponse(r, 201);
}

function asObject(v: unknown): Record<string, unknown> {
  return v && typeof v === "object" && !Array.isArray(v) ? (v as Record<string, unknown>) : {};
}
