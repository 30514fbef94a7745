/**
 * npm run bench:engine — speed of the engine on a full hourly year and on its compressed climate.
 *
 * Prints, for the hourly fixture with three options and with a fourth option added (a second
 * closed-circuit cooler with two-speed fans), each also under floating head pressure (the hour's control
 * optimum), at full resolution (8760 h) and on the compressed climate:
 *  - the median CPU time per analysis: physics (climate + calibration + year + cleaning optimum) and the
 *    full analysis with deterministic economics;
 *  - saturated-air enthalpy evaluations per hour and option over the whole physics run (cleaning optimum
 *    included), and how many of them evaluated the formula itself (exp/log) rather than its table: every
 *    call of the primitive during one fresh analysis (prepareScenario + physicsOf) divided by hours × options;
 *    the climate's entering-air states, computed once per analysis and read by every option, count once in
 *    the total (1/options per option); the per-pressure tables, built once per process, do not recur;
 *  - the ratio of the physics time to the bare cost of that many evaluations of the primitive — the full
 *    formula (one exp, one log) and its per-pressure table — measured in the same run, in interleaved rounds
 *    (one physics run, then the bare evaluations), the median of the per-round ratios;
 *  - the what-if physics re-run (physical overrides on the compressed climate, applied to the stored hourly
 *    result, and its economics);
 *  - Monte Carlo draws per second with physics per draw (load, climate shift, fouling, cycles and prices),
 *    and the CPU time 10,000 draws take; the same per-draw physics at full resolution for comparison.
 * Scenario: tests/fixtures/scenario-hourly.json (the invented Harrowgate Flats cold store).
 */
import { readFileSync } from "node:fs";
import os from "node:os";
import { resolve } from "node:path";
import { parseEpw } from "@/lib/engine/climate";
import { analyzeScenario, physicsOf, prepareScenario, type PhysicsOverrides, type ScenarioInput } from "@/lib/engine";
import { analyzeEconomics } from "@/lib/engine/economics";
import {
  pressureFromElevationPa,
  psychroCounters,
  saturatedAirEnthalpyExactKJPerKg,
  saturatedAirEnthalpyKJPerKg,
} from "@/lib/engine/psychrometrics";
import { physicsNear } from "@/lib/engine/what-if";
import { parseScenario } from "@/lib/scenarios/schema";

function loadScenario(): ScenarioInput {
  const path = resolve(__dirname, "../tests/fixtures/scenario-hourly.json");
  const doc = JSON.parse(readFileSync(path, "utf8"));
  const epw = readFileSync(resolve(__dirname, "../tests/fixtures", doc.climate.epwPath), "utf8");
  const parsed = parseEpw(epw, { pressure: "site", sitePressurePa: pressureFromElevationPa(doc.site.elevationM) });
  if (!parsed.ok) throw new Error("EPW fixture does not parse");
  const y = parsed.value.year;
  doc.climate = { source: "hourly", label: doc.climate.label, month: y.month, day: y.day, hour: y.hour, dryBulbC: y.dryBulbC, wetBulbC: y.wetBulbC };
  const r = parseScenario(doc);
  if (!r.ok) throw new Error(r.errors.map((e) => `${e.path}: ${e.message}`).join("\n"));
  return { ...r.value, sensitivity: undefined, monteCarlo: undefined };
}

/** The fixture with a fourth option: a second closed-circuit cooler, two-speed fans. */
function withFourthOption(input: ScenarioInput): ScenarioInput {
  const cooler = input.options.find((o) => o.kind === "closedCircuitCooler");
  if (!cooler) throw new Error("fixture has no cooler");
  const fourth = { ...structuredClone(cooler), id: "cooler-two-speed", label: "Closed-circuit cooler, two-speed fans" };
  fourth.fan = { ...fourth.fan, control: "twoSpeed" };
  return { ...input, options: [...input.options, fourth] };
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? (s[m] ?? 0) : 0.5 * ((s[m - 1] ?? 0) + (s[m] ?? 0));
}

/**
 * CPU time of this process per run, ms (user + system): on a shared machine the wall-clock time also
 * counts the time other processes held the cores; the CPU time is what one core spends on the work.
 */
function cpu(fn: () => void, runs: number): number {
  const out: number[] = [];
  for (let i = 0; i < runs; i++) {
    const c0 = process.cpuUsage();
    fn();
    const c = process.cpuUsage(c0);
    out.push((c.user + c.system) / 1000);
  }
  return median(out);
}

let sink = 0;
/** CPU time of one pass of `calls` evaluations of a primitive over the temperatures the solvers visit, ms. */
function primitiveOnce(calls: number, f: (tC: number, pPa: number) => number, pPa: number): number {
  return cpu(() => {
    for (let i = 0; i < calls; i++) sink += f(-10 + (i % 600) * 0.1, pPa);
  }, 1);
}

function economicsOf(input: ScenarioInput, physics: ReturnType<typeof physicsOf>) {
  return analyzeEconomics({
    physics,
    options: input.options.map((o) => ({ optionId: o.id, kind: o.kind, label: o.label, costs: o.costs })),
    tariffs: input.tariffs,
    upkeep: input.upkeep,
    economics: input.economics,
  });
}

const RUNS = 9;
const ROUNDS = 21;
const lines: string[] = [];
const out = (s: string) => lines.push(s);

function benchPhysics(input: ScenarioInput, label: string) {
  const p = prepareScenario(input);
  const pPa = p.pressurePa;
  const hours = p.year.kind === "hourly" ? p.year.dryBulbC.length : 8760;
  const nOpt = input.options.length;
  out(`\n${label}: ${nOpt} options`);
  for (const resolution of ["full", "compressed"] as const) {
    const fresh = () => {
      const q = prepareScenario(input);
      physicsOf(q, {}, resolution);
      return q;
    };
    for (let i = 0; i < 3; i++) fresh();
    psychroCounters.saturatedEnthalpyCalls = 0;
    psychroCounters.exactSaturatedEnthalpyCalls = 0;
    const q = fresh();
    const calls = psychroCounters.saturatedEnthalpyCalls;
    const exact = psychroCounters.exactSaturatedEnthalpyCalls;
    const records = resolution === "full" ? hours : (q.compression?.count ?? hours);
    // Interleaved rounds: each round times one physics run and, right after it, the bare evaluations, so
    // that a change of the machine's speed during the run (a shared host) moves both sides of a ratio alike;
    // the ratios are the medians of the per-round ratios.
    const physicsRuns: number[] = [];
    const exactRuns: number[] = [];
    const tableRuns: number[] = [];
    const exactRatios: number[] = [];
    const tableRatios: number[] = [];
    primitiveOnce(calls, saturatedAirEnthalpyExactKJPerKg, pPa);
    primitiveOnce(calls, saturatedAirEnthalpyKJPerKg, pPa);
    for (let round = 0; round < ROUNDS; round++) {
      const ph = cpu(() => physicsOf(prepareScenario(input), {}, resolution), 1);
      const ex = primitiveOnce(calls, saturatedAirEnthalpyExactKJPerKg, pPa);
      const tb = primitiveOnce(calls, saturatedAirEnthalpyKJPerKg, pPa);
      physicsRuns.push(ph);
      exactRuns.push(ex);
      tableRuns.push(tb);
      exactRatios.push(ph / ex);
      tableRatios.push(ph / tb);
    }
    const physicsMs = median(physicsRuns);
    const exactMs = median(exactRuns);
    const tableMs = median(tableRuns);
    const fullMs = cpu(() => economicsOf(input, physicsOf(prepareScenario(input), {}, resolution)), RUNS);
    const perRecord = calls / (records * nOpt);
    out(
      `  ${resolution === "full" ? `full year (${hours} h)` : `compressed (${records} records)`}: physics ${physicsMs.toFixed(1)} ms, analysis with economics ${fullMs.toFixed(1)} ms CPU`,
    );
    out(
      `    saturated-enthalpy evaluations: ${calls} = ${perRecord.toFixed(2)} per ${resolution === "full" ? "hour" : "record"} and option (${exact} of them the full formula: table building and temperatures outside it)`,
    );
    out(
      `    ratio physics / bare evaluations: ${median(exactRatios).toFixed(2)} against the formula (${exactMs.toFixed(2)} ms for ${calls}), ${median(tableRatios).toFixed(2)} against the table (${tableMs.toFixed(2)} ms); median of ${ROUNDS} interleaved rounds`,
    );
  }
}

function benchWhatIfAndMonteCarlo(input: ScenarioInput) {
  const p = prepareScenario(input);
  const full = physicsOf(p);
  let k = 0;
  const slider = (): PhysicsOverrides => {
    k++;
    return { loadFactor: 0.8 + 0.04 * (k % 10), climateShiftK: 0.5 * (k % 5) };
  };
  for (let i = 0; i < 5; i++) economicsOf(input, physicsNear(p, full, slider()));
  const whatIfMs = cpu(() => economicsOf(input, physicsNear(p, full, slider())), 21);
  const whatIfFullMs = cpu(() => economicsOf(input, physicsOf(p, slider(), "full", false)), 5);
  out(`\nwhat-if with physical inputs (load and climate shift moved; physics + economics), ${input.options.length} options:`);
  out(`  compressed climate applied to the stored hourly result: ${whatIfMs.toFixed(1)} ms CPU per slider move`);
  out(`  full hourly re-run instead:                          ${whatIfFullMs.toFixed(1)} ms CPU per slider move`);

  const distributions = {
    waterPriceFactor: { type: "triangular" as const, min: 0.8, mode: 1, max: 1.5 },
    electricityPriceFactor: { type: "triangular" as const, min: 0.85, mode: 1, max: 1.3 },
    energyEscalationDelta: { type: "triangular" as const, min: -0.01, mode: 0, max: 0.02 },
    firstCostFactor: { type: "triangular" as const, min: 0.9, mode: 1, max: 1.25 },
    cyclesOfConcentration: { type: "triangular" as const, min: 3, mode: 4, max: 6 },
    loadFactor: { type: "triangular" as const, min: 0.85, mode: 1, max: 1.15 },
    climateShiftK: { type: "triangular" as const, min: 0, mode: 0.5, max: 2 },
    foulingRateFactor: { type: "triangular" as const, min: 0.5, mode: 1, max: 2 },
  };
  const draws = 1000;
  const mcInput: ScenarioInput = { ...input, monteCarlo: { enabled: true, draws, seed: 20260101, histogramBins: 30, distributions } };
  analyzeScenario({ ...mcInput, monteCarlo: { ...mcInput.monteCarlo!, draws: 50 } });
  const base = cpu(() => analyzeScenario(input), 3);
  const c0 = process.cpuUsage();
  const r = analyzeScenario(mcInput);
  const c = process.cpuUsage(c0);
  const mcMs = (c.user + c.system) / 1000 - base;
  const perSecond = draws / (mcMs / 1000);
  out(`\nMonte Carlo with physics per draw (load, climate shift, fouling on the compressed climate; cycles, prices, escalation, first cost), ${input.options.length} options:`);
  out(`  ${draws} draws: ${mcMs.toFixed(0)} ms CPU → ${perSecond.toFixed(0)} draws/s; 10,000 draws ≈ ${(10_000 / perSecond).toFixed(1)} s CPU (${r.economics.monteCarlo?.physicsReruns ?? 0} physics re-runs)`);
  const fullDraw = cpu(() => economicsOf(input, physicsOf(p, slider(), "full", false)), 3);
  out(`  the same per-draw physics at full resolution: ${(1000 / fullDraw).toFixed(1)} draws/s; 10,000 draws ≈ ${((10_000 * fullDraw) / 1000).toFixed(0)} s CPU`);
}

const input = loadScenario();
out(`LoopLedger engine benchmark — tests/fixtures/scenario-hourly.json, CPU time (median), node ${process.version}, load average ${os.loadavg()[0]?.toFixed(1)}`);
benchPhysics(input, "Hourly fixture");
benchPhysics({ ...input, duty: { ...input.duty, headPressureControl: "floating" } }, "Hourly fixture, floating head pressure (each hour's fan + spray + compressor optimum)");
const four = withFourthOption(input);
benchPhysics(four, "Hourly fixture + a fourth option");
benchPhysics({ ...four, duty: { ...four.duty, headPressureControl: "floating" } }, "Hourly fixture + a fourth option, floating head pressure (each hour's fan + spray + compressor optimum)");
benchWhatIfAndMonteCarlo(four);
process.stdout.write(`${lines.join("\n")}\n`);
if (sink === 42) process.stdout.write("\n");
