/**
 * The one zod schema of a LoopLedger scenario (forms, API and storage use it): engineer A's
 * `climateInputSchema`, engineer C's economic pieces, and the physics keys defined here (site, duty,
 * options discriminated by `kind`, water, fouling). Parsing fills every default, so its output is the
 * engine's `ScenarioInput` (checked at compile time at the bottom). All field errors are returned with
 * their paths; cross-field checks carry the path of the field to fix.
 *
 * Every defaulted field takes its default from `fieldDefaults` (path → default + source), which the
 * editor shows beside the field. `options[]` in a path stands for every option.
 */
import { z } from "zod";
import { text } from "@/lib/validation/text";
import { MAX_BINS } from "@/lib/validation/limits";
import { OPTION_KINDS } from "@/lib/engine/types";
import {
  CLEANING_METHODS,
  CONDENSER_CONSTRUCTIONS,
  CONDENSER_CONSTRUCTION_DEFAULTS,
  CONDENSER_MATERIALS,
} from "@/lib/engine/condenser-construction";
import { DEFAULT_ANNUAL_LEAK_FRACTION, DEFAULT_GRID_EMISSION_FACTOR } from "@/lib/engine/footprint";
import { GWP_REPORTS, REFRIGERANTS } from "@/lib/engine/refrigerants";
import type { ScenarioInput } from "@/lib/engine/input";
import type { ClimateInput } from "@/lib/engine/climate/types";
import { climateInputSchema } from "./schema-climate";
import {
  economicsFieldDefaults,
  economicsSchema,
  monteCarloSchema,
  optionCostsSchema,
  sensitivitySchema,
  tariffsSchema,
  upkeepSchema,
  type FieldDefault,
} from "./schema-economics";

export type { FieldDefault } from "./schema-economics";

/** Outdoor dry-bulb at which a basin heater's rating just holds its set-point (the default heat-loss basis), °C. */
export const BASIN_HEATER_SIZING_AMBIENT_C = -17.8;

/** Default value and source of every defaulted physics field (economics: see `economicsFieldDefaults`). */
export const physicsFieldDefaults = {
  "duty.headPressureControl": {
    default: "fixedSetPoint",
    source: "[practice] fans hold one condensing set-point; choose floating head pressure where the plant allows it",
  },
  "duty.loadProfile": {
    default: { kind: "constant", fraction: 1 },
    source: "[practice] conservative: the design load in every hour; enter the plant's profile",
  },
  "duty.compressorModel": {
    default: { kind: "refrigerantCycle" },
    source:
      "single-stage saturated cycle of the plant's refrigerant (R-717, or R-134a for halocarbons) fitted to CoolProp reference-library values, scaled to the design COP; enter the manufacturer's data where you have them",
  },
  "duty.compressorModel.floorFraction": {
    default: 0.4,
    source: "[practice] a compressor at the lowest head still draws a good part of its design power (unloading, oil pump, motor losses)",
  },
  "duty.refrigerant": {
    default: "R717",
    source: "[practice] ammonia, the usual refrigerant of industrial plants; choose the plant's refrigerant",
  },
  "options[].fan.control": { default: "variableSpeed", source: "[practice] variable-speed drives are the norm on new units" },
  "options[].fan.minSpeedFraction": { default: 0.25, source: "[practice] 20–30 % minimum speed of tower and cooler fan drives" },
  "options[].fan.powerFloorFraction": {
    default: 0.05,
    source: "[practice] drive and motor losses that remain at low speed: P/Pd = a + (1 − a)·f³",
  },
  "options[].fan.lowSpeedFraction": { default: 0.5, source: "[practice] two-speed motors 100/50 % (or 100/67 %)" },
  "options[].fan.naturalDraftAirflowFraction": {
    default: 0.1,
    source: "[memory] natural-draft capacity with the fan off ≈ 10 %, modelled as 10 % of the design airflow",
  },
  "options[].tower.designLiquidToGasRatio": {
    default: 1.2,
    source: "[practice] counterflow towers run L/G 0.75–1.5 at design; enter the selection's airflow-based value if known",
  },
  "options[].tower.characteristicExponent": {
    default: 0.6,
    source: "[practice] n of KaV/L = C·(L/G)^−n is 0.5–0.8 for film fills (CTI practice)",
  },
  "options[].condenser.construction": {
    default: "shellAndTube",
    source: "[practice] the usual condenser on tower water; it sets the defaults below",
  },
  "options[].condenser.material": {
    default: "by construction and refrigerant: steel for ammonia, copper alloy tubes for halocarbons",
    source: "[practice] never copper with ammonia",
  },
  "options[].condenser.cleanUWPerM2K": {
    default: "by construction: shell-and-tube 1000, plate-and-frame 3000, plate-and-shell 2500, brazed plate 3000",
    source: "[practice] clean overall coefficients of each construction (shell-and-tube 800–1400, plates 2000–5000 W/(m²·K))",
  },
  "options[].condenser.foulingGrowthMultiplier": {
    default: "by construction: shell-and-tube 1, plate types 0.5 (on open-tower water)",
    source: "[practice] turbulent plate channels grow deposits more slowly than tubes (but block with particulate)",
  },
  "options[].condenser.specificChargeKgPerKW": {
    default: "by construction: ammonia 0.08 shell-and-tube, 0.03 plate-and-frame, 0.02 plate-and-shell, 0.015 brazed; × liquid-density ratio for other refrigerants",
    source: "[memory] screening figures; use the manufacturer's stated charge",
  },
  "options[].condenser.upkeep.cleaningMethod": {
    default: "by construction: tube brushing, opening the plate pack, chemical cleaning in place",
    source: "[practice]",
  },
  "options[].condenser.upkeep.cleaningCostPerEvent": {
    default: "by construction: 3000 shell-and-tube, 4000 plate-and-frame, 2500 plate-and-shell, 800 brazed",
    source: "[practice] order of magnitude for a ~1 MW condenser; get a contractor's price",
  },
  "options[].condenser.upkeep.inspectionIntervalYears": {
    default: "shell-and-tube: eddy-current testing every 3 years on open-tower water, 6 on a closed loop; plates: none (inspected when opened)",
    source: "[practice] eddy-current testing applies to tubes only",
  },
  "options[].condenser.upkeep.inspectionCostPerEvent": {
    default: "shell-and-tube 4000; others 0",
    source: "[practice] order of magnitude; get a contractor's price",
  },
  "options[].condenser.upkeep.wearPartLifeYears": {
    default: "tube bundle 20 years (shell-and-tube), gaskets 8 years (plate-and-frame)",
    source: "[practice]",
  },
  "options[].condenser.designFoulingM2KPerW": {
    default: 0,
    source: "the stated design condensing temperature is taken as the clean condenser's",
  },
  "options[].condenserPump.headM": { default: 20, source: "[practice] condenser-water loop head 15–25 m" },
  "options[].condenserPump.efficiency": { default: 0.65, source: "[practice] wire-to-water efficiency of an end-suction pump set" },
  "options[].towerPump.headM": { default: 15, source: "[practice] tower-side loop head (static lift + piping)" },
  "options[].towerPump.efficiency": { default: 0.65, source: "[practice] wire-to-water efficiency" },
  "options[].basinHeater.powerKW": { default: 0, source: "none entered; enter the heater rating (0 = no heater)" },
  "options[].basinHeater.setPointC": {
    default: 4.4,
    source: "[practice] basin-heater thermostat at about 40 °F (a stored 'runs below dry-bulb' value is read as the set-point)",
  },
  "options[].basinHeater.heatLossKWPerK": {
    default: "rating ÷ (set-point + 17.8 K)",
    source: `[practice] heaters are sized to hold the set-point at about ${BASIN_HEATER_SIZING_AMBIENT_C} °C (0 °F) outdoors with the fan off; enter the manufacturer's basin heat loss if known`,
  },
  "options[].basinHeater.drainedWhenIdle": {
    default: false,
    source: "[practice] the basin stays filled when no water circulates; choose drained for a drain-down (or remote-sump) winter sequence",
  },
  "options[].cyclesOfConcentration": {
    default: "the scenario's cycles (Water)",
    source: "enter a loop's own cycles where it runs differently, e.g. a cooler's spray loop held lower to protect the coil",
  },
  "options[].condenser.waterSideResistanceFraction": {
    default: 0.4,
    source: "[practice] the water-side film is about 30–50 % of a clean condenser's resistance; glycol derates this part (Dittus–Boelter)",
  },
  "options[].driftFractionOfFlow": {
    default: 0.00005,
    source: "[practice] modern drift eliminators 0.0005–0.005 % of circulating flow; 0.005 % used",
  },
  "options[].wetLoopVolumeM3": {
    default: "3 minutes of the circulating (tower or spray) flow",
    source: "[practice] basin and piping volume of a packaged unit",
  },
  "options[].plateExchanger.designApproachK": { default: 1.5, source: "[practice] plate exchangers for tower isolation: 1–2 K" },
  "options[].plateExchanger.cleanUWPerM2K": { default: 5000, source: "[practice] water-to-water plates 3000–7000 W/(m²·K) clean" },
  "options[].plateExchanger.towerSidePressureDropKPa": { default: 50, source: "[practice] 30–70 kPa per side at design flow" },
  "options[].plateExchanger.cleanSidePressureDropKPa": { default: 50, source: "[practice] 30–70 kPa per side at design flow" },
  "options[].plateExchanger.foulingGrowthFactor": {
    default: 0.5,
    source: "[practice] turbulent plate channels foul more slowly than condenser tubes on the same water",
  },
  "options[].cooler.designFluidToAirRatio": {
    default: 1,
    source: "[practice] closed-circuit coolers run about 1 kg of fluid per kg of air at design; enter the rated airflow if known",
  },
  "options[].cooler.internalResistanceFraction": {
    default: 0.3,
    source: "[practice] the tube-side (fluid) share of the wet overall resistance, 20–40 %",
  },
  "options[].cooler.dryExternalConductanceFactor": {
    default: 0.7,
    source: "[practice] dry external conductance 0.5–0.8 of the Lewis-analogy value hD·A·cp; calibrated on the dry rating when given",
  },
  "options[].cooler.allowDryMode": { default: true, source: "the unit may run dry (spray pump off) when that costs less power" },
  "options[].cooler.modeSelection": {
    default: "lowestTotalPower",
    source: "each hour wet or dry, whichever needs less fan + spray pump + compressor power [practice: the usual energy optimum]",
  },
  "options[].cooler.sprayLockoutDryBulbC": {
    default: 2,
    source: "[practice] spray water is kept off below about 0–3 °C dry-bulb unless the unit is built for wet winter operation (freeze protection)",
  },
  "options[].cooler.glycol": { default: { kind: "none", massFraction: 0 }, source: "water in the process loop" },
  "options[].cooler.ratingFluid": {
    default: "water",
    source: "ratings taken as on water; the engine derates capacity and pump power for the loop's glycol",
  },
  "options[].evaporativeCondenser.airFlowKgPerS": {
    default: "0.03 kg/s per kW of rated heat rejection",
    source: "[practice] the usual airflow of an ammonia evaporative condenser at its rating; enter the rated airflow",
  },
  "options[].evaporativeCondenser.internalResistanceFraction": {
    default: 0.15,
    source: "[practice] condensing ammonia films are thin: the inside (film + wall) share of the overall resistance is small, 10–25 %",
  },
  "options[].evaporativeCondenser.dryExternalConductanceFactor": {
    default: 0.7,
    source: "[practice] dry external conductance 0.5–0.8 of the Lewis-analogy value hD·A·cp; calibrated on the dry rating when given",
  },
  "options[].evaporativeCondenser.allowDryMode": {
    default: false,
    source: "dry operation only where the manufacturer rates the unit for it (enter its dry rating)",
  },
  "options[].evaporativeCondenser.modeSelection": {
    default: "lowestTotalPower",
    source: "each hour wet or dry, whichever needs less fan + spray pump + compressor power [practice: the usual energy optimum]",
  },
  "options[].evaporativeCondenser.sprayLockoutDryBulbC": {
    default: -30,
    source: "[practice] evaporative condensers commonly run wet in winter with basin heat and an indoor sump; raise it to force dry operation in frost",
  },
  "options[].evaporativeCondenser.coilMaterial": { default: "galvanizedSteel", source: "[practice] hot-dip galvanized steel coils; stainless steel on request" },
  "options[].evaporativeCondenser.specificChargeKgPerKW": {
    default: "ammonia 0.1 kg/kW of rated heat rejection; × liquid-density ratio for other refrigerants",
    source: "[memory] screening figure 0.05–0.15 kg/kW; use the manufacturer's stated charge",
  },
  "options[].evaporativeCondenser.coilScaling": {
    default: { derateBeforeCleaning: 0.05, cleaningIntervalMonths: 12 },
    source: "[practice] scale on the coil exterior costs a few per cent of capacity by the yearly cleaning and descaling",
  },
  "options[].evaporativeCondenser.coilLifeYears": {
    default: 20,
    source: "[practice] hot-dip galvanized coil about the unit's life with good water treatment; stainless longer",
  },
  "options[].sprayPump.headM": { default: 6, source: "[practice] spray pumps work against a low head, 5–8 m" },
  "options[].sprayPump.efficiency": { default: 0.6, source: "[practice] small close-coupled pump sets" },
  "water.limits.silicaMgPerL": { default: 150, source: "[memory] typical guideline 150 mg/L SiO2 in recirculating water" },
  "water.limits.chlorideMgPerL": { default: 250, source: "[memory] 250–500 mg/L by metallurgy; 250 for stainless steel" },
  "water.limits.tdsMgPerL": { default: 2500, source: "[practice] common TDS ceiling of treatment programmes" },
  "water.limits.calciumHardnessMgPerLAsCaCO3": {
    default: 1000,
    source: "[practice] calcium hardness ceiling with a scale inhibitor, as CaCO3",
  },
  "water.cyclesMode": { default: "fromChemistry", source: "cycles from the makeup analysis and the limits" },
  "water.recirculatingPh": { default: 8.5, source: "[practice] alkaline treatment programmes run pH 8.0–9.0" },
  "water.sewerBasis": {
    default: "makeup",
    source:
      "[practice] without a credit the utility bills all makeup; a credit needs meters and the utility's consent (a stored evaporation-credit choice is read as makeup − evaporation)",
  },
  "water.scaleControl.maximumLangelierIndex": {
    default: 2.5,
    source: "[practice] inhibitor programmes commonly accept an LSI of about 2.0–2.8 at the hottest wetted surface; ask the treatment vendor",
  },
  "water.scaleControl.acidFeed": {
    default: true,
    source: "[practice] sulfuric acid feed holds the LSI at the limit where the cycles would exceed it",
  },
  "water.scaleControl.acidStrengthFraction": { default: 0.93, source: "[practice] 66 °Bé sulfuric acid is 93 % H2SO4" },
  "water.dosing.inhibitorMgPerLOutflow": { default: 100, source: "[practice] inhibitor product 50–150 mg/L in the blowdown" },
  "water.dosing.biocideMgPerLSystemVolume": { default: 10, source: "[practice] slug dose of a non-oxidising biocide" },
  "water.dosing.biocideSlugsPerYear": { default: 52, source: "[practice] weekly slug dosing" },
  "footprint.gridEmissionFactorKgCO2ePerKWh": {
    default: DEFAULT_GRID_EMISSION_FACTOR.value.kgCO2ePerKWh,
    source: DEFAULT_GRID_EMISSION_FACTOR.source,
  },
  "footprint.gridEmissionFactorYear": { default: DEFAULT_GRID_EMISSION_FACTOR.value.dataYear, source: "data year of the default factor" },
  "footprint.gridEmissionFactorSource": {
    default: "[memory] US grid average, EPA eGRID data year 2022",
    source: "state where the project's factor comes from",
  },
  "footprint.gwpReport": {
    default: "AR5",
    source: "IPCC Fifth Assessment Report 100-year values, the basis of many reporting schemes; AR6 on request",
  },
  "footprint.annualLeakFraction": { default: DEFAULT_ANNUAL_LEAK_FRACTION.value, source: DEFAULT_ANNUAL_LEAK_FRACTION.source },
  "fouling.model": { default: "asymptotic", source: "Kern & Seaton (1959) asymptotic fouling" },
  "fouling.asymptoticM2KPerW": {
    default: 0.000176,
    source: "[memory] TEMA RGP-T-2.4: treated cooling-tower water 0.001 h·ft²·°F/Btu = 0.000176 m²·K/W",
  },
  "fouling.timeConstantMonths": { default: 3, source: "[practice] treated tower water approaches its asymptote within a season" },
  "fouling.linearRateM2KPerWPerMonth": { default: 0.0000146, source: "[practice] about the TEMA allowance (0.000176 m²·K/W) reached in 12 months" },
  "fouling.limitM2KPerW": { default: 0.000176, source: "[memory] TEMA allowance for treated tower water" },
  "fouling.condenserCleaningIntervalMonths": { default: 12, source: "[practice] yearly mechanical tube cleaning" },
  "fouling.plateExchangerCleaningIntervalMonths": { default: 24, source: "[practice] plate exchangers opened every 1–3 years" },
  "fouling.closedLoopFoulingM2KPerW": {
    default: 0,
    source: "[practice] a treated closed loop stays clean (the AHRI 550/590 rating allowance is 0.000044 m²·K/W [memory])",
  },
} as const satisfies Record<string, FieldDefault>;

/** Every defaulted field of the scenario (physics and economics), path → { default, source }. */
export const fieldDefaults: Record<string, FieldDefault> = { ...physicsFieldDefaults, ...economicsFieldDefaults };

type PhysicsPath = keyof typeof physicsFieldDefaults;
function d<P extends PhysicsPath>(path: P): (typeof physicsFieldDefaults)[P]["default"] {
  return physicsFieldDefaults[path].default;
}

// --- building blocks ---------------------------------------------------------------------------------

const num = z.number().finite();
const positive = num.positive();
const nonNegative = num.nonnegative();
const waterC = num.min(-10).max(90);
const airC = num.min(-70).max(70);
const efficiency = num.gt(0).max(1);

export const siteSchema = z.object({
  elevationM: num.min(-430).max(5000),
  locationLabel: text().min(1).max(200),
});

export const loadProfileSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("constant"), fraction: num.min(0).max(1.5) }),
  z.object({ kind: z.literal("monthHour"), fractions: z.array(num.min(0).max(1.5)).length(288, "a month × hour profile has 288 values") }),
  z.object({ kind: z.literal("perBin"), fractions: z.array(num.min(0).max(1.5)).min(1).max(MAX_BINS) }),
  z
    .object({
      kind: z.literal("linearInDryBulb"),
      lowDryBulbC: airC,
      fractionAtLowDryBulb: num.min(0).max(1.5),
      highDryBulbC: airC,
      fractionAtHighDryBulb: num.min(0).max(1.5),
    })
    .refine((p) => p.highDryBulbC > p.lowDryBulbC, { message: "the high dry-bulb point must be above the low one", path: ["highDryBulbC"] }),
]);

const compressorDataPointSchema = z
  .object({
    condensingC: num.min(0).max(75),
    cop: num.gt(0.3).max(30).optional(),
    powerKW: positive.max(1e6).optional(),
    refrigerationKW: positive.max(1e6).optional(),
  })
  .superRefine((p, ctx) => {
    if ((p.cop === undefined) === (p.powerKW === undefined))
      ctx.addIssue({ code: "custom", path: ["cop"], message: "enter either the COP or the power at this condensing temperature" });
    if (p.refrigerationKW !== undefined && p.powerKW === undefined)
      ctx.addIssue({ code: "custom", path: ["powerKW"], message: "a refrigeration capacity goes with a power" });
  });

const compressorDataCurveSchema = z
  .object({
    evaporatingC: num.min(-60).max(30),
    points: z.array(compressorDataPointSchema).min(3, "enter at least three condensing temperatures").max(12),
  })
  .superRefine((c, ctx) => {
    for (let i = 1; i < c.points.length; i++) {
      const a = c.points[i - 1];
      const b = c.points[i];
      if (a && b && !(b.condensingC > a.condensingC))
        ctx.addIssue({ code: "custom", path: ["points", i, "condensingC"], message: "condensing temperatures must rise from point to point" });
      else if (a?.cop !== undefined && b?.cop !== undefined && !(b.cop < a.cop))
        ctx.addIssue({ code: "custom", path: ["points", i, "cop"], message: "the COP must fall as the condensing temperature rises" });
      else if (a?.powerKW !== undefined && b?.powerKW !== undefined && a.refrigerationKW === undefined && b.refrigerationKW === undefined && !(b.powerKW > a.powerKW))
        ctx.addIssue({ code: "custom", path: ["points", i, "powerKW"], message: "the power must rise with the condensing temperature" });
    }
  });

export const compressorModelSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("refrigerantCycle"), refrigerant: z.enum(["R717", "R134a"]).optional() }),
  z.object({
    kind: z.literal("manufacturer"),
    curves: z
      .array(compressorDataCurveSchema)
      .min(1)
      .max(2, "one or two suction temperatures")
      .refine((cs) => cs.length < 2 || cs[0]?.evaporatingC !== cs[1]?.evaporatingC, { message: "the two suction temperatures must differ" }),
  }),
  z.object({
    kind: z.literal("percentPerK"),
    percentPerK: num.gt(0).max(10),
    floorFraction: num.min(0).max(1).default(d("duty.compressorModel.floorFraction")),
  }),
  z.object({ kind: z.literal("carnotFraction") }),
]);

export const dutySchema = z
  .object({
    designBasis: z.enum(["heatRejection", "refrigeration"]),
    designHeatRejectionKW: positive.max(1e6).optional(),
    designRefrigerationLoadKW: positive.max(1e6).optional(),
    designCop: num.gt(0.5).max(20),
    evaporatingC: num.min(-60).max(30),
    condensingSetPointC: num.min(10).max(70),
    minimumCondensingC: num.min(0).max(70),
    headPressureControl: z.enum(["fixedSetPoint", "floating"]).default(d("duty.headPressureControl")),
    loadProfile: loadProfileSchema.default(() => ({ ...d("duty.loadProfile") })),
    compressorModel: compressorModelSchema.default(() => ({ ...d("duty.compressorModel") })),
    refrigerant: z.enum(REFRIGERANTS).default(d("duty.refrigerant")),
  })
  .superRefine((v, ctx) => {
    if (v.designBasis === "heatRejection" && v.designHeatRejectionKW === undefined)
      ctx.addIssue({ code: "custom", path: ["designHeatRejectionKW"], message: "enter the design heat rejection (kW)" });
    if (v.designBasis === "refrigeration" && v.designRefrigerationLoadKW === undefined)
      ctx.addIssue({ code: "custom", path: ["designRefrigerationLoadKW"], message: "enter the design refrigeration load (kW)" });
    if (v.minimumCondensingC > v.condensingSetPointC)
      ctx.addIssue({ code: "custom", path: ["minimumCondensingC"], message: "the minimum condensing temperature must not exceed the set-point" });
    if (v.evaporatingC >= v.minimumCondensingC)
      ctx.addIssue({ code: "custom", path: ["evaporatingC"], message: "the evaporating temperature must be below the minimum condensing temperature" });
  });

const fanSchema = z
  .object({
    designPowerKW: positive.max(5000),
    control: z.enum(["variableSpeed", "twoSpeed", "cycling"]).default(d("options[].fan.control")),
    minSpeedFraction: num.gt(0).max(1).default(d("options[].fan.minSpeedFraction")),
    powerFloorFraction: num.min(0).max(0.5).default(d("options[].fan.powerFloorFraction")),
    lowSpeedFraction: num.gt(0).lt(1).default(d("options[].fan.lowSpeedFraction")),
    naturalDraftAirflowFraction: num.min(0).max(0.5).default(d("options[].fan.naturalDraftAirflowFraction")),
  })
  .refine((f) => f.naturalDraftAirflowFraction < f.minSpeedFraction, {
    message: "the fan-off (natural-draft) airflow must be below the minimum speed",
    path: ["naturalDraftAirflowFraction"],
  });

const pumpSchema = (head: number, eff: number) =>
  z.object({ headM: nonNegative.max(200).default(head), efficiency: efficiency.default(eff) });

/**
 * Basin heater. `belowDryBulbC` is the earlier name of the thermostat set-point (stored scenarios keep
 * it); the heat loss defaults to the rating spread over the set-point's margin above the sizing ambient.
 */
const basinHeaterSchema = z
  .object({
    powerKW: nonNegative.max(1000).default(d("options[].basinHeater.powerKW")),
    setPointC: num.min(0).max(30).optional(),
    /** @deprecated stored scenarios: read as `setPointC`. */
    belowDryBulbC: airC.optional(),
    heatLossKWPerK: nonNegative.max(100).optional(),
    drainedWhenIdle: z.boolean().default(d("options[].basinHeater.drainedWhenIdle")),
  })
  .transform(({ belowDryBulbC, setPointC, heatLossKWPerK, ...rest }) => {
    const setPoint = setPointC ?? Math.min(Math.max(belowDryBulbC ?? d("options[].basinHeater.setPointC"), 0), 30);
    return {
      ...rest,
      setPointC: setPoint,
      heatLossKWPerK: heatLossKWPerK ?? rest.powerKW / (setPoint - BASIN_HEATER_SIZING_AMBIENT_C),
    };
  });

/** The condenser's upkeep plan; every field defaults from its construction (condenser-construction.ts). */
const condenserUpkeepSchema = z.object({
  cleaningMethod: z.enum(CLEANING_METHODS).optional(),
  cleaningCostPerEvent: nonNegative.max(1e7).optional(),
  /** Years between inspections (eddy-current testing for tubes); 0 = none. */
  inspectionIntervalYears: z.number().finite().nonnegative().max(50).refine((v) => v === 0 || v >= 0.25, "Enter 0 (no separate inspection) or at least 0.25 yr.").optional(),
  inspectionCostPerEvent: nonNegative.max(1e7).optional(),
  /** Life of the wear part (tube bundle or gasket set), years. */
  wearPartLifeYears: z.number().finite().min(0.25).max(100).optional(),
  /** Cost of replacing the wear part; not counted until entered. */
  wearPartReplacementCost: nonNegative.max(1e8).optional(),
});

const condenserSchema = z
  .object({
    construction: z.enum(CONDENSER_CONSTRUCTIONS).default(d("options[].condenser.construction")),
    material: z.enum(CONDENSER_MATERIALS).optional(),
    designCondensingC: num.min(10).max(75),
    designEnteringWaterC: waterC.optional(),
    cleanUWPerM2K: positive.max(20000).optional(),
    designFoulingM2KPerW: nonNegative.max(0.005).default(d("options[].condenser.designFoulingM2KPerW")),
    foulingGrowthMultiplier: nonNegative.max(10).optional(),
    specificChargeKgPerKW: nonNegative.max(5).optional(),
    upkeep: condenserUpkeepSchema.prefault({}),
    waterSideResistanceFraction: num.gt(0).lt(1).default(d("options[].condenser.waterSideResistanceFraction")),
  })
  .refine((c) => c.designEnteringWaterC === undefined || c.designEnteringWaterC < c.designCondensingC, {
    message: "the design entering water must be colder than the design condensing temperature",
    path: ["designEnteringWaterC"],
  })
  // The clean coefficient the engine needs: entered, or the construction's default.
  .transform((c) => ({ ...c, cleanUWPerM2K: c.cleanUWPerM2K ?? CONDENSER_CONSTRUCTION_DEFAULTS[c.construction].cleanUWPerM2K.value }));

/**
 * One rating point of a tower selection (certified data at another flow, wet-bulb or fan speed): its L/G
 * comes from the airflow, else the fan power (fan laws), else the design airflow (fan at full speed).
 */
const towerRatingPointSchema = z
  .object({
    waterFlowKgPerS: positive.max(50000),
    enteringWaterC: waterC,
    leavingWaterC: waterC,
    wetBulbC: airC,
    airFlowKgPerS: positive.max(1e5).optional(),
    fanPowerKW: positive.max(5000).optional(),
  })
  .superRefine((r, ctx) => {
    if (r.leavingWaterC >= r.enteringWaterC)
      ctx.addIssue({ code: "custom", path: ["leavingWaterC"], message: "the leaving (cold) water must be colder than the entering (hot) water" });
    else if (r.leavingWaterC <= r.wetBulbC)
      ctx.addIssue({ code: "custom", path: ["leavingWaterC"], message: "a tower cannot cool water to or below the entering wet-bulb" });
    if (r.airFlowKgPerS !== undefined && r.fanPowerKW !== undefined)
      ctx.addIssue({ code: "custom", path: ["fanPowerKW"], message: "enter the airflow or the fan power, not both" });
  });

const towerSchema = z
  .object({
    waterFlowKgPerS: positive.max(50000),
    enteringWaterC: waterC,
    leavingWaterC: waterC,
    designWetBulbC: airC,
    designLiquidToGasRatio: num.gt(0.1).max(5).default(d("options[].tower.designLiquidToGasRatio")),
    characteristicExponent: num.min(0.2).max(1.2).default(d("options[].tower.characteristicExponent")),
    ratingPoints: z.array(towerRatingPointSchema).max(5, "enter at most five rating points").optional(),
  })
  .superRefine((t, ctx) => {
    if (t.leavingWaterC >= t.enteringWaterC)
      ctx.addIssue({ code: "custom", path: ["leavingWaterC"], message: "the leaving (cold) water must be colder than the entering (hot) water" });
    if (t.leavingWaterC <= t.designWetBulbC)
      ctx.addIssue({ code: "custom", path: ["leavingWaterC"], message: "a tower cannot cool water to or below the entering wet-bulb" });
  });

/** An extra wet rating of a cooler (another flow, airflow or wet-bulb); without an airflow, the fan at full speed. */
const coolerWetRatingSchema = z
  .object({
    fluidFlowKgPerS: positive.max(50000),
    enteringFluidC: waterC,
    leavingFluidC: waterC,
    wetBulbC: airC,
    airFlowKgPerS: positive.max(1e5).optional(),
  })
  .superRefine((r, ctx) => {
    if (r.leavingFluidC >= r.enteringFluidC)
      ctx.addIssue({ code: "custom", path: ["leavingFluidC"], message: "the leaving fluid must be colder than the entering fluid" });
    else if (r.leavingFluidC <= r.wetBulbC)
      ctx.addIssue({ code: "custom", path: ["leavingFluidC"], message: "a cooler cannot cool the fluid to or below the entering wet-bulb" });
  });

const plateExchangerSchema = z.object({
  designApproachK: positive.max(10).default(d("options[].plateExchanger.designApproachK")),
  cleanUWPerM2K: positive.max(20000).default(d("options[].plateExchanger.cleanUWPerM2K")),
  cleanSideFlowKgPerS: positive.max(50000).optional(),
  towerSidePressureDropKPa: nonNegative.max(500).default(d("options[].plateExchanger.towerSidePressureDropKPa")),
  cleanSidePressureDropKPa: nonNegative.max(500).default(d("options[].plateExchanger.cleanSidePressureDropKPa")),
  foulingGrowthFactor: nonNegative.max(5).default(d("options[].plateExchanger.foulingGrowthFactor")),
});

const coolerSchema = z
  .object({
    fluidFlowKgPerS: positive.max(50000),
    enteringFluidC: waterC,
    leavingFluidC: waterC,
    designWetBulbC: airC,
    designFluidToAirRatio: num.gt(0.1).max(5).default(d("options[].cooler.designFluidToAirRatio")),
    internalResistanceFraction: num.gt(0).lt(1).default(d("options[].cooler.internalResistanceFraction")),
    dryRating: z.object({ enteringFluidC: waterC, leavingFluidC: waterC, dryBulbC: airC }).optional(),
    wetRatings: z.array(coolerWetRatingSchema).max(4, "enter at most four extra wet ratings").optional(),
    dryExternalConductanceFactor: num.gt(0).max(2).default(d("options[].cooler.dryExternalConductanceFactor")),
    allowDryMode: z.boolean().default(d("options[].cooler.allowDryMode")),
    dryModeMaxDryBulbC: airC.optional(),
    modeSelection: z.enum(["lowestTotalPower", "switchOverDryBulb"]).default(d("options[].cooler.modeSelection")),
    switchOverDryBulbC: airC.optional(),
    sprayLockoutDryBulbC: airC.default(d("options[].cooler.sprayLockoutDryBulbC")),
    glycol: z
      .object({ kind: z.enum(["none", "ethyleneGlycol", "propyleneGlycol"]), massFraction: num.min(0).max(0.5) })
      .default(() => ({ ...d("options[].cooler.glycol") })),
    ratingFluid: z.enum(["water", "loopFluid"]).default(d("options[].cooler.ratingFluid")),
  })
  .superRefine((c, ctx) => {
    if (c.leavingFluidC >= c.enteringFluidC)
      ctx.addIssue({ code: "custom", path: ["leavingFluidC"], message: "the leaving fluid must be colder than the entering fluid" });
    if (c.leavingFluidC <= c.designWetBulbC)
      ctx.addIssue({ code: "custom", path: ["leavingFluidC"], message: "a cooler cannot cool the fluid to or below the entering wet-bulb" });
    if (c.dryRating) {
      if (c.dryRating.leavingFluidC >= c.dryRating.enteringFluidC)
        ctx.addIssue({ code: "custom", path: ["dryRating", "leavingFluidC"], message: "the dry rating's leaving fluid must be colder than its entering fluid" });
      if (c.dryRating.leavingFluidC <= c.dryRating.dryBulbC)
        ctx.addIssue({ code: "custom", path: ["dryRating", "leavingFluidC"], message: "dry, the fluid cannot leave at or below the dry-bulb" });
    }
    if (c.modeSelection === "switchOverDryBulb" && c.switchOverDryBulbC === undefined)
      ctx.addIssue({ code: "custom", path: ["switchOverDryBulbC"], message: "enter the dry-bulb at or below which the cooler runs dry" });
    if (c.glycol.kind === "none" && c.glycol.massFraction > 0)
      ctx.addIssue({ code: "custom", path: ["glycol", "massFraction"], message: "a glycol fraction needs a glycol kind" });
  });

const sprayPumpSchema = z.object({
  flowKgPerS: positive.max(50000),
  headM: nonNegative.max(50).default(d("options[].sprayPump.headM")),
  efficiency: efficiency.default(d("options[].sprayPump.efficiency")),
  powerKW: nonNegative.max(1000).optional(),
});

const optionCommon = {
  id: text().min(1).max(64),
  label: text().min(1).max(120),
  costs: optionCostsSchema,
  fan: fanSchema,
  basinHeater: basinHeaterSchema.prefault({}),
  driftFractionOfFlow: num.min(0).max(0.01).default(d("options[].driftFractionOfFlow")),
  wetLoopVolumeM3: positive.max(1e5).optional(),
  cyclesOfConcentration: num.gt(1).max(50).optional(),
};

const optionBase = {
  ...optionCommon,
  condenser: condenserSchema,
  condenserPump: pumpSchema(d("options[].condenserPump.headM"), d("options[].condenserPump.efficiency")).prefault({}),
};

const evaporativeCondenserSchema = z
  .object({
    ratedHeatRejectionKW: positive.max(1e6),
    ratedCondensingC: num.min(15).max(70),
    ratedWetBulbC: num.min(-10).max(40),
    airFlowKgPerS: positive.max(1e5).optional(),
    internalResistanceFraction: num.min(0).max(0.9).default(d("options[].evaporativeCondenser.internalResistanceFraction")),
    dryRating: z.object({ heatRejectionKW: positive.max(1e6), condensingC: num.min(10).max(70), dryBulbC: airC }).optional(),
    dryExternalConductanceFactor: num.gt(0).max(2).default(d("options[].evaporativeCondenser.dryExternalConductanceFactor")),
    allowDryMode: z.boolean().default(d("options[].evaporativeCondenser.allowDryMode")),
    dryModeMaxDryBulbC: airC.optional(),
    modeSelection: z.enum(["lowestTotalPower", "switchOverDryBulb"]).default(d("options[].evaporativeCondenser.modeSelection")),
    switchOverDryBulbC: airC.optional(),
    sprayLockoutDryBulbC: airC.default(d("options[].evaporativeCondenser.sprayLockoutDryBulbC")),
    coilMaterial: z.enum(CONDENSER_MATERIALS).optional(),
    specificChargeKgPerKW: nonNegative.max(5).optional(),
    coilScaling: z
      .object({
        derateBeforeCleaning: num.min(0).max(0.5),
        cleaningIntervalMonths: num.int().min(1).max(120),
      })
      .default(() => ({ ...d("options[].evaporativeCondenser.coilScaling") })),
    coilLifeYears: z.number().finite().min(0.25).max(100).optional(),
    coilReplacementCost: nonNegative.max(1e8).optional(),
  })
  .superRefine((e, ctx) => {
    if (e.ratedCondensingC <= e.ratedWetBulbC + 1)
      ctx.addIssue({ code: "custom", path: ["ratedCondensingC"], message: "the rated condensing temperature must be more than 1 K above the rated wet-bulb" });
    if (e.dryRating && e.dryRating.condensingC <= e.dryRating.dryBulbC)
      ctx.addIssue({ code: "custom", path: ["dryRating", "condensingC"], message: "dry, the condensing temperature must be above the dry-bulb" });
    if (e.modeSelection === "switchOverDryBulb" && e.switchOverDryBulbC === undefined)
      ctx.addIssue({ code: "custom", path: ["switchOverDryBulbC"], message: "enter the dry-bulb at or below which the unit runs dry" });
  });

export const openTowerDirectOptionSchema = z.object({ ...optionBase, kind: z.literal("openTowerDirect"), tower: towerSchema });
export const openTowerPlateHxOptionSchema = z.object({
  ...optionBase,
  kind: z.literal("openTowerPlateHx"),
  tower: towerSchema,
  plateExchanger: plateExchangerSchema.prefault({}),
  towerPump: pumpSchema(d("options[].towerPump.headM"), d("options[].towerPump.efficiency")).prefault({}),
});
export const closedCircuitCoolerOptionSchema = z.object({
  ...optionBase,
  kind: z.literal("closedCircuitCooler"),
  cooler: coolerSchema,
  sprayPump: sprayPumpSchema,
});

export const evaporativeCondenserOptionSchema = z.object({
  ...optionCommon,
  kind: z.literal("evaporativeCondenser"),
  evaporativeCondenser: evaporativeCondenserSchema,
  sprayPump: sprayPumpSchema,
});

export const optionSchema = z.discriminatedUnion("kind", [openTowerDirectOptionSchema, openTowerPlateHxOptionSchema, closedCircuitCoolerOptionSchema, evaporativeCondenserOptionSchema], {
  error: `an option's kind must be one of ${OPTION_KINDS.join(", ")}`,
});

const concentrationMgPerL = nonNegative.max(1e5);
export const makeupAnalysisSchema = z.object({
  conductivityUSPerCm: nonNegative.max(1e5).optional(),
  calciumHardnessMgPerLAsCaCO3: concentrationMgPerL,
  mAlkalinityMgPerLAsCaCO3: concentrationMgPerL,
  silicaMgPerL: concentrationMgPerL,
  chlorideMgPerL: concentrationMgPerL,
  ph: num.min(4).max(11),
  tdsMgPerL: concentrationMgPerL,
});

/** The water object's fields (what-if reads single fields from it); `waterSchema` adds its checks. */
export const waterObjectSchema = z.object({
    makeup: makeupAnalysisSchema,
    limits: z
      .object({
        silicaMgPerL: positive.max(1e5).default(d("water.limits.silicaMgPerL")),
        chlorideMgPerL: positive.max(1e5).default(d("water.limits.chlorideMgPerL")),
        tdsMgPerL: positive.max(1e6).default(d("water.limits.tdsMgPerL")),
        calciumHardnessMgPerLAsCaCO3: positive.max(1e5).default(d("water.limits.calciumHardnessMgPerLAsCaCO3")),
      })
      .prefault({}),
    cyclesMode: z.enum(["entered", "fromChemistry"]).default(d("water.cyclesMode")),
    cyclesOfConcentration: num.gt(1).max(50).optional(),
    recirculatingPh: num.min(5).max(10).default(d("water.recirculatingPh")),
    sewerBasis: z.enum(["makeup", "makeupMinusEvaporation", "blowdown"]).optional(),
    /** @deprecated stored scenarios: true is read as sewerBasis "makeupMinusEvaporation", false as "makeup". */
    sewerEvaporationCredit: z.boolean().optional(),
    scaleControl: z
      .object({
        maximumLangelierIndex: num.min(-1).max(4).default(d("water.scaleControl.maximumLangelierIndex")),
        acidFeed: z.boolean().default(d("water.scaleControl.acidFeed")),
        acidStrengthFraction: num.min(0.1).max(1).default(d("water.scaleControl.acidStrengthFraction")),
      })
      .prefault({}),
    dosing: z
      .object({
        inhibitorMgPerLOutflow: nonNegative.max(10000).default(d("water.dosing.inhibitorMgPerLOutflow")),
        biocideMgPerLSystemVolume: nonNegative.max(10000).default(d("water.dosing.biocideMgPerLSystemVolume")),
        biocideSlugsPerYear: nonNegative.max(365).default(d("water.dosing.biocideSlugsPerYear")),
      })
      .prefault({}),
  });

export const waterSchema = waterObjectSchema
  .refine((w) => w.cyclesMode !== "entered" || w.cyclesOfConcentration !== undefined, {
    message: "enter the cycles of concentration, or derive them from the chemistry",
    path: ["cyclesOfConcentration"],
  })
  .transform(({ sewerEvaporationCredit, sewerBasis, ...rest }) => ({
    ...rest,
    sewerBasis: sewerBasis ?? (sewerEvaporationCredit ? ("makeupMinusEvaporation" as const) : d("water.sewerBasis")),
  }));

const months = num.int().min(1).max(120);
export const foulingSchema = z.object({
  model: z.enum(["asymptotic", "linear"]).default(d("fouling.model")),
  asymptoticM2KPerW: nonNegative.max(0.01).default(d("fouling.asymptoticM2KPerW")),
  timeConstantMonths: positive.max(240).default(d("fouling.timeConstantMonths")),
  linearRateM2KPerWPerMonth: nonNegative.max(0.001).default(d("fouling.linearRateM2KPerWPerMonth")),
  limitM2KPerW: positive.max(0.01).default(d("fouling.limitM2KPerW")),
  condenserCleaningIntervalMonths: months.default(d("fouling.condenserCleaningIntervalMonths")),
  plateExchangerCleaningIntervalMonths: months.default(d("fouling.plateExchangerCleaningIntervalMonths")),
  closedLoopFoulingM2KPerW: nonNegative.max(0.005).default(d("fouling.closedLoopFoulingM2KPerW")),
});

export const footprintSchema = z.object({
  gridEmissionFactorKgCO2ePerKWh: nonNegative.max(2).default(d("footprint.gridEmissionFactorKgCO2ePerKWh")),
  gridEmissionFactorYear: num.int().min(1990).max(2100).default(d("footprint.gridEmissionFactorYear")),
  gridEmissionFactorSource: text().max(300).default(d("footprint.gridEmissionFactorSource")),
  gwpReport: z.enum(GWP_REPORTS).default(d("footprint.gwpReport")),
  annualLeakFraction: num.min(0).max(1).default(d("footprint.annualLeakFraction")),
});

// --- the scenario --------------------------------------------------------------------------------------

const scenarioObject = z.object({
  inputVersion: z.literal(1),
  name: text().min(1).max(200),
  site: siteSchema,
  climate: climateInputSchema,
  duty: dutySchema,
  options: z.array(optionSchema).min(2, "compare at least two options").max(4, "compare at most four options"),
  water: waterSchema,
  fouling: foulingSchema.prefault({}),
  footprint: footprintSchema.prefault({}),
  tariffs: tariffsSchema.prefault({}),
  upkeep: upkeepSchema.prefault({}),
  economics: economicsSchema.prefault({}),
  sensitivity: sensitivitySchema.optional(),
  monteCarlo: monteCarloSchema.optional(),
});

/** The scenario schema: parse a document into the engine's ScenarioInput (defaults filled). */
export const scenarioSchema = scenarioObject.superRefine((s, ctx) => {
  const seen = new Map<string, number>();
  s.options.forEach((o, i) => {
    const first = seen.get(o.id);
    if (first !== undefined)
      ctx.addIssue({ code: "custom", path: ["options", i, "id"], message: `option id "${o.id}" is already used by option ${first + 1}` });
    else seen.set(o.id, i);
  });
  if (s.economics.baseOptionId !== undefined && !seen.has(s.economics.baseOptionId))
    ctx.addIssue({ code: "custom", path: ["economics", "baseOptionId"], message: "the base option must be one of the scenario's option ids" });
  const lp = s.duty.loadProfile;
  if (lp.kind === "perBin") {
    if (s.climate.source === "hourly")
      ctx.addIssue({ code: "custom", path: ["duty", "loadProfile", "kind"], message: "a per-bin load profile needs a bin climate" });
    else if (lp.fractions.length !== s.climate.bins.length)
      ctx.addIssue({
        code: "custom",
        path: ["duty", "loadProfile", "fractions"],
        message: `a per-bin profile needs one fraction per bin (${s.climate.bins.length}), not ${lp.fractions.length}`,
      });
  }
  s.options.forEach((o, i) => {
    if (o.fan.control === "twoSpeed" && o.fan.lowSpeedFraction <= o.fan.naturalDraftAirflowFraction)
      ctx.addIssue({ code: "custom", path: ["options", i, "fan", "lowSpeedFraction"], message: "the low speed must be above the fan-off airflow" });
    if (o.kind === "evaporativeCondenser") return;
    const supplyC =
      o.kind === "closedCircuitCooler" ? o.cooler.leavingFluidC : o.kind === "openTowerPlateHx" ? o.tower.leavingWaterC + o.plateExchanger.designApproachK : o.tower.leavingWaterC;
    const entering = o.condenser.designEnteringWaterC ?? supplyC;
    if (o.condenser.designCondensingC <= entering)
      ctx.addIssue({
        code: "custom",
        path: ["options", i, "condenser", "designCondensingC"],
        message: `the design condensing temperature must be above the condenser's design entering water (${Math.round(entering * 10) / 10} °C)`,
        // The editor words it in the project's units from these.
        params: { what: "the design condensing temperature must be above the condenser's design entering water", aboveC: entering },
      });
  });
});

/** The document as written and stored (defaults may be omitted). */
export type ScenarioDocument = z.input<typeof scenarioSchema>;
/** The parsed scenario with every default filled: the engine's input. */
export type ParsedScenario = z.output<typeof scenarioSchema>;

/** JSON Schema of the scenario document (input side: defaulted fields are optional). */
export const scenarioJsonSchema = z.toJSONSchema(scenarioObject, { io: "input", unrepresentable: "any" });

/** A field error with its dotted path, e.g. "options.1.tower.leavingWaterC". */
export interface FieldError {
  path: string;
  message: string;
}

/** Parse a scenario document: the engine input, or every field error with its path. */
export function parseScenario(doc: unknown): { ok: true; value: ScenarioInput } | { ok: false; errors: FieldError[] } {
  const r = scenarioSchema.safeParse(doc);
  if (r.success) return { ok: true, value: r.data };
  return { ok: false, errors: r.error.issues.map((i) => ({ path: i.path.map(String).join("."), message: i.message })) };
}

/** A starting scenario for the editor: what `defaultScenario` returns; first costs are left to be entered. */
export type ScenarioDraft = Omit<ScenarioDocument, "options"> & {
  options: Array<DistributiveOmit<z.input<typeof optionSchema>, "costs"> & { costs: Omit<z.input<typeof optionCostsSchema>, "firstCost"> }>;
};
type DistributiveOmit<T, K extends PropertyKey> = T extends unknown ? Omit<T, K> : never;

/**
 * A starting scenario for the forms around a climate: a 1000 kW heat-rejection duty (ammonia-like
 * temperatures), the three option kinds sized for it, defaults everywhere else. First costs have no
 * default: the draft is valid and analyses its physics and operating costs; its life-cycle figures wait
 * for the first costs (`firstCostsMissing`).
 * The equipment figures are placeholders to overwrite with certified manufacturer selections.
 */
export function defaultScenario(climate: ClimateInput, site: { elevationM: number; locationLabel: string } = { elevationM: 0, locationLabel: "" }): ScenarioDraft {
  const flow = 1000 / (4.186 * 5.5);
  return {
    inputVersion: 1,
    name: "New scenario",
    site,
    climate,
    duty: {
      designBasis: "heatRejection",
      designHeatRejectionKW: 1000,
      designCop: 2.5,
      evaporatingC: -10,
      condensingSetPointC: 35,
      minimumCondensingC: 25,
    },
    options: [
      {
        id: "tower-direct",
        kind: "openTowerDirect",
        label: "Open tower, direct",
        costs: {},
        fan: { designPowerKW: 11 },
        condenser: { designCondensingC: 35 },
        tower: { waterFlowKgPerS: flow, enteringWaterC: 33, leavingWaterC: 27.5, designWetBulbC: 23 },
      },
      {
        id: "tower-plate",
        kind: "openTowerPlateHx",
        label: "Open tower + plate exchanger",
        costs: {},
        fan: { designPowerKW: 15 },
        condenser: { designCondensingC: 35 },
        tower: { waterFlowKgPerS: flow, enteringWaterC: 31.5, leavingWaterC: 26, designWetBulbC: 23 },
      },
      {
        id: "cooler",
        kind: "closedCircuitCooler",
        label: "Closed-circuit cooler",
        costs: {},
        fan: { designPowerKW: 22 },
        condenser: { designCondensingC: 35 },
        cooler: { fluidFlowKgPerS: flow, enteringFluidC: 33, leavingFluidC: 27.5, designWetBulbC: 23 },
        sprayPump: { flowKgPerS: 0.4 * flow },
      },
    ],
    water: {
      makeup: { calciumHardnessMgPerLAsCaCO3: 100, mAlkalinityMgPerLAsCaCO3: 80, silicaMgPerL: 15, chlorideMgPerL: 30, ph: 7.6, tdsMgPerL: 250 },
    },
  };
}

// --- compile-time check: the parsed scenario is the engine's input ----------------------------------
type Assignable<From, To> = [From] extends [To] ? true : false;
const assertTrue = <T extends true>(): T => true as T;
assertTrue<Assignable<ParsedScenario, ScenarioInput>>();
