"use server";

import { revalidatePath } from "next/cache";
import { perform } from "@/lib/actions/request";
import { createProject } from "@/lib/projects/data";

/** Create a project. The session is re-read here: the form's own checks are only for feedback. */
export async function createProjectAction(input: Record<string, unknown>) {
  const r = await perform(createProject, input);
  if (r.ok) revalidatePath("/projects");
  return r;
}
