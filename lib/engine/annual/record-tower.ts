/**
 * One record of a tower option (direct, or isolated by a plate exchanger), by head-pressure control:
 *
 * - fixed set-point: the fan control holds the cold water the set-point needs; where full speed cannot,
 *   the water floats and the condensing temperature rises above the set-point (the compressor pays).
 * - floating: variable speed — the condensing temperature between the minimum (or what full speed
 *   reaches) and the set-point that minimises fan + compressor power (head-pressure.ts); two-speed or
 *   cycling — the cheapest of holding the minimum (a time mix of states) and each lower fan state with
 *   its floating temperature (fan power and condensing temperature are both linear in the mix fraction,
 *   so the optimum is at a state or at the minimum).
 */
import { type EnteringAir, evaporationKgPerS } from "../air-side";
import { type CompressorModel, compressorPowerCurvatureKWPerK2, compressorPowerKW, compressorPowerSlopeKWPerK } from "../compressor";
import { fouledUaKWPerK } from "../condenser";
import { fanPowerAtSpeedKW } from "../fans";
import { type AirflowAtCondensing, type FloatingHour, optimalFloatingCondensing } from "../head-pressure";
import { plateExchangerApproachK } from "../plate-exchanger";
import { waterSpecificHeatKJPerKgK } from "../psychrometrics";
import {
  type TowerModel,
  newTowerHourResult,
  noteTowerFloated,
  solveTowerHour,
  towerAirflowForColdWater,
  towerColdWaterAtAirflowC,
  towerFloatedLastHour,
  towerFullSpeedColdWaterC,
} from "../tower";
import type { YearContext } from "./context";
import type { PreparedOption } from "./options";
import { type DeviceRecord, type HourCondenser, type RecordRates, SET_POINT_TOLERANCE_K, deviceRecord, lowerFanStates } from "./record-types";

export function towerRecord(
  po: PreparedOption,
  model: TowerModel,
  ctx: YearContext,
  air: EnteringAir,
  hour: HourCondenser,
  towerSideRf: number,
  rates: RecordRates,
): DeviceRecord {
  const heatKW = hour.heatKW;
  if (po.plate) {
    const uaHx = fouledUaKWPerK(po.plate.cleanUaKWPerK, po.plate.cleanUWPerM2K, towerSideRf);
    hour.approachK = plateExchangerApproachK(heatKW, uaHx, po.plate.hotCapacityKWPerK, po.plate.coldCapacityKWPerK);
  }
  // Tc = tower cold water + lift.
  const liftK = hour.condenserLiftK + hour.approachK;
  const rangeK = heatKW / (model.waterFlowKgPerS * waterSpecificHeatKJPerKgK);
  const setC = ctx.duty.condensingSetPointC;
  rates.driftKgPerS = po.input.driftFractionOfFlow * po.driftFlowKgPerS;
  const floating = ctx.duty.headPressureControl === "floating";
  const targetC = floating ? ctx.duty.minimumCondensingC : setC;

  if (floating && po.fan.control === "variableSpeed") {
    const qe = hour.refrigerationKW;
    const h = TOWER_HOUR;
    h.set(model, air, heatKW, liftK, ctx, qe);
    const fMin = Math.max(po.fan.minSpeedFraction, po.fan.naturalDraftAirflowFraction);
    const slope = { airflowSlopePerK: 0, airflowCurvaturePerK2: 0 };
    let lowC = targetC;
    let atLow: AirflowAtCondensing | undefined;
    // Hours when even full speed cannot reach the minimum come in runs: after such an hour, full speed's
    // temperature is solved first, and where it still lies above the minimum the minimum's own airflow solve
    // (which could only say "more than full speed") is skipped.
    if (towerFloatedLastHour(model)) {
      const fullC = towerFullSpeedColdWaterC(model, air, heatKW, ctx.pPa, targetC - liftK, slope) + liftK;
      if (fullC > targetC + 1e-3) {
        lowC = fullC;
        atLow = { fraction: 1, slopePerK: slope.airflowSlopePerK, curvaturePerK2: slope.airflowCurvaturePerK2 };
      }
    }
    if (atLow === undefined) {
      const a0 = h.airflowAt(targetC);
      if (a0.fraction <= fMin) {
        // Below the minimum speed the fan cycles to hold the minimum: nothing left to trade.
        noteTowerFloated(model, false);
        const r = solveTowerHour(model, po.fan, air, heatKW, targetC - liftK, ctx.pPa, HOLD);
        return finishTower(rates, liftK, rangeK, true, targetC, r.fanPowerKW, r.evaporationKgPerS);
      }
      atLow = a0;
      if (!(a0.fraction <= 1 + 1e-6)) {
        // Full speed starts where the minimum's requirement (a0: f, f′, f″) extrapolates to f = 1 when it is
        // finite (the minimum lies above the wet-bulb and pinch), else from the last full-speed approach.
        const start = Number.isFinite(a0.fraction) ? targetC - liftK + fullSpeedStepK(a0) : undefined;
        lowC = towerFullSpeedColdWaterC(model, air, heatKW, ctx.pPa, targetC - liftK, slope, start) + liftK;
        atLow = { fraction: 1, slopePerK: slope.airflowSlopePerK, curvaturePerK2: slope.airflowCurvaturePerK2 };
      }
    }
    noteTowerFloated(model, lowC > targetC);
    if (lowC > targetC && lowC >= setC) return finishTower(rates, liftK, rangeK, false, lowC, po.fan.designPowerKW, evaporationKgPerS(heatKW, model.designAirFlowKgPerS, ctx.pPa, air));
    const best = optimalFloatingCondensing(po.fan, lowC, setC, h, atLow);
    const f = Math.min(1, Math.max(best.airflow.fraction, fMin));
    return finishTower(rates, liftK, rangeK, true, best.condensingC, fanPowerAtSpeedKW(po.fan, f), evaporationKgPerS(heatKW, f * model.designAirFlowKgPerS, ctx.pPa, air));
  }

  const hold = solveTowerHour(model, po.fan, air, heatKW, targetC - liftK, ctx.pPa, HOLD);
  const holdC = hold.held ? targetC : hold.coldWaterC + liftK;
  if (!floating) return finishTower(rates, liftK, rangeK, hold.held, holdC, hold.fanPowerKW, hold.evaporationKgPerS);

  // Floating with a two-speed or cycling fan: compare holding (or full speed) with each lower state.
  const qe = hour.refrigerationKW;
  let bestC = holdC;
  let bestFan = hold.fanPowerKW;
  let bestEvap = hold.evaporationKgPerS;
  let bestTotal = bestFan + compressorPowerKW(ctx.compressor, qe, holdC);
  for (const s of lowerFanStates(po, hold.airflowFraction)) {
    const tc = towerColdWaterAtAirflowC(model, air, heatKW, s.airflowFraction, ctx.pPa, targetC - liftK) + liftK;
    if (tc > setC + SET_POINT_TOLERANCE_K || tc < targetC) continue;
    const total = s.powerKW + compressorPowerKW(ctx.compressor, qe, tc);
    if (total < bestTotal) {
      bestTotal = total;
      bestC = tc;
      bestFan = s.powerKW;
      bestEvap = evaporationKgPerS(heatKW, Math.max(s.airflowFraction, 1e-3) * model.designAirFlowKgPerS, ctx.pPa, air);
    }
  }
  return finishTower(rates, liftK, rangeK, bestC <= setC + SET_POINT_TOLERANCE_K, bestC, bestFan, bestEvap);
}

/**
 * The step in Tc from a requirement f > 1 (slope f′ < 0, curvature f″) to where the quadratic through it
 * reaches f = 1: the smaller positive root of f + f′·d + f″·d²/2 = 1 (the linear step where the quadratic
 * has none), kept within 0…15 K. A starting point only.
 */
function fullSpeedStepK(a: { fraction: number; slopePerK: number; curvaturePerK2?: number }): number {
  const g = a.fraction - 1;
  const b = a.slopePerK;
  const c = 0.5 * (a.curvaturePerK2 ?? 0);
  if (!(b < 0) || !(g > 0)) return 0;
  const linear = -g / b;
  const disc = b * b - 4 * c * g;
  const d = c !== 0 && disc >= 0 ? (-b - Math.sqrt(disc)) / (2 * c) : linear;
  const step = d > 0 && Number.isFinite(d) ? d : linear;
  return Math.min(15, Math.max(0, step));
}

function finishTower(rates: RecordRates, liftK: number, rangeK: number, held: boolean, condensingC: number, fanKW: number, evaporation: number): DeviceRecord {
  const cold = condensingC - liftK;
  rates.fanKW = fanKW;
  rates.evaporationKgPerS = evaporation;
  rates.hottestSurfaceC = cold + rangeK;
  return deviceRecord(held, condensingC, cold);
}

/** The tower's hour as the floating-head search sees it: Tc = cold water + lift. */
class TowerFloatingHour implements FloatingHour {
  /** towerAirflowForColdWater's slope is the implicit derivative of its L/G root (tower.ts). */
  readonly slopeIsExact = true;
  private model!: TowerModel;
  private air!: EnteringAir;
  private heatKW = 0;
  private liftK = 0;
  private pPa = 0;
  private compressor!: CompressorModel;
  private qe = 0;
  set(model: TowerModel, air: EnteringAir, heatKW: number, liftK: number, ctx: YearContext, qe: number): void {
    this.model = model;
    this.air = air;
    this.heatKW = heatKW;
    this.liftK = liftK;
    this.pPa = ctx.pPa;
    this.compressor = ctx.compressor;
    this.qe = qe;
    this.lastLg = model.designLiquidToGasRatio;
  }
  /** The previous evaluation's L/G: the search's evaluations lie within a few K of each other. */
  private lastLg = 1;
  airflowAt(condensingC: number) {
    const a = towerAirflowForColdWater(this.model, this.air, this.heatKW, condensingC - this.liftK, this.pPa, this.lastLg);
    if (a.liquidToGasRatio !== undefined) this.lastLg = a.liquidToGasRatio;
    return a;
  }
  compressorSlope(condensingC: number): number {
    return compressorPowerSlopeKWPerK(this.compressor, this.qe, condensingC);
  }
  compressorCurvature(condensingC: number): number {
    return compressorPowerCurvatureKWPerK2(this.compressor, this.qe, condensingC);
  }
}

/** One instance reused hour after hour (the engine is synchronous and never re-enters a record). */
const TOWER_HOUR = new TowerFloatingHour();

/** The hold (or full-speed) solve of the hour, read at once. */
const HOLD = newTowerHourResult();
