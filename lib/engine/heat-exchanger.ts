/**
 * Effectiveness–NTU relations of a counterflow heat exchanger.
 * Source: Kays & London, Compact Heat Exchangers; Incropera & DeWitt, Fundamentals of Heat and Mass
 * Transfer, Table 11.3/11.4 (counterflow).
 */

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
  const m = COUNTERFLOW_MEMO;
  if (ntu === m.ntu && cr === m.cr) return m.eps;
  const e = Math.exp(-ntu * (1 - cr));
  const eps = (1 - e) / (1 - cr * e);
  m.ntu = ntu;
  m.cr = cr;
  m.eps = eps;
  return eps;
}

const COUNTERFLOW_MEMO = { ntu: Number.NaN, cr: Number.NaN, eps: 0 };

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
  const m = ISOTHERMAL_MEMO;
  if (uaKWPerK === m.ua0 && capacityRateKWPerK === m.c0) return m.eps0;
  if (uaKWPerK === m.ua1 && capacityRateKWPerK === m.c1) return m.eps1;
  const eps = 1 - Math.exp(-uaKWPerK / capacityRateKWPerK);
  if (m.next === 0) {
    m.ua0 = uaKWPerK;
    m.c0 = capacityRateKWPerK;
    m.eps0 = eps;
    m.next = 1;
  } else {
    m.ua1 = uaKWPerK;
    m.c1 = capacityRateKWPerK;
    m.eps1 = eps;
    m.next = 0;
  }
  return eps;
}

const ISOTHERMAL_MEMO = { ua0: Number.NaN, c0: Number.NaN, eps0: 0, ua1: Number.NaN, c1: Number.NaN, eps1: 0, next: 0 };
