import type { Metadata } from "next";
import { requireProjectAction } from "@/lib/auth/session";
import { formatQuantity } from "@/lib/units";
import { PageHeader, Panel } from "@/components/ui/panel";
import { ClimateSection } from "./_components/climate-section";
import { ScenarioSection } from "./_components/scenario-section";
import { AccessSection } from "./_components/access-section";
import { AuditSection } from "./_components/audit-section";
import { ProjectActions } from "./_components/project-actions";

export const metadata: Metadata = { title: "Project" };

/** The project page: site, climate datasets, scenarios, then (for the firm) access and the audit trail. */
export default async function ProjectPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const access = await requireProjectAction(projectId, "project.view");
  const { project, relation } = access;
  return (
    <>
      <PageHeader
        title={project.name}
        subtitle={`${project.clientName} · ${project.siteName}${project.locationLabel ? ` — ${project.locationLabel}` : ""}`}
        actions={<ProjectActions access={access} />}
      />
      <div className="space-y-6">
        <Panel title="Site">
          <dl className="grid grid-cols-2 gap-x-6 gap-y-2 text-sm md:grid-cols-4">
            <dt className="text-ink-faint">Elevation</dt>
            <dd className="num text-left" data-testid="project-elevation">
              {/* In the project's units like every other figure; the stored metres beside it when those are feet. */}
              {formatQuantity("elevationM", project.elevationM, project.unitSystem, { decimals: 0 })}
              {project.unitSystem === "IP" ? ` (${formatQuantity("elevationM", project.elevationM, "SI", { decimals: 0 })})` : ""}
            </dd>
            <dt className="text-ink-faint">Units shown</dt>
            <dd>{project.unitSystem}</dd>
            <dt className="text-ink-faint">Currency</dt>
            <dd>{project.currency}</dd>
            <dt className="text-ink-faint">Consulting firm</dt>
            <dd>{project.firmName}</dd>
          </dl>
          <p className="mt-4 text-xs text-ink-faint" data-testid="project-relation">Your access: {relation}</p>
        </Panel>
        <ScenarioSection access={access} />
        <ClimateSection access={access} />
        <AccessSection access={access} />
        <AuditSection access={access} />
      </div>
    </>
  );
}
