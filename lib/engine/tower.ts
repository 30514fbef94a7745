/**
 * Open (wet) counterflow cooling tower: Merkel's method with the CTI four-point Chebyshev rule.
 *
 * Demand (Merkel 1925): KaV/L = ∫ cpw·dT/(hs(T) − ha(T)) from the cold- to the hot-water temperature,
 * ha(T) = ha,in + (L/G)·cpw·(T − Tcold) (counterflow operating line), ha,in = hs(entering wet-bulb).
 * Four-point Chebyshev (CTI ATC-105): KaV/L ≈ (cpw·R/4)·Σ 1/(hs − ha) at Tcold + {0.1, 0.4, 0.6, 0.9}·R.
 * Supply (tower characteristic): KaV/L = C·(L/G)^−n, C calibrated at the manufacturer's design point.
 * Airflow is proportional to fan speed; water flow is constant (constant-speed condenser-water pumps).
 */
import { saturatedAirEnthalpyKJPerKg, waterSpecificHeatKJPerKgK } from "./psychrometrics";
import { type EnteringAir, evaporationKgPerS, tableSaturatedTemperatureC } from "./air-side";
import { type FanModel, fanOperationForRequiredAirflow, highStateTimeFraction } from "./fans";
import {
  saturatedEnthalpySlopeAndCurvature,
  saturatedEnthalpySlopeKJPerKgK,
} from "./saturation";
import { brentRoot, positivePower } from "./solvers";
import type { EngineWarning } from "./types";

const CPW = waterSpecificHeatKJPerKgK;
/**
 * Tolerance of a mix state's floating cold-water temperature: 0.01 K plus 2 % of its distance from the
 * requirement. The mix fraction x = (T_low − T_req)/(T_low − T_high) is insensitive to the far state.
 */
const MIX_STATE_TOLERANCE_K = 0.01;
const MIX_STATE_RELATIVE_TOLERANCE = 0.02;

/** Chebyshev abscissae of the CTI four-point rule, as fractions of the range. */
export const CHEBYSHEV_RANGE_FRACTIONS = [0.1, 0.4, 0.6, 0.9] as const;

/**
 * Merkel number (tower demand) by the CTI four-point Chebyshev rule, dimensionless.
 * KaV/L = (cpw·R/4)·Σᵢ 1/(hs(Tc + kᵢR) − ha,in − (L/G)·cpw·kᵢR), kᵢ ∈ {0.1, 0.4, 0.6, 0.9}.
 * Source: Merkel (1925); CTI ATC-105 (Chebyshev integration). Units: °C, K, kJ/kg, kJ/(kg·K).
 * Returns +∞ where the operating line reaches the saturation curve (no solution).
 */
export function merkelNumberChebyshev(
  coldWaterC: number,
  rangeK: number,
  liquidToGasRatio: number,
  enteringAirEnthalpyKJPerKg: number,
  pPa: number,
): number {
  let sum = 0;
  for (const k of CHEBYSHEV_RANGE_FRACTIONS) {
    const hs = saturatedAirEnthalpyKJPerKg(coldWaterC + k * rangeK, pPa);
    const drive = hs - enteringAirEnthalpyKJPerKg - liquidToGasRatio * CPW * k * rangeK;
    if (!(drive > 0)) return Number.POSITIVE_INFINITY;
    sum += 1 / drive;
  }
  return ((CPW * rangeK) / 4) * sum;
}

/**
 * The same Merkel integral by composite Simpson's rule with `intervals` (even) sub-intervals —
 * the fine reference the Chebyshev rule is tested against. Not for the inner loop.
 */
export function merkelNumberNumerical(
  coldWaterC: number,
  rangeK: number,
  liquidToGasRatio: number,
  enteringAirEnthalpyKJPerKg: number,
  pPa: number,
  intervals = 2000,
): number {
  const n = intervals % 2 === 0 ? intervals : intervals + 1;
  const h = rangeK / n;
  let sum = 0;
  for (let i = 0; i <= n; i++) {
    const dt = i * h;
    const drive =
      saturatedAirEnthalpyKJPerKg(coldWaterC + dt, pPa) - enteringAirEnthalpyKJPerKg - liquidToGasRatio * CPW * dt;
    if (!(drive > 0)) return Number.POSITIVE_INFINITY;
    const weight = i === 0 || i === n ? 1 : i % 2 === 1 ? 4 : 2;
    sum += weight / drive;
  }
  return ((CPW * h) / 3) * sum;
}

/**
 * Tower characteristic (supply): KaV/L = C·(L/G)^−n. Source: CTI ATC-105 / Merkel practice;
 * n ≈ 0.5–0.8 [practice].
 */
export function towerCharacteristicMerkel(coefficientC: number, exponentN: number, liquidToGasRatio: number): number {
  return coefficientC * positivePower(liquidToGasRatio, -exponentN);
}

/** The manufacturer's design point of a tower selection. */
export interface TowerSelection {
  waterFlowKgPerS: number;
  enteringWaterC: number;
  leavingWaterC: number;
  designWetBulbC: number;
  /** L/G at design (the selection rarely states the airflow; 0.75–1.5 for counterflow [practice]). */
  designLiquidToGasRatio: number;
  characteristicExponent: number;
}

/** A tower calibrated on its design point. */
export interface TowerModel {
  waterFlowKgPerS: number;
  designAirFlowKgPerS: number;
  designLiquidToGasRatio: number;
  coefficientC: number;
  exponentN: number;
  designMerkel: number;
  designRangeK: number;
  designApproachK: number;
}

/**
 * Calibrate the tower characteristic C on the design point: C = (KaV/L)design·(L/G)design^n, with the
 * design demand from the Chebyshev rule at the design wet-bulb, range and approach.
 * Where the stated L/G puts the operating line through the saturation curve it is lowered to 90 %
 * of the pinch value (with a warning): a design point is always feasible at some airflow.
 */
export function calibrateTower(
  selection: TowerSelection,
  pPa: number,
  path: string,
): { model: TowerModel; warnings: EngineWarning[] } {
  const warnings: EngineWarning[] = [];
  const rangeK = selection.enteringWaterC - selection.leavingWaterC;
  const haIn = saturatedAirEnthalpyKJPerKg(selection.designWetBulbC, pPa);
  let lg = selection.designLiquidToGasRatio;
  let demand = merkelNumberChebyshev(selection.leavingWaterC, rangeK, lg, haIn, pPa);
  if (!Number.isFinite(demand)) {
    const lgPinch = pinchLiquidToGasRatio(selection.leavingWaterC, rangeK, haIn, pPa);
    lg = 0.9 * lgPinch;
    demand = merkelNumberChebyshev(selection.leavingWaterC, rangeK, lg, haIn, pPa);
    warnings.push({
      code: "tower.designLiquidToGasInfeasible",
      severity: "warning",
      message: `At the design point the stated L/G of ${selection.designLiquidToGasRatio} would saturate the air before it leaves; L/G ${round3(lg)} (90 % of the limit) was used instead.`,
      path: `${path}.designLiquidToGasRatio`,
    });
  }
  const model: TowerModel = {
    waterFlowKgPerS: selection.waterFlowKgPerS,
    designAirFlowKgPerS: selection.waterFlowKgPerS / lg,
    designLiquidToGasRatio: lg,
    coefficientC: demand * Math.pow(lg, selection.characteristicExponent),
    exponentN: selection.characteristicExponent,
    designMerkel: demand,
    designRangeK: rangeK,
    designApproachK: selection.leavingWaterC - selection.designWetBulbC,
  };
  return { model, warnings };
}

/** Largest L/G for which the four Chebyshev driving forces stay positive. */
function pinchLiquidToGasRatio(coldWaterC: number, rangeK: number, haIn: number, pPa: number): number {
  let lgMax = Number.POSITIVE_INFINITY;
  for (const k of CHEBYSHEV_RANGE_FRACTIONS) {
    const hs = saturatedAirEnthalpyKJPerKg(coldWaterC + k * rangeK, pPa);
    lgMax = Math.min(lgMax, (hs - haIn) / (CPW * k * rangeK));
  }
  return lgMax;
}

/**
 * L/G at which a tower with characteristic C·(L/G)^−n delivers a given cold-water temperature at a
 * given range, from the four saturated enthalpies hs(Tc + kᵢR) (fixed once Tc and R are fixed):
 * solve (cpw·R/4)·Σ 1/(hsᵢ − ha,in − (L/G)·cpw·kᵢR) = C·(L/G)^−n, a monotone 1-D root in ln(L/G)
 * (safeguarded Halley steps on 1/demand − 1/supply) that needs no further saturated-enthalpy evaluation. Returns 0 when no airflow can do it
 * (cold water at or below the wet-bulb).
 */
export function requiredLiquidToGasRatio(
  saturatedEnthalpiesKJPerKg: readonly number[],
  enteringAirEnthalpyKJPerKg: number,
  rangeK: number,
  coefficientC: number,
  exponentN: number,
  guessLiquidToGasRatio = 1,
): number {
  const a0 = saturatedEnthalpiesKJPerKg[0] ?? 0;
  const a1 = saturatedEnthalpiesKJPerKg[1] ?? 0;
  const a2 = saturatedEnthalpiesKJPerKg[2] ?? 0;
  const a3 = saturatedEnthalpiesKJPerKg[3] ?? 0;
  const d0 = a0 - enteringAirEnthalpyKJPerKg;
  const d1 = a1 - enteringAirEnthalpyKJPerKg;
  const d2 = a2 - enteringAirEnthalpyKJPerKg;
  const d3 = a3 - enteringAirEnthalpyKJPerKg;
  if (!(d0 > 0 && d1 > 0 && d2 > 0 && d3 > 0)) return 0;
  const c = CPW * rangeK;
  // Slopes of the four driving forces with L/G: drive_i = d_i − L/G·cpw·k_i·R.
  const s0 = 0.1 * c;
  const s1 = 0.4 * c;
  const s2 = 0.6 * c;
  const s3 = 0.9 * c;
  const lgMax = Math.min(d0 / s0, d1 / s1, d2 / s2, d3 / s3);
  // ψ(L/G) = 1/demand − 1/supply: 1/demand falls almost linearly to 0 at the pinch, 1/supply =
  // (L/G)^n/C is concave, so ψ is smooth, convex and decreasing; bracketed Halley steps converge in a few.
  let lo = 0;
  let hi = lgMax;
  const k4 = 4 / c;
  let psiLo = k4 / (1 / d0 + 1 / d1 + 1 / d2 + 1 / d3);
  // ψ at the bracket's high end, only if a secant step needs it before a Newton iterate lands above the root.
  let psiHi = Number.NaN;
  let lg = guessLiquidToGasRatio > 0 && guessLiquidToGasRatio < lgMax ? guessLiquidToGasRatio : 0.5 * lgMax;
  for (let iter = 0; iter < 60; iter++) {
    const i0 = 1 / (d0 - lg * s0);
    const i1 = 1 / (d1 - lg * s1);
    const i2 = 1 / (d2 - lg * s2);
    const i3 = 1 / (d3 - lg * s3);
    const sum = i0 + i1 + i2 + i3;
    const dsum = s0 * i0 * i0 + s1 * i1 * i1 + s2 * i2 * i2 + s3 * i3 * i3;
    const d2sum = 2 * (s0 * s0 * i0 * i0 * i0 + s1 * s1 * i1 * i1 * i1 + s2 * s2 * i2 * i2 * i2 + s3 * s3 * i3 * i3 * i3);
    const lgn = positivePower(lg, exponentN);
    const psi = k4 / sum - lgn / coefficientC;
    if (psi > 0) {
      lo = lg;
      psiLo = psi;
    } else {
      hi = lg;
      psiHi = psi;
    }
    const dpsi = (-k4 * dsum) / (sum * sum) - (exponentN * lgn) / (lg * coefficientC);
    // Halley's step: ψ″ = (4/(cpw·R))·(2(Σsᵢ/rᵢ²)²/Σ³ − Σ(2sᵢ²/rᵢ³)/Σ²) − n(n − 1)(L/G)^(n−2)/C, Σ = Σ1/rᵢ.
    const d2psi = k4 * ((2 * dsum * dsum) / (sum * sum * sum) - d2sum / (sum * sum)) - (exponentN * (exponentN - 1) * lgn) / (lg * lg * coefficientC);
    const step = -psi / dpsi;
    const halleyDenominator = 2 * dpsi * dpsi - psi * d2psi;
    let next = halleyDenominator > dpsi * dpsi ? lg - (2 * psi * dpsi) / halleyDenominator : lg + step;
    // Converged when the Newton step, or the error the step taken leaves, is below 1e−10 of L/G: with
    // c = |ψ″/(2ψ′)|, a Newton step s leaves about c·s², Halley's about c²·|s|³ (third order).
    const c2 = Math.abs(d2psi / (2 * dpsi));
    const left = halleyDenominator > dpsi * dpsi ? c2 * c2 * Math.abs(step) * step * step : c2 * step * step;
    if (psi === 0 || Math.abs(step) < 1e-10 * lg || left < 1e-10 * lg) return next;
    // Outside the bracket: a secant step between its ends (bisection only if that degenerates).
    if (!(next > lo && next < hi) && Number.isNaN(psiHi)) psiHi = -positivePower(hi, exponentN) / coefficientC;
    if (!(next > lo && next < hi)) next = lo + (psiLo * (hi - lo)) / (psiLo - psiHi);
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    lg = next;
  }
  return lg;
}

/**
 * The tower characteristic C·(L/G)^−n of the last two L/G values asked for, per tower: the floating solves of a
 * fan mix ask for the same two fan states hour after hour (the same number, computed once).
 */
const SUPPLY_MEMO = { model: null as TowerModel | null, lg: [Number.NaN, Number.NaN], supply: [0, 0], next: 0 };

function supplyAtLiquidToGas(model: TowerModel, lg: number): number {
  const m = SUPPLY_MEMO;
  if (m.model === model) {
    if (m.lg[0] === lg) return m.supply[0] ?? 0;
    if (m.lg[1] === lg) return m.supply[1] ?? 0;
  } else {
    m.model = model;
    m.lg[0] = Number.NaN;
    m.lg[1] = Number.NaN;
  }
  const supply = towerCharacteristicMerkel(model.coefficientC, model.exponentN, lg);
  m.lg[m.next] = lg;
  m.supply[m.next] = supply;
  m.next = 1 - m.next;
  return supply;
}

/**
 * Cold-water temperature the tower delivers at a given airflow (floating, not controlled), °C:
 * the Tc where Chebyshev demand equals the characteristic, found by bracketed Halley steps on
 * ρ = 1/demand − 1/supply with the analytic slope and curvature of hs (Newton where Halley's denominator
 * is not safely positive). 4 saturated-enthalpy evaluations per iteration; `guessC` (e.g. the set-point)
 * speeds it up. Converged when the Newton step is within the tolerance, or — without `slopeOut` — when the
 * error the step leaves, |ρ″/(2ρ′)|·s², is.
 * `slopeOut` receives d(required airflow fraction)/dT at the solution (towerAirflowForColdWater's slope,
 * from the last iterate's saturated enthalpies: no further evaluation).
 */
export function towerColdWaterAtAirflowC(
  model: TowerModel,
  air: EnteringAir,
  heatKW: number,
  airflowFraction: number,
  pPa: number,
  guessC?: number,
  known?: { tC: number; saturatedEnthalpiesKJPerKg: readonly number[] },
  toleranceK = 2e-4,
  relativeTolerance = 0,
  slopeOut?: { airflowSlopePerK: number; airflowCurvaturePerK2?: number },
  startC?: number,
): number {
  const rangeK = heatKW / (model.waterFlowKgPerS * CPW);
  const lg = model.waterFlowKgPerS / (model.designAirFlowKgPerS * Math.max(airflowFraction, 1e-3));
  const supply = supplyAtLiquidToGas(model, lg);
  const haIn = air.enthalpyKJPerKg;
  // Lowest feasible Tc (operating line touching the saturation curve at a Chebyshev point), from the
  // saturation table: hs(Tc + kR) = ha,in + (L/G)·cpw·kR. There 1/demand = 0; the binding point's
  // slope gives a first estimate of the root without evaluating hs.
  // A known point (e.g. the requirement's four hs) lies above the pinch when its four driving forces are
  // positive: then it starts the search, its first pass brackets the root, and the pinch is not needed.
  let knownUsable = known !== undefined && known.tC > air.wetBulbC + 1e-3;
  for (let i = 0; knownUsable && known !== undefined && i < 4; i++) {
    const k = CHEBYSHEV_RANGE_FRACTIONS[i] ?? 0;
    if (!((known.saturatedEnthalpiesKJPerKg[i] ?? 0) - haIn - lg * CPW * k * rangeK > 0)) knownUsable = false;
  }
  let pinchC = air.wetBulbC + 1e-3;
  let pinchSlope = 0;
  for (let i = 0; !knownUsable && i < 4; i++) {
    const k = CHEBYSHEV_RANGE_FRACTIONS[i] ?? 0;
    const target = haIn + lg * CPW * k * rangeK;
    const tk = tableSaturatedTemperatureC(air.table, target);
    if (Number.isFinite(tk) && tk - k * rangeK > pinchC) {
      pinchC = tk - k * rangeK;
      pinchSlope = saturatedEnthalpySlopeKJPerKgK(tk, target);
    }
  }
  const floorC = pinchC;
  const start = knownUsable ? known : undefined;
  let t: number;
  if (start) t = start.tC;
  else if (startC !== undefined && startC > floorC + 1e-3) t = startC;
  else if (pinchSlope > 0) t = pinchC + ((CPW * rangeK) / 4) * (pinchSlope > 0 ? 1 / (supply * pinchSlope) : 0);
  else t = Math.max(guessC ?? air.wetBulbC + model.designApproachK, floorC + 1e-3);
  // The per-point values the airflow's curvature needs, kept only when it is asked for.
  const keepPoints = slopeOut?.airflowCurvaturePerK2 !== undefined;
  let lo = floorC; // residual < 0 side (too cold)
  let hi = Number.POSITIVE_INFINITY; // residual > 0 side
  for (let iter = 0; iter < 40; iter++) {
    let sum = 0;
    let dsum = 0;
    let d2sum = 0;
    let lsum = 0;
    let feasible = true;
    const reuse = iter === 0 && start !== undefined && start.tC === t;
    for (let i = 0; i < 4; i++) {
      const k = CHEBYSHEV_RANGE_FRACTIONS[i] ?? 0;
      const tk = t + k * rangeK;
      const hs = reuse ? (start.saturatedEnthalpiesKJPerKg[i] ?? 0) : saturatedAirEnthalpyKJPerKg(tk, pPa);
      const drive = hs - haIn - lg * CPW * k * rangeK;
      if (!(drive > 0)) {
        feasible = false;
        break;
      }
      const inv = 1 / drive;
      saturatedEnthalpySlopeAndCurvature(tk, hs, HS_SHAPE);
      const slope = HS_SHAPE.slope;
      if (keepPoints) {
        POINT_INV[i] = inv;
        POINT_SLOPE[i] = slope;
        POINT_CURVATURE[i] = HS_SHAPE.curvature;
      }
      sum += inv;
      dsum += slope * inv * inv;
      d2sum += (HS_SHAPE.curvature - 2 * slope * slope * inv) * inv * inv;
      lsum += CPW * k * rangeK * inv * inv;
    }
    if (!feasible) {
      lo = Math.max(lo, t);
      t = Number.isFinite(hi) ? 0.5 * (lo + hi) : t + Math.max(2, rangeK);
      continue;
    }
    // Residual in 1/KaV/L: the harmonic-mean driving force is nearly linear in Tc, so Newton on
    // ρ = 1/demand − 1/supply converges in two or three steps.
    const demand = ((CPW * rangeK) / 4) * sum;
    const rho = 1 / demand - 1 / supply;
    if (rho < 0) lo = Math.max(lo, t);
    else hi = Math.min(hi, t);
    const dRho = (((CPW * rangeK) / 4) * dsum) / (demand * demand);
    const newton = t - rho / dRho;
    // Halley's step with ρ″ = (4/(cpw·R))·(Σ(hs″ᵢ/rᵢ² − 2hs′ᵢ²/rᵢ³)/Σ² + 2(Σhs′ᵢ/rᵢ²)²/Σ³), Σ = Σ1/rᵢ
    // (hs″ analytic, no further evaluation).
    const d2Rho = ((4 / (CPW * rangeK)) * (d2sum + (2 * dsum * dsum) / sum)) / (sum * sum);
    const halleyDenominator = 2 * dRho * dRho - rho * d2Rho;
    const halley = halleyDenominator > dRho * dRho;
    let next = halley ? t - (2 * rho * dRho) / halleyDenominator : newton;
    const tol = toleranceK + (guessC !== undefined ? relativeTolerance * Math.abs(newton - guessC) : 0);
    // Converged when the step itself is within the tolerance, or when the error left after it is: a Newton
    // step s from t leaves ≈ |ρ″/(2ρ′)|·s² (Halley's less, third order), so a state a few K from its start
    // needs one evaluation near the root instead of two. With a slope to report, only a step under 0.02 K is
    // taken so: the slope and curvature reported are those at t, within about 0.1 % of the answer's.
    const step = newton - t;
    const leftK = halley && (!slopeOut || Math.abs(step) < 0.02) ? Math.abs(d2Rho / (2 * dRho)) * step * step : Number.POSITIVE_INFINITY;
    if (rho === 0 || Math.abs(step) < tol || leftK < tol) {
      if (slopeOut) {
        // d(airflow fraction)/dT of the requirement at this temperature (see towerAirflowForColdWater).
        const k4 = 4 / (CPW * rangeK);
        const psiT = (k4 * dsum) / (sum * sum);
        const lgn1 = positivePower(lg, model.exponentN - 1);
        const psiL = (-k4 * lsum) / (sum * sum) - (model.exponentN * lgn1) / model.coefficientC;
        const fraction = Math.max(airflowFraction, 1e-3);
        slopeOut.airflowSlopePerK = (-fraction / lg) * (-psiT / psiL);
        if (slopeOut.airflowCurvaturePerK2 !== undefined) {
          slopeOut.airflowCurvaturePerK2 = airflowCurvatureFromPoints(model, fraction, lg, lgn1, rangeK, sum, dsum, lsum, psiT, psiL);
        }
      }
      return Math.max(next, floorC);
    }
    if (!(next > lo && next < hi)) next = Number.isFinite(hi) ? 0.5 * (lo + hi) : t + Math.max(2, rangeK);
    t = next;
  }
  return Math.max(t, floorC);
}

/**
 * Heat the tower rejects with a given hot (entering) water temperature, wet-bulb and airflow, kW:
 * the range R where demand(Tc = Th − R, R) = supply, Q = L·cpw·R. Used to check monotonicity
 * (capacity falls as wet-bulb rises and as fan speed falls); not used in the annual loop.
 */
export function towerCapacityKW(
  model: TowerModel,
  hotWaterC: number,
  air: EnteringAir,
  airflowFraction: number,
  pPa: number,
): number {
  const maxRange = hotWaterC - air.wetBulbC;
  if (!(maxRange > 0)) return 0;
  const lg = model.waterFlowKgPerS / (model.designAirFlowKgPerS * Math.max(airflowFraction, 1e-3));
  const supply = towerCharacteristicMerkel(model.coefficientC, model.exponentN, lg);
  const res = (rangeK: number): number => {
    const d = merkelNumberChebyshev(hotWaterC - rangeK, rangeK, lg, air.enthalpyKJPerKg, pPa);
    return Number.isFinite(d) ? d - supply : 1e6;
  };
  const lo = 1e-6 * maxRange;
  const hi = maxRange * (1 - 1e-6);
  const fLo = res(lo);
  const fHi = res(hi);
  if (fLo > 0) return 0;
  if (fHi < 0) return model.waterFlowKgPerS * CPW * hi;
  return model.waterFlowKgPerS * CPW * brentRoot(res, lo, hi, fLo, fHi, 1e-9);
}

/** One hour (or bin) of tower operation. Rates are hour averages. */
export interface TowerHourResult {
  /** The cold-water temperature was held at the required value (false: floated above it at full fan). */
  held: boolean;
  /** Time-averaged cold-water temperature leaving the tower, °C. */
  coldWaterC: number;
  hotWaterC: number;
  /** Time-averaged airflow fraction. */
  airflowFraction: number;
  fanPowerKW: number;
  evaporationKgPerS: number;
}

/** Scratch of `towerColdWaterAtAirflowC`: the slope and curvature of hs at one Chebyshev point. */
const HS_SHAPE = { slope: 0, curvature: 0 };

/** Scratch of `solveTowerHour`: the four hs at the requirement (read only within the call; the engine never re-enters). */
const HOLD_HS = [0, 0, 0, 0];
const HOLD_KNOWN = { tC: 0, saturatedEnthalpiesKJPerKg: HOLD_HS };

/** The last L/G `solveTowerHour` found, and for which tower (a starting point, never a result). */
let lastLgModel: TowerModel | null = null;
let lastLg = 1;

/** Forget the warm start (see `resetCoolerWarmStarts`: same inputs, same numbers to the last bit). */
export function resetTowerWarmStart(): void {
  lastLgModel = null;
  lastLg = 1;
  fullSpeedMemo.model = null;
  floatedMemo.model = null;
}

/** Whether a tower's last floating-head hour floated at full speed above the minimum (a hint for the next hour's order of solves, never a result). */
const floatedMemo: { model: TowerModel | null; floated: boolean } = { model: null, floated: false };

/** The tower's last floating-head hour floated at full speed, above the minimum condensing temperature. */
export function towerFloatedLastHour(model: TowerModel): boolean {
  return floatedMemo.model === model && floatedMemo.floated;
}

/** Note whether this hour floated at full speed above the minimum (see `towerFloatedLastHour`). */
export function noteTowerFloated(model: TowerModel, floated: boolean): void {
  floatedMemo.model = model;
  floatedMemo.floated = floated;
}

/** The last full-speed floating solve's approach to the wet-bulb per kW of heat, per tower (a starting point, never a result). */
const fullSpeedMemo: { model: TowerModel | null; approachPerKW: number } = { model: null, approachPerKW: 0 };

/**
 * Cold water the tower delivers at full speed (floating), °C, with the requirement's slope and curvature
 * there in `slopeOut` — `towerColdWaterAtAirflowC` at f = 1, started from `startC` when given, else from the
 * approach per kW of the last such solve of this tower (the approach at full speed grows about in
 * proportion to the heat, and changes little from one hour to the next).
 */
export function towerFullSpeedColdWaterC(
  model: TowerModel,
  air: EnteringAir,
  heatKW: number,
  pPa: number,
  guessC: number,
  slopeOut: { airflowSlopePerK: number; airflowCurvaturePerK2?: number },
  startC?: number,
): number {
  const start = startC ?? (fullSpeedMemo.model === model ? air.wetBulbC + fullSpeedMemo.approachPerKW * heatKW : undefined);
  const t = towerColdWaterAtAirflowC(model, air, heatKW, 1, pPa, guessC, undefined, 2e-4, 0, slopeOut, start);
  if (heatKW > 0 && Number.isFinite(t)) {
    fullSpeedMemo.model = model;
    fullSpeedMemo.approachPerKW = (t - air.wetBulbC) / heatKW;
  }
  return t;
}

/**
 * Operate the tower for one hour: hold the required cold-water temperature with the installed fan
 * control, or float at full speed when it cannot.
 * 1. With Tc fixed at the requirement the four hs values are fixed: solve L/G (cheap 1-D root) →
 *    required airflow fraction f = (L/(L/G))/Gdesign.
 * 2. The fan control maps f to a continuous speed or a time mix of two states (mix fraction by the
 *    states' floating cold-water temperatures); f > 1 → full speed, floating Tc (Newton).
 * 3. Evaporation E = G·(Wout − Win) for each state (exit air saturated at ha,in + Q/G).
 */
export function solveTowerHour(
  model: TowerModel,
  fan: FanModel,
  air: EnteringAir,
  heatKW: number,
  requiredColdWaterC: number,
  pPa: number,
  into?: TowerHourResult,
): TowerHourResult {
  const r = into ?? newTowerHourResult();
  if (!(heatKW > 0)) return towerHour(r, true, requiredColdWaterC, requiredColdWaterC, 0, 0, 0);
  const rangeK = heatKW / (model.waterFlowKgPerS * CPW);
  let requiredFraction = Number.POSITIVE_INFINITY;
  const hs = HOLD_HS;
  let haveHs = false;
  if (requiredColdWaterC > air.wetBulbC) {
    haveHs = true;
    for (let i = 0; i < 4; i++) {
      hs[i] = saturatedAirEnthalpyKJPerKg(requiredColdWaterC + (CHEBYSHEV_RANGE_FRACTIONS[i] ?? 0) * rangeK, pPa);
    }
    // Warm start: the previous hour's L/G of the same tower (the year runs one option at a time).
    const guess = lastLgModel === model ? lastLg : model.designLiquidToGasRatio;
    const lg = requiredLiquidToGasRatio(hs, air.enthalpyKJPerKg, rangeK, model.coefficientC, model.exponentN, guess);
    if (lg > 0) {
      requiredFraction = model.waterFlowKgPerS / lg / model.designAirFlowKgPerS;
      lastLgModel = model;
      lastLg = lg;
    }
  }
  const op = fanOperationForRequiredAirflow(fan, requiredFraction);
  const gd = model.designAirFlowKgPerS;
  HOLD_KNOWN.tC = requiredColdWaterC;
  const known = haveHs ? HOLD_KNOWN : undefined;
  if (op.kind === "insufficient") {
    const tc = towerColdWaterAtAirflowC(model, air, heatKW, 1, pPa, requiredColdWaterC, known);
    return towerHour(r, false, tc, tc + rangeK, 1, op.state.powerKW, evaporationKgPerS(heatKW, gd, pPa, air));
  }
  if (op.kind === "continuous") {
    // With the fan off and natural draft more than enough, the loop's head-pressure control holds the
    // set-point; the tower sees the required airflow's evaporation.
    const f = Math.max(Math.min(requiredFraction, 1), 1e-3);
    return towerHour(r, true, requiredColdWaterC, requiredColdWaterC + rangeK, f, op.state.powerKW, evaporationKgPerS(heatKW, f * gd, pPa, air));
  }
  // The first Newton pass of the near state reuses the four hs at the requirement.
  const tLow = towerColdWaterAtAirflowC(model, air, heatKW, op.low.airflowFraction, pPa, requiredColdWaterC, known, MIX_STATE_TOLERANCE_K, MIX_STATE_RELATIVE_TOLERANCE);
  const tHigh = towerColdWaterAtAirflowC(model, air, heatKW, op.high.airflowFraction, pPa, requiredColdWaterC, known, MIX_STATE_TOLERANCE_K, MIX_STATE_RELATIVE_TOLERANCE);
  const x = highStateTimeFraction(tLow, tHigh, requiredColdWaterC);
  const eLow = evaporationKgPerS(heatKW, op.low.airflowFraction * gd, pPa, air);
  const eHigh = evaporationKgPerS(heatKW, op.high.airflowFraction * gd, pPa, air);
  return towerHour(
    r,
    true,
    requiredColdWaterC,
    requiredColdWaterC + rangeK,
    x * op.high.airflowFraction + (1 - x) * op.low.airflowFraction,
    x * op.high.powerKW + (1 - x) * op.low.powerKW,
    x * eHigh + (1 - x) * eLow,
  );
}

/** A tower hour's result object (every field set by `solveTowerHour`). */
export function newTowerHourResult(): TowerHourResult {
  return { held: true, coldWaterC: 0, hotWaterC: 0, airflowFraction: 0, fanPowerKW: 0, evaporationKgPerS: 0 };
}

function towerHour(r: TowerHourResult, held: boolean, coldWaterC: number, hotWaterC: number, airflowFraction: number, fanPowerKW: number, evaporation: number): TowerHourResult {
  r.held = held;
  r.coldWaterC = coldWaterC;
  r.hotWaterC = hotWaterC;
  r.airflowFraction = airflowFraction;
  r.fanPowerKW = fanPowerKW;
  r.evaporationKgPerS = evaporation;
  return r;
}

function round3(x: number): number {
  return Math.round(x * 1000) / 1000;
}

/** Airflow fraction a device needs to deliver a leaving temperature, and its slope with that temperature. */
export interface AirflowAtTemperature {
  /** Required airflow fraction (+∞ when no airflow can do it). */
  fraction: number;
  /** d(fraction)/d(leaving temperature), 1/K (≤ 0: warmer water needs less air). */
  slopePerK: number;
  /** d²(fraction)/d(leaving temperature)², 1/K² (towers: analytic; absent where not computed). */
  curvaturePerK2?: number;
  /** The tower's L/G at that airflow (a warm start for the next, nearby evaluation); absent for coolers. */
  liquidToGasRatio?: number;
}

/** Scratch of `towerAirflowForColdWater`'s four saturated enthalpies (read within the call, never kept). */
const AIRFLOW_HS = [0, 0, 0, 0];

/**
 * Airflow fraction the tower needs for a cold-water temperature at a heat load, and its slope, from four
 * saturated enthalpies: L/G from `requiredLiquidToGasRatio`, f = L/(L/G)/Gdesign, and by implicit
 * differentiation of ψ(L/G, T) = (4/(cpw·R))/Σ(1/rᵢ) − (L/G)^n/C = 0 with rᵢ = hs(T + kᵢR) − ha,in − (L/G)·cpw·kᵢR:
 * d(L/G)/dT = −ψ_T/ψ_L/G, ψ_T = (4/(cpw·R))·Σ(hs′ᵢ/rᵢ²)/(Σ1/rᵢ)², ψ_L/G = −(4/(cpw·R))·Σ(cpw·kᵢR/rᵢ²)/(Σ1/rᵢ)² − n·(L/G)^(n−1)/C;
 * df/dT = −(f/(L/G))·d(L/G)/dT. Source: Merkel/Chebyshev as above; calculus.
 */
export function towerAirflowForColdWater(
  model: TowerModel,
  air: EnteringAir,
  heatKW: number,
  coldWaterC: number,
  pPa: number,
  guessLiquidToGasRatio = model.designLiquidToGasRatio,
): AirflowAtTemperature {
  if (!(coldWaterC > air.wetBulbC)) return { fraction: Number.POSITIVE_INFINITY, slopePerK: 0 };
  const rangeK = heatKW / (model.waterFlowKgPerS * CPW);
  const hs = AIRFLOW_HS;
  for (let i = 0; i < 4; i++) hs[i] = saturatedAirEnthalpyKJPerKg(coldWaterC + (CHEBYSHEV_RANGE_FRACTIONS[i] ?? 0) * rangeK, pPa);
  const lg = requiredLiquidToGasRatio(hs, air.enthalpyKJPerKg, rangeK, model.coefficientC, model.exponentN, guessLiquidToGasRatio);
  if (!(lg > 0)) return { fraction: Number.POSITIVE_INFINITY, slopePerK: 0 };
  const c = CPW * rangeK;
  let sumInv = 0;
  let sumT = 0;
  let sumL = 0;
  for (let i = 0; i < 4; i++) {
    const k = CHEBYSHEV_RANGE_FRACTIONS[i] ?? 0;
    const h = hs[i] ?? 0;
    const r = h - air.enthalpyKJPerKg - lg * c * k;
    if (!(r > 0)) return { fraction: model.waterFlowKgPerS / lg / model.designAirFlowKgPerS, slopePerK: 0 };
    const inv = 1 / r;
    saturatedEnthalpySlopeAndCurvature(coldWaterC + k * rangeK, h, HS_SHAPE);
    POINT_INV[i] = inv;
    POINT_SLOPE[i] = HS_SHAPE.slope;
    POINT_CURVATURE[i] = HS_SHAPE.curvature;
    sumInv += inv;
    sumT += HS_SHAPE.slope / (r * r);
    sumL += (c * k) / (r * r);
  }
  const k4 = 4 / c;
  const psiT = (k4 * sumT) / (sumInv * sumInv);
  const lgn1 = positivePower(lg, model.exponentN - 1);
  const psiL = (-k4 * sumL) / (sumInv * sumInv) - (model.exponentN * lgn1) / model.coefficientC;
  const dLgdT = -psiT / psiL;
  const fraction = model.waterFlowKgPerS / lg / model.designAirFlowKgPerS;
  return {
    fraction,
    slopePerK: (-fraction / lg) * dLgdT,
    curvaturePerK2: airflowCurvatureFromPoints(model, fraction, lg, lgn1, rangeK, sumInv, sumT, sumL, psiT, psiL),
    liquidToGasRatio: lg,
  };
}

/** Per Chebyshev point of the last solve: 1/rᵢ, hs′ᵢ and hs″ᵢ (read at once by `airflowCurvatureFromPoints`). */
const POINT_INV = [0, 0, 0, 0];
const POINT_SLOPE = [0, 0, 0, 0];
const POINT_CURVATURE = [0, 0, 0, 0];

/**
 * d²f/dT² of the required airflow fraction f = L/(λ·Gd), λ = L/G, from the implicit root
 * ψ(λ, T) = k4/Σ − λⁿ/C = 0 (k4 = 4/(cpw·R), Σ = Σ1/rᵢ, rᵢ = hs(T + kᵢR) − ha,in − λ·cpw·kᵢR):
 * λ′ = −ψ_T/ψ_λ, λ″ = −(ψ_TT + 2ψ_Tλ·λ′ + ψ_λλ·λ′²)/ψ_λ, f″ = f·(2λ′²/λ² − λ″/λ), with
 * ψ_TT = k4(2A²/Σ³ − Σ_TT/Σ²), ψ_Tλ = −k4(2AB/Σ³ + Σ_Tλ/Σ²), ψ_λλ = k4(2B²/Σ³ − Σ_λλ/Σ²) − n(n − 1)λ^(n−2)/C,
 * A = Σhs′ᵢ/rᵢ², B = Σcpw·kᵢR/rᵢ², Σ_TT = Σ(2hs′ᵢ²/rᵢ³ − hs″ᵢ/rᵢ²), Σ_Tλ = −Σ2hs′ᵢ·cpw·kᵢR/rᵢ³,
 * Σ_λλ = Σ2(cpw·kᵢR)²/rᵢ³ (the per-point values in POINT_INV, POINT_SLOPE, POINT_CURVATURE).
 * Source: calculus on the Merkel/Chebyshev relation above (no further saturated-enthalpy evaluation).
 */
function airflowCurvatureFromPoints(
  model: TowerModel,
  fraction: number,
  lg: number,
  lgPowerNMinus1: number,
  rangeK: number,
  sum: number,
  sumA: number,
  sumB: number,
  psiT: number,
  psiL: number,
): number {
  const c = CPW * rangeK;
  let tt = 0;
  let tl = 0;
  let ll = 0;
  for (let i = 0; i < 4; i++) {
    const inv = POINT_INV[i] ?? 0;
    const slope = POINT_SLOPE[i] ?? 0;
    const ck = c * (CHEBYSHEV_RANGE_FRACTIONS[i] ?? 0);
    const inv2 = inv * inv;
    const inv3 = inv2 * inv;
    tt += 2 * slope * slope * inv3 - (POINT_CURVATURE[i] ?? 0) * inv2;
    tl -= 2 * slope * ck * inv3;
    ll += 2 * ck * ck * inv3;
  }
  const k4 = 4 / c;
  const s2 = sum * sum;
  const s3 = s2 * sum;
  const n = model.exponentN;
  const psiTT = k4 * ((2 * sumA * sumA) / s3 - tt / s2);
  const psiTL = -k4 * ((2 * sumA * sumB) / s3 + tl / s2);
  const psiLL = k4 * ((2 * sumB * sumB) / s3 - ll / s2) - (n * (n - 1) * lgPowerNMinus1) / (lg * model.coefficientC);
  const dLg = -psiT / psiL;
  const d2Lg = -(psiTT + 2 * psiTL * dLg + psiLL * dLg * dLg) / psiL;
  return fraction * ((2 * dLg * dLg) / (lg * lg) - d2Lg / lg);
}
