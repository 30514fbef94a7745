import { NextResponse } from "next/server";
import { db } from "@/db";
import { authorizeProjectApi } from "@/lib/auth/session";
import { importClimateFile, readClimateUpload } from "@/lib/climate/import";
import { listClimateDatasets } from "@/lib/climate/data";

// Parsing uses node:crypto and large strings: the Node runtime, never the edge.
export const runtime = "nodejs";
export const dynamic = "force-dynamic";

type Ctx = { params: Promise<{ projectId: string }> };

const noStore = { "cache-control": "no-store" };

/** A browser on another site cannot post here with the viewer's cookies (SameSite=Lax), but refuse a foreign Origin anyway. */
function foreignOrigin(request: Request): boolean {
  const origin = request.headers.get("origin");
  if (!origin) return false;
  const host = request.headers.get("x-forwarded-host") ?? request.headers.get("host");
  try {
    return new URL(origin).host !== host;
  } catch {
    return true;
  }
}

/** The project's climate datasets (anyone who may view the project). */
export async function GET(_request: Request, { params }: Ctx) {
  const { projectId } = await params;
  const auth = await authorizeProjectApi(projectId, "project.view");
  if (!auth.ok) return NextResponse.json(auth.body, { status: auth.status, headers: noStore });
  const datasets = await listClimateDatasets(auth.access);
  return NextResponse.json({ datasets }, { headers: noStore });
}

/**
 * Upload an EPW or hourly CSV weather file (multipart: `file`, optional `name`, optional `mapping` JSON for
 * CSV). 201 stored; 200 `{ step: "mapping", preview }` for a CSV without mapping; 413 over 10 MB;
 * 415 not a weather file; 422 the parser's line/field errors (nothing stored).
 */
export async function POST(request: Request, { params }: Ctx) {
  const { projectId } = await params;
  const auth = await authorizeProjectApi(projectId, "climate.manage");
  if (!auth.ok) return NextResponse.json(auth.body, { status: auth.status, headers: noStore });
  if (foreignOrigin(request)) return NextResponse.json({ error: "Cross-site upload refused." }, { status: 403, headers: noStore });
  const upload = await readClimateUpload(request);
  if (!upload.ok) return NextResponse.json(upload.outcome.body, { status: upload.outcome.status, headers: noStore });
  const { project, viewer } = auth.access;
  const outcome = await importClimateFile(
    db,
    { projectId: project.id, firmId: project.firmId, actorId: viewer.id, siteElevationM: project.elevationM },
    upload.form,
  );
  return NextResponse.json(outcome.body, { status: outcome.status, headers: noStore });
}
