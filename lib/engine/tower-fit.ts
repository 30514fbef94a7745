/**
 * Fitting the tower characteristic KaV/L = C·(L/G)^−n to a selection's rating points (Methods §2).
 * Each rating point (water flow, entering and leaving water, entering wet-bulb, and its L/G from the
 * airflow or the fan power) gives the tower's demand KaV/L by the CTI four-point Chebyshev rule — the rule
 * the engine runs the year with. With two or more points at different L/G, C and n come from least squares
 * on ln KaV/L = ln C − n·ln(L/G) [pub: CTI ATC-105 practice of plotting the characteristic on log–log axes];
 * with one point (or all at one L/G) n stays at its default and only C is fitted. Each point's residual is
 * (supply − demand)/demand at that point. Pure: SI inside (°C, K, kg/s, kPa as Pa).
 */
import { merkelNumberChebyshev } from "./tower";
import { saturatedAirEnthalpyKJPerKg } from "./psychrometrics";

export interface TowerRatingPoint {
  waterFlowKgPerS: number;
  enteringWaterC: number;
  leavingWaterC: number;
  wetBulbC: number;
  /** Water-to-air mass ratio at this point (from the airflow, or the fan power by the fan laws). */
  liquidToGasRatio: number;
}

export interface TowerFit {
  coefficientC: number;
  exponentN: number;
  /** "fitted": C and n by least squares; "defaultExponent": one L/G only, n is the default and only C fitted. */
  method: "fitted" | "defaultExponent";
  points: { liquidToGasRatio: number; demand: number; supply: number; residualFraction: number }[];
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

/** Fit C and n to 1–5 rating points at the pressure `pPa`; `defaultExponentN` is used with one L/G only. */
export function fitTowerCharacteristic(points: readonly TowerRatingPoint[], pPa: number, defaultExponentN: number): TowerFit | null {
  const usable: { lg: number; demand: number }[] = [];
  const rejected: { index: number; reason: string }[] = [];
  points.forEach((p, index) => {
    const range = p.enteringWaterC - p.leavingWaterC;
    if (!(range > 0)) return rejected.push({ index, reason: "the leaving water is not colder than the entering water" });
    if (!(p.leavingWaterC > p.wetBulbC)) return rejected.push({ index, reason: "the leaving water is not above the wet-bulb" });
    const demand = merkelNumberChebyshev(p.leavingWaterC, range, p.liquidToGasRatio, saturatedAirEnthalpyKJPerKg(p.wetBulbC, pPa), pPa);
    if (!Number.isFinite(demand) || demand <= 0) return rejected.push({ index, reason: "at this L/G the air would saturate inside the fill: check the airflow" });
    usable.push({ lg: p.liquidToGasRatio, demand });
  });
  if (usable.length === 0) return null;
  const xs = usable.map((u) => Math.log(u.lg));
  const ys = usable.map((u) => Math.log(u.demand));
  const meanX = xs.reduce((a, b) => a + b, 0) / xs.length;
  const meanY = ys.reduce((a, b) => a + b, 0) / ys.length;
  const sxx = xs.reduce((a, x) => a + (x - meanX) ** 2, 0);
  let n = defaultExponentN;
  let method: TowerFit["method"] = "defaultExponent";
  // Points at (nearly) one L/G say nothing about the slope: keep the default exponent.
  if (usable.length >= 2 && sxx > 1e-6) {
    const sxy = xs.reduce((a, x, i) => a + (x - meanX) * (ys[i]! - meanY), 0);
    n = -sxy / sxx;
    method = "fitted";
  }
  const lnC = meanY + n * meanX;
  const c = Math.exp(lnC);
  return {
    coefficientC: c,
    exponentN: n,
    method,
    points: usable.map((u) => {
      const supply = c * Math.pow(u.lg, -n);
      return { liquidToGasRatio: u.lg, demand: u.demand, supply, residualFraction: (supply - u.demand) / u.demand };
    }),
    rejected,
  };
}
