/**
 * Rating points through the scenario schema and the annual run: the tower characteristic and the cooler's
 * resistance split are fitted to rating points generated here by independent models (this folder's own
 * Merkel integration, merkel-reference.ts, and a counterflow ε-NTU cooler written below), and the fit is
 * read back from the analysis result.
 */
import { describe, expect, it } from "vitest";
import { analyzeScenario } from "@/lib/engine";
import { buildAssumptions } from "@/lib/reports/assumptions";
import { defaultScenario, parseScenario, type ScenarioDraft } from "@/lib/scenarios/schema";
import type { ClimateInput } from "@/lib/engine/climate/types";
import { F, coldWater, hs } from "./merkel-reference";

// A small wet-bulb bin climate (invented): the fit does not depend on it, the annual run only has to run.
const climate: ClimateInput = {
  source: "wetBulbBins",
  label: "test bins",
  bins: [
    { wetBulbC: 5, meanCoincidentDryBulbC: 8, hours: 3000 },
    { wetBulbC: 15, meanCoincidentDryBulbC: 20, hours: 3760 },
    { wetBulbC: 24, meanCoincidentDryBulbC: 30, hours: 2000 },
  ],
};

function draft(): ScenarioDraft {
  const d = defaultScenario(climate, { elevationM: 0, locationLabel: "Test site" });
  d.options = d.options.map((o) => ({ ...o, costs: { firstCost: { equipment: 100000 } } })) as ScenarioDraft["options"];
  return d;
}

function analyse(doc: unknown) {
  const parsed = parseScenario(doc);
  if (!parsed.ok) throw new Error(parsed.errors.map((e) => `${e.path}: ${e.message}`).join("\n"));
  return analyzeScenario(parsed.value);
}

// Issue 11's check: 95/85/78 °F design (range 10 °F, wet-bulb 78 °F) at L/G 1.2 with C = 1.3241, n = 0.6.
const C = 1.3241;
const N = 0.6;
const WB = F(78);
const RANGE = F(95) - F(85);
const FLOW = 50; // kg/s
const FAN_KW = 15;
const DESIGN_LG = 1.2;

function towerDoc(lgs: number[], as: ("airflow" | "fanPower" | "none")[]) {
  const d = draft();
  const cold = coldWater(C, N, DESIGN_LG, RANGE, WB);
  const o = d.options[0]!;
  if (o.kind !== "openTowerDirect") throw new Error("the starter's first option is the direct tower");
  o.fan = { designPowerKW: FAN_KW };
  o.condenser = { designCondensingC: cold + RANGE + 8 };
  o.tower = {
    waterFlowKgPerS: FLOW,
    enteringWaterC: cold + RANGE,
    leavingWaterC: cold,
    designWetBulbC: WB,
    designLiquidToGasRatio: DESIGN_LG,
    ratingPoints: lgs.map((lg, i) => {
      const c = coldWater(C, N, lg, RANGE, WB);
      const base = { waterFlowKgPerS: FLOW, enteringWaterC: c + RANGE, leavingWaterC: c, wetBulbC: WB };
      // Same water flow: airflow = L/(L/G); by the fan laws P = Pd·(G/Gd)³ = Pd·((L/G)d/(L/G))³.
      if (as[i] === "airflow") return { ...base, airFlowKgPerS: FLOW / lg };
      if (as[i] === "fanPower") return { ...base, fanPowerKW: FAN_KW * Math.pow(DESIGN_LG / lg, 3) };
      return base;
    }),
  };
  d.duty.designHeatRejectionKW = FLOW * 4.18 * RANGE;
  return d;
}

describe("tower rating points through the schema and the annual run", () => {
  it("three points from C = 1.3241, n = 0.6 (95/85/78 °F, L/G 1.2): C and n fitted back within 0.5 %, residuals below 0.05 K", () => {
    const r = analyse(towerDoc([0.9, 1.2, 1.5], ["airflow", "none", "fanPower"]));
    const fit = r.physics[0]!.ratingFit!;
    expect(fit.device).toBe("tower");
    expect(fit.method).toBe("fitted");
    expect(Math.abs(fit.coefficientC! / C - 1)).toBeLessThan(0.005);
    expect(Math.abs(fit.exponentN! / N - 1)).toBeLessThan(0.005);
    const ratings = fit.points.filter((p) => p.label.startsWith("rating"));
    expect(ratings).toHaveLength(3);
    for (const p of ratings) expect(Math.abs(p.residualK!)).toBeLessThan(0.05);
    // The design point lies on the generating characteristic too.
    expect(Math.abs(fit.points.find((p) => p.label === "design")!.residualK!)).toBeLessThan(0.05);
    expect(fit.note).toMatch(/fitted to 3 rating points/);
    // The report's assumptions carry the fit and each point's residual, in the viewer's units.
    const parsed = parseScenario(towerDoc([0.9, 1.2, 1.5], ["airflow", "none", "fanPower"]));
    const group = buildAssumptions(parsed.ok ? parsed.value : {}, r, "IP", "USD").find((g) => g.title === "Rating points: Open tower, direct")!;
    expect(group.rows.find((row) => row.label === "Characteristic exponent n")!.source).toBe("fitted");
    expect(group.rows.filter((row) => /^Rating \d: leaving/.test(row.label))).toHaveLength(3);
    expect(group.rows.find((row) => row.label.startsWith("Rating 1"))!.unit).toBe("°F");
  });

  it("one point: n = 0.6 default, and the result says so", () => {
    const r = analyse(towerDoc([1.0], ["airflow"]));
    const fit = r.physics[0]!.ratingFit!;
    expect(fit.method).toBe("defaultExponent");
    expect(fit.exponentN).toBe(0.6);
    expect(fit.note).toContain("n = 0.6 default, one rating point");
  });

  it("points at nearly the same L/G: the fit is ill-conditioned, warned, and the default n is kept", () => {
    const r = analyse(towerDoc([1.2, 1.25], ["airflow", "airflow"]));
    const fit = r.physics[0]!.ratingFit!;
    expect(fit.method).toBe("defaultExponent");
    expect(fit.exponentN).toBe(0.6);
    expect(r.physics[0]!.warnings.some((w) => w.code === "tower.ratingFitIllConditioned")).toBe(true);
  });

  it("a document saved before rating points (no ratingPoints, no wetRatings) parses and analyses as before", () => {
    const d = draft();
    const parsed = parseScenario(JSON.parse(JSON.stringify(d)));
    expect(parsed.ok).toBe(true);
    const r = analyse(d);
    expect(r.physics[0]!.ratingFit!.method).toBe("designPoint");
    expect(r.physics[2]!.ratingFit!.method).toBe("defaultSplit");
  });

  it("refuses more than five points and names the field", () => {
    const parsed = parseScenario(towerDoc([0.8, 0.9, 1, 1.1, 1.2, 1.3], ["airflow", "airflow", "airflow", "airflow", "airflow", "airflow"]));
    expect(parsed.ok).toBe(false);
    if (!parsed.ok) expect(parsed.errors.some((e) => e.path === "options.0.tower.ratingPoints")).toBe(true);
  });
});

// --- the cooler ----------------------------------------------------------------------------------------
// Independent generator: counterflow ε-NTU [pub: Incropera & DeWitt, Fundamentals of Heat and Mass
// Transfer, Table 11.3, counterflow ε = (1 − e^(−NTU(1−Cr)))/(1 − Cr·e^(−NTU(1−Cr)))] on the air capacity
// ṁa·cs with cs the chord slope of saturated-air enthalpy (Jaber & Webb 1989), this folder's own hs; the
// overall resistance is R_int·(ṁd/ṁ)^0.8 + R_ext·(ṁa,d/ṁa)^0.8·(cs,d/cs) with a chosen split.
const CPW = 4.18; // kJ/(kg·K) water near 30 °C [memory]
const CP_DRY = 1.006 + 1.86 * 0.005; // moist-air cp at W ≈ 0.005 [pub: ASHRAE Fundamentals ch.1, cp,a + W·cp,v]
function epsCounterflow(ntu: number, cr: number): number {
  if (Math.abs(1 - cr) < 1e-9) return ntu / (1 + ntu);
  const e = Math.exp(-ntu * (1 - cr));
  return (1 - e) / (1 - cr * e);
}
const csChord = (meanC: number, wbC: number) => (hs(meanC) - hs(wbC)) / (meanC - wbC);

const SPLIT = 0.35; // chosen tube-side share of the design wet resistance
const UA_D = 140; // kW/K overall wet conductance at the design rating
const M_D = 40; // kg/s process water
const MA_D = 40; // kg/s air (fluid-to-air ratio 1)
const DRY_FACTOR = 0.6;

/** Leaving fluid of the generating cooler, wet, °C (fixed point on cs). */
function genWet(m: number, ma: number, tin: number, wb: number, csD: number): number {
  const rInt = SPLIT / UA_D;
  const rExt = (1 - SPLIT) / UA_D;
  let tout = tin - 5;
  for (let k = 0; k < 200; k++) {
    const cs = csChord(0.5 * (tin + tout), wb);
    const ua = 1 / (rInt * Math.pow(M_D / m, 0.8) + rExt * Math.pow(MA_D / ma, 0.8) * (csD / cs));
    const ca = ma * cs;
    const cf = m * CPW;
    const cmin = Math.min(ca, cf);
    const q = epsCounterflow(ua / cmin, cmin / Math.max(ca, cf)) * cmin * (tin - wb);
    tout = 0.5 * tout + 0.5 * (tin - q / cf);
  }
  return tout;
}

describe("cooler ratings through the schema and the annual run", () => {
  // Design rating 35 °C in at 24 °C wet-bulb: cs,d depends on the design's own leaving fluid (fixed point).
  const tinD = 35;
  const wbD = 24;
  let csD = csChord(32, wbD);
  let toutD = 30;
  for (let k = 0; k < 50; k++) {
    toutD = genWet(M_D, MA_D, tinD, wbD, csD);
    csD = csChord(0.5 * (tinD + toutD), wbD);
  }
  const extras = [
    { fluidFlowKgPerS: 0.6 * M_D, enteringFluidC: 35, wetBulbC: 24 },
    { fluidFlowKgPerS: M_D, enteringFluidC: 30, wetBulbC: 16 },
    { fluidFlowKgPerS: M_D, enteringFluidC: 33, wetBulbC: 22, airFlowKgPerS: 0.6 * MA_D },
  ].map((e) => ({ ...e, leavingFluidC: genWet(e.fluidFlowKgPerS, e.airFlowKgPerS ?? MA_D, e.enteringFluidC, e.wetBulbC, csD) }));
  // Dry rating: UA_ext,dry = factor·(1/R_ext)/cs,d·cp (Lewis analogy), in series with R_int.
  const dryIn = 35;
  const dryDb = 10;
  const uaDry = 1 / (SPLIT / UA_D + 1 / ((DRY_FACTOR * (UA_D / (1 - SPLIT))) / csD * CP_DRY));
  const caDry = MA_D * CP_DRY;
  const cf = M_D * CPW;
  const cminDry = Math.min(caDry, cf);
  const qDry = epsCounterflow(uaDry / cminDry, cminDry / Math.max(caDry, cf)) * cminDry * (dryIn - dryDb);
  const dryOut = dryIn - qDry / cf;

  function coolerDoc(wetRatings: typeof extras) {
    const d = draft();
    const o = d.options[2]!;
    if (o.kind !== "closedCircuitCooler") throw new Error("the starter's third option is the cooler");
    o.cooler = {
      fluidFlowKgPerS: M_D,
      enteringFluidC: tinD,
      leavingFluidC: toutD,
      designWetBulbC: wbD,
      designFluidToAirRatio: M_D / MA_D,
      dryRating: { enteringFluidC: dryIn, leavingFluidC: dryOut, dryBulbC: dryDb },
      wetRatings,
    };
    o.condenser = { designCondensingC: tinD + 6 };
    return d;
  }

  it("a 35 % tube-side share is fitted back from three extra wet ratings within 2 %, the dry factor 0.6 within 3 %, residuals below 0.05 K", () => {
    const r = analyse(coolerDoc(extras));
    const fit = r.physics[2]!.ratingFit!;
    expect(fit.device).toBe("cooler");
    expect(fit.method).toBe("fitted");
    console.log(`[cooler fit] share ${fit.internalResistanceFraction!.toFixed(4)} (${SPLIT}), dry factor ${fit.dryExternalConductanceFactor!.toFixed(4)} (${DRY_FACTOR})`);
    expect(Math.abs(fit.internalResistanceFraction! / SPLIT - 1)).toBeLessThan(0.02);
    expect(Math.abs(fit.dryExternalConductanceFactor! / DRY_FACTOR - 1)).toBeLessThan(0.03);
    expect(fit.points.map((p) => p.label)).toEqual(["design", "wet rating 2", "wet rating 3", "wet rating 4", "dry"]);
    for (const p of fit.points) expect(Math.abs(p.residualK!)).toBeLessThan(0.05);
  });

  it("a second rating at the design's own conditions cannot tell the split: the entered share is kept and said so", () => {
    const same = [{ fluidFlowKgPerS: M_D, enteringFluidC: tinD, leavingFluidC: toutD, wetBulbC: wbD }];
    const r = analyse(coolerDoc(same));
    const fit = r.physics[2]!.ratingFit!;
    expect(fit.method).toBe("defaultSplit");
    expect(fit.internalResistanceFraction).toBe(0.3);
    expect(r.physics[2]!.warnings.some((w) => w.code === "cooler.ratingFitIllConditioned")).toBe(true);
  });

  it("without extra ratings the default split is used and the note says so", () => {
    const r = analyse(coolerDoc([]));
    const fit = r.physics[2]!.ratingFit!;
    expect(fit.method).toBe("defaultSplit");
    expect(fit.note).toMatch(/no second wet rating/);
  });
});

