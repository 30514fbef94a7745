/**
 * Each option's condenser as built and kept: its construction (or, for an evaporative condenser, its
 * coil), material, refrigerant inventory, and the upkeep plan its construction implies — cleaning
 * method and cost, inspection regime, wear-part life — resolved from the entered values and the
 * construction defaults (condenser-construction.ts). The plan feeds the economics (as upkeep items and
 * replacements of the option), the footprint (inventory × leak rate × GWP) and the report.
 *
 * Precedence: an entered value wins over the construction's default; an option's own upkeep entries
 * (its cleaning cost per event, an eddy-current testing item) are its plan and are not duplicated.
 */
import {
  CLEANING_METHOD_LABELS,
  CONDENSER_CONSTRUCTION_DEFAULTS,
  CONDENSER_MATERIAL_LABELS,
  type CleaningMethod,
  type CondenserConstruction,
  type CondenserMaterial,
  type CondenserWaterSide,
  INSPECTION_METHOD_LABELS,
  type InspectionMethod,
  constructionChargeKgPerKW,
  constructionWarnings,
  defaultCondenserMaterial,
} from "./condenser-construction";
import { designHeatRejectionKW } from "./duty";
import {
  EVAPORATIVE_CONDENSER_AMMONIA_CHARGE_KG_PER_KW,
  EVAPORATIVE_CONDENSER_COIL_CLEANING_COST,
  EVAPORATIVE_CONDENSER_COIL_LIFE_YEARS,
} from "./evaporative-condenser";
import type { EconomicsOptionInput, OptionCostsInput, PeriodicUpkeepItemInput } from "./economics/types";
import type { DutyInput, EvaporativeCondenserOptionInput, FootprintInput, OptionInput, ScenarioInput } from "./input";
import { condenserInventoryKg, inventoryCautions } from "./refrigerant-inventory";
import { LIQUID_DENSITY_35C_KG_PER_M3, globalWarmingPotential100, isAmmonia } from "./refrigerants";
import type { EngineWarning } from "./types";

/** What the option's scheduled cleanings (`OptionAnnualPhysics.cleaningsPerYear`) clean. */
export type CleanedSurface = "condenser" | "plateExchanger" | "coil" | "none";

export interface CondenserPlan {
  optionId: string;
  /** The water-cooled condenser's construction, or the evaporative condenser's own coil. */
  construction: CondenserConstruction | "evaporativeCondenserCoil";
  constructionLabel: string;
  description: string;
  /** What wets the condensing surface's outside: open-tower water, a closed loop, or recirculating spray water. */
  waterSide: CondenserWaterSide | "sprayWater";
  material: CondenserMaterial;
  materialLabel: string;
  /** Clean overall coefficient of a water-cooled condenser, W/(m²·K); null for the evaporative condenser. */
  cleanUWPerM2K: number | null;
  /** Multiplier on the tube-fouling growth law; applied only where the condenser sees open-tower water. */
  foulingGrowthMultiplier: number;
  specificChargeKgPerKW: number;
  specificChargeSource: string;
  inventoryKg: number;
  cleaning: {
    method: CleaningMethod;
    methodLabel: string;
    /** Cost per scheduled cleaning of `surface` (entered, or the construction's default). */
    costPerEvent: number;
    costSource: string;
    surface: CleanedSurface;
  };
  inspection: { method: InspectionMethod; methodLabel: string; intervalYears: number; costPerEvent: number; source: string };
  wearPart: { name: string; lifeYears: number; replacementCost: number | null } | null;
  firstCostItems: readonly string[];
  warnings: EngineWarning[];
}

/** What the water side of an option's condenser sees. */
export function condenserWaterSide(o: OptionInput): CondenserWaterSide | "sprayWater" {
  return o.kind === "openTowerDirect" ? "openTower" : o.kind === "evaporativeCondenser" ? "sprayWater" : "closedLoop";
}

/**
 * The evaporative condenser's coil as its condenser: galvanized steel unless entered (copper with ammonia
 * warns), charge per kW of rated heat rejection (ammonia figure × liquid-density ratio), coil-exterior
 * cleaning on the scaling interval at the entered or default cost (0 when the option lists its own
 * descaling item), the coil as the wear part.
 */
function evaporativeCoilPlan(o: EvaporativeCondenserOptionInput, index: number, duty: DutyInput): CondenserPlan {
  const e = o.evaporativeCondenser;
  const material = e.coilMaterial ?? "galvanizedSteel";
  const charge =
    e.specificChargeKgPerKW ??
    (EVAPORATIVE_CONDENSER_AMMONIA_CHARGE_KG_PER_KW.value * LIQUID_DENSITY_35C_KG_PER_M3[duty.refrigerant]) / LIQUID_DENSITY_35C_KG_PER_M3.R717;
  const entered = o.costs.upkeep.cleaningCostPerEvent;
  const ownDescaling = o.costs.upkeep.periodicItems.some((p) => p.kind === "coilExteriorDescaling");
  const costPerEvent = entered > 0 ? entered : ownDescaling ? 0 : EVAPORATIVE_CONDENSER_COIL_CLEANING_COST.value;
  const warnings: EngineWarning[] = [];
  if (isAmmonia(duty.refrigerant) && (material === "copperAlloy" || material === "stainlessCopperBrazed")) {
    warnings.push({
      code: "condenser.copperWithAmmonia",
      severity: "warning",
      message: "Copper and copper alloys are attacked by ammonia: an ammonia evaporative condenser's coil is galvanized or stainless steel.",
      path: `options.${index}.evaporativeCondenser.coilMaterial`,
      optionId: o.id,
    });
  }
  return {
    optionId: o.id,
    construction: "evaporativeCondenserCoil",
    constructionLabel: "Evaporative condenser coil",
    description:
      "Refrigerant condenses inside the coil; recirculating spray water wets its outside and air is drawn across it. Scale on the coil exterior cuts capacity until the coil is cleaned and descaled.",
    waterSide: "sprayWater",
    material,
    materialLabel: CONDENSER_MATERIAL_LABELS[material],
    cleanUWPerM2K: null,
    foulingGrowthMultiplier: 1,
    specificChargeKgPerKW: charge,
    specificChargeSource: e.specificChargeKgPerKW !== undefined ? "entered" : EVAPORATIVE_CONDENSER_AMMONIA_CHARGE_KG_PER_KW.source,
    inventoryKg: condenserInventoryKg(e.ratedHeatRejectionKW, charge),
    cleaning: {
      method: "coilExteriorDescaling",
      methodLabel: CLEANING_METHOD_LABELS.coilExteriorDescaling,
      costPerEvent,
      costSource:
        entered > 0 ? "entered with the option's upkeep" : ownDescaling ? "in the option's own descaling item" : EVAPORATIVE_CONDENSER_COIL_CLEANING_COST.source,
      surface: "coil",
    },
    inspection: { method: "none", methodLabel: INSPECTION_METHOD_LABELS.none, intervalYears: 0, costPerEvent: 0, source: "[practice] coil and basin are inspected at each cleaning" },
    wearPart: {
      name: "coil",
      lifeYears: e.coilLifeYears ?? EVAPORATIVE_CONDENSER_COIL_LIFE_YEARS.value,
      replacementCost: e.coilReplacementCost ?? null,
    },
    firstCostItems: ["evaporative condenser (coil, fans, spray pump, basin)", "structure and crane", "hot-gas, liquid-drain and purge piping to the unit", "water-treatment equipment"],
    warnings,
  };
}

/**
 * Resolve an option's condenser: entered values over construction defaults; inventory = charge per kW ×
 * design heat rejection; the construction warnings (plate on open-tower water, copper with ammonia).
 */
export function condenserPlan(o: OptionInput, index: number, duty: DutyInput): CondenserPlan {
  if (o.kind === "evaporativeCondenser") return evaporativeCoilPlan(o, index, duty);
  const c = o.condenser;
  const d = CONDENSER_CONSTRUCTION_DEFAULTS[c.construction];
  const waterSide: CondenserWaterSide = o.kind === "openTowerDirect" ? "openTower" : "closedLoop";
  const material = c.material ?? defaultCondenserMaterial(c.construction, duty.refrigerant);
  const path = `options.${index}.condenser`;
  const heatKW = designHeatRejectionKW(duty);
  const charge = c.specificChargeKgPerKW ?? constructionChargeKgPerKW(c.construction, duty.refrigerant);
  const up = c.upkeep;
  const surface: CleanedSurface = o.kind === "openTowerDirect" ? "condenser" : o.kind === "openTowerPlateHx" ? "plateExchanger" : "none";
  // The option's own cleaning cost (costs.upkeep) is what its scheduled cleanings cost when entered; the
  // condenser's plan supplies it otherwise — for the direct option only, whose condenser is what gets cleaned.
  const entered = o.costs.upkeep.cleaningCostPerEvent;
  const planCost = up.cleaningCostPerEvent ?? d.cleaningCostPerEvent.value;
  const costPerEvent = entered > 0 ? entered : surface === "condenser" ? planCost : 0;
  const costSource =
    entered > 0
      ? "entered with the option's upkeep"
      : surface === "condenser"
        ? up.cleaningCostPerEvent !== undefined
          ? "entered with the condenser"
          : d.cleaningCostPerEvent.source
        : surface === "plateExchanger"
          ? "none entered for the plate exchanger's cleaning"
          : "no scheduled cleaning (closed loop)";
  const interval = up.inspectionIntervalYears ?? d.inspectionIntervalYears.value[waterSide];
  const gasket = d.gasketLifeYears.value;
  const bundle = d.tubeBundleLifeYears.value;
  const wearName = bundle !== undefined ? "tube bundle" : gasket !== undefined ? "gasket set" : null;
  const wearLife = up.wearPartLifeYears ?? bundle ?? gasket;
  return {
    optionId: o.id,
    construction: c.construction,
    constructionLabel: d.label,
    description: d.description,
    waterSide,
    material,
    materialLabel: CONDENSER_MATERIAL_LABELS[material],
    cleanUWPerM2K: c.cleanUWPerM2K,
    foulingGrowthMultiplier: c.foulingGrowthMultiplier ?? d.foulingGrowthMultiplierOpenTower.value,
    specificChargeKgPerKW: charge,
    specificChargeSource: c.specificChargeKgPerKW !== undefined ? "entered" : d.ammoniaChargeKgPerKW.source,
    inventoryKg: condenserInventoryKg(heatKW, charge),
    cleaning: {
      method: up.cleaningMethod ?? d.cleaningMethod.value,
      methodLabel: CLEANING_METHOD_LABELS[up.cleaningMethod ?? d.cleaningMethod.value],
      costPerEvent,
      costSource,
      surface,
    },
    inspection: {
      method: d.inspectionMethod.value,
      methodLabel: INSPECTION_METHOD_LABELS[d.inspectionMethod.value],
      intervalYears: interval,
      costPerEvent: up.inspectionCostPerEvent ?? d.inspectionCostPerEvent.value,
      source: up.inspectionIntervalYears !== undefined ? "entered" : d.inspectionIntervalYears.source,
    },
    wearPart: wearName !== null && wearLife !== undefined ? { name: wearName, lifeYears: wearLife, replacementCost: up.wearPartReplacementCost ?? null } : null,
    firstCostItems: d.firstCostItems.value,
    warnings: constructionWarnings({
      construction: c.construction,
      material,
      refrigerant: duty.refrigerant,
      waterSide,
      designHeatKW: heatKW,
      path,
      optionId: o.id,
    }),
  };
}

/**
 * The option's costs with its condenser plan folded in: the cleaning cost per event resolved; an
 * inspection item (eddy-current testing for tubes) unless the option already lists one; the wear part
 * as a component replacement once its cost is entered.
 */
export function costsWithCondenserPlan(costs: OptionCostsInput, plan: CondenserPlan): OptionCostsInput {
  const periodicItems: PeriodicUpkeepItemInput[] = [...costs.upkeep.periodicItems];
  const i = plan.inspection;
  const alreadyListed = periodicItems.some((p) => p.kind === "eddyCurrentTesting");
  if (i.method === "eddyCurrentTesting" && i.intervalYears > 0 && i.costPerEvent > 0 && !alreadyListed) {
    periodicItems.push({
      kind: "eddyCurrentTesting",
      label: `Condenser: ${i.methodLabel.toLowerCase()}`,
      everyYears: i.intervalYears,
      costPerEvent: i.costPerEvent,
      labourHoursPerEvent: 0,
    });
  }
  const components = [...costs.components];
  const w = plan.wearPart;
  if (w && w.replacementCost !== null && w.replacementCost > 0) {
    components.push(
      plan.construction === "evaporativeCondenserCoil"
        ? { component: "coil", label: "Evaporative condenser coil", lifeYears: w.lifeYears, replacementCost: w.replacementCost }
        : { component: "condenserWearPart", label: `Condenser ${w.name}`, lifeYears: w.lifeYears, replacementCost: w.replacementCost },
    );
  }
  return {
    ...costs,
    components,
    upkeep: { ...costs.upkeep, cleaningCostPerEvent: plan.cleaning.costPerEvent, periodicItems },
  };
}

/** Yearly refrigerant leakage of a plan, kg CO₂e: leak fraction × inventory × GWP (100-year, report named). */
export function leakageKgCO2ePerYear(plan: CondenserPlan, duty: DutyInput, footprint: FootprintInput): number {
  return footprint.annualLeakFraction * plan.inventoryKg * globalWarmingPotential100(duty.refrigerant, footprint.gwpReport);
}

/** Every option's condenser plan. */
export function condenserPlans(input: ScenarioInput): CondenserPlan[] {
  return input.options.map((o, i) => condenserPlan(o, i, input.duty));
}

/** The scenario's options with their condenser plans folded into their costs (what physics and economics read). */
export function optionsWithCondenserPlans(input: ScenarioInput, plans: CondenserPlan[] = condenserPlans(input)): OptionInput[] {
  return input.options.map((o, i) => {
    const plan = plans[i];
    if (!plan) return o;
    const costs = costsWithCondenserPlan(o.costs, plan);
    if (o.kind === "evaporativeCondenser") return { ...o, costs };
    return { ...o, condenser: { ...o.condenser, foulingGrowthMultiplier: plan.foulingGrowthMultiplier }, costs };
  });
}

/** The options as the economics sees them: plan-resolved costs and the carbon basis of each. */
export function economicsOptionsOf(input: ScenarioInput, plans: CondenserPlan[] = condenserPlans(input)): EconomicsOptionInput[] {
  const options = optionsWithCondenserPlans(input, plans);
  return options.map((o, i) => {
    const plan = plans[i];
    return {
      optionId: o.id,
      kind: o.kind,
      label: o.label,
      costs: o.costs,
      carbon: {
        gridFactorKgCO2ePerKWh: input.footprint.gridEmissionFactorKgCO2ePerKWh,
        leakageKgCO2ePerYear: plan ? leakageKgCO2ePerYear(plan, input.duty, input.footprint) : 0,
      },
    };
  });
}

/** Inventory cautions of every plan (the standing ammonia caution once, thresholds per option). */
export function inventoryWarnings(input: ScenarioInput, plans: CondenserPlan[]): EngineWarning[] {
  const out: EngineWarning[] = [];
  let ammoniaShown = false;
  plans.forEach((p, i) => {
    const gwp = globalWarmingPotential100(input.duty.refrigerant, input.footprint.gwpReport);
    const path = p.construction === "evaporativeCondenserCoil" ? `options.${i}.evaporativeCondenser.specificChargeKgPerKW` : `options.${i}.condenser.specificChargeKgPerKW`;
    for (const w of inventoryCautions({ refrigerant: input.duty.refrigerant, inventoryKg: p.inventoryKg, gwp, optionId: p.optionId, path })) {
      if (w.code === "caution.ammonia") {
        if (ammoniaShown) continue;
        ammoniaShown = true;
        out.push({ code: w.code, severity: w.severity, message: w.message, path: "duty.refrigerant" });
        continue;
      }
      out.push(w);
    }
  });
  return out;
}
