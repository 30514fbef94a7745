/**
 * The compressed climate against the full hourly year, and the physical what-if built on it.
 * The reference of every check is the engine's own full-resolution hourly run (8760 h) of the same scenario:
 * the compressed climate must reproduce its life-cycle cost within 0.5 % (the acceptance), and a
 * what-if must move the answer the way a full re-run with the same inputs moves it.
 */
import { describe, expect, it, vi } from "vitest";
import { physicsOf, prepareScenario, type PhysicsOverrides } from "@/lib/engine";
import { compressHourlyYear } from "@/lib/engine/annual/compress";
import { analyzeEconomics } from "@/lib/engine/economics";
import type { ScenarioInput } from "@/lib/engine/input";
import type { OptionAnnualPhysics } from "@/lib/engine/types";
import { needsPhysics, physicsNear, scenarioWhatIf, shiftedByDifference } from "@/lib/engine/what-if";
import { storedEconomicsInputs } from "@/lib/scenarios/what-if";
import { fixtureInput } from "./helpers";

vi.setConfig({ testTimeout: 120_000 });

const hourly = fixtureInput("scenario-hourly.json");

function lccs(input: ScenarioInput, physics: OptionAnnualPhysics[]): number[] {
  return analyzeEconomics({
    physics,
    options: input.options.map((o) => ({ optionId: o.id, kind: o.kind, label: o.label, costs: o.costs })),
    tariffs: input.tariffs,
    upkeep: input.upkeep,
    economics: input.economics,
  }).options.map((o) => o.lcc);
}

/** Variants a practitioner runs: floating head, a month × hour load with a time-of-use tariff. */
function variants(): [string, ScenarioInput][] {
  const floating = structuredClone(hourly);
  floating.duty.headPressureControl = "floating";
  const tou = structuredClone(hourly);
  // Two shifts a day: 100 % from 06:00 to 22:00, 55 % at night, lower in winter (invented profile).
  tou.duty.loadProfile = {
    kind: "monthHour",
    fractions: Array.from({ length: 288 }, (_, i) => {
      const m = Math.floor(i / 24);
      const h = i % 24;
      return (h >= 6 && h < 22 ? 1 : 0.55) * (m < 2 || m > 9 ? 0.8 : 1);
    }),
  };
  tou.tariffs.electricity = {
    ...tou.tariffs.electricity,
    pricing: "monthHour",
    energyPricePerKWhByMonthHour: Array.from({ length: 288 }, (_, i) => (i % 24 >= 8 && i % 24 < 20 ? 0.19 : 0.09)),
  };
  return [
    ["as entered (fixed set-point, load linear in dry-bulb)", hourly],
    ["floating head pressure", floating],
    ["month × hour load and time-of-use prices", tou],
  ];
}

describe("compressed climate", () => {
  it("folds the 8760 hours into a few hundred records that keep every hour", () => {
    const p = prepareScenario(hourly);
    if (p.year.kind !== "hourly") throw new Error("fixture changed");
    const c = compressHourlyYear(p.year, hourly.duty.loadProfile);
    expect(c.count).toBeGreaterThan(100);
    expect(c.count).toBeLessThan(600);
    expect(c.hours.reduce((a, b) => a + b, 0)).toBe(8760);
    // Every month keeps its own hours (January 744 h, February 672 h in a non-leap typical year).
    const jan = Array.from(c.month).reduce((s, m, r) => s + (m === 1 ? (c.hours[r] ?? 0) : 0), 0);
    const feb = Array.from(c.month).reduce((s, m, r) => s + (m === 2 ? (c.hours[r] ?? 0) : 0), 0);
    expect([jan, feb]).toEqual([744, 672]);
  });

  it.each(variants())("reproduces the hourly year's life-cycle cost of every option within 0.5 %: %s", (_label, input) => {
    const p = prepareScenario(input);
    const full = lccs(input, physicsOf(p));
    const compressed = lccs(input, physicsOf(p, {}, "compressed"));
    full.forEach((l, i) => expect(Math.abs((compressed[i] ?? 0) / l - 1)).toBeLessThan(0.005));
  });

  it("keeps the water balance closed in every month (M − E − B − D = 0, Methods §4)", () => {
    for (const o of physicsOf(prepareScenario(hourly), {}, "compressed")) {
      for (const m of o.monthly) {
        const w = m.waterM3;
        expect(Math.abs(w.makeup - w.evaporation - w.blowdown - w.drift)).toBeLessThanOrEqual(1e-9 * Math.max(1, w.makeup));
      }
      expect(o.hoursTotal).toBeCloseTo(8760, 6);
      expect(o.energyKWhByMonthHour.reduce((a, b) => a + b, 0)).toBeCloseTo(o.energyKWh.total, 3);
    }
  });
});

describe("physical what-if", () => {
  const prepared = prepareScenario(hourly);
  const full = physicsOf(prepared);
  const cases: [string, PhysicsOverrides][] = [
    ["load ×0.8", { loadFactor: 0.8 }],
    ["load ×1.2", { loadFactor: 1.2 }],
    ["climate +2 K", { climateShiftK: 2 }],
    ["fouling growth ×2", { foulingRateFactor: 2 }],
    ["two-speed fans", { fanControl: "twoSpeed" }],
  ];

  it.each(cases)("moves each option's LCC as a full hourly re-run does, within 0.5 %: %s", (_label, o) => {
    const exact = lccs(hourly, physicsOf(prepared, o));
    const near = lccs(hourly, physicsNear(prepared, full, o));
    exact.forEach((l, i) => expect(Math.abs((near[i] ?? 0) / l - 1)).toBeLessThan(0.005));
  });

  it("answers exactly the stored result at the entered values (no jump when a slider first moves)", () => {
    const near = physicsNear(prepared, full, {});
    expect(lccs(hourly, near)).toEqual(lccs(hourly, full));
    expect(needsPhysics({ loadFactor: 1, climateShiftK: 0, sizeFactorByOptionId: { x: 1 } })).toBe(false);
  });

  it("a warmer year costs every wet option more water and more fan energy (+2 K on dry-bulb and wet-bulb)", () => {
    const warm = physicsNear(prepared, full, { climateShiftK: 2 });
    warm.forEach((w, i) => {
      const f = full[i];
      if (!f) throw new Error("missing option");
      expect(w.waterM3.evaporation).toBeGreaterThan(f.waterM3.evaporation);
      expect(w.energyKWh.fan).toBeGreaterThan(f.energyKWh.fan);
    });
  });

  it("a larger selection (×1.3) holds the set-point more often and needs less fan energy; a smaller one (×0.8) the reverse", () => {
    for (const o of hourly.options) {
      const at = (s: number) => physicsOf(prepared, { sizeFactorByOptionId: { [o.id]: s } }, "compressed", false).find((p) => p.optionId === o.id);
      const [small, base, big] = [at(0.8), at(1), at(1.3)];
      if (!small || !base || !big) throw new Error("missing option");
      expect(big.unmetHours).toBeLessThanOrEqual(base.unmetHours);
      expect(small.unmetHours).toBeGreaterThanOrEqual(base.unmetHours);
      // Same duty, more fill or coil and more air at full speed: a lower airflow fraction (fan laws, cube).
      expect(big.energyKWh.fan).toBeLessThan(base.energyKWh.fan);
      expect(small.energyKWh.fan).toBeGreaterThan(base.energyKWh.fan);
      // A cooler's spray pumps scale with the units (s pumps of the selected size).
      if (o.kind === "closedCircuitCooler") expect(big.energyKWh.sprayPump).toBeGreaterThan(base.energyKWh.sprayPump);
    }
  });

  it("a larger selection costs more: equipment first cost × size^0.6 (six-tenths rule, Williams 1947)", () => {
    const id = hourly.options[2]?.id ?? "";
    const stored = storedEconomicsInputs(hourly, { physics: full } as Parameters<typeof storedEconomicsInputs>[1]);
    const base = scenarioWhatIf(prepared, stored, {}, {});
    const big = scenarioWhatIf(prepared, stored, {}, { sizeFactorByOptionId: { [id]: 1.5 } });
    const before = base.options.find((o) => o.optionId === id)?.firstCostByItem.equipment ?? 0;
    const after = big.options.find((o) => o.optionId === id)?.firstCostByItem.equipment ?? 0;
    // Hand calculation: 1.5^0.6 = e^(0.6·ln 1.5) = e^(0.6·0.405465) = e^0.243279 = 1.275424.
    expect(after / before).toBeCloseTo(1.275424, 5);
  });

  it("shifts numbers by the difference, keeps quantities ≥ 0, and takes strings and warnings from the new run", () => {
    const full0 = { a: 10, b: [1, 2], s: "full", warnings: [{ code: "old" }], n: null };
    const base0 = { a: 4, b: [1, 1], s: "base", warnings: [], n: null };
    const next0 = { a: 1, b: [3, 1], s: "next", warnings: [{ code: "new" }], n: 5 };
    // 10 + (1 − 4) = 7; [1 + (3 − 1), 2 + (1 − 1)] = [3, 2].
    expect(shiftedByDifference(full0, base0, next0)).toEqual({ a: 7, b: [3, 2], s: "next", warnings: [{ code: "new" }], n: 5 });
    // 1 + (0 − 4) = −3 on a quantity ≥ 0 everywhere → 0.
    expect(shiftedByDifference({ v: 1 }, { v: 4 }, { v: 0 })).toEqual({ v: 0 });
  });
});
