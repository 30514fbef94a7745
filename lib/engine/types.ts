/**
 * Shared result shapes of the LoopLedger engine. SI everywhere; the unit is in each name.
 *
 * The physics modules (psychrometrics, climate, tower, fluid cooler, condenser, water) produce one
 * `OptionAnnualPhysics` per option; the economics modules turn those into cash flows and measures
 * without re-running the physics (price-only what-ifs and Monte Carlo draws reuse them).
 */

/** The loop types a scenario compares. */
export const OPTION_KINDS = ["openTowerDirect", "openTowerPlateHx", "closedCircuitCooler"] as const;
export type OptionKind = (typeof OPTION_KINDS)[number];

export const OPTION_KIND_LABELS: Record<OptionKind, string> = {
  openTowerDirect: "Open tower, direct",
  openTowerPlateHx: "Open tower + plate exchanger",
  closedCircuitCooler: "Closed-circuit cooler",
};

/** A warning the engine attaches to its result; `path` points at the input it concerns. */
export interface EngineWarning {
  code: string;
  severity: "info" | "warning";
  message: string;
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
  /** Extra compressor energy against the clean reference condensing temperature. */
  compressorPenalty: number;
  total: number;
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
  /** Highest hourly electric demand of the option in the month (fans + pumps + heater + penalty). */
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
  dryModeHours: number;
  unmetHours: number;
  /** Hour-weighted mean condensing temperature and the clean reference one, °C. */
  meanCondensingC: number;
  meanReferenceCondensingC: number;
  /** Condenser tube cleanings (direct option) or plate-exchanger cleanings per year, from the cleaning schedule. */
  cleaningsPerYear: number;
  /** Cost-minimising cleaning interval, months (null where the option has no fouled surface). */
  optimalCleaningIntervalMonths: number | null;
  /** Chemical programme quantities: water leaving the wet loop (blowdown + drift) and loop volume. */
  chemicals: { treatedOutflowM3: number; systemVolumeM3: number; inhibitorKg: number; biocideKg: number };
  /**
   * Total compressor energy at the option's own condensing temperatures (not only the penalty), kWh:
   * compares options whose condensing temperatures float (floating head pressure). Added by the physics.
   */
  compressorEnergyKWh?: number;
  /** Scaling indices of the recirculating (tower or spray) water at the hottest wetted surface. */
  waterChemistry?: {
    hottestWettedSurfaceC: number;
    saturationPh: number;
    langelierIndex: number;
    ryznarIndex: number;
    cyclesLimitFromChemistry: number;
    limitingSpecies: "silica" | "chloride" | "tds" | "calciumHardness" | null;
  };
  warnings: EngineWarning[];
}
