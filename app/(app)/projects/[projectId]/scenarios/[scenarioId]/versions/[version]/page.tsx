import type { Metadata } from "next";
import Link from "next/link";
import { forbidden, notFound } from "next/navigation";
import { perform } from "@/lib/actions/request";
import { requireViewer } from "@/lib/auth/session";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { openIssuedVersion, parseVersionParam } from "@/lib/sharing/versions";
import { versionComments } from "@/lib/sharing/comments";
import { formatWhen } from "@/lib/dates";
import { EmptyState, PageHeader, Panel } from "@/components/ui/panel";
import { ComparisonView } from "@/components/comparison/comparison-view";
import { DownloadLinks, reportRights } from "@/components/reports/download-links";
import { displayableVersion, VersionSummary } from "./_components/version-summary";
import { CommentForm } from "./_components/comment-form";

export const metadata: Metadata = { title: "Issued version" };

/** One issued version: frozen inputs and result, read-only, with the comment thread. */
export default async function VersionPage({ params }: { params: Promise<{ projectId: string; scenarioId: string; version: string }> }) {
  const { projectId, scenarioId, version } = await params;
  await requireViewer();
  const n = parseVersionParam(version);
  if (n === null) notFound();
  const opened = await perform(openIssuedVersion, projectId, scenarioId, n);
  if (!opened.ok) return opened.status === 403 ? forbidden() : notFound();
  const { access, version: v } = opened.value;
  const comments = await perform(versionComments, projectId, v.id);
  const isFirm = access.can("scenario.viewDraft");
  const drawable = displayableVersion(v.input, v.result);
  return (
    <>
      <PageHeader
        title={
          <>
            {v.name} <span className="text-ink-faint">· version {v.versionNumber}</span>
          </>
        }
        subtitle={
          <>
            <Link href={`/projects/${projectId}`} className="text-basin-700 hover:underline">
              {access.project.name}
            </Link>{" "}
            · issued {formatWhen(v.issuedAt)}
            {v.issuedByName ? ` by ${v.issuedByName}` : ""}
          </>
        }
      />
      <div className="space-y-6">
        <div className="rounded-panel border border-basin-300 bg-basin-50 px-panel py-3 text-sm text-basin-900" data-testid="version-frozen-note">
          This is an issued version: its inputs and results are frozen as of {formatWhen(v.issuedAt)} (engine {v.engineVersion}).
          {isFirm && (
            <>
              {" "}
              Later edits change the draft only.{" "}
              <Link href={`/projects/${projectId}/scenarios/${scenarioId}/versions`} className="underline">
                All versions
              </Link>
            </>
          )}
        </div>
        {!drawable && <DownloadLinks scenarioId={scenarioId} version={v.versionNumber} {...reportRights(access)} />}
        {v.note && (
          <Panel title="Note from the consultant">
            <p className="whitespace-pre-wrap text-sm" data-testid="version-note">
              {v.note}
            </p>
          </Panel>
        )}
        {drawable ? (
          <ComparisonView
            project={{
              name: access.project.name,
              currency: access.project.currency,
              clientName: access.project.clientName,
              siteName: access.project.siteName,
              locationLabel: access.project.locationLabel,
            }}
            scenarioName={v.name}
            input={drawable.input}
            result={drawable.result}
            unitSystem={access.project.unitSystem}
            canSeeCashFlows={access.can("scenario.viewCashFlows")}
            whatIfEndpoint={access.can("scenario.whatIf") ? `/api/scenarios/${scenarioId}/what-if?version=${v.versionNumber}` : null}
            actions={<DownloadLinks scenarioId={scenarioId} version={v.versionNumber} {...reportRights(access)} />}
          />
        ) : (
          <Panel title="Comparison">
            <VersionSummary result={v.result} unitSystem={access.project.unitSystem} currency={access.project.currency} />
          </Panel>
        )}
        <Panel title={`Comments (${comments.ok ? comments.value.length : 0})`}>
          <div id="comments" className="space-y-4">
            {comments.ok && comments.value.length > 0 ? (
              <ol className="space-y-3" data-testid="comment-list">
                {comments.value.map((c) => (
                  <li key={c.id} className="rounded-md border border-line px-3 py-2">
                    <p className="text-xs text-ink-faint">
                      <span className="font-medium text-ink">{c.authorName ?? "Former user"}</span>
                      {c.authorClientRole ? ` · ${ROLE_LABELS[c.authorClientRole]}` : ""} · {formatWhen(c.createdAt)}
                    </p>
                    <p className="mt-1 whitespace-pre-wrap text-sm">{c.body}</p>
                  </li>
                ))}
              </ol>
            ) : (
              <EmptyState title="No comments yet." />
            )}
            {access.can("scenario.comment") && <CommentForm projectId={projectId} versionId={v.id} />}
          </div>
        </Panel>
      </div>
    </>
  );
}
