/**
 * The invented demo scenario (Harrowgate Flats) as engine input, on its own generated climate year, the way
 * the seed stores it; shared by the option-figures script and the engine regression guard.
 */
import type { ScenarioInput } from "@/lib/engine";
import { demoClimateDataset, demoScenarioDocument } from "@/lib/scenarios/demo";
import { buildEngineInput } from "@/lib/scenarios/store";

export function demoEngineInput(): ScenarioInput {
  const site = { elevationM: 240, locationLabel: "Harrowgate Flats (invented)" };
  const ds = demoClimateDataset(site.elevationM);
  const dataset = { id: "00000000-0000-4000-8000-000000000000", name: ds.name, source_kind: ds.sourceKind, data: JSON.parse(JSON.stringify(ds.data)) };
  const r = buildEngineInput(demoScenarioDocument(), dataset, site);
  if (!r.ok) throw new Error(JSON.stringify(r.fieldErrors));
  return r.input;
}
