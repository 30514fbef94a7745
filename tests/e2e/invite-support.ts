import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { DEMO_PROJECT } from "@/db/seed";
import { buildEngineInput, loadScenarioContext } from "@/lib/scenarios/store";
import { analyzeAndStore } from "@/lib/scenarios/analysis";
import type { ScenarioDocument } from "@/lib/scenarios/mappers";

/**
 * A project of the demo firm with a copy of the demo climate dataset and the demo scenario, its result
 * computed and stored the way a save does (lib/scenarios/analysis.ts), so that it can be issued from the UI.
 * Everything is new rows with unique names; the seed's own rows are only read.
 */
export async function projectWithAnalysedScenario(db: Kysely<Database>, tag: string, extra: { draftOnlyName?: string } = {}) {
  const demo = await db.selectFrom("projects").selectAll().where("name", "=", DEMO_PROJECT.name).executeTakeFirstOrThrow();
  const scenario = await db
    .selectFrom("scenarios")
    .selectAll()
    .where("project_id", "=", demo.id)
    .where("climate_dataset_id", "is not", null)
    .where("archived_at", "is", null)
    .orderBy("created_at")
    .executeTakeFirst();
  if (!scenario?.climate_dataset_id) throw new Error("The demo seed has no scenario on a climate dataset: the e2e fixtures copy it.");
  const ds = await db.selectFrom("climate_datasets").selectAll().where("id", "=", scenario.climate_dataset_id).executeTakeFirstOrThrow();
  const consultant = await db.selectFrom("users").select("id").where("email", "=", "cole.consultant@corrandale.example").executeTakeFirstOrThrow();

  const project = await db
    .insertInto("projects")
    .values({
      firm_id: demo.firm_id,
      name: `Invite flow ${tag}`,
      client_name: `Client ${tag}`,
      site_name: `Site ${tag}`,
      location_label: demo.location_label,
      elevation_m: demo.elevation_m,
      unit_system: demo.unit_system,
      currency: demo.currency,
      created_by: consultant.id,
    })
    .returning("id")
    .executeTakeFirstOrThrow();
  const newDs = await db
    .insertInto("climate_datasets")
    .values({
      project_id: project.id,
      name: ds.name,
      source_kind: ds.source_kind,
      file_name: ds.file_name,
      provenance: JSON.stringify(ds.provenance),
      record_count: ds.record_count,
      missing_count: ds.missing_count,
      hours_total: ds.hours_total,
      data: JSON.stringify(ds.data),
      summary: JSON.stringify(ds.summary),
      created_by: consultant.id,
    })
    .returning("id")
    .executeTakeFirstOrThrow();
  const copyScenario = async (name: string) => {
    const input = { ...(scenario.input as Record<string, unknown>), name, climate: { datasetId: newDs.id } };
    return (
      await db
        .insertInto("scenarios")
        .values({
          project_id: project.id,
          name,
          climate_dataset_id: newDs.id,
          input: JSON.stringify(input),
          input_version: scenario.input_version,
          created_by: consultant.id,
          updated_by: consultant.id,
        })
        .returning("id")
        .executeTakeFirstOrThrow()
    ).id;
  };
  const scenarioName = `Loop comparison ${tag}`;
  const scenarioId = await copyScenario(scenarioName);
  const ctx = await loadScenarioContext(db, scenarioId);
  const built = ctx && buildEngineInput(ctx.dto.document as ScenarioDocument, ctx.dataset, ctx.project);
  if (!built || !built.ok) throw new Error(`The copied demo scenario does not build: ${JSON.stringify(built && !built.ok ? built.fieldErrors : null)}`);
  await analyzeAndStore(db, scenarioId, built.input);
  const draftOnlyId = extra.draftOnlyName ? await copyScenario(extra.draftOnlyName) : null;
  return { projectId: project.id, projectName: `Invite flow ${tag}`, scenarioId, scenarioName, draftOnlyId };
}
