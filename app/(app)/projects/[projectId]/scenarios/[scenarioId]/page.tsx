import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { projectAccess, requireViewer } from "@/lib/auth/session";
import { draftView, requireScenario } from "@/lib/scenarios/data";
import { AnalysisPending } from "@/components/comparison/analysis-pending";
import { ComparisonView } from "@/components/comparison/comparison-view";
import { DownloadLinks, reportRights } from "@/components/reports/download-links";
import { EmptyState, PageHeader } from "@/components/ui/panel";
import { ButtonLink } from "@/components/ui/button";
import { ScenarioToolbar } from "./scenario-toolbar";

export const metadata: Metadata = { title: "Scenario comparison" };

/** A draft scenario's comparison (firm members). Client viewers are sent to the issued versions. */
export default async function ScenarioPage({ params }: { params: Promise<{ projectId: string; scenarioId: string }> }) {
  const { projectId, scenarioId } = await params;
  const viewer = await requireViewer();
  const pa = await projectAccess(viewer, projectId);
  if (pa && !pa.can("scenario.viewDraft") && pa.can("scenario.viewIssued")) redirect(`/projects/${projectId}/scenarios/${scenarioId}/versions`);
  const sa = await requireScenario(projectId, scenarioId, "scenario.viewDraft", { withClimateData: false });
  const { access, ctx } = sa;
  const view = await draftView(sa);
  const base = `/projects/${projectId}/scenarios/${scenarioId}`;
  const canEdit = access.can("scenario.edit");
  const header = (
    <PageHeader
      title={ctx.row.name}
      subtitle={
        <>
          <Link href={`/projects/${projectId}`} className="text-basin-700 hover:underline">
            {access.project.name}
          </Link>
          {" · "}draft revision {ctx.row.revision}
          {ctx.dataset ? ` · climate: ${ctx.dataset.name}` : ""}
          {ctx.row.archivedAt ? " · archived" : ""}
        </>
      }
      actions={<ScenarioToolbar projectId={projectId} scenarioId={scenarioId} canEdit={canEdit} canIssue={access.can("scenario.issue")} archived={Boolean(ctx.row.archivedAt)} />}
    />
  );
  if (view.input && !view.result && view.full && (view.full.status === "queued" || view.full.status === "running")) {
    return (
      <>
        {header}
        <AnalysisPending pollUrl={`/api/scenarios/${scenarioId}/results?part=full`} initialStatus={view.full.status} />
      </>
    );
  }
  if (view.input && !view.result && view.full?.status === "failed") {
    return (
      <>
        {header}
        <EmptyState title="The analysis of these inputs failed.">
          <p>{view.full.error ?? "Unknown error."}</p>
          {canEdit ? (
            <div className="mt-4">
              <ButtonLink href={`${base}/edit`}>Review the inputs</ButtonLink>
            </div>
          ) : null}
        </EmptyState>
      </>
    );
  }
  if (!view.input || !view.result) {
    const problems = Object.entries(view.inputErrors ?? {});
    return (
      <>
        {header}
        <EmptyState title="This scenario cannot be analysed yet.">
          <p>
            {problems.length} {problems.length === 1 ? "input needs" : "inputs need"} attention
            {problems.some(([p]) => p.includes("firstCost")) ? " — first costs have no default and must come from the selections" : ""}.
          </p>
          <ul className="mx-auto mt-2 max-w-xl list-disc text-left text-xs">
            {problems.slice(0, 8).map(([path, messages]) => (
              <li key={path}>
                <code>{path || "scenario"}</code>: {messages.join(" ")}
              </li>
            ))}
          </ul>
          {canEdit ? (
            <div className="mt-4">
              <ButtonLink href={`${base}/edit`}>Complete the inputs</ButtonLink>
            </div>
          ) : null}
        </EmptyState>
      </>
    );
  }
  return (
    <>
      {header}
      <ComparisonView
        project={{ name: access.project.name, currency: access.project.currency, clientName: access.project.clientName, siteName: access.project.siteName, locationLabel: access.project.locationLabel }}
        scenarioName={ctx.row.name}
        input={view.input}
        result={view.result}
        unitSystem={access.project.unitSystem}
        canSeeCashFlows={access.can("scenario.viewCashFlows")}
        monteCarlo={
          view.monteCarlo
            ? { status: view.monteCarlo.status, progress: view.monteCarlo.progress, result: view.monteCarlo.result, error: view.monteCarlo.error }
            : { status: "off", progress: 0, result: null, error: null }
        }
        monteCarloPollUrl={`/api/scenarios/${scenarioId}/results?part=monteCarlo`}
        whatIfEndpoint={access.can("scenario.whatIf") ? `/api/scenarios/${scenarioId}/what-if` : null}
        actions={<DownloadLinks scenarioId={scenarioId} {...reportRights(access)} />}
      />
    </>
  );
}
