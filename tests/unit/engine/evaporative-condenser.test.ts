import { describe, expect, it, vi } from "vitest";
import fc from "fast-check";
import psychrolib from "psychrolib";
import { enteringAir } from "@/lib/engine/air-side";
import {
  type EvaporativeCondenserSelection,
  calibrateEvaporativeCondenser,
  condensingTemperatureAtAirflowC,
  evaporativeCondenserCapacityKW,
  monthlyScaleDerate,
  solveEvaporativeCondenserHour,
  sprayLoopWaterKgPerS,
} from "@/lib/engine/evaporative-condenser";
import type { FanModel } from "@/lib/engine/fans";

vi.setConfig({ testTimeout: 60_000 });

const P = 101_325;
// An invented selection at the usual ammonia rating point: 35 °C condensing at 25.6 °C wet-bulb
// ([memory] 95 °F / 78 °F), 1200 kW of heat rejection, 36 kg/s of air.
const sel: EvaporativeCondenserSelection = {
  ratedHeatRejectionKW: 1200,
  ratedCondensingC: 35,
  ratedWetBulbC: 25.6,
  airFlowKgPerS: 36,
  internalResistanceFraction: 0.15,
  dryRating: { heatRejectionKW: 300, condensingC: 30, dryBulbC: 0 },
  dryExternalConductanceFactor: 0.7,
  allowDryMode: true,
  modeSelection: "lowestTotalPower",
  sprayLockoutDryBulbC: -30,
};
const { model, warnings } = calibrateEvaporativeCondenser(sel, P, "options.3.evaporativeCondenser");
const fan: FanModel = {
  designPowerKW: 30,
  control: "variableSpeed",
  minSpeedFraction: 0.25,
  powerFloorFraction: 0.05,
  lowSpeedFraction: 0.5,
  naturalDraftAirflowFraction: 0.1,
};

describe("evaporative condenser calibration", () => {
  it("reproduces its wet rating (1200 kW at 35 °C condensing, 25.6 °C wet-bulb) after calibration", () => {
    expect(warnings).toEqual([]);
    // Entering air at the rating wet-bulb; the dry-bulb does not enter the wet model (Merkel: ha,in = hs(twb)).
    const air = enteringAir(33, 25.6, P);
    expect(evaporativeCondenserCapacityKW(model, 35, air, 1, true, P)).toBeCloseTo(1200, 6);
    expect(condensingTemperatureAtAirflowC(model, air, 1200, 1, true, P)).toBeCloseTo(35, 3);
  });

  it("reproduces its dry rating (300 kW at 30 °C condensing, 0 °C dry-bulb) after calibration", () => {
    // The dry rating was calibrated with moist-air cp at W = 0.005; 0 °C air with a −2.2 °C wet-bulb at
    // sea level carries W ≈ 0.0025 [psychrolib], so cp differs by 0.1 %: 0.5 % tolerance.
    const air = enteringAir(0, -2.2, P);
    const q = evaporativeCondenserCapacityKW(model, 30, air, 1, false, P);
    expect(Math.abs(q / 300 - 1)).toBeLessThan(0.005);
  });

  it("warns when the rating cannot be carried by the stated airflow", () => {
    // 1200 kW over 10 kg/s of air needs 120 kJ/kg; saturation at 35 °C is only ≈ 50 kJ/kg above 25.6 °C air
    // (ASHRAE Fundamentals 2017 ch.1 Table 2: hs(35 °C) ≈ 129.8, hs(25.6 °C) ≈ 79 kJ/kg).
    const r = calibrateEvaporativeCondenser({ ...sel, airFlowKgPerS: 10 }, P, "o");
    expect(r.warnings.map((w) => w.code)).toContain("evaporativeCondenser.ratingInfeasible");
  });

  it("capacity at a 21.1 °C (70 °F) wet-bulb is 1.25–1.55 × the 25.6 °C rating at 35 °C condensing", () => {
    // [memory] manufacturers' ammonia capacity factors at 95 °F condensing: about 1.3–1.5 × the 78 °F
    // wet-bulb rating at 70 °F. A screening check of the enthalpy-potential model, not a precise value.
    const ratio = evaporativeCondenserCapacityKW(model, 35, enteringAir(28, 21.1, P), 1, true, P) / 1200;
    expect(ratio).toBeGreaterThan(1.25);
    expect(ratio).toBeLessThan(1.55);
  });
});

describe("evaporative condenser properties (fast-check)", () => {
  it("capacity falls as the wet-bulb rises (fixed condensing temperature and airflow)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: -5, max: 28, noNaN: true }),
        fc.double({ min: 0.2, max: 4, noNaN: true }),
        fc.double({ min: 30, max: 45, noNaN: true }),
        fc.double({ min: 0.2, max: 1, noNaN: true }),
        (wb, dwb, tc, f) => {
          const q1 = evaporativeCondenserCapacityKW(model, tc, enteringAir(wb + 5, wb, P), f, true, P);
          const q2 = evaporativeCondenserCapacityKW(model, tc, enteringAir(wb + dwb + 5, wb + dwb, P), f, true, P);
          expect(q2).toBeLessThan(q1);
        },
      ),
    );
  });

  it("capacity rises with the condensing temperature (fixed air and airflow)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: -5, max: 27, noNaN: true }),
        fc.double({ min: 28, max: 45, noNaN: true }),
        fc.double({ min: 0.1, max: 3, noNaN: true }),
        fc.double({ min: 0.2, max: 1, noNaN: true }),
        (wb, tc, dtc, f) => {
          const air = enteringAir(wb + 4, wb, P);
          const q1 = evaporativeCondenserCapacityKW(model, tc, air, f, true, P);
          const q2 = evaporativeCondenserCapacityKW(model, tc + dtc, air, f, true, P);
          expect(q2).toBeGreaterThan(q1);
        },
      ),
    );
  });

  it("the floating condensing temperature inverts the capacity", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 28, noNaN: true }),
        fc.double({ min: 100, max: 1600, noNaN: true }),
        fc.double({ min: 0.3, max: 1, noNaN: true }),
        (wb, q, f) => {
          const air = enteringAir(wb + 6, wb, P);
          const tc = condensingTemperatureAtAirflowC(model, air, q, f, true, P);
          expect(evaporativeCondenserCapacityKW(model, tc, air, f, true, P) / q).toBeCloseTo(1, 3);
        },
      ),
    );
  });
});

describe("evaporative condenser operation", () => {
  it("holds 35 °C at part airflow in mild weather and floats above it at full airflow in a hot hour", () => {
    const mild = solveEvaporativeCondenserHour(model, fan, enteringAir(24, 18, P), 1200, 35, P);
    expect(mild.held).toBe(true);
    expect(mild.mode).toBe("wet");
    expect(mild.condensingC).toBe(35);
    expect(mild.airflowFraction).toBeGreaterThan(0.25);
    expect(mild.airflowFraction).toBeLessThan(1);
    // Affinity law with the drive floor: P = 30·(0.05 + 0.95·f³) (fans.ts; fan laws [pub]).
    expect(mild.fanPowerKW).toBeCloseTo(30 * (0.05 + 0.95 * mild.airflowFraction ** 3), 9);
    const hot = solveEvaporativeCondenserHour(model, fan, enteringAir(34, 28, P), 1200, 35, P);
    expect(hot.held).toBe(false);
    expect(hot.condensingC).toBeGreaterThan(35);
    expect(hot.fanPowerKW).toBe(30);
  });

  it("runs dry in winter where rated, with no evaporation and the spray off", () => {
    const r = solveEvaporativeCondenserHour(model, fan, enteringAir(-5, -6, P), 300, 30, P);
    expect(r.mode).toBe("dry");
    expect(r.sprayOn).toBe(false);
    expect(r.evaporationKgPerS).toBe(0);
    const noDry = calibrateEvaporativeCondenser({ ...sel, allowDryMode: false }, P, "o").model;
    expect(solveEvaporativeCondenserHour(noDry, fan, enteringAir(-5, -6, P), 300, 30, P).mode).toBe("wet");
  });

  it("coil scale derates capacity by its fraction; the derate is restored by each cleaning", () => {
    const air = enteringAir(30, 24, P);
    const clean = evaporativeCondenserCapacityKW(model, 35, air, 1, true, P);
    expect(evaporativeCondenserCapacityKW(model, 35, air, 1, true, P, 0.08) / clean).toBeCloseTo(0.92, 12);
    expect(condensingTemperatureAtAirflowC(model, air, 1000, 1, true, P, 0.08)).toBeGreaterThan(condensingTemperatureAtAirflowC(model, air, 1000, 1, true, P));
    // Linear growth 0 → 12 % over a 12-month cleaning interval: 1 % per month, each month's mean at its
    // middle (hand calculation): 0.5 %, 1.5 %, …, 11.5 %.
    const m = monthlyScaleDerate(0.12, 12);
    const hand = [0.005, 0.015, 0.025, 0.035, 0.045, 0.055, 0.065, 0.075, 0.085, 0.095, 0.105, 0.115];
    m.forEach((v, i) => expect(v).toBeCloseTo(hand[i] ?? Number.NaN, 12));
    // Six-monthly cleaning with 6 % before it: the pattern repeats twice a year.
    expect(monthlyScaleDerate(0.06, 6)[6]).toBeCloseTo(0.005, 12);
  });
});

describe("evaporative condenser water", () => {
  it("evaporation matches the air-side balance computed with psychrolib (ASHRAE Fundamentals ch.1 formulas)", () => {
    // Reference: psychrolib (the ASHRAE-formula library). Leaving air saturated at h(tdb, Win) + Q/ma
    // (the entering air's true enthalpy); E = ma·(Ws(Tout) − Win). Bisection on psychrolib's
    // GetSatAirEnthalpy written out here.
    psychrolib.SetUnitSystem(psychrolib.SI);
    const tdb = 33;
    const twb = 25.6;
    const q = 1200;
    const ma = 36;
    const wIn = psychrolib.GetHumRatioFromTWetBulb(tdb, twb, P);
    const hIn = psychrolib.GetMoistAirEnthalpy(tdb, wIn) / 1000;
    const hOut = hIn + q / ma;
    let lo = twb;
    let hi = 60;
    for (let i = 0; i < 80; i++) {
      const mid = 0.5 * (lo + hi);
      if (psychrolib.GetSatAirEnthalpy(mid, P) / 1000 < hOut) lo = mid;
      else hi = mid;
    }
    const wOut = psychrolib.GetSatHumRatio(0.5 * (lo + hi), P);
    const eRef = ma * (wOut - wIn);
    const r = solveEvaporativeCondenserHour(model, { ...fan, control: "cycling" }, enteringAir(tdb, twb, P), q, 35, P);
    // Rated conditions: full airflow (cycling control at exactly 100 %).
    expect(r.airflowFraction).toBeCloseTo(1, 6);
    expect(r.held).toBe(true);
    expect(r.evaporationKgPerS / eRef).toBeCloseTo(1, 3);
    // Cross-check [practice]: E ≈ f·Q/hfg with latent fraction f ≈ 0.75–1.0 in summer (hfg ≈ 2420 kJ/kg at
    // 33 °C, IAPWS-IF97 steam tables).
    const f = (r.evaporationKgPerS * 2420) / q;
    expect(f).toBeGreaterThan(0.75);
    expect(f).toBeLessThan(1.05);
  });

  it("the spray-loop balance closes on hand numbers", () => {
    // Hand calculation: E = 0.4 kg/s, spray 30 kg/s, drift 0.005 % → D = 0.0015 kg/s; C = 4 →
    // B = 0.4/3 − 0.0015 = 0.131833… kg/s; M = 0.4 + 0.131833… + 0.0015 = 0.533333… kg/s (= E·C/(C − 1)).
    const w = sprayLoopWaterKgPerS(0.4, 30, 0.00005, 4, true);
    expect(w.drift).toBeCloseTo(0.0015, 12);
    expect(w.blowdown).toBeCloseTo(0.1318333333333, 12);
    expect(w.makeup).toBeCloseTo(0.5333333333333, 12);
    // Drift beyond the cycles' need: E = 0.01, spray 30, drift 0.05 % → D = 0.015 > E/(C − 1) = 0.00333: B = 0,
    // M = 0.025 kg/s (hand).
    const d = sprayLoopWaterKgPerS(0.01, 30, 0.0005, 4, true);
    expect(d.blowdown).toBe(0);
    expect(d.makeup).toBeCloseTo(0.025, 12);
    // Spray off (dry hours): no water at all.
    expect(sprayLoopWaterKgPerS(0.4, 30, 0.00005, 4, false)).toEqual({ evaporation: 0, drift: 0, blowdown: 0, makeup: 0 });
  });
});
