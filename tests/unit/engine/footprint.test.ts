import { describe, expect, it } from "vitest";
import { carbonCostPerYear, emissionsFootprint, waterFootprint } from "@/lib/engine/footprint";
import { globalWarmingPotential100 } from "@/lib/engine/refrigerants";

describe("water footprint", () => {
  it("withdrawn = makeup, consumed = evaporation + drift, per MWh rejected (hand numbers)", () => {
    // 6000 m³ makeup, 4500 evaporation, 5 drift, 1495 blowdown over 5,000 MWh rejected:
    // withdrawn 6000 m³ → 1.2 m³/MWh; consumed 4505 m³ → 0.901 m³/MWh.
    const w = waterFootprint({ evaporation: 4500, drift: 5, blowdown: 1495, makeup: 6000, sewerBilled: 6000 }, 5_000_000);
    expect(w.withdrawnM3).toBe(6000);
    expect(w.consumedM3).toBe(4505);
    expect(w.withdrawnM3PerMWh).toBeCloseTo(1.2, 12);
    expect(w.consumedM3PerMWh).toBeCloseTo(0.901, 12);
  });

  it("a dry option has none", () => {
    expect(waterFootprint({ evaporation: 0, drift: 0, blowdown: 0, makeup: 0, sewerBilled: 0 }, 1000).consumedM3PerMWh).toBe(0);
  });
});

describe("emissions", () => {
  it("= kWh × grid factor + leak fraction × inventory × GWP (hand calculation)", () => {
    // 250,000 kWh × 0.37 kg/kWh = 92,500 kg; R-134a (AR5 GWP 1300 [memory, IPCC AR5 Table 8.A.1]):
    // 0.05 × 160 kg × 1300 = 10,400 kg; total 102,900 kg over 5,000 MWh = 20.58 kg/MWh; 8 kg leaked.
    const e = emissionsFootprint({
      electricityKWh: 250_000,
      gridFactorKgCO2ePerKWh: 0.37,
      inventoryKg: 160,
      annualLeakFraction: 0.05,
      gwp100: globalWarmingPotential100("R134a", "AR5"),
      heatRejectedKWh: 5_000_000,
    });
    expect(e.electricityKgCO2e).toBeCloseTo(92_500, 6);
    expect(e.leakageKgCO2e).toBeCloseTo(10_400, 6);
    expect(e.totalKgCO2e).toBeCloseTo(102_900, 6);
    expect(e.totalKgCO2ePerMWh).toBeCloseTo(20.58, 9);
    expect(e.leakedRefrigerantKg).toBeCloseTo(8, 12);
  });

  it("ammonia leakage adds no CO₂e (GWP 0)", () => {
    const e = emissionsFootprint({
      electricityKWh: 1000,
      gridFactorKgCO2ePerKWh: 0.5,
      inventoryKg: 80,
      annualLeakFraction: 0.05,
      gwp100: globalWarmingPotential100("R717", "AR6"),
      heatRejectedKWh: 0,
    });
    expect(e.totalKgCO2e).toBe(500);
    expect(e.leakedRefrigerantKg).toBeCloseTo(4, 12);
  });

  it("carbon cost = tonnes × price (hand: 102.9 t × 50 = 5145)", () => {
    expect(carbonCostPerYear(102_900, 50)).toBeCloseTo(5145, 9);
  });
});
