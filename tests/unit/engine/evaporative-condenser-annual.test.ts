import { describe, expect, it, vi } from "vitest";
import { analyzeScenario } from "@/lib/engine";
import { parseScenario } from "@/lib/scenarios/schema";
import { readFixture } from "./helpers";

vi.setConfig({ testTimeout: 120_000 });

/** The bins fixture with a fourth option: an evaporative condenser rated for the duty (invented selection). */
function fourOptionDocument(): Record<string, unknown> {
  const doc = readFixture("scenario-bins.json");
  const options = doc.options as Record<string, unknown>[];
  options.push({
    id: "evap",
    kind: "evaporativeCondenser",
    label: "Evaporative condenser",
    costs: {
      firstCost: { equipment: 420000, installation: 90000, structureAndCrane: 30000, electrical: 25000, controls: 15000, plateExchanger: 0, waterTreatmentEquipment: 12000, meters: 3000, other: 0 },
      upkeep: { annualLabourHours: 50, annualServiceCost: 4000, periodicItems: [{ kind: "basinDisinfection", everyYears: 0.5, costPerEvent: 1400, labourHoursPerEvent: 5 }] },
    },
    fan: { designPowerKW: 30 },
    evaporativeCondenser: { ratedHeatRejectionKW: 1500, ratedCondensingC: 35, ratedWetBulbC: 25.6, airFlowKgPerS: 45 },
    sprayPump: { flowKgPerS: 40, powerKW: 5.5 },
    basinHeater: { powerKW: 9 },
  });
  return doc;
}

describe("the evaporative condenser as a fourth option", () => {
  const parsed = parseScenario(fourOptionDocument());
  if (!parsed.ok) throw new Error(parsed.errors.map((e) => `${e.path}: ${e.message}`).join("; "));
  const input = parsed.value;
  const r = analyzeScenario(input);
  const evap = r.physics.find((p) => p.optionId === "evap")!;
  const cooler = r.physics.find((p) => p.optionId === "cooler")!;

  it("has no condenser water loop: no condenser or second pump energy; spray pump, fans and compressor only", () => {
    expect(evap.kind).toBe("evaporativeCondenser");
    expect(evap.energyKWh.condenserPump).toBe(0);
    expect(evap.energyKWh.secondaryPump).toBe(0);
    expect(evap.energyKWh.sprayPump).toBeGreaterThan(0);
    expect(evap.energyKWh.fan).toBeGreaterThan(0);
    // The spray pump runs only in wet hours at its entered 5.5 kW: energy ≤ 5.5 kW × the year's hours.
    expect(evap.energyKWh.sprayPump).toBeLessThanOrEqual(5.5 * evap.hoursTotal + 1e-6);
  });

  it("closes its spray-loop water balance: M = E + B + D, and B = E/(C − 1) − D where blowdown runs", () => {
    const w = evap.waterM3;
    expect(w.makeup).toBeGreaterThan(0);
    expect(Math.abs(w.makeup - (w.evaporation + w.blowdown + w.drift))).toBeLessThan(1e-6 * w.makeup);
    // Year totals at the entered cycles (blowdown ≥ drift-adjusted need in every record): C = M/(B + D).
    expect((w.evaporation + w.blowdown + w.drift) / (w.blowdown + w.drift)).toBeCloseTo(evap.cyclesOfConcentration, 6);
  });

  it("condenses colder on average than the closed-circuit cooler (no loop approach and no water-cooled condenser) [practice]", () => {
    expect(evap.meanCondensingC).toBeLessThan(cooler.meanCondensingC);
  });

  it("takes part in the comparison, tornado and Monte Carlo, and reports its coil plan and footprint", () => {
    expect(r.economics.options.map((o) => o.optionId)).toContain("evap");
    expect(r.economics.comparisons.some((c) => c.alternativeOptionId === "evap")).toBe(true);
    // The fixture enables the tornado and a 2000-draw Monte Carlo.
    expect(input.sensitivity?.enabled && input.monteCarlo?.enabled).toBe(true);
    expect(r.economics.sensitivity?.tornado.some((t) => t.alternativeOptionId === "evap")).toBe(true);
    expect(r.economics.monteCarlo?.probabilityLowest.evap).toBeGreaterThanOrEqual(0);
    const plan = r.condensers?.find((c) => c.optionId === "evap");
    expect(plan?.construction).toBe("evaporativeCondenserCoil");
    // 1500 kW × 0.1 kg NH3/kW (stated coil default) = 150 kg.
    expect(plan?.inventoryKg).toBeCloseTo(150, 9);
    // Coil cleaned yearly (default interval 12 months) at the stated default cost, 2500 per event.
    expect(evap.cleaningsPerYear).toBe(1);
    expect(plan?.cleaning.costPerEvent).toBe(2500);
    expect(r.footprint?.options.find((f) => f.optionId === "evap")?.water.withdrawnM3).toBe(evap.waterM3.makeup);
  });

  it("coil scale costs energy: a 20 % derate before cleaning needs more fan and compressor energy than none", () => {
    const doc = fourOptionDocument();
    const ev = (doc.options as Record<string, unknown>[])[3] as { evaporativeCondenser: Record<string, unknown> };
    ev.evaporativeCondenser.coilScaling = { derateBeforeCleaning: 0, cleaningIntervalMonths: 12 };
    const p0 = parseScenario({ ...doc, sensitivity: undefined, monteCarlo: undefined });
    ev.evaporativeCondenser.coilScaling = { derateBeforeCleaning: 0.2, cleaningIntervalMonths: 12 };
    const p1 = parseScenario({ ...doc, sensitivity: undefined, monteCarlo: undefined });
    if (!p0.ok || !p1.ok) throw new Error("parse");
    const e0 = analyzeScenario(p0.value).physics.find((p) => p.optionId === "evap")!;
    const e1 = analyzeScenario(p1.value).physics.find((p) => p.optionId === "evap")!;
    expect(e1.energyKWh.total).toBeGreaterThan(e0.energyKWh.total);
  });
});
