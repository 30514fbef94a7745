import Link from "next/link";
import type { ProjectAccess } from "@/lib/auth/session";
import { listArchivedScenarios, listDraftScenarios, listProjectDatasets } from "@/lib/scenarios/data";
import { money } from "@/lib/comparison/headline";
import { EmptyState, Panel } from "@/components/ui/panel";
import { formatNumber } from "@/lib/units";
import { NewScenarioForm } from "../scenarios/_components/new-scenario-form";

const dateText = (iso: string) => new Date(iso).toISOString().slice(0, 16).replace("T", " ") + " UTC";

/**
 * The project's draft scenarios with their latest result in one line, and "New scenario" for those who
 * may edit. Client viewers see nothing here: they see issued versions (the sharing section).
 */
export async function ScenarioSection({ access }: { access: ProjectAccess }) {
  if (!access.can("scenario.viewDraft")) return null;
  const [scenarios, datasets, archived] = await Promise.all([listDraftScenarios(access), listProjectDatasets(access.project.id), listArchivedScenarios(access)]);
  const canEdit = access.can("scenario.edit");
  const base = `/projects/${access.project.id}`;
  return (
    <Panel title="Scenarios">
      <div className="space-y-4" data-testid="scenario-section">
        {scenarios.length === 0 ? (
          <EmptyState title="No scenario yet.">
            {datasets.length === 0
              ? "Import a climate dataset first (below), then create a scenario that compares two to four heat-rejection options on it."
              : "Create a scenario: it starts from sensible defaults for each option; enter the selections and first costs, then save to analyse."}
          </EmptyState>
        ) : (
          <ul className="divide-y divide-line" data-testid="scenario-list">
            {scenarios.map((s) => (
              <li key={s.id} className="flex flex-wrap items-baseline justify-between gap-x-6 gap-y-1 py-3">
                <div>
                  <Link href={`${base}/scenarios/${s.id}`} className="font-medium text-basin-700 hover:underline">
                    {s.name}
                  </Link>
                  <p className="text-xs text-ink-faint">
                    revision {s.revision} · {s.climateName ?? "no climate chosen"} · saved {dateText(s.updatedAt)}
                    {s.updatedByName ? ` by ${s.updatedByName}` : ""}
                  </p>
                </div>
                <p className="text-sm text-ink-soft" data-testid="scenario-latest">
                  {s.latest && s.latest.firstCostsMissing.length > 0
                    ? `Analysed · first costs missing for ${s.latest.firstCostsMissing.join(", ")}`
                    : s.latest
                    ? `Lowest ${s.latest.studyPeriodYears}-year cost: ${s.latest.lowestLabel.toLowerCase()}${s.latest.marginLcc !== null ? `, by ${money(s.latest.marginLcc, access.project.currency)}` : ""}`
                    : "not analysed yet"}
                </p>
                {canEdit ? (
                  <Link href={`${base}/scenarios/${s.id}/edit`} className="text-sm text-basin-700 hover:underline">
                    Edit
                  </Link>
                ) : null}
              </li>
            ))}
          </ul>
        )}
        {archived.length > 0 ? (
          <details className="text-sm">
            <summary className="cursor-pointer text-ink-soft">Archived ({archived.length})</summary>
            <ul className="mt-2 space-y-1">
              {archived.map((a) => (
                <li key={a.id}>
                  <Link href={`${base}/scenarios/${a.id}`} className="text-basin-700 hover:underline">
                    {a.name}
                  </Link>{" "}
                  <span className="text-xs text-ink-faint">archived {dateText(a.archivedAt)}</span>
                </li>
              ))}
            </ul>
          </details>
        ) : null}
        {canEdit && datasets.length > 0 ? (
          <NewScenarioForm
            projectId={access.project.id}
            datasets={datasets.map((d) => ({
              id: d.id,
              name: d.name,
              detail: d.sourceKind === "epw" || d.sourceKind === "csv" ? `${formatNumber(d.hoursTotal, { decimals: 0 })} h hourly` : `bin table, ${formatNumber(d.hoursTotal, { decimals: 0 })} h`,
            }))}
          />
        ) : null}
      </div>
    </Panel>
  );
}
