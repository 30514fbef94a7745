/**
 * Seeds the demo's climate dataset and complete scenario into a project: stored, analysed (deterministic
 * result and Monte Carlo under the current engine version and inputs hash) and issued as version 1, so
 * the demo's owner and finance viewers see an issued comparison right after `npm start`.
 */
import type { Executor } from "@/db/schema";
import { writeAudit } from "@/db/queries/audit";
import { insertClimateDataset } from "@/db/queries/climate";
import { upsertDoneResult } from "@/db/queries/results";
import { insertVersionRow } from "@/db/queries/versions";
import { climateDatasetRow } from "@/lib/climate/build";
import { analyzeScenario, ENGINE_VERSION } from "@/lib/engine";
import { monteCarloInput, runDeterministic } from "./analysis";
import { demoClimateDataset, demoScenarioDocument, DEMO_SCENARIO_NAME } from "./demo";
import { inputsHash } from "./hash";
import { createScenario, saveScenario, SCENARIO_INPUT_VERSION } from "./store";


export async function seedDemoScenario(
  db: Executor,
  a: { projectId: string; firmId: string; siteElevationM: number; consultantId: string },
): Promise<{ datasetId: string; scenarioId: string; versionId: string; inputsHash: string }> {
  const ds = demoClimateDataset(a.siteElevationM);
  const dataset = await insertClimateDataset(db, climateDatasetRow(ds, { projectId: a.projectId, createdBy: a.consultantId }));

  const document = demoScenarioDocument();
  const created = await createScenario(db, { projectId: a.projectId, name: DEMO_SCENARIO_NAME, climateDatasetId: dataset.id, userId: a.consultantId, document });
  if (!created.ok) throw new Error(`demo scenario: ${JSON.stringify(created.fieldErrors)}`);
  const saved = await saveScenario(db, {
    scenarioId: created.id,
    expectedRevision: created.revision,
    name: DEMO_SCENARIO_NAME,
    climateDatasetId: dataset.id,
    document,
    userId: a.consultantId,
  });
  if (!saved.ok) throw new Error(`demo scenario did not validate: ${JSON.stringify(saved)}`);

  const hash = inputsHash(saved.input);
  const det = { ...runDeterministic(saved.input).result, inputsHash: hash };
  const mc = analyzeScenario(monteCarloInput(saved.input)).economics.monteCarlo;
  await upsertDoneResult(db, { scenarioId: created.id, engineVersion: ENGINE_VERSION, inputsHash: hash, kind: "full", result: det });
  if (mc) await upsertDoneResult(db, { scenarioId: created.id, engineVersion: ENGINE_VERSION, inputsHash: hash, kind: "monteCarlo", result: mc });

  const version = await insertVersionRow(db, {
    scenarioId: created.id,
    projectId: a.projectId,
    versionNumber: 1,
    name: DEMO_SCENARIO_NAME,
    note: "Issued for the owner's capital review (demo data: invented site, weather, selections and prices).",
    input: saved.input,
    inputVersion: SCENARIO_INPUT_VERSION,
    result: mc ? { ...det, economics: { ...det.economics, monteCarlo: mc } } : det,
    engineVersion: ENGINE_VERSION,
    inputsHash: hash,
    scenarioRevision: saved.revision,
    issuedBy: a.consultantId,
  });
  await writeAudit(db, {
    actorId: a.consultantId,
    firmId: a.firmId,
    projectId: a.projectId,
    action: "scenario.issue",
    targetType: "scenario",
    targetId: created.id,
    detail: { versionNumber: 1, seeded: true },
  });
  return { datasetId: dataset.id, scenarioId: created.id, versionId: version.id, inputsHash: hash };
}
