import { describe, expect, it, vi } from "vitest";
import { analyzeScenario, physicsOf, prepareScenario, rerunPhysics } from "@/lib/engine";
import { designHeatRejectionKW, linearLoadFraction } from "@/lib/engine/duty";
import type { ScenarioInput } from "@/lib/engine/input";
import { psychroCounters } from "@/lib/engine/psychrometrics";
import type { OptionAnnualPhysics } from "@/lib/engine/types";
import { fixtureInput } from "./helpers";

// Whole-year runs and property tests: generous time on a shared CI machine.
vi.setConfig({ testTimeout: 60_000 });

const hourly = fixtureInput("scenario-hourly.json");
const bins = fixtureInput("scenario-bins.json");
const noEconomicsRuns = (s: ScenarioInput): ScenarioInput => ({ ...s, sensitivity: undefined, monteCarlo: undefined });
const hourlyPhysics = physicsOf(prepareScenario(hourly));
const binPhysics = physicsOf(prepareScenario(bins));
const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(1, Math.abs(b));

function checkBalances(p: OptionAnnualPhysics) {
  // Standard mass balance M = E + B + D, closed in every month (each month sums its hours/bins).
  for (const m of p.monthly) {
    const w = m.waterM3;
    expect(Math.abs(w.makeup - w.evaporation - w.blowdown - w.drift)).toBeLessThanOrEqual(1e-9 * Math.max(1, w.makeup));
  }
  const w = p.waterM3;
  expect(Math.abs(w.makeup - w.evaporation - w.blowdown - w.drift)).toBeLessThanOrEqual(1e-9 * w.makeup);
  const sum = (f: (m: OptionAnnualPhysics["monthly"][number]) => number) => p.monthly.reduce((a, m) => a + f(m), 0);
  expect(rel(sum((m) => m.energyKWh.total), p.energyKWh.total)).toBeLessThan(1e-12);
  expect(rel(sum((m) => m.waterM3.makeup), p.waterM3.makeup)).toBeLessThan(1e-12);
  expect(rel(p.energyKWhByMonthHour.reduce((a, b) => a + b, 0), p.energyKWh.total)).toBeLessThan(1e-9);
  const e = p.energyKWh;
  expect(rel(e.fan + e.condenserPump + e.secondaryPump + e.sprayPump + e.basinHeater + e.compressor, e.total)).toBeLessThan(1e-12);
}

describe("annual composition", () => {
  it("covers the whole year and closes the water balance in every month, both fixtures", () => {
    for (const p of [...hourlyPhysics, ...binPhysics]) {
      expect(p.hoursTotal).toBeCloseTo(8760, 6);
      expect(p.energyKWhByMonthHour).toHaveLength(288);
      expect(p.monthly).toHaveLength(12);
      checkBalances(p);
    }
  });

  it("heat rejected equals the duty served in every hour (hourly, linear-in-dry-bulb profile)", () => {
    const q = designHeatRejectionKW(hourly.duty);
    if (hourly.climate.source !== "hourly" || hourly.duty.loadProfile.kind !== "linearInDryBulb") throw new Error("fixture changed");
    const lp = hourly.duty.loadProfile;
    const duty = hourly.climate.dryBulbC.reduce(
      (a, db) => a + q * linearLoadFraction(db, lp.lowDryBulbC, lp.fractionAtLowDryBulb, lp.highDryBulbC, lp.fractionAtHighDryBulb),
      0,
    );
    for (const p of hourlyPhysics) expect(rel(p.heatRejectedKWh, duty)).toBeLessThan(1e-12);
  });

  it("heat rejected equals the duty served in every bin (per-bin profile)", () => {
    if (bins.climate.source !== "wetBulbBins" || bins.duty.loadProfile.kind !== "perBin") throw new Error("fixture changed");
    const fr = bins.duty.loadProfile.fractions;
    const duty = bins.climate.bins.reduce((a, b, i) => a + 1500 * (fr[i] ?? 0) * b.hours, 0);
    for (const p of binPhysics) expect(rel(p.heatRejectedKWh, duty)).toBeLessThan(1e-12);
  });

  // Standard mass balance: M = E·C/(C − 1) when blowdown is positive in every hour (drift 0.005 % is far below it).
  it("makeup = E·C/(C − 1) with the entered cycles", () => {
    for (const p of binPhysics) {
      const c = 5;
      expect(rel(p.waterM3.makeup, (p.waterM3.evaporation * c) / (c - 1))).toBeLessThan(1e-9);
      expect(p.cyclesOfConcentration).toBeCloseTo(5, 9);
    }
  });

  // Common practice, no source: over a year 60–100 % of the heat leaves as latent heat (E·hfg/Q).
  it("evaporation carries a plausible share of the heat", () => {
    for (const p of hourlyPhysics.filter((x) => x.kind !== "closedCircuitCooler")) {
      const latent = (p.waterM3.evaporation * 998.2 * 2450) / (p.heatRejectedKWh * 3600);
      expect(latent).toBeGreaterThan(0.6);
      expect(latent).toBeLessThan(1.0);
    }
  });

  it("the cooler runs dry part of the year and then evaporates nothing; it uses less water than the towers", () => {
    const cooler = hourlyPhysics.find((p) => p.kind === "closedCircuitCooler");
    const tower = hourlyPhysics.find((p) => p.kind === "openTowerDirect");
    expect(cooler?.dryModeHours).toBeGreaterThan(500);
    expect(cooler?.waterM3.evaporation).toBeLessThan(tower?.waterM3.evaporation ?? 0);
    expect(cooler?.energyKWh.sprayPump).toBeLessThan(5.5 * (8760 - (cooler?.dryModeHours ?? 0)) + 1e-6);
  });

  it("fixed set-point: condensing never below the set-point; above the clean reference only in unmet hours", () => {
    for (const p of hourlyPhysics) {
      expect(p.meanCondensingC).toBeGreaterThanOrEqual(35 - 1e-9);
      expect(p.meanReferenceCondensingC).toBeLessThanOrEqual(p.meanCondensingC + 1e-9);
      if (p.unmetHours === 0) expect(p.compressorAboveCleanReferenceKWh).toBe(0);
    }
  });

  it("floating head: the exchanger's approach costs compressor energy against the clean reference", () => {
    const plate = binPhysics.find((p) => p.kind === "openTowerPlateHx");
    const direct = binPhysics.find((p) => p.kind === "openTowerDirect");
    expect(plate?.compressorAboveCleanReferenceKWh).toBeGreaterThan(0);
    expect((plate?.meanCondensingC ?? 0) - (plate?.meanReferenceCondensingC ?? 0)).toBeGreaterThan(0.3);
    expect(direct?.optimalCleaningIntervalMonths).toBeGreaterThan(1);
    expect(direct?.cleaningsPerYear).toBe(1);
    expect(plate?.cleaningsPerYear).toBe(0.5);
  });

  it("re-runs scale with the load and change only water with the cycles", () => {
    const base = physicsOf(prepareScenario(bins));
    const less = rerunPhysics(bins, { loadFactor: 0.8 });
    const cyc = rerunPhysics(bins, { cyclesOfConcentration: 4 });
    base.forEach((p, i) => {
      expect(rel(less[i]?.heatRejectedKWh ?? 0, 0.8 * p.heatRejectedKWh)).toBeLessThan(1e-12);
      expect(cyc[i]?.energyKWh.total).toBeCloseTo(p.energyKWh.total, 6);
      expect(cyc[i]?.waterM3.blowdown).toBeGreaterThan(p.waterM3.blowdown);
      expect(cyc[i]?.waterM3.evaporation).toBeCloseTo(p.waterM3.evaporation, 6);
    });
  });

  it("a handful of saturated-enthalpy evaluations per hour and option", () => {
    const prepared = prepareScenario(hourly);
    psychroCounters.saturatedEnthalpyCalls = 0;
    physicsOf(prepared);
    const perHourOption = psychroCounters.saturatedEnthalpyCalls / (8760 * 3);
    expect(perHourOption).toBeLessThan(30);
  });
});

describe("warnings", () => {
  it("cycles beyond a chemistry limit, a bin table not summing to a year, an implausibly small approach", () => {
    const doc: ScenarioInput = structuredClone(noEconomicsRuns(bins));
    doc.water = { ...doc.water, cyclesMode: "entered", cyclesOfConcentration: 9 };
    if (doc.climate.source !== "wetBulbBins") throw new Error("fixture changed");
    doc.climate.bins = doc.climate.bins.map((b) => ({ ...b, hours: b.hours / 2 }));
    const o = doc.options[0];
    if (o?.kind !== "openTowerDirect") throw new Error("fixture changed");
    o.tower = { ...o.tower, leavingWaterC: 25.5, enteringWaterC: 30.5 };
    o.condenser = { ...o.condenser, designCondensingC: 32 };
    const codes = analyzeScenario(doc).warnings.map((w) => w.code);
    expect(codes).toContain("water.cyclesBeyondChemistryLimit");
    expect(codes).toContain("climate.hoursNotAYear");
    expect(codes).toContain("tower.approachImplausiblySmall");
  });

  it("the full analysis returns physics, economics and a climate summary", () => {
    const r = analyzeScenario(noEconomicsRuns(bins));
    expect(r.physics).toHaveLength(3);
    expect(r.economics.options).toHaveLength(3);
    expect(r.climateSummary.hours).toBe(8760);
    expect(r.engineVersion).toMatch(/^\d+\.\d+\.\d+$/);
  });
});
