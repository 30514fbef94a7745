/**
 * One record of the closed-circuit cooler option. The modes the hour allows (fluid-cooler.ts,
 * allowedCoolerModes: spray lock-out below its dry-bulb forces dry; a switch-over dry-bulb fixes the
 * mode; otherwise wet, and dry where allowed) are each run under the head-pressure control as for the
 * tower (record-tower.ts): fixed set-point — hold it or float at full speed; floating — the fan speed
 * minimising fan + compressor power. Where both modes are allowed, the hour runs in the one with the
 * lower fan + spray pump + compressor power. The spray pump, drift and the hottest wetted surface follow
 * the spray; the basin heater runs when the spray is off below its dry-bulb.
 */
import { type EnteringAir, evaporationKgPerS } from "../air-side";
import { compressorPowerKW, compressorPowerSlopeKWPerK } from "../compressor";
import { fanPowerAtSpeedKW } from "../fans";
import {
  type CoolerModel,
  allowedCoolerModes,
  coolerAirflowForLeavingFluid,
  coolerLeavingFluidAtAirflowC,
  solveCoolerModeHour,
} from "../fluid-cooler";
import { optimalFloatingCondensing } from "../head-pressure";
import type { YearContext } from "./context";
import type { PreparedOption } from "./options";
import { type DeviceRecord, type HourCondenser, type RecordRates, SET_POINT_TOLERANCE_K, lowerFanStates } from "./record-types";

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
  heaterBelow: boolean,
  rates: RecordRates,
): DeviceRecord {
  const o = po.input;
  const modes = allowedCoolerModes(model, air.dryBulbC);
  let best: ModeOutcome | null = null;
  if (modes.dry) best = coolerMode(po, model, ctx, air, hour, false);
  if (modes.wet) {
    const wet = coolerMode(po, model, ctx, air, hour, true);
    // Ties go to dry: no water, no spray, no plume.
    if (!best || wet.totalKW < best.totalKW - 1e-9) best = wet;
  }
  const r = best ?? coolerMode(po, model, ctx, air, hour, true);
  const lift = hour.condenserLiftK;
  const leaving = r.condensingC - lift;
  rates.fanKW = r.fanKW;
  rates.evaporationKgPerS = r.evaporationKgPerS;
  rates.dry = !r.wet;
  if (r.wet) {
    rates.sprayPumpKW = po.sprayPumpKW;
    rates.driftKgPerS = o.driftFractionOfFlow * po.driftFlowKgPerS;
    rates.hottestSurfaceC = leaving + hour.heatKW / model.fluidCapacityKWPerK;
  } else if (heaterBelow) {
    rates.heaterKW = o.basinHeater.powerKW;
  }
  return { held: r.held, condensingC: r.condensingC, leavingC: leaving };
}

/** The hour in one mode under the head-pressure control, with its fan + spray + compressor power. */
function coolerMode(po: PreparedOption, model: CoolerModel, ctx: YearContext, air: EnteringAir, hour: HourCondenser, wet: boolean): ModeOutcome {
  const heatKW = hour.heatKW;
  const qe = hour.refrigerationKW;
  const lift = hour.condenserLiftK;
  const setC = ctx.duty.condensingSetPointC;
  const floating = ctx.duty.headPressureControl === "floating";
  const targetC = floating ? ctx.duty.minimumCondensingC : setC;
  const spray = wet ? po.sprayPumpKW : 0;
  const ma = model.designAirFlowKgPerS;
  const evapAt = (f: number): number => (wet ? evaporationKgPerS(heatKW, Math.max(f, 1e-3) * ma, ctx.pPa, air) : 0);
  const outcome = (held: boolean, condensingC: number, fanKW: number, evaporation: number): ModeOutcome => ({
    wet,
    held,
    condensingC,
    fanKW,
    evaporationKgPerS: evaporation,
    totalKW: fanKW + spray + compressorPowerKW(ctx.compressor, qe, condensingC),
  });

  if (floating && po.fan.control === "variableSpeed") {
    const airflowAt = (tc: number) => coolerAirflowForLeavingFluid(model, air, heatKW, tc - lift, wet, ctx.pPa);
    const slope = (tc: number) => compressorPowerSlopeKWPerK(ctx.compressor, qe, tc);
    const fMin = Math.max(po.fan.minSpeedFraction, po.fan.naturalDraftAirflowFraction);
    const a0 = airflowAt(targetC);
    if (a0.fraction <= fMin) {
      const r = solveCoolerModeHour(model, po.fan, air, heatKW, targetC - lift, wet, ctx.pPa);
      return outcome(true, targetC, r.fanPowerKW, r.evaporationKgPerS);
    }
    let lowC = targetC;
    let atLow = a0;
    if (!(a0.fraction <= 1 + 1e-6)) {
      lowC = coolerLeavingFluidAtAirflowC(model, air, heatKW, 1, wet, ctx.pPa) + lift;
      if (lowC >= setC) return outcome(false, lowC, po.fan.designPowerKW, evapAt(1));
      atLow = { fraction: 1, slopePerK: airflowAt(lowC).slopePerK };
    }
    const best = optimalFloatingCondensing(po.fan, lowC, setC, airflowAt, slope, atLow);
    const f = Math.min(1, Math.max(best.airflow.fraction, fMin));
    return outcome(true, best.condensingC, fanPowerAtSpeedKW(po.fan, f), evapAt(f));
  }

  const hold = solveCoolerModeHour(model, po.fan, air, heatKW, targetC - lift, wet, ctx.pPa);
  const holdC = hold.held ? targetC : hold.leavingFluidC + lift;
  let best = outcome(floating ? holdC <= setC + SET_POINT_TOLERANCE_K : hold.held, holdC, hold.fanPowerKW, hold.evaporationKgPerS);
  if (!floating) return best;
  for (const s of lowerFanStates(po, hold.airflowFraction)) {
    const tc = coolerLeavingFluidAtAirflowC(model, air, heatKW, s.airflowFraction, wet, ctx.pPa) + lift;
    if (tc > setC + SET_POINT_TOLERANCE_K || tc < targetC) continue;
    const c = outcome(true, tc, s.powerKW, evapAt(s.airflowFraction));
    if (c.totalKW < best.totalKW) best = c;
  }
  return best;
}
