/**
 * Plate-and-frame exchanger isolating the tower water from a clean condenser loop.
 *
 * Hot side: clean loop returning from the condenser; cold side: tower water. The exchanger's
 * approach = clean-loop supply − tower cold water = Q·(1/(ε·Cmin) − 1/Chot); balanced counterflow
 * (Chot = Ccold): approach = R·(1 − ε)/ε. UA calibrated at the design approach; constant flows keep
 * UA (and so ε) constant, fouling lowers it: UA = UAclean/(1 + Rf·Uclean).
 * Source: counterflow ε-NTU (Incropera & DeWitt; Kays & London); Methods §5.
 */
import { counterflowEffectiveness, counterflowNtu } from "./heat-exchanger";

/**
 * Clean UA of the exchanger from its design approach, kW/K:
 * ε = 1/(Cmin·(approach/Q + 1/Chot)), NTU from the counterflow relation, UA = NTU·Cmin.
 */
export function calibratePlateExchangerUaKWPerK(
  designHeatKW: number,
  designApproachK: number,
  hotCapacityKWPerK: number,
  coldCapacityKWPerK: number,
): number {
  const cmin = Math.min(hotCapacityKWPerK, coldCapacityKWPerK);
  const cr = cmin / Math.max(hotCapacityKWPerK, coldCapacityKWPerK);
  const eps = 1 / (cmin * (designApproachK / designHeatKW + 1 / hotCapacityKWPerK));
  return counterflowNtu(eps, cr) * cmin;
}

/** Approach of the exchanger at a heat load, K: Q·(1/(ε·Cmin) − 1/Chot). */
export function plateExchangerApproachK(
  heatKW: number,
  uaKWPerK: number,
  hotCapacityKWPerK: number,
  coldCapacityKWPerK: number,
): number {
  const cmin = Math.min(hotCapacityKWPerK, coldCapacityKWPerK);
  const cr = cmin / Math.max(hotCapacityKWPerK, coldCapacityKWPerK);
  const eps = counterflowEffectiveness(uaKWPerK / cmin, cr);
  return heatKW * (1 / (eps * cmin) - 1 / hotCapacityKWPerK);
}

/** Balanced counterflow approach from range and effectiveness: R·(1 − ε)/ε, K. */
export function balancedCounterflowApproachK(rangeK: number, effectiveness: number): number {
  return (rangeK * (1 - effectiveness)) / effectiveness;
}
