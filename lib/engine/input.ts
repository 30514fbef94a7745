/**
 * The engine's scenario input: plain TypeScript, SI, units in names. The zod schema in
 * lib/scenarios/schema.ts produces values assignable to `ScenarioInput` (checked there at compile time),
 * with every default filled in, so the engine never guesses.
 */
import type { ClimateInput } from "./climate/types";
import type {
  EconomicsInput,
  MonteCarloInput,
  OptionCostsInput,
  SensitivityInput,
  TariffsInput,
  UpkeepInput,
} from "./economics/types";
import type { CycleRefrigerant } from "./compressor";
import type { CleaningMethod, CondenserConstruction, CondenserMaterial } from "./condenser-construction";
import type { EvaporativeCondenserSelection } from "./evaporative-condenser";
import type { CoolerSelection } from "./fluid-cooler";
import type { GwpReport, Refrigerant } from "./refrigerants";
import type { TowerSelection } from "./tower";
import type { TowerRatingPointInput } from "./tower-fit";
import type { CoolerWetRatingInput } from "./cooler-fit";
import type { ScaleControl, SewerBasis } from "./water";

export interface SiteInput {
  elevationM: number;
  locationLabel: string;
}

/** Fraction of the design heat rejection in each hour/bin. */
export type LoadProfileInput =
  | { kind: "constant"; fraction: number }
  /** 288 fractions indexed (month − 1)·24 + hour, hour 0…23 starting. */
  | { kind: "monthHour"; fractions: number[] }
  /** One fraction per climate bin, in the bin table's order (bin climates only). */
  | { kind: "perBin"; fractions: number[] }
  /** Linear in dry-bulb between two points, clamped to the end fractions outside them. */
  | { kind: "linearInDryBulb"; lowDryBulbC: number; fractionAtLowDryBulb: number; highDryBulbC: number; fractionAtHighDryBulb: number };

/** One manufacturer's point: COP, or power (at `refrigerationKW`, default the design refrigeration load). */
export interface CompressorDataPointInput {
  condensingC: number;
  cop?: number;
  powerKW?: number;
  refrigerationKW?: number;
}

/** How compressor power follows the condensing temperature (lib/engine/compressor.ts documents each). */
export type CompressorModelInput =
  /**
   * Refrigerant-aware default: the single-stage saturated cycle of R-717 or R-134a, scaled to the design COP.
   * Without `refrigerant`: the plant's, where it is one of the two; R-134a stands in for other halocarbons.
   */
  | { kind: "refrigerantCycle"; refrigerant?: CycleRefrigerant }
  /** The manufacturer's data at one or two suction temperatures, three or more condensing temperatures each. */
  | { kind: "manufacturer"; curves: { evaporatingC: number; points: CompressorDataPointInput[] }[] }
  /** Per cent per kelvin, compounding, never below `floorFraction` of the design power. */
  | { kind: "percentPerK"; percentPerK: number; floorFraction: number }
  /** The simplest: a constant fraction of the Carnot COP. */
  | { kind: "carnotFraction" };

export interface DutyInput {
  /** "heatRejection": the design heat rejection is entered; "refrigeration": load + COP → rejection = load·(1 + 1/COP). */
  designBasis: "heatRejection" | "refrigeration";
  designHeatRejectionKW?: number;
  designRefrigerationLoadKW?: number;
  /** Compressor COP at the condensing set-point and the evaporating temperature. */
  designCop: number;
  evaporatingC: number;
  /** Condensing temperature the head-pressure control holds (fixed) or never exceeds by design (floating). */
  condensingSetPointC: number;
  /** Lowest condensing temperature allowed (expansion devices, oil return, defrost). */
  minimumCondensingC: number;
  /**
   * "fixedSetPoint": fans modulate to hold the set-point; hours that cannot, run hotter and pay for it.
   * "floating": in each hour the fan speed (and the cooler's wet or dry mode) that minimises fan + spray
   * pump + compressor power, with the condensing temperature between the minimum and the set-point.
   */
  headPressureControl: "fixedSetPoint" | "floating";
  loadProfile: LoadProfileInput;
  compressorModel: CompressorModelInput;
  /** The plant's refrigerant: material warnings, charge scaling, GWP of leakage. */
  refrigerant: Refrigerant;
}

export interface FanInput {
  /** Motor input power at full speed (all cells), kW. */
  designPowerKW: number;
  control: "variableSpeed" | "twoSpeed" | "cycling";
  minSpeedFraction: number;
  powerFloorFraction: number;
  lowSpeedFraction: number;
  naturalDraftAirflowFraction: number;
}

/** A constant-speed pump; flow is the loop's flow. Head in metres of water at that flow. */
export interface PumpInput {
  headM: number;
  /** Wire-to-water efficiency (pump × motor × drive). */
  efficiency: number;
}

/**
 * Basin heater: a thermostat holds the basin water at `setPointC`; the heat it must supply is the basin's
 * loss to the air, heatLoss·(set-point − dry-bulb), capped at the heater's rating. It runs only in hours
 * when the basin holds still water: not while warm water circulates (tower under load, cooler spraying),
 * and not when the basin is drained in those hours (`drainedWhenIdle`).
 */
export interface BasinHeaterInput {
  /** Heater rating, kW (0 = no heater). */
  powerKW: number;
  /** Thermostat set-point of the basin water, °C. */
  setPointC: number;
  /** Heat loss of the basin per kelvin of set-point above the dry-bulb, kW/K. */
  heatLossKWPerK: number;
  /** The basin is drained whenever no water circulates over the fill or coil (tower idle, cooler dry or idle). */
  drainedWhenIdle: boolean;
}

/** The condenser's upkeep plan; undefined fields take the construction's defaults (condenser-construction.ts). */
export interface CondenserUpkeepInput {
  cleaningMethod?: CleaningMethod;
  cleaningCostPerEvent?: number;
  /** Years between inspections (eddy-current testing for tubes); 0 = none. */
  inspectionIntervalYears?: number;
  inspectionCostPerEvent?: number;
  /** Life of the wear part (tube bundle or gasket set), years. */
  wearPartLifeYears?: number;
  /** Cost of replacing the wear part; not counted until entered. */
  wearPartReplacementCost?: number;
}

export interface CondenserInput {
  construction: CondenserConstruction;
  /** Tube or plate material; default by construction and refrigerant. */
  material?: CondenserMaterial;
  /** Condensing temperature at the design heat rejection, design entering water and loop flow. */
  designCondensingC: number;
  /** Entering water at that design point; default: the loop's design supply temperature. */
  designEnteringWaterC?: number;
  cleanUWPerM2K: number;
  /** Fouling allowance already contained in the stated design point (0 = the design is the clean condenser). */
  designFoulingM2KPerW: number;
  /** Multiplier on the tube-fouling growth law when the condenser sees open-tower water; default by construction. */
  foulingGrowthMultiplier?: number;
  /** Refrigerant held per kW of design heat rejection, kg/kW; default by construction and refrigerant. */
  specificChargeKgPerKW?: number;
  upkeep: CondenserUpkeepInput;
  /**
   * Share of the clean condenser's resistance 1/U on the water (loop-fluid) side; the part glycol derates
   * when the condenser's design point is stated on water and the loop carries glycol.
   */
  waterSideResistanceFraction: number;
}

/**
 * The tower's design point as entered: the same fields calibrateTower reads (documented there), and 1–5
 * rating points of the selection that fit C and n (tower-fit.ts calibrateTowerOnRatings).
 */
export type TowerSelectionInput = TowerSelection & { ratingPoints?: TowerRatingPointInput[] | undefined };

export interface PlateExchangerInput {
  designApproachK: number;
  cleanUWPerM2K: number;
  /** Clean (condenser) loop flow; default the tower's water flow. */
  cleanSideFlowKgPerS?: number;
  towerSidePressureDropKPa: number;
  cleanSidePressureDropKPa: number;
  /** Growth of the plates' fouling relative to the condenser-tube growth law. */
  foulingGrowthFactor: number;
}

/**
 * The cooler's rating as entered: the same fields calibrateCooler reads (documented there), and extra wet
 * ratings that fit the internal/external resistance split (cooler-fit.ts).
 */
export type CoolerSelectionInput = CoolerSelection & { wetRatings?: CoolerWetRatingInput[] | undefined };

export interface SprayPumpInput {
  flowKgPerS: number;
  headM: number;
  efficiency: number;
  /** Motor input from the selection; overrides ṁ·g·H/η when given. */
  powerKW?: number;
}

/** What every option has: its costs, fans, basin and wet loop. */
interface OptionCommonInput {
  id: string;
  label: string;
  costs: OptionCostsInput;
  fan: FanInput;
  basinHeater: BasinHeaterInput;
  /** Drift as a fraction of the circulating (tower or spray) water flow. */
  driftFractionOfFlow: number;
  /** Water volume of the wet loop; default: 3 minutes of its circulating flow. */
  wetLoopVolumeM3?: number;
  /**
   * This wet loop's own cycles of concentration (e.g. a cooler's spray loop run lower than a tower);
   * default: the scenario's cycles (`water`). A cycles what-if or sensitivity scales every loop's cycles
   * by the same factor as the scenario's.
   */
  cyclesOfConcentration?: number;
}

/** The options with a water-cooled refrigerant condenser and a condenser water loop. */
interface OptionBaseInput extends OptionCommonInput {
  condenser: CondenserInput;
  /** Pump through the condenser (tower water, clean loop or process fluid). */
  condenserPump: PumpInput;
}

/** The evaporative condenser's selection and what it holds and needs (evaporative-condenser.ts). */
export interface EvaporativeCondenserInput extends EvaporativeCondenserSelection {
  /** Coil material; default galvanized steel (stainless on request). */
  coilMaterial?: CondenserMaterial;
  /** Refrigerant held in the coil per kW of rated heat rejection, kg/kW; default by refrigerant. */
  specificChargeKgPerKW?: number;
  /** Coil-exterior scale: capacity lost just before each cleaning, and the cleaning interval. */
  coilScaling: { derateBeforeCleaning: number; cleaningIntervalMonths: number };
  /** Life of the coil, years (a replacement is costed only when its cost is entered). */
  coilLifeYears?: number;
  coilReplacementCost?: number;
}

export interface OpenTowerDirectOptionInput extends OptionBaseInput {
  kind: "openTowerDirect";
  tower: TowerSelectionInput;
}

export interface OpenTowerPlateHxOptionInput extends OptionBaseInput {
  kind: "openTowerPlateHx";
  tower: TowerSelectionInput;
  plateExchanger: PlateExchangerInput;
  /** Second pump: tower water through the exchanger's tower side. */
  towerPump: PumpInput;
}

export interface ClosedCircuitCoolerOptionInput extends OptionBaseInput {
  kind: "closedCircuitCooler";
  cooler: CoolerSelectionInput;
  sprayPump: SprayPumpInput;
}

/** Refrigerant condensed in the unit's coil: no condenser water loop, condenser pump or water-cooled condenser. */
export interface EvaporativeCondenserOptionInput extends OptionCommonInput {
  kind: "evaporativeCondenser";
  evaporativeCondenser: EvaporativeCondenserInput;
  sprayPump: SprayPumpInput;
}

export type WaterCooledOptionInput = OpenTowerDirectOptionInput | OpenTowerPlateHxOptionInput | ClosedCircuitCoolerOptionInput;
export type OptionInput = WaterCooledOptionInput | EvaporativeCondenserOptionInput;

/** True for the options with a water-cooled condenser (every kind but the evaporative condenser). */
export function hasWaterCooledCondenser(o: OptionInput): o is WaterCooledOptionInput {
  return o.kind !== "evaporativeCondenser";
}

export interface MakeupAnalysisInput {
  conductivityUSPerCm?: number;
  calciumHardnessMgPerLAsCaCO3: number;
  mAlkalinityMgPerLAsCaCO3: number;
  silicaMgPerL: number;
  chlorideMgPerL: number;
  ph: number;
  tdsMgPerL: number;
}

export interface ChemistryLimitsInput {
  silicaMgPerL: number;
  chlorideMgPerL: number;
  tdsMgPerL: number;
  calciumHardnessMgPerLAsCaCO3: number;
}

export interface WaterInput {
  makeup: MakeupAnalysisInput;
  limits: ChemistryLimitsInput;
  /** "entered": use `cyclesOfConcentration`; "fromChemistry": Cmax from makeup and limits. */
  cyclesMode: "entered" | "fromChemistry";
  cyclesOfConcentration?: number;
  /** pH of the recirculating water for the scaling indices (before any acid feed). */
  recirculatingPh: number;
  /** What the sewer utility bills: makeup, makeup − evaporation (B + D), or metered blowdown (B). */
  sewerBasis: SewerBasis;
  /** Highest Langelier index accepted at the hottest wetted surface, and acid feed to hold it. */
  scaleControl: ScaleControl;
  dosing: { inhibitorMgPerLOutflow: number; biocideMgPerLSystemVolume: number; biocideSlugsPerYear: number };
}

export interface FoulingInput {
  model: "asymptotic" | "linear";
  asymptoticM2KPerW: number;
  timeConstantMonths: number;
  linearRateM2KPerWPerMonth: number;
  /** Allowance the fouling should not exceed before a cleaning (warning only). */
  limitM2KPerW: number;
  condenserCleaningIntervalMonths: number;
  plateExchangerCleaningIntervalMonths: number;
  /** Constant fouling of condensers fed by a closed loop (plate and cooler options). */
  closedLoopFoulingM2KPerW: number;
}

/** Water and carbon footprint settings of the project (Methods §13). */
export interface FootprintInput {
  /** Grid emission factor, kg CO₂e per kWh, with its data year and source. */
  gridEmissionFactorKgCO2ePerKWh: number;
  gridEmissionFactorYear: number;
  gridEmissionFactorSource: string;
  /** IPCC assessment report whose 100-year GWP values price refrigerant leakage. */
  gwpReport: GwpReport;
  /** Fraction of the condenser's refrigerant inventory lost per year. */
  annualLeakFraction: number;
}

export interface ScenarioInput {
  inputVersion: 1;
  name: string;
  site: SiteInput;
  climate: ClimateInput;
  duty: DutyInput;
  options: OptionInput[];
  water: WaterInput;
  fouling: FoulingInput;
  footprint: FootprintInput;
  tariffs: TariffsInput;
  upkeep: UpkeepInput;
  economics: EconomicsInput;
  sensitivity?: SensitivityInput;
  monteCarlo?: MonteCarloInput;
}
