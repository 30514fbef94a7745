/** Shared constants and small formatting helpers of the annual pipeline. */

/** The one water-density convention (Methods §8), from lib/units: metered volumes ⇄ mass. */
export { WATER_DENSITY_KG_PER_M3 } from "@/lib/units/factors";
export const DAYS_IN_MONTH = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];

export function round1(x: number): number {
  return Math.round(x * 10) / 10;
}
export function sci(x: number): string {
  return x.toExponential(2);
}
