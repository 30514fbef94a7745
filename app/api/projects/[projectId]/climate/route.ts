import { crossSiteRefusal, isCrossSite, jsonOk, NO_STORE } from "@/lib/http";
import { NextResponse } from "next/server";
import { authorizeProjectApi } from "@/lib/auth/session";
import { readClimateUpload } from "@/lib/climate/import";
import { importClimateUpload, listClimateDatasets } from "@/lib/climate/data";

// Parsing uses node:crypto and large strings: the Node runtime, never the edge.
export const runtime = "nodejs";
export const dynamic = "force-dynamic";

type Ctx = { params: Promise<{ projectId: string }> };

/** The project's climate datasets (anyone who may view the project). */
export async function GET(_request: Request, { params }: Ctx) {
  const { projectId } = await params;
  const auth = await authorizeProjectApi(projectId, "project.view");
  if (!auth.ok) return NextResponse.json(auth.body, { status: auth.status, headers: NO_STORE });
  const datasets = await listClimateDatasets(auth.access);
  return jsonOk({ datasets });
}

/**
 * Upload an EPW or hourly CSV weather file (multipart: `file`, optional `name`, optional `mapping` JSON for
 * CSV). 201 stored; 200 `{ step: "mapping", preview }` for a CSV without mapping; 413 over 10 MB;
 * 415 not a weather file; 422 the parser's line/field errors (nothing stored).
 */
export async function POST(request: Request, { params }: Ctx) {
  const { projectId } = await params;
  const auth = await authorizeProjectApi(projectId, "climate.manage");
  if (!auth.ok) return NextResponse.json(auth.body, { status: auth.status, headers: NO_STORE });
  if (isCrossSite(request)) return crossSiteRefusal();
  const upload = await readClimateUpload(request);
  if (!upload.ok) return NextResponse.json(upload.outcome.body, { status: upload.outcome.status, headers: NO_STORE });
  const { project, viewer } = auth.access;
  const outcome = await importClimateUpload(
    { projectId: project.id, firmId: project.firmId, actorId: viewer.id, siteElevationM: project.elevationM },
    upload.form,
  );
  return NextResponse.json(outcome.body, { status: outcome.status, headers: NO_STORE });
}
