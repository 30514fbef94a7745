/**
 * Fouling of the tower-water side (condenser tubes of the direct option, plates of the exchanger),
 * growing between cleanings and reset by each cleaning, and the cost-minimising cleaning interval.
 *
 * Growth: asymptotic Kern & Seaton (1959) Rf(t) = Rf∞·(1 − e^(−t/τ)), or linear Rf(t) = a·t.
 * Resolution: calendar months; the schedule is the long-run pattern of cleanings every T months.
 * Optimum interval (renewal cost rate): A(T) = [K + ∫₀ᵀ p(t)dt]/T is least where A(T*) = p(T*);
 * with p = s·Rf(t) and linear growth, T* = √(2K/(s·a)) [pub: standard renewal-cost result].
 */
import { brentRoot } from "./solvers";

export type FoulingGrowth =
  | { model: "asymptotic"; asymptoticM2KPerW: number; timeConstantMonths: number }
  | { model: "linear"; rateM2KPerWPerMonth: number };

/** Fouling resistance after `ageMonths` since the last cleaning, m²·K/W. */
export function foulingResistanceM2KPerW(growth: FoulingGrowth, ageMonths: number): number {
  if (!(ageMonths > 0)) return 0;
  if (growth.model === "linear") return growth.rateM2KPerWPerMonth * ageMonths;
  return growth.asymptoticM2KPerW * (1 - Math.exp(-ageMonths / growth.timeConstantMonths));
}

/** ∫₀ᵗ Rf dt, m²·K/W·month (closed forms of the two growth laws). */
export function integratedFoulingM2KPerWMonths(growth: FoulingGrowth, ageMonths: number): number {
  if (!(ageMonths > 0)) return 0;
  if (growth.model === "linear") return 0.5 * growth.rateM2KPerWPerMonth * ageMonths * ageMonths;
  const tau = growth.timeConstantMonths;
  return growth.asymptoticM2KPerW * (ageMonths - tau * (1 - Math.exp(-ageMonths / tau)));
}

/** Scale a growth law's rate (the economics' fouling-rate factor). */
export function scaleGrowth(growth: FoulingGrowth, factor: number): FoulingGrowth {
  return growth.model === "linear"
    ? { model: "linear", rateM2KPerWPerMonth: growth.rateM2KPerWPerMonth * factor }
    : { model: "asymptotic", asymptoticM2KPerW: growth.asymptoticM2KPerW * factor, timeConstantMonths: growth.timeConstantMonths };
}

function gcd(a: number, b: number): number {
  return b === 0 ? a : gcd(b, a % b);
}

/**
 * Mean fouling resistance in each calendar month (12 values, m²·K/W) for cleanings every
 * `intervalMonths` (integer ≥ 1) in the long run: the pattern repeats every lcm(T, 12) months; each
 * calendar month's value is the average over the years of that pattern of the month-mean
 * Rf = [∫ Rf over the month's age span]/1 month.
 */
export function monthlyFoulingM2KPerW(growth: FoulingGrowth, intervalMonths: number): number[] {
  const t = Math.max(1, Math.round(intervalMonths));
  const years = t / gcd(t, 12);
  const out: number[] = [];
  for (let m = 0; m < 12; m++) {
    let sum = 0;
    for (let y = 0; y < years; y++) {
      const age = (12 * y + m) % t;
      sum += integratedFoulingM2KPerWMonths(growth, age + 1) - integratedFoulingM2KPerWMonths(growth, age);
    }
    out.push(sum / years);
  }
  return out;
}

/** Fouling just before a cleaning (end of an interval), m²·K/W. */
export function peakFoulingM2KPerW(growth: FoulingGrowth, intervalMonths: number): number {
  return foulingResistanceM2KPerW(growth, intervalMonths);
}

/**
 * Average cost rate of cleaning every T months, cost per month:
 * A(T) = [K + s·∫₀ᵀ Rf dt]/T, with K the cost of one cleaning and s the energy cost per month per unit Rf.
 */
export function cleaningCostRatePerMonth(
  growth: FoulingGrowth,
  cleaningCost: number,
  costPerMonthPerUnitFouling: number,
  intervalMonths: number,
): number {
  return (cleaningCost + costPerMonthPerUnitFouling * integratedFoulingM2KPerWMonths(growth, intervalMonths)) / intervalMonths;
}

/**
 * Cost-minimising cleaning interval, months, or null when cleaning never pays for itself by energy
 * alone (asymptotic growth with K ≥ s·Rf∞·τ) or an input is missing (K ≤ 0 or s ≤ 0).
 * Linear growth: T* = √(2K/(s·a)). Asymptotic: root of A(T) = p(T) ⇔ K = s·Rf∞·[τ − e^(−T/τ)·(τ + T)].
 */
export function optimalCleaningIntervalMonths(
  growth: FoulingGrowth,
  cleaningCost: number,
  costPerMonthPerUnitFouling: number,
): number | null {
  const k = cleaningCost;
  const s = costPerMonthPerUnitFouling;
  if (!(k > 0) || !(s > 0)) return null;
  if (growth.model === "linear") {
    if (!(growth.rateM2KPerWPerMonth > 0)) return null;
    return Math.sqrt((2 * k) / (s * growth.rateM2KPerWPerMonth));
  }
  const tau = growth.timeConstantMonths;
  const sr = s * growth.asymptoticM2KPerW;
  if (!(sr > 0) || k >= sr * tau) return null;
  const g = (t: number): number => sr * (tau - Math.exp(-t / tau) * (tau + t)) - k;
  let hi = tau;
  while (g(hi) < 0 && hi < 1e6) hi *= 2;
  return brentRoot(g, 0, hi, g(0), g(hi), 1e-9);
}
