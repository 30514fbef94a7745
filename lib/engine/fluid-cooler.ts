/**
 * Closed-circuit (indirect-contact) evaporative fluid cooler.
 *
 * Model: effectiveness-NTU with an enthalpy-based ("fictitious") air specific heat cs = dhs/dT —
 * Jaber & Webb (1989), ASME J. Heat Transfer 111:837–843; Webb (1984), ASHRAE Trans. 90(2) — in
 * the screening form of Methods §3: overall conductance from an internal
 * (fluid → tube, ∝ fluid flow^0.8, derated for glycol) and an external (film → air, ∝ airflow^0.8·cs/cs,design)
 * resistance in series, calibrated on the manufacturer's wet rating; counterflow effectiveness;
 * Q = ε·Cmin·(Tfluid,in − Twb) with the air capacity ma·cs.
 * cs is the chord slope of hs between the entering wet-bulb and the mean fluid temperature. The process
 * pump runs at constant speed at the rated flow, so the internal flow^0.8 factor stays 1; the external
 * conductance follows the fan's airflow.
 *
 * Dry mode (spray pump off): sensible only, air capacity ma·cp,moist, external conductance from the
 * Lewis analogy hc = hD·cp times a dry factor (calibrated on the dry rating when given, else
 * 0.5–0.8 [practice]); driving difference to the dry-bulb; no evaporation, no spray pump.
 */
import { allowedSprayModes } from "./spray-modes";
import { saturatedAirEnthalpyKJPerKg } from "./psychrometrics";
import { type EnteringAir, evaporationKgPerS } from "./air-side";
import { type FanModel, fanOperationForRequiredAirflow, highStateTimeFraction } from "./fans";
import { type GlycolKind, fluidProperties, tubeSideCoefficientRatio } from "./glycol";
import { counterflowNtu } from "./heat-exchanger";
import type { EngineWarning } from "./types";
import { saturatedEnthalpySlopeKJPerKgK } from "./saturation";
import { newPairMemo, pairMemoGet, pairMemoSet, positivePower } from "./solvers";

/** The manufacturer's selection of a closed-circuit cooler. */
export interface CoolerSelection {
  fluidFlowKgPerS: number;
  enteringFluidC: number;
  leavingFluidC: number;
  designWetBulbC: number;
  /** Fluid-to-air mass-flow ratio at design (when the airflow is not stated). */
  designFluidToAirRatio: number;
  /** Share of the overall wet resistance 1/UA that is inside the tubes (0…1). */
  internalResistanceFraction: number;
  dryRating?: { enteringFluidC: number; leavingFluidC: number; dryBulbC: number };
  /** Dry external conductance / Lewis-analogy value hD·A·cp when no dry rating is given. */
  dryExternalConductanceFactor: number;
  allowDryMode: boolean;
  /** Dry mode only at or below this dry-bulb (e.g. a plume rule); undefined = no limit. */
  dryModeMaxDryBulbC?: number;
  /**
   * Wet or dry in each hour: "lowestTotalPower" — the mode with the lower fan + spray pump + compressor
   * power; "switchOverDryBulb" — dry at or below `switchOverDryBulbC`, wet above.
   */
  modeSelection: "lowestTotalPower" | "switchOverDryBulb";
  switchOverDryBulbC?: number;
  /** Spray locked out (dry operation forced) below this dry-bulb: freeze protection of the spray water. */
  sprayLockoutDryBulbC: number;
  glycol: { kind: GlycolKind; massFraction: number };
  /** Fluid the ratings were made with: "water" (engine derates for glycol) or the loop's own fluid. */
  ratingFluid: "water" | "loopFluid";
}

/** A cooler calibrated on its rating points. Conductances in kW/K at design airflow. */
export interface CoolerModel {
  fluidFlowKgPerS: number;
  /** Operating fluid capacity rate ṁ·cp, kW/K. */
  fluidCapacityKWPerK: number;
  fluidSpecificHeatKJPerKgK: number;
  designAirFlowKgPerS: number;
  designCsKJPerKgK: number;
  internalUaKWPerK: number;
  /** External wet conductance at design airflow and cs,design (temperature basis), kW/K. */
  externalWetUaKWPerK: number;
  /** hD·A at design airflow, kg/s (= externalWetUa/cs,design). */
  externalMassTransferKgPerS: number;
  dryFactor: number;
  allowDryMode: boolean;
  dryModeMaxDryBulbC: number;
  modeSelection: "lowestTotalPower" | "switchOverDryBulb";
  /** Dry at or below, wet above (switch-over rule only), °C. */
  switchOverDryBulbC: number;
  sprayLockoutDryBulbC: number;
  designApproachK: number;
}

/** Tolerance of a fan-mix state's leaving-fluid temperature, as the tower's (tower.ts): 0.01 K plus 2 % of its distance from the requirement. */
const MIX_STATE_TOLERANCE_K = 0.01;
const MIX_STATE_RELATIVE_TOLERANCE = 0.02;

const CP_DRY_RATING_AIR = 1.006 + 1.86 * 0.005; // moist-air cp at a typical W for the dry rating

/**
 * Enthalpy-based air specific heat: chord slope cs = (hs(Tm) − hs(Twb))/(Tm − Twb), kJ/(kg·K),
 * Tm = mean fluid temperature. One saturated-enthalpy evaluation. Source: Jaber & Webb (1989)
 * (cs = dhs/dT over the operating span).
 */
export function enthalpyBasedAirSpecificHeat(meanFluidC: number, air: EnteringAir, pPa: number): number {
  const span = meanFluidC - air.wetBulbC;
  if (span < 0.05) return air.slopeAtWetBulbKJPerKgK;
  return (saturatedAirEnthalpyKJPerKg(meanFluidC, pPa) - air.enthalpyKJPerKg) / span;
}

/**
 * Calibrate internal and external conductances on the wet rating (and the dry factor on the dry
 * rating when given): ε = Q/(Cmin·(Tin − Twb)), NTU from the counterflow relation, UA = NTU·Cmin,
 * 1/UA split by `internalResistanceFraction`. Glycol: when ratings are on water and the loop holds
 * glycol, the internal conductance is scaled by the Dittus–Boelter coefficient ratio at the same mass flow.
 */
export function calibrateCooler(
  sel: CoolerSelection,
  pPa: number,
  path: string,
): { model: CoolerModel; warnings: EngineWarning[] } {
  const warnings: EngineWarning[] = [];
  const meanRatingC = 0.5 * (sel.enteringFluidC + sel.leavingFluidC);
  const water = fluidProperties("none", 0, meanRatingC);
  const loop = fluidProperties(sel.glycol.kind, sel.glycol.massFraction, meanRatingC);
  const ratingCp = sel.ratingFluid === "water" ? water.specificHeatKJPerKgK : loop.specificHeatKJPerKgK;
  const ratingCf = sel.fluidFlowKgPerS * ratingCp;
  const qRating = ratingCf * (sel.enteringFluidC - sel.leavingFluidC);
  const ma = sel.fluidFlowKgPerS / sel.designFluidToAirRatio;
  const twb = sel.designWetBulbC;
  const hsWb = saturatedAirEnthalpyKJPerKg(twb, pPa);
  const cs = (saturatedAirEnthalpyKJPerKg(meanRatingC, pPa) - hsWb) / (meanRatingC - twb);
  const ca = ma * cs;
  const cmin = Math.min(ca, ratingCf);
  const cr = cmin / Math.max(ca, ratingCf);
  let eps = qRating / (cmin * (sel.enteringFluidC - twb));
  if (!(eps < 0.98)) {
    warnings.push({
      code: "cooler.ratingInfeasible",
      severity: "warning",
      message: `The wet rating needs an effectiveness of ${eps.toFixed(3)} at the stated airflow; capped at 0.98 — check the fluid-to-air ratio and the rating.`,
      path: `${path}.designFluidToAirRatio`,
    });
    eps = 0.98;
  }
  const ua = counterflowNtu(eps, cr) * cmin;
  const fInt = sel.internalResistanceFraction;
  const uaIntRating = ua / fInt;
  const uaExt = ua / (1 - fInt);
  const glycolFactor = sel.ratingFluid === "water" ? tubeSideCoefficientRatio(loop, water) : 1;
  const hDA = uaExt / cs;
  let dryFactor = sel.dryExternalConductanceFactor;
  if (sel.dryRating) {
    const d = sel.dryRating;
    const qDry = ratingCf * (d.enteringFluidC - d.leavingFluidC);
    const caDry = ma * CP_DRY_RATING_AIR;
    const cminD = Math.min(caDry, ratingCf);
    const crD = cminD / Math.max(caDry, ratingCf);
    const epsD = qDry / (cminD * (d.enteringFluidC - d.dryBulbC));
    const uaDry = counterflowNtu(epsD, crD) * cminD;
    const inv = 1 / uaDry - 1 / uaIntRating;
    if (epsD > 0 && epsD < 1 && inv > 0) {
      dryFactor = 1 / inv / (hDA * CP_DRY_RATING_AIR);
    } else {
      warnings.push({
        code: "cooler.dryRatingInconsistent",
        severity: "warning",
        message: "The dry rating cannot be reproduced with the wet rating's internal conductance; the default dry factor was used.",
        path: `${path}.dryRating`,
      });
    }
  }
  const cpOp = loop.specificHeatKJPerKgK;
  return {
    model: {
      fluidFlowKgPerS: sel.fluidFlowKgPerS,
      fluidCapacityKWPerK: sel.fluidFlowKgPerS * cpOp,
      fluidSpecificHeatKJPerKgK: cpOp,
      designAirFlowKgPerS: ma,
      designCsKJPerKgK: cs,
      internalUaKWPerK: uaIntRating * glycolFactor,
      externalWetUaKWPerK: uaExt,
      externalMassTransferKgPerS: hDA,
      dryFactor,
      allowDryMode: sel.allowDryMode,
      dryModeMaxDryBulbC: sel.dryModeMaxDryBulbC ?? Number.POSITIVE_INFINITY,
      modeSelection: sel.modeSelection,
      switchOverDryBulbC: sel.switchOverDryBulbC ?? Number.NEGATIVE_INFINITY,
      sprayLockoutDryBulbC: sel.sprayLockoutDryBulbC,
      designApproachK: sel.leavingFluidC - twb,
    },
    warnings,
  };
}

/**
 * Cooler heat-transfer "ε·Cmin" (kW/K) at an airflow fraction: wet (cs given) or dry (cs = undefined).
 * Wet: Ca = ma·cs, UAext = UAext,d·f^0.8·cs/cs,d. Dry: Ca = ma·cp,moist, UAext = factor·hD·A·f^0.8·cp.
 * 1/UA = 1/UAint + 1/UAext; ε counterflow.
 */
export function coolerConductanceKWPerK(
  model: CoolerModel,
  airflowFraction: number,
  air: EnteringAir,
  csKJPerKgK: number | undefined,
): number {
  coolerConductance(model, airflowFraction, air, csKJPerKgK, K_ONLY, false);
  return K_ONLY.k;
}

/**
 * f^0.8 of the last two airflows asked for (the passes of a floating solve repeat one airflow; a fan mix
 * alternates between its two states).
 */
function power08(f: number): number {
  const kept = pairMemoGet(POW08, f, 0.8);
  return Number.isNaN(kept) ? pairMemoSet(POW08, f, 0.8, positivePower(f, 0.8)) : kept;
}

const POW08 = newPairMemo();

/**
 * εCmin (`k`, kW/K) and, with the slope, d(εCmin)/df (`dk`, kW/K) and UAext·∂(εCmin)/∂UAext (`dkExternal`,
 * kW/K: the external conductance's share of the sensitivities, from which ∂(εCmin)/∂cs follows).
 */
export interface ConductanceOut {
  k: number;
  dk: number;
  dkExternal: number;
}

/** Scratch of `coolerConductanceKWPerK` (its own, so a caller holding `KS` is never overwritten). */
const K_ONLY: ConductanceOut = { k: 0, dk: 0, dkExternal: 0 };

/** One hour (or bin) of cooler operation; rates are hour averages. */
export interface CoolerHourResult {
  mode: "wet" | "dry";
  held: boolean;
  /** Time-averaged leaving-fluid temperature, °C. */
  leavingFluidC: number;
  enteringFluidC: number;
  airflowFraction: number;
  fanPowerKW: number;
  evaporationKgPerS: number;
  sprayOn: boolean;
}

/**
 * Leaving-fluid temperature at a given airflow, floating, °C. Dry: closed form
 * Tin = Tdb + Q/(εCmin). Wet: the entering-fluid temperature is the fixed point of
 * G(Tin) = Twb + Q/(εCmin(cs(Tin))), cs the chord slope at the mean fluid temperature (1 saturated-enthalpy
 * evaluation per pass). G falls as Tin rises (warmer fluid, steeper hs, larger cs), so the plain
 * substitution oscillates and crawls where |G′| nears 1; the root of r(T) = G(T) − T (strictly falling)
 * is found instead by secant steps kept inside the bracket the passes build (bisection if a step leaves it),
 * to the same tolerance: |G(T) − T| < 2e−4 K, returning G(T).
 */
export function coolerLeavingFluidAtAirflowC(
  model: CoolerModel,
  air: EnteringAir,
  heatKW: number,
  airflowFraction: number,
  wet: boolean,
  pPa: number,
  csGuess?: number,
  mixOfRequiredLeavingFluidC?: number,
): number {
  const cf = model.fluidCapacityKWPerK;
  if (!wet) {
    return dryLeavingFluidC(air, heatKW, coolerConductanceKWPerK(model, airflowFraction, air, undefined), cf);
  }
  const halfRange = (0.5 * heatKW) / cf;
  // Start from the cs this cooler last converged to at this airflow (the states of a fan mix recur hour
  // after hour), else the caller's guess.
  const memo = csMemo.model === model ? csMemo.airflow.indexOf(airflowFraction) : -1;
  const csStart = memo >= 0 ? (csMemo.cs[memo] ?? model.designCsKJPerKgK) : (csGuess ?? model.designCsKJPerKgK);
  // The wet conductance depends on the model, the airflow and cs only (not on the hour's air): the memo's
  // conductance at its cs is the number coolerConductanceKWPerK would return.
  const kStart = memo >= 0 ? (csMemo.k[memo] ?? 0) : coolerConductanceKWPerK(model, airflowFraction, air, csStart);
  let t = air.wetBulbC + heatKW / kStart;
  let csLast = csStart;
  let kLast = kStart;
  // r(T) = G(T) − T: r > 0 below the root, r < 0 above it.
  let lo = Number.NEGATIVE_INFINITY;
  let hi = Number.POSITIVE_INFINITY;
  let tPrev = Number.NaN;
  let rPrev = Number.NaN;
  let g = t;
  for (let i = 0; i < 16; i++) {
    const cs = enthalpyBasedAirSpecificHeat(t - halfRange, air, pPa);
    csLast = cs;
    kLast = coolerConductanceKWPerK(model, airflowFraction, air, cs);
    g = air.wetBulbC + heatKW / kLast;
    const r = g - t;
    // A fan-mix state (`mixOfRequiredLeavingFluidC`, the mix's requirement) to the tower's mix-state
    // tolerance (tower.ts): 0.01 K plus 2 % of its distance from the requirement — the mix fraction is
    // insensitive to the far state.
    const tol =
      mixOfRequiredLeavingFluidC !== undefined
        ? MIX_STATE_TOLERANCE_K + MIX_STATE_RELATIVE_TOLERANCE * Math.abs(g - heatKW / cf - mixOfRequiredLeavingFluidC)
        : 2e-4;
    if (Math.abs(r) < tol) break;
    if (r > 0) lo = t;
    else hi = t;
    // First pass: the substitution step (G(T) lies on the other side of the root). Then secant steps.
    let next = i === 0 ? g : t - (r * (t - tPrev)) / (r - rPrev);
    if (!(next > lo && next < hi)) next = Number.isFinite(lo) && Number.isFinite(hi) ? 0.5 * (lo + hi) : g;
    tPrev = t;
    rPrev = r;
    t = next;
  }
  if (csMemo.model !== model) {
    csMemo.model = model;
    csMemo.airflow.fill(Number.NaN);
  }
  const free = csMemo.airflow.findIndex((x) => Number.isNaN(x));
  const slot = memo >= 0 ? memo : free >= 0 ? free : (csMemo.next = (csMemo.next + 1) % 4);
  csMemo.airflow[slot] = airflowFraction;
  csMemo.cs[slot] = csLast;
  csMemo.k[slot] = kLast;
  return g - heatKW / cf;
}

/** Dry leaving-fluid temperature, °C: Tin = Tdb + Q/(εCmin), Tout = Tin − Q/Cf (closed form). */
function dryLeavingFluidC(air: EnteringAir, heatKW: number, conductanceKWPerK: number, fluidCapacityKWPerK: number): number {
  return air.dryBulbC + heatKW / conductanceKWPerK - heatKW / fluidCapacityKWPerK;
}

/**
 * Forget the warm starts (the annual loop calls it before each option's year, so that a run's answer never
 * depends on what ran before it: the same inputs give the same numbers to the last bit).
 */
export function resetCoolerWarmStarts(): void {
  warm.model = null;
  csMemo.model = null;
  csMemo.airflow.fill(Number.NaN);
  csMemo.next = 0;
}

/**
 * The cs a cooler last converged to at up to four airflows, and the wet conductance at that cs (starting
 * points for the next hour, never results).
 */
const csMemo: { model: CoolerModel | null; airflow: number[]; cs: number[]; k: number[]; next: number } = {
  model: null,
  airflow: [Number.NaN, Number.NaN, Number.NaN, Number.NaN],
  cs: [0, 0, 0, 0],
  k: [0, 0, 0, 0],
  next: 0,
};

/**
 * Heat a cooler rejects at a given entering-fluid temperature and airflow (for rating checks), kW:
 * Q = εCmin·(Tin − Tair) with cs consistent with the resulting mean fluid temperature.
 * Wet: Q is the root of r(Q) = εCmin(cs(Q))·(Tin − Twb) − Q, cs the chord slope at Tm = Tin − Q/(2·Cf).
 * A larger Q lowers Tm, hence cs and εCmin, so r falls strictly; the plain substitution Q ← εCmin(cs(Q))·ΔT
 * therefore oscillates about the root and crawls where its slope nears −1 (hot fluid, large ΔT), stopping
 * short of the tolerance. The root is taken instead by secant steps kept inside the energy-balance bracket
 * [0, Cf·(Tin − Twb)] (the fluid cannot leave below the wet-bulb: r(0) > 0, r(Cf·ΔT) = (εCmin − Cf)·ΔT < 0),
 * bisection if a step leaves it, to |r(Q)| < 1e−6·max(1, Q).
 */
export function coolerCapacityKW(
  model: CoolerModel,
  enteringFluidC: number,
  air: EnteringAir,
  airflowFraction: number,
  wet: boolean,
  pPa: number,
): number {
  if (!wet) return coolerConductanceKWPerK(model, airflowFraction, air, undefined) * (enteringFluidC - air.dryBulbC);
  const cf = model.fluidCapacityKWPerK;
  const drivingK = enteringFluidC - air.wetBulbC;
  if (drivingK === 0) return 0;
  // The bracket's ends by the sign of r: r > 0 at `pos`, r < 0 at `neg` (below the wet-bulb the signs swap).
  let pos = drivingK > 0 ? 0 : cf * drivingK;
  let neg = drivingK > 0 ? cf * drivingK : 0;
  let q = coolerConductanceKWPerK(model, airflowFraction, air, model.designCsKJPerKgK) * drivingK;
  if (!(q > Math.min(pos, neg) && q < Math.max(pos, neg))) q = 0.5 * (pos + neg);
  let qPrev = Number.NaN;
  let rPrev = Number.NaN;
  for (let i = 0; i < 60; i++) {
    const cs = enthalpyBasedAirSpecificHeat(enteringFluidC - (0.5 * q) / cf, air, pPa);
    const g = coolerConductanceKWPerK(model, airflowFraction, air, cs) * drivingK;
    const r = g - q;
    if (Math.abs(r) < 1e-6 * Math.max(1, Math.abs(q))) return q;
    if (r > 0) pos = q;
    else neg = q;
    // First pass: the substitution step (it lands on the other side of the root). Then secant steps.
    let next = i === 0 ? g : q - (r * (q - qPrev)) / (r - rPrev);
    if (!(next > Math.min(pos, neg) && next < Math.max(pos, neg))) next = 0.5 * (pos + neg);
    qPrev = q;
    rPrev = r;
    q = next;
  }
  return q;
}

/**
 * εCmin (kW/K) at an airflow fraction and its derivative d(εCmin)/df, written to `out` (no allocation):
 * the same quantity as `coolerConductanceKWPerK`, with the slope by the chain rule —
 * dCa/df = Ca/f, dUAext/df = 0.8·UAext/f, dUA/df = (UA/UAext)²·dUAext/df; air the smaller stream:
 * Cmin = Ca, Cr = Ca/Cf; fluid the smaller: Cmin = Cf, Cr = Cf/Ca; NTU = UA/Cmin;
 * ε = (1 − e)/(1 − Cr·e), e = exp(−NTU(1 − Cr)): ∂ε/∂NTU = (1 − Cr)²·e/D², ∂ε/∂Cr = e·[(1 − e) − NTU(1 − Cr)]/D²,
 * D = 1 − Cr·e (Cr → 1: ε = NTU/(1 + NTU), ∂ε/∂NTU = 1/(1 + NTU)², ∂ε/∂Cr = −NTU²/(2(1 + NTU)²)).
 * Source: the counterflow ε-NTU relation (heat-exchanger.ts); calculus.
 */
export function coolerConductanceWithSlope(model: CoolerModel, airflowFraction: number, air: EnteringAir, csKJPerKgK: number | undefined, out: ConductanceOut): void {
  coolerConductance(model, airflowFraction, air, csKJPerKgK, out, true);
}

/**
 * εCmin into `out.k`, and with `withSlope` its slope into `out.dk` (without it `out.dk` is left as it was:
 * the value alone skips the slope's terms — most calls need only the value). One body for both, so the
 * value is the same number either way. `knownF08` is f^0.8 when the caller has it (the airflow root works
 * in u = f^0.2, whose fourth power it is).
 */
function coolerConductance(
  model: CoolerModel,
  airflowFraction: number,
  air: EnteringAir,
  csKJPerKgK: number | undefined,
  out: ConductanceOut,
  withSlope: boolean,
  knownF08?: number,
): void {
  const f = Math.max(airflowFraction, 1e-4);
  const ma = model.designAirFlowKgPerS * f;
  const f08 = knownF08 ?? power08(f);
  const c = constantsOf(model);
  let ca: number;
  let uaExt: number;
  if (csKJPerKgK === undefined) {
    const cp = air.moistSpecificHeatKJPerKgK;
    ca = ma * cp;
    uaExt = c.dryMassTransferKgPerS * f08 * cp;
  } else {
    ca = ma * csKJPerKgK;
    uaExt = c.wetUaPerCs * f08 * csKJPerKgK;
  }
  const cf = model.fluidCapacityKWPerK;
  const airMin = ca < cf;
  const cmin = airMin ? ca : cf;
  const cr = airMin ? ca * c.inverseFluidCapacity : cf / ca;
  const inverseCmin = airMin ? 1 / ca : c.inverseFluidCapacity;
  // 1/UA = 1/UAint + 1/UAext: UA = UAext·share, share = UA/UAext = 1/(1 + UAext/UAint).
  const share = 1 / (1 + uaExt * c.inverseInternalUa);
  const ua = uaExt * share;
  const ntu = ua * inverseCmin;
  const nearBalanced = Math.abs(1 - cr) < 1e-6;
  const e = nearBalanced ? 0 : Math.exp(-ntu * (1 - cr));
  const d = 1 - cr * e;
  const eps = nearBalanced ? ntu / (1 + ntu) : (1 - e) / d;
  out.k = f > 0 && ntu > 0 ? eps * cmin : 0;
  if (!withSlope) return;
  const inverseF = 1 / f;
  const dUa = share * share * 0.8 * uaExt * inverseF;
  const dCmin = airMin ? ca * inverseF : 0;
  const dCr = airMin ? cr * inverseF : -cr * inverseF;
  const dNtu = (dUa - ntu * dCmin) * inverseCmin;
  const inverseD2 = nearBalanced ? 1 / ((1 + ntu) * (1 + ntu)) : 1 / (d * d);
  const epsN = nearBalanced ? inverseD2 : (1 - cr) * (1 - cr) * e * inverseD2;
  const epsCr = nearBalanced ? -0.5 * ntu * ntu * inverseD2 : e * (1 - e - ntu * (1 - cr)) * inverseD2;
  out.dk = airflowFraction > 1e-4 ? (epsN * dNtu + epsCr * dCr) * cmin + eps * dCmin : 0;
  out.dkExternal = epsN * share * share * uaExt;
}

/**
 * A cooler's constants in the form the conductance uses them (reciprocals and products computed once per
 * model instead of per call; the year runs one option at a time, so the last model's are kept).
 */
interface CoolerConstants {
  model: CoolerModel | null;
  /** UAext,d/cs,d: the wet external conductance per unit cs at design airflow. */
  wetUaPerCs: number;
  /** dry factor × hD·A: the dry external conductance per unit cp at design airflow. */
  dryMassTransferKgPerS: number;
  inverseInternalUa: number;
  inverseFluidCapacity: number;
}

const CONSTANTS: CoolerConstants = { model: null, wetUaPerCs: 0, dryMassTransferKgPerS: 0, inverseInternalUa: 0, inverseFluidCapacity: 0 };

function constantsOf(model: CoolerModel): CoolerConstants {
  const c = CONSTANTS;
  if (c.model !== model) {
    c.model = model;
    c.wetUaPerCs = model.externalWetUaKWPerK / model.designCsKJPerKgK;
    c.dryMassTransferKgPerS = model.dryFactor * model.externalMassTransferKgPerS;
    c.inverseInternalUa = 1 / model.internalUaKWPerK;
    c.inverseFluidCapacity = 1 / model.fluidCapacityKWPerK;
  }
  return c;
}

const KS: ConductanceOut = { k: 0, dk: 0, dkExternal: 0 };

/**
 * Airflow fraction at which the cooler holds the required leaving-fluid temperature (cs fixed by the
 * required temperatures), from εCmin(f) = Q/(Tin,req − Tair): a 1-D root in f with no
 * saturated-enthalpy evaluation. +∞ if not even full speed (or a driving difference ≤ 0) suffices.
 * The root is sought in u = f^0.2 (f = u⁵): the external conductance's f^0.8 is then u⁴, a product
 * instead of a power (an exp and a log) per step. Newton steps in u from the previous root (analytic
 * slope, `coolerConductanceWithSlope`, times df/du = 5u⁴), kept inside the bracket (bisection otherwise),
 * to |εCmin − need| < 1e−9·need.
 */
export function requiredAirflowFraction(model: CoolerModel, air: EnteringAir, needKWPerK: number, cs: number | undefined): number {
  ROOT_CONDUCTANCE.fraction = Number.NaN;
  if (!(needKWPerK > 0)) return Number.POSITIVE_INFINITY;
  const ks = KS;
  const wet = cs !== undefined;
  if (warm.model !== model) {
    warm.model = model;
    warm.wetRoot = 1;
    warm.dryRoot = 1;
  }
  // Start from the previous root of this cooler in this mode (the year runs one option at a time); full
  // speed is evaluated whenever a step would pass it, so "insufficient" is decided exactly as before.
  const start = wet ? warm.wetRoot : warm.dryRoot;
  let lo = U_LOWEST;
  let hi = 1;
  let u = start > lo && start < 1 ? start : 1;
  let checkedLo = false;
  let uPrev = Number.NaN;
  let slopePrev = Number.NaN;
  let fPrev = Number.NaN;
  let dkPrev = Number.NaN;
  for (let i = 0; i < 60; i++) {
    const u2 = u * u;
    const u4 = u2 * u2;
    const f = u4 * u;
    coolerConductance(model, f, air, cs, ks, true, u4);
    const g = ks.k - needKWPerK;
    // The rating point itself counts as held: a relative 1e−6 of the conductance (rounding of the
    // calibration round trip), as the tower's L/G root and the fan map allow.
    if (u === 1 && g < 0) {
      if (g >= -1e-6 * needKWPerK) return rootWithConductance(1, ks.k, ks.dk, ks.dkExternal);
      // Not even full speed: the next hour in this mode starts there (the hours that cannot hold come in
      // runs). Full speed's conductance is kept for the caller's floating temperature.
      if (wet) warm.wetRoot = 1;
      else warm.dryRoot = 1;
      rootWithConductance(1, ks.k, ks.dk, ks.dkExternal);
      return Number.POSITIVE_INFINITY;
    }
    if (Math.abs(g) < 1e-9 * needKWPerK || hi - lo < 1e-10) {
      if (wet) warm.wetRoot = u;
      else warm.dryRoot = u;
      return rootWithConductance(f, ks.k, ks.dk, ks.dkExternal);
    }
    if (g > 0) hi = u;
    else lo = u;
    const slope = 5 * u4 * ks.dk;
    let next = slope > 0 ? u - g / slope : Number.NaN;
    // A Newton step s leaves an error of about |k″|/2·s² in the conductance (k″ from this iterate's and
    // the previous one's slopes): when that is within the tolerance, the step's end is the root and its
    // conductance the need, to that tolerance — without a further evaluation.
    if (next > lo && next < hi && !Number.isNaN(uPrev) && u !== uPrev) {
      const step = next - u;
      if (Math.abs((slope - slopePrev) / (u - uPrev)) * step * step < 2e-9 * needKWPerK) {
        if (wet) warm.wetRoot = next;
        else warm.dryRoot = next;
        const n2 = next * next;
        const fNext = n2 * n2 * next;
        // dk/df at the step's end: this iterate's, moved along k″ (from the last two iterates' slopes).
        const dkNext = ks.dk + ((ks.dk - dkPrev) / (f - fPrev)) * (fNext - f);
        return rootWithConductance(fNext, needKWPerK, dkNext, ks.dkExternal);
      }
    }
    uPrev = u;
    slopePrev = slope;
    fPrev = f;
    dkPrev = ks.dk;
    if (next >= hi && hi === 1 && u !== 1) next = 1;
    else if (!(next > lo && next < hi)) {
      if (lo === U_LOWEST && !checkedLo) {
        checkedLo = true;
        coolerConductanceWithSlope(model, F_LOWEST, air, cs, ks);
        if (ks.k - needKWPerK >= 0) return rootWithConductance(F_LOWEST, ks.k, ks.dk, ks.dkExternal);
      }
      next = 0.5 * (lo + hi);
    }
    u = next;
  }
  const mid = 0.5 * (lo + hi);
  return mid * mid * mid * mid * mid;
}

/** The lowest airflow fraction the root considers, and its u = f^0.2. */
const F_LOWEST = 1e-3;
const U_LOWEST = F_LOWEST ** 0.2;

/**
 * The conductance εCmin the last `requiredAirflowFraction` call evaluated at the fraction it returned (NaN
 * when it returned none it evaluated): its caller's slope needs that same value, so it is kept, not
 * recomputed (bit for bit the same number: same model, air, cs and fraction).
 */
const ROOT_CONDUCTANCE = { fraction: Number.NaN, kKWPerK: 0, slopeKWPerK: 0, externalSensitivityKWPerK: 0 };

function rootWithConductance(fraction: number, kKWPerK: number, slopeKWPerK: number, externalSensitivityKWPerK: number): number {
  ROOT_CONDUCTANCE.fraction = fraction;
  ROOT_CONDUCTANCE.kKWPerK = kKWPerK;
  ROOT_CONDUCTANCE.slopeKWPerK = slopeKWPerK;
  ROOT_CONDUCTANCE.externalSensitivityKWPerK = externalSensitivityKWPerK;
  return fraction;
}

/** The last airflow roots (as u = f^0.2) of the cooler `requiredAirflowFraction` served: starting points, never results. */
const warm: { model: CoolerModel | null; wetRoot: number; dryRoot: number } = { model: null, wetRoot: 1, dryRoot: 1 };

/**
 * Operate the cooler for one hour: dry if dry operation holds the required leaving-fluid temperature
 * at allowed fan speed (and dry mode is allowed at this dry-bulb), else wet; within the mode the fan
 * control holds the requirement or the fluid floats at full speed. Spray evaporation from the
 * air-side balance (exit air saturated at ha,in + Q/ma) in wet hours only.
 */
/**
 * Modes the cooler may run in at this dry-bulb: the spray lock-out forces dry below its dry-bulb (freeze
 * protection, even where dry mode is otherwise not allowed); the switch-over rule fixes the mode by the
 * dry-bulb; otherwise dry is allowed where `allowDryMode` and the dry-bulb is at or below
 * `dryModeMaxDryBulbC`, and wet always.
 */
export function allowedCoolerModes(model: CoolerModel, dryBulbC: number): { wet: boolean; dry: boolean } {
  return allowedSprayModes(model, dryBulbC);
}

/**
 * Required airflow fraction for a leaving-fluid temperature in one mode, and its slope (1/K): f solves
 * εCmin(f, cs(T)) = need(T) = Q/(Tin − Tair), Tin = T + Q/Cf; df/dT = (need′(T) − ∂k/∂cs·dcs/dT)/(∂k/∂f) with
 * need′ = −Q/(Tin − Tair)², ∂k/∂f analytic at the root and the wet chord slope's drift with T (csDriftKWPerK;
 * it is first order: up to a quarter of the slope).
 */
export function coolerAirflowForLeavingFluid(
  model: CoolerModel,
  air: EnteringAir,
  heatKW: number,
  leavingFluidC: number,
  wet: boolean,
  pPa: number,
): { fraction: number; slopePerK: number } {
  const tin = leavingFluidC + heatKW / model.fluidCapacityKWPerK;
  const tAir = wet ? air.wetBulbC : air.dryBulbC;
  if (!(tin > tAir) || (wet && !(leavingFluidC > air.wetBulbC))) return { fraction: Number.POSITIVE_INFINITY, slopePerK: 0 };
  const meanC = 0.5 * (tin + leavingFluidC);
  const cs = wet ? enthalpyBasedAirSpecificHeat(meanC, air, pPa) : undefined;
  const need = heatKW / (tin - tAir);
  const f = requiredAirflowFraction(model, air, need, cs);
  if (!Number.isFinite(f)) return { fraction: f, slopePerK: 0 };
  // d(εCmin)/df and UAext·∂(εCmin)/∂UAext at the root, as the root's last Newton step had them.
  let dK: number;
  let dKExternal: number;
  if (ROOT_CONDUCTANCE.fraction === f) {
    dK = ROOT_CONDUCTANCE.slopeKWPerK;
    dKExternal = ROOT_CONDUCTANCE.externalSensitivityKWPerK;
  } else {
    coolerConductanceWithSlope(model, f, air, cs, KS);
    dK = KS.dk;
    dKExternal = KS.dkExternal;
  }
  const dNeed = -need / (tin - tAir);
  const drift = csDriftKWPerK(air, meanC, cs, f, dK, dKExternal);
  return { fraction: f, slopePerK: dK > 0 ? (dNeed - drift) / dK : 0 };
}

/**
 * ∂(εCmin)/∂cs·dcs/dT, kW/K: wet, cs is the chord slope at the mean fluid temperature Tm, which moves with T
 * (dTm/dT = 1), so dcs/dT = (hs′(Tm) − cs)/(Tm − Twb); and cs·∂k/∂cs = f·∂k/∂f + 0.2·UAext·∂k/∂UAext
 * (Ca ∝ f·cs, UAext ∝ f^0.8·cs). 0 dry (cp does not move with T) and where cs is the wet-bulb slope
 * (span < 0.05 K). hs(Tm) = ha + cs·(Tm − Twb) by cs's own definition: no further evaluation.
 */
function csDriftKWPerK(air: EnteringAir, meanC: number, cs: number | undefined, f: number, dK: number, dKExternal: number): number {
  if (cs === undefined) return 0;
  const span = meanC - air.wetBulbC;
  if (span < 0.05) return 0;
  const hsMean = air.enthalpyKJPerKg + cs * span;
  const dCs = (saturatedEnthalpySlopeKJPerKgK(meanC, hsMean) - cs) / span;
  return ((f * dK + 0.2 * dKExternal) / cs) * dCs;
}

/**
 * d(required airflow fraction)/dT at full speed, for the leaving-fluid temperature full speed itself
 * reaches (the floating search's low end): the slope of `coolerAirflowForLeavingFluid` at f = 1, computed
 * directly — going through the airflow root there returned +∞ and no slope whenever the floating
 * solution's round-off put the need a hair above full speed's conductance.
 */
export function coolerAirflowSlopeAtFullSpeedPerK(
  model: CoolerModel,
  air: EnteringAir,
  heatKW: number,
  leavingFluidC: number,
  wet: boolean,
  pPa: number,
): number {
  const tin = leavingFluidC + heatKW / model.fluidCapacityKWPerK;
  const tAir = wet ? air.wetBulbC : air.dryBulbC;
  if (!(tin > tAir)) return 0;
  const meanC = 0.5 * (tin + leavingFluidC);
  const cs = wet ? enthalpyBasedAirSpecificHeat(meanC, air, pPa) : undefined;
  const need = heatKW / (tin - tAir);
  coolerConductanceWithSlope(model, 1, air, cs, KS);
  const dK = KS.dk;
  return dK > 0 ? (-need / (tin - tAir) - csDriftKWPerK(air, meanC, cs, 1, dK, KS.dkExternal)) / dK : 0;
}

/**
 * One hour in a given mode: the fan control holds the required leaving-fluid temperature, or the fluid
 * floats at full speed. Evaporation (wet only) from the air-side balance.
 */
export function solveCoolerModeHour(
  model: CoolerModel,
  fan: FanModel,
  air: EnteringAir,
  heatKW: number,
  requiredLeavingFluidC: number,
  wet: boolean,
  pPa: number,
  into?: CoolerHourResult,
): CoolerHourResult {
  const tinReq = requiredLeavingFluidC + heatKW / model.fluidCapacityKWPerK;
  if (!wet) {
    if (!(tinReq > air.dryBulbC)) return finishMode(model, fan, Number.POSITIVE_INFINITY, air, heatKW, requiredLeavingFluidC, false, undefined, pPa, into);
    const fDry = requiredAirflowFraction(model, air, heatKW / (tinReq - air.dryBulbC), undefined);
    // Where full speed cannot hold, the root evaluated full speed's conductance: the floating temperature reuses it.
    const fullSpeedK = fDry === Number.POSITIVE_INFINITY && ROOT_CONDUCTANCE.fraction === 1 ? ROOT_CONDUCTANCE.kKWPerK : undefined;
    return finishMode(model, fan, fDry, air, heatKW, requiredLeavingFluidC, false, undefined, pPa, into, fullSpeedK);
  }
  const cs = enthalpyBasedAirSpecificHeat(0.5 * (tinReq + requiredLeavingFluidC), air, pPa);
  const fWet = requiredLeavingFluidC > air.wetBulbC ? requiredAirflowFraction(model, air, heatKW / (tinReq - air.wetBulbC), cs) : Number.POSITIVE_INFINITY;
  return finishMode(model, fan, fWet, air, heatKW, requiredLeavingFluidC, true, cs, pPa, into);
}

/**
 * The simplest mode rule (kept for checks of the cooler model on its own): dry whenever dry operation
 * holds the requirement, else wet. The annual analysis chooses the mode by total power or by the
 * switch-over dry-bulb instead (lib/engine/annual/record-cooler.ts).
 */
export function solveCoolerHour(
  model: CoolerModel,
  fan: FanModel,
  air: EnteringAir,
  heatKW: number,
  requiredLeavingFluidC: number,
  pPa: number,
): CoolerHourResult {
  const cf = model.fluidCapacityKWPerK;
  const tinReq = requiredLeavingFluidC + heatKW / cf;
  if (!(heatKW > 0)) {
    return { mode: "dry", held: true, leavingFluidC: requiredLeavingFluidC, enteringFluidC: requiredLeavingFluidC, airflowFraction: 0, fanPowerKW: 0, evaporationKgPerS: 0, sprayOn: false };
  }
  if (model.allowDryMode && air.dryBulbC <= model.dryModeMaxDryBulbC) {
    const fDry = requiredAirflowFraction(model, air, heatKW / (tinReq - air.dryBulbC), undefined);
    if (fDry <= 1 + 1e-6) {
      return finishMode(model, fan, fDry, air, heatKW, requiredLeavingFluidC, false, undefined, pPa);
    }
  }
  const cs = enthalpyBasedAirSpecificHeat(0.5 * (tinReq + requiredLeavingFluidC), air, pPa);
  const fWet = requiredLeavingFluidC > air.wetBulbC ? requiredAirflowFraction(model, air, heatKW / (tinReq - air.wetBulbC), cs) : Number.POSITIVE_INFINITY;
  return finishMode(model, fan, fWet, air, heatKW, requiredLeavingFluidC, true, cs, pPa);
}

function finishMode(
  model: CoolerModel,
  fan: FanModel,
  requiredFraction: number,
  air: EnteringAir,
  heatKW: number,
  requiredLeavingFluidC: number,
  wet: boolean,
  cs: number | undefined,
  pPa: number,
  into?: CoolerHourResult,
  dryFullSpeedKWPerK?: number,
): CoolerHourResult {
  const cf = model.fluidCapacityKWPerK;
  const op = fanOperationForRequiredAirflow(fan, requiredFraction);
  const ma = model.designAirFlowKgPerS;
  const r = into ?? newCoolerHourResult();
  r.mode = wet ? "wet" : "dry";
  r.sprayOn = wet;
  if (op.kind === "insufficient") {
    // Dry at full speed: Tin = Tdb + Q/(εCmin), as coolerLeavingFluidAtAirflowC, from the conductance the root evaluated when given.
    const tout =
      !wet && dryFullSpeedKWPerK !== undefined ? dryLeavingFluidC(air, heatKW, dryFullSpeedKWPerK, cf) : coolerLeavingFluidAtAirflowC(model, air, heatKW, 1, wet, pPa, cs);
    r.held = false;
    r.leavingFluidC = tout;
    r.enteringFluidC = tout + heatKW / cf;
    r.airflowFraction = 1;
    r.fanPowerKW = op.state.powerKW;
    r.evaporationKgPerS = wet ? evaporationKgPerS(heatKW, ma, pPa, air) : 0;
    return r;
  }
  r.held = true;
  r.leavingFluidC = requiredLeavingFluidC;
  r.enteringFluidC = requiredLeavingFluidC + heatKW / cf;
  if (op.kind === "continuous") {
    // Fan off with natural draft to spare: the loop's control holds the set-point; the air that
    // actually takes the heat is about the required airflow.
    const f = op.state.powerKW > 0 ? op.state.airflowFraction : Math.max(requiredFraction, 1e-3);
    r.airflowFraction = f;
    r.fanPowerKW = op.state.powerKW;
    r.evaporationKgPerS = wet ? evaporationKgPerS(heatKW, f * ma, pPa, air) : 0;
    return r;
  }
  const tLow = coolerLeavingFluidAtAirflowC(model, air, heatKW, op.low.airflowFraction, wet, pPa, cs, requiredLeavingFluidC);
  const tHigh = coolerLeavingFluidAtAirflowC(model, air, heatKW, op.high.airflowFraction, wet, pPa, cs, requiredLeavingFluidC);
  const x = highStateTimeFraction(tLow, tHigh, requiredLeavingFluidC);
  r.airflowFraction = x * op.high.airflowFraction + (1 - x) * op.low.airflowFraction;
  r.fanPowerKW = x * op.high.powerKW + (1 - x) * op.low.powerKW;
  r.evaporationKgPerS = wet
    ? x * evaporationKgPerS(heatKW, op.high.airflowFraction * ma, pPa, air) + (1 - x) * evaporationKgPerS(heatKW, op.low.airflowFraction * ma, pPa, air)
    : 0;
  return r;
}

/** A cooler hour's result object (every field set by `finishMode`). */
export function newCoolerHourResult(): CoolerHourResult {
  return { mode: "wet", held: true, leavingFluidC: 0, enteringFluidC: 0, airflowFraction: 0, fanPowerKW: 0, evaporationKgPerS: 0, sprayOn: true };
}
