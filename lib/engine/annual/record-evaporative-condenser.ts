/**
 * One record of the evaporative-condenser option: the refrigerant condenses in the unit's coil, so the
 * device works on the condensing temperature directly (no condenser water, no lift). The modes the hour
 * allows (evaporative-condenser.ts, allowedEvaporativeCondenserModes) each run under the head-pressure
 * control as for the cooler (record-cooler.ts): fixed set-point — hold it or float at full speed;
 * floating — the fan speed minimising fan + compressor power (head-pressure.ts), or the cheapest lower
 * fan state for discrete controls. Where both modes are allowed the hour runs in the one with the lower
 * fan + spray pump + compressor power. The coil-exterior scale derate of the month applies to both.
 * The spray pump, drift and the hottest wetted surface (the coil at the condensing temperature) follow the
 * spray; with the spray off the basin heater holds the still basin at its set-point (record.ts), and
 * that heater power counts against the dry mode in the choice.
 */
import { type EnteringAir, evaporationKgPerS } from "../air-side";
import { compressorPowerKW, compressorPowerSlopeKWPerK } from "../compressor";
import {
  type EvaporativeCondenserModel,
  allowedEvaporativeCondenserModes,
  condensingTemperatureAtAirflowC,
  evaporativeCondenserAirflowForCondensing,
  solveEvaporativeCondenserModeHour,
} from "../evaporative-condenser";
import { fanPowerAtSpeedKW } from "../fans";
import { optimalFloatingCondensing } from "../head-pressure";
import type { YearContext } from "./context";
import type { PreparedOption } from "./options";
import { type DeviceRecord, type HourCondenser, type RecordRates, SET_POINT_TOLERANCE_K, lowerFanStates } from "./record-types";

interface ModeOutcome {
  wet: boolean;
  held: boolean;
  condensingC: number;
  airflowFraction: number;
  fanKW: number;
  evaporationKgPerS: number;
  totalKW: number;
}

export function evaporativeCondenserRecord(
  po: PreparedOption,
  model: EvaporativeCondenserModel,
  ctx: YearContext,
  air: EnteringAir,
  hour: HourCondenser,
  scaleDerate: number,
  stillBasinHeaterKW: number,
  rates: RecordRates,
): DeviceRecord & { cleanCondensingC: number } {
  const o = po.input;
  const modes = allowedEvaporativeCondenserModes(model, air.dryBulbC);
  let best: ModeOutcome | null = null;
  if (modes.dry) {
    // Dry, the basin holds still water (unless drained): its heater belongs to the dry mode's power.
    const dry = mode(po, model, ctx, air, hour, false, scaleDerate);
    best = { ...dry, totalKW: dry.totalKW + stillBasinHeaterKW };
  }
  if (modes.wet) {
    const wet = mode(po, model, ctx, air, hour, true, scaleDerate);
    // Ties go to dry: no water, no spray, no plume.
    if (!best || wet.totalKW < best.totalKW - 1e-9) best = wet;
  }
  const r = best ?? mode(po, model, ctx, air, hour, true, scaleDerate);
  rates.fanKW = r.fanKW;
  rates.evaporationKgPerS = r.evaporationKgPerS;
  rates.dry = !r.wet;
  if (r.wet) {
    rates.sprayPumpKW = po.sprayPumpKW;
    rates.driftKgPerS = o.driftFractionOfFlow * po.driftFlowKgPerS;
    rates.hottestSurfaceC = r.condensingC;
  } else {
    rates.heaterKW = stillBasinHeaterKW;
  }
  // Reference for the explanation only: a clean coil at the same airflow.
  const clean =
    scaleDerate > 0 ? condensingTemperatureAtAirflowC(model, air, hour.heatKW, Math.max(r.airflowFraction, 1e-3), r.wet, ctx.pPa, 0) : r.condensingC;
  return { held: r.held, condensingC: r.condensingC, leavingC: r.condensingC, cleanCondensingC: clean };
}

function mode(
  po: PreparedOption,
  model: EvaporativeCondenserModel,
  ctx: YearContext,
  air: EnteringAir,
  hour: HourCondenser,
  wet: boolean,
  derate: number,
): ModeOutcome {
  const heatKW = hour.heatKW;
  const qe = hour.refrigerationKW;
  const setC = ctx.duty.condensingSetPointC;
  const floating = ctx.duty.headPressureControl === "floating";
  const targetC = floating ? ctx.duty.minimumCondensingC : setC;
  const spray = wet ? po.sprayPumpKW : 0;
  const ma = model.designAirFlowKgPerS;
  const evapAt = (f: number): number => (wet ? evaporationKgPerS(heatKW, Math.max(f, 1e-3) * ma, ctx.pPa, air) : 0);
  const outcome = (held: boolean, condensingC: number, f: number, fanKW: number, evaporation: number): ModeOutcome => ({
    wet,
    held,
    condensingC,
    airflowFraction: f,
    fanKW,
    evaporationKgPerS: evaporation,
    totalKW: fanKW + spray + compressorPowerKW(ctx.compressor, qe, condensingC),
  });

  if (floating && po.fan.control === "variableSpeed") {
    const airflowAt = (tc: number) => evaporativeCondenserAirflowForCondensing(model, air, heatKW, tc, wet, ctx.pPa, derate);
    const slope = (tc: number) => compressorPowerSlopeKWPerK(ctx.compressor, qe, tc);
    const fMin = Math.max(po.fan.minSpeedFraction, po.fan.naturalDraftAirflowFraction);
    const a0 = airflowAt(targetC);
    if (a0.fraction <= fMin) {
      const r = solveEvaporativeCondenserModeHour(model, po.fan, air, heatKW, targetC, wet, ctx.pPa, derate);
      return outcome(true, targetC, r.airflowFraction, r.fanPowerKW, r.evaporationKgPerS);
    }
    let lowC = targetC;
    let atLow = a0;
    if (!(a0.fraction <= 1 + 1e-6)) {
      lowC = condensingTemperatureAtAirflowC(model, air, heatKW, 1, wet, ctx.pPa, derate);
      if (lowC >= setC) return outcome(false, lowC, 1, po.fan.designPowerKW, evapAt(1));
      // Full speed holds lowC by construction: the forward-difference slope from f = 1 there (the airflow
      // root at lowC itself may answer "none suffices" on round-off, with no slope).
      const above = airflowAt(lowC + 0.05).fraction;
      atLow = { fraction: 1, slopePerK: Number.isFinite(above) ? Math.min(0, (above - 1) / 0.05) : 0 };
    }
    const best = optimalFloatingCondensing(po.fan, lowC, setC, { airflowAt, compressorSlope: slope, slopeIsExact: false }, atLow);
    const f = Math.min(1, Math.max(best.airflow.fraction, fMin));
    return outcome(true, best.condensingC, f, fanPowerAtSpeedKW(po.fan, f), evapAt(f));
  }

  const hold = solveEvaporativeCondenserModeHour(model, po.fan, air, heatKW, targetC, wet, ctx.pPa, derate);
  let best = outcome(floating ? hold.condensingC <= setC + SET_POINT_TOLERANCE_K : hold.held, hold.condensingC, hold.airflowFraction, hold.fanPowerKW, hold.evaporationKgPerS);
  if (!floating) return best;
  for (const s of lowerFanStates(po, hold.airflowFraction)) {
    const tc = condensingTemperatureAtAirflowC(model, air, heatKW, s.airflowFraction, wet, ctx.pPa, derate);
    if (tc > setC + SET_POINT_TOLERANCE_K || tc < targetC) continue;
    const c = outcome(true, tc, s.airflowFraction, s.powerKW, evapAt(s.airflowFraction));
    if (c.totalKW < best.totalKW) best = c;
  }
  return best;
}
