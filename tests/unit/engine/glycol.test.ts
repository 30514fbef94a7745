import { describe, expect, it } from "vitest";
import { fluidProperties, freezingPointC, pressureDropRatioAtSameVolumeFlow, tubeSideCoefficientRatio } from "@/lib/engine/glycol";
import { glycolPumpPowerKW, pumpPowerKW } from "@/lib/engine/pumps";

describe("loop fluid properties", () => {
  // Source: IAPWS water at 20 °C: ρ = 998.2 kg/m³, cp = 4.182 kJ/(kg·K), μ = 1.002 mPa·s, k = 0.598 W/(m·K)
  // [memory; standard steam-table values]; the table's 0 % column must reproduce them.
  it("water column reproduces standard water properties", () => {
    const w = fluidProperties("none", 0, 20);
    expect(w.densityKgPerM3).toBeCloseTo(998.2, 0);
    expect(w.specificHeatKJPerKgK).toBeCloseTo(4.182, 2);
    expect(w.viscosityPaS * 1000).toBeCloseTo(1.002, 2);
    expect(w.conductivityWPerMK).toBeCloseTo(0.598, 2);
  });

  // Source: Melinder (2010), IIR; ASHRAE Handbook—Fundamentals ch.31 gives similar values [memory]:
  // 30 % propylene glycol at 20 °C: ρ ≈ 1024 kg/m³, cp ≈ 3.9 kJ/(kg·K); freezes near −13 °C.
  it("30 % propylene glycol is denser, has a lower cp and a higher viscosity than water", () => {
    const g = fluidProperties("propyleneGlycol", 0.3, 20);
    const w = fluidProperties("none", 0, 20);
    expect(g.densityKgPerM3).toBeGreaterThan(1020);
    expect(g.densityKgPerM3).toBeLessThan(1030);
    expect(g.specificHeatKJPerKgK).toBeGreaterThan(3.85);
    expect(g.specificHeatKJPerKgK).toBeLessThan(3.95);
    expect(g.viscosityPaS / w.viscosityPaS).toBeGreaterThan(2.5);
    expect(freezingPointC("propyleneGlycol", 0.3)).toBeLessThan(-11);
    expect(freezingPointC("propyleneGlycol", 0.3)).toBeGreaterThan(-15);
    expect(tubeSideCoefficientRatio(g, w)).toBeLessThan(0.8);
    expect(pressureDropRatioAtSameVolumeFlow(g, w)).toBeGreaterThan(1.2);
  });

  // Pump power P = ṁ·g·H/η; with glycol at the same mass flow more volume and more friction (Blasius).
  it("glycol raises pump power", () => {
    const w = fluidProperties("none", 0, 30);
    const g = fluidProperties("ethyleneGlycol", 0.3, 30);
    expect(pumpPowerKW(72, 22, 0.68)).toBeCloseTo((72 * 9.80665 * 22) / 0.68 / 1000, 12);
    expect(glycolPumpPowerKW(72, 22, 0.68, g, w)).toBeGreaterThan(pumpPowerKW(72, 22, 0.68) * 1.1);
    expect(glycolPumpPowerKW(72, 22, 0.68, w, w)).toBeCloseTo(pumpPowerKW(72, 22, 0.68), 9);
  });
});
