import type { Metadata } from "next";
import Link from "next/link";
import { forbidden, notFound } from "next/navigation";
import { perform } from "@/lib/actions/request";
import { requireViewer } from "@/lib/auth/session";
import { scenarioVersions } from "@/lib/sharing/versions";
import { EmptyState, PageHeader, Panel } from "@/components/ui/panel";
import { IssueForm } from "./_components/issue-form";
import { VersionList } from "./_components/version-list";

export const metadata: Metadata = { title: "Issued versions" };

/** A scenario's issued versions; for the firm also the form that issues the draft as the next one. */
export default async function VersionsPage({ params }: { params: Promise<{ projectId: string; scenarioId: string }> }) {
  const { projectId, scenarioId } = await params;
  await requireViewer();
  const r = await perform(scenarioVersions, projectId, scenarioId);
  if (!r.ok) return r.status === 403 ? forbidden() : notFound();
  const { access, draft, versions } = r.value;
  const title = draft?.name ?? versions[0]?.name ?? "Scenario";
  const nextNumber = (versions[0]?.versionNumber ?? 0) + 1;
  return (
    <>
      <PageHeader
        title={`${title}: issued versions`}
        subtitle={
          <Link href={`/projects/${projectId}`} className="text-basin-700 hover:underline">
            {access.project.name}
          </Link>
        }
      />
      <div className="space-y-6">
        {draft && access.can("scenario.issue") && (
          <Panel title="Issue the draft">
            <p className="mb-3 text-sm text-ink-soft">
              Draft revision {draft.revision}.{" "}
              <Link href={`/projects/${projectId}/scenarios/${scenarioId}`} className="text-basin-700 hover:underline">
                Open the draft
              </Link>
            </p>
            {draft.archived ? (
              <p className="text-sm text-caution-800">This scenario is archived; restore it before issuing.</p>
            ) : draft.firstCostsMissing.length > 0 ? (
              <p className="text-sm text-caution-800" data-testid="issue-needs-first-costs">
                Enter the first costs of {draft.firstCostsMissing.join(", ")} before issuing: an issued version carries a complete life-cycle cost.{" "}
                <Link href={`/projects/${projectId}/scenarios/${scenarioId}/edit?section=option-1`} className="text-basin-700 underline">
                  Enter them in the editor
                </Link>
              </p>
            ) : (
              <IssueForm projectId={projectId} scenarioId={scenarioId} nextNumber={nextNumber} />
            )}
          </Panel>
        )}
        <Panel title="Issued versions">
          {versions.length === 0 ? (
            <EmptyState title="Nothing issued yet.">Client viewers see this scenario once a version is issued.</EmptyState>
          ) : (
            <VersionList projectId={projectId} versions={versions} />
          )}
        </Panel>
      </div>
    </>
  );
}
