import { db } from "@/db";
import { currentViewer } from "@/lib/auth/session";
import { accessOverview } from "@/lib/sharing/invitations";
import { success } from "@/lib/sharing/outcome";
import { outcomeResponse } from "@/lib/sharing/http";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/** GET: the project's client viewers with role and since when (access.share). */
export async function GET(_req: Request, { params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const r = await accessOverview(db, await currentViewer(), projectId);
  return outcomeResponse(r.ok ? success({ viewers: r.value.viewers }) : r);
}
