/**
 * The export document: the scenario in the schema's own shape, self-contained (the dataset's climate
 * arrays and the project's site put in), so that /api/v1/analyses reproduces the stored result from it.
 * A valid scenario exports its parsed form (every default written out); an incomplete one exports as stored.
 */
import type { ClimateInput } from "@/lib/engine/climate/types";
import { climateInputFromDataset, documentFromStored, toEngineInputDraft, type ClimateDatasetLike, type ProjectSiteLike } from "./mappers";
import { parseScenarioDocument } from "./validate";

export function exportDocument(stored: unknown, dataset: ClimateDatasetLike | null, site: ProjectSiteLike): Record<string, unknown> {
  const raw = (typeof stored === "string" ? JSON.parse(stored) : stored) as Record<string, unknown>;
  // A frozen full input (with its own climate arrays and site) exports as it is.
  const own = raw?.climate as { source?: string } | undefined;
  if (own && typeof own.source === "string" && raw.site) {
    const parsed = parseScenarioDocument(raw);
    return parsed.ok ? (parsed.value as unknown as Record<string, unknown>) : raw;
  }
  let climate: ClimateInput | undefined;
  try {
    climate = dataset && dataset.data !== null ? climateInputFromDataset(dataset) : undefined;
  } catch {
    climate = undefined;
  }
  const draft = toEngineInputDraft(documentFromStored(raw), climate as ClimateInput, site);
  if (!climate) delete draft.climate;
  const parsed = parseScenarioDocument(draft);
  return parsed.ok ? (parsed.value as unknown as Record<string, unknown>) : draft;
}
