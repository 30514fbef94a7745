/**
 * Annual composition: every option's equipment model run over every hour (or bin) of the climate,
 * summed into `OptionAnnualPhysics`.
 *
 * Per hour: duty Q → required condenser entering water for the target condensing temperature
 * (set-point, or the minimum under floating head pressure) through the option's (fouled) condenser
 * and exchanger → the tower or cooler holds it with its fan control or floats at full speed →
 * condensing temperature, fan, pump, spray and heater power, compressor penalty against the clean
 * reference (clean condenser, no exchanger, same water from the tower/cooler), evaporation, drift,
 * blowdown, makeup, sewer. Balances close per record: M − E − B − D = 0 and heat rejected = duty.
 *
 * Basin heater rule: the heater runs in hours below its dry-bulb threshold in which no warm water
 * wets the basin — the tower idle (no load), or the cooler's spray pump off (dry mode or idle).
 */
import { type EnteringAir, enteringAir } from "./air-side";
import type { ClimateYear } from "./climate/types";
import {
  type CompressorModel,
  carnotEfficiency,
  compressorPenaltyKW,
  compressorPowerKW,
} from "./compressor";
import { calibrateCondenserCleanUaKWPerK, condensingTemperatureC, fouledUaKWPerK, requiredEnteringWaterC } from "./condenser";
import { binLoadFraction, designHeatRejectionKW, designRefrigerationLoadKW, hourLoadFraction, targetCondensingC } from "./duty";
import type { FanModel } from "./fans";
import { type CoolerModel, calibrateCooler, solveCoolerHour } from "./fluid-cooler";
import {
  type FoulingGrowth,
  monthlyFoulingM2KPerW,
  optimalCleaningIntervalMonths,
  peakFoulingM2KPerW,
  scaleGrowth,
} from "./fouling";
import { fluidProperties, freezingPointC } from "./glycol";
import type { DutyInput, FoulingInput, OptionInput, WaterInput } from "./input";
import { calibratePlateExchangerUaKWPerK, plateExchangerApproachK } from "./plate-exchanger";
import { waterSpecificHeatKJPerKgK } from "./psychrometrics";
import { glycolPumpPowerKW, pumpPowerKW, waterHeadFromPressureDropM } from "./pumps";
import { type TowerModel, calibrateTower, solveTowerHour } from "./tower";
import type { EngineWarning, EnergyByComponentKWh, MonthlyPhysics, OptionAnnualPhysics, WaterByComponentM3 } from "./types";
import {
  achievedCycles,
  blowdown,
  chemicalQuantitiesKg,
  concentrated,
  langelierIndex,
  maximumCyclesFromChemistry,
  ryznarIndex,
  saturationPh,
  sewerBilled,
} from "./water";

const CPW = waterSpecificHeatKJPerKgK;
/** Density of the metered water, kg/m³ (≈ 20 °C). */
export const WATER_DENSITY_KG_PER_M3 = 998.2;
const DAYS_IN_MONTH = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];

// ---------------------------------------------------------------------------------------------
// Climate records
// ---------------------------------------------------------------------------------------------

/** The climate as the annual loop walks it, with the entering-air state computed once. */
export interface PreparedClimate {
  kind: "hourly" | "bins";
  count: number;
  /** 1…12, or 0 for a bin without a month. */
  month: Int8Array;
  /** 0…23, or −1 for a bin. */
  hour: Int8Array;
  hours: Float64Array;
  air: EnteringAir[];
  totalHours: number;
  /** Bins carry no month: monthly results are spread pro rata by days. */
  monthsUnknown: boolean;
}

/** Walk a ClimateYear once: entering-air enthalpy and humidity per record (one hs evaluation each). */
export function prepareClimate(year: ClimateYear, pPa: number): PreparedClimate {
  if (year.kind === "hourly") {
    const n = year.dryBulbC.length;
    const air: EnteringAir[] = new Array(n);
    const month = new Int8Array(n);
    const hour = new Int8Array(n);
    const hours = new Float64Array(n).fill(1);
    for (let i = 0; i < n; i++) {
      month[i] = year.month[i] ?? 1;
      hour[i] = year.hour[i] ?? 0;
      air[i] = enteringAir(year.dryBulbC[i] ?? 0, year.wetBulbC[i] ?? 0, pPa);
    }
    return { kind: "hourly", count: n, month, hour, hours, air, totalHours: n, monthsUnknown: false };
  }
  const n = year.bins.length;
  const air: EnteringAir[] = new Array(n);
  const month = new Int8Array(n);
  const hour = new Int8Array(n).fill(-1);
  const hours = new Float64Array(n);
  let total = 0;
  let unknown = false;
  for (let i = 0; i < n; i++) {
    const b = year.bins[i];
    if (!b) continue;
    month[i] = b.month ?? 0;
    if (b.month === undefined) unknown = true;
    hours[i] = b.hours;
    total += b.hours;
    air[i] = enteringAir(b.meanCoincidentDryBulbC, b.wetBulbC, pPa);
  }
  return { kind: "bins", count: n, month, hour, hours, air, totalHours: total, monthsUnknown: unknown };
}

// ---------------------------------------------------------------------------------------------
// Option preparation (calibration; independent of the what-if overrides)
// ---------------------------------------------------------------------------------------------

type Device = { kind: "tower"; model: TowerModel } | { kind: "cooler"; model: CoolerModel };

/** An option with every model calibrated once. */
export interface PreparedOption {
  input: OptionInput;
  path: string;
  fan: FanModel;
  device: Device;
  condenserCleanUaKWPerK: number;
  condenserCleanUWPerM2K: number;
  /** ṁ·cp through the condenser, kW/K. */
  condenserCapacityKWPerK: number;
  /** Constant fouling of a condenser on a closed loop (plate and cooler options), m²·K/W. */
  condenserFixedFoulingM2KPerW: number;
  plate?: { cleanUaKWPerK: number; cleanUWPerM2K: number; hotCapacityKWPerK: number; coldCapacityKWPerK: number };
  condenserPumpKW: number;
  secondaryPumpKW: number;
  sprayPumpKW: number;
  /** Circulating water whose drift counts: tower flow, or the cooler's spray flow, kg/s. */
  driftFlowKgPerS: number;
  wetLoopVolumeM3: number;
  /** Hot-water (tower) or entering-fluid (cooler) temperature at design, °C. */
  designHottestSurfaceC: number;
  warnings: EngineWarning[];
}

function fanModel(o: OptionInput): FanModel {
  return {
    designPowerKW: o.fan.designPowerKW,
    control: o.fan.control,
    minSpeedFraction: o.fan.minSpeedFraction,
    powerFloorFraction: o.fan.powerFloorFraction,
    lowSpeedFraction: o.fan.lowSpeedFraction,
    naturalDraftAirflowFraction: o.fan.naturalDraftAirflowFraction,
  };
}

function calibrateCondenser(
  o: OptionInput,
  path: string,
  designHeatKW: number,
  defaultEnteringC: number,
  capacityKWPerK: number,
  warnings: EngineWarning[],
): number {
  const entering = o.condenser.designEnteringWaterC ?? defaultEnteringC;
  let ua = calibrateCondenserCleanUaKWPerK(
    o.condenser.designCondensingC,
    entering,
    designHeatKW,
    capacityKWPerK,
    o.condenser.cleanUWPerM2K,
    o.condenser.designFoulingM2KPerW,
  );
  if (!Number.isFinite(ua)) {
    ua = -capacityKWPerK * Math.log(0.05);
    warnings.push({
      code: "condenser.designInfeasible",
      severity: "warning",
      message: `A condensing temperature of ${o.condenser.designCondensingC} °C cannot reject ${Math.round(designHeatKW)} kW into ${round1(entering)} °C water at this flow (it needs more than the water's temperature rise); a condenser effectiveness of 0.95 was assumed.`,
      path: `${path}.condenser.designCondensingC`,
      optionId: o.id,
    });
  }
  return ua;
}

/**
 * Calibrate an option's tower or cooler, condenser and exchanger on their design points and work out
 * the constant pump powers. Design-point sanity checks become warnings.
 */
export function prepareOption(o: OptionInput, index: number, duty: DutyInput, fouling: FoulingInput, pPa: number): PreparedOption {
  const path = `options.${index}`;
  const warnings: EngineWarning[] = [];
  const qDesign = designHeatRejectionKW(duty);
  const fan = fanModel(o);
  const volumeFromFlow = (kgPerS: number): number => (kgPerS * 180) / WATER_DENSITY_KG_PER_M3;
  if (o.kind === "closedCircuitCooler") {
    const { model, warnings: w } = calibrateCooler(o.cooler, pPa, `${path}.cooler`);
    warnings.push(...w.map((x) => ({ ...x, optionId: o.id })));
    const c = o.cooler;
    const meanC = 0.5 * (c.enteringFluidC + c.leavingFluidC);
    const loop = fluidProperties(c.glycol.kind, c.glycol.massFraction, meanC);
    const water = fluidProperties("none", 0, meanC);
    const cw = model.fluidCapacityKWPerK;
    const ua = calibrateCondenser(o, path, qDesign, c.leavingFluidC, cw, warnings);
    designChecks(warnings, o, path, qDesign, model.fluidCapacityKWPerK * (c.enteringFluidC - c.leavingFluidC), c.leavingFluidC - c.designWetBulbC, 2.5, "cooler");
    const sprayKW = o.sprayPump.powerKW ?? pumpPowerKW(o.sprayPump.flowKgPerS, o.sprayPump.headM, o.sprayPump.efficiency);
    return {
      input: o,
      path,
      fan,
      device: { kind: "cooler", model },
      condenserCleanUaKWPerK: ua,
      condenserCleanUWPerM2K: o.condenser.cleanUWPerM2K,
      condenserCapacityKWPerK: cw,
      condenserFixedFoulingM2KPerW: fouling.closedLoopFoulingM2KPerW,
      condenserPumpKW:
        c.glycol.kind === "none"
          ? pumpPowerKW(c.fluidFlowKgPerS, o.condenserPump.headM, o.condenserPump.efficiency)
          : glycolPumpPowerKW(c.fluidFlowKgPerS, o.condenserPump.headM, o.condenserPump.efficiency, loop, water),
      secondaryPumpKW: 0,
      sprayPumpKW: sprayKW,
      driftFlowKgPerS: o.sprayPump.flowKgPerS,
      wetLoopVolumeM3: o.wetLoopVolumeM3 ?? volumeFromFlow(o.sprayPump.flowKgPerS),
      designHottestSurfaceC: c.enteringFluidC,
      warnings,
    };
  }
  const { model, warnings: w } = calibrateTower(o.tower, pPa, `${path}.tower`);
  warnings.push(...w.map((x) => ({ ...x, optionId: o.id })));
  const t = o.tower;
  const towerC = t.waterFlowKgPerS * CPW;
  designChecks(warnings, o, path, qDesign, towerC * (t.enteringWaterC - t.leavingWaterC), t.leavingWaterC - t.designWetBulbC, 2, "tower");
  if (o.kind === "openTowerDirect") {
    const ua = calibrateCondenser(o, path, qDesign, t.leavingWaterC, towerC, warnings);
    return {
      input: o,
      path,
      fan,
      device: { kind: "tower", model },
      condenserCleanUaKWPerK: ua,
      condenserCleanUWPerM2K: o.condenser.cleanUWPerM2K,
      condenserCapacityKWPerK: towerC,
      condenserFixedFoulingM2KPerW: 0,
      condenserPumpKW: pumpPowerKW(t.waterFlowKgPerS, o.condenserPump.headM, o.condenserPump.efficiency),
      secondaryPumpKW: 0,
      sprayPumpKW: 0,
      driftFlowKgPerS: t.waterFlowKgPerS,
      wetLoopVolumeM3: o.wetLoopVolumeM3 ?? volumeFromFlow(t.waterFlowKgPerS),
      designHottestSurfaceC: t.enteringWaterC,
      warnings,
    };
  }
  const px = o.plateExchanger;
  const cleanFlow = px.cleanSideFlowKgPerS ?? t.waterFlowKgPerS;
  const hotC = cleanFlow * CPW;
  const uaHx = calibratePlateExchangerUaKWPerK(qDesign, px.designApproachK, hotC, towerC);
  if (px.designApproachK < 0.5) {
    warnings.push({
      code: "plateExchanger.approachImplausiblySmall",
      severity: "warning",
      message: `A plate-exchanger approach of ${px.designApproachK} K is implausibly small for a screening study (1–2 K is usual).`,
      path: `${path}.plateExchanger.designApproachK`,
      optionId: o.id,
    });
  }
  const ua = calibrateCondenser(o, path, qDesign, t.leavingWaterC + px.designApproachK, hotC, warnings);
  return {
    input: o,
    path,
    fan,
    device: { kind: "tower", model },
    condenserCleanUaKWPerK: ua,
    condenserCleanUWPerM2K: o.condenser.cleanUWPerM2K,
    condenserCapacityKWPerK: hotC,
    condenserFixedFoulingM2KPerW: fouling.closedLoopFoulingM2KPerW,
    plate: { cleanUaKWPerK: uaHx, cleanUWPerM2K: px.cleanUWPerM2K, hotCapacityKWPerK: hotC, coldCapacityKWPerK: towerC },
    condenserPumpKW: pumpPowerKW(cleanFlow, o.condenserPump.headM + waterHeadFromPressureDropM(px.cleanSidePressureDropKPa), o.condenserPump.efficiency),
    secondaryPumpKW: pumpPowerKW(t.waterFlowKgPerS, o.towerPump.headM + waterHeadFromPressureDropM(px.towerSidePressureDropKPa), o.towerPump.efficiency),
    sprayPumpKW: 0,
    driftFlowKgPerS: t.waterFlowKgPerS,
    wetLoopVolumeM3: o.wetLoopVolumeM3 ?? volumeFromFlow(t.waterFlowKgPerS),
    designHottestSurfaceC: t.enteringWaterC,
    warnings,
  };
}

function designChecks(
  warnings: EngineWarning[],
  o: OptionInput,
  path: string,
  dutyKW: number,
  selectionKW: number,
  approachK: number,
  minApproachK: number,
  what: "tower" | "cooler",
): void {
  if (approachK < minApproachK) {
    warnings.push({
      code: `${what}.approachImplausiblySmall`,
      severity: "warning",
      message: `The ${what} selection's approach to the design wet-bulb is ${round1(approachK)} K: below ${minApproachK} K is implausibly small for a real selection; check the rating.`,
      path: `${path}.${what}.leavingWaterC`.replace("cooler.leavingWaterC", "cooler.leavingFluidC"),
      optionId: o.id,
    });
  }
  if (dutyKW > 0 && Math.abs(selectionKW / dutyKW - 1) > 0.1) {
    warnings.push({
      code: `${what}.selectionDutyMismatch`,
      severity: "info",
      message: `The ${what} is rated for ${Math.round(selectionKW)} kW at its design point, the duty is ${Math.round(dutyKW)} kW; the model uses the rating as the unit's characteristic and the duty as the load.`,
      path: `${path}.${what}`,
      optionId: o.id,
    });
  }
}

// ---------------------------------------------------------------------------------------------
// One option over the year
// ---------------------------------------------------------------------------------------------

/** Scenario-wide settings the year loop needs. */
export interface YearContext {
  pPa: number;
  climate: PreparedClimate;
  duty: DutyInput;
  designHeatKW: number;
  /** Qe/Qrej, from the design COP. */
  refrigerationPerRejection: number;
  compressor: CompressorModel;
  water: WaterInput;
  cycles: number;
  loadFactor: number;
}

interface Accumulator {
  monthly: MonthlyPhysics[];
  byMonthHour: Float64Array;
  heatKWh: number;
  runningHours: number;
  condSum: number;
  refSum: number;
  hottestSurfaceC: number;
  compressorKWh: number;
  peakRfM2KPerW: number;
  /** Hours of wet operation (water on the fill or coil) below 0 °C dry-bulb, and the year's lowest dry-bulb. */
  wetHoursBelowFreezing: number;
  minDryBulbC: number;
}

function emptyEnergy(): EnergyByComponentKWh {
  return { fan: 0, condenserPump: 0, secondaryPump: 0, sprayPump: 0, basinHeater: 0, compressorPenalty: 0, total: 0 };
}
function emptyWater(): WaterByComponentM3 {
  return { evaporation: 0, drift: 0, blowdown: 0, makeup: 0, sewerBilled: 0 };
}

/** Results of one record, per hour (rates), before weighting. */
interface RecordRates {
  heatKW: number;
  fanKW: number;
  condenserPumpKW: number;
  secondaryPumpKW: number;
  sprayPumpKW: number;
  heaterKW: number;
  penaltyKW: number;
  compressorKW: number;
  evaporationKgPerS: number;
  driftKgPerS: number;
  dry: boolean;
  unmet: boolean;
  running: boolean;
  condensingC: number;
  referenceC: number;
  hottestSurfaceC: number;
}

function evaluateRecord(po: PreparedOption, ctx: YearContext, air: EnteringAir, heatKW: number, towerSideRf: number): RecordRates {
  const o = po.input;
  const rates: RecordRates = {
    heatKW,
    fanKW: 0,
    condenserPumpKW: 0,
    secondaryPumpKW: 0,
    sprayPumpKW: 0,
    heaterKW: 0,
    penaltyKW: 0,
    compressorKW: 0,
    evaporationKgPerS: 0,
    driftKgPerS: 0,
    dry: false,
    unmet: false,
    running: false,
    condensingC: 0,
    referenceC: 0,
    hottestSurfaceC: Number.NEGATIVE_INFINITY,
  };
  const heaterBelow = air.dryBulbC < o.basinHeater.belowDryBulbC;
  if (!(heatKW > 0)) {
    if (heaterBelow) rates.heaterKW = o.basinHeater.powerKW;
    return rates;
  }
  rates.running = true;
  const target = targetCondensingC(ctx.duty);
  const cw = po.condenserCapacityKWPerK;
  const condRf = o.kind === "openTowerDirect" ? towerSideRf : po.condenserFixedFoulingM2KPerW;
  const uaCond = fouledUaKWPerK(po.condenserCleanUaKWPerK, po.condenserCleanUWPerM2K, condRf);
  const condenserEnteringReq = requiredEnteringWaterC(target, heatKW, uaCond, cw);
  let held: boolean;
  let deviceLeavingC: number;
  let approachK = 0;
  if (po.device.kind === "tower") {
    if (po.plate) {
      const uaHx = fouledUaKWPerK(po.plate.cleanUaKWPerK, po.plate.cleanUWPerM2K, towerSideRf);
      approachK = plateExchangerApproachK(heatKW, uaHx, po.plate.hotCapacityKWPerK, po.plate.coldCapacityKWPerK);
    }
    const r = solveTowerHour(po.device.model, po.fan, air, heatKW, condenserEnteringReq - approachK, ctx.pPa);
    held = r.held;
    deviceLeavingC = r.coldWaterC;
    rates.fanKW = r.fanPowerKW;
    rates.evaporationKgPerS = r.evaporationKgPerS;
    rates.driftKgPerS = o.driftFractionOfFlow * po.driftFlowKgPerS;
    rates.hottestSurfaceC = r.hotWaterC;
  } else {
    const r = solveCoolerHour(po.device.model, po.fan, air, heatKW, condenserEnteringReq, ctx.pPa);
    held = r.held;
    deviceLeavingC = r.leavingFluidC;
    rates.fanKW = r.fanPowerKW;
    rates.evaporationKgPerS = r.evaporationKgPerS;
    rates.dry = r.mode === "dry";
    if (r.sprayOn) {
      rates.sprayPumpKW = po.sprayPumpKW;
      rates.driftKgPerS = o.driftFractionOfFlow * po.driftFlowKgPerS;
      rates.hottestSurfaceC = r.enteringFluidC;
    } else if (heaterBelow) {
      rates.heaterKW = o.basinHeater.powerKW;
    }
  }
  rates.condenserPumpKW = po.condenserPumpKW;
  rates.secondaryPumpKW = po.secondaryPumpKW;
  const condensing = held ? target : condensingTemperatureC(deviceLeavingC + approachK, heatKW, uaCond, cw);
  const cleanRef = condensingTemperatureC(deviceLeavingC, heatKW, po.condenserCleanUaKWPerK, cw);
  const reference = Math.max(target, Math.min(cleanRef, condensing));
  const qe = heatKW * ctx.refrigerationPerRejection;
  rates.condensingC = condensing;
  rates.referenceC = reference;
  rates.penaltyKW = Math.max(0, compressorPenaltyKW(ctx.compressor, qe, condensing, reference));
  rates.compressorKW = compressorPowerKW(ctx.compressor, qe, condensing, ctx.duty.condensingSetPointC);
  rates.unmet = ctx.duty.headPressureControl === "fixedSetPoint" ? !held : condensing > ctx.duty.condensingSetPointC + 1e-6;
  return rates;
}

/**
 * Run one option over the year with a given tower-side fouling per calendar month (m²·K/W; the
 * condenser tubes for the direct option, the exchanger plates for the plate option, unused by the cooler).
 */
export function simulateOptionYear(
  po: PreparedOption,
  ctx: YearContext,
  foulingByMonth: readonly number[],
  stride = 1,
): OptionYearTotals {
  const cl = ctx.climate;
  const acc: Accumulator = {
    monthly: Array.from({ length: 12 }, (_, i) => ({
      month: i + 1,
      hours: 0,
      heatRejectedKWh: 0,
      energyKWh: emptyEnergy(),
      waterM3: emptyWater(),
      peakDemandKW: 0,
      dryModeHours: 0,
      unmetHours: 0,
    })),
    byMonthHour: new Float64Array(288),
    heatKWh: 0,
    runningHours: 0,
    condSum: 0,
    refSum: 0,
    hottestSurfaceC: Number.NEGATIVE_INFINITY,
    compressorKWh: 0,
    peakRfM2KPerW: 0,
    wetHoursBelowFreezing: 0,
    minDryBulbC: Number.POSITIVE_INFINITY,
  };
  const meanRf = foulingByMonth.reduce((a, b) => a + b, 0) / 12;
  const cycles = ctx.cycles;
  const credit = ctx.water.sewerEvaporationCredit;
  const toM3PerH = 3600 / WATER_DENSITY_KG_PER_M3;
  const profile = ctx.duty.loadProfile;
  for (let i = 0; i < cl.count; i += stride) {
    const air = cl.air[i];
    if (!air) continue;
    const month = cl.month[i] ?? 0;
    const w = (cl.hours[i] ?? 0) * stride;
    const fraction =
      cl.kind === "hourly"
        ? hourLoadFraction(profile, month, cl.hour[i] ?? 0, air.dryBulbC)
        : binLoadFraction(profile, i, month > 0 ? month : undefined, air.dryBulbC);
    const heatKW = ctx.designHeatKW * fraction * ctx.loadFactor;
    const rf = month > 0 ? (foulingByMonth[month - 1] ?? 0) : meanRf;
    const r = evaluateRecord(po, ctx, air, heatKW, rf);
    const e = r.evaporationKgPerS * toM3PerH * w;
    const d = r.driftKgPerS * toM3PerH * w;
    const b = blowdown(e, cycles, d);
    const m = e + b + d;
    const sewer = sewerBilled(m, e, credit);
    const totalKW = r.fanKW + r.condenserPumpKW + r.secondaryPumpKW + r.sprayPumpKW + r.heaterKW + r.penaltyKW;
    if (r.running) {
      acc.runningHours += w;
      acc.condSum += r.condensingC * w;
      acc.refSum += r.referenceC * w;
      acc.compressorKWh += r.compressorKW * w;
      if (r.hottestSurfaceC > acc.hottestSurfaceC) acc.hottestSurfaceC = r.hottestSurfaceC;
    }
    acc.heatKWh += (r.running ? heatKW : 0) * w;
    if (w > 0 && air.dryBulbC < acc.minDryBulbC) acc.minDryBulbC = air.dryBulbC;
    if (r.running && !r.dry && air.dryBulbC < 0) acc.wetHoursBelowFreezing += w;
    // Spread over months: an hour or a monthly bin goes to its month; a bin without month pro rata by days.
    const shares = month > 0 ? null : DAYS_IN_MONTH;
    for (let mi = 0; mi < 12; mi++) {
      const share = shares ? (shares[mi] ?? 0) / 365 : mi === month - 1 ? 1 : 0;
      if (share === 0) continue;
      const mo = acc.monthly[mi];
      if (!mo) continue;
      const ws = w * share;
      mo.hours += ws;
      mo.heatRejectedKWh += (r.running ? heatKW : 0) * ws;
      const en = mo.energyKWh;
      en.fan += r.fanKW * ws;
      en.condenserPump += r.condenserPumpKW * ws;
      en.secondaryPump += r.secondaryPumpKW * ws;
      en.sprayPump += r.sprayPumpKW * ws;
      en.basinHeater += r.heaterKW * ws;
      en.compressorPenalty += r.penaltyKW * ws;
      en.total += totalKW * ws;
      const wa = mo.waterM3;
      wa.evaporation += e * share;
      wa.drift += d * share;
      wa.blowdown += b * share;
      wa.makeup += m * share;
      wa.sewerBilled += sewer * share;
      if (totalKW > mo.peakDemandKW) mo.peakDemandKW = totalKW;
      if (r.dry && r.running) mo.dryModeHours += ws;
      if (r.unmet) mo.unmetHours += ws;
      if (cl.kind === "hourly") {
        const idx = (month - 1) * 24 + (cl.hour[i] ?? 0);
        acc.byMonthHour[idx] = (acc.byMonthHour[idx] ?? 0) + totalKW * w;
      } else {
        const per = (totalKW * ws) / 24;
        for (let h = 0; h < 24; h++) acc.byMonthHour[mi * 24 + h] = (acc.byMonthHour[mi * 24 + h] ?? 0) + per;
      }
    }
  }
  return totalsFrom(acc);
}

/** Year totals of one option before the water chemistry and cleaning analysis are attached. */
export interface OptionYearTotals {
  monthly: MonthlyPhysics[];
  byMonthHour: number[];
  energyKWh: EnergyByComponentKWh;
  waterM3: WaterByComponentM3;
  heatRejectedKWh: number;
  hoursTotal: number;
  runningHours: number;
  dryModeHours: number;
  unmetHours: number;
  meanCondensingC: number;
  meanReferenceCondensingC: number;
  compressorKWh: number;
  hottestSurfaceC: number;
  wetHoursBelowFreezing: number;
  minDryBulbC: number;
}

function totalsFrom(acc: Accumulator): OptionYearTotals {
  const energy = emptyEnergy();
  const water = emptyWater();
  let hours = 0;
  let dry = 0;
  let unmet = 0;
  for (const mo of acc.monthly) {
    hours += mo.hours;
    dry += mo.dryModeHours;
    unmet += mo.unmetHours;
    for (const k of Object.keys(energy) as (keyof EnergyByComponentKWh)[]) energy[k] += mo.energyKWh[k];
    for (const k of Object.keys(water) as (keyof WaterByComponentM3)[]) water[k] += mo.waterM3[k];
  }
  return {
    monthly: acc.monthly,
    byMonthHour: Array.from(acc.byMonthHour),
    energyKWh: energy,
    waterM3: water,
    heatRejectedKWh: acc.heatKWh,
    hoursTotal: hours,
    runningHours: acc.runningHours,
    dryModeHours: dry,
    unmetHours: unmet,
    meanCondensingC: acc.runningHours > 0 ? acc.condSum / acc.runningHours : Number.NaN,
    meanReferenceCondensingC: acc.runningHours > 0 ? acc.refSum / acc.runningHours : Number.NaN,
    compressorKWh: acc.compressorKWh,
    hottestSurfaceC: acc.hottestSurfaceC,
    wetHoursBelowFreezing: acc.wetHoursBelowFreezing,
    minDryBulbC: acc.minDryBulbC,
  };
}

// ---------------------------------------------------------------------------------------------
// Scenario-level composition
// ---------------------------------------------------------------------------------------------

/** Build the compressor model from the duty. */
export function compressorModelFromDuty(duty: DutyInput): CompressorModel {
  if (duty.compressorModel.kind === "percentPerK") {
    return { kind: "percentPerK", percentPerK: duty.compressorModel.percentPerK, designCop: duty.designCop };
  }
  return {
    kind: "carnotFraction",
    carnotEfficiency: carnotEfficiency(duty.designCop, duty.condensingSetPointC, duty.evaporatingC),
    evaporatingK: duty.evaporatingC + 273.15,
  };
}

/** Growth law of the tower-water side from the scenario's fouling input. */
export function foulingGrowthFromInput(f: FoulingInput): FoulingGrowth {
  return f.model === "linear"
    ? { model: "linear", rateM2KPerWPerMonth: f.linearRateM2KPerWPerMonth }
    : { model: "asymptotic", asymptoticM2KPerW: f.asymptoticM2KPerW, timeConstantMonths: f.timeConstantMonths };
}

/** Cycles of concentration the scenario asks for (entered, or the chemistry limit). */
export function scenarioCycles(water: WaterInput): { cycles: number; limit: ReturnType<typeof maximumCyclesFromChemistry> } {
  const limit = maximumCyclesFromChemistry(water.makeup, water.limits);
  const cycles = water.cyclesMode === "entered" ? (water.cyclesOfConcentration ?? limit.cycles) : limit.cycles;
  return { cycles, limit };
}

export interface AnnualOptions {
  cyclesOverride?: number;
  foulingRateFactor?: number;
  loadFactor?: number;
  /** Flat electricity price for the cleaning-interval optimum (0 or undefined: not computed). */
  electricityPricePerKWh?: number;
  /** Cache of the energy cost per unit fouling (per option id, per load factor) across re-runs. */
  foulingCostCache?: Map<string, number>;
}

/**
 * All options over the year → OptionAnnualPhysics[]. Pure; the climate is prepared by the caller
 * (once per analysis) so what-if re-runs skip the psychrometrics of the weather.
 */
export function computeOptionsPhysics(
  prepared: PreparedOption[],
  climate: PreparedClimate,
  duty: DutyInput,
  water: WaterInput,
  fouling: FoulingInput,
  pPa: number,
  opts: AnnualOptions = {},
): OptionAnnualPhysics[] {
  const { cycles: baseCycles, limit } = scenarioCycles(water);
  const cycles = Math.max(opts.cyclesOverride ?? baseCycles, 1.05);
  const loadFactor = opts.loadFactor ?? 1;
  const ctx: YearContext = {
    pPa,
    climate,
    duty,
    designHeatKW: designHeatRejectionKW(duty),
    refrigerationPerRejection: designRefrigerationLoadKW(duty) / Math.max(designHeatRejectionKW(duty), 1e-9),
    compressor: compressorModelFromDuty(duty),
    water,
    cycles,
    loadFactor,
  };
  const baseGrowth = scaleGrowth(foulingGrowthFromInput(fouling), opts.foulingRateFactor ?? 1);
  return prepared.map((po) => {
    const o = po.input;
    const warnings: EngineWarning[] = [...po.warnings];
    const isDirect = o.kind === "openTowerDirect";
    const isPlate = o.kind === "openTowerPlateHx";
    const growth = isPlate ? scaleGrowth(baseGrowth, o.plateExchanger.foulingGrowthFactor) : baseGrowth;
    const intervalMonths = isDirect
      ? fouling.condenserCleaningIntervalMonths
      : isPlate
        ? fouling.plateExchangerCleaningIntervalMonths
        : 0;
    const monthlyRf = isDirect || isPlate ? monthlyFoulingM2KPerW(growth, intervalMonths) : new Array<number>(12).fill(0);
    const totals = simulateOptionYear(po, ctx, monthlyRf);

    let optimal: number | null = null;
    if ((isDirect || isPlate) && (opts.electricityPricePerKWh ?? 0) > 0) {
      const s = foulingCostPerMonthPerUnit(po, ctx, growth, intervalMonths, fouling, opts);
      optimal = optimalCleaningIntervalMonths(growth, o.costs.upkeep.cleaningCostPerEvent, s);
      if (optimal === null && o.costs.upkeep.cleaningCostPerEvent > 0 && s > 0) {
        warnings.push({
          code: "fouling.cleaningNeverPaysByEnergy",
          severity: "info",
          message: "With this asymptotic fouling the energy saved never repays a cleaning: clean on condition (inspection, eddy-current results) rather than on energy.",
          path: "fouling",
          optionId: o.id,
        });
      }
    }
    if ((isDirect || isPlate) && peakFoulingM2KPerW(growth, intervalMonths) > fouling.limitM2KPerW * (1 + 1e-6)) {
      warnings.push({
        code: "fouling.exceedsLimit",
        severity: "warning",
        message: `Fouling reaches ${sci(peakFoulingM2KPerW(growth, intervalMonths))} m²·K/W before each cleaning, above the limit of ${sci(fouling.limitM2KPerW)} m²·K/W: clean more often.`,
        path: isDirect ? "fouling.condenserCleaningIntervalMonths" : "fouling.plateExchangerCleaningIntervalMonths",
        optionId: o.id,
      });
    }
    return finishOption(po, totals, cycles, limit, water, intervalMonths, optimal, warnings, opts.cyclesOverride !== undefined);
  });
}

/**
 * Energy cost per month of one unit of tower-side fouling resistance (cost/(month·m²·K/W)), from
 * two extra (sub-sampled) years at constant fouling 0 and Rref: s = price·ΔkWh/(12·Rref). Cached per option and
 * load factor (the slope does not depend on cycles or on the fouling rate).
 */
function foulingCostPerMonthPerUnit(
  po: PreparedOption,
  ctx: YearContext,
  growth: FoulingGrowth,
  intervalMonths: number,
  fouling: FoulingInput,
  opts: AnnualOptions,
): number {
  const key = `${po.input.id}|${ctx.loadFactor}`;
  const cached = opts.foulingCostCache?.get(key);
  if (cached !== undefined) return cached;
  const sched = monthlyFoulingM2KPerW(growth, intervalMonths);
  let rRef = sched.reduce((a, b) => a + b, 0) / 12;
  if (!(rRef > 0)) rRef = fouling.limitM2KPerW > 0 ? fouling.limitM2KPerW : 1.76e-4;
  // Every 7th hour of an hourly year (weighted ×7; 7 and 24 share no factor, so every hour of the day
  // is sampled) is plenty for a year-average slope.
  const stride = ctx.climate.kind === "hourly" ? 7 : 1;
  const clean = simulateOptionYear(po, ctx, new Array<number>(12).fill(0), stride);
  const fouled = simulateOptionYear(po, ctx, new Array<number>(12).fill(rRef), stride);
  const s = ((opts.electricityPricePerKWh ?? 0) * (fouled.energyKWh.total - clean.energyKWh.total)) / (12 * rRef);
  opts.foulingCostCache?.set(key, s);
  return s;
}

function finishOption(
  po: PreparedOption,
  t: OptionYearTotals,
  cycles: number,
  limit: ReturnType<typeof maximumCyclesFromChemistry>,
  water: WaterInput,
  intervalMonths: number,
  optimal: number | null,
  warnings: EngineWarning[],
  cyclesOverridden: boolean,
): OptionAnnualPhysics {
  const o = po.input;
  const w = t.waterM3;
  const achieved = achievedCycles(w.evaporation, w.blowdown, w.drift);
  const reportedCycles = Number.isFinite(achieved) && w.makeup > 0 ? achieved : cycles;
  if (!cyclesOverridden && water.cyclesMode === "entered" && cycles > limit.cycles + 1e-9) {
    warnings.push({
      code: "water.cyclesBeyondChemistryLimit",
      severity: "warning",
      message: `${round1(cycles)} cycles exceed the ${round1(limit.cycles)} the makeup chemistry allows (${limit.limitingSpecies ?? "—"} limit): scale or corrosion risk unless the treatment programme supports it.`,
      path: "water.cyclesOfConcentration",
      optionId: o.id,
    });
  }
  if (w.makeup > 0 && achieved < cycles - 0.05) {
    warnings.push({
      code: "water.driftExceedsBlowdown",
      severity: "info",
      message: `Drift alone removes more water than the blowdown the cycles need in some hours: the loop achieves ${round1(achieved)} cycles instead of ${round1(cycles)}.`,
      path: `${po.path}.driftFractionOfFlow`,
      optionId: o.id,
    });
  }
  if (t.unmetHours > 0) {
    warnings.push({
      code: "loop.unmetHours",
      severity: "warning",
      message: `${Math.round(t.unmetHours)} h in which the loop could not hold the condensing set-point at full fan speed.`,
      path: `${po.path}`,
      optionId: o.id,
    });
  }
  if (t.wetHoursBelowFreezing > 0) {
    warnings.push({
      code: "caution.winterOperation",
      severity: "warning",
      message: `${Math.round(t.wetHoursBelowFreezing)} h of wet operation below 0 °C: icing of fill, louvres and basin, and freezing of exposed piping must be designed out (basin heat, bypass to the basin, fan de-icing, heat tracing) — follow the manufacturer and local codes.`,
      path: `${po.path}.basinHeater`,
      optionId: o.id,
    });
  }
  if (o.kind === "closedCircuitCooler" && Number.isFinite(t.minDryBulbC)) {
    const fp = freezingPointC(o.cooler.glycol.kind, o.cooler.glycol.massFraction);
    if (t.minDryBulbC < fp + 2) {
      warnings.push({
        code: "caution.coilFreeze",
        severity: "warning",
        message: `The outdoor air reaches ${round1(t.minDryBulbC)} °C and the coil fluid freezes near ${round1(fp)} °C: a coil that stands idle or loses flow can burst — use enough glycol, or keep flow and a minimum heat load, or drain the coil; follow the manufacturer.`,
        path: `${po.path}.cooler.glycol`,
        optionId: o.id,
      });
    }
  }
  // Scaling indices at the hottest wetted surface (tower fill inlet / wetted coil).
  const hottest = Number.isFinite(t.hottestSurfaceC) ? t.hottestSurfaceC : po.designHottestSurfaceC;
  const recirc = concentrated(water.makeup, cycles);
  const phs = saturationPh(hottest, recirc.tdsMgPerL, recirc.calciumHardnessMgPerLAsCaCO3, recirc.mAlkalinityMgPerLAsCaCO3);
  const lsi = langelierIndex(water.recirculatingPh, phs);
  const rsi = ryznarIndex(water.recirculatingPh, phs);
  // [practice] treated towers commonly run up to LSI ≈ 2.5 with a scale inhibitor; beyond that, or at a
  // Ryznar index below 4, scale control needs more than an inhibitor (acid feed, softening, fewer cycles).
  if (w.makeup > 0 && (lsi > 2.5 || rsi < 4)) {
    warnings.push({
      code: "water.scaleForming",
      severity: "info",
      message: `At ${round1(hottest)} °C and ${round1(cycles)} cycles the recirculating water is strongly scale-forming (LSI ${lsi.toFixed(2)}, RSI ${rsi.toFixed(2)}): the treatment programme must control it.`,
      path: "water",
      optionId: o.id,
    });
  }
  const outflow = w.blowdown + w.drift;
  const yearFraction = t.hoursTotal / 8760;
  const wetVolume = w.makeup > 0 ? po.wetLoopVolumeM3 : 0;
  const chem = chemicalQuantitiesKg(outflow, wetVolume, water.dosing.inhibitorMgPerLOutflow, water.dosing.biocideMgPerLSystemVolume, water.dosing.biocideSlugsPerYear, yearFraction);
  return {
    optionId: o.id,
    kind: o.kind,
    label: o.label,
    hoursTotal: t.hoursTotal,
    heatRejectedKWh: t.heatRejectedKWh,
    energyKWh: t.energyKWh,
    energyKWhByMonthHour: t.byMonthHour,
    waterM3: w,
    monthly: t.monthly,
    cyclesOfConcentration: reportedCycles,
    dryModeHours: t.dryModeHours,
    unmetHours: t.unmetHours,
    meanCondensingC: t.meanCondensingC,
    meanReferenceCondensingC: t.meanReferenceCondensingC,
    cleaningsPerYear: intervalMonths > 0 ? 12 / intervalMonths : 0,
    optimalCleaningIntervalMonths: optimal,
    chemicals: { treatedOutflowM3: outflow, systemVolumeM3: wetVolume, inhibitorKg: chem.inhibitorKg, biocideKg: chem.biocideKg },
    compressorEnergyKWh: t.compressorKWh,
    waterChemistry: {
      hottestWettedSurfaceC: hottest,
      saturationPh: phs,
      langelierIndex: lsi,
      ryznarIndex: rsi,
      cyclesLimitFromChemistry: limit.cycles,
      limitingSpecies: limit.limitingSpecies,
    },
    warnings,
  };
}

function round1(x: number): number {
  return Math.round(x * 10) / 10;
}
function sci(x: number): string {
  return x.toExponential(2);
}
