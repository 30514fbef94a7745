import { describe, expect, it } from "vitest";
import { fc, test } from "@fast-check/vitest";
import psychrolib from "psychrolib";
import {
  STANDARD_ATMOSPHERE_PA,
  dewPointFromHumidityRatioC,
  humidityRatioFromVaporPressure,
  humidityRatioFromWetBulb,
  latentHeatOfVaporizationKJPerKg,
  moistAirEnthalpyKJPerKg,
  pressureFromElevationPa,
  psychroCounters,
  relativeHumidityFromWetBulb,
  resetPsychroCounters,
  saturatedAirEnthalpyExactKJPerKg,
  saturatedAirEnthalpyKJPerKg,
  saturationHumidityRatio,
  saturationVaporPressurePa,
  waterSpecificHeatKJPerKgK,
  wetBulbFromDewPointC,
  wetBulbFromRelativeHumidityC,
} from "@/lib/engine/psychrometrics";
import { saturatedEnthalpyCurvatureKJPerKgK2, saturatedEnthalpySlopeAndCurvature } from "@/lib/engine/saturation";

const P0 = STANDARD_ATMOSPHERE_PA;

function relErr(actual: number, expected: number): number {
  return Math.abs(actual - expected) / Math.abs(expected);
}

describe("standard atmosphere", () => {
  // ASHRAE Handbook—Fundamentals 2017 ch.1 Table 1 (Standard Atmospheric Data for Altitudes):
  // 1000 m → 89.875 kPa. The other rows are [memory] of the same table.
  it.each([
    [0, 101325],
    [1000, 89875],
    [-500, 107478], // [memory]
    [500, 95461], // [memory]
    [2000, 79495], // [memory]
  ])("p(%d m) = %d Pa (Table 1)", (z, pTable) => {
    expect(Math.abs(pressureFromElevationPa(z) - pTable)).toBeLessThan(2);
  });
});

describe("saturation pressure (Hyland–Wexler, ASHRAE 2017 ch.1 eqs. 5–6)", () => {
  // ASHRAE 2017 ch.1 Table 3 (Thermodynamic Properties of Water at Saturation), kPa. 25 °C = 3.1699 kPa
  // is quoted in Methods §1; the other rows are IAPWS values as tabulated there [memory].
  // The formula reproduces the table to ~0.05 %: the table's pure-water pws carries no enhancement factor.
  it.each([
    [-20, 0.10326], // over ice [memory]
    [-10, 0.25987], // over ice [memory]
    [0.01, 0.61165], // triple point [memory]
    [20, 2.3392], // [memory]
    [25, 3.1699],
    [30, 4.2467], // [memory]
    [40, 7.3844], // [memory]
    [50, 12.352], // [memory]
  ])("pws(%d °C) ≈ %d kPa", (tC, pwsKPa) => {
    expect(relErr(saturationVaporPressurePa(tC), pwsKPa * 1000)).toBeLessThan(1e-3);
  });

  it("gives the formula value 3169.2 Pa at 25 °C (Methods §1, from the Handbook's eq. 6)", () => {
    expect(Math.abs(saturationVaporPressurePa(25) - 3169.2)).toBeLessThan(0.1);
  });

  it("is continuous at the triple point where the ice and water branches meet", () => {
    // The two correlations agree at 0.01 °C to better than 0.01 % (ASHRAE 2017 ch.1, note to eqs. 5–6).
    const below = saturationVaporPressurePa(0.01 - 1e-9);
    const above = saturationVaporPressurePa(0.01 + 1e-9);
    expect(relErr(below, above)).toBeLessThan(1e-4);
  });
});

describe("moist-air table values at 101.325 kPa (ASHRAE 2017 ch.1 Table 2)", () => {
  // Table 2 includes the enhancement factor (~1.004) that the formulas omit, so its Ws and hs sit
  // ~0.4–0.5 % above the formula. Tolerance 0.8 % on Ws and 0.6 % on hs accepts that and nothing more.
  it.each([
    // tC, Ws kg/kg, hs kJ/kg  — Table 2 rows [memory]
    [10, 0.007661, 29.348],
    [20, 0.014758, 57.555],
    [30, 0.027329, 100.0],
    [40, 0.049141, 166.7],
  ])("t = %d °C: Ws ≈ %d, hs ≈ %d", (tC, wsTable, hsTable) => {
    const ws = saturationHumidityRatio(tC, P0);
    expect(ws).toBeLessThan(wsTable); // the formula lacks the enhancement factor, so it must sit below
    expect(relErr(ws, wsTable)).toBeLessThan(8e-3);
    expect(relErr(saturatedAirEnthalpyKJPerKg(tC, P0), hsTable)).toBeLessThan(6e-3);
  });
});

describe("ASHRAE 2017 ch.1 Example 1: 40 °C dry-bulb, 20 °C wet-bulb, 101.325 kPa", () => {
  // Handbook answers: W = 0.0065 kg/kg, h = 56.7 kJ/kg, dew point ≈ 7 °C, φ ≈ 14 % (Methods §1).
  // The Handbook takes Ws* = 0.014758 from Table 2 (with enhancement factor); the formula's Ws* is 0.4 %
  // lower, which lowers W by ~1 % (≈ 0.00006): hence the W tolerance of 1.2e-4 kg/kg.
  const w = humidityRatioFromWetBulb(40, 20, P0);
  it("humidity ratio ≈ 0.0065 kg/kg", () => {
    expect(Math.abs(w - 0.0065)).toBeLessThan(1.2e-4);
  });
  it("enthalpy ≈ 56.7 kJ/kg", () => {
    expect(Math.abs(moistAirEnthalpyKJPerKg(40, w) - 56.7)).toBeLessThan(0.3);
  });
  it("dew point ≈ 7 °C", () => {
    const td = dewPointFromHumidityRatioC(40, w, P0);
    expect(td).toBeGreaterThan(6.8);
    expect(td).toBeLessThan(8.0);
  });
  it("relative humidity ≈ 14 %", () => {
    expect(Math.abs(relativeHumidityFromWetBulb(40, 20, P0) - 0.14)).toBeLessThan(0.005);
  });
  it("the inverse solvers give back the 20 °C wet-bulb", () => {
    const rh = relativeHumidityFromWetBulb(40, 20, P0);
    expect(Math.abs(wetBulbFromRelativeHumidityC(40, rh, P0) - 20)).toBeLessThan(2e-3);
    const td = dewPointFromHumidityRatioC(40, w, P0);
    expect(Math.abs(wetBulbFromDewPointC(40, td, P0) - 20)).toBeLessThan(2e-3);
  });
});

describe("latent heat of vaporization", () => {
  // ~2430 kJ/kg at 30 °C (Methods §1); IAPWS-95 saturated hfg: 2500.9 (0.01 °C), 2453.5 (20 °C),
  // 2429.8 (30 °C), 2382.0 (50 °C), 2256.4 (100 °C) kJ/kg [memory].
  it.each([
    [0.01, 2500.9],
    [20, 2453.5],
    [30, 2429.8],
    [50, 2382.0],
    [100, 2256.4],
  ])("hfg(%d °C) ≈ %d kJ/kg", (tC, hfg) => {
    expect(Math.abs(latentHeatOfVaporizationKJPerKg(tC) - hfg)).toBeLessThan(0.5);
  });
  it("agrees with the Handbook's own linearisation 2501 − 2.326·t (ch.1 eq. 33) within 0.3 % over 0–60 °C", () => {
    for (let t = 0; t <= 60; t += 5) {
      expect(relErr(latentHeatOfVaporizationKJPerKg(t), 2501 - 2.326 * t)).toBeLessThan(3e-3);
    }
  });
  it("uses cp,water = 4.186 kJ/(kg·K), the value of ASHRAE 2017 ch.1 eq. 33", () => {
    expect(waterSpecificHeatKJPerKgK).toBe(4.186);
  });
});

describe("cross-check against psychrolib (reference implementation of ASHRAE 2017 ch.1) over a grid", () => {
  psychrolib.SetUnitSystem(psychrolib.SI);
  const temps = Array.from({ length: 71 }, (_, i) => -40 + i * 2); // −40…100 °C
  const pressures = [P0, pressureFromElevationPa(1000), pressureFromElevationPa(2500)];

  it("saturation pressure, saturated humidity ratio and saturated enthalpy match to 1e-9", () => {
    for (const p of pressures) {
      for (const t of temps) {
        expect(relErr(saturationVaporPressurePa(t), psychrolib.GetSatVapPres(t))).toBeLessThan(1e-9);
        if (t > 85) continue; // near boiling at 2500 m the two cap W differently; not an operating range
        expect(relErr(saturationHumidityRatio(t, p), psychrolib.GetSatHumRatio(t, p))).toBeLessThan(1e-9);
        expect(
          Math.abs(saturatedAirEnthalpyExactKJPerKg(t, p) - psychrolib.GetSatAirEnthalpy(t, p) / 1000),
        ).toBeLessThan(1e-9 * Math.max(1, Math.abs(saturatedAirEnthalpyExactKJPerKg(t, p))));
      }
    }
  });

  it("moist-air enthalpy, humidity ratio from vapour pressure and standard pressure match", () => {
    for (const t of temps) {
      for (const w of [1e-5, 0.002, 0.01, 0.03]) {
        // psychrolib floors W at 1e-7, so not 0
        expect(
          Math.abs(moistAirEnthalpyKJPerKg(t, w) - psychrolib.GetMoistAirEnthalpy(t, w) / 1000),
        ).toBeLessThan(1e-9);
      }
    }
    for (const pw of [100, 1000, 5000]) {
      for (const p of pressures) {
        expect(
          relErr(humidityRatioFromVaporPressure(pw, p), psychrolib.GetHumRatioFromVapPres(pw, p)),
        ).toBeLessThan(1e-12);
      }
    }
    for (const z of [-400, 0, 240, 1000, 3000]) {
      expect(relErr(pressureFromElevationPa(z), psychrolib.GetStandardAtmPressure(z))).toBeLessThan(1e-12);
    }
  });
});

describe("wet-bulb solvers", () => {
  const sites = [P0, pressureFromElevationPa(240), pressureFromElevationPa(1500)];

  it("round-trip dry-bulb + RH → wet-bulb → RH within 0.3 %-points over −20…50 °C", () => {
    for (const p of sites) {
      for (let t = -20; t <= 50; t += 5) {
        for (const rh of [0.05, 0.2, 0.5, 0.8, 1]) {
          const twb = wetBulbFromRelativeHumidityC(t, rh, p);
          expect(twb).toBeLessThanOrEqual(t + 1e-9);
          // the solver's 0.001 K tolerance maps to < 0.3 %-points of RH even in cold dry air
          expect(Math.abs(relativeHumidityFromWetBulb(t, twb, p) - rh)).toBeLessThan(3e-3);
        }
      }
    }
  });

  it("round-trip dry-bulb + dew point → wet-bulb → W → dew point within 0.01 K (0.03 K below −20 °C dew point)", () => {
    for (const p of sites) {
      for (let t = -10; t <= 45; t += 5) {
        for (let dep = 0; dep <= 30; dep += 6) {
          const td = t - dep;
          const twb = wetBulbFromDewPointC(t, td, p);
          expect(twb).toBeGreaterThanOrEqual(td - 2e-3);
          expect(twb).toBeLessThanOrEqual(t + 1e-9);
          const w = humidityRatioFromWetBulb(t, twb, p);
          // the 0.001 K wet-bulb tolerance is amplified where W is tiny: dew points below −20 °C get 0.03 K
          const tol = td < -20 ? 0.03 : 0.01;
          expect(Math.abs(dewPointFromHumidityRatioC(t, w, p) - td)).toBeLessThan(tol);
        }
      }
    }
  });

  it("saturated air has wet-bulb = dry-bulb = dew point (definition, ASHRAE 2017 ch.1)", () => {
    expect(Math.abs(wetBulbFromRelativeHumidityC(25, 1, P0) - 25)).toBeLessThan(2e-3);
    expect(Math.abs(wetBulbFromDewPointC(25, 25, P0) - 25)).toBeLessThan(2e-3);
  });

  it("treats RH above 100 % and a dew point above the dry-bulb as saturation (weather-file rounding)", () => {
    expect(Math.abs(wetBulbFromRelativeHumidityC(20, 1.01, P0) - 20)).toBeLessThan(2e-3);
    expect(Math.abs(wetBulbFromDewPointC(20, 20.3, P0) - 20)).toBeLessThan(2e-3);
  });

  test.prop([fc.double({ min: 0, max: 45, noNaN: true }), fc.double({ min: 0, max: 25, noNaN: true })])(
    "at fixed dry-bulb and dew point the wet-bulb is lower at lower pressure (eq. 33: psychrometer term ∝ p)",
    (t, dep) => {
      const td = t - dep;
      const sea = wetBulbFromDewPointC(t, td, P0);
      const high = wetBulbFromDewPointC(t, td, pressureFromElevationPa(2000));
      expect(high).toBeLessThanOrEqual(sea + 2e-3);
    },
  );
});

describe("saturated enthalpy hot path (tabulated per pressure)", () => {
  psychrolib.SetUnitSystem(psychrolib.SI);
  // Working range of the solvers: entering wet-bulbs from −40 °C to water at 90 °C, site pressures from
  // 4000 m (61.6 kPa) to 400 m below sea level (106.2 kPa). The table's cubic interpolation must stay
  // within 1e−5 kJ/kg of psychrolib's GetSatAirEnthalpy (the reference implementation of ASHRAE 2017
  // ch.1 eqs. 5–6, 23, 32) wherever the water is below half its boiling pressure (pws ≤ 0.5·p: beyond
  // that no tower or cooler runs; the hot path there evaluates the formula itself).
  const sites = [-400, 0, 240, 1000, 2500, 4000].map(pressureFromElevationPa);
  it.each(sites)("matches psychrolib within 1e-5 kJ/kg over −40…90 °C at %d Pa", (p) => {
    let worst = 0;
    for (let t = -40; t <= 90; t += 0.0173) {
      if (psychrolib.GetSatVapPres(t) > 0.5 * p) break;
      const e = Math.abs(saturatedAirEnthalpyKJPerKg(t, p) - psychrolib.GetSatAirEnthalpy(t, p) / 1000);
      if (e > worst) worst = e;
    }
    expect(worst).toBeLessThan(1e-5);
  });

  it("is exact at the triple point from both sides and continuous across it (no interval spans the ice/water switch)", () => {
    for (const t of [0.01 - 1e-7, 0.01, 0.01 + 1e-7]) {
      expect(Math.abs(saturatedAirEnthalpyKJPerKg(t, P0) - psychrolib.GetSatAirEnthalpy(t, P0) / 1000)).toBeLessThan(1e-6);
    }
  });

  it("evaluates the formula outside the table (hot water at a high site)", () => {
    const p = pressureFromElevationPa(2500);
    for (const t of [-60, 88, 95]) {
      expect(saturatedAirEnthalpyKJPerKg(t, p)).toBe(saturatedAirEnthalpyExactKJPerKg(t, p));
    }
  });


  test.prop([fc.double({ min: -30, max: 70, noNaN: true }), fc.double({ min: 0.01, max: 5, noNaN: true })])(
    "is strictly increasing in temperature (dhs/dt = 1.006 + … > 0)",
    (t, dt) => {
      expect(saturatedAirEnthalpyKJPerKg(t + dt, P0)).toBeGreaterThan(saturatedAirEnthalpyKJPerKg(t, P0));
    },
  );

  it("counts every call, and no exponential once the table for the pressure exists", () => {
    saturatedAirEnthalpyKJPerKg(20, P0);
    resetPsychroCounters();
    for (let i = 0; i < 37; i++) saturatedAirEnthalpyKJPerKg(20 + i * 0.1, P0);
    expect(psychroCounters.saturatedEnthalpyCalls).toBe(37);
    expect(psychroCounters.exactSaturatedEnthalpyCalls).toBe(0);
    resetPsychroCounters();
    expect(psychroCounters.saturatedEnthalpyCalls).toBe(0);
  });

  it("stays finite and large where water would boil at the site pressure", () => {
    const p = pressureFromElevationPa(2000); // boils near 93 °C
    const h = saturatedAirEnthalpyKJPerKg(98, p);
    expect(Number.isFinite(h)).toBe(true);
    expect(h).toBeGreaterThan(saturatedAirEnthalpyKJPerKg(90, p));
  });

  it("does not depend on psychrolib's global unit setting", () => {
    psychrolib.SetUnitSystem(psychrolib.IP);
    const h = saturatedAirEnthalpyKJPerKg(30, P0);
    const twb = wetBulbFromRelativeHumidityC(30, 0.5, P0);
    psychrolib.SetUnitSystem(psychrolib.SI);
    expect(Math.abs(h - psychrolib.GetSatAirEnthalpy(30, P0) / 1000)).toBeLessThan(1e-9);
    expect(Math.abs(twb - psychrolib.GetTWetBulbFromRelHum(30, 0.5, P0))).toBeLessThan(1e-9);
  });
});

describe("curvature of the saturated-air enthalpy, d²hs/dT² (the tower's Halley step)", () => {
  // Reference: the central second difference of psychrolib's GetSatAirEnthalpy (the reference implementation
  // of ASHRAE Fundamentals 2017 ch.1), h = 0.01 K: truncation h²·hs⁗/12 and round-off are both far below
  // 0.1 % of hs″ at these temperatures (hand estimate).
  psychrolib.SetUnitSystem(psychrolib.SI);
  const cases: [number, number][] = [
    [-10, 101325],
    [5, 101325],
    [20, 101325],
    [35, 101325],
    [30, 89875],
  ];
  it.each(cases)("at %d °C, %d Pa: within 0.1 % of psychrolib's second difference", (t, p) => {
    const h = 0.01;
    const hsJ = (x: number) => psychrolib.GetSatAirEnthalpy(x, p);
    const reference = (hsJ(t + h) - 2 * hsJ(t) + hsJ(t - h)) / (h * h) / 1000;
    const hs = psychrolib.GetSatAirEnthalpy(t, p) / 1000;
    expect(Math.abs(saturatedEnthalpyCurvatureKJPerKgK2(t, hs) / reference - 1)).toBeLessThan(1e-3);
  });

  it.each(cases)("slope and curvature together (the tower's iteration) at %d °C, %d Pa: psychrolib's central differences", (t, p) => {
    // Slope: central first difference, h = 0.01 K (truncation h²·hs‴/6, far below 1e-5 of hs′; hand estimate).
    const h = 0.01;
    const hsJ = (x: number) => psychrolib.GetSatAirEnthalpy(x, p);
    const slopeReference = (hsJ(t + h) - hsJ(t - h)) / (2 * h) / 1000;
    const curvatureReference = (hsJ(t + h) - 2 * hsJ(t) + hsJ(t - h)) / (h * h) / 1000;
    const out = { slope: 0, curvature: 0 };
    saturatedEnthalpySlopeAndCurvature(t, psychrolib.GetSatAirEnthalpy(t, p) / 1000, out);
    expect(Math.abs(out.slope / slopeReference - 1)).toBeLessThan(1e-5);
    expect(Math.abs(out.curvature / curvatureReference - 1)).toBeLessThan(1e-3);
  });
});
