/**
 * The editor's starting values: the stored document with every schema default written out, so that
 * each field shows a value (and its default's source beside it). First costs stay empty where none was
 * entered — they have no default. Client-safe.
 */
import { OPTION_KINDS, OPTION_KIND_LABELS, type OptionKind } from "@/lib/engine/types";
import type { ScenarioDocument } from "./mappers";
import type { EditorOption } from "./editor-values";
import { defaultScenario, fieldDefaults, scenarioSchema, type FieldDefault } from "./schema";
import { PLACEHOLDER_CLIMATE, withPlaceholders } from "./validate";

type Obj = Record<string, unknown>;
const isObj = (v: unknown): v is Obj => typeof v === "object" && v !== null && !Array.isArray(v);

/** The document with defaults filled; unchanged when it cannot be parsed even with placeholders. */
export function prefillDocument(document: ScenarioDocument): ScenarioDocument {
  const doc = structuredClone(document) as unknown as Obj;
  // Sensitivity and Monte Carlo are optional in the schema; the editor starts with them on (their defaults).
  if (doc.sensitivity === undefined) doc.sensitivity = {};
  if (doc.monteCarlo === undefined) doc.monteCarlo = {};
  const parsed = scenarioSchema.safeParse(withPlaceholders(doc));
  if (!parsed.success) {
    // Keep what is there.
    return document;
  }
  const out = parsed.data as unknown as Obj;
  delete out.climate;
  delete out.site;
  // First costs stay as entered: none (the form shows empty boxes) or every item (parsing filled the
  // items left empty with 0).
  for (const o of out.options as Obj[]) {
    const costs = o.costs as Obj;
    if (costs.firstCost === undefined) delete costs.firstCost;
  }
  return out as unknown as ScenarioDocument;
}

/** The editor's values for a new scenario: `defaultScenario` prefilled. */
export function defaultEditorDocument(): ScenarioDocument {
  const { climate: _c, site: _s, ...rest } = defaultScenario(PLACEHOLDER_CLIMATE) as unknown as Obj;
  void _c;
  void _s;
  return prefillDocument(rest as unknown as ScenarioDocument);
}

/**
 * The starter's evaporative condenser (the new-scenario document compares three water-loop options): rated
 * for the starter's 1000 kW at 35 °C condensing and 23 °C wet-bulb, spray flow and fan power of the same
 * order as the starter's closed-circuit cooler; the user replaces them with the manufacturer's selection.
 */
const EVAPORATIVE_CONDENSER_STARTER = {
  id: "evap-condenser",
  kind: "evaporativeCondenser",
  label: "Evaporative condenser",
  costs: {},
  fan: { designPowerKW: 22 },
  evaporativeCondenser: { ratedHeatRejectionKW: 1000, ratedCondensingC: 35, ratedWetBulbC: 23 },
  sprayPump: { flowKgPerS: 18 },
};

/** The option of a kind with every default filled (a parse of the starter with that option in it). */
function templateOfKind(kind: OptionKind): Obj {
  const base = defaultEditorDocument() as unknown as { options: Obj[] };
  const own = base.options.find((o) => o.kind === kind);
  if (own) return structuredClone(own);
  const doc = { ...base, options: [base.options[0]!, structuredClone(EVAPORATIVE_CONDENSER_STARTER)] };
  const filled = prefillDocument(doc as unknown as ScenarioDocument) as unknown as { options: Obj[] };
  return structuredClone(filled.options.find((o) => o.kind === kind) ?? base.options[0]!);
}

const ID_STEMS: Record<OptionKind, string> = {
  openTowerDirect: "tower-direct",
  openTowerPlateHx: "tower-plate",
  closedCircuitCooler: "cooler",
  evaporativeCondenser: "evap-condenser",
};

/** A new option of a kind with every default filled and no first cost, with an id not yet used. */
export function newOptionOfKind(kind: OptionKind, usedIds: string[]): EditorOption {
  const template = templateOfKind(kind);
  let n = 1;
  const stem = ID_STEMS[kind];
  let id = stem;
  while (usedIds.includes(id)) id = `${stem}-${++n}`;
  template.id = id;
  template.label = n > 1 ? `${OPTION_KIND_LABELS[kind]} ${n}` : OPTION_KIND_LABELS[kind];
  return template as unknown as EditorOption;
}

export { OPTION_KINDS };

/**
 * The default and its source for a form path: "options.2.fan.minSpeedFraction" looks up
 * "options[].fan.minSpeedFraction"; a field inside a defaulted object (e.g. "sensitivity.tornado.waterPrice.low")
 * reads the parent default's member.
 */
export function defaultFor(path: string): FieldDefault | null {
  const key = path.replace(/^options\.\d+\./, "options[].");
  const direct = fieldDefaults[key];
  if (direct) return direct;
  const parts = key.split(".");
  for (let cut = parts.length - 1; cut > 0; cut--) {
    const parent = fieldDefaults[parts.slice(0, cut).join(".")];
    if (!parent) continue;
    let v: unknown = parent.default;
    for (const p of parts.slice(cut)) v = isObj(v) ? v[p] : undefined;
    return v === undefined ? null : { default: v, source: parent.source };
  }
  return null;
}
