import { describe, expect, it, vi } from "vitest";
import fc from "fast-check";
import psychrolib from "psychrolib";
import { enteringAir } from "@/lib/engine/air-side";
import type { FanModel } from "@/lib/engine/fans";
import {
  type CoolerSelection,
  calibrateCooler,
  coolerCapacityKW,
  coolerAirflowForLeavingFluid,
  coolerAirflowSlopeAtFullSpeedPerK,
  coolerConductanceKWPerK,
  coolerConductanceWithSlope,
  enthalpyBasedAirSpecificHeat,
  requiredAirflowFraction,
  coolerLeavingFluidAtAirflowC,
  solveCoolerHour,
} from "@/lib/engine/fluid-cooler";
import { fluidProperties } from "@/lib/engine/glycol";
import { counterflowEffectiveness, counterflowNtu } from "@/lib/engine/heat-exchanger";

// Whole-year runs and property tests: generous time on a shared CI machine.
vi.setConfig({ testTimeout: 60_000 });

const P = 98_500;
const sel: CoolerSelection = {
  fluidFlowKgPerS: 72,
  enteringFluidC: 33.3,
  leavingFluidC: 28.3,
  designWetBulbC: 24,
  designFluidToAirRatio: 1,
  internalResistanceFraction: 0.3,
  dryRating: { enteringFluidC: 33.3, leavingFluidC: 30.5, dryBulbC: 5 },
  dryExternalConductanceFactor: 0.7,
  allowDryMode: true,
  modeSelection: "lowestTotalPower",
  sprayLockoutDryBulbC: -50,
  glycol: { kind: "none", massFraction: 0 },
  ratingFluid: "water",
};
const { model } = calibrateCooler(sel, P, "c");
const cpRating = fluidProperties("none", 0, 30.8).specificHeatKJPerKgK;
const qWet = 72 * cpRating * 5;
const fan: FanModel = {
  designPowerKW: 37,
  control: "variableSpeed",
  minSpeedFraction: 0.25,
  powerFloorFraction: 0.05,
  lowSpeedFraction: 0.5,
  naturalDraftAirflowFraction: 0.1,
};

describe("counterflow effectiveness-NTU", () => {
  // Source: Incropera & DeWitt, Fundamentals of Heat and Mass Transfer, Table 11.3 (counterflow):
  // ε = [1 − e^(−NTU(1−Cr))]/[1 − Cr·e^(−NTU(1−Cr))]; ε = NTU/(1 + NTU) for Cr = 1; 1 − e^(−NTU) for Cr = 0.
  it("matches the closed forms and inverts exactly", () => {
    expect(counterflowEffectiveness(1, 1)).toBeCloseTo(0.5, 12);
    expect(counterflowEffectiveness(1, 0)).toBeCloseTo(1 - Math.exp(-1), 12);
    expect(counterflowEffectiveness(1, 0.5)).toBeCloseTo((1 - Math.exp(-0.5)) / (1 - 0.5 * Math.exp(-0.5)), 12);
    fc.assert(
      fc.property(fc.double({ min: 0.05, max: 6, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), (ntu, cr) => {
        expect(counterflowNtu(counterflowEffectiveness(ntu, cr), cr)).toBeCloseTo(ntu, 6);
      }),
    );
  });
});

describe("closed-circuit cooler calibration", () => {
  it("reproduces its wet rating point after calibration", () => {
    const air = enteringAir(31, 24, P);
    expect(coolerLeavingFluidAtAirflowC(model, air, qWet, 1, true, P)).toBeCloseTo(28.3, 3);
    expect(coolerCapacityKW(model, 33.3, air, 1, true, P) / qWet).toBeCloseTo(1, 4);
  });

  it("reproduces its dry rating point after calibration (moist-air cp at a typical humidity)", () => {
    const qDry = 72 * cpRating * (33.3 - 30.5);
    // Dry rating's air: 5 °C dry-bulb with W ≈ 0.005 (wet-bulb ≈ 3.3 °C at this pressure)
    const air = enteringAir(5, 3.3, P);
    expect(Math.abs(coolerLeavingFluidAtAirflowC(model, air, qDry, 1, false, P) - 30.5)).toBeLessThan(0.05);
  });

  it("without a dry rating uses the default dry factor", () => {
    const { model: m } = calibrateCooler({ ...sel, dryRating: undefined }, P, "c");
    expect(m.dryFactor).toBe(0.7);
  });

  // Glycol: lower cp and tube-side coefficient (Dittus–Boelter with Melinder's properties) cut capacity.
  it("30 % propylene glycol rated on water loses capacity", () => {
    const { model: g } = calibrateCooler({ ...sel, glycol: { kind: "propyleneGlycol", massFraction: 0.3 } }, P, "c");
    const air = enteringAir(31, 24, P);
    expect(g.internalUaKWPerK).toBeLessThan(model.internalUaKWPerK * 0.8);
    expect(coolerCapacityKW(g, 33.3, air, 1, true, P)).toBeLessThan(coolerCapacityKW(model, 33.3, air, 1, true, P));
  });
});

describe("cooler mode selection", () => {
  it("runs dry only when dry operation holds the set-point, and wet hours use the spray", () => {
    fc.assert(
      fc.property(
        fc.double({ min: -15, max: 32, noNaN: true }),
        fc.double({ min: 0, max: 8, noNaN: true }),
        fc.double({ min: 0.3, max: 1, noNaN: true }),
        (db, depression, load) => {
          const air = enteringAir(db, db - depression, P);
          const q = qWet * load;
          const r = solveCoolerHour(model, fan, air, q, 28.3, P);
          const dryAtFull = coolerLeavingFluidAtAirflowC(model, air, q, 1, false, P);
          if (r.mode === "dry") {
            expect(dryAtFull).toBeLessThanOrEqual(28.3 + 1e-6);
            expect(r.evaporationKgPerS).toBe(0);
            expect(r.sprayOn).toBe(false);
          } else {
            expect(dryAtFull).toBeGreaterThan(28.3 - 1e-6);
            expect(r.sprayOn).toBe(true);
          }
          if (r.held) expect(r.leavingFluidC).toBe(28.3);
        },
      ),
      { numRuns: 200 },
    );
  });

  it("respects a dry-bulb limit on dry operation", () => {
    const { model: m } = calibrateCooler({ ...sel, dryModeMaxDryBulbC: -5 }, P, "c");
    const r = solveCoolerHour(m, fan, enteringAir(0, -2, P), qWet * 0.4, 28.3, P);
    expect(r.mode).toBe("wet");
  });
});

describe("a selection exactly at its rating point holds it", () => {
  // Common practice, no source: a unit operated at the very conditions it was selected for (design
  // wet-bulb, flow, range, leaving temperature) meets its rating; a model calibrated on that point must
  // report the set-point as held, within the rounding of the calibration round trip.
  it("the cooler at its wet rating point, over a grid of pressures, wet-bulbs, approaches and ranges", () => {
    let notHeld = 0;
    for (const p of [101_325, 98_500, 89_875])
      for (const wb of [18, 21.3, 24, 25.6, 27.1])
        for (const approach of [2.5, 3.1, 4.7, 6])
          for (const range of [3, 5.5, 7.7])
            for (const glycol of [{ kind: "none" as const, massFraction: 0 }, { kind: "propyleneGlycol" as const, massFraction: 0.3 }]) {
              const s: CoolerSelection = {
                ...sel,
                fluidFlowKgPerS: 50.3,
                enteringFluidC: wb + approach + range,
                leavingFluidC: wb + approach,
                designWetBulbC: wb,
                glycol,
                ratingFluid: glycol.kind === "none" ? "water" : "loopFluid",
              };
              const m = calibrateCooler(s, p, "c").model;
              const r = solveCoolerHour(m, fan, enteringAir(wb + 8, wb, p), m.fluidCapacityKWPerK * range, wb + approach, p);
              if (!r.held) notHeld++;
            }
    expect(notHeld).toBe(0);
  });
});

describe("cooler leaving-fluid temperature at a given airflow (wet, floating)", () => {
  // The answer must satisfy the model's own energy balance, rebuilt here by hand with psychrolib's
  // saturated-air enthalpy (ASHRAE Fundamentals 2017 ch.1, the reference library): Tin = T + Q/Cf,
  // Tm = Tin − Q/(2·Cf), cs = (hs(Tm) − hs(Twb))/(Tm − Twb), Q = εCmin(cs)·(Tin − Twb).
  // At low airflow (the fan-off and low-speed states of a mix) plain substitution on cs oscillates with
  // a growing amplitude (|G′| > 1); the solver must still land on the balance.
  psychrolib.SetUnitSystem(psychrolib.SI);
  const hsKJ = (tC: number) => psychrolib.GetSatAirEnthalpy(tC, P) / 1000;
  it("closes Q = εCmin·(Tin − Twb) within 0.05 % from natural draft to full speed", () => {
    const cf = model.fluidCapacityKWPerK;
    for (const [db, wb] of [[5, 3], [10, 8], [20, 15], [25, 20], [32, 24]] as const) {
      const air = enteringAir(db, wb, P);
      for (const q of [0.3 * qWet, 0.7 * qWet, qWet]) {
        for (const f of [0.1, 0.25, 0.5, 1]) {
          const t = coolerLeavingFluidAtAirflowC(model, air, q, f, true, P);
          const tin = t + q / cf;
          const tm = tin - q / (2 * cf);
          const cs = (hsKJ(tm) - hsKJ(air.wetBulbC)) / (tm - air.wetBulbC);
          const back = coolerConductanceKWPerK(model, f, air, cs) * (tin - air.wetBulbC);
          expect(Math.abs(back - q) / q, `db ${db} wb ${wb} Q ${q.toFixed(0)} f ${f}: T ${t}`).toBeLessThan(5e-4);
        }
      }
    }
  });
});

describe("cooler capacity at a given entering-fluid temperature and airflow (wet, rating checks)", () => {
  // A unit with a large conductance for its airflow (rated at 2.5 K approach over a 10 K range at a 16 °C
  // wet-bulb) run with hot fluid at low airflow: there the substitution Q ← εCmin(cs(Q))·ΔT swings about the
  // root with a slope near −0.8 and, after its 20 passes, stopped ~0.1 % from it (85 °C, f = 0.15). The
  // answer must be a fixed point of its own defining equation.
  const hot = calibrateCooler({ ...sel, designWetBulbC: 16, leavingFluidC: 18.5, enteringFluidC: 28.5, dryRating: undefined }, P, "c").model;
  psychrolib.SetUnitSystem(psychrolib.SI);
  const hsKJ = (tC: number) => psychrolib.GetSatAirEnthalpy(tC, P) / 1000;
  const cases = [
    [hot, 20, 85, 0.15],
    [hot, 25, 80, 0.1],
    [hot, 27, 85, 0.05],
    [hot, 10, 60, 0.15],
    [model, 20, 85, 0.1],
    [model, 24, 70, 0.15],
  ] as const;
  it("returns a fixed point of Q = εCmin(cs(Q))·(Tin − Twb) at low airflow and large ΔT", () => {
    for (const [m, wb, tin, f] of cases) {
      const air = enteringAir(wb + 5, wb, P);
      const q = coolerCapacityKW(m, tin, air, f, true, P);
      const label = `Twb ${wb} Tin ${tin} f ${f}: Q ${q}`;
      // The model's own definition, rebuilt from its primitives: Tm = Tin − Q/(2·Cf), cs = chord slope of hs
      // between Twb and Tm (Jaber & Webb 1989), εCmin by counterflow ε-NTU (Incropera & DeWitt, Table 11.3).
      const tm = tin - q / (2 * m.fluidCapacityKWPerK);
      const own = coolerConductanceKWPerK(m, f, air, enthalpyBasedAirSpecificHeat(tm, air, P)) * (tin - wb);
      expect(Math.abs(own - q), label).toBeLessThan(1e-6 * q);
      // The same balance with psychrolib's saturated-air enthalpy (ASHRAE Fundamentals 2017 ch.1, the
      // reference library) for cs: the engine's hs differs from it only by its fit, within 0.05 %.
      const csRef = (hsKJ(tm) - hsKJ(wb)) / (tm - wb);
      const ref = coolerConductanceKWPerK(m, f, air, csRef) * (tin - wb);
      expect(Math.abs(ref - q) / q, label).toBeLessThan(5e-4);
    }
  });

  it("stays within the energy-balance bounds", () => {
    for (const [m, wb, tin, f] of cases) {
      const air = enteringAir(wb + 5, wb, P);
      const q = coolerCapacityKW(m, tin, air, f, true, P);
      const label = `Twb ${wb} Tin ${tin} f ${f}: Q ${q}`;
      // First law, fluid side: the fluid cannot leave below the entering wet-bulb, Q < Cf·(Tin − Twb).
      expect(q, label).toBeGreaterThan(0);
      expect(q, label).toBeLessThan(m.fluidCapacityKWPerK * (tin - wb));
      // First law, air side: the air cannot leave above saturation at the entering-fluid temperature,
      // Q < ma·(hs(Tin) − hs(Twb)), hs from psychrolib (ASHRAE Fundamentals 2017 ch.1); 0.05 % for the fit.
      expect(q, label).toBeLessThan(m.designAirFlowKgPerS * f * (hsKJ(tin) - hsKJ(wb)) * (1 + 5e-4));
    }
  });
});

describe("cooler conductance slope (the Newton step of the airflow root)", () => {
  it("equals a central difference of εCmin and the root reproduces the airflow it was built from", () => {
    const air = enteringAir(20, 15, P);
    const out = { k: 0, dk: 0, dkExternal: 0 };
    for (const cs of [undefined, 2, 3.5, 6]) {
      for (const f of [0.02, 0.1, 0.3, 0.6, 0.95, 1]) {
        const h = 1e-6;
        const central = (coolerConductanceKWPerK(model, f + h, air, cs) - coolerConductanceKWPerK(model, f - h, air, cs)) / (2 * h);
        coolerConductanceWithSlope(model, f, air, cs, out);
        expect(out.k).toBeCloseTo(coolerConductanceKWPerK(model, f, air, cs), 10);
        expect(Math.abs(out.dk - central) / central).toBeLessThan(1e-6);
        expect(requiredAirflowFraction(model, air, out.k, cs)).toBeCloseTo(f, 7);
      }
    }
  });
});

describe("airflow slope at full speed (the floating search's low end)", () => {
  it("continues the requirement's slope from just warmer than what full speed reaches, where the root is below full speed", () => {
    // Continuity check: the direct slope at full speed against coolerAirflowForLeavingFluid's own slope
    // 0.001 K warmer (there the airflow root exists, f < 1). Both hold cs at the required temperatures
    // (its drift with T is second order, see coolerAirflowForLeavingFluid).
    for (const [db, wb, q] of [[20, 15, 0.8 * qWet], [28, 22, qWet], [10, 8, 0.6 * qWet]] as const) {
      const air = enteringAir(db, wb, P);
      const lowC = coolerLeavingFluidAtAirflowC(model, air, q, 1, true, P);
      const inside = coolerAirflowForLeavingFluid(model, air, q, lowC + 1e-3, true, P);
      expect(inside.fraction).toBeLessThan(1);
      const direct = coolerAirflowSlopeAtFullSpeedPerK(model, air, q, lowC, true, P);
      expect(direct).toBeLessThan(0);
      expect(Math.abs(direct - inside.slopePerK) / Math.abs(inside.slopePerK)).toBeLessThan(0.01);
    }
  });
});

describe("required airflow's slope with the leaving-fluid temperature (the floating search's marginal)", () => {
  it("matches a central difference of the requirement, wet and dry", () => {
    // Reference: (f(T + 0.01) − f(T − 0.01))/0.02 of coolerAirflowForLeavingFluid's own fraction — each side
    // a fresh root with its own cs (a fresh saturated enthalpy). The analytic slope includes cs's drift with T
    // (without it the wet slopes here were up to 24 % off); truncation of the difference h²·f‴/6 is far below
    // the tolerance (hand estimate).
    for (const [db, wb, q, t, wet] of [
      [20, 15, 0.8 * qWet, 27, true],
      [28, 22, qWet, 31, true],
      [5, 3, 0.5 * qWet, 30, false],
      [-2, -3, 0.4 * qWet, 20, false],
    ] as const) {
      const air = enteringAir(db, wb, P);
      const mid = coolerAirflowForLeavingFluid(model, air, q, t, wet, P);
      expect(mid.fraction).toBeGreaterThan(0.1);
      expect(mid.fraction).toBeLessThan(1);
      const central = (coolerAirflowForLeavingFluid(model, air, q, t + 0.01, wet, P).fraction - coolerAirflowForLeavingFluid(model, air, q, t - 0.01, wet, P).fraction) / 0.02;
      expect(mid.slopePerK).toBeLessThan(0);
      expect(Math.abs(mid.slopePerK / central - 1)).toBeLessThan(1e-4);
    }
  });
});
