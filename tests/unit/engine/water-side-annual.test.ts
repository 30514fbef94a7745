import { describe, expect, it, vi } from "vitest";
import { physicsOf, prepareScenario } from "@/lib/engine";
import { parseScenario } from "@/lib/scenarios/schema";
import { readFixture } from "./helpers";

vi.setConfig({ testTimeout: 60_000 });

/**
 * The bin fixture on a two-bin year without months: a summer bin at full load and a cold bin in which
 * the plant is idle, so every quantity below can be worked by hand from the inputs.
 */
function twoBinScenario(edit: (doc: Record<string, unknown>) => void = () => {}) {
  const doc = readFixture("scenario-bins.json") as Record<string, unknown> & {
    climate: Record<string, unknown>;
    duty: Record<string, unknown>;
    options: Record<string, unknown>[];
    water: Record<string, unknown>;
  };
  doc.climate = {
    source: "wetBulbBins",
    label: "two bins",
    bins: [
      { wetBulbC: 22, meanCoincidentDryBulbC: 28, hours: 4000 },
      { wetBulbC: -4, meanCoincidentDryBulbC: -3, hours: 4760 },
    ],
  };
  doc.duty.loadProfile = { kind: "perBin", fractions: [1, 0] };
  for (const o of doc.options) o.basinHeater = { powerKW: 8, setPointC: 4.4 };
  edit(doc);
  const r = parseScenario(doc);
  if (!r.ok) throw new Error(r.errors.map((e) => `${e.path}: ${e.message}`).join("\n"));
  return { input: r.value, physics: physicsOf(prepareScenario(r.value)) };
}

const M3_PER_KG = 1 / 998.2;

describe("water side over a year, against hand numbers", () => {
  // Basin heater (Methods §2): the idle bin holds still water at −3 °C; default heat loss
  // 8 kW/(4.4 + 17.8) K = 0.36036 kW/K; need 0.36036 × (4.4 + 3) = 2.6667 kW < 8 kW rating;
  // 4760 h × 2.6667 kW = 12,693 kWh. The running summer bin wets the basin with warm water: no heat.
  it("the basin heater supplies the basin's loss below its set-point in idle hours only", () => {
    const { physics } = twoBinScenario();
    for (const p of physics) expect(p.energyKWh.basinHeater).toBeCloseTo(4760 * (8 / 22.2) * 7.4, 3);
    const drained = twoBinScenario((d) => {
      for (const o of d.options as Record<string, unknown>[]) o.basinHeater = { powerKW: 8, setPointC: 4.4, drainedWhenIdle: true };
    });
    for (const p of drained.physics) expect(p.energyKWh.basinHeater).toBe(0);
    // A heater too small for the loss runs at its rating: 1 kW × 4760 h (loss entered as 0.5 kW/K → 3.7 kW needed).
    const small = twoBinScenario((d) => {
      for (const o of d.options as Record<string, unknown>[]) o.basinHeater = { powerKW: 1, setPointC: 4.4, heatLossKWPerK: 0.5 };
    });
    for (const p of small.physics) expect(p.energyKWh.basinHeater).toBeCloseTo(4760, 6);
  });

  // Standard mass balance with hand numbers: drift D = 0.005 % × tower flow × 4000 h (the fixture's
  // tower flow, kg/s → m³ at 998.2 kg/m³); B = E/(C − 1) − D at the entered 5 cycles; M = E + B + D;
  // metered-blowdown sewer bills B only. E comes from the engine's air-side balance (tested in air-side.test.ts).
  it("closes M − E − B − D = 0 with hand-computed drift, blowdown and a blowdown-metered sewer", () => {
    const { input, physics } = twoBinScenario((d) => {
      (d.water as Record<string, unknown>).sewerBasis = "blowdown";
    });
    const direct = input.options[0];
    const p = physics[0];
    if (!direct || direct.kind !== "openTowerDirect" || !p) throw new Error("fixture");
    const driftHand = 0.00005 * direct.tower.waterFlowKgPerS * 3600 * 4000 * M3_PER_KG;
    const w = p.waterM3;
    expect(w.drift / driftHand).toBeCloseTo(1, 9);
    const blowdownHand = w.evaporation / (5 - 1) - driftHand;
    expect(w.blowdown / blowdownHand).toBeCloseTo(1, 9);
    expect(w.makeup / (w.evaporation + blowdownHand + driftHand)).toBeCloseTo(1, 12);
    expect(w.sewerBilled / blowdownHand).toBeCloseTo(1, 9);
    expect(p.sewerBasis).toBe("blowdown");
  });

  // Cycles per wet loop (Methods §4): the cooler's spray loop entered at 3 cycles while the towers run the
  // scenario's 5; standard mass balance M = E·C/(C − 1) whenever B > 0.
  it("a cooler's spray loop runs its own, lower cycles", () => {
    const { physics } = twoBinScenario((d) => {
      const cooler = (d.options as Record<string, unknown>[]).find((o) => o.kind === "closedCircuitCooler");
      if (cooler) cooler.cyclesOfConcentration = 3;
    });
    const tower = physics[0];
    const cooler = physics.find((p) => p.kind === "closedCircuitCooler");
    if (!tower || !cooler) throw new Error("fixture");
    expect(cooler.waterM3.makeup / ((cooler.waterM3.evaporation * 3) / 2)).toBeCloseTo(1, 9);
    expect(tower.waterM3.makeup / ((tower.waterM3.evaporation * 5) / 4)).toBeCloseTo(1, 9);
    expect(cooler.targetCyclesOfConcentration).toBe(3);
    expect(tower.scenarioCyclesOfConcentration).toBe(5);
  });

  // LSI at the cycles achieved (Methods §4): with a drift of 1 % of the flow, drift exceeds the blowdown
  // the 5 cycles need, B = 0 and the loop achieves C = (E + D)/D. The index is the Langelier A–D form at
  // that C (hand formula below) and the hottest wetted surface, not at the target 5.
  it("reports the Langelier and Ryznar indices at the cycles actually achieved", () => {
    const { input, physics } = twoBinScenario((d) => {
      for (const o of d.options as Record<string, unknown>[]) o.driftFractionOfFlow = 0.01;
    });
    const p = physics[0];
    const chem = p?.waterChemistry;
    if (!p || !chem) throw new Error("fixture");
    const w = p.waterM3;
    expect(w.blowdown).toBe(0);
    const achieved = (w.evaporation + w.drift) / w.drift;
    expect(achieved).toBeLessThan(5);
    expect(chem.atCycles).toBeCloseTo(achieved, 9);
    const m = input.water.makeup;
    const t = chem.hottestWettedSurfaceC;
    const pHs =
      9.3 +
      (Math.log10(m.tdsMgPerL * achieved) - 1) / 10 -
      13.12 * Math.log10(t + 273.15) +
      34.55 -
      (Math.log10(m.calciumHardnessMgPerLAsCaCO3 * achieved) - 0.4) -
      Math.log10(m.mAlkalinityMgPerLAsCaCO3 * achieved);
    expect(chem.langelierIndex).toBeCloseTo(input.water.recirculatingPh - pHs, 9);
    expect(chem.ryznarIndex).toBeCloseTo(2 * pHs - input.water.recirculatingPh, 9);
  });
});
