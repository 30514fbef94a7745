import { db } from "@/db";
import { env } from "@/lib/env";
import { currentViewer } from "@/lib/auth/session";
import { addComment, versionComments } from "@/lib/sharing/comments";
import { success } from "@/lib/sharing/outcome";
import { errorResponse, isCrossSite, outcomeResponse, readJsonBody } from "@/lib/sharing/http";
import { kickMailer } from "@/lib/mail/worker";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

type Ctx = { params: Promise<{ projectId: string }> };

/** GET ?versionId=: the comments on an issued version (scenario.viewIssued). */
export async function GET(req: Request, { params }: Ctx) {
  const { projectId } = await params;
  const versionId = new URL(req.url).searchParams.get("versionId") ?? "";
  const r = await versionComments(db, await currentViewer(), projectId, versionId);
  return outcomeResponse(r.ok ? success({ comments: r.value }) : r);
}

/** POST { versionId, body }: comment on an issued version (scenario.comment); the firm is e-mailed. */
export async function POST(req: Request, { params }: Ctx) {
  const { projectId } = await params;
  if (isCrossSite(req)) return errorResponse(403, "Cross-site request refused.");
  const body = (await readJsonBody(req)) as { versionId?: unknown; body?: unknown } | undefined;
  const versionId = typeof body?.versionId === "string" ? body.versionId : "";
  const r = await addComment(db, await currentViewer(), projectId, versionId, { body: body?.body }, { appUrl: env().APP_URL });
  if (r.ok) kickMailer();
  return outcomeResponse(r, 201);
}
