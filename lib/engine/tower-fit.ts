/**
 * Fitting the tower characteristic KaV/L = C·(L/G)^−n to a selection's rating points (Methods §2).
 * Each rating point (water flow, entering and leaving water, entering wet-bulb, and its L/G from the
 * airflow or the fan power) gives the tower's demand KaV/L by the CTI four-point Chebyshev rule — the rule
 * the engine runs the year with. With two or more points at different L/G, C and n come from least squares
 * on ln KaV/L = ln C − n·ln(L/G) [pub: CTI ATC-105 practice of plotting the characteristic on log–log axes];
 * with one point (or all at nearly one L/G, or a fitted n outside its physical range) n stays at its
 * default and only C is fitted. Each point's residual is (supply − demand)/demand at that point, and the
 * leaving water the fitted tower predicts at the point minus the rated one. Pure: SI inside (°C, K, kg/s, Pa).
 */
import { merkelNumberChebyshev, type TowerModel, type TowerSelection } from "./tower";
import { saturatedAirEnthalpyKJPerKg } from "./psychrometrics";
import type { EngineWarning, RatingFitSummary, RatingPointCheck } from "./types";
import { numericWarning, wv } from "./warnings";

export interface TowerRatingPoint {
  waterFlowKgPerS: number;
  enteringWaterC: number;
  leavingWaterC: number;
  wetBulbC: number;
  /** Water-to-air mass ratio at this point (from the airflow, or the fan power by the fan laws). */
  liquidToGasRatio: number;
}

/** A rating point as entered: its airflow, or its fan power, or neither (the fan at full speed). */
export interface TowerRatingPointInput {
  waterFlowKgPerS: number;
  enteringWaterC: number;
  leavingWaterC: number;
  wetBulbC: number;
  airFlowKgPerS?: number;
  fanPowerKW?: number;
}

/** Smallest spread of L/G (largest / smallest) that lets the points say anything about n. */
export const MIN_LIQUID_TO_GAS_SPREAD = 1.1;
/** Physical range of the exponent n (the schema's range of the entered exponent). */
export const EXPONENT_N_RANGE = { min: 0.2, max: 1.2 } as const;

export interface TowerFit {
  coefficientC: number;
  exponentN: number;
  /** "fitted": C and n by least squares; "defaultExponent": n is the default and only C fitted. */
  method: "fitted" | "defaultExponent";
  /** Why the default n was kept: one usable point, points at nearly one L/G, or a fitted n out of range. */
  defaultReason?: "onePoint" | "sameLiquidToGas" | "exponentOutOfRange";
  /** The n least squares gave when it was out of range (then the default is used). */
  rejectedExponentN?: number;
  points: { index: number; liquidToGasRatio: number; demand: number; supply: number; residualFraction: number }[];
  /** Why a point was left out (an operating line through saturation, a leaving water at or below the wet-bulb). */
  rejected: { index: number; reason: string }[];
}

/**
 * L/G of a rating point given by its fan power instead of its airflow: airflow ∝ speed and power ∝ speed³
 * (fan laws), so G = Gd·(P/Pd)^(1/3) and L/G = (L/Ld)·(Pd/P)^(1/3)·(L/G)d.
 */
export function liquidToGasFromFanPower(
  point: { waterFlowKgPerS: number; fanPowerKW: number },
  design: { waterFlowKgPerS: number; fanPowerKW: number; liquidToGasRatio: number },
): number {
  return (point.waterFlowKgPerS / design.waterFlowKgPerS) * Math.cbrt(design.fanPowerKW / point.fanPowerKW) * design.liquidToGasRatio;
}

/** L/G of an entered rating point: from its airflow, else its fan power (fan laws), else the design airflow. */
export function ratingPointLiquidToGas(
  point: TowerRatingPointInput,
  design: { waterFlowKgPerS: number; fanPowerKW: number; liquidToGasRatio: number },
): number {
  if (point.airFlowKgPerS !== undefined && point.airFlowKgPerS > 0) return point.waterFlowKgPerS / point.airFlowKgPerS;
  if (point.fanPowerKW !== undefined && point.fanPowerKW > 0 && design.fanPowerKW > 0)
    return liquidToGasFromFanPower({ waterFlowKgPerS: point.waterFlowKgPerS, fanPowerKW: point.fanPowerKW }, design);
  return (point.waterFlowKgPerS / design.waterFlowKgPerS) * design.liquidToGasRatio;
}

/** Fit C and n to 1–5 rating points at the pressure `pPa`; `defaultExponentN` is used when n cannot be fitted. */
export function fitTowerCharacteristic(points: readonly TowerRatingPoint[], pPa: number, defaultExponentN: number): TowerFit | null {
  const usable: { index: number; lg: number; demand: number }[] = [];
  const rejected: { index: number; reason: string }[] = [];
  points.forEach((p, index) => {
    const range = p.enteringWaterC - p.leavingWaterC;
    if (!(range > 0)) return rejected.push({ index, reason: "the leaving water is not colder than the entering water" });
    if (!(p.leavingWaterC > p.wetBulbC)) return rejected.push({ index, reason: "the leaving water is not above the wet-bulb" });
    const demand = merkelNumberChebyshev(p.leavingWaterC, range, p.liquidToGasRatio, saturatedAirEnthalpyKJPerKg(p.wetBulbC, pPa), pPa);
    if (!Number.isFinite(demand) || demand <= 0) return rejected.push({ index, reason: "at this L/G the air would saturate inside the fill: check the airflow" });
    usable.push({ index, lg: p.liquidToGasRatio, demand });
  });
  if (usable.length === 0) return null;
  const xs = usable.map((u) => Math.log(u.lg));
  const ys = usable.map((u) => Math.log(u.demand));
  const meanX = xs.reduce((a, b) => a + b, 0) / xs.length;
  const meanY = ys.reduce((a, b) => a + b, 0) / ys.length;
  const sxx = xs.reduce((a, x) => a + (x - meanX) ** 2, 0);
  let n = defaultExponentN;
  let method: TowerFit["method"] = "defaultExponent";
  let defaultReason: TowerFit["defaultReason"];
  let rejectedExponentN: number | undefined;
  if (usable.length < 2) defaultReason = "onePoint";
  // Points at (nearly) one L/G say almost nothing about the slope: keep the default exponent.
  else if (Math.max(...xs) - Math.min(...xs) < Math.log(MIN_LIQUID_TO_GAS_SPREAD)) defaultReason = "sameLiquidToGas";
  else {
    const sxy = xs.reduce((a, x, i) => a + (x - meanX) * (ys[i]! - meanY), 0);
    const fitted = -sxy / sxx;
    if (fitted >= EXPONENT_N_RANGE.min && fitted <= EXPONENT_N_RANGE.max) {
      n = fitted;
      method = "fitted";
    } else {
      defaultReason = "exponentOutOfRange";
      rejectedExponentN = fitted;
    }
  }
  const lnC = meanY + n * meanX;
  const c = Math.exp(lnC);
  return {
    coefficientC: c,
    exponentN: n,
    method,
    ...(defaultReason ? { defaultReason } : {}),
    ...(rejectedExponentN !== undefined ? { rejectedExponentN } : {}),
    points: usable.map((u) => {
      const supply = c * Math.pow(u.lg, -n);
      return { index: u.index, liquidToGasRatio: u.lg, demand: u.demand, supply, residualFraction: (supply - u.demand) / u.demand };
    }),
    rejected,
  };
}

/**
 * Leaving (cold) water a tower of characteristic C·(L/G)^−n gives at a range, wet-bulb and L/G, °C:
 * bisection on Chebyshev demand = supply (demand falls as the cold water rises). Not in the hourly loop.
 */
export function fittedColdWaterC(coefficientC: number, exponentN: number, liquidToGasRatio: number, rangeK: number, wetBulbC: number, pPa: number): number {
  const supply = coefficientC * Math.pow(liquidToGasRatio, -exponentN);
  const haIn = saturatedAirEnthalpyKJPerKg(wetBulbC, pPa);
  let lo = wetBulbC + 1e-3;
  let hi = wetBulbC + 60;
  for (let k = 0; k < 60; k++) {
    const mid = 0.5 * (lo + hi);
    const d = merkelNumberChebyshev(mid, rangeK, liquidToGasRatio, haIn, pPa);
    if (!Number.isFinite(d) || d <= 0 || d > supply) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

const r3 = (v: number) => Math.round(v * 1000) / 1000;

/**
 * Calibrate a tower on its selection's rating points: C and n fitted (or C with the default n), put into
 * the model calibrated on the design point, with each point's residual and the design point's check.
 * Without rating points the model is returned as it is (C from the design point, the entered n).
 */
export function calibrateTowerOnRatings(
  model: TowerModel,
  selection: TowerSelection & { ratingPoints?: readonly TowerRatingPointInput[] | undefined },
  fanDesignPowerKW: number,
  pPa: number,
  path: string,
): { model: TowerModel; summary: RatingFitSummary; warnings: EngineWarning[] } {
  const warnings: EngineWarning[] = [];
  const n0 = selection.characteristicExponent;
  const ratings = selection.ratingPoints ?? [];
  const designCheck = (c: number, n: number, usedInFit: boolean): RatingPointCheck => {
    const range = selection.enteringWaterC - selection.leavingWaterC;
    const predicted = fittedColdWaterC(c, n, model.designLiquidToGasRatio, range, selection.designWetBulbC, pPa);
    return {
      label: "design",
      usedInFit,
      liquidToGasRatio: model.designLiquidToGasRatio,
      demandKaVL: model.designMerkel,
      fittedKaVL: c * Math.pow(model.designLiquidToGasRatio, -n),
      ratedLeavingC: selection.leavingWaterC,
      predictedLeavingC: predicted,
      residualK: predicted - selection.leavingWaterC,
    };
  };
  if (ratings.length === 0) {
    return {
      model,
      summary: {
        device: "tower",
        method: "designPoint",
        note: `No rating points: C from the design point, n = ${r3(n0)} (entered or default).`,
        coefficientC: model.coefficientC,
        exponentN: model.exponentN,
        points: [designCheck(model.coefficientC, model.exponentN, true)],
      },
      warnings,
    };
  }
  const design = { waterFlowKgPerS: selection.waterFlowKgPerS, fanPowerKW: fanDesignPowerKW, liquidToGasRatio: model.designLiquidToGasRatio };
  const pts: TowerRatingPoint[] = ratings.map((p) => ({
    waterFlowKgPerS: p.waterFlowKgPerS,
    enteringWaterC: p.enteringWaterC,
    leavingWaterC: p.leavingWaterC,
    wetBulbC: p.wetBulbC,
    liquidToGasRatio: ratingPointLiquidToGas(p, design),
  }));
  const fit = fitTowerCharacteristic(pts, pPa, n0);
  if (!fit) {
    warnings.push({
      code: "tower.ratingPointsUnusable",
      severity: "warning",
      message: "None of the tower's rating points can be used (see each point); C comes from the design point and n is the entered value.",
      path: `${path}.ratingPoints`,
    });
    return {
      model,
      summary: {
        device: "tower",
        method: "designPoint",
        note: `No usable rating point: C from the design point, n = ${r3(n0)}.`,
        coefficientC: model.coefficientC,
        exponentN: model.exponentN,
        points: [
          ...pts.map((p, i) => rejectedCheck(p, i, fit)),
          designCheck(model.coefficientC, model.exponentN, true),
        ],
      },
      warnings,
    };
  }
  const count = fit.points.length;
  let note: string;
  if (fit.method === "fitted") note = `C = ${r3(fit.coefficientC)} and n = ${r3(fit.exponentN)} fitted to ${count} rating points (least squares on ln KaV/L vs ln L/G).`;
  else if (fit.defaultReason === "onePoint") note = `n = ${r3(n0)} default, one rating point; C = ${r3(fit.coefficientC)} fitted to it.`;
  else if (fit.defaultReason === "sameLiquidToGas")
    note = `n = ${r3(n0)} default: the ${count} rating points are at nearly the same L/G (less than ${Math.round((MIN_LIQUID_TO_GAS_SPREAD - 1) * 100)} % apart), so the slope cannot be fitted; C = ${r3(fit.coefficientC)} fitted.`;
  else note = `n = ${r3(n0)} default: the points give n = ${r3(fit.rejectedExponentN ?? Number.NaN)}, outside ${EXPONENT_N_RANGE.min}–${EXPONENT_N_RANGE.max}; C = ${r3(fit.coefficientC)} fitted.`;
  if (fit.defaultReason === "sameLiquidToGas" || fit.defaultReason === "exponentOutOfRange") {
    warnings.push({
      code: fit.defaultReason === "sameLiquidToGas" ? "tower.ratingFitIllConditioned" : "tower.ratingFitExponentOutOfRange",
      severity: "warning",
      message: `${note} Give rating points at different water flows or fan speeds to fit n.`,
      path: `${path}.ratingPoints`,
    });
  }
  for (const r of fit.rejected)
    warnings.push({ code: "tower.ratingPointRejected", severity: "warning", message: `Tower rating point ${r.index + 1} was left out: ${r.reason}.`, path: `${path}.ratingPoints.${r.index}` });
  const checks: RatingPointCheck[] = pts.map((p, i) => {
    const f = fit.points.find((q) => q.index === i);
    if (!f) return rejectedCheck(p, i, fit);
    const predicted = fittedColdWaterC(fit.coefficientC, fit.exponentN, p.liquidToGasRatio, p.enteringWaterC - p.leavingWaterC, p.wetBulbC, pPa);
    return {
      label: `rating ${i + 1}`,
      usedInFit: true,
      liquidToGasRatio: p.liquidToGasRatio,
      demandKaVL: f.demand,
      fittedKaVL: f.supply,
      ratedLeavingC: p.leavingWaterC,
      predictedLeavingC: predicted,
      residualK: predicted - p.leavingWaterC,
    };
  });
  const design0 = designCheck(fit.coefficientC, fit.exponentN, false);
  checks.push(design0);
  const designResidualK = design0.residualK ?? 0;
  if (Math.abs(designResidualK) > 0.5) {
    warnings.push(
      numericWarning({
        code: "tower.designOffFittedCharacteristic",
        severity: "info",
        template: `With the characteristic fitted to the rating points, the design point's leaving water is predicted ${designResidualK > 0 ? "warmer" : "colder"} than stated by {d}: check the design L/G and the rating points.`,
        values: { d: wv.dK(Math.abs(designResidualK)) },
        path: `${path}.designLiquidToGasRatio`,
      }),
    );
  }
  return {
    model: {
      ...model,
      coefficientC: fit.coefficientC,
      exponentN: fit.exponentN,
      designMerkel: fit.coefficientC * Math.pow(model.designLiquidToGasRatio, -fit.exponentN),
    },
    summary: {
      device: "tower",
      method: fit.method,
      note,
      coefficientC: fit.coefficientC,
      exponentN: fit.exponentN,
      points: checks,
    },
    warnings,
  };
}

function rejectedCheck(p: TowerRatingPoint, i: number, fit: TowerFit | null): RatingPointCheck {
  return {
    label: `rating ${i + 1}`,
    usedInFit: false,
    liquidToGasRatio: p.liquidToGasRatio,
    ratedLeavingC: p.leavingWaterC,
    rejected: fit?.rejected.find((r) => r.index === i)?.reason ?? "not usable",
  };
}
