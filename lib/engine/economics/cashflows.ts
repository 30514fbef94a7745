/**
 * Year-by-year cash flows of one option over the study period (NIST Handbook 135, ch. 5–6).
 *
 * Two steps keep price-only what-ifs and Monte Carlo draws cheap:
 *  1. `buildOptionBasis` turns the physics and the option's costs into base-date amounts that do not
 *     depend on price factors, escalation or discounting (yearly quantities × base prices, and the
 *     dated schedule of replacements, periodic upkeep and residual values);
 *  2. `evaluateOptionBasis` prices that basis for one set of factors and rates: closed-form UPV* for
 *     the recurring streams, SPV for dated events, and optionally the full yearly table.
 *
 * Conventions: base date = start of year 1 (year index 0); a recurring cost of year t is paid at the end
 * of year t (or at t − 0.5 under the mid-year convention, at the price level of that date); dated events
 * (periodic upkeep, replacements, residual) are paid at the end of the year they fall in. A base-date
 * price A escalating at e costs A·(1 + e)^t in year t (the UPV* series). Escalation rates are real; a
 * nominal analysis turns each into (1 + e)(1 + I) − 1 and discounts at (1 + d)(1 + I) − 1.
 */
import type { AcidBasis, EngineWarning, OptionAnnualPhysics } from "../types";
import { loopChemistryAtCycles, type SewerBasis, sewerBilled } from "../water";
import { nominalFromReal, upvStar, upvStarMidYear } from "./factors";
import { checkSteps, MAX_SCHEDULE_EVENTS, MAX_STUDY_YEARS } from "../budget";
import {
  COST_CATEGORIES,
  FIRST_COST_ITEMS,
  type CategoryAmounts,
  type EconomicsInput,
  type EconomicsOptionInput,
  type EscalationRates,
  type EscalationStream,
  type FirstCostItems,
  type TariffsInput,
  type UpkeepInput,
  type YearCashFlow,
} from "./types";

const TIME_EPS = 1e-9;

/** Yearly water-side quantities the cycles of concentration act on, m³ (and kg of product). */
export interface WaterQuantities {
  evaporationM3: number;
  driftM3: number;
  blowdownM3: number;
  makeupM3: number;
  sewerBilledM3: number;
  /** Makeup volume not billed by the sewer utility (the evaporation credit), held fixed when cycles change. */
  sewerExemptM3: number;
  treatedOutflowM3: number;
  inhibitorKg: number;
  biocideKg: number;
  /** Acid product fed to hold the Langelier limit, kg. */
  acidKg: number;
  cyclesOfConcentration: number;
  /**
   * The scenario's cycles in the run (a cycles override replaces them), and this loop's target cycles
   * per scenario cycle (1 unless the loop has its own cycles).
   */
  scenarioCycles: number;
  loopCyclesPerScenarioCycle: number;
  /** What the sewer bills; null for results stored before the choice (the exempt volume is then held). */
  sewerBasis: SewerBasis | null;
  /** Chemistry to recompute the acid at other cycles (null: no acid recompute, e.g. stored results). */
  acidBasis: AcidBasis | null;
}

/** A cost that falls in one year of the study period. */
export interface DatedEvent {
  /** 1…N, the year whose end it is paid at. */
  year: number;
  category: "upkeep" | "replacements" | "residual";
  stream: EscalationStream;
  /** Base-date amount; residual values are negative. */
  amount: number;
  /** True for first-cost items (their replacements and residual values scale with a first-cost factor). */
  fromFirstCost: boolean;
}

/** Everything about one option that does not depend on price factors, escalation or discounting. */
export interface OptionBasis {
  optionId: string;
  kind: EconomicsOptionInput["kind"];
  label: string;
  firstCostByItem: FirstCostItems;
  firstCost: number;
  firstCostMissing: boolean;
  /** Base-date yearly costs of the recurring streams (variable parts before price factors). */
  energyCost: number;
  demandCost: number;
  water: WaterQuantities;
  waterPricePerM3: number;
  waterFixedPerYear: number;
  sewerPricePerM3: number;
  sewerFixedPerYear: number;
  chemicalsPricePerM3Outflow: number;
  inhibitorPricePerKg: number;
  biocidePricePerKg: number;
  acidPricePerKg: number;
  /** Chemical programme fixed cost + water-management programme, per year. */
  chemicalsFixedPerYear: number;
  /** Own labour + service contract + condenser/exchanger cleanings, per year. */
  upkeepPerYear: number;
  /** Emissions per year, kg CO₂e: electricity × grid factor + refrigerant leakage. */
  emissionsKgCO2ePerYear: number;
  /** Carbon price per tonne CO₂e at base-date prices; 0 when no carbon price is applied. */
  carbonPricePerTonne: number;
  events: DatedEvent[];
  studyPeriodYears: number;
}

/** Price factors and rates one evaluation uses. Factors multiply variable (per-unit) prices only. */
export interface Pricing {
  electricityPriceFactor: number;
  demandChargeFactor: number;
  waterPriceFactor: number;
  sewerPriceFactor: number;
  chemicalsPriceFactor: number;
  /** Real escalation per stream. */
  escalation: EscalationRates;
  realDiscountRate: number;
  inflationRate: number;
  analysis: "real" | "nominal";
  discounting: "endOfYear" | "midYear";
}

export interface EvaluatedOption {
  pvByCategory: CategoryAmounts;
  lcc: number;
  firstYearOperatingCost: number;
  cashFlows?: YearCashFlow[];
}

/** A cost-by-category record with every category at 0 (money, project currency). */
export function zeroCategories(): CategoryAmounts {
  return {
    investment: 0,
    energy: 0,
    demand: 0,
    water: 0,
    sewer: 0,
    chemicals: 0,
    upkeep: 0,
    carbon: 0,
    replacements: 0,
    residual: 0,
  };
}

/** Total of a cost-by-category record: Σ over categories, residual value counted as negative (money). */
export function sumCategories(c: CategoryAmounts): number {
  let s = 0;
  for (const k of COST_CATEGORIES) s += c[k];
  return s;
}

/** Base pricing from the scenario's tariffs and economics: all factors 1. */
export function basePricing(tariffs: TariffsInput, economics: EconomicsInput): Pricing {
  return {
    electricityPriceFactor: 1,
    demandChargeFactor: 1,
    waterPriceFactor: 1,
    sewerPriceFactor: 1,
    chemicalsPriceFactor: 1,
    escalation: { ...tariffs.escalation },
    realDiscountRate: economics.realDiscountRate,
    inflationRate: economics.inflationRate,
    analysis: economics.analysis,
    discounting: economics.discounting,
  };
}

/** The discount rate the analysis uses: d (real) or D = (1 + d)(1 + I) − 1 (nominal). Handbook 135. */
export function analysisDiscountRate(
  p: Pick<Pricing, "realDiscountRate" | "inflationRate" | "analysis">,
): number {
  return p.analysis === "nominal" ? nominalFromReal(p.realDiscountRate, p.inflationRate) : p.realDiscountRate;
}

/** The escalation rate of a stream on the analysis' basis: e (real) or (1 + e)(1 + I) − 1 (nominal). */
function analysisEscalation(p: Pricing, stream: EscalationStream): number {
  const e = p.escalation[stream];
  return p.analysis === "nominal" ? nominalFromReal(e, p.inflationRate) : e;
}

// ---------------------------------------------------------------------------------------------------
// Quantities
// ---------------------------------------------------------------------------------------------------

/**
 * Yearly electric energy cost at base-date prices, flat or by month × hour:
 * C = Σ_i kWh_i · price_i over the 288 month-hour cells, or kWh_total · price.
 */
export function energyCostPerYear(
  physics: OptionAnnualPhysics,
  tariffs: TariffsInput,
  warnings: EngineWarning[],
): number {
  const el = tariffs.electricity;
  if (el.pricing === "monthHour") {
    const prices = el.energyPricePerKWhByMonthHour;
    const kwh = physics.energyKWhByMonthHour;
    if (prices && prices.length === 288 && kwh.length === 288) {
      let c = 0;
      for (let i = 0; i < 288; i++) c += (kwh[i] ?? 0) * (prices[i] ?? 0);
      return c;
    }
    warnings.push({
      code: "economics.tariff.monthHourUnavailable",
      severity: "warning",
      message:
        "Month × hour electricity pricing needs 288 prices and 288 energy values; the flat price was used instead.",
      path: "tariffs.electricity.energyPricePerKWhByMonthHour",
      optionId: physics.optionId,
    });
  }
  return physics.energyKWh.total * el.energyPricePerKWh;
}

/** Yearly demand charges: Σ_months peak kW × coincidence factor × charge per kW-month. */
export function demandCostPerYear(physics: OptionAnnualPhysics, tariffs: TariffsInput): number {
  const el = tariffs.electricity;
  let c = 0;
  for (const m of physics.monthly) {
    const charge = el.demandChargePerKWMonthByMonth?.[m.month - 1] ?? el.demandChargePerKWMonth;
    c += m.peakDemandKW * el.demandCoincidenceFactor * charge;
  }
  return c;
}

/** The yearly water volumes (m³) the water, sewer and chemical cost streams are priced on, from the physics. */
export function waterQuantitiesFromPhysics(p: OptionAnnualPhysics): WaterQuantities {
  const w = p.waterM3;
  const scenarioCycles = p.scenarioCyclesOfConcentration ?? p.cyclesOfConcentration;
  const target = p.targetCyclesOfConcentration ?? scenarioCycles;
  return {
    evaporationM3: w.evaporation,
    driftM3: w.drift,
    blowdownM3: w.blowdown,
    makeupM3: w.makeup,
    sewerBilledM3: w.sewerBilled,
    sewerExemptM3: Math.max(0, w.makeup - w.sewerBilled),
    treatedOutflowM3: p.chemicals.treatedOutflowM3,
    inhibitorKg: p.chemicals.inhibitorKg,
    biocideKg: p.chemicals.biocideKg,
    acidKg: p.chemicals.acidKg ?? 0,
    cyclesOfConcentration: p.cyclesOfConcentration,
    scenarioCycles,
    loopCyclesPerScenarioCycle: scenarioCycles > 0 ? target / scenarioCycles : 1,
    sewerBasis: p.sewerBasis ?? null,
    acidBasis: p.waterChemistry?.acidBasis ?? null,
  };
}

/**
 * Water quantities at other cycles of concentration, without re-running the physics. `cycles` are the
 * scenario's cycles; a loop with its own cycles runs at C = cycles × (its ratio to the scenario's).
 * Cycles act only through the mass balance: B = max(E/(C − 1) − D, 0), M = E + B + D, while E (set by
 * the heat rejected and the air) and D (set by the circulating flow) do not change. The billed sewer
 * volume follows its basis (M, M − E = B + D, or B; results stored without a basis keep their exempt
 * volume). Treated outflow = B + D; inhibitor (dosed to a concentration in the water that leaves)
 * scales with it [practice]; biocide (slug doses on the loop volume) does not depend on cycles; the acid
 * is recomputed at C from the loop's chemistry (water.ts `loopChemistryAtCycles`), so it rises with
 * cycles once the Langelier limit binds.
 * Source: the standard cooling-water mass balance (Methods §4).
 */
export function waterAtCycles(q: WaterQuantities, cycles: number): WaterQuantities {
  const c = Math.max(cycles * q.loopCyclesPerScenarioCycle, 1 + 1e-6);
  const blowdownM3 = Math.max(q.evaporationM3 / (c - 1) - q.driftM3, 0);
  const makeupM3 = q.evaporationM3 + blowdownM3 + q.driftM3;
  const outflow = blowdownM3 + q.driftM3;
  const scale = q.treatedOutflowM3 > 0 ? outflow / q.treatedOutflowM3 : 1;
  const a = q.acidBasis;
  const acidKg =
    a && makeupM3 > 0
      ? outflow *
        loopChemistryAtCycles(a.makeup, a.recirculatingPh, a.hottestSurfaceC, c, {
          maximumLangelierIndex: a.maximumLangelierIndex,
          acidFeed: a.acidFeed,
          acidStrengthFraction: a.acidStrengthFraction,
        }).acidProductKgPerM3Outflow
      : q.acidKg * scale;
  const sewerBilledM3 =
    q.sewerBasis === null
      ? Math.max(0, makeupM3 - q.sewerExemptM3)
      : sewerBilled(q.sewerBasis, makeupM3, q.evaporationM3, blowdownM3);
  return {
    ...q,
    blowdownM3,
    makeupM3,
    sewerBilledM3,
    sewerExemptM3: Math.max(0, makeupM3 - sewerBilledM3),
    treatedOutflowM3: outflow,
    inhibitorKg: q.inhibitorKg * scale,
    acidKg,
    cyclesOfConcentration: c,
    scenarioCycles: cycles,
  };
}

/** Base basis with other cycles (all else unchanged). */
export function basisAtCycles(b: OptionBasis, cycles: number): OptionBasis {
  return { ...b, water: waterAtCycles(b.water, cycles) };
}

// ---------------------------------------------------------------------------------------------------
// Schedules
// ---------------------------------------------------------------------------------------------------

/** Times k·L (k ≥ 1) strictly inside the study period (0, N). */
export function replacementTimes(lifeYears: number, studyPeriodYears: number): number[] {
  const out: number[] = [];
  if (!(lifeYears > 0)) return out;
  checkSteps(`replacements every ${lifeYears} years over ${studyPeriodYears} years`, studyPeriodYears / lifeYears, MAX_SCHEDULE_EVENTS);
  for (let k = 1; k * lifeYears < studyPeriodYears - TIME_EPS; k++) out.push(k * lifeYears);
  return out;
}

/** The study year (1…N) an event at time t (years) is billed in: ⌈t⌉. */
function billingYear(t: number): number {
  return Math.max(1, Math.ceil(t - TIME_EPS));
}

/**
 * Linear residual value fraction of an asset installed at `installedAt` with life L, at the end of the
 * study N: max(0, (installedAt + L − N)/L). Source: NIST Handbook 135 (residual value by remaining life).
 */
export function linearResidualFraction(
  installedAt: number,
  lifeYears: number,
  studyPeriodYears: number,
): number {
  if (!(lifeYears > 0)) return 0;
  return Math.max(0, (installedAt + lifeYears - studyPeriodYears) / lifeYears);
}

/** Periodic-item event times k·every ≤ N (k ≥ 1), as counts per billing year. */
function periodicEventCounts(everyYears: number, studyPeriodYears: number): Map<number, number> {
  const counts = new Map<number, number>();
  if (!(everyYears > 0)) return counts;
  checkSteps(`an upkeep item every ${everyYears} years over ${studyPeriodYears} years`, studyPeriodYears / everyYears, MAX_SCHEDULE_EVENTS);
  for (let k = 1; k * everyYears <= studyPeriodYears + TIME_EPS; k++) {
    const y = billingYear(k * everyYears);
    counts.set(y, (counts.get(y) ?? 0) + 1);
  }
  return counts;
}


/** Every first-cost item at 0: the amounts of an option whose first cost is not entered yet. */
function noFirstCost(): FirstCostItems {
  return Object.fromEntries(FIRST_COST_ITEMS.map((k) => [k, 0])) as FirstCostItems;
}
function scheduleFirstCostItems(
  option: EconomicsOptionInput,
  economics: EconomicsInput,
  events: DatedEvent[],
  warnings: EngineWarning[],
): number[] {
  const n = economics.studyPeriodYears;
  const costs = option.costs;
  let equipmentTimes: number[] = [];
  let warnedNoReplacement = false;
  for (const item of FIRST_COST_ITEMS) {
    const cost = costs.firstCost?.[item] ?? 0;
    const life = costs.firstCostItemLivesYears?.[item] ?? costs.serviceLifeYears;
    const times = costs.replaceAtEndOfLife ? replacementTimes(life, n) : [];
    if (item === "equipment") equipmentTimes = times;
    if (!(cost > 0)) continue;
    for (const t of times) {
      events.push({
        year: billingYear(t),
        category: "replacements",
        stream: "replacements",
        amount: cost,
        fromFirstCost: true,
      });
    }
    if (!costs.replaceAtEndOfLife && life < n - TIME_EPS && !warnedNoReplacement) {
      warnedNoReplacement = true;
      warnings.push({
        code: "economics.lifeShorterThanStudy",
        severity: "info",
        message: `${option.label}: a first-cost item's life (${life} years) ends before the study period (${n} years) and no replacement is costed.`,
        path: "options[].costs.replaceAtEndOfLife",
        optionId: option.optionId,
      });
    }
    if (economics.residualValueMethod === "linear") {
      const lastInstall = times.length > 0 ? (times[times.length - 1] ?? 0) : 0;
      const fraction = linearResidualFraction(lastInstall, life, n);
      if (fraction > 0) {
        events.push({
          year: n,
          category: "residual",
          stream: "replacements",
          amount: -cost * fraction,
          fromFirstCost: true,
        });
      }
    }
  }
  return equipmentTimes;
}

/**
 * Components are installed with the unit (inside its first cost), replaced at the end of each life, and
 * renewed with the unit when the whole unit is replaced (their clock restarts, no separate cost). Only a
 * separately bought last replacement earns its own residual value; the original is in the unit's.
 */
function scheduleComponents(
  option: EconomicsOptionInput,
  economics: EconomicsInput,
  equipmentTimes: number[],
  events: DatedEvent[],
): void {
  const n = economics.studyPeriodYears;
  for (const comp of option.costs.components) {
    const life = comp.lifeYears;
    if (!(life > 0)) continue;
    checkSteps(`a component replaced every ${life} years over ${n} years`, n / life, MAX_SCHEDULE_EVENTS);
    let last = 0;
    let lastWasSeparate = false;
    for (let guard = 0; guard < 10_000; guard++) {
      const next = last + life;
      const unitRenewal = equipmentTimes.find((t) => t > last + TIME_EPS);
      if (unitRenewal !== undefined && unitRenewal <= next + TIME_EPS) {
        last = unitRenewal;
        lastWasSeparate = false;
        continue;
      }
      if (next >= n - TIME_EPS) break;
      events.push({
        year: billingYear(next),
        category: "replacements",
        stream: "replacements",
        amount: comp.replacementCost,
        fromFirstCost: false,
      });
      last = next;
      lastWasSeparate = true;
    }
    if (lastWasSeparate && economics.residualValueMethod === "linear") {
      const fraction = linearResidualFraction(last, life, n);
      if (fraction > 0) {
        events.push({
          year: n,
          category: "residual",
          stream: "replacements",
          amount: -comp.replacementCost * fraction,
          fromFirstCost: false,
        });
      }
    }
  }
}

function schedulePeriodicUpkeep(
  option: EconomicsOptionInput,
  upkeep: UpkeepInput,
  economics: EconomicsInput,
  events: DatedEvent[],
): void {
  for (const item of option.costs.upkeep.periodicItems) {
    const perEvent = item.costPerEvent + item.labourHoursPerEvent * upkeep.labourRatePerHour;
    if (!(perEvent > 0)) continue;
    for (const [year, count] of periodicEventCounts(item.everyYears, economics.studyPeriodYears)) {
      events.push({
        year,
        category: "upkeep",
        stream: "labour",
        amount: perEvent * count,
        fromFirstCost: false,
      });
    }
  }
}

/**
 * Base-date amounts and the dated schedule of one option. `physics` may be undefined (no physics for
 * this option): its operating quantities are then zero and a warning is added.
 */
export function buildOptionBasis(
  physics: OptionAnnualPhysics | undefined,
  option: EconomicsOptionInput,
  tariffs: TariffsInput,
  upkeep: UpkeepInput,
  economics: EconomicsInput,
  warnings: EngineWarning[],
): OptionBasis {
  // The yearly cash-flow loops walk the study period year by year.
  checkSteps(`a study period of ${economics.studyPeriodYears} years`, economics.studyPeriodYears, MAX_STUDY_YEARS);
  const costs = option.costs;
  const firstCostByItem = costs.firstCost ? { ...costs.firstCost } : noFirstCost();
  let firstCost = 0;
  for (const k of FIRST_COST_ITEMS) firstCost += firstCostByItem[k];

  if (!physics) {
    warnings.push({
      code: "economics.physicsMissing",
      severity: "warning",
      message: `${option.label}: no yearly physics found; its energy, water and cleaning costs are taken as zero.`,
      optionId: option.optionId,
    });
  }
  const water: WaterQuantities = physics
    ? waterQuantitiesFromPhysics(physics)
    : {
        evaporationM3: 0,
        driftM3: 0,
        blowdownM3: 0,
        makeupM3: 0,
        sewerBilledM3: 0,
        sewerExemptM3: 0,
        treatedOutflowM3: 0,
        inhibitorKg: 0,
        biocideKg: 0,
        acidKg: 0,
        cyclesOfConcentration: 1,
        scenarioCycles: 1,
        loopCyclesPerScenarioCycle: 1,
        sewerBasis: null,
        acidBasis: null,
      };
  const creditApplied = water.sewerExemptM3 > 1e-9 * Math.max(1, water.makeupM3);

  const events: DatedEvent[] = [];
  const equipmentTimes = scheduleFirstCostItems(option, economics, events, warnings);
  scheduleComponents(option, economics, equipmentTimes, events);
  schedulePeriodicUpkeep(option, upkeep, economics, events);

  const up = costs.upkeep;
  const cleanings = physics?.cleaningsPerYear ?? 0;
  const kwh = physics?.energyKWh.total ?? 0;
  const emissions = option.carbon ? kwh * option.carbon.gridFactorKgCO2ePerKWh + option.carbon.leakageKgCO2ePerYear : 0;
  return {
    optionId: option.optionId,
    kind: option.kind,
    label: option.label,
    firstCostByItem,
    firstCost,
    firstCostMissing: costs.firstCost === undefined,
    energyCost: physics ? energyCostPerYear(physics, tariffs, warnings) : 0,
    demandCost: physics ? demandCostPerYear(physics, tariffs) : 0,
    water,
    waterPricePerM3: tariffs.water.pricePerM3,
    waterFixedPerYear: 12 * tariffs.water.fixedChargePerMonth,
    sewerPricePerM3: tariffs.sewer.pricePerM3,
    sewerFixedPerYear:
      12 *
      (tariffs.sewer.fixedChargePerMonth +
        (creditApplied ? tariffs.sewer.evaporationCreditMeterChargePerMonth : 0)),
    chemicalsPricePerM3Outflow: tariffs.chemicals.costPerM3Outflow,
    inhibitorPricePerKg: tariffs.chemicals.inhibitorPricePerKg,
    biocidePricePerKg: tariffs.chemicals.biocidePricePerKg,
    acidPricePerKg: tariffs.chemicals.acidPricePerKg,
    // All three loop kinds have a wet loop (the closed-circuit cooler's spray loop too), so each carries
    // a treatment programme and a water-management programme unless the option overrides them.
    chemicalsFixedPerYear:
      (up.chemicalFixedCostPerYearOverride ?? tariffs.chemicals.fixedCostPerYear) +
      (up.waterManagementProgrammeCostPerYearOverride ?? tariffs.waterManagementProgrammeCostPerYear),
    upkeepPerYear:
      up.annualLabourHours * upkeep.labourRatePerHour +
      up.annualServiceCost +
      cleanings * up.cleaningCostPerEvent,
    emissionsKgCO2ePerYear: emissions,
    carbonPricePerTonne: tariffs.carbon.enabled ? tariffs.carbon.pricePerTonneCO2e : 0,
    events,
    studyPeriodYears: economics.studyPeriodYears,
  };
}

// ---------------------------------------------------------------------------------------------------
// Evaluation
// ---------------------------------------------------------------------------------------------------

interface EventGroup {
  category: DatedEvent["category"];
  stream: EscalationStream;
  fromFirstCost: boolean;
  /** Base-date amount per study year, index 0…N. */
  byYear: Float64Array;
}

/**
 * Dated events summed per (category, stream, first-cost flag) and year, memoised on the events array
 * (shared by every copy of a basis), so an evaluation costs N multiplications per group, not a power
 * per event: this is what keeps 10,000 Monte Carlo draws cheap.
 */
const eventGroupCache = new WeakMap<DatedEvent[], EventGroup[]>();
function eventGroups(events: DatedEvent[], n: number): EventGroup[] {
  const cached = eventGroupCache.get(events);
  if (cached) return cached;
  const groups = new Map<string, EventGroup>();
  for (const ev of events) {
    const key = `${ev.category}|${ev.stream}|${ev.fromFirstCost}`;
    let g = groups.get(key);
    if (!g) {
      g = {
        category: ev.category,
        stream: ev.stream,
        fromFirstCost: ev.fromFirstCost,
        byYear: new Float64Array(n + 1),
      };
      groups.set(key, g);
    }
    if (ev.year >= 1 && ev.year <= n) g.byYear[ev.year] = (g.byYear[ev.year] ?? 0) + ev.amount;
  }
  const out = [...groups.values()];
  eventGroupCache.set(events, out);
  return out;
}

interface RecurringStream {
  category: "energy" | "demand" | "water" | "sewer" | "chemicals" | "upkeep" | "carbon";
  stream: EscalationStream;
  amount: number;
}

function recurringStreams(b: OptionBasis, p: Pricing): RecurringStream[] {
  const w = b.water;
  return [
    { category: "energy", stream: "energy", amount: b.energyCost * p.electricityPriceFactor },
    { category: "demand", stream: "demand", amount: b.demandCost * p.demandChargeFactor },
    {
      category: "water",
      stream: "water",
      amount: w.makeupM3 * b.waterPricePerM3 * p.waterPriceFactor + b.waterFixedPerYear,
    },
    {
      category: "sewer",
      stream: "sewer",
      amount: w.sewerBilledM3 * b.sewerPricePerM3 * p.sewerPriceFactor + b.sewerFixedPerYear,
    },
    {
      category: "chemicals",
      stream: "chemicals",
      amount:
        (w.treatedOutflowM3 * b.chemicalsPricePerM3Outflow +
          w.inhibitorKg * b.inhibitorPricePerKg +
          w.biocideKg * b.biocidePricePerKg +
          w.acidKg * b.acidPricePerKg) *
          p.chemicalsPriceFactor +
        b.chemicalsFixedPerYear,
    },
    { category: "upkeep", stream: "labour", amount: b.upkeepPerYear },
    // Optional carbon price: tonnes CO₂e × price per tonne, escalated on its own stream.
    { category: "carbon", stream: "carbon", amount: (b.emissionsKgCO2ePerYear / 1000) * b.carbonPricePerTonne },
  ];
}

/**
 * Price one option's basis. `firstCostScale` multiplies every first-cost-derived amount (investment,
 * its replacements and residual values), which is how first-cost premiums and draws act.
 * PV_recurring = A·UPV*(D, E, N) (mid-year variant when asked); PV_event = A·(1 + E)^t·(1 + D)^−t.
 */
export function evaluateOptionBasis(
  b: OptionBasis,
  p: Pricing,
  firstCostScale = 1,
  recordCashFlows = false,
  baseYear = 0,
): EvaluatedOption {
  const n = b.studyPeriodYears;
  const d = analysisDiscountRate(p);
  const mid = p.discounting === "midYear";
  const pv = zeroCategories();
  pv.investment = b.firstCost * firstCostScale;

  const streams = recurringStreams(b, p);
  let firstYearOperatingCost = 0;
  for (const s of streams) {
    const e = analysisEscalation(p, s.stream);
    pv[s.category] += s.amount * (mid ? upvStarMidYear(d, e, n) : upvStar(d, e, n));
    firstYearOperatingCost += s.amount;
  }
  for (const g of eventGroups(b.events, n)) {
    const x = (1 + analysisEscalation(p, g.stream)) / (1 + d);
    const scale = g.fromFirstCost ? firstCostScale : 1;
    let f = 1;
    let sum = 0;
    for (let y = 1; y <= n; y++) {
      f *= x;
      const a = g.byYear[y] ?? 0;
      if (a !== 0) sum += a * f;
    }
    pv[g.category] += sum * scale;
  }
  const result: EvaluatedOption = { pvByCategory: pv, lcc: sumCategories(pv), firstYearOperatingCost };
  if (recordCashFlows) result.cashFlows = yearlyTable(b, p, streams, firstCostScale, baseYear);
  return result;
}

function yearlyTable(
  b: OptionBasis,
  p: Pricing,
  streams: RecurringStream[],
  firstCostScale: number,
  baseYear: number,
): YearCashFlow[] {
  const n = b.studyPeriodYears;
  const d = analysisDiscountRate(p);
  const tShift = p.discounting === "midYear" ? 0.5 : 0;
  const rows: YearCashFlow[] = [];
  let cumulative = 0;
  const escalations = new Map<EscalationStream, number>();
  const esc = (s: EscalationStream): number => {
    let e = escalations.get(s);
    if (e === undefined) {
      e = analysisEscalation(p, s);
      escalations.set(s, e);
    }
    return e;
  };
  const eventsByYear = new Map<number, DatedEvent[]>();
  for (const ev of b.events) {
    const list = eventsByYear.get(ev.year) ?? [];
    list.push(ev);
    eventsByYear.set(ev.year, list);
  }
  for (let t = 0; t <= n; t++) {
    const amounts = zeroCategories();
    const pvs = zeroCategories();
    if (t === 0) {
      amounts.investment = b.firstCost * firstCostScale;
      pvs.investment = amounts.investment;
    } else {
      const tr = t - tShift;
      for (const s of streams) {
        const a = s.amount * Math.pow(1 + esc(s.stream), tr);
        amounts[s.category] += a;
        pvs[s.category] += a * Math.pow(1 + d, -tr);
      }
      for (const ev of eventsByYear.get(t) ?? []) {
        const a =
          (ev.fromFirstCost ? ev.amount * firstCostScale : ev.amount) * Math.pow(1 + esc(ev.stream), t);
        amounts[ev.category] += a;
        pvs[ev.category] += a * Math.pow(1 + d, -t);
      }
    }
    const presentValue = sumCategories(pvs);
    cumulative += presentValue;
    rows.push({
      yearIndex: t,
      calendarYear: baseYear + Math.max(0, t - 1),
      byCategory: amounts,
      total: sumCategories(amounts),
      presentValueByCategory: pvs,
      presentValue,
      cumulativePresentValue: cumulative,
    });
  }
  return rows;
}
