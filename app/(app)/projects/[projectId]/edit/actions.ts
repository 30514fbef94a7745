"use server";

import { revalidatePath } from "next/cache";
import { perform } from "@/lib/actions/request";
import { updateProject } from "@/lib/projects/data";

/** Save a project's fields; authorization (project.edit) and validation happen in the wrapper. */
export async function updateProjectAction(projectId: string, input: Record<string, unknown>) {
  const r = await perform(updateProject, { ...input, projectId });
  if (r.ok) {
    revalidatePath(`/projects/${projectId}`);
    revalidatePath("/projects");
  }
  return r;
}
