/**
 * The one validation of a scenario document, used by the server actions, the API, the job worker and
 * (through `editorResolverInput`) the editor in the browser: `scenarioSchema`, all issues as dotted paths.
 * Client-safe.
 */
import { toFieldErrors, type FieldErrorMap } from "@/components/forms/errors";
import type { ClimateInput } from "@/lib/engine/climate/types";
import type { ScenarioInput } from "@/lib/engine/input";
import { scenarioSchema } from "./schema";

export type ParseOutcome = { ok: true; value: ScenarioInput } | { ok: false; fieldErrors: FieldErrorMap };

export function parseScenarioDocument(document: unknown): ParseOutcome {
  const r = scenarioSchema.safeParse(document);
  if (r.success) return { ok: true, value: r.data as ScenarioInput };
  return { ok: false, fieldErrors: toFieldErrors(r.error.issues) };
}

/**
 * A one-bin climate that satisfies the schema, put in place of the real dataset where only the rest of
 * the document is being checked (the editor in the browser, a new scenario's draft). Never analysed.
 */
export const PLACEHOLDER_CLIMATE: ClimateInput = {
  source: "wetBulbBins",
  label: "placeholder",
  bins: [{ wetBulbC: 10, meanCoincidentDryBulbC: 15, hours: 8760 }],
};
export const PLACEHOLDER_SITE = { elevationM: 0, locationLabel: "placeholder" };

/** The editor's values with the placeholder climate and site, ready for the schema. */
export function withPlaceholders(values: Record<string, unknown>): Record<string, unknown> {
  return { ...values, climate: PLACEHOLDER_CLIMATE, site: PLACEHOLDER_SITE };
}
