import { describe, expect, it, vi } from "vitest";
import { analyzeScenario, physicsOf, prepareScenario } from "@/lib/engine";
import { enteringAir, enteringAirAt } from "@/lib/engine/air-side";
import { type YearContext, compressorModelFromDuty } from "@/lib/engine/annual";
import { evaluateRecord } from "@/lib/engine/annual/record";
import { compressorPowerKW } from "@/lib/engine/compressor";
import { condensingTemperatureC } from "@/lib/engine/condenser";
import { designHeatRejectionKW, designRefrigerationLoadKW, hourLoadFraction } from "@/lib/engine/duty";
import { fanPowerAtSpeedKW } from "@/lib/engine/fans";
import type { ScenarioInput } from "@/lib/engine/input";
import { plateExchangerApproachK } from "@/lib/engine/plate-exchanger";
import { towerColdWaterAtAirflowC } from "@/lib/engine/tower";
import { designDaySentence } from "@/lib/reports/design-day";
import { warningText } from "@/lib/units/warnings";
import { fixtureInput } from "./helpers";

vi.setConfig({ testTimeout: 60_000 });

const light = (s: ScenarioInput): ScenarioInput => ({ ...s, sensitivity: undefined, monteCarlo: undefined });

function yearContext(input: ScenarioInput, prepared: ReturnType<typeof prepareScenario>): YearContext {
  return {
    pPa: prepared.pressurePa,
    climate: prepared.climate,
    duty: input.duty,
    designHeatKW: designHeatRejectionKW(input.duty),
    refrigerationPerRejection: designRefrigerationLoadKW(input.duty) / designHeatRejectionKW(input.duty),
    compressor: compressorModelFromDuty(input.duty).model,
    water: input.water,
    cycles: 4,
    loadFactor: 1,
  };
}

describe("floating head pressure: fan speed minimising fan + compressor power", () => {
  // Common practice, no source: floating head pressure trades fan power against compressor power; the
  // engine's choice must be the minimum a brute-force scan of fan speed finds. A large fan and a weak
  // compressor sensitivity (0.5 %/K) put the optimum inside the speed range.
  const base = fixtureInput("scenario-bins.json");
  const input: ScenarioInput = structuredClone(light(base));
  input.duty.compressorModel = { kind: "percentPerK", percentPerK: 0.5, floorFraction: 0.4 };
  const plateIndex = input.options.findIndex((o) => o.kind === "openTowerPlateHx");
  const plate = input.options[plateIndex];
  if (!plate || plate.kind !== "openTowerPlateHx") throw new Error("fixture changed");
  plate.fan.designPowerKW = 300;
  const prepared = prepareScenario(input);
  const po = prepared.options[plateIndex];
  const ctx = yearContext(input, prepared);

  for (const [wb, db, load] of [
    [14, 19, 0.7],
    [8, 12, 0.6],
    [20, 27, 0.9],
  ] as const) {
    it(`wet-bulb ${wb} °C, ${Math.round(load * 100)} % load: the engine's total is the scan's minimum (±0.05 %)`, () => {
      if (!po || po.device.kind !== "tower" || !po.plate) throw new Error("not a plate option");
      const air = enteringAir(db, wb, ctx.pPa);
      const q = ctx.designHeatKW * load;
      const qe = q * ctx.refrigerationPerRejection;
      const r = evaluateRecord(po, ctx, air, q, 0);
      const approach = plateExchangerApproachK(q, po.plate.cleanUaKWPerK, po.plate.hotCapacityKWPerK, po.plate.coldCapacityKWPerK);
      const fMin = Math.max(po.fan.minSpeedFraction, po.fan.naturalDraftAirflowFraction);
      let best = Number.POSITIVE_INFINITY;
      for (let f = fMin; f <= 1 + 1e-12; f += 0.0005) {
        const cold = towerColdWaterAtAirflowC(po.device.model, air, q, f, ctx.pPa);
        const tc = condensingTemperatureC(cold + approach, q, po.condenserCleanUaKWPerK, po.condenserCapacityKWPerK);
        if (tc < input.duty.minimumCondensingC - 1e-6 || tc > input.duty.condensingSetPointC + 1e-6) continue;
        best = Math.min(best, fanPowerAtSpeedKW(po.fan, f) + compressorPowerKW(ctx.compressor, qe, tc));
      }
      expect(Number.isFinite(best)).toBe(true);
      const engine = r.fanKW + r.compressorKW;
      expect(engine).toBeLessThanOrEqual(best * 1.0005);
      expect(engine).toBeGreaterThanOrEqual(best * 0.9995);
      if (wb === 14) {
        // This hour's optimum lies inside the band: above the minimum, below full speed.
        expect(r.condensingC).toBeGreaterThan(input.duty.minimumCondensingC + 0.2);
        expect(r.fanKW).toBeLessThan(0.9 * po.fan.designPowerKW);
      }
    });
  }
});

describe("closed-circuit cooler: wet or dry", () => {
  const input = light(fixtureInput("scenario-hourly.json"));
  const ci = input.options.findIndex((o) => o.kind === "closedCircuitCooler");
  const forced = (switchOverDryBulbC: number): ScenarioInput => {
    const s = structuredClone(input);
    const o = s.options[ci];
    if (o?.kind !== "closedCircuitCooler") throw new Error("fixture changed");
    o.cooler.modeSelection = "switchOverDryBulb";
    o.cooler.switchOverDryBulbC = switchOverDryBulbC;
    return s;
  };
  const prepared = prepareScenario(input);
  const dryOnly = prepareScenario(forced(100));
  const wetOnly = prepareScenario(forced(-100));
  const ctx = yearContext(input, prepared);
  const lockout = (input.options[ci] as Extract<ScenarioInput["options"][number], { kind: "closedCircuitCooler" }>).cooler.sprayLockoutDryBulbC;

  // Issue 10 (freeze protection, common practice): the spray never runs below the lock-out dry-bulb.
  it("never sprays below its lock-out dry-bulb", () => {
    const cl = prepared.climate;
    let cold = 0;
    for (let i = 0; i < cl.count; i++) {
      const air = enteringAirAt(cl.air, i);
      if (!air || air.dryBulbC >= lockout) continue;
      cold++;
      const q = ctx.designHeatKW * hourLoadFraction(input.duty.loadProfile, cl.month[i] ?? 1, cl.hour[i] ?? 0, air.dryBulbC);
      const r = evaluateRecord(prepared.options[ci]!, ctx, air, q, 0);
      expect(r.sprayPumpKW).toBe(0);
      expect(r.evaporationKgPerS).toBe(0);
      expect(r.dry).toBe(true);
    }
    expect(cold).toBeGreaterThan(100);
  });

  // Common practice, no source: by lowest total power, each hour's fan + spray + compressor power is the
  // lower of the two modes' (where the dry-bulb allows both).
  it("by lowest total power: each hour runs the cheaper of wet and dry", () => {
    const cl = prepared.climate;
    let both = 0;
    for (let i = 0; i < cl.count; i += 13) {
      const air = enteringAirAt(cl.air, i);
      if (!air || air.dryBulbC < lockout) continue;
      const q = ctx.designHeatKW * hourLoadFraction(input.duty.loadProfile, cl.month[i] ?? 1, cl.hour[i] ?? 0, air.dryBulbC);
      const total = (r: ReturnType<typeof evaluateRecord>) => r.fanKW + r.sprayPumpKW + r.compressorKW;
      const chosen = total(evaluateRecord(prepared.options[ci]!, ctx, air, q, 0));
      const dry = total(evaluateRecord(dryOnly.options[ci]!, ctx, air, q, 0));
      const wet = total(evaluateRecord(wetOnly.options[ci]!, ctx, air, q, 0));
      expect(chosen).toBeCloseTo(Math.min(dry, wet), 9);
      both++;
    }
    expect(both).toBeGreaterThan(300);
  });
});

describe("each option pays its own compressor energy", () => {
  // First law with the design COP: where every hour holds the set-point, W = Qe/COPd and
  // Qrej = Qe·(1 + 1/COPd), so the compressor energy is Σ Qrej/(1 + COPd) over the year.
  it("held everywhere: compressor energy = heat rejected/(1 + COP); unmet hours only add to it", () => {
    const input = light(fixtureInput("scenario-hourly.json"));
    const cop = input.duty.designCop;
    const held = physicsOf(prepareScenario(input), { loadFactor: 0.6 });
    for (const p of held) {
      expect(p.unmetHours).toBe(0);
      expect(Math.abs(p.energyKWh.compressor / (p.heatRejectedKWh / (1 + cop)) - 1)).toBeLessThan(1e-9);
    }
    for (const p of physicsOf(prepareScenario(input))) {
      expect(p.energyKWh.compressor).toBeGreaterThanOrEqual(p.heatRejectedKWh / (1 + cop) - 1e-6);
      if (p.unmetHours > 0) expect(p.energyKWh.compressor).toBeGreaterThan(p.heatRejectedKWh / (1 + cop));
    }
  });

  const bins = analyzeScenario(light(fixtureInput("scenario-bins.json")));
  const by = (k: string) => {
    const p = bins.physics.find((x) => x.kind === k);
    const e = bins.economics.options.find((x) => x.optionId === p?.optionId);
    if (!p || !e) throw new Error(k);
    return { p, e };
  };
  // Physics (issue 10): under floating head the exchanger's approach and the cooler's larger approach raise
  // the condensing temperature, so those options need more compressor energy than the direct tower.
  it("floating head, bin fixture: plate and cooler use more compressor energy than the direct tower", () => {
    const direct = by("openTowerDirect");
    const plate = by("openTowerPlateHx");
    const cooler = by("closedCircuitCooler");
    expect(plate.p.meanCondensingC).toBeGreaterThan(direct.p.meanCondensingC);
    expect(plate.p.energyKWh.compressor).toBeGreaterThan(direct.p.energyKWh.compressor);
    expect(cooler.p.energyKWh.compressor).toBeGreaterThan(direct.p.energyKWh.compressor);
  });

  // NIST Handbook 135: with one flat price and the same escalation every kWh has the same present value,
  // so PV(energy)/kWh is one number for all options: the compressor kWh are priced like any other.
  it("the compressor difference is in the life-cycle cost (one PV per kWh for every option)", () => {
    const ratios = bins.physics.map((p) => {
      const e = bins.economics.options.find((x) => x.optionId === p.optionId);
      return (e?.pvByCategory.energy ?? 0) / p.energyKWh.total;
    });
    for (const r of ratios) expect(r).toBeCloseTo(ratios[0] ?? 0, 9);
    const direct = by("openTowerDirect");
    const cooler = by("closedCircuitCooler");
    const dCompressorPv = (cooler.p.energyKWh.compressor - direct.p.energyKWh.compressor) * (ratios[0] ?? 0);
    expect(dCompressorPv).toBeGreaterThan(0);
    const dEnergyPv = cooler.e.pvByCategory.energy - direct.e.pvByCategory.energy;
    const dOtherPv = (cooler.p.energyKWh.total - cooler.p.energyKWh.compressor - (direct.p.energyKWh.total - direct.p.energyKWh.compressor)) * (ratios[0] ?? 0);
    expect(dEnergyPv).toBeCloseTo(dCompressorPv + dOtherPv, 3);
  });

  it("the clean-reference figure is an explanation: not part of the priced total", () => {
    for (const p of bins.physics) {
      const e = p.energyKWh;
      expect(e.total).toBeCloseTo(e.fan + e.condenserPump + e.secondaryPump + e.sprayPump + e.basinHeater + e.compressor, 6);
      expect(p.compressorAboveCleanReferenceKWh).toBeGreaterThanOrEqual(0);
    }
  });
});

describe("design-day checks", () => {
  const input = light(fixtureInput("scenario-hourly.json"));
  const result = analyzeScenario(input);
  it("each option is checked at the site's 0.4 % wet-bulb of the climate summary", () => {
    const site = result.climateSummary.designWetBulbC.find((d) => d.exceedancePercent === 0.4)?.wetBulbC;
    for (const p of result.physics) {
      expect(p.designDay?.siteWetBulbC).toBe(site);
      expect(p.designDay?.setPointC).toBe(input.duty.condensingSetPointC);
    }
  });

  // Common practice, no source: a tower with half its water flow and half its fan cannot reject the duty
  // at the set-point in the design hour; headline, table and warnings say so.
  it("an undersized option cannot hold the set-point at design, and says so (in IP too)", () => {
    const small = structuredClone(input);
    const o = small.options[0];
    if (!o || o.kind !== "openTowerDirect") throw new Error("fixture changed");
    o.tower.designWetBulbC -= 4;
    o.tower.leavingWaterC -= 4;
    o.tower.enteringWaterC -= 4;
    const r = analyzeScenario(small);
    const p = r.physics[0];
    expect(p?.designDay?.holdsSetPoint).toBe(false);
    expect(p?.designDay?.capacityAtSetPointKW).toBeLessThan(p?.designDay?.dutyKW ?? 0);
    expect(p?.designDay?.condensingC).toBeGreaterThan(input.duty.condensingSetPointC);
    const w = r.warnings.find((x) => x.code === "designDay.cannotHoldSetPoint" && x.optionId === o.id);
    expect(w).toBeDefined();
    expect(r.warnings.some((x) => x.code === "designDay.selectionBelowSiteWetBulb" && x.optionId === o.id)).toBe(true);
    // 35 °C set-point = 95 °F (exact: 35·1.8 + 32).
    if (w) expect(warningText(w, "IP")).toMatch(/95\s°F/);
    expect(designDaySentence(r.physics, "SI")).toContain(o.label.toLowerCase());
  });
});
