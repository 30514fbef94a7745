import type { Metadata } from "next";
import { requireProjectAction } from "@/lib/auth/session";
import { PageHeader, Panel } from "@/components/ui/panel";

export const metadata: Metadata = { title: "Project" };

export default async function ProjectPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const { project, relation } = await requireProjectAction(projectId, "project.view");
  return (
    <>
      <PageHeader
        title={project.name}
        subtitle={`${project.clientName} · ${project.siteName}${project.locationLabel ? ` — ${project.locationLabel}` : ""}`}
      />
      <Panel title="Site">
        <dl className="grid grid-cols-2 gap-x-6 gap-y-2 text-sm md:grid-cols-4">
          <dt className="text-ink-faint">Elevation</dt>
          <dd className="num text-left">{project.elevationM.toFixed(0)} m</dd>
          <dt className="text-ink-faint">Units shown</dt>
          <dd>{project.unitSystem}</dd>
          <dt className="text-ink-faint">Currency</dt>
          <dd>{project.currency}</dd>
          <dt className="text-ink-faint">Consulting firm</dt>
          <dd>{project.firmName}</dd>
        </dl>
        <p className="mt-4 text-xs text-ink-faint" data-testid="project-relation">Your access: {relation}</p>
      </Panel>
    </>
  );
}
