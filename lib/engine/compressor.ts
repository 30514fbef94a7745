/**
 * Compressor power against condensing temperature: every option pays its own compressor energy at the
 * condensing temperature it reaches in each hour. Four models, each calibrated so that its COP at the
 * condensing set-point is the duty's design COP (the rejection ↔ refrigeration relation of the duty):
 *
 * - **refrigerantCycle** (the refrigerant-aware default): COP(Tc) = COPd·COPis(Te, Tc)/COPis(Te, Tset),
 *   COPis the isentropic single-stage saturated cycle (saturated vapour at the suction, saturated liquid
 *   at the condenser outlet, no subcooling, isenthalpic expansion) of R-717 or R-134a, fitted in this file
 *   to values computed with the CoolProp reference library. The implied isentropic efficiency
 *   η = COPd/COPis(Te, Tset) is reported.
 * - **manufacturer**: the selection's power or COP at three or more condensing temperatures (one or two
 *   suction temperatures); power per unit refrigeration, 1/COP, interpolated by the monotone piecewise
 *   cubic of Fritsch & Carlson (1980), SIAM J. Numer. Anal. 17:238–246; outside the data, linear with the
 *   end slope, flagged so the annual result can warn.
 * - **percentPerK**: W = Wd·(1 + p/100)^(Tc − Tset), compounding per kelvin, never below floor·Wd
 *   (2–4 %/K industrial refrigeration, 1–2 % per °F of entering condenser water for chillers [practice]).
 * - **carnotFraction**, the simplest: COP = η·Te/(Tc − Te) (K), η from the design point; its sensitivity
 *   1/(Tc − Te) per K is 15–25 % below a real ammonia cycle's.
 *
 * Heat rejected = refrigeration load × (1 + 1/COP). Units: °C, kW.
 */

const KELVIN = 273.15;

/** Refrigerants whose single-stage cycle is fitted here. */
export type CycleRefrigerant = "R717" | "R134a";

export const CYCLE_REFRIGERANT_LABELS: Record<CycleRefrigerant, string> = { R717: "ammonia (R-717)", R134a: "R-134a" };

/** Monotone cubic through (x, y) with the Fritsch–Carlson slopes; x strictly increasing. */
export interface MonotoneCurve {
  x: number[];
  y: number[];
  /** Slopes dy/dx at the knots. */
  m: number[];
}

export type CompressorModel =
  | { kind: "carnotFraction"; carnotEfficiency: number; evaporatingK: number }
  | { kind: "percentPerK"; percentPerK: number; designKWPerKW: number; setPointC: number; floorFraction: number }
  | { kind: "refrigerantCycle"; refrigerant: CycleRefrigerant; evaporatingC: number; isentropicEfficiency: number }
  | { kind: "manufacturer"; kwPerKW: MonotoneCurve };

// ---------------------------------------------------------------------------------------------------
// Refrigerant cycles
// ---------------------------------------------------------------------------------------------------

/**
 * ln(COPis/COPcarnot) = Σ c_ij·x^i·y^j, x = te/50, y = tc/50 (°C), i + j ≤ 3: a least-squares fit over
 * R-717 te −50…15 °C, tc 10…55 °C and R-134a te −40…20 °C, tc 10…60 °C (tc − te ≥ 8 K, 2.5 K grid) of the
 * isentropic single-stage saturated cycle computed with CoolProp 8.0.0 (PropsSI; h1, s1 saturated vapour
 * at te, h2s at (p_sat(tc), s1), h3 saturated liquid at tc). Largest error of COPis over the grid: R-717
 * 0.014 %, R-134a 0.26 %. Keys "ij".
 */
const CYCLE_FITS: Record<CycleRefrigerant, { c: Record<string, number>; teC: [number, number]; tcC: [number, number] }> = {
  R717: {
    c: {
      "00": -0.0049219985,
      "01": -0.1928065,
      "02": 0.0027455661,
      "03": -0.014292347,
      "10": 0.18006761,
      "11": 0.026894825,
      "12": -0.0018146227,
      "20": -0.035027012,
      "21": 0.00096521051,
      "30": 0.013426763,
    },
    teC: [-50, 15],
    tcC: [10, 55],
  },
  R134a: {
    c: {
      "00": -0.0015090955,
      "01": -0.24177509,
      "02": 0.043157775,
      "03": -0.0973143,
      "10": 0.18203994,
      "11": 0.0038305035,
      "12": 0.084965818,
      "20": -0.0057916692,
      "21": -0.039488312,
      "30": 0.010962751,
    },
    teC: [-40, 20],
    tcC: [10, 60],
  },
};

/** Range of evaporating and condensing temperatures over which a refrigerant's cycle fit holds, °C. */
export function refrigerantCycleFitRange(refrigerant: CycleRefrigerant): { evaporatingC: [number, number]; condensingC: [number, number]; minimumLiftK: number } {
  const f = CYCLE_FITS[refrigerant];
  return { evaporatingC: f.teC, condensingC: f.tcC, minimumLiftK: 8 };
}

/**
 * COP of the isentropic single-stage saturated cycle (η = 1), dimensionless:
 * COPis = COPcarnot·exp(Σ c_ij·(te/50)^i·(tc/50)^j), COPcarnot = Te/(Tc − Te) (K). Outside the fitted
 * range the correction is held at its value on the range's edge (the Carnot factor stays exact).
 * Source: fit of CoolProp 8.0.0 cycle values (see CYCLE_FITS). Multiply by an isentropic efficiency for a
 * real compressor: COP = η·COPis.
 */
export function isentropicCycleCop(refrigerant: CycleRefrigerant, evaporatingC: number, condensingC: number): number {
  const f = CYCLE_FITS[refrigerant];
  const te = clamp(evaporatingC, f.teC[0], f.teC[1]);
  const tc = clamp(Math.max(condensingC, te + 8), f.tcC[0], f.tcC[1]);
  const x = te / 50;
  const y = tc / 50;
  const c = f.c;
  const lnF =
    (c["00"] ?? 0) +
    y * ((c["01"] ?? 0) + y * ((c["02"] ?? 0) + y * (c["03"] ?? 0))) +
    x * ((c["10"] ?? 0) + y * ((c["11"] ?? 0) + y * (c["12"] ?? 0))) +
    x * x * ((c["20"] ?? 0) + y * (c["21"] ?? 0)) +
    x * x * x * (c["30"] ?? 0);
  const carnot = (evaporatingC + KELVIN) / Math.max(condensingC - evaporatingC, 1);
  return carnot * Math.exp(lnF);
}

// ---------------------------------------------------------------------------------------------------
// Monotone interpolation (manufacturer's data)
// ---------------------------------------------------------------------------------------------------

/**
 * Monotone piecewise-cubic Hermite interpolant through strictly increasing x: secant slopes δk, knot
 * slopes by the three-point formula, set to 0 where the data turn and limited so that α² + β² ≤ 9.
 * Source: Fritsch & Carlson (1980), SIAM J. Numer. Anal. 17(2):238–246.
 */
export function monotoneCurve(x: readonly number[], y: readonly number[]): MonotoneCurve {
  const n = x.length;
  const delta: number[] = [];
  for (let k = 0; k < n - 1; k++) delta.push(((y[k + 1] ?? 0) - (y[k] ?? 0)) / ((x[k + 1] ?? 0) - (x[k] ?? 0)));
  const m: number[] = new Array<number>(n).fill(0);
  if (n === 2) {
    m[0] = delta[0] ?? 0;
    m[1] = delta[0] ?? 0;
  } else if (n > 2) {
    m[0] = delta[0] ?? 0;
    m[n - 1] = delta[n - 2] ?? 0;
    for (let k = 1; k < n - 1; k++) {
      const a = delta[k - 1] ?? 0;
      const b = delta[k] ?? 0;
      m[k] = a * b <= 0 ? 0 : 0.5 * (a + b);
    }
    for (let k = 0; k < n - 1; k++) {
      const d = delta[k] ?? 0;
      if (d === 0) {
        m[k] = 0;
        m[k + 1] = 0;
        continue;
      }
      const alpha = (m[k] ?? 0) / d;
      const beta = (m[k + 1] ?? 0) / d;
      const s = alpha * alpha + beta * beta;
      if (s > 9) {
        const tau = 3 / Math.sqrt(s);
        m[k] = tau * alpha * d;
        m[k + 1] = tau * beta * d;
      }
    }
  }
  return { x: [...x], y: [...y], m };
}

/** Value of a monotone curve; outside its knots, the straight line with the end knot's slope. */
export function evaluateMonotoneCurve(c: MonotoneCurve, x: number): number {
  const n = c.x.length;
  const x0 = c.x[0] ?? 0;
  const xn = c.x[n - 1] ?? 0;
  if (x <= x0) return (c.y[0] ?? 0) + (c.m[0] ?? 0) * (x - x0);
  if (x >= xn) return (c.y[n - 1] ?? 0) + (c.m[n - 1] ?? 0) * (x - xn);
  let k = 0;
  while (k < n - 2 && x > (c.x[k + 1] ?? 0)) k++;
  const xa = c.x[k] ?? 0;
  const h = (c.x[k + 1] ?? 0) - xa;
  const t = (x - xa) / h;
  const t2 = t * t;
  const t3 = t2 * t;
  return (
    (2 * t3 - 3 * t2 + 1) * (c.y[k] ?? 0) +
    (t3 - 2 * t2 + t) * h * (c.m[k] ?? 0) +
    (-2 * t3 + 3 * t2) * (c.y[k + 1] ?? 0) +
    (t3 - t2) * h * (c.m[k + 1] ?? 0)
  );
}

/** The manufacturer's points at one suction temperature: condensing °C → COP. */
export interface CompressorDataCurve {
  evaporatingC: number;
  points: { condensingC: number; cop: number }[];
}

/**
 * Power per unit refrigeration (1/COP) against condensing temperature at the duty's evaporating
 * temperature: one curve as given, or, with two suction temperatures, 1/COP linear in Te between them at
 * each condensing temperature of the first curve. `extrapolatedSuction` when the duty's Te is outside them.
 */
export function manufacturerCurve(curves: readonly CompressorDataCurve[], evaporatingC: number): { curve: MonotoneCurve; extrapolatedSuction: boolean } {
  const build = (c: CompressorDataCurve): MonotoneCurve => {
    const pts = [...c.points].sort((a, b) => a.condensingC - b.condensingC);
    return monotoneCurve(
      pts.map((p) => p.condensingC),
      pts.map((p) => 1 / p.cop),
    );
  };
  const first = curves[0];
  if (!first) return { curve: monotoneCurve([0, 1], [0, 0]), extrapolatedSuction: false };
  const second = curves[1];
  if (!second || second.evaporatingC === first.evaporatingC) return { curve: build(first), extrapolatedSuction: false };
  const a = build(first);
  const b = build(second);
  const w = (evaporatingC - first.evaporatingC) / (second.evaporatingC - first.evaporatingC);
  const xs = a.x.filter((x) => x >= (b.x[0] ?? 0) && x <= (b.x[b.x.length - 1] ?? 0));
  const grid = xs.length >= 2 ? xs : a.x;
  const ys = grid.map((x) => (1 - w) * evaluateMonotoneCurve(a, x) + w * evaluateMonotoneCurve(b, x));
  return { curve: monotoneCurve(grid, ys), extrapolatedSuction: w < -1e-9 || w > 1 + 1e-9 };
}

// ---------------------------------------------------------------------------------------------------
// Calibration and evaluation
// ---------------------------------------------------------------------------------------------------

/** Carnot efficiency from a design point: η = COP·(Tc − Te)/Te, K. Dimensionless. */
export function carnotEfficiency(designCop: number, condensingC: number, evaporatingC: number): number {
  return (designCop * (condensingC - evaporatingC)) / (evaporatingC + KELVIN);
}

/** COP of the Carnot-fraction model at a condensing temperature: η·Te/(Tc − Te). */
export function carnotFractionCop(model: { carnotEfficiency: number; evaporatingK: number }, condensingC: number): number {
  return (model.carnotEfficiency * model.evaporatingK) / (condensingC + KELVIN - model.evaporatingK);
}

/** Isentropic efficiency that makes the refrigerant cycle give the design COP at the set-point: η = COPd/COPis. */
export function impliedIsentropicEfficiency(refrigerant: CycleRefrigerant, designCop: number, evaporatingC: number, setPointC: number): number {
  return designCop / isentropicCycleCop(refrigerant, evaporatingC, setPointC);
}

/**
 * Compressor power at a condensing temperature, kW, for a refrigeration load Qe (kW):
 * W = Qe/COP(Tc) (Carnot fraction, refrigerant cycle, manufacturer's data) or
 * W = (Qe/COPd)·max((1 + p/100)^(Tc − Tset), floor) (per cent per K).
 */
export function compressorPowerKW(model: CompressorModel, refrigerationLoadKW: number, condensingC: number): number {
  switch (model.kind) {
    case "carnotFraction":
      return refrigerationLoadKW / carnotFractionCop(model, condensingC);
    case "percentPerK": {
      const factor = Math.pow(1 + model.percentPerK / 100, condensingC - model.setPointC);
      return refrigerationLoadKW * model.designKWPerKW * (factor > model.floorFraction ? factor : model.floorFraction);
    }
    case "refrigerantCycle":
      return refrigerationLoadKW / (model.isentropicEfficiency * isentropicCycleCop(model.refrigerant, model.evaporatingC, condensingC));
    case "manufacturer": {
      const kwPerKW = evaluateMonotoneCurve(model.kwPerKW, condensingC);
      return refrigerationLoadKW * (kwPerKW > 0 ? kwPerKW : 0);
    }
  }
}

/** dW/dTc, kW/K, by a central difference of ±0.05 K (every model is smooth at that scale). */
export function compressorPowerSlopeKWPerK(model: CompressorModel, refrigerationLoadKW: number, condensingC: number): number {
  return (compressorPowerKW(model, refrigerationLoadKW, condensingC + 0.05) - compressorPowerKW(model, refrigerationLoadKW, condensingC - 0.05)) / 0.1;
}

/** d²W/dTc², kW/K², by the central second difference over the same ±0.05 K. */
export function compressorPowerCurvatureKWPerK2(model: CompressorModel, refrigerationLoadKW: number, condensingC: number): number {
  return (
    (compressorPowerKW(model, refrigerationLoadKW, condensingC + 0.05) - 2 * compressorPowerKW(model, refrigerationLoadKW, condensingC) + compressorPowerKW(model, refrigerationLoadKW, condensingC - 0.05)) /
    0.0025
  );
}

/** True where the manufacturer's model is outside its data (more than 0.01 K beyond the end points). */
export function compressorExtrapolates(model: CompressorModel, condensingC: number): boolean {
  if (model.kind !== "manufacturer") return false;
  const x = model.kwPerKW.x;
  return condensingC < (x[0] ?? 0) - 0.01 || condensingC > (x[x.length - 1] ?? 0) + 0.01;
}

/**
 * Extra compressor power when condensing at Tc instead of Tref, kW (negative if Tc < Tref):
 * W(Tc) − W(Tref) with the same model. Explains a condensing-temperature difference; never priced.
 */
export function compressorPenaltyKW(model: CompressorModel, refrigerationLoadKW: number, condensingC: number, referenceCondensingC: number): number {
  return compressorPowerKW(model, refrigerationLoadKW, condensingC) - compressorPowerKW(model, refrigerationLoadKW, referenceCondensingC);
}

/** Refrigeration load from the heat rejected: Qe = Qrej·COP/(1 + COP), kW. */
export function refrigerationLoadFromRejectionKW(heatRejectedKW: number, cop: number): number {
  return (heatRejectedKW * cop) / (1 + cop);
}

function clamp(x: number, lo: number, hi: number): number {
  return x < lo ? lo : x > hi ? hi : x;
}
