/**
 * One record of the closed-circuit cooler option. The modes the hour allows (fluid-cooler.ts,
 * allowedCoolerModes: spray lock-out below its dry-bulb forces dry; a switch-over dry-bulb fixes the
 * mode; otherwise wet, and dry where allowed) are each run under the head-pressure control as for the
 * tower (record-tower.ts): fixed set-point — hold it or float at full speed; floating — the fan speed
 * minimising fan + compressor power. Where both modes are allowed, the hour runs in the one with the
 * lower fan + spray pump + compressor power. The spray pump, drift and the hottest wetted surface follow
 * the spray; with the spray off the basin heater holds the still basin at its set-point (record.ts),
 * and that heater power counts against the dry mode in the choice.
 */
import { type EnteringAir, evaporationKgPerS } from "../air-side";
import { type CompressorModel, compressorPowerKW, compressorPowerSlopeKWPerK } from "../compressor";
import { fanPowerAtSpeedKW } from "../fans";
import {
  type CoolerModel,
  allowedCoolerModes,
  coolerAirflowForLeavingFluid,
  coolerAirflowSlopeAtFullSpeedPerK,
  coolerLeavingFluidAtAirflowC,
  newCoolerHourResult,
  solveCoolerModeHour,
} from "../fluid-cooler";
import { type FloatingHour, optimalFloatingCondensing } from "../head-pressure";
import type { YearContext } from "./context";
import type { PreparedOption } from "./options";
import { type DeviceRecord, type HourCondenser, type RecordRates, SET_POINT_TOLERANCE_K, deviceRecord, lowerFanStates } from "./record-types";

interface ModeOutcome {
  wet: boolean;
  held: boolean;
  condensingC: number;
  fanKW: number;
  evaporationKgPerS: number;
  totalKW: number;
}

export function coolerRecord(
  po: PreparedOption,
  model: CoolerModel,
  ctx: YearContext,
  air: EnteringAir,
  hour: HourCondenser,
  stillBasinHeaterKW: number,
  rates: RecordRates,
): DeviceRecord {
  const o = po.input;
  const modes = allowedCoolerModes(model, air.dryBulbC);
  let best: ModeOutcome | null = null;
  if (modes.dry) {
    // Dry, the basin holds still water (unless drained): its heater belongs to the dry mode's power.
    const dry = coolerMode(po, model, ctx, air, hour, false, DRY_OUTCOME);
    dry.totalKW += stillBasinHeaterKW;
    best = dry;
  }
  if (modes.wet) {
    const wet = coolerMode(po, model, ctx, air, hour, true, WET_OUTCOME);
    // Ties go to dry: no water, no spray, no plume.
    if (!best || wet.totalKW < best.totalKW - 1e-9) best = wet;
  }
  const r = best ?? coolerMode(po, model, ctx, air, hour, true, WET_OUTCOME);
  const lift = hour.condenserLiftK;
  const leaving = r.condensingC - lift;
  rates.fanKW = r.fanKW;
  rates.evaporationKgPerS = r.evaporationKgPerS;
  rates.dry = !r.wet;
  if (r.wet) {
    rates.sprayPumpKW = po.sprayPumpKW;
    rates.driftKgPerS = o.driftFractionOfFlow * po.driftFlowKgPerS;
    rates.hottestSurfaceC = leaving + hour.heatKW / model.fluidCapacityKWPerK;
  } else {
    rates.heaterKW = stillBasinHeaterKW;
  }
  return deviceRecord(r.held, r.condensingC, leaving);
}

/**
 * The hour's outcome in each mode, and a lower fan state's under test (filled anew every record and read
 * within it: the engine is synchronous and never re-enters a record).
 */
const DRY_OUTCOME = newOutcome();
const WET_OUTCOME = newOutcome();
const CANDIDATE = newOutcome();
/** The hold (or full-speed) solve of a mode, read at once. */
const HOLD = newCoolerHourResult();

function newOutcome(): ModeOutcome {
  return { wet: false, held: false, condensingC: 0, fanKW: 0, evaporationKgPerS: 0, totalKW: 0 };
}

/** The hour in one mode under the head-pressure control, with its fan + spray + compressor power, into `into`. */
function coolerMode(po: PreparedOption, model: CoolerModel, ctx: YearContext, air: EnteringAir, hour: HourCondenser, wet: boolean, into: ModeOutcome): ModeOutcome {
  const heatKW = hour.heatKW;
  const qe = hour.refrigerationKW;
  const lift = hour.condenserLiftK;
  const setC = ctx.duty.condensingSetPointC;
  const floating = ctx.duty.headPressureControl === "floating";
  const targetC = floating ? ctx.duty.minimumCondensingC : setC;
  const spray = wet ? po.sprayPumpKW : 0;

  if (floating && po.fan.control === "variableSpeed") {
    const h = COOLER_HOUR;
    h.set(model, air, heatKW, lift, wet, ctx, qe);
    const fMin = Math.max(po.fan.minSpeedFraction, po.fan.naturalDraftAirflowFraction);
    const a0 = h.airflowAt(targetC);
    if (a0.fraction <= fMin) {
      const r = solveCoolerModeHour(model, po.fan, air, heatKW, targetC - lift, wet, ctx.pPa, HOLD);
      return outcome(into, ctx, qe, spray, wet, true, targetC, r.fanPowerKW, r.evaporationKgPerS);
    }
    let lowC = targetC;
    let atLow = a0;
    if (!(a0.fraction <= 1 + 1e-6)) {
      lowC = coolerLeavingFluidAtAirflowC(model, air, heatKW, 1, wet, ctx.pPa) + lift;
      if (lowC >= setC) return outcome(into, ctx, qe, spray, wet, false, lowC, po.fan.designPowerKW, sprayEvaporation(wet, heatKW, 1, model, ctx, air));
      atLow = { fraction: 1, slopePerK: coolerAirflowSlopeAtFullSpeedPerK(model, air, heatKW, lowC - lift, wet, ctx.pPa) };
    }
    const best = optimalFloatingCondensing(po.fan, lowC, setC, h, atLow);
    const f = Math.min(1, Math.max(best.airflow.fraction, fMin));
    return outcome(into, ctx, qe, spray, wet, true, best.condensingC, fanPowerAtSpeedKW(po.fan, f), sprayEvaporation(wet, heatKW, f, model, ctx, air));
  }

  const hold = solveCoolerModeHour(model, po.fan, air, heatKW, targetC - lift, wet, ctx.pPa, HOLD);
  const holdC = hold.held ? targetC : hold.leavingFluidC + lift;
  const best = outcome(into, ctx, qe, spray, wet, floating ? holdC <= setC + SET_POINT_TOLERANCE_K : hold.held, holdC, hold.fanPowerKW, hold.evaporationKgPerS);
  if (!floating) return best;
  for (const s of lowerFanStates(po, hold.airflowFraction)) {
    const tc = coolerLeavingFluidAtAirflowC(model, air, heatKW, s.airflowFraction, wet, ctx.pPa) + lift;
    if (tc > setC + SET_POINT_TOLERANCE_K || tc < targetC) continue;
    const c = outcome(CANDIDATE, ctx, qe, spray, wet, true, tc, s.powerKW, sprayEvaporation(wet, heatKW, s.airflowFraction, model, ctx, air));
    if (c.totalKW < best.totalKW) Object.assign(best, c);
  }
  return best;
}

function outcome(into: ModeOutcome, ctx: YearContext, qe: number, sprayKW: number, wet: boolean, held: boolean, condensingC: number, fanKW: number, evaporation: number): ModeOutcome {
  into.wet = wet;
  into.held = held;
  into.condensingC = condensingC;
  into.fanKW = fanKW;
  into.evaporationKgPerS = evaporation;
  into.totalKW = fanKW + sprayKW + compressorPowerKW(ctx.compressor, qe, condensingC);
  return into;
}

/** Spray evaporation at an airflow fraction (air-side balance); 0 dry. */
function sprayEvaporation(wet: boolean, heatKW: number, airflowFraction: number, model: CoolerModel, ctx: YearContext, air: EnteringAir): number {
  return wet ? evaporationKgPerS(heatKW, Math.max(airflowFraction, 1e-3) * model.designAirFlowKgPerS, ctx.pPa, air) : 0;
}

/** The cooler's hour in one mode as the floating-head search sees it: Tc = leaving fluid + lift. */
class CoolerFloatingHour implements FloatingHour {
  /** coolerAirflowForLeavingFluid's slope is the requirement's derivative, cs's drift with T included. */
  readonly slopeIsExact = true;
  private model!: CoolerModel;
  private air!: EnteringAir;
  private heatKW = 0;
  private liftK = 0;
  private wet = true;
  private pPa = 0;
  private compressor!: CompressorModel;
  private qe = 0;
  set(model: CoolerModel, air: EnteringAir, heatKW: number, liftK: number, wet: boolean, ctx: YearContext, qe: number): void {
    this.model = model;
    this.air = air;
    this.heatKW = heatKW;
    this.liftK = liftK;
    this.wet = wet;
    this.pPa = ctx.pPa;
    this.compressor = ctx.compressor;
    this.qe = qe;
  }
  airflowAt(condensingC: number) {
    return coolerAirflowForLeavingFluid(this.model, this.air, this.heatKW, condensingC - this.liftK, this.wet, this.pPa);
  }
  compressorSlope(condensingC: number): number {
    return compressorPowerSlopeKWPerK(this.compressor, this.qe, condensingC);
  }
}

/** One instance reused hour after hour (the engine is synchronous and never re-enters a record). */
const COOLER_HOUR = new CoolerFloatingHour();
