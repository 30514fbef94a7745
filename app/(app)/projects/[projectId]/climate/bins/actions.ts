"use server";

import { revalidatePath } from "next/cache";
import { perform } from "@/lib/actions/request";
import { saveBinTable } from "@/lib/climate/import";

/** Save an entered bin table (SI values) as a climate dataset of the project; climate.manage only. */
export async function saveBinTableAction(projectId: string, input: Record<string, unknown>) {
  const r = await perform(saveBinTable, { ...input, projectId });
  if (r.ok) revalidatePath(`/projects/${projectId}`);
  return r;
}
