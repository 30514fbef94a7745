/**
 * Input and result types of the LoopLedger life-cycle economics (NIST Handbook 135, ASTM E917).
 *
 * Money is a plain number in the project's currency; rates are fractions per year (0.03 = 3 %/yr).
 * Escalation rates are always entered as REAL (differential) rates, i.e. above general inflation;
 * a nominal analysis converts them with (1 + E) = (1 + e)(1 + I) so that the two analyses never mix.
 */
import type { EngineWarning, OptionAnnualPhysics, OptionKind } from "../types";

// ---------------------------------------------------------------------------------------------
// Option costs
// ---------------------------------------------------------------------------------------------

/** The first-cost items of an option, incurred at the base date (year 0). No defaults: they come from the selections. */
export const FIRST_COST_ITEMS = [
  "equipment",
  "installation",
  "structureAndCrane",
  "electrical",
  "controls",
  "plateExchanger",
  "waterTreatmentEquipment",
  "meters",
  "other",
] as const;
export type FirstCostItem = (typeof FIRST_COST_ITEMS)[number];
export type FirstCostItems = Record<FirstCostItem, number>;

/** Components that wear out before (or independently of) the whole unit. */
export const COMPONENT_KEYS = [
  "fill",
  "coil",
  "fanMotor",
  "gearbox",
  "exchangerPlates",
  "pumps",
  "sprayPump",
  "variableSpeedDrive",
  "driftEliminators",
  /** The condenser's tube bundle or gasket set (from its construction's upkeep plan). */
  "condenserWearPart",
  "other",
] as const;
export type ComponentKey = (typeof COMPONENT_KEYS)[number];

/** A component replaced at the end of each of its lives within the study period. */
export interface ComponentReplacementInput {
  component: ComponentKey;
  /** Free text shown in reports, e.g. "PVC film fill". */
  label?: string;
  lifeYears: number;
  /** Cost of one replacement at base-date prices (escalated with `escalation.replacements`). */
  replacementCost: number;
}

/** Kinds of periodic upkeep event (every N years; N may be fractional, e.g. 0.5 = twice a year). */
export const PERIODIC_ITEM_KINDS = [
  "eddyCurrentTesting",
  "basinDisinfection",
  "exchangerCleaning",
  "coilExteriorDescaling",
  "fillCleaning",
  "other",
] as const;
export type PeriodicItemKind = (typeof PERIODIC_ITEM_KINDS)[number];

export interface PeriodicUpkeepItemInput {
  kind: PeriodicItemKind;
  label?: string;
  /** Interval between events, years (> 0). Events fall at t = k·everyYears (k ≥ 1) and are billed in year ⌈t⌉. */
  everyYears: number;
  /** Cost per event at base-date prices (outside contractor, parts), escalated with labour. */
  costPerEvent: number;
  /** Own staff hours per event, priced at `upkeep.labourRatePerHour`. */
  labourHoursPerEvent: number;
}

/** Option-specific upkeep. */
export interface OptionUpkeepInput {
  /** Own staff hours per year for routine inspection and service of this option. */
  annualLabourHours: number;
  /** Yearly service contract, parts and consumables at base-date prices. */
  annualServiceCost: number;
  /**
   * Cost of one condenser-tube cleaning (direct option) or plate-exchanger cleaning (plate option).
   * The number of events per year comes from the physics (`OptionAnnualPhysics.cleaningsPerYear`);
   * the physics engine also reads this value to find the cost-minimising cleaning interval.
   */
  cleaningCostPerEvent: number;
  periodicItems: PeriodicUpkeepItemInput[];
  /** Overrides of the scenario-wide chemical and programme costs for this option (e.g. a smaller spray loop). */
  chemicalFixedCostPerYearOverride?: number;
  waterManagementProgrammeCostPerYearOverride?: number;
}

export interface OptionCostsInput {
  /**
   * The quoted first cost by item; absent while the consultant has not entered it (a draft): the option's
   * physics and operating costs are still priced, its life-cycle figures are withheld (`firstCostsMissing`).
   */
  firstCost?: FirstCostItems;
  /**
   * Service life of the installation, years: every first-cost item is replaced at its life (when
   * `replaceAtEndOfLife`) and its last installation earns a linear residual value.
   */
  serviceLifeYears: number;
  /** Lives that differ from `serviceLifeYears`, per first-cost item (e.g. structure 40 years). */
  firstCostItemLivesYears?: Partial<Record<FirstCostItem, number>>;
  /** Reinvest each first-cost item at the end of its life within the study period. */
  replaceAtEndOfLife: boolean;
  components: ComponentReplacementInput[];
  upkeep: OptionUpkeepInput;
}

// ---------------------------------------------------------------------------------------------
// Tariffs, upkeep, economics
// ---------------------------------------------------------------------------------------------

export interface EscalationRates {
  /** Real escalation of each cost stream, fraction per year above general inflation. */
  energy: number;
  demand: number;
  water: number;
  sewer: number;
  chemicals: number;
  labour: number;
  replacements: number;
  /** Real escalation of the carbon price (used only when a carbon price is on). */
  carbon: number;
}
export type EscalationStream = keyof EscalationRates;

export interface ElectricityTariffInput {
  /** "flat": one price; "monthHour": 12 × 24 prices indexed (month − 1)·24 + hour, like the physics. */
  pricing: "flat" | "monthHour";
  energyPricePerKWh: number;
  /** 288 values, used when pricing = "monthHour". */
  energyPricePerKWhByMonthHour?: number[];
  /** Charge per kW of the month's peak demand, each month. */
  demandChargePerKWMonth: number;
  /** 12 values overriding `demandChargePerKWMonth` by month (seasonal demand charges). */
  demandChargePerKWMonthByMonth?: number[];
  /** Share of the option's own monthly peak that coincides with the facility's billed peak (0…1). */
  demandCoincidenceFactor: number;
}

export interface TariffsInput {
  electricity: ElectricityTariffInput;
  water: { pricePerM3: number; fixedChargePerMonth: number };
  sewer: {
    pricePerM3: number;
    fixedChargePerMonth: number;
    /** Monthly charge of the evaporation-credit meter; billed only where the physics applied the credit. */
    evaporationCreditMeterChargePerMonth: number;
  };
  chemicals: {
    /** Treatment programme cost per m³ of treated outflow (blowdown + drift). */
    costPerM3Outflow: number;
    /** Priced quantities from the physics' dosing model (0 when the per-m³ price already covers them). */
    inhibitorPricePerKg: number;
    biocidePricePerKg: number;
    /** Price of the acid product (as delivered, e.g. 93 % sulfuric acid) fed to hold the Langelier limit. */
    acidPricePerKg: number;
    /** Service visits, testing and equipment rental, per wet loop and year. */
    fixedCostPerYear: number;
  };
  /** Legionella water-management programme (plan, monitoring, validation), per wet loop and year. */
  waterManagementProgrammeCostPerYear: number;
  /** Optional carbon price on each option's emissions (electricity + refrigerant leakage); off by default. */
  carbon: { enabled: boolean; pricePerTonneCO2e: number };
  escalation: EscalationRates;
}

/** Shared upkeep inputs. */
export interface UpkeepInput {
  /** Loaded hourly rate of own maintenance staff. */
  labourRatePerHour: number;
}

export interface EconomicsInput {
  /** Calendar year whose 1 January is the base date (year 0); study year 1 is this year. */
  baseYear: number;
  studyPeriodYears: number;
  /** End-of-year (Handbook 135 default) or mid-year discounting of recurring yearly costs. */
  discounting: "endOfYear" | "midYear";
  /** Constant-dollar (real) analysis by default; nominal on request. */
  analysis: "real" | "nominal";
  realDiscountRate: number;
  /** General inflation, used to convert to a nominal analysis. */
  inflationRate: number;
  residualValueMethod: "linear" | "none";
  baseOptionId?: string;
}

// ---------------------------------------------------------------------------------------------
// Sensitivity, break-even, Monte Carlo
// ---------------------------------------------------------------------------------------------

/**
 * Inputs of the tornado. How `low`/`high` act is fixed per input (see SENSITIVITY_INPUT_MODES):
 * "factor" multiplies the base value, "delta" is added to a base rate, "value" replaces it.
 */
export const SENSITIVITY_INPUTS = [
  "waterPrice",
  "sewerPrice",
  "electricityPrice",
  "electricityEscalation",
  "cyclesOfConcentration",
  "discountRate",
  "firstCostPremium",
  "foulingRate",
  "load",
  "waterAndSewerEscalation",
] as const;
export type SensitivityInputKey = (typeof SENSITIVITY_INPUTS)[number];

export const SENSITIVITY_INPUT_MODES: Record<SensitivityInputKey, "factor" | "delta" | "value"> = {
  waterPrice: "factor",
  sewerPrice: "factor",
  electricityPrice: "factor",
  electricityEscalation: "delta",
  cyclesOfConcentration: "value",
  discountRate: "delta",
  firstCostPremium: "factor",
  foulingRate: "factor",
  load: "factor",
  waterAndSewerEscalation: "delta",
};

export interface SensitivityRange {
  enabled: boolean;
  /** For cycles, omitted low/high are derived as 0.75× and 1.25× the base option's cycles. */
  low?: number;
  high?: number;
}

export const BREAK_EVEN_INPUTS = [
  "waterAndSewerPrice",
  "electricityPrice",
  "cyclesOfConcentration",
  "firstCostPremium",
] as const;
export type BreakEvenInputKey = (typeof BREAK_EVEN_INPUTS)[number];

export interface BreakEvenRange {
  enabled: boolean;
  /** Search interval: a factor on the base prices / premium, absolute cycles for cycles. */
  min: number;
  max: number;
}

export interface SensitivityInput {
  enabled: boolean;
  tornado: Record<SensitivityInputKey, SensitivityRange>;
  breakEven: Record<BreakEvenInputKey, BreakEvenRange>;
}

export type Distribution =
  | { type: "triangular"; min: number; mode: number; max: number }
  | { type: "uniform"; min: number; max: number };

/**
 * Uncertain inputs of the Monte Carlo. Prices and fouling as factors, escalations and discount rate as
 * deltas, cycles absolute (the scenario's; loops with their own cycles in proportion).
 * `waterAndSewerEscalationDelta` moves both escalations together (utilities raise both tariffs
 * together), on top of any separate water or sewer delta.
 */
export const MONTE_CARLO_INPUTS = [
  "waterPriceFactor",
  "sewerPriceFactor",
  "electricityPriceFactor",
  "demandChargeFactor",
  "chemicalsPriceFactor",
  "energyEscalationDelta",
  "waterEscalationDelta",
  "sewerEscalationDelta",
  "discountRateDelta",
  "firstCostFactor",
  "cyclesOfConcentration",
  "foulingRateFactor",
  "loadFactor",
  "climateShiftK",
  "waterAndSewerEscalationDelta",
] as const;
export type MonteCarloInputKey = (typeof MONTE_CARLO_INPUTS)[number];

export interface MonteCarloInput {
  enabled: boolean;
  draws: number;
  seed: number;
  histogramBins: number;
  distributions: Partial<Record<MonteCarloInputKey, Distribution>>;
}

/** What the economics (and the what-if panel) may ask the physics to re-run with. */
export interface PhysicsOverrides {
  /**
   * The scenario's cycles of concentration (absolute): loops on the scenario's cycles run at this value,
   * loops with their own cycles at the same ratio to it as entered.
   */
  cyclesOfConcentration?: number;
  /** Multiplier on the fouling growth rate. */
  foulingRateFactor?: number;
  /** Multiplier on the heat-rejection duty in every hour/bin. */
  loadFactor?: number;
  /** Added to every dry-bulb and wet-bulb of the climate (a warmer or cooler year), K. */
  climateShiftK?: number;
  /** Replaces the duty's minimum condensing temperature (floating head pressure), °C. */
  minimumCondensingC?: number;
  /** Replaces every option's fan control. */
  fanControl?: "variableSpeed" | "twoSpeed" | "cycling";
  /** Selection size factor per option id (1 = as selected; see lib/engine/annual/variants.ts). */
  sizeFactorByOptionId?: Record<string, number>;
}

export type RerunPhysics = (overrides: PhysicsOverrides) => OptionAnnualPhysics[];

/** Option as the economics sees it. */
export interface EconomicsOptionInput {
  optionId: string;
  kind: OptionKind;
  label: string;
  costs: OptionCostsInput;
  /**
   * The option's emissions basis for the optional carbon price: the grid factor that turns its yearly
   * electricity into kg CO₂e, and its refrigerant leakage in kg CO₂e per year. Absent: no emissions.
   */
  carbon?: { gridFactorKgCO2ePerKWh: number; leakageKgCO2ePerYear: number };
}

export interface AnalyzeEconomicsArgs {
  physics: OptionAnnualPhysics[];
  options: EconomicsOptionInput[];
  tariffs: TariffsInput;
  upkeep: UpkeepInput;
  economics: EconomicsInput;
  sensitivity?: SensitivityInput;
  monteCarlo?: MonteCarloInput;
  baseOptionId?: string;
  rerunPhysics?: RerunPhysics;
  /**
   * Physics of one Monte Carlo draw (load factor, climate shift, fouling rate), fast enough to call per
   * draw (the compressed climate, lib/engine/what-if.ts physicsNear). Without it the load and the climate
   * shift are not sampled and the fouling rate is interpolated between a few full re-runs.
   */
  drawPhysics?: RerunPhysics;
  /** Called with the fraction done (0…1) during long runs (Monte Carlo). */
  onProgress?: (fraction: number) => void;
}

export interface WhatIfOverrides {
  waterAndSewerPriceFactor?: number;
  electricityPriceFactor?: number;
  /** Replaces the discount rate of the analysis (real rate in a real analysis, nominal in a nominal one). */
  discountRate?: number;
  /** Multiplies each alternative's extra first cost over the base option. */
  firstCostPremiumFactor?: number;
  cyclesOfConcentration?: number;
}

// ---------------------------------------------------------------------------------------------
// Results
// ---------------------------------------------------------------------------------------------

export const COST_CATEGORIES = [
  "investment",
  "energy",
  "demand",
  "water",
  "sewer",
  "chemicals",
  "upkeep",
  "carbon",
  "replacements",
  "residual",
] as const;
export type CostCategory = (typeof COST_CATEGORIES)[number];
/** Amounts by category. `residual` is a credit and therefore ≤ 0; the total is their plain sum. */
export type CategoryAmounts = Record<CostCategory, number>;

export const COST_CATEGORY_LABELS: Record<CostCategory, string> = {
  investment: "First cost",
  energy: "Electric energy",
  demand: "Electric demand",
  water: "Water",
  sewer: "Sewer",
  chemicals: "Chemicals & water-management programme",
  upkeep: "Upkeep (labour, cleaning, testing)",
  carbon: "Carbon price on emissions",
  replacements: "Replacements",
  residual: "Residual value",
};

export interface YearCashFlow {
  /** 0 = the base date (1 January of baseYear, first costs); t ≥ 1 = study year t. */
  yearIndex: number;
  /** baseYear for the base date and study year 1, baseYear + t − 1 for study year t. */
  calendarYear: number;
  /** Amounts in the analysis' dollars (constant in a real analysis, then-current in a nominal one). */
  byCategory: CategoryAmounts;
  total: number;
  /** Present value of this year's amounts (recurring costs discounted mid-year when asked). */
  presentValueByCategory: CategoryAmounts;
  presentValue: number;
  cumulativePresentValue: number;
}

export interface OptionEconomics {
  optionId: string;
  kind: OptionKind;
  label: string;
  firstCost: number;
  firstCostByItem: FirstCostItems;
  /** True when no first cost was entered: the amounts above are 0 and its LCC is not a life-cycle cost. */
  firstCostMissing: boolean;
  cashFlows: YearCashFlow[];
  pvByCategory: CategoryAmounts;
  /** Present-value life-cycle cost (sum of pvByCategory). */
  lcc: number;
  /** LCC × CRF(d, N): the level yearly cost with the same present value. */
  annualisedCost: number;
  /** Year-1 operating cost (energy … upkeep) at base-date prices, for the headline. */
  firstYearOperatingCost: number;
}

export interface OptionComparison {
  baseOptionId: string;
  alternativeOptionId: string;
  /** LCC(base) − LCC(alternative): positive when the alternative is cheaper over its life. */
  netSavings: number;
  /** PV of extra investment-related cost of the alternative: Δ(investment + replacements + residual). */
  deltaInvestmentPV: number;
  /** PV of operational savings of the alternative: base − alternative over energy … upkeep. */
  operationalSavingsPV: number;
  /** Savings-to-investment ratio (ASTM E964); null with a reason when the extra investment is ≤ 0. */
  sir: number | null;
  sirNote?: string;
  /** Adjusted internal rate of return (ASTM E1057), at the analysis' discount rate. */
  airr: number | null;
  airrNote?: string;
  /** The option whose extra first cost is paid back (the one with the higher first cost). */
  paybackOfOptionId: string;
  extraFirstCost: number;
  simplePaybackYears: number | null;
  discountedPaybackYears: number | null;
  paybackNote?: string;
  /** IRR of the yearly difference stream (base − alternative); only for exactly one sign change. */
  irr: number | null;
  irrNote?: string;
  /** Year 0…N cash-flow difference, base − alternative (in the analysis' dollars). */
  differenceCashFlows: number[];
}

export interface TornadoBar {
  input: SensitivityInputKey;
  label: string;
  mode: "factor" | "delta" | "value";
  low: number;
  high: number;
  netSavingsAtLow: number;
  netSavingsAtHigh: number;
  /** |netSavingsAtHigh − netSavingsAtLow| — the ranking key. */
  swing: number;
  /** Why the input was not varied (e.g. no physics re-run available); swing is 0 then. */
  skippedReason?: string;
}

export interface TornadoForPair {
  baseOptionId: string;
  alternativeOptionId: string;
  baseNetSavings: number;
  /** Sorted by swing, largest first; skipped inputs last. */
  bars: TornadoBar[];
}

export interface BreakEvenResult {
  input: BreakEvenInputKey;
  baseOptionId: string;
  alternativeOptionId: string;
  /** Factor (prices, premium) or absolute cycles at which net savings = 0; null when no tie within range. */
  value: number | null;
  /** The tie in plain units where it helps (e.g. combined water + sewer price per m³, price per kWh). */
  absoluteValue: number | null;
  /**
   * The SI unit of absoluteValue in words ("per m³, …"), like `note` for the stored result and the JSON API.
   * Screens and reports do not show either for a tie: they restate it in the project's units and currency
   * (lib/comparison/break-even.ts, lib/reports/summary.ts; per kgal in IP).
   */
  absoluteUnit?: string;
  searchMin: number;
  searchMax: number;
  note: string;
}

export interface SensitivityResult {
  tornado: TornadoForPair[];
  breakEven: BreakEvenResult[];
  physicsReruns: number;
}

export interface HistogramBin {
  from: number;
  to: number;
  count: number;
}

export interface NetSavingsDistribution {
  baseOptionId: string;
  alternativeOptionId: string;
  mean: number;
  p10: number;
  p50: number;
  p90: number;
  min: number;
  max: number;
  probabilityPositive: number;
  histogram: HistogramBin[];
  /**
   * Which sampled inputs drive the spread: Spearman rank correlation of each input with these net savings
   * over the draws, strongest first (a first-cost factor per option, `optionId` set).
   */
  drivers?: { input: MonteCarloInputKey; optionId?: string; rankCorrelation: number }[];
}

export interface MonteCarloResult {
  draws: number;
  seed: number;
  /** Probability that each option has the lowest LCC (ties split evenly), by optionId. */
  probabilityLowest: Record<string, number>;
  lccPercentiles: { optionId: string; p10: number; p50: number; p90: number; mean: number }[];
  netSavings: NetSavingsDistribution[];
  /** Inputs drawn, and how physics-dependent ones were evaluated. */
  sampledInputs: MonteCarloInputKey[];
  notes: string[];
  physicsReruns: number;
}

export interface EconomicsResult {
  analysis: "real" | "nominal";
  discounting: "endOfYear" | "midYear";
  baseYear: number;
  studyPeriodYears: number;
  /** The rate used to discount: real in a real analysis, nominal (1 + D) = (1 + d)(1 + I) otherwise. */
  discountRate: number;
  realDiscountRate: number;
  nominalDiscountRate: number;
  inflationRate: number;
  baseOptionId: string;
  options: OptionEconomics[];
  /** Each alternative against the base option, in option order. */
  comparisons: OptionComparison[];
  lowestLccOptionId: string;
  /**
   * Ids of the options without first costs. While it is not empty the LCC, annualised cost, net savings,
   * SIR, AIRR, IRR and paybacks are not life-cycle figures (first costs count as 0): every screen, report
   * and export shows "first costs missing" in their place, and the tornado and Monte Carlo are not run.
   */
  firstCostsMissing: string[];
  sensitivity?: SensitivityResult;
  monteCarlo?: MonteCarloResult;
  warnings: EngineWarning[];
}
