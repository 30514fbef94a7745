/**
 * Pipeline step 5 — cleaning optimum: the energy cost per month of one unit of tower-side fouling, from
 * which the cost-minimising cleaning interval follows (fouling.ts, optimalCleaningIntervalMonths).
 */
import { type FoulingGrowth, monthlyFoulingM2KPerW } from "../fouling";
import type { FoulingInput } from "../input";
import { simulateOptionYear } from "./accumulate";
import type { YearContext } from "./context";
import type { AnnualOptions } from "./index";
import type { PreparedOption } from "./options";

/**
 * Energy cost per month of one unit of tower-side fouling resistance (cost/(month·m²·K/W)), from
 * two extra (sub-sampled) years at constant fouling 0 and Rref: s = price·ΔkWh/(12·Rref). Cached per option and
 * load factor (the slope does not depend on cycles or on the fouling rate).
 */
export function foulingCostPerMonthPerUnit(
  po: PreparedOption,
  ctx: YearContext,
  growth: FoulingGrowth,
  intervalMonths: number,
  fouling: FoulingInput,
  opts: AnnualOptions,
): number {
  const key = `${po.input.id}|${ctx.loadFactor}|${opts.foulingCostCacheKey ?? ""}`;
  const cached = opts.foulingCostCache?.get(key);
  if (cached !== undefined) return cached;
  const sched = monthlyFoulingM2KPerW(growth, intervalMonths);
  let rRef = sched.reduce((a, b) => a + b, 0) / 12;
  if (!(rRef > 0)) rRef = fouling.limitM2KPerW > 0 ? fouling.limitM2KPerW : 1.76e-4;
  // Every 7th hour of an hourly year (weighted ×7; 7 and 24 share no factor, so every hour of the day
  // is sampled) is plenty for a year-average slope.
  const stride = ctx.climate.kind === "hourly" ? 7 : 1;
  const clean = simulateOptionYear(po, ctx, new Array<number>(12).fill(0), stride);
  const fouled = simulateOptionYear(po, ctx, new Array<number>(12).fill(rRef), stride);
  const s = ((opts.electricityPricePerKWh ?? 0) * (fouled.energyKWh.total - clean.energyKWh.total)) / (12 * rRef);
  opts.foulingCostCache?.set(key, s);
  return s;
}
