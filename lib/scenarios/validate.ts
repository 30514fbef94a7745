/**
 * The one validation of a scenario document, used by the server actions, the API, the job worker and
 * (through `editorResolverInput`) the editor in the browser: `scenarioSchema`, all issues as dotted paths.
 * Client-safe.
 */
import type { FieldErrorMap } from "@/lib/result";
import type { ClimateInput } from "@/lib/engine/climate/types";
import type { ScenarioInput } from "@/lib/engine/input";
import { scenarioSchema } from "./schema";
import { humanIssue, type MessageContext } from "./field-messages";

export type ParseOutcome = { ok: true; value: ScenarioInput } | { ok: false; fieldErrors: FieldErrorMap };

/** Units the messages use when the caller does not know the project's (SI, US dollars). */
export const DEFAULT_MESSAGE_CONTEXT: MessageContext = { system: "SI", currency: "USD" };

/**
 * Parse a scenario document: the engine input, or every problem keyed by its field path with a message a
 * person can act on (in `units`, never the schema library's wording).
 */
export function parseScenarioDocument(document: unknown, units: MessageContext = DEFAULT_MESSAGE_CONTEXT): ParseOutcome {
  const r = scenarioSchema.safeParse(document, { reportInput: true });
  if (r.success) return { ok: true, value: r.data as ScenarioInput };
  const fieldErrors: FieldErrorMap = {};
  for (const issue of r.error.issues) {
    const path = issue.path.map(String).join(".");
    const { message } = humanIssue(issue, path, units);
    const list = (fieldErrors[path] ??= []);
    if (!list.includes(message)) list.push(message);
  }
  return { ok: false, fieldErrors };
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
