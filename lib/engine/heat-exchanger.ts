/**
 * Effectiveness–NTU relations of a counterflow heat exchanger.
 * Source: Kays & London, Compact Heat Exchangers; Incropera & DeWitt, Fundamentals of Heat and Mass
 * Transfer, Table 11.3/11.4 (counterflow).
 */
import { newPairMemo, pairMemoGet, pairMemoSet } from "./solvers";

/**
 * Counterflow effectiveness: ε = [1 − e^(−NTU(1−Cr))]/[1 − Cr·e^(−NTU(1−Cr))]; ε = NTU/(1 + NTU) at Cr = 1.
 * NTU = UA/Cmin, Cr = Cmin/Cmax (0…1). Dimensionless.
 */
export function counterflowEffectiveness(ntu: number, capacityRatio: number): number {
  if (!(ntu > 0)) return 0;
  const cr = capacityRatio;
  if (Math.abs(1 - cr) < 1e-6) return ntu / (1 + ntu);
  // The annual loop asks for the same exchanger (the plate exchanger at the month's fouling) hour after
  // hour: the last answer is kept (the same arguments give the same number; no result depends on it).
  const kept = pairMemoGet(COUNTERFLOW_MEMO, ntu, cr);
  if (!Number.isNaN(kept)) return kept;
  const e = Math.exp(-ntu * (1 - cr));
  return pairMemoSet(COUNTERFLOW_MEMO, ntu, cr, (1 - e) / (1 - cr * e));
}

const COUNTERFLOW_MEMO = newPairMemo();

/**
 * Inverse of the counterflow relation: NTU = ln[(1 − Cr·ε)/(1 − ε)]/(1 − Cr); NTU = ε/(1 − ε) at Cr = 1.
 * Returns +∞ for ε ≥ 1 (and for ε ≥ 1/Cr, which no counterflow exchanger reaches).
 */
export function counterflowNtu(effectiveness: number, capacityRatio: number): number {
  const eps = effectiveness;
  const cr = capacityRatio;
  if (!(eps > 0)) return 0;
  if (eps >= 1) return Number.POSITIVE_INFINITY;
  if (Math.abs(1 - cr) < 1e-6) return eps / (1 - eps);
  const arg = (1 - cr * eps) / (1 - eps);
  if (!(arg > 0)) return Number.POSITIVE_INFINITY;
  return Math.log(arg) / (1 - cr);
}

/**
 * Effectiveness of an exchanger with one isothermal stream (condensing refrigerant): ε = 1 − e^(−UA/C).
 * Source: Incropera & DeWitt (Cr = 0 limit of every configuration).
 */
export function isothermalStreamEffectiveness(uaKWPerK: number, capacityRateKWPerK: number): number {
  // The annual loop asks, hour after hour, for the same two condensers (the month's fouled one and its
  // clean reference): the last two answers are kept (the same arguments give the same number).
  const kept = pairMemoGet(ISOTHERMAL_MEMO, uaKWPerK, capacityRateKWPerK);
  if (!Number.isNaN(kept)) return kept;
  return pairMemoSet(ISOTHERMAL_MEMO, uaKWPerK, capacityRateKWPerK, 1 - Math.exp(-uaKWPerK / capacityRateKWPerK));
}

const ISOTHERMAL_MEMO = newPairMemo();
