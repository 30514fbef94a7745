/**
 * The physical what-if: a scenario's stored result moved by physical overrides (load, climate shift,
 * fouling growth, minimum condensing temperature, fan control, selection size) and re-priced with price
 * overrides, nothing saved.
 *
 * The physics is re-run on the compressed climate and applied to the stored full-resolution physics as a
 * difference (a control variate): Q = Q_full + (Q_compressed(overrides) − Q_compressed(as entered)). At the
 * entered values the answer is exactly the stored result; away from them only the compressed climate's
 * error in the *change* remains (the compressed climate alone is within 0.5 % of the hourly LCC, tested).
 */
import { type PreparedScenario, physicsOf } from "./index";
import { type StoredEconomicsInputs, whatIf } from "./economics";
import type { EconomicsResult, PhysicsOverrides, WhatIfOverrides } from "./economics/types";
import type { OptionAnnualPhysics } from "./types";

/** Exponent of the cost-capacity rule for a larger or smaller selection's equipment cost [pub: Williams (1947), the "six-tenths factor", Chemical Engineering 54(12)]. */
export const SIZE_COST_EXPONENT = 0.6;

/** True when an override asks for a physics re-run (cycles alone are an exact water-balance recompute). */
export function needsPhysics(o: PhysicsOverrides): boolean {
  return (
    (o.loadFactor !== undefined && o.loadFactor !== 1) ||
    (o.foulingRateFactor !== undefined && o.foulingRateFactor !== 1) ||
    (o.climateShiftK !== undefined && o.climateShiftK !== 0) ||
    o.minimumCondensingC !== undefined ||
    o.fanControl !== undefined ||
    Object.values(o.sizeFactorByOptionId ?? {}).some((s) => s !== 1)
  );
}

/**
 * full + (next − base) field by field over the shape of `next`: numbers shifted (kept ≥ 0 where all three
 * are ≥ 0: energies, volumes, hours), arrays element by element, objects key by key; anything else — and
 * any mismatch of shape — is taken from `next`. Warnings come from `next`.
 */
export function shiftedByDifference(full: unknown, base: unknown, next: unknown): unknown {
  if (typeof next === "number") {
    if (typeof full !== "number" || typeof base !== "number") return next;
    if (!Number.isFinite(full) || !Number.isFinite(base) || !Number.isFinite(next)) return next;
    const v = full + (next - base);
    return v < 0 && full >= 0 && base >= 0 && next >= 0 ? 0 : v;
  }
  if (Array.isArray(next)) {
    if (!Array.isArray(full) || !Array.isArray(base) || full.length !== next.length || base.length !== next.length) return next;
    return next.map((x, i) => shiftedByDifference(full[i], base[i], x));
  }
  if (next !== null && typeof next === "object") {
    if (full === null || typeof full !== "object" || base === null || typeof base !== "object") return next;
    const f = full as Record<string, unknown>;
    const b = base as Record<string, unknown>;
    const out: Record<string, unknown> = {};
    for (const [k, v] of Object.entries(next)) out[k] = k === "warnings" ? v : shiftedByDifference(f[k], b[k], v);
    return out;
  }
  return next;
}

/**
 * The scenario's physics under physical overrides, from the stored full-resolution physics and two
 * compressed runs (the one at the entered values is cached on the prepared scenario).
 */
export function physicsNear(
  prepared: PreparedScenario,
  fullPhysics: readonly OptionAnnualPhysics[],
  overrides: PhysicsOverrides,
): OptionAnnualPhysics[] {
  const { cyclesOfConcentration: _cycles, ...physical } = overrides;
  prepared.compressedBase ??= physicsOf(prepared, {}, "compressed", false);
  const base = prepared.compressedBase;
  const next = physicsOf(prepared, physical, "compressed", false);
  return next.map((n, i) => {
    const f = fullPhysics.find((p) => p.optionId === n.optionId);
    const b = base[i];
    return f && b ? (shiftedByDifference(f, b, n) as OptionAnnualPhysics) : n;
  });
}

/**
 * Physical and price what-if of a stored result: the physics moved by `physics` (physicsNear), each option's
 * equipment first cost scaled by its size factor^0.6, then `whatIf` with the price overrides (cycles by
 * the exact water balance). Without physical overrides the stored physics is re-priced as it is.
 */
export function scenarioWhatIf(
  prepared: PreparedScenario | null,
  stored: StoredEconomicsInputs,
  prices: WhatIfOverrides,
  physics: PhysicsOverrides,
): EconomicsResult {
  if (!prepared || !needsPhysics(physics)) return whatIf(stored, prices);
  const sizes = physics.sizeFactorByOptionId ?? {};
  const options = stored.options.map((o) => {
    const s = sizes[o.optionId] ?? 1;
    // Without a first cost there is no equipment price to scale.
    if (s === 1 || !o.costs.firstCost) return o;
    const firstCost = { ...o.costs.firstCost, equipment: o.costs.firstCost.equipment * Math.pow(s, SIZE_COST_EXPONENT) };
    return { ...o, costs: { ...o.costs, firstCost } };
  });
  return whatIf({ ...stored, options, physics: physicsNear(prepared, stored.physics, physics) }, prices);
}
