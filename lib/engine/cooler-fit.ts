/**
 * Calibrating a closed-circuit cooler on more than one rating (Methods §3). The design (wet) rating fixes
 * the overall wet conductance UA_d; extra wet ratings at other fluid flows, airflows or wet-bulbs fix how
 * 1/UA_d splits into the tube-side (internal) and the film-to-air (external) resistance, because the two
 * scale differently with the rating's conditions in the engine's cooler model (lib/engine/fluid-cooler.ts):
 *
 *   1/UA_i = R_int·(ṁ_d/ṁ_i)^0.8 + R_ext·(ṁa_d/ṁa_i)^0.8·(cs_d/cs_i),   R_int + R_ext = 1/UA_d,
 *
 * with each rating's UA_i from its effectiveness (counterflow ε-NTU on the enthalpy-based air capacity
 * ṁa·cs, cs the chord slope of hs between the wet-bulb and the mean fluid temperature). With the design
 * point kept exact, R_int follows by one-parameter least squares over the extra ratings; the tube-side share
 * is R_int·UA_d. Where the extra ratings scale both resistances alike (same flows, nearly the same wet-bulb)
 * the split cannot be told and the entered (or default) share is kept, and said so. The dry rating then
 * calibrates the dry derating with the fitted internal conductance (fluid-cooler.ts calibrateCooler).
 * Each rating's residual is the leaving-fluid temperature the calibrated model gives at the rated entering
 * fluid minus the rated one. Pure: SI inside.
 */
import { fluidProperties } from "./glycol";
import { counterflowEffectiveness, counterflowNtu } from "./heat-exchanger";
import { saturatedAirEnthalpyKJPerKg } from "./psychrometrics";
import type { CoolerSelection } from "./fluid-cooler";
import type { EngineWarning, RatingFitSummary, RatingPointCheck } from "./types";

/** An extra wet rating of the same cooler; without an airflow, the fan at full speed (the design airflow). */
export interface CoolerWetRatingInput {
  fluidFlowKgPerS: number;
  enteringFluidC: number;
  leavingFluidC: number;
  wetBulbC: number;
  airFlowKgPerS?: number;
}

/** Smallest difference between the internal and external scaling of a rating that lets the split be fitted. */
export const MIN_SPLIT_LEVERAGE = 0.05;
/** Plausible tube-side share of the wet resistance; a fit outside it keeps the entered share. */
export const SPLIT_RANGE = { min: 0.05, max: 0.9 } as const;

/** The moist-air cp the dry rating is reduced with (as in calibrateCooler), kJ/(kg·K). */
const CP_DRY_AIR = 1.006 + 1.86 * 0.005;

interface RatingConditions {
  m: number;
  cp: number;
  ma: number;
  tin: number;
  tout: number;
  wb: number;
}

function chordCs(meanC: number, wbC: number, pPa: number): number {
  const span = Math.max(meanC - wbC, 0.05);
  return (saturatedAirEnthalpyKJPerKg(wbC + span, pPa) - saturatedAirEnthalpyKJPerKg(wbC, pPa)) / span;
}

/** UA of one wet rating and its cs, or null when the rating needs ε ≥ 0.98 (or ≤ 0). */
function wetRatingUa(r: RatingConditions, pPa: number): { ua: number; cs: number } | null {
  if (!(r.tin > r.tout) || !(r.tout > r.wb)) return null;
  const cs = chordCs(0.5 * (r.tin + r.tout), r.wb, pPa);
  const ca = r.ma * cs;
  const cf = r.m * r.cp;
  const cmin = Math.min(ca, cf);
  const eps = (cf * (r.tin - r.tout)) / (cmin * (r.tin - r.wb));
  if (!(eps > 0 && eps < 0.98)) return null;
  return { ua: counterflowNtu(eps, cmin / Math.max(ca, cf)) * cmin, cs };
}

/** Leaving fluid the two-resistance model predicts at a rating's entering fluid (wet), °C. */
function predictWetLeavingC(r: RatingConditions, rInt: number, rExt: number, d: { m: number; ma: number; cs: number }, pPa: number): number {
  const cf = r.m * r.cp;
  let tout = r.tout;
  for (let k = 0; k < 40; k++) {
    const cs = chordCs(0.5 * (r.tin + tout), r.wb, pPa);
    const ua = 1 / (rInt * Math.pow(d.m / r.m, 0.8) + rExt * Math.pow(d.ma / r.ma, 0.8) * (d.cs / cs));
    const ca = r.ma * cs;
    const cmin = Math.min(ca, cf);
    const q = counterflowEffectiveness(ua / cmin, cmin / Math.max(ca, cf)) * cmin * (r.tin - r.wb);
    const next = r.tin - q / cf;
    if (Math.abs(next - tout) < 1e-7) return next;
    tout = 0.5 * (tout + next);
  }
  return tout;
}

export interface CoolerSplitFit {
  internalResistanceFraction: number;
  method: "fitted" | "defaultSplit";
  summary: RatingFitSummary;
  warnings: EngineWarning[];
}

const pct = (v: number) => `${Math.round(v * 1000) / 10} %`;

/** The selection's design wet rating: the fluid's cp at a mean temperature, design airflow and its wet UA. */
function designRating(sel: CoolerSelection, pPa: number) {
  const cpOf = (tin: number, tout: number) => {
    const mean = 0.5 * (tin + tout);
    return sel.ratingFluid === "water" ? fluidProperties("none", 0, mean).specificHeatKJPerKgK : fluidProperties(sel.glycol.kind, sel.glycol.massFraction, mean).specificHeatKJPerKgK;
  };
  const maD = sel.fluidFlowKgPerS / sel.designFluidToAirRatio;
  const design: RatingConditions = { m: sel.fluidFlowKgPerS, cp: cpOf(sel.enteringFluidC, sel.leavingFluidC), ma: maD, tin: sel.enteringFluidC, tout: sel.leavingFluidC, wb: sel.designWetBulbC };
  return { cpOf, maD, design, uaD: wetRatingUa(design, pPa) };
}

/**
 * Fit the tube-side share of the wet resistance to the selection's wet ratings (the design rating and
 * `wetRatings`), with each rating's residual. `dryFactor` (from calibrateCooler, after the split) is used for
 * the dry rating's residual; call `coolerRatingChecks` again with it.
 */
export function fitCoolerResistanceSplit(
  sel: CoolerSelection & { wetRatings?: readonly CoolerWetRatingInput[] | undefined },
  pPa: number,
  path: string,
): CoolerSplitFit {
  const warnings: EngineWarning[] = [];
  const extras = sel.wetRatings ?? [];
  const f0 = sel.internalResistanceFraction;
  const { cpOf, maD, design, uaD } = designRating(sel, pPa);
  const keep = (note: string): CoolerSplitFit => ({
    internalResistanceFraction: f0,
    method: "defaultSplit",
    summary: { device: "cooler", method: "defaultSplit", note, internalResistanceFraction: f0, points: [] },
    warnings,
  });
  if (extras.length === 0) return keep(`Tube-side share ${pct(f0)} (entered or default): no second wet rating to fit it.`);
  if (!uaD) return keep(`Tube-side share ${pct(f0)} kept: the design rating cannot be reproduced at the stated airflow.`);
  const rows: { d: number; y: number; index: number }[] = [];
  const rejected = new Map<number, string>();
  extras.forEach((e, index) => {
    const r: RatingConditions = { m: e.fluidFlowKgPerS, cp: cpOf(e.enteringFluidC, e.leavingFluidC), ma: e.airFlowKgPerS ?? maD, tin: e.enteringFluidC, tout: e.leavingFluidC, wb: e.wetBulbC };
    const u = wetRatingUa(r, pPa);
    if (!u) {
      rejected.set(index, "the rating needs an effectiveness the cooler cannot have at this airflow (check the airflow and temperatures)");
      return;
    }
    const a = Math.pow(design.m / r.m, 0.8);
    const b = Math.pow(design.ma / r.ma, 0.8) * (uaD.cs / u.cs);
    rows.push({ d: a - b, y: 1 / u.ua - b / uaD.ua, index });
  });
  for (const [index, reason] of rejected)
    warnings.push({ code: "cooler.ratingRejected", severity: "warning", message: `Cooler wet rating ${index + 2} was left out: ${reason}.`, path: `${path}.wetRatings.${index}` });
  let fraction = f0;
  let method: CoolerSplitFit["method"] = "defaultSplit";
  let note: string;
  const leverage = rows.length ? Math.max(...rows.map((r) => Math.abs(r.d))) : 0;
  if (rows.length === 0) note = `Tube-side share ${pct(f0)} kept: no usable second wet rating.`;
  else if (leverage < MIN_SPLIT_LEVERAGE) {
    note = `Tube-side share ${pct(f0)} kept: the wet ratings are at nearly the same flows and wet-bulb, so the split cannot be told from them.`;
    warnings.push({ code: "cooler.ratingFitIllConditioned", severity: "warning", message: `${note} Give a wet rating at another fluid flow, airflow or wet-bulb.`, path: `${path}.wetRatings` });
  } else {
    const rInt = rows.reduce((s, r) => s + r.d * r.y, 0) / rows.reduce((s, r) => s + r.d * r.d, 0);
    const fitted = rInt * uaD.ua;
    if (fitted >= SPLIT_RANGE.min && fitted <= SPLIT_RANGE.max) {
      fraction = fitted;
      method = "fitted";
      note = `Tube-side share ${pct(fitted)} of the wet resistance fitted to ${rows.length + 1} wet ratings (least squares, design rating held).`;
    } else {
      note = `Tube-side share ${pct(f0)} kept: the wet ratings give ${pct(fitted)}, outside ${pct(SPLIT_RANGE.min)}–${pct(SPLIT_RANGE.max)}.`;
      warnings.push({ code: "cooler.ratingFitOutOfRange", severity: "warning", message: `${note} Check the ratings' flows, airflows and temperatures.`, path: `${path}.wetRatings` });
    }
  }
  return {
    internalResistanceFraction: fraction,
    method,
    summary: { device: "cooler", method, note, internalResistanceFraction: fraction, points: [] },
    warnings,
  };
}

/**
 * Each rating against the calibrated cooler: design and extra wet ratings (wet model), and the dry rating
 * (dry model with `dryFactor`). Predicted leaving fluid at the rated entering fluid and conditions.
 */
export function coolerRatingChecks(
  sel: CoolerSelection & { wetRatings?: readonly CoolerWetRatingInput[] | undefined },
  internalResistanceFraction: number,
  dryFactor: number,
  usedInFit: boolean,
  pPa: number,
): RatingPointCheck[] {
  const { cpOf, maD, design, uaD } = designRating(sel, pPa);
  if (!uaD) return [];
  const rD = 1 / uaD.ua;
  const rInt = internalResistanceFraction * rD;
  const rExt = rD - rInt;
  const ref = { m: design.m, ma: design.ma, cs: uaD.cs };
  const check = (label: string, r: RatingConditions, used: boolean): RatingPointCheck => {
    const predicted = predictWetLeavingC(r, rInt, rExt, ref, pPa);
    return { label, usedInFit: used, liquidToGasRatio: r.m / r.ma, ratedLeavingC: r.tout, predictedLeavingC: predicted, residualK: predicted - r.tout };
  };
  const out: RatingPointCheck[] = [check("design", design, true)];
  (sel.wetRatings ?? []).forEach((e, i) => {
    const r: RatingConditions = { m: e.fluidFlowKgPerS, cp: cpOf(e.enteringFluidC, e.leavingFluidC), ma: e.airFlowKgPerS ?? maD, tin: e.enteringFluidC, tout: e.leavingFluidC, wb: e.wetBulbC };
    if (!wetRatingUa(r, pPa)) out.push({ label: `wet rating ${i + 2}`, usedInFit: false, liquidToGasRatio: r.m / r.ma, ratedLeavingC: r.tout, rejected: "not reproducible at this airflow" });
    else out.push(check(`wet rating ${i + 2}`, r, usedInFit));
  });
  if (sel.dryRating) {
    const dr = sel.dryRating;
    const cf = design.m * design.cp;
    const hDA = 1 / rExt / uaD.cs;
    const uaExtDry = dryFactor * hDA * CP_DRY_AIR;
    const ua = 1 / (rInt + 1 / uaExtDry);
    const ca = maD * CP_DRY_AIR;
    const cmin = Math.min(ca, cf);
    const q = counterflowEffectiveness(ua / cmin, cmin / Math.max(ca, cf)) * cmin * (dr.enteringFluidC - dr.dryBulbC);
    const predicted = dr.enteringFluidC - q / cf;
    out.push({ label: "dry", usedInFit: true, liquidToGasRatio: design.m / maD, ratedLeavingC: dr.leavingFluidC, predictedLeavingC: predicted, residualK: predicted - dr.leavingFluidC });
  }
  return out;
}
