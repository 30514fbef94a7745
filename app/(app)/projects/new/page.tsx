import type { Metadata } from "next";
import { forbidden } from "next/navigation";
import { requireViewer } from "@/lib/auth/session";
import { canInFirm } from "@/lib/auth/permissions";
import { newProjectDefaults } from "@/lib/projects/schema";
import { PageHeader, Panel } from "@/components/ui/panel";
import { ProjectForm } from "./project-form";

export const metadata: Metadata = { title: "New project" };

/** New project: for members of a consulting firm (project.create in at least one firm). */
export default async function NewProjectPage() {
  const viewer = await requireViewer();
  const firms = viewer.firms.filter((f) => canInFirm(viewer.principal, f.firmId, "project.create"));
  if (firms.length === 0) forbidden();
  return (
    <>
      <PageHeader title="New project" subtitle="A client site whose condenser heat rejection you will compare. You can change all of this later." />
      <Panel>
        <ProjectForm
          mode="create"
          firms={firms.map((f) => ({ firmId: f.firmId, firmName: f.firmName }))}
          initial={{ ...newProjectDefaults, elevationM: undefined, firmId: firms[0]!.firmId }}
          cancelHref="/projects"
        />
      </Panel>
    </>
  );
}
