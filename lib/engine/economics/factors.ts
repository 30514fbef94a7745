/**
 * Discount factors of NIST Handbook 135 (Fuller & Petersen, 1995 edition, "Life-Cycle Costing Manual
 * for the Federal Energy Management Program"), section 4 and its Table 4-1 / Appendix factor formulas.
 *
 * d = discount rate (real in a real analysis, nominal in a nominal one), e = escalation rate of the
 * cost stream on the same basis, n = years, t = time in years from the base date. All rates are
 * fractions per year.
 */

/**
 * Below this |d − e| (or |d| for UPV) the closed forms lose digits to cancellation (0/0 in the limit),
 * so the factor is summed term by term instead, which is exact to rounding for the integer study
 * periods the schema allows.
 */
const NEAR_EQUAL_RATES = 1e-5;

/** Σ_{t=1..n} x^t by direct summation (n a whole number of years). */
function geometricSum(x: number, n: number): number {
  let s = 0;
  let p = 1;
  for (let t = 1; t <= n; t++) {
    p *= x;
    s += p;
  }
  return s;
}

/**
 * Single present value factor SPV(d, t) = (1 + d)^−t: the present value of 1 paid at time t.
 * Source: NIST Handbook 135, SPV formula (Table 4-1). Units: dimensionless; t in years (may be fractional).
 */
export function spv(d: number, t: number): number {
  return Math.pow(1 + d, -t);
}

/**
 * Uniform present value factor UPV(d, n) = [(1 + d)^n − 1] / [d·(1 + d)^n]: present value of 1 paid at
 * the end of each of n years. UPV(0, n) = n. Source: NIST Handbook 135, UPV formula (Table 4-1).
 */
export function upv(d: number, n: number): number {
  if (Math.abs(d) < NEAR_EQUAL_RATES && Number.isInteger(n)) return geometricSum(1 / (1 + d), n);
  const g = Math.pow(1 + d, n);
  return (g - 1) / (d * g);
}

/**
 * Modified uniform present value factor for a stream escalating at e per year:
 * UPV*(d, e, n) = [(1 + e)/(d − e)]·[1 − ((1 + e)/(1 + d))^n] = Σ_{t=1..n} ((1 + e)/(1 + d))^t,
 * with the limit n when d = e. The first payment, at the end of year 1, is the base-date price × (1 + e).
 * Source: NIST Handbook 135, UPV* formula (Table 4-1).
 */
export function upvStar(d: number, e: number, n: number): number {
  if (d === e) return n;
  if (Math.abs(d - e) < NEAR_EQUAL_RATES && Number.isInteger(n)) return geometricSum((1 + e) / (1 + d), n);
  return ((1 + e) / (d - e)) * (1 - Math.pow((1 + e) / (1 + d), n));
}

/**
 * SPV under the mid-year convention: a payment within year t (t ≥ 1) is discounted from t − 0.5.
 * Source: NIST Handbook 135 (mid-year discounting convention for recurring annual costs).
 */
export function spvMidYear(d: number, t: number): number {
  return Math.pow(1 + d, -(t - 0.5));
}

/**
 * UPV under the mid-year convention: Σ_{t=1..n} (1 + d)^−(t − 0.5) = UPV(d, n)·(1 + d)^0.5.
 * Source: NIST Handbook 135, mid-year convention.
 */
export function upvMidYear(d: number, n: number): number {
  return upv(d, n) * Math.sqrt(1 + d);
}

/**
 * UPV* under the mid-year convention, with the price escalated to the same mid-year date it is paid:
 * Σ_{t=1..n} ((1 + e)/(1 + d))^(t − 0.5) = UPV*(d, e, n)·((1 + d)/(1 + e))^0.5.
 * Source: NIST Handbook 135, mid-year convention applied to the UPV* series.
 */
export function upvStarMidYear(d: number, e: number, n: number): number {
  return upvStar(d, e, n) * Math.sqrt((1 + d) / (1 + e));
}

/**
 * Nominal rate from a real rate and general inflation: (1 + D) = (1 + d)(1 + I).
 * Source: NIST Handbook 135, relation between nominal and real discount rates (section 4).
 */
export function nominalFromReal(realRate: number, inflationRate: number): number {
  return (1 + realRate) * (1 + inflationRate) - 1;
}

/** Real rate from a nominal rate and general inflation: d = (1 + D)/(1 + I) − 1. Source: NIST Handbook 135. */
export function realFromNominal(nominalRate: number, inflationRate: number): number {
  return (1 + nominalRate) / (1 + inflationRate) - 1;
}

/**
 * Capital recovery factor CRF(d, n) = 1/UPV(d, n) = d(1 + d)^n / [(1 + d)^n − 1]: the level yearly amount
 * over n years with a present value of 1 (annualised cost = PV × CRF). Source: NIST Handbook 135.
 */
export function crf(d: number, n: number): number {
  return 1 / upv(d, n);
}

/**
 * Adjusted internal rate of return from the SIR: AIRR = (1 + r)·SIR^(1/N) − 1, r the discount rate of
 * the analysis, N the study period. Source: ASTM E1057; NIST Handbook 135 (AIRR from SIR).
 */
export function airrFromSir(sir: number, discountRate: number, studyPeriodYears: number): number {
  return (1 + discountRate) * Math.pow(sir, 1 / studyPeriodYears) - 1;
}
