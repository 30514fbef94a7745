/**
 * Constructions of the water-cooled refrigerant condenser (the condenser of the tower and cooler
 * options): shell-and-tube, gasketed plate-and-frame, welded plate-and-shell and brazed plate.
 *
 * Each construction carries screening defaults — clean overall coefficient, how much faster it fouls
 * on open-tower water, how it is cleaned and inspected and what that costs, component lives, tube or
 * plate material, refrigerant charge per kW, and the first-cost items to price — every one with its
 * source or a [practice]/[memory] tag (Methods §12). The consultant replaces them
 * with the selected unit's data; costs are order-of-magnitude figures in the project's currency for a
 * condenser of about 1 MW and must be replaced by quotes.
 */
import { type Refrigerant, LIQUID_DENSITY_35C_KG_PER_M3, isAmmonia } from "./refrigerants";
import type { EngineWarning } from "./types";

export const CONDENSER_CONSTRUCTIONS = ["shellAndTube", "plateAndFrame", "plateAndShell", "brazedPlate"] as const;
export type CondenserConstruction = (typeof CONDENSER_CONSTRUCTIONS)[number];

export const CONDENSER_CONSTRUCTION_LABELS: Record<CondenserConstruction, string> = {
  shellAndTube: "Shell-and-tube",
  plateAndFrame: "Plate-and-frame (gasketed)",
  plateAndShell: "Plate-and-shell (welded)",
  brazedPlate: "Brazed plate",
};

export const CONDENSER_MATERIALS = [
  "carbonSteel",
  "galvanizedSteel",
  "stainlessSteel",
  "copperAlloy",
  "titanium",
  "stainlessCopperBrazed",
  "stainlessNickelBrazed",
] as const;
export type CondenserMaterial = (typeof CONDENSER_MATERIALS)[number];

export const CONDENSER_MATERIAL_LABELS: Record<CondenserMaterial, string> = {
  carbonSteel: "Carbon steel tubes",
  galvanizedSteel: "Hot-dip galvanized steel coil",
  stainlessSteel: "Stainless steel",
  copperAlloy: "Copper alloy (copper, copper-nickel, admiralty brass)",
  titanium: "Titanium",
  stainlessCopperBrazed: "Stainless plates, copper-brazed",
  stainlessNickelBrazed: "Stainless plates, nickel-brazed",
};

export const CLEANING_METHODS = ["mechanicalTubeBrushing", "openPlatePack", "chemicalCleanInPlace", "coilExteriorDescaling"] as const;
export type CleaningMethod = (typeof CLEANING_METHODS)[number];

export const CLEANING_METHOD_LABELS: Record<CleaningMethod, string> = {
  mechanicalTubeBrushing: "Mechanical tube brushing (water heads off)",
  openPlatePack: "Opening the plate pack and cleaning the plates (or cleaning in place)",
  chemicalCleanInPlace: "Chemical cleaning in place (cannot be opened)",
  coilExteriorDescaling: "Descaling and cleaning the coil exterior (spray side)",
};

export const INSPECTION_METHODS = ["eddyCurrentTesting", "visualAtOpening", "none"] as const;
export type InspectionMethod = (typeof INSPECTION_METHODS)[number];

export const INSPECTION_METHOD_LABELS: Record<InspectionMethod, string> = {
  eddyCurrentTesting: "Eddy-current testing of the tube walls",
  visualAtOpening: "Visual inspection of plates and gaskets when the pack is opened",
  none: "No routine internal inspection (pressure and leak tests only)",
};

/** A default with the source shown beside it in the editor and the report. */
export interface Sourced<T> {
  value: T;
  source: string;
}

export interface ConstructionDefaults {
  label: string;
  description: string;
  /** Typical clean overall coefficient range, W/(m²·K). */
  cleanURangeWPerM2K: Sourced<readonly [number, number]>;
  /** The default inside that range. */
  cleanUWPerM2K: Sourced<number>;
  /** Multiplier on the scenario's tube-fouling growth law when this condenser sees open-tower water. */
  foulingGrowthMultiplierOpenTower: Sourced<number>;
  /** What open-tower water does to it: "suitable", or a reason for the warning. */
  openTowerWater: Sourced<"suitable" | "particulateSensitive" | "notCleanable">;
  cleaningMethod: Sourced<CleaningMethod>;
  cleaningCostPerEvent: Sourced<number>;
  inspectionMethod: Sourced<InspectionMethod>;
  /** Years between inspections on open-tower water and on a treated closed loop (0 = none). */
  inspectionIntervalYears: Sourced<{ openTower: number; closedLoop: number }>;
  inspectionCostPerEvent: Sourced<number>;
  /** Component lives, years (undefined where the construction has no such part). */
  gasketLifeYears: Sourced<number | undefined>;
  tubeBundleLifeYears: Sourced<number | undefined>;
  /** Replacement cost of gaskets or bundle as a fraction of the condenser's first cost. */
  wearPartCostFractionOfCondenser: Sourced<number>;
  material: { ammonia: Sourced<CondenserMaterial>; halocarbon: Sourced<CondenserMaterial> };
  /** Ammonia held per kW of heat rejected, kg/kW (other refrigerants scale by liquid density). */
  ammoniaChargeKgPerKW: Sourced<number>;
  /** Items to include in the option's first cost for this construction (no amounts: they come from quotes). */
  firstCostItems: Sourced<readonly string[]>;
  /** Largest duty the construction is usually built for, kW (undefined: no practical limit). */
  typicalMaxDutyKW: Sourced<number | undefined>;
}

const COST_NOTE = "order of magnitude for a ~1 MW condenser, currency units of the project; get a contractor's price";

export const CONDENSER_CONSTRUCTION_DEFAULTS: Record<CondenserConstruction, ConstructionDefaults> = {
  shellAndTube: {
    label: CONDENSER_CONSTRUCTION_LABELS.shellAndTube,
    description:
      "Cooling water in the tubes, refrigerant condensing in the shell; multi-pass water circuits. Tubes are brushed mechanically with the water heads off and their walls checked by eddy-current testing; the plant needs clear space to pull the bundle.",
    cleanURangeWPerM2K: { value: [800, 1400], source: "[practice] ammonia shell-and-tube condensers with water in the tubes" },
    cleanUWPerM2K: { value: 1000, source: "[practice] ammonia shell-and-tube condensers with water in the tubes ≈ 800–1400 W/(m²·K)" },
    foulingGrowthMultiplierOpenTower: {
      value: 1,
      source: "[practice] the scenario's fouling law (TEMA tower-water allowance) describes condenser tubes",
    },
    openTowerWater: { value: "suitable", source: "[practice] tubes can be brushed, so open-tower water is acceptable" },
    cleaningMethod: { value: "mechanicalTubeBrushing", source: "[practice] heads off, tubes brushed or water-lanced" },
    cleaningCostPerEvent: { value: 3000, source: `[practice] ${COST_NOTE}` },
    inspectionMethod: { value: "eddyCurrentTesting", source: "[practice] eddy-current testing applies to tubes only" },
    inspectionIntervalYears: {
      value: { openTower: 3, closedLoop: 6 },
      source: "[practice] every 3–5 years on open-tower water, less often on a treated closed loop",
    },
    inspectionCostPerEvent: { value: 4000, source: `[practice] ${COST_NOTE}` },
    gasketLifeYears: { value: undefined, source: "no plate gaskets (head gaskets are renewed at each cleaning)" },
    tubeBundleLifeYears: { value: 20, source: "[practice] carbon-steel tubes on treated tower water 15–25 years" },
    wearPartCostFractionOfCondenser: { value: 0.5, source: "[practice] a retube or new bundle costs about half a new condenser" },
    material: {
      ammonia: { value: "carbonSteel", source: "[practice] carbon or stainless steel tubes for ammonia (never copper)" },
      halocarbon: { value: "copperAlloy", source: "[practice] copper or copper-nickel tubes for halocarbons" },
    },
    ammoniaChargeKgPerKW: {
      value: 0.08,
      source: "[memory] screening figure 0.05–0.1 kg of ammonia per kW for a drained shell; use the manufacturer's stated charge",
    },
    firstCostItems: {
      value: ["condenser", "tube-pull clearance in the plant room", "water-box heads and isolation valves"],
      source: "[practice]",
    },
    typicalMaxDutyKW: { value: undefined, source: "[practice] built to any size" },
  },
  plateAndFrame: {
    label: CONDENSER_CONSTRUCTION_LABELS.plateAndFrame,
    description:
      "Compact gasketed plate pack with high coefficients; narrow channels are sensitive to particulate in open-tower water; cleaned by opening the pack (or in place); gaskets are replaced on a life; plates can be added when the load grows.",
    cleanURangeWPerM2K: { value: [2500, 5000], source: "[practice] condensing on gasketed (or semi-welded) plates" },
    cleanUWPerM2K: { value: 3000, source: "[practice] gasketed plate condensers ≈ 2500–5000 W/(m²·K) clean" },
    foulingGrowthMultiplierOpenTower: {
      value: 0.5,
      source: "[practice] turbulent plate channels grow deposits more slowly than tubes, but particulate can block them",
    },
    openTowerWater: { value: "particulateSensitive", source: "[practice] narrow channels block with airborne dirt and debris from an open tower" },
    cleaningMethod: { value: "openPlatePack", source: "[practice] pack opened and plates cleaned, or cleaned in place" },
    cleaningCostPerEvent: { value: 4000, source: `[practice] ${COST_NOTE}` },
    inspectionMethod: { value: "visualAtOpening", source: "[practice] plates and gaskets inspected whenever the pack is opened" },
    inspectionIntervalYears: { value: { openTower: 0, closedLoop: 0 }, source: "[practice] inspection is part of each opening" },
    inspectionCostPerEvent: { value: 0, source: "part of the cleaning" },
    gasketLifeYears: { value: 8, source: "[practice] gaskets every 5–10 years" },
    tubeBundleLifeYears: { value: undefined, source: "no tubes" },
    wearPartCostFractionOfCondenser: { value: 0.25, source: "[practice] a full gasket set ≈ a quarter of the unit's price" },
    material: {
      ammonia: { value: "stainlessSteel", source: "[practice] stainless plates, ammonia-compatible gaskets (semi-welded pairs on the refrigerant side)" },
      halocarbon: { value: "stainlessSteel", source: "[practice] stainless steel plates" },
    },
    ammoniaChargeKgPerKW: { value: 0.03, source: "[memory] screening figure 0.02–0.04 kg/kW; use the manufacturer's stated charge" },
    firstCostItems: {
      value: ["condenser", "strainer on the water inlet", "clearance to open the frame"],
      source: "[practice]",
    },
    typicalMaxDutyKW: { value: undefined, source: "[practice] built in large frames" },
  },
  plateAndShell: {
    label: CONDENSER_CONSTRUCTION_LABELS.plateAndShell,
    description:
      "Welded plate pack inside a pressure shell: robust, high pressure rating, low refrigerant charge; it cannot be opened, so it is cleaned chemically only.",
    cleanURangeWPerM2K: { value: [2000, 4000], source: "[practice] welded plate-and-shell condensers" },
    cleanUWPerM2K: { value: 2500, source: "[practice] welded plate-and-shell ≈ 2000–4000 W/(m²·K) clean" },
    foulingGrowthMultiplierOpenTower: { value: 0.5, source: "[practice] turbulent channels; deposits cannot be removed mechanically" },
    openTowerWater: { value: "notCleanable", source: "[practice] a welded pack cannot be opened: open-tower deposits must be dissolved" },
    cleaningMethod: { value: "chemicalCleanInPlace", source: "[practice] acid or alkaline circulation; cannot be opened" },
    cleaningCostPerEvent: { value: 2500, source: `[practice] ${COST_NOTE}` },
    inspectionMethod: { value: "none", source: "[practice] no internal access: pressure and leak tests" },
    inspectionIntervalYears: { value: { openTower: 0, closedLoop: 0 }, source: "[practice] no routine internal inspection" },
    inspectionCostPerEvent: { value: 0, source: "none" },
    gasketLifeYears: { value: undefined, source: "no gaskets in the pack" },
    tubeBundleLifeYears: { value: undefined, source: "no tubes" },
    wearPartCostFractionOfCondenser: { value: 0, source: "no wear parts" },
    material: {
      ammonia: { value: "stainlessSteel", source: "[practice] stainless plates" },
      halocarbon: { value: "stainlessSteel", source: "[practice] stainless plates" },
    },
    ammoniaChargeKgPerKW: { value: 0.02, source: "[memory] low-charge construction, screening figure 0.01–0.03 kg/kW; use the manufacturer's stated charge" },
    firstCostItems: { value: ["condenser", "fine strainer on the water inlet", "chemical-cleaning connections"], source: "[practice]" },
    typicalMaxDutyKW: { value: undefined, source: "[practice]" },
  },
  brazedPlate: {
    label: CONDENSER_CONSTRUCTION_LABELS.brazedPlate,
    description: "Small brazed plate packs for halocarbon duties; cannot be opened, cleaned chemically; replaced rather than repaired.",
    cleanURangeWPerM2K: { value: [2000, 4000], source: "[practice] brazed plate condensers" },
    cleanUWPerM2K: { value: 3000, source: "[practice] brazed plate ≈ 2000–4000 W/(m²·K) clean" },
    foulingGrowthMultiplierOpenTower: { value: 0.5, source: "[practice] turbulent channels; narrow and not openable" },
    openTowerWater: { value: "notCleanable", source: "[practice] narrow channels that cannot be opened" },
    cleaningMethod: { value: "chemicalCleanInPlace", source: "[practice] chemical circulation only" },
    cleaningCostPerEvent: { value: 800, source: `[practice] order of magnitude for a small unit; get a contractor's price` },
    inspectionMethod: { value: "none", source: "[practice] no internal access" },
    inspectionIntervalYears: { value: { openTower: 0, closedLoop: 0 }, source: "[practice] none" },
    inspectionCostPerEvent: { value: 0, source: "none" },
    gasketLifeYears: { value: undefined, source: "no gaskets" },
    tubeBundleLifeYears: { value: undefined, source: "no tubes" },
    wearPartCostFractionOfCondenser: { value: 0, source: "replaced as a unit" },
    material: {
      ammonia: { value: "stainlessNickelBrazed", source: "[practice] only nickel-brazed packs for ammonia (copper brazing is attacked)" },
      halocarbon: { value: "stainlessCopperBrazed", source: "[practice] copper-brazed stainless plates" },
    },
    ammoniaChargeKgPerKW: { value: 0.015, source: "[memory] screening figure; use the manufacturer's stated charge" },
    firstCostItems: { value: ["condenser", "fine strainer on the water inlet"], source: "[practice]" },
    typicalMaxDutyKW: { value: 500, source: "[practice] brazed plates serve small duties, up to a few hundred kW" },
  },
};

/**
 * Refrigerant charge per kW of heat rejected in a construction, kg/kW: the ammonia figure scaled by the
 * ratio of saturated-liquid densities (the same liquid volume held), ρref/ρNH3 at ~35 °C.
 */
export function constructionChargeKgPerKW(construction: CondenserConstruction, refrigerant: Refrigerant): number {
  const base = CONDENSER_CONSTRUCTION_DEFAULTS[construction].ammoniaChargeKgPerKW.value;
  return (base * LIQUID_DENSITY_35C_KG_PER_M3[refrigerant]) / LIQUID_DENSITY_35C_KG_PER_M3.R717;
}

/** Default material of a construction for a refrigerant. */
export function defaultCondenserMaterial(construction: CondenserConstruction, refrigerant: Refrigerant): CondenserMaterial {
  const m = CONDENSER_CONSTRUCTION_DEFAULTS[construction].material;
  return isAmmonia(refrigerant) ? m.ammonia.value : m.halocarbon.value;
}

/** Copper and copper-brazed surfaces are attacked by ammonia (with the moisture always present). */
export function materialContainsCopper(material: CondenserMaterial): boolean {
  return material === "copperAlloy" || material === "stainlessCopperBrazed";
}

/** What the condenser's water side sees. */
export type CondenserWaterSide = "openTower" | "closedLoop";

/**
 * Warnings about a condenser's construction in its option: a plate-type or welded condenser on
 * open-tower water (the direct-tower option), copper with ammonia, a brazed plate above its usual
 * size or with ammonia. `path` is the option's condenser path, e.g. "options.0.condenser".
 */
export function constructionWarnings(args: {
  construction: CondenserConstruction;
  material: CondenserMaterial;
  refrigerant: Refrigerant;
  waterSide: CondenserWaterSide;
  designHeatKW: number;
  path: string;
  optionId?: string;
}): EngineWarning[] {
  const out: EngineWarning[] = [];
  const d = CONDENSER_CONSTRUCTION_DEFAULTS[args.construction];
  const id = args.optionId !== undefined ? { optionId: args.optionId } : {};
  if (args.waterSide === "openTower" && d.openTowerWater.value !== "suitable") {
    const why =
      d.openTowerWater.value === "particulateSensitive"
        ? "its narrow gasketed channels block with the dirt, debris and biofilm an open tower collects"
        : "its welded or brazed pack cannot be opened, so deposits from open-tower water can only be dissolved chemically";
    out.push({
      code: "condenser.plateOnOpenTowerWater",
      severity: "warning",
      message: `A ${d.label.toLowerCase()} condenser would see open-tower water: ${why}. Isolate it behind a plate exchanger, or fit fine filtration (side-stream or full-flow strainer) and plan cleaning accordingly — or choose a shell-and-tube condenser for direct tower water.`,
      path: `${args.path}.construction`,
      ...id,
    });
  }
  if (isAmmonia(args.refrigerant) && materialContainsCopper(args.material)) {
    out.push({
      code: "condenser.copperWithAmmonia",
      severity: "warning",
      message: "Copper and copper alloys (including copper brazing) are attacked by ammonia: use carbon or stainless steel (or a nickel-brazed pack) in an ammonia condenser.",
      path: `${args.path}.material`,
      ...id,
    });
  }
  if (args.construction === "brazedPlate") {
    const max = d.typicalMaxDutyKW.value;
    if (max !== undefined && args.designHeatKW > max) {
      out.push({
        code: "condenser.brazedPlateLargeDuty",
        severity: "info",
        message: `Brazed plate condensers usually serve duties up to a few hundred kW; ${Math.round(args.designHeatKW)} kW is large for one — check that a selection exists.`,
        path: `${args.path}.construction`,
        ...id,
      });
    }
  }
  return out;
}

/** Years between inspections for the construction on the given water side (0 = none). */
export function inspectionIntervalYears(construction: CondenserConstruction, waterSide: CondenserWaterSide): number {
  return CONDENSER_CONSTRUCTION_DEFAULTS[construction].inspectionIntervalYears.value[waterSide];
}
