import type { Metadata } from "next";
import Link from "next/link";
import { draftRatingFits, listProjectDatasets, requireScenario } from "@/lib/scenarios/data";
import { prefillDocument } from "@/lib/scenarios/prefill";
import type { EditorValues } from "@/lib/scenarios/editor-values";
import { validateEditorValues } from "@/lib/scenarios/editor-validation";
import { PageHeader } from "@/components/ui/panel";
import { ScenarioEditor } from "./_components/scenario-editor";

export const metadata: Metadata = { title: "Edit scenario" };

/** The scenario editor: one section at a time (named in the URL), every input in the project's units. */
export default async function EditScenarioPage({
  params,
  searchParams,
}: {
  params: Promise<{ projectId: string; scenarioId: string }>;
  searchParams: Promise<{ section?: string | string[]; part?: string | string[] }>;
}) {
  const { projectId, scenarioId } = await params;
  const { section, part } = await searchParams;
  const { access, ctx } = await requireScenario(projectId, scenarioId, "scenario.edit", {
    withClimateData: false,
  });
  const sa = { access, ctx };
  const [datasets, ratingFits] = await Promise.all([listProjectDatasets(projectId), draftRatingFits(sa)]);
  const initial: EditorValues = {
    ...prefillDocument(ctx.dto.document),
    name: ctx.row.name,
    climateDatasetId: ctx.row.climateDatasetId ?? "",
  };
  const units = { system: access.project.unitSystem, currency: access.project.currency };
  return (
    <>
      <PageHeader
        title={`Edit: ${ctx.row.name}`}
        subtitle={
          <>
            <Link href={`/projects/${projectId}`} className="text-basin-700 hover:underline">
              {access.project.name}
            </Link>{" "}
            · values in {access.project.unitSystem === "IP" ? "IP" : "SI"} units, {access.project.currency}
          </>
        }
      />
      {ctx.row.archivedAt ? (
        <p className="mb-4 rounded-md border border-caution-600 bg-caution-50 px-3 py-2 text-sm text-caution-800">
          This scenario is archived: it cannot be saved. Clone it to continue.
        </p>
      ) : null}
      <ScenarioEditor
        projectId={projectId}
        scenarioId={scenarioId}
        revision={ctx.row.revision}
        unitSystem={access.project.unitSystem}
        currency={access.project.currency}
        datasets={datasets.map((d) => ({ id: d.id, name: d.name }))}
        initial={initial}
        initialSection={typeof section === "string" ? section : null}
        initialPart={typeof part === "string" ? part : null}
        initialProblems={validateEditorValues(initial, units)}
        initialRatingFits={ratingFits}
      />
    </>
  );
}
