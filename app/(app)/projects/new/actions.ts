"use server";

import { revalidatePath } from "next/cache";
import { db } from "@/db";
import { currentViewer } from "@/lib/auth/session";
import { createProjectFor } from "@/lib/projects/data";
import type { ActionResult } from "@/components/forms/errors";

/** Create a project. The session is re-read here: the form's own checks are only for feedback. */
export async function createProjectAction(input: unknown): Promise<ActionResult<{ projectId: string }>> {
  const viewer = await currentViewer();
  if (!viewer) return { ok: false, fieldErrors: {}, formError: "Your session has ended. Sign in again; nothing was saved." };
  const result = await createProjectFor(db, { userId: viewer.id, principal: viewer.principal }, input);
  if (result.ok) revalidatePath("/projects");
  return result;
}
