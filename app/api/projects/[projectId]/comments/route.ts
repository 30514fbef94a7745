import { anonymousRefusal, perform } from "@/lib/actions/request";
import { crossSiteRefusal, failureResponse, isCrossSite, readJsonBody, resultResponse } from "@/lib/http";
import { addComment, versionComments } from "@/lib/sharing/comments";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

type Ctx = { params: Promise<{ projectId: string }> };

/** GET ?versionId=: the comments on an issued version (scenario.viewIssued). */
export async function GET(req: Request, { params }: Ctx) {
  const { projectId } = await params;
  const versionId = new URL(req.url).searchParams.get("versionId") ?? "";
  const r = await perform(versionComments, projectId, versionId);
  return resultResponse(r.ok ? { ok: true, value: { comments: r.value } } : r);
}

/** POST { versionId, body }: comment on an issued version (scenario.comment); the firm is e-mailed. */
export async function POST(req: Request, { params }: Ctx) {
  const { projectId } = await params;
  if (isCrossSite(req)) return crossSiteRefusal();
  const anonymous = await anonymousRefusal();
  if (anonymous) return failureResponse(anonymous);
  const body = await readJsonBody(req, 16 * 1024);
  if (!body.ok) return resultResponse(body);
  const v = body.value && typeof body.value === "object" ? (body.value as Record<string, unknown>) : {};
  const r = await perform(addComment, { versionId: v.versionId, body: v.body, projectId });
  return resultResponse(r, 201);
}
