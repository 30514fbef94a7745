"use server";

import { revalidatePath } from "next/cache";
import { db } from "@/db";
import { currentViewer, projectAccess } from "@/lib/auth/session";
import { saveBinTable } from "@/lib/climate/import";
import type { ActionResult } from "@/components/forms/errors";

/** Save an entered bin table (SI values) as a climate dataset of the project; climate.manage only. */
export async function saveBinTableAction(projectId: string, input: unknown): Promise<ActionResult<{ datasetId: string }>> {
  const viewer = await currentViewer();
  if (!viewer) return { ok: false, fieldErrors: {}, formError: "Your session has ended. Sign in again; nothing was saved." };
  const access = await projectAccess(viewer, projectId);
  if (!access) return { ok: false, fieldErrors: {}, formError: "That project was not found." };
  if (!access.can("climate.manage")) return { ok: false, fieldErrors: {}, formError: "You do not have permission to add climate data." };
  const { project } = access;
  const r = await saveBinTable(db, { projectId: project.id, firmId: project.firmId, actorId: viewer.id, siteElevationM: project.elevationM }, input);
  if (!r.ok) return { ok: false, fieldErrors: r.fieldErrors };
  revalidatePath(`/projects/${project.id}`);
  return { ok: true, data: { datasetId: r.datasetId } };
}
