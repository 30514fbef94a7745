import type { Metadata } from "next";
import { requireProjectAction } from "@/lib/auth/session";
import { PageHeader, Panel } from "@/components/ui/panel";
import { ProjectForm } from "../../new/project-form";

export const metadata: Metadata = { title: "Edit project" };

export default async function EditProjectPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const { project } = await requireProjectAction(projectId, "project.edit");
  return (
    <>
      <PageHeader title="Edit project" subtitle={project.name} />
      <Panel>
        <ProjectForm
          mode="edit"
          projectId={project.id}
          revision={project.revision}
          firms={[]}
          initial={{
            firmId: project.firmId,
            clientName: project.clientName,
            name: project.name,
            siteName: project.siteName,
            locationLabel: project.locationLabel,
            elevationM: project.elevationM,
            unitSystem: project.unitSystem,
            currency: project.currency,
          }}
          cancelHref={`/projects/${project.id}`}
        />
      </Panel>
    </>
  );
}
