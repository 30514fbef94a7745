import { describe, expect, it } from "vitest";
import { QUANTITY_KINDS, fromSI, toSI, unitLabel, convertBetween, type QuantityKind } from "@/lib/units";

/**
 * One row per quantity kind: a value in the IP unit and the SI value it equals, as PUBLISHED by the named
 * source (not computed from lib/units' constants), with the relative tolerance the published digits allow.
 * E8 = lib/methods/methods.md §8; SP811 = NIST Special Publication 811 (2008), Appendix B.8 / B.9.
 */
interface Case {
  ip: number;
  si: number;
  relTol: number;
  source: string;
}

const CASES: Record<QuantityKind, Case> = {
  // SP811 §4.2.1.1 / B.9: t/°C = (t/°F − 32)/1.8; 212 °F is 100 °C exactly, 85 °F = 29.444… °C.
  temperatureC: { ip: 212, si: 100, relTol: 1e-12, source: "SP811 B.9 t°C = (t°F − 32)/1.8" },
  // E8: temperature differences convert without the 32° offset: a 10 °F range is 5.5556 K.
  temperatureDifferenceK: { ip: 10, si: 10 / 1.8, relTol: 1e-12, source: "E8; SP811 B.9 1 K = 1.8 °F" },
  // E8: 1 gpm = 0.0630901964 L/s.
  waterFlowLPerS: { ip: 1, si: 0.0630901964, relTol: 1e-9, source: "E8 1 gpm = 0.0630901964 L/s" },
  // E8: 1 gpm = 0.0630901964 L/s = 0.227124707 m³/h (× 3.6).
  waterFlowM3PerH: { ip: 1, si: 0.0630901964 * 3.6, relTol: 1e-9, source: "E8 1 gpm = 0.0630901964 L/s" },
  // E8: 1 US gal = 3.785411784 L.
  volumeM3: { ip: 1, si: 3.785411784e-3, relTol: 1e-12, source: "E8 1 US gal = 3.785411784 L" },
  // E8: 1 kgal = 3.785411784 m³.
  waterVolumeM3: { ip: 1, si: 3.785411784, relTol: 1e-12, source: "E8 1 kgal = 3.785411784 m³" },
  // E8: 1 CCF = 2.8316846592 m³.
  waterVolumeCcfM3: { ip: 1, si: 2.8316846592, relTol: 1e-12, source: "E8 1 CCF = 2.8316846592 m³" },
  // E8: 1 hp = 0.7457 kW (4 figures); SP811 B.8: horsepower (550 ft·lbf/s) = 7.456999 E+02 W.
  powerKW: { ip: 1, si: 0.7456999, relTol: 2e-7, source: "SP811 B.8 hp = 745.6999 W (E8 0.7457 kW)" },
  // E8: 1 Btu/h = 0.29307107 W.
  powerBtuPerHKW: { ip: 1, si: 0.29307107e-3, relTol: 2e-8, source: "E8 1 Btu/h = 0.29307107 W" },
  heatDutyKW: { ip: 1_000_000, si: 293.07107, relTol: 2e-8, source: "E8 1 Btu/h = 0.29307107 W" },
  // 1 MBH = 1000 Btu/h [practice] → 0.29307107 kW (E8).
  heatDutyMbhKW: { ip: 1, si: 0.29307107, relTol: 2e-8, source: "E8 Btu/h; MBH = 1000 Btu/h (common practice, no source)" },
  // E8: 1 ton of refrigeration = 12,000 Btu/h = 3.516853 kW.
  refrigerationTonsKW: { ip: 1, si: 3.516853, relTol: 2e-7, source: "E8 1 TR = 12,000 Btu/h = 3.516853 kW" },
  // E8: the cooling-tower ton = 15,000 Btu/h → 15,000 × 0.29307107 W = 4.39606605 kW.
  coolingTowerTonsKW: { ip: 1, si: 15_000 * 0.29307107e-3, relTol: 2e-8, source: "E8 cooling-tower ton = 15,000 Btu/h" },
  energyKWh: { ip: 1234.5, si: 1234.5, relTol: 0, source: "kWh in both systems (common practice, no source)" },
  // SP811 B.8: Btu_IT = 1.055056 E+03 J → 1 MMBtu = 1.055056e9 J / 3.6e6 J/kWh = 293.0711 kWh.
  heatEnergyKWh: { ip: 1, si: 1.055056e9 / 3.6e6, relTol: 1e-6, source: "SP811 B.8 Btu_IT = 1055.056 J" },
  // E8: 1 psi = 6.894757 kPa.
  pressureKPa: { ip: 1, si: 6.894757, relTol: 1e-7, source: "E8 1 psi = 6.894757 kPa" },
  // E8: 1 ft of water ≈ 2.989 kPa; SP811 B.8: foot of water, conventional = 2.989067 E+03 Pa.
  pressureDropKPa: { ip: 1, si: 2.989067, relTol: 2e-7, source: "SP811 B.8 ftH2O conventional = 2.989067 kPa (E8 ≈ 2.989)" },
  // SP811 B.8: 1 ft = 0.3048 m (exact).
  headM: { ip: 100, si: 30.48, relTol: 1e-12, source: "SP811 B.8 ft = 0.3048 m" },
  lengthM: { ip: 1, si: 0.3048, relTol: 1e-12, source: "SP811 B.8 ft = 0.3048 m" },
  // SP811 B.8: 1 in = 0.0254 m (exact).
  lengthMm: { ip: 1, si: 25.4, relTol: 1e-12, source: "SP811 B.8 in = 2.54 E−02 m" },
  elevationM: { ip: 787.4, si: 240.0, relTol: 1e-4, source: "SP811 B.8 ft = 0.3048 m (240 m ≈ 787.4 ft)" },
  // SP811 B.8: ft² = 9.290304 E−02 m² (exact).
  areaM2: { ip: 1, si: 0.09290304, relTol: 1e-12, source: "SP811 B.8 ft² = 0.09290304 m²" },
  // SP811 B.8: lb = 4.5359237 E−01 kg (exact).
  massKg: { ip: 1, si: 0.45359237, relTol: 1e-12, source: "SP811 B.8 lb = 0.45359237 kg" },
  // SP811 B.8: lb/h = 1.259979 E−04 kg/s.
  massFlowKgPerS: { ip: 1, si: 1.259979e-4, relTol: 1e-6, source: "SP811 B.8 lb/h = 1.259979e−4 kg/s" },
  // mg/L and ppm identical for dilute water (common practice, no source).
  concentrationMgPerL: { ip: 150, si: 150, relTol: 0, source: "ppm ≡ mg/L (common practice, no source)" },
  conductivityUSPerCm: { ip: 800, si: 800, relTol: 0, source: "µS/cm in both systems (common practice, no source)" },
  // SP811 B.8: Btu_IT/(h·ft²·°F) = 5.678263 W/(m²·K) → 1 h·ft²·°F/Btu = 1/5.678263 m²·K/W; the TEMA tower-water
  // allowance 0.001 h·ft²·°F/Btu ≈ 0.000176 m²·K/W [memory].
  foulingM2KPerW: { ip: 0.001, si: 0.001 / 5.678263, relTol: 1e-6, source: "SP811 B.8 5.678263 W/(m²·K)" },
  // SP811 B.8 (and ASHRAE Handbook—Fundamentals, unit conversions): 1 Btu_IT/(h·ft²·°F) = 5.678263 W/(m²·K).
  heatTransferCoefficientWPerM2K: { ip: 1, si: 5.678263, relTol: 1e-6, source: "SP811 B.8 Btu/(h·ft²·°F) = 5.678263 W/(m²·K)" },
  // E8 Btu/h = 0.29307107 W and SP811 1 K = 1.8 °F: 1 Btu/(h·°F) = 0.52752793 W/K.
  uaKWPerK: { ip: 1000, si: 0.29307107 * 1.8, relTol: 2e-8, source: "E8 Btu/h; SP811 1 K = 1.8 °F" },
  // SP811 B.8: ft³/min = 4.719474 E−04 m³/s.
  airflowM3PerS: { ip: 1, si: 4.719474e-4, relTol: 1e-6, source: "SP811 B.8 cfm = 4.719474e−4 m³/s" },
  // SP811 B.8: ft/min = 5.08 E−03 m/s (exact).
  velocityMPerS: { ip: 1, si: 5.08e-3, relTol: 1e-12, source: "SP811 B.8 ft/min = 0.00508 m/s" },
  // SP811 B.8: lb/ft³ = 1.601846 E+01 kg/m³; water at 62.4 lb/ft³ ≈ 999.6 kg/m³.
  densityKgPerM3: { ip: 1, si: 16.01846, relTol: 1e-6, source: "SP811 B.8 lb/ft³ = 16.01846 kg/m³" },
  // SP811 B.8: Btu_IT/(lb·°F) = 4.1868 E+03 J/(kg·K) (exact).
  specificHeatKJPerKgK: { ip: 1, si: 4.1868, relTol: 1e-12, source: "SP811 B.8 Btu_IT/(lb·°F) = 4.1868 kJ/(kg·K)" },
  // SP811 B.8: Btu_IT/lb = 2.326 E+03 J/kg (exact).
  enthalpyKJPerKg: { ip: 1, si: 2.326, relTol: 1e-12, source: "SP811 B.8 Btu_IT/lb = 2.326 kJ/kg" },
  // 1.5 %/°F of compressor power = 2.7 %/K (1 K = 1.8 °F, SP811 B.9).
  percentPerK: { ip: 1.5, si: 2.7, relTol: 1e-12, source: "SP811 B.9 1 K = 1.8 °F" },
  // A price of 10 per kgal is 10 / 3.785411784 per m³ (E8 kgal).
  pricePerM3: { ip: 10, si: 10 / 3.785411784, relTol: 1e-12, source: "E8 1 kgal = 3.785411784 m³" },
  pricePerM3Ccf: { ip: 5, si: 5 / 2.8316846592, relTol: 1e-12, source: "E8 1 CCF = 2.8316846592 m³" },
  pricePerKWh: { ip: 0.12, si: 0.12, relTol: 0, source: "money per kWh unchanged (brief)" },
  pricePerKW: { ip: 15, si: 15, relTol: 0, source: "demand charge per kW unchanged (common practice, no source)" },
  // SP811 B.8 lb = 0.45359237 kg: 2 per lb = 4.40924524 per kg.
  pricePerKg: { ip: 2, si: 2 / 0.45359237, relTol: 1e-12, source: "SP811 B.8 lb = 0.45359237 kg" },
  money: { ip: 250_000, si: 250_000, relTol: 0, source: "currency is not a unit system (common practice, no source)" },
  percent: { ip: 3, si: 3, relTol: 0, source: "dimensionless" },
  ratio: { ip: 0.6, si: 0.6, relTol: 0, source: "dimensionless" },
  count: { ip: 4, si: 4, relTol: 0, source: "dimensionless" },
  years: { ip: 25, si: 25, relTol: 0, source: "time is the same in both systems" },
  months: { ip: 6, si: 6, relTol: 0, source: "time is the same in both systems" },
  hours: { ip: 8760, si: 8760, relTol: 0, source: "time is the same in both systems" },
};

function close(actual: number, expected: number, relTol: number) {
  const err = Math.abs(actual - expected);
  expect(err, `got ${actual}, expected ${expected} (rel. tol ${relTol})`).toBeLessThanOrEqual(
    Math.max(relTol * Math.abs(expected), 1e-15),
  );
}

describe("lib/units: every quantity kind, both directions", () => {
  it("has a published check for every kind in the table", () => {
    expect(Object.keys(CASES).sort()).toEqual([...QUANTITY_KINDS].sort());
  });

  for (const kind of QUANTITY_KINDS) {
    const c = CASES[kind];
    it(`${kind}: IP → SI and SI → IP (${c.source})`, () => {
      close(toSI(kind, c.ip, "IP"), c.si, c.relTol);
      close(fromSI(kind, c.si, "IP"), c.ip, c.relTol);
      // SI display of a stored SI value is the value itself.
      close(toSI(kind, c.si, "SI"), c.si, 1e-15);
      close(fromSI(kind, c.si, "SI"), c.si, 1e-15);
      // A round trip through the other system returns the value.
      close(convertBetween(kind, convertBetween(kind, c.ip, "IP", "SI"), "SI", "IP"), c.ip, 1e-12);
    });
  }
});

describe("lib/units: offsets, differences and labels", () => {
  it("85 °F is 29.44 °C but an 85 °F difference is 47.22 K (SP811 B.9; E8: differences without the offset)", () => {
    close(toSI("temperatureC", 85, "IP"), (85 - 32) / 1.8, 1e-12);
    close(toSI("temperatureDifferenceK", 85, "IP"), 85 / 1.8, 1e-12);
    close(fromSI("temperatureC", -40, "IP"), -40, 1e-12); // −40 °C = −40 °F, SP811 B.9
    close(fromSI("temperatureC", 0, "IP"), 32, 1e-12);
  });

  it("E8's IP water duty rule Q[Btu/h] ≈ 500 × gpm × ΔT[°F] agrees with the SI heat balance (common practice, no source)", () => {
    const gpm = 1000;
    const rangeF = 10;
    const flowLPerS = toSI("waterFlowLPerS", gpm, "IP");
    const rangeK = toSI("temperatureDifferenceK", rangeF, "IP");
    // ρ ≈ 0.997 kg/L and cp ≈ 4.18 kJ/(kg·K) near 25 °C [memory]; the rule's 500 assumes 8.33 lb/gal and 1 Btu/(lb·°F).
    const dutyKW = flowLPerS * 0.997 * 4.18 * rangeK;
    close(fromSI("heatDutyKW", dutyKW, "IP"), 500 * gpm * rangeF, 0.01);
  });

  it("labels say which ton and put the currency in money units", () => {
    expect(unitLabel("refrigerationTonsKW", "IP")).toBe("TR");
    expect(unitLabel("coolingTowerTonsKW", "IP")).toMatch(/tower/);
    expect(unitLabel("pricePerM3", "IP", "CAD")).toBe("CAD/kgal");
    expect(unitLabel("pricePerM3", "SI", "EUR")).toBe("EUR/m³");
    expect(unitLabel("pricePerM3Ccf", "IP", "USD")).toBe("USD/CCF");
    expect(unitLabel("temperatureDifferenceK", "SI")).toBe("K");
    expect(unitLabel("foulingM2KPerW", "IP")).toBe("h·ft²·°F/Btu");
  });

  it("a U-value reads in Btu/(h·ft²·°F) in IP: 1 W/(m²·K) = 0.176110 Btu/(h·ft²·°F) (NIST SP 811 B.8; ASHRAE Handbook—Fundamentals unit conversions)", () => {
    // Hand calculation with the published factor 1 Btu/(h·ft²·°F) = 5.678263 W/(m²·K):
    // 4500 / 5.678263 = 792.50 Btu/(h·ft²·°F); 1000 / 5.678263 = 176.11; 176.11 Btu/(h·ft²·°F) × 5.678263 ≈ 1000 W/(m²·K).
    close(fromSI("heatTransferCoefficientWPerM2K", 4500, "IP"), 792.50, 1e-5);
    close(fromSI("heatTransferCoefficientWPerM2K", 1000, "IP"), 176.110, 1e-5);
    close(fromSI("heatTransferCoefficientWPerM2K", 1, "IP"), 0.176110, 1e-5);
    close(toSI("heatTransferCoefficientWPerM2K", 176.110, "IP"), 1000, 1e-5);
    // Fouling resistance is its reciprocal: 1 h·ft²·°F/Btu = 0.176110 m²·K/W (SP 811 B.8 1.761102 E−01).
    close(toSI("foulingM2KPerW", 1, "IP"), 0.176110, 1e-5);
    expect(unitLabel("heatTransferCoefficientWPerM2K", "IP")).toBe("Btu/(h·ft²·°F)");
    expect(unitLabel("heatTransferCoefficientWPerM2K", "SI")).toBe("W/(m²·K)");
  });

  it("one ton of refrigeration is 12,000 Btu/h and a cooling-tower ton 15,000 Btu/h (E8)", () => {
    close(fromSI("heatDutyKW", toSI("refrigerationTonsKW", 1, "IP"), "IP"), 12_000, 1e-12);
    close(fromSI("heatDutyKW", toSI("coolingTowerTonsKW", 1, "IP"), "IP"), 15_000, 1e-12);
  });
});

describe("the water-density convention (Methods §8)", () => {
  it("1 L/s of water is 0.9982 kg/s: IAPWS-95 density of liquid water at 20 °C, 998.21 kg/m³ [pub], rounded to 998.2", async () => {
    const { waterKgPerSFromLPerS, waterLPerSFromKgPerS, WATER_DENSITY_KG_PER_M3 } = await import("@/lib/units");
    expect(WATER_DENSITY_KG_PER_M3).toBeCloseTo(998.21, 1);
    expect(waterKgPerSFromLPerS(1)).toBeCloseTo(0.9982, 4);
    // 100 gpm = 6.30901964 L/s (exact) → 6.2976 kg/s at 998.2 kg/m³ (hand calculation: 6.30901964 × 0.9982).
    expect(waterKgPerSFromLPerS(6.30901964)).toBeCloseTo(6.30901964 * 0.9982, 6);
    expect(waterLPerSFromKgPerS(0.9982)).toBeCloseTo(1, 9);
  });
});
