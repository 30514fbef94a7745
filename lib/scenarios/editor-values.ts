/**
 * The scenario editor's form state, typed by the one scenario schema: the stored document (no site, no
 * climate) plus the chosen climate dataset. Field names are `EditorPath`s, so a renamed schema key fails
 * the type check wherever the editor names it. Also the editor's sections: which section a field path
 * belongs to. Client-safe.
 */
import type { FieldPath, FieldPathValue } from "react-hook-form";
import type { ScenarioDocument } from "./mappers";

/** The editor's values: the scenario document as written (defaults may be omitted) + the climate dataset. */
export type EditorValues = ScenarioDocument & { climateDatasetId: string };

/** A field of the editor, checked against the scenario schema ("options.0.tower.leavingWaterC"). */
export type EditorPath = FieldPath<EditorValues>;
export type EditorPathValue<P extends EditorPath> = FieldPathValue<EditorValues, P>;

/** One option of the editor (any kind). */
export type EditorOption = EditorValues["options"][number];

/** The editor's fixed sections, in order; the options between Duty and Water are sections of their own. */
export const EDITOR_SECTIONS = [
  { id: "general", title: "General" },
  { id: "duty", title: "Duty" },
  { id: "water", title: "Water" },
  { id: "upkeep", title: "Upkeep and fouling" },
  { id: "tariffs", title: "Tariffs" },
  { id: "economics", title: "Economics" },
] as const;

export type FixedSectionId = (typeof EDITOR_SECTIONS)[number]["id"];
/** A section id: a fixed section or "option-N" (N from 1). */
export type SectionId = FixedSectionId | `option-${number}`;

export const optionSectionId = (index: number): SectionId => `option-${index + 1}`;

/** The option index of an "option-N" section, or null. */
export function optionIndexOfSection(id: string): number | null {
  const m = /^option-(\d+)$/.exec(id);
  if (!m) return null;
  const n = Number(m[1]);
  return n >= 1 && n <= 4 ? n - 1 : null;
}

/** The section ids in order for a scenario with `optionCount` options. */
export function sectionOrder(optionCount: number): SectionId[] {
  const options = Array.from({ length: optionCount }, (_, i) => optionSectionId(i));
  return ["general", "duty", ...options, "water", "upkeep", "tariffs", "economics"];
}

/** Parse a `?section=` value; unknown values give the first section. */
export function parseSection(value: string | null | undefined, optionCount: number): SectionId {
  if (!value) return "general";
  return sectionOrder(optionCount).includes(value as SectionId) ? (value as SectionId) : "general";
}

const TARIFF_PREFIXES_IN_WATER = [
  "tariffs.water",
  "tariffs.sewer",
  "tariffs.chemicals",
  "tariffs.waterManagementProgrammeCostPerYear",
];

/**
 * The section a field path is edited in. Water and sewer prices and the treatment programme sit in the
 * Water section although they are tariffs in the schema; the climate and site (set elsewhere) and the
 * option list itself count as General.
 */
export function sectionOfPath(path: string): SectionId {
  const m = /^options\.(\d+)(\.|$)/.exec(path);
  if (m) return optionSectionId(Number(m[1]));
  if (path.startsWith("duty")) return "duty";
  if (
    path.startsWith("water") ||
    TARIFF_PREFIXES_IN_WATER.some((p) => path === p || path.startsWith(`${p}.`))
  )
    return "water";
  if (path.startsWith("fouling") || path.startsWith("upkeep")) return "upkeep";
  if (path.startsWith("tariffs")) return "tariffs";
  if (path.startsWith("economics") || path.startsWith("sensitivity") || path.startsWith("monteCarlo") || path.startsWith("footprint"))
    return "economics";
  return "general";
}

/**
 * The parts of the long steps, shown one at a time (`?section=option-2&part=condenser`): an option step in
 * four parts, Economics in four. The other steps are short enough to show whole.
 */
export const OPTION_PARTS = [
  { id: "selection", title: "Selection and fans" },
  { id: "condenser", title: "Condenser" },
  { id: "pumps", title: "Pumps, basin and water" },
  { id: "costs", title: "First cost and upkeep" },
] as const;
export const ECONOMICS_PARTS = [
  { id: "study", title: "Study and rates" },
  { id: "sensitivity", title: "Sensitivity" },
  { id: "monte-carlo", title: "Monte Carlo" },
  { id: "footprint", title: "Footprint" },
] as const;

export type OptionPartId = (typeof OPTION_PARTS)[number]["id"];
export type EconomicsPartId = (typeof ECONOMICS_PARTS)[number]["id"];
export type PartId = OptionPartId | EconomicsPartId;
export interface EditorPart {
  readonly id: PartId;
  readonly title: string;
}

/** The parts of a step, in order; none for a step shown whole. */
export function partsOfSection(id: SectionId): readonly EditorPart[] {
  if (id === "economics") return ECONOMICS_PARTS;
  return optionIndexOfSection(id) === null ? [] : OPTION_PARTS;
}

/** Parse a `?part=` value for a step: its first part when the value is not one of its parts. */
export function parsePart(section: SectionId, value: string | null | undefined): PartId | null {
  const parts = partsOfSection(section);
  if (parts.length === 0) return null;
  return parts.find((p) => p.id === value)?.id ?? parts[0]!.id;
}

/** Fields of an option's condenser part: the condenser, the plate exchanger, an evaporative condenser's coil. */
const OPTION_CONDENSER_PREFIXES = [
  "condenser",
  "plateExchanger",
  "evaporativeCondenser.coilMaterial",
  "evaporativeCondenser.specificChargeKgPerKW",
  "evaporativeCondenser.coilScaling",
  "evaporativeCondenser.coilLifeYears",
  "evaporativeCondenser.coilReplacementCost",
];
const OPTION_PUMP_PREFIXES = [
  "condenserPump",
  "towerPump",
  "sprayPump",
  "basinHeater",
  "cyclesOfConcentration",
  "driftFractionOfFlow",
  "wetLoopVolumeM3",
];
const startsWithField = (rest: string, prefixes: readonly string[]) =>
  prefixes.some((p) => rest === p || rest.startsWith(`${p}.`));

/** The part of its step a field path is edited in (null for a step shown whole). */
export function partOfPath(path: string): PartId | null {
  const m = /^options\.\d+(?:\.(.*))?$/.exec(path);
  if (m) {
    const rest = m[1] ?? "";
    if (startsWithField(rest, OPTION_CONDENSER_PREFIXES)) return "condenser";
    if (startsWithField(rest, OPTION_PUMP_PREFIXES)) return "pumps";
    if (startsWithField(rest, ["costs"])) return "costs";
    return "selection";
  }
  if (sectionOfPath(path) !== "economics") return null;
  if (path.startsWith("sensitivity")) return "sensitivity";
  if (path.startsWith("monteCarlo")) return "monte-carlo";
  if (path.startsWith("footprint")) return "footprint";
  return "study";
}

/** Where a step/part lives in the editor's address (`?section=option-1&part=costs`). */
export function editorPlaceQuery(section: SectionId, part: PartId | null): string {
  return part ? `?section=${section}&part=${part}` : `?section=${section}`;
}
