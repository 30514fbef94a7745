/**
 * Shared result shapes of the LoopLedger engine. SI everywhere; the unit is in each name.
 *
 * The physics modules (psychrometrics, climate, tower, fluid cooler, condenser, water) produce one
 * `OptionAnnualPhysics` per option; the economics modules turn those into cash flows and measures
 * without re-running the physics (price-only what-ifs and Monte Carlo draws reuse them).
 */

/** The loop types a scenario compares. */
export const OPTION_KINDS = ["openTowerDirect", "openTowerPlateHx", "closedCircuitCooler", "evaporativeCondenser"] as const;
export type OptionKind = (typeof OPTION_KINDS)[number];

export const OPTION_KIND_LABELS: Record<OptionKind, string> = {
  openTowerDirect: "Open tower, direct",
  openTowerPlateHx: "Open tower + plate exchanger",
  closedCircuitCooler: "Closed-circuit cooler",
  evaporativeCondenser: "Evaporative condenser",
};

/**
 * Physical quantity of a number carried by a warning (names of `lib/units` quantity kinds), so that a
 * viewer sees it in its own unit system.
 */
export type WarningQuantity =
  | "temperatureC"
  | "temperatureDifferenceK"
  | "powerKW"
  | "heatDutyKW"
  | "energyKWh"
  | "waterVolumeM3"
  | "massKg"
  | "foulingM2KPerW"
  | "hours"
  | "months"
  | "percent"
  | "ratio"
  | "count";

/** A number in a warning: its SI value and its quantity. */
export interface WarningValue {
  value: number;
  quantity: WarningQuantity;
}

/** A warning the engine attaches to its result; `path` points at the input it concerns. */
export interface EngineWarning {
  code: string;
  severity: "info" | "warning";
  /** The text rendered in SI (for logs and readers that do not format `template`). */
  message: string;
  /**
   * The text with `{name}` placeholders for `values`; viewers render each value in their unit system.
   * Absent on warnings without numbers (then `message` is the whole text).
   */
  template?: string;
  values?: Record<string, WarningValue>;
  /** Dotted path of the scenario input concerned, e.g. "water.cyclesOfConcentration". */
  path?: string;
  optionId?: string;
}

/** Energy by component, kWh over the period it describes. */
export interface EnergyByComponentKWh {
  fan: number;
  condenserPump: number;
  /** Second (tower-side) pump of the plate-exchanger option; 0 for the others. */
  secondaryPump: number;
  /** Spray-water pump of the closed-circuit cooler (wet hours only); 0 for the others. */
  sprayPump: number;
  basinHeater: number;
  /** The refrigeration compressors at the option's own condensing temperature in each hour. */
  compressor: number;
  /** Everything above: the electricity the option pays for. */
  total: number;
}

/**
 * Design-day check of one option: its selection against the site's 0.4 % wet-bulb, its condenser
 * against the set-point, and the design duty in the design hour at full fan speed (wet).
 */
export interface OptionDesignDay {
  /** The site's 0.4 % (annual exceedance) wet-bulb and the mean dry-bulb coincident with it, °C. */
  siteWetBulbC: number;
  siteDryBulbC: number;
  /** The wet-bulb the tower or cooler was selected for, °C. */
  selectionWetBulbC: number;
  /** The condenser's stated design condensing temperature and the plant's set-point, °C. */
  condenserDesignCondensingC: number;
  setPointC: number;
  /** Design duty and the heat the option can reject at the set-point in the design hour, kW. */
  dutyKW: number;
  capacityAtSetPointKW: number;
  /** Condensing temperature the option reaches at the design duty in the design hour, °C. */
  condensingC: number;
  holdsSetPoint: boolean;
}

/** Water by component, m³ over the period it describes. M = E + B + D exactly. */
export interface WaterByComponentM3 {
  evaporation: number;
  drift: number;
  blowdown: number;
  makeup: number;
  /** Volume billed by the sewer utility (makeup, or makeup − evaporation with an evaporation credit). */
  sewerBilled: number;
}

export interface MonthlyPhysics {
  /** 1…12 */
  month: number;
  hours: number;
  heatRejectedKWh: number;
  energyKWh: EnergyByComponentKWh;
  waterM3: WaterByComponentM3;
  /** Highest hourly electric demand of the option in the month (fans + pumps + heater + compressors). */
  peakDemandKW: number;
  dryModeHours: number;
  /** Hours in which the loop could not hold the condensing set-point at full fan speed. */
  unmetHours: number;
}

export interface OptionAnnualPhysics {
  optionId: string;
  kind: OptionKind;
  label: string;
  hoursTotal: number;
  heatRejectedKWh: number;
  energyKWh: EnergyByComponentKWh;
  /** 12 × 24 = 288 values, index (month − 1)·24 + hour: total electric energy for time-of-use tariffs. */
  energyKWhByMonthHour: number[];
  waterM3: WaterByComponentM3;
  monthly: MonthlyPhysics[];
  cyclesOfConcentration: number;
  /**
   * The scenario's cycles the run used (entered or from the chemistry, or the override); a loop with its
   * own cycles runs at a fixed ratio to them. Absent in results stored before per-loop cycles.
   */
  scenarioCyclesOfConcentration?: number;
  /** This loop's target cycles (its own, or the scenario's). */
  targetCyclesOfConcentration?: number;
  /** What the sewer utility bills (absent in results stored before the choice existed). */
  sewerBasis?: "makeup" | "makeupMinusEvaporation" | "blowdown";
  dryModeHours: number;
  unmetHours: number;
  /** Hour-weighted mean condensing temperature and the clean reference one, °C. */
  meanCondensingC: number;
  meanReferenceCondensingC: number;
  /** Condenser tube cleanings (direct option) or plate-exchanger cleanings per year, from the cleaning schedule. */
  cleaningsPerYear: number;
  /** Cost-minimising cleaning interval, months (null where the option has no fouled surface). */
  optimalCleaningIntervalMonths: number | null;
  /**
   * Chemical programme quantities: water leaving the wet loop (blowdown + drift), loop volume, inhibitor
   * and biocide, and the acid product fed to hold the Langelier limit (0 where none is needed). Stored
   * results from before acid feed carry no `acidKg` (read as 0).
   */
  chemicals: { treatedOutflowM3: number; systemVolumeM3: number; inhibitorKg: number; biocideKg: number; acidKg?: number };
  /**
   * Explanation only, never priced: the compressor energy above what the same hours would need with a
   * clean condenser and no plate exchanger on the same tower or cooler water, kWh/yr (≥ 0 per hour).
   */
  compressorAboveCleanReferenceKWh: number;
  /** Hours in which the manufacturer's compressor data were extrapolated (0 for the other models). */
  compressorExtrapolatedHours: number;
  /** The 0.4 % design-hour check of this option's selection (absent where the climate has no hours). */
  designDay?: OptionDesignDay;
  /**
   * Scaling indices of the recirculating (tower or spray) water at the hottest wetted surface, at the
   * cycles the loop actually achieves (M/(B + D) over the year), after any acid feed.
   */
  waterChemistry?: {
    hottestWettedSurfaceC: number;
    saturationPh: number;
    langelierIndex: number;
    ryznarIndex: number;
    cyclesLimitFromChemistry: number;
    limitingSpecies: "silica" | "chloride" | "tds" | "calciumHardness" | null;
    /** Cycles the indices are computed at (achieved), and the loop's target cycles. */
    atCycles?: number;
    targetCycles?: number;
    /** pH after acid feed, and the Langelier index the water would have without it. */
    ph?: number;
    untreatedLangelierIndex?: number;
    /** The limit the treatment holds, and whether acid is fed to hold it. */
    maximumLangelierIndex?: number;
    acidFeed?: boolean;
    /** What the economics need to recompute the acid at other cycles without the physics. */
    acidBasis?: AcidBasis;
  };
  /** How the tower or cooler was calibrated on the selection's rating points, with each point's residual. */
  ratingFit?: RatingFitSummary;
  warnings: EngineWarning[];
}

/** One rating point of a selection against the calibrated model (shown in the editor and the report). */
export interface RatingPointCheck {
  /** "rating 1" … for entered rating points, "design" for the selection's design point, "dry" for a dry rating. */
  label: string;
  /** Whether this point took part in the fit (the design point of a fitted tower only checks it). */
  usedInFit: boolean;
  /** Water-to-air (tower) or fluid-to-air (cooler) mass ratio at the point. */
  liquidToGasRatio?: number;
  /** Tower: KaV/L the point needs (Chebyshev demand) and the fitted C·(L/G)^−n there. */
  demandKaVL?: number;
  fittedKaVL?: number;
  /** Rated and predicted leaving water (fluid) temperature, °C; residual = predicted − rated, K. */
  ratedLeavingC: number;
  predictedLeavingC?: number;
  residualK?: number;
  /** Why a point was left out of the fit. */
  rejected?: string;
}

/**
 * How an option's tower characteristic or cooler conductances were calibrated on the selection's rating
 * points (absent in results stored before rating points existed, and for the evaporative condenser).
 */
export interface RatingFitSummary {
  device: "tower" | "cooler";
  /**
   * tower — "fitted": C and n by least squares on ln KaV/L vs ln L/G; "defaultExponent": n is the default
   * (one point, points at nearly one L/G, or a fitted n out of range) and C is fitted; "designPoint": no rating
   * points, C from the design point. cooler — "fitted": the tube-side share from the wet ratings;
   * "defaultSplit": the entered (or default) share, with or without extra ratings.
   */
  method: "fitted" | "defaultExponent" | "designPoint" | "defaultSplit";
  /** Plain statement of what was fitted and what was taken as a default, e.g. "n = 0.6 default, one rating point". */
  note: string;
  coefficientC?: number;
  exponentN?: number;
  internalResistanceFraction?: number;
  dryExternalConductanceFactor?: number;
  points: RatingPointCheck[];
}

/**
 * The chemistry a cycles recompute needs to re-derive the acid feed (lib/engine/water.ts
 * `loopChemistryAtCycles`): makeup analysis, untreated recirculating pH, hottest wetted surface, the limit.
 */
export interface AcidBasis {
  makeup: {
    calciumHardnessMgPerLAsCaCO3: number;
    mAlkalinityMgPerLAsCaCO3: number;
    silicaMgPerL: number;
    chlorideMgPerL: number;
    tdsMgPerL: number;
    ph: number;
  };
  recirculatingPh: number;
  hottestSurfaceC: number;
  maximumLangelierIndex: number;
  acidFeed: boolean;
  acidStrengthFraction: number;
}
