/** The design-day sentence the comparison headline and the report both show. */
import type { OptionAnnualPhysics } from "@/lib/engine/types";
import { formatQuantity, type UnitSystem } from "@/lib/units";

/**
 * The design-day sentence of the headline: each option that cannot hold the condensing set-point at the
 * design duty in the site's 0.4 % design hour, with the temperature it condenses at (null when all hold
 * or the result has no design-day check).
 */
export function designDaySentence(physics: readonly OptionAnnualPhysics[], system: UnitSystem): string | null {
  const failing = physics.filter((p) => p.designDay && !p.designDay.holdsSetPoint);
  const first = failing[0]?.designDay;
  if (!first) return null;
  const t = (c: number) => formatQuantity("temperatureC", c, system, { sig: 3 });
  const parts = failing.map((p) => `the ${p.label.toLowerCase()} condenses at ${t(p.designDay?.condensingC ?? Number.NaN)}`);
  const who = failing.length === 1 ? `the ${failing[0]?.label.toLowerCase()}` : `${failing.length} options`;
  return `At the design duty in the site's 0.4 % design hour (${t(first.siteWetBulbC)} wet-bulb), ${who} cannot hold the ${t(first.setPointC)} set-point: ${parts.join("; ")}, and pays the extra compressor energy in such hours.`;
}
