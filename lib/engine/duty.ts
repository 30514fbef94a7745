/**
 * Heat-rejection duty: design value, load profile, and the refrigeration load behind it.
 * Heat rejected = refrigeration load × (1 + 1/COP) (first law for the refrigerating plant).
 */
import type { DutyInput, LoadProfileInput } from "./input";

/** Design heat rejection, kW: entered, or Qe·(1 + 1/COP). */
export function designHeatRejectionKW(duty: DutyInput): number {
  if (duty.designBasis === "refrigeration") {
    const qe = duty.designRefrigerationLoadKW ?? 0;
    return qe * (1 + 1 / duty.designCop);
  }
  return duty.designHeatRejectionKW ?? 0;
}

/** Design refrigeration load, kW: entered, or Qrej·COP/(1 + COP). */
export function designRefrigerationLoadKW(duty: DutyInput): number {
  if (duty.designBasis === "refrigeration") return duty.designRefrigerationLoadKW ?? 0;
  const q = duty.designHeatRejectionKW ?? 0;
  return (q * duty.designCop) / (1 + duty.designCop);
}

/**
 * Linear load fraction in dry-bulb between two points, clamped to the end values outside.
 * f = f1 + (f2 − f1)·(t − t1)/(t2 − t1).
 */
export function linearLoadFraction(
  dryBulbC: number,
  lowDryBulbC: number,
  fractionAtLow: number,
  highDryBulbC: number,
  fractionAtHigh: number,
): number {
  if (!(highDryBulbC > lowDryBulbC)) return 0.5 * (fractionAtLow + fractionAtHigh);
  const w = (dryBulbC - lowDryBulbC) / (highDryBulbC - lowDryBulbC);
  const wc = w < 0 ? 0 : w > 1 ? 1 : w;
  return fractionAtLow + (fractionAtHigh - fractionAtLow) * wc;
}

/**
 * Load fraction of an hour: by month × hour (index (month − 1)·24 + hour), linear in dry-bulb, or constant.
 * A per-bin profile has no meaning for an hourly climate; it yields 1 (the schema rejects that case).
 */
export function hourLoadFraction(profile: LoadProfileInput, month: number, hour: number, dryBulbC: number): number {
  switch (profile.kind) {
    case "constant":
      return profile.fraction;
    case "monthHour":
      return profile.fractions[(month - 1) * 24 + hour] ?? 1;
    case "linearInDryBulb":
      return linearLoadFraction(dryBulbC, profile.lowDryBulbC, profile.fractionAtLowDryBulb, profile.highDryBulbC, profile.fractionAtHighDryBulb);
    case "perBin":
      return 1;
  }
}

/**
 * Load fraction of a bin: its own entry (per bin), the mean of its month's 24 values (month × hour;
 * the mean of all 288 when the bin has no month), linear in its mean coincident dry-bulb, or constant.
 */
export function binLoadFraction(profile: LoadProfileInput, binIndex: number, month: number | undefined, dryBulbC: number): number {
  switch (profile.kind) {
    case "constant":
      return profile.fraction;
    case "perBin":
      return profile.fractions[binIndex] ?? 1;
    case "linearInDryBulb":
      return linearLoadFraction(dryBulbC, profile.lowDryBulbC, profile.fractionAtLowDryBulb, profile.highDryBulbC, profile.fractionAtHighDryBulb);
    case "monthHour": {
      const from = month !== undefined ? (month - 1) * 24 : 0;
      const to = month !== undefined ? from + 24 : 288;
      let sum = 0;
      for (let i = from; i < to; i++) sum += profile.fractions[i] ?? 1;
      return sum / (to - from);
    }
  }
}

/** Target condensing temperature of the head-pressure control, °C. */
export function targetCondensingC(duty: DutyInput): number {
  return duty.headPressureControl === "floating" ? duty.minimumCondensingC : duty.condensingSetPointC;
}
