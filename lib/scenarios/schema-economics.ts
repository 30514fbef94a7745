/**
 * Zod schemas of the scenario's economic keys: each option's `costs`, and the top-level `tariffs`,
 * `upkeep`, `economics`, `sensitivity` and `monteCarlo`. Their outputs are assignable to the engine's
 * plain TS types in lib/engine/economics/types.ts (checked at the bottom of this file).
 *
 * Every defaulted field takes its default from `economicsFieldDefaults`, which also carries the
 * default's source for the editor. First costs have no default: they come from the selections.
 * Tariff defaults are placeholders that make an example run; the consultant replaces them with the
 * local utility's tariff.
 */
import { z } from "zod";
import { text } from "@/lib/validation/text";
import { MAX_MONEY } from "@/lib/validation/limits";
import {
  BREAK_EVEN_INPUTS,
  COMPONENT_KEYS,
  FIRST_COST_ITEMS,
  MONTE_CARLO_INPUTS,
  PERIODIC_ITEM_KINDS,
  SENSITIVITY_INPUTS,
  type BreakEvenInputKey,
  type ComponentKey,
  type EconomicsInput,
  type MonteCarloInput,
  type MonteCarloInputKey,
  type OptionCostsInput,
  type SensitivityInput,
  type SensitivityInputKey,
  type TariffsInput,
  type UpkeepInput,
} from "@/lib/engine/economics/types";

export interface FieldDefault {
  default: unknown;
  source: string;
}

const PLACEHOLDER = "[practice] placeholder so an example runs; enter the local utility's tariff";

/**
 * Default value and source of every defaulted economic field. Paths are dotted from the scenario
 * root; `options[]` stands for every option.
 */
export const economicsFieldDefaults = {
  "options[].costs.serviceLifeYears": {
    default: 20,
    source:
      "[memory] ASHRAE Handbook—HVAC Applications, Owning and Operating Costs chapter, median service life of galvanized cooling towers and evaporative units ≈ 20 years; verify against the current table",
  },
  "options[].costs.replaceAtEndOfLife": {
    default: true,
    source: "NIST Handbook 135: replacements within the study period are part of the LCC",
  },
  "options[].costs.components": { default: [], source: "none entered" },
  "options[].costs.upkeep.annualLabourHours": {
    default: 40,
    source: "[practice] weekly walk-round plus seasonal service of one cell, own staff",
  },
  "options[].costs.upkeep.annualServiceCost": { default: 0, source: "none entered" },
  "options[].costs.upkeep.cleaningCostPerEvent": {
    default: 0,
    source: "none entered; enter the contractor's price per tube or exchanger cleaning",
  },
  "options[].costs.upkeep.periodicItems": { default: [], source: "none entered" },
  "tariffs.electricity.pricing": { default: "flat", source: "[practice] simplest tariff form" },
  "tariffs.electricity.energyPricePerKWh": { default: 0.12, source: PLACEHOLDER },
  "tariffs.electricity.demandChargePerKWMonth": { default: 12, source: PLACEHOLDER },
  "tariffs.electricity.demandCoincidenceFactor": {
    default: 1,
    source: "[practice] conservative: the option's own peak assumed to coincide with the billed peak",
  },
  "tariffs.water.pricePerM3": { default: 2.0, source: PLACEHOLDER },
  "tariffs.water.fixedChargePerMonth": { default: 0, source: PLACEHOLDER },
  "tariffs.sewer.pricePerM3": { default: 2.5, source: PLACEHOLDER },
  "tariffs.sewer.fixedChargePerMonth": { default: 0, source: PLACEHOLDER },
  "tariffs.sewer.evaporationCreditMeterChargePerMonth": { default: 0, source: PLACEHOLDER },
  "tariffs.chemicals.costPerM3Outflow": {
    default: 0.6,
    source:
      "[practice] order of magnitude of a scale/corrosion/biocide programme per m³ of blowdown; get the treatment vendor's quote",
  },
  "tariffs.chemicals.inhibitorPricePerKg": {
    default: 0,
    source: "[practice] 0 when the per-m³ price already covers the product",
  },
  "tariffs.chemicals.biocidePricePerKg": {
    default: 0,
    source: "[practice] 0 when the per-m³ price already covers the product",
  },
  "tariffs.chemicals.acidPricePerKg": {
    default: 0.25,
    source:
      "[practice] placeholder for bulk 93 % sulfuric acid, only used where acid holds the Langelier limit; get the vendor's quote",
  },
  "tariffs.chemicals.fixedCostPerYear": {
    default: 3000,
    source: "[practice] monthly service visits and test kits of a treatment vendor; get a quote",
  },
  "tariffs.waterManagementProgrammeCostPerYear": {
    default: 4000,
    source:
      "[practice] plan upkeep, Legionella sampling and validation under a water-management programme (ASHRAE Standard 188 requires one); get a quote",
  },
  "tariffs.escalation.energy": {
    default: 0.005,
    source:
      "[practice] modest real escalation; FEMP publishes regional real energy price indices yearly (Handbook 135 annual supplement)",
  },
  "tariffs.escalation.demand": { default: 0.005, source: "[practice] as energy" },
  "tariffs.escalation.water": {
    default: 0.02,
    source:
      "[practice] water and sewer tariffs have long risen faster than general inflation; enter the utility's plan",
  },
  "tariffs.escalation.sewer": { default: 0.02, source: "[practice] as water" },
  "tariffs.escalation.chemicals": { default: 0, source: "[practice] constant real price" },
  "tariffs.escalation.labour": { default: 0, source: "[practice] constant real price" },
  "tariffs.escalation.replacements": { default: 0, source: "[practice] constant real price" },
  "tariffs.escalation.carbon": {
    default: 0,
    source: "[practice] constant real carbon price unless the owner's planning price rises; enter its own path",
  },
  "tariffs.carbon.enabled": { default: false, source: "off unless the owner prices carbon in its decisions" },
  "tariffs.carbon.pricePerTonneCO2e": {
    default: 50,
    source: "[practice] placeholder; enter the owner's internal carbon price or the applicable market or tax price",
  },
  "upkeep.labourRatePerHour": {
    default: 85,
    source: "[practice] loaded hourly rate of a maintenance technician; enter the local rate",
  },
  "economics.baseYear": { default: 2026, source: "year of the study" },
  "economics.studyPeriodYears": {
    default: 25,
    source: "NIST Handbook 135 / 10 CFR 436: federal studies run at most 25 years from the service date",
  },
  "economics.discounting": {
    default: "endOfYear",
    source: "NIST Handbook 135: end-of-year convention by default",
  },
  "economics.analysis": {
    default: "real",
    source: "NIST Handbook 135: constant-dollar analysis recommended",
  },
  "economics.realDiscountRate": {
    default: 0.03,
    source:
      "[memory] 10 CFR 436.14 sets a 3 % floor on the FEMP real discount rate; use the owner's own rate",
  },
  "economics.inflationRate": {
    default: 0.025,
    source: "[practice] long-run general inflation assumption; only used by a nominal analysis",
  },
  "economics.residualValueMethod": {
    default: "linear",
    source: "NIST Handbook 135: residual value by remaining life, linear as a simple approximation",
  },
  "sensitivity.enabled": { default: true, source: "run the tornado and break-evens" },
  "sensitivity.tornado.waterPrice": {
    default: { enabled: true, low: 0.75, high: 1.5 },
    source: "[practice] ×0.75 … ×1.5",
  },
  "sensitivity.tornado.sewerPrice": {
    default: { enabled: true, low: 0.75, high: 1.5 },
    source: "[practice] ×0.75 … ×1.5",
  },
  "sensitivity.tornado.electricityPrice": {
    default: { enabled: true, low: 0.8, high: 1.25 },
    source: "[practice] ×0.8 … ×1.25",
  },
  "sensitivity.tornado.electricityEscalation": {
    default: { enabled: true, low: -0.01, high: 0.02 },
    source: "[practice] −1 … +2 %/yr around the entered real escalation",
  },
  "sensitivity.tornado.cyclesOfConcentration": {
    default: { enabled: true },
    source: "[practice] 0.75× … 1.25× the base option's cycles unless entered",
  },
  "sensitivity.tornado.discountRate": {
    default: { enabled: true, low: -0.02, high: 0.02 },
    source: "[practice] ±2 %/yr around the entered discount rate",
  },
  "sensitivity.tornado.firstCostPremium": {
    default: { enabled: true, low: 0.8, high: 1.3 },
    source: "[practice] screening first-cost accuracy −20 % … +30 %",
  },
  "sensitivity.tornado.foulingRate": {
    default: { enabled: true, low: 0.5, high: 2 },
    source: "[practice] ×0.5 … ×2",
  },
  "sensitivity.tornado.load": { default: { enabled: true, low: 0.8, high: 1.2 }, source: "[practice] ±20 %" },
  "sensitivity.tornado.waterAndSewerEscalation": {
    default: { enabled: true, low: -0.02, high: 0.02 },
    source: "[practice] ±2 %/yr around the entered real water and sewer escalations, moved together",
  },
  "sensitivity.breakEven.waterAndSewerPrice": {
    default: { enabled: true, min: 0, max: 10 },
    source: "searches ×0 … ×10 the entered water and sewer prices",
  },
  "sensitivity.breakEven.electricityPrice": {
    default: { enabled: true, min: 0, max: 10 },
    source: "searches ×0 … ×10 the entered electricity prices",
  },
  "sensitivity.breakEven.cyclesOfConcentration": {
    default: { enabled: true, min: 1.5, max: 15 },
    source: "[practice] the practical range of cycles",
  },
  "sensitivity.breakEven.firstCostPremium": {
    default: { enabled: true, min: 0, max: 10 },
    source: "searches ×0 … ×10 the extra first cost",
  },
  "monteCarlo.enabled": { default: true, source: "run the uncertainty analysis" },
  "monteCarlo.draws": { default: 10000, source: "[practice] percentiles stable to ~1 % at 10,000 draws" },
  "monteCarlo.seed": { default: 20260101, source: "any fixed seed makes the run reproducible" },
  "monteCarlo.histogramBins": { default: 30, source: "[practice] chart resolution" },
  "monteCarlo.distributions": {
    default: {
      waterPriceFactor: { type: "triangular", min: 0.8, mode: 1, max: 1.5 },
      sewerPriceFactor: { type: "triangular", min: 0.8, mode: 1, max: 1.5 },
      electricityPriceFactor: { type: "triangular", min: 0.85, mode: 1, max: 1.3 },
      energyEscalationDelta: { type: "triangular", min: -0.01, mode: 0, max: 0.02 },
      waterAndSewerEscalationDelta: { type: "triangular", min: -0.015, mode: 0, max: 0.02 },
      firstCostFactor: { type: "triangular", min: 0.9, mode: 1, max: 1.25 },
    },
    source: "[practice] screening ranges; set them from the tariff history and the quotes",
  },
} as const satisfies Record<string, FieldDefault>;

type DefaultPath = keyof typeof economicsFieldDefaults;
function dflt<P extends DefaultPath>(path: P): (typeof economicsFieldDefaults)[P]["default"] {
  return economicsFieldDefaults[path].default;
}

/** Money: zero or more, at most MAX_MONEY in the project's currency. */
const money = z.number().finite().nonnegative().max(MAX_MONEY);
/** Hours of work: a periodic event's, or a year's routine upkeep (at most ten people all year round). */
const labourHours = z.number().finite().nonnegative().max(100_000);
const rate = z.number().finite().gt(-0.99).lt(1);
/** Lives: at least a quarter of a year, so that no entered life can make the replacement loop run away. */
const yearsPositive = z.number().finite().min(0.25).max(200);

// --- option costs --------------------------------------------------------------------------------

const firstCostShape = Object.fromEntries(FIRST_COST_ITEMS.map((k) => [k, money])) as Record<
  (typeof FIRST_COST_ITEMS)[number],
  typeof money
>;

/** First cost by item, every item entered (0 where it does not apply): the engine's form. */
export const firstCostItemsSchema = z.object(firstCostShape);

/**
 * The first cost as entered: any items (an item left empty counts as 0 once one item is entered), or none
 * at all while the selection's prices are not in yet — then it parses to `undefined` and the scenario still
 * analyses its physics and operating costs, with its life-cycle figures marked "first costs missing".
 * First costs have no default: they come from the consultant's selections.
 */
export const firstCostSchema = z
  .object(Object.fromEntries(FIRST_COST_ITEMS.map((k) => [k, money.optional()])) as Record<(typeof FIRST_COST_ITEMS)[number], z.ZodOptional<typeof money>>)
  .optional()
  .transform((v): z.output<typeof firstCostItemsSchema> | undefined => {
    if (!v || FIRST_COST_ITEMS.every((k) => v[k] === undefined)) return undefined;
    return Object.fromEntries(FIRST_COST_ITEMS.map((k) => [k, v[k] ?? 0])) as z.output<typeof firstCostItemsSchema>;
  });

export const componentReplacementSchema = z.object({
  component: z.enum(COMPONENT_KEYS),
  label: text().max(120).optional(),
  lifeYears: yearsPositive,
  replacementCost: money,
});

/** Suggested component lives for the editor (years), with their sources. */
export const componentLifeDefaultsYears: Record<ComponentKey, FieldDefault> = {
  fill: { default: 15, source: "[practice] PVC film fill 10–20 years depending on water quality" },
  coil: { default: 20, source: "[practice] galvanized coil ~ the unit's life; stainless longer" },
  fanMotor: {
    default: 18,
    source: "[memory] ASHRAE Applications, owning and operating costs: electric motors ≈ 18 years median",
  },
  gearbox: { default: 15, source: "[practice]" },
  exchangerPlates: { default: 15, source: "[practice] plates; gaskets every 5–10 years" },
  pumps: { default: 20, source: "[memory] ASHRAE Applications: base-mounted pumps ≈ 20 years median" },
  sprayPump: { default: 10, source: "[memory] ASHRAE Applications: pipe-mounted pumps ≈ 10 years median" },
  variableSpeedDrive: { default: 15, source: "[practice]" },
  driftEliminators: { default: 15, source: "[practice]" },
  condenserWearPart: {
    default: 20,
    source: "[practice] shell-and-tube bundle 15–25 years on treated tower water; plate gaskets 5–10 years",
  },
  other: { default: 15, source: "[practice]" },
};

export const periodicUpkeepItemSchema = z.object({
  kind: z.enum(PERIODIC_ITEM_KINDS),
  label: text().max(120).optional(),
  /** At least weekly (1/52 year): an interval bounds the events the cash-flow loop walks. */
  everyYears: z.number().finite().min(1 / 52).max(100),
  costPerEvent: money,
  labourHoursPerEvent: labourHours.default(0),
});

export const optionUpkeepSchema = z.object({
  annualLabourHours: labourHours.default(dflt("options[].costs.upkeep.annualLabourHours")),
  annualServiceCost: money.default(dflt("options[].costs.upkeep.annualServiceCost")),
  cleaningCostPerEvent: money.default(dflt("options[].costs.upkeep.cleaningCostPerEvent")),
  periodicItems: z.array(periodicUpkeepItemSchema).max(50).default([]),
  chemicalFixedCostPerYearOverride: money.optional(),
  waterManagementProgrammeCostPerYearOverride: money.optional(),
});

export const optionCostsSchema = z.object({
  firstCost: firstCostSchema,
  serviceLifeYears: yearsPositive.default(dflt("options[].costs.serviceLifeYears")),
  firstCostItemLivesYears: z.partialRecord(z.enum(FIRST_COST_ITEMS), yearsPositive).optional(),
  replaceAtEndOfLife: z.boolean().default(dflt("options[].costs.replaceAtEndOfLife")),
  components: z.array(componentReplacementSchema).max(50).default([]),
  upkeep: optionUpkeepSchema.prefault({}),
});

// --- tariffs ---------------------------------------------------------------------------------------

export const electricityTariffSchema = z
  .object({
    pricing: z.enum(["flat", "monthHour"]).default(dflt("tariffs.electricity.pricing")),
    energyPricePerKWh: money.default(dflt("tariffs.electricity.energyPricePerKWh")),
    energyPricePerKWhByMonthHour: z.array(money).length(288).optional(),
    demandChargePerKWMonth: money.default(dflt("tariffs.electricity.demandChargePerKWMonth")),
    demandChargePerKWMonthByMonth: z.array(money).length(12).optional(),
    demandCoincidenceFactor: z
      .number()
      .finite()
      .min(0)
      .max(1)
      .default(dflt("tariffs.electricity.demandCoincidenceFactor")),
  })
  .refine((e) => e.pricing === "flat" || e.energyPricePerKWhByMonthHour !== undefined, {
    message: "month × hour pricing needs 288 prices (12 months × 24 hours)",
    path: ["energyPricePerKWhByMonthHour"],
  });

export const escalationSchema = z.object({
  energy: rate.default(dflt("tariffs.escalation.energy")),
  demand: rate.default(dflt("tariffs.escalation.demand")),
  water: rate.default(dflt("tariffs.escalation.water")),
  sewer: rate.default(dflt("tariffs.escalation.sewer")),
  chemicals: rate.default(dflt("tariffs.escalation.chemicals")),
  labour: rate.default(dflt("tariffs.escalation.labour")),
  replacements: rate.default(dflt("tariffs.escalation.replacements")),
  carbon: rate.default(dflt("tariffs.escalation.carbon")),
});

export const tariffsSchema = z.object({
  electricity: electricityTariffSchema.prefault({}),
  water: z
    .object({
      pricePerM3: money.default(dflt("tariffs.water.pricePerM3")),
      fixedChargePerMonth: money.default(dflt("tariffs.water.fixedChargePerMonth")),
    })
    .prefault({}),
  sewer: z
    .object({
      pricePerM3: money.default(dflt("tariffs.sewer.pricePerM3")),
      fixedChargePerMonth: money.default(dflt("tariffs.sewer.fixedChargePerMonth")),
      evaporationCreditMeterChargePerMonth: money.default(
        dflt("tariffs.sewer.evaporationCreditMeterChargePerMonth"),
      ),
    })
    .prefault({}),
  chemicals: z
    .object({
      costPerM3Outflow: money.default(dflt("tariffs.chemicals.costPerM3Outflow")),
      inhibitorPricePerKg: money.default(dflt("tariffs.chemicals.inhibitorPricePerKg")),
      biocidePricePerKg: money.default(dflt("tariffs.chemicals.biocidePricePerKg")),
      acidPricePerKg: money.default(dflt("tariffs.chemicals.acidPricePerKg")),
      fixedCostPerYear: money.default(dflt("tariffs.chemicals.fixedCostPerYear")),
    })
    .prefault({}),
  waterManagementProgrammeCostPerYear: money.default(dflt("tariffs.waterManagementProgrammeCostPerYear")),
  carbon: z
    .object({
      enabled: z.boolean().default(dflt("tariffs.carbon.enabled")),
      pricePerTonneCO2e: money.max(10_000).default(dflt("tariffs.carbon.pricePerTonneCO2e")),
    })
    .prefault({}),
  escalation: escalationSchema.prefault({}),
});

export const upkeepSchema = z.object({
  labourRatePerHour: money.default(dflt("upkeep.labourRatePerHour")),
});

export const economicsSchema = z.object({
  baseYear: z.number().int().min(1990).max(2100).default(dflt("economics.baseYear")),
  studyPeriodYears: z.number().int().min(1).max(60).default(dflt("economics.studyPeriodYears")),
  discounting: z.enum(["endOfYear", "midYear"]).default(dflt("economics.discounting")),
  analysis: z.enum(["real", "nominal"]).default(dflt("economics.analysis")),
  realDiscountRate: rate.default(dflt("economics.realDiscountRate")),
  inflationRate: rate.default(dflt("economics.inflationRate")),
  residualValueMethod: z.enum(["linear", "none"]).default(dflt("economics.residualValueMethod")),
  baseOptionId: text().min(1).max(64).optional(),
});

// --- sensitivity and Monte Carlo ---------------------------------------------------------------

/**
 * A tornado or break-even bound: a factor (×0 … ×100), a change of a rate (−1 … +1 per year) or a number of
 * cycles (up to 50); −1 … 100 holds them all and keeps every re-priced case finite.
 */
const sensitivityBound = z.number().finite().min(-1).max(100);

const sensitivityRangeSchema = z
  .object({
    enabled: z.boolean().default(true),
    low: sensitivityBound.optional(),
    high: sensitivityBound.optional(),
  })
  .refine((r) => r.low === undefined || r.high === undefined || r.low <= r.high, {
    message: "low must not exceed high",
    path: ["low"],
  });

const tornadoShape = Object.fromEntries(
  SENSITIVITY_INPUTS.map((k) => [
    k,
    sensitivityRangeSchema.prefault(
      dflt(`sensitivity.tornado.${k}` as `sensitivity.tornado.${SensitivityInputKey}`),
    ),
  ]),
) as Record<SensitivityInputKey, ReturnType<typeof sensitivityRangeSchema.prefault>>;

const breakEvenRangeSchema = z
  .object({ enabled: z.boolean().default(true), min: sensitivityBound, max: sensitivityBound })
  .refine((r) => r.min < r.max, { message: "min must be below max", path: ["min"] });

const breakEvenShape = Object.fromEntries(
  BREAK_EVEN_INPUTS.map((k) => [
    k,
    breakEvenRangeSchema.prefault(
      dflt(`sensitivity.breakEven.${k}` as `sensitivity.breakEven.${BreakEvenInputKey}`),
    ),
  ]),
) as Record<BreakEvenInputKey, ReturnType<typeof breakEvenRangeSchema.prefault>>;

export const sensitivitySchema = z.object({
  enabled: z.boolean().default(dflt("sensitivity.enabled")),
  tornado: z.object(tornadoShape).prefault({}),
  breakEven: z.object(breakEvenShape).prefault({}),
});

/** Any distribution's value before its own input's range (below) applies: finite and bounded. */
const distributionValue = z.number().finite().min(-100).max(100);

export const distributionSchema = z
  .discriminatedUnion("type", [
    z.object({
      type: z.literal("triangular"),
      min: distributionValue,
      mode: distributionValue,
      max: distributionValue,
    }),
    z.object({ type: z.literal("uniform"), min: distributionValue, max: distributionValue }),
  ])
  .refine((d) => d.min <= d.max && (d.type === "uniform" || (d.min <= d.mode && d.mode <= d.max)), {
    message: "a distribution needs min ≤ mode ≤ max",
  });

/**
 * The range of every Monte Carlo input: [lowest, highest, name]. Factors multiply a price, a cost or a rate
 * (×0 … ×10; a negative price means nothing); deltas change a yearly rate (±0.5 per year is far beyond any
 * tariff history); cycles of concentration as the scenario's (above 1, at most 50); load and climate shift
 * stay within what the physics model covers.
 */
const DISTRIBUTION_RANGES: Record<MonteCarloInputKey, readonly [number, number, string]> = {
  waterPriceFactor: [0, 10, "a price factor"],
  sewerPriceFactor: [0, 10, "a price factor"],
  electricityPriceFactor: [0, 10, "a price factor"],
  demandChargeFactor: [0, 10, "a price factor"],
  chemicalsPriceFactor: [0, 10, "a price factor"],
  energyEscalationDelta: [-0.5, 0.5, "an escalation change"],
  waterEscalationDelta: [-0.5, 0.5, "an escalation change"],
  sewerEscalationDelta: [-0.5, 0.5, "an escalation change"],
  waterAndSewerEscalationDelta: [-0.5, 0.5, "an escalation change"],
  discountRateDelta: [-0.5, 0.5, "a discount-rate change"],
  firstCostFactor: [0, 10, "a first-cost factor"],
  cyclesOfConcentration: [1.1, 50, "the cycles of concentration"],
  foulingRateFactor: [0, 20, "a fouling-rate factor"],
  loadFactor: [0.2, 2, "a load factor"],
  climateShiftK: [-5, 5, "a climate shift (K)"],
};

export const monteCarloSchema = z.object({
  enabled: z.boolean().default(dflt("monteCarlo.enabled")),
  draws: z.number().int().min(100).max(200_000).default(dflt("monteCarlo.draws")),
  seed: z
    .number()
    .int()
    .min(0)
    .max(2 ** 32 - 1)
    .default(dflt("monteCarlo.seed")),
  histogramBins: z.number().int().min(5).max(200).default(dflt("monteCarlo.histogramBins")),
  distributions: z
    .partialRecord(z.enum(MONTE_CARLO_INPUTS), distributionSchema)
    .superRefine((rec, ctx) => {
      for (const [key, [lo, hi, what]] of Object.entries(DISTRIBUTION_RANGES)) {
        const d = rec[key as keyof typeof DISTRIBUTION_RANGES];
        if (!d) continue;
        if (d.min < lo) ctx.addIssue({ code: "custom", path: [key, "min"], message: `${what} cannot go below ${lo}` });
        if (d.max > hi) ctx.addIssue({ code: "custom", path: [key, "max"], message: `${what} cannot exceed ${hi}` });
      }
    })
    .default(() => structuredClone(dflt("monteCarlo.distributions"))),
});

export type OptionCostsDocument = z.input<typeof optionCostsSchema>;
export type TariffsDocument = z.input<typeof tariffsSchema>;

// --- type-level assertions: zod output → engine input --------------------------------------------

type Assignable<From, To> = [From] extends [To] ? true : false;
const assertTrue = <T extends true>(): T => true as T;
assertTrue<Assignable<z.output<typeof optionCostsSchema>, OptionCostsInput>>();
assertTrue<Assignable<z.output<typeof tariffsSchema>, TariffsInput>>();
assertTrue<Assignable<z.output<typeof upkeepSchema>, UpkeepInput>>();
assertTrue<Assignable<z.output<typeof economicsSchema>, EconomicsInput>>();
assertTrue<Assignable<z.output<typeof sensitivitySchema>, SensitivityInput>>();
assertTrue<Assignable<z.output<typeof monteCarloSchema>, MonteCarloInput>>();
