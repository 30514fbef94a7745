import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { type FanModel, fanOperationForRequiredAirflow, fanPowerAtSpeedKW, highStateTimeFraction } from "@/lib/engine/fans";

const base: FanModel = {
  designPowerKW: 30,
  control: "twoSpeed",
  minSpeedFraction: 0.25,
  powerFloorFraction: 0.05,
  lowSpeedFraction: 0.5,
  naturalDraftAirflowFraction: 0.1,
};

describe("fan laws", () => {
  // Source: fan affinity laws (ASHRAE Handbook—HVAC Systems and Equipment, Fans): power ∝ speed³.
  it("fixed-speed motors follow the cube law", () => {
    fc.assert(
      fc.property(fc.double({ min: 0.05, max: 1, noNaN: true }), (f) => {
        expect(fanPowerAtSpeedKW(base, f) / fanPowerAtSpeedKW(base, 1)).toBeCloseTo(f ** 3, 12);
      }),
    );
    expect(fanPowerAtSpeedKW(base, 0.5)).toBeCloseTo(30 / 8, 12);
  });

  // Source: Methods §2 (P/Pd = a + (1 − a)·f³, a ≈ 0.05 [practice]).
  it("a variable-speed drive adds its floor: P/Pd = a + (1 − a)·f³", () => {
    const vsd = { ...base, control: "variableSpeed" as const };
    expect(fanPowerAtSpeedKW(vsd, 1)).toBeCloseTo(30, 12);
    expect(fanPowerAtSpeedKW(vsd, 0.5)).toBeCloseTo(30 * (0.05 + 0.95 * 0.125), 12);
    expect(fanPowerAtSpeedKW(vsd, 0)).toBe(0);
  });
});

describe("fan control", () => {
  it("maps a required airflow to the installed control's states", () => {
    const vsd = { ...base, control: "variableSpeed" as const };
    expect(fanOperationForRequiredAirflow(vsd, 0.6)).toMatchObject({ kind: "continuous", state: { airflowFraction: 0.6 } });
    expect(fanOperationForRequiredAirflow(vsd, 0.2)).toMatchObject({ kind: "mix", low: { powerKW: 0 }, high: { airflowFraction: 0.25 } });
    expect(fanOperationForRequiredAirflow(vsd, 0.05)).toMatchObject({ kind: "continuous", state: { powerKW: 0 } });
    expect(fanOperationForRequiredAirflow(vsd, 1.2).kind).toBe("insufficient");
    expect(fanOperationForRequiredAirflow(base, 0.7)).toMatchObject({ kind: "mix", low: { airflowFraction: 0.5 }, high: { airflowFraction: 1 } });
    expect(fanOperationForRequiredAirflow(base, 0.3)).toMatchObject({ kind: "mix", low: { powerKW: 0 }, high: { airflowFraction: 0.5 } });
    const cycling = { ...base, control: "cycling" as const };
    expect(fanOperationForRequiredAirflow(cycling, 0.3)).toMatchObject({ kind: "mix", low: { powerKW: 0 }, high: { airflowFraction: 1, powerKW: 30 } });
  });

  // Temperature-weighted cycling ratio (U.S. DOE EnergyPlus Engineering Reference, single-speed tower).
  it("the time in the high state makes the average leaving temperature the required one", () => {
    fc.assert(
      fc.property(fc.double({ min: 20, max: 30, noNaN: true }), fc.double({ min: 0.5, max: 10, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), (tHigh, span, u) => {
        const tLow = tHigh + span;
        const req = tHigh + u * span;
        const x = highStateTimeFraction(tLow, tHigh, req);
        expect(x * tHigh + (1 - x) * tLow).toBeCloseTo(req, 9);
      }),
    );
  });
});
