"use server";

import { revalidatePath } from "next/cache";
import { db } from "@/db";
import { currentViewer, isUuid } from "@/lib/auth/session";
import { updateProjectFor } from "@/lib/projects/data";
import type { ActionResult } from "@/components/forms/errors";

/** Save a project's fields; authorization (project.edit) and validation happen in the DAL. */
export async function updateProjectAction(projectId: string, input: unknown): Promise<ActionResult<{ changed: string[] }>> {
  const viewer = await currentViewer();
  if (!viewer) return { ok: false, fieldErrors: {}, formError: "Your session has ended. Sign in again; nothing was saved." };
  if (!isUuid(projectId)) return { ok: false, fieldErrors: {}, formError: "That project was not found." };
  const result = await updateProjectFor(db, { userId: viewer.id, principal: viewer.principal }, projectId, input);
  if (result.ok) {
    revalidatePath(`/projects/${projectId}`);
    revalidatePath("/projects");
  }
  return result;
}
