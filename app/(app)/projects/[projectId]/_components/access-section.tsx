import Link from "next/link";
import { perform } from "@/lib/actions/request";
import type { ProjectAccess } from "@/lib/auth/session";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { accessOverview } from "@/lib/sharing/invitations";
import { listIssuedVersions } from "@/lib/sharing/versions";
import { EmptyState, Panel } from "@/components/ui/panel";
import { ButtonLink } from "@/components/ui/button";
import { VersionList } from "../scenarios/[scenarioId]/versions/_components/version-list";

/**
 * Sharing on the project page. Client viewers: the issued comparisons shared with them (nothing else of
 * the project's scenarios exists for them). The firm: who has access, open invitations, and every issued version.
 */
export async function AccessSection({ access }: { access: ProjectAccess }) {
  const projectId = access.project.id;
  const versions = await perform(listIssuedVersions, projectId);
  const issued = versions.ok ? versions.value : [];

  if (!access.can("access.share")) {
    return (
      <Panel title="Issued comparisons">
        {issued.length === 0 ? (
          <EmptyState title="Nothing has been issued to you yet.">
            The consultant issues a comparison when it is ready; it appears here, and you can comment on it.
          </EmptyState>
        ) : (
          <VersionList projectId={projectId} versions={issued} testId="issued-comparisons" />
        )}
      </Panel>
    );
  }

  const overview = await perform(accessOverview, projectId);
  const viewers = overview.ok ? overview.value.viewers : [];
  const open = overview.ok ? overview.value.invitations.filter((i) => i.state === "pending") : [];
  const failedMail = overview.ok ? overview.value.invitations.filter((i) => i.state === "pending" && i.mail?.status === "failed").length : 0;
  return (
    <Panel
      title="Sharing"
      actions={
        <ButtonLink href={`/projects/${projectId}/access`} variant="secondary">
          Manage access
        </ButtonLink>
      }
    >
      <div className="grid gap-6 md:grid-cols-2">
        <div>
          <h3 className="mb-2 text-sm font-semibold">Client viewers ({viewers.length})</h3>
          {viewers.length === 0 ? (
            <p className="text-sm text-ink-soft">Nobody outside the firm sees this project.</p>
          ) : (
            <ul className="space-y-1 text-sm" data-testid="access-summary">
              {viewers.map((v) => (
                <li key={v.userId}>
                  {v.name} <span className="text-ink-faint">· {ROLE_LABELS[v.role]}</span>
                </li>
              ))}
            </ul>
          )}
          <p className="mt-2 text-sm text-ink-soft">
            {open.length === 0 ? "No open invitations." : `${open.length} invitation${open.length === 1 ? "" : "s"} waiting for acceptance.`}
            {failedMail > 0 && <span className="text-danger-700"> {failedMail} e-mail could not be sent.</span>}
          </p>
        </div>
        <div>
          <h3 className="mb-2 text-sm font-semibold">Issued versions ({issued.length})</h3>
          {issued.length === 0 ? (
            <p className="text-sm text-ink-soft">Nothing issued yet. Client viewers see a scenario once a version of it is issued.</p>
          ) : (
            <ul className="space-y-1 text-sm" data-testid="issued-versions-firm">
              {issued.slice(0, 8).map((v) => (
                <li key={v.id}>
                  <Link href={`/projects/${projectId}/scenarios/${v.scenarioId}/versions/${v.versionNumber}`} className="text-basin-700 hover:underline">
                    {v.name} — v{v.versionNumber}
                  </Link>
                </li>
              ))}
            </ul>
          )}
        </div>
      </div>
    </Panel>
  );
}
