/**
 * npm run bench:engine — speed of the engine on a full hourly year with three options.
 *
 * Prints the median CPU time per analysis (physics only, and the full analysis with deterministic
 * economics), the saturated-air enthalpy evaluations per hour and option, and the ratio of the physics
 * time to the time of that many bare primitive evaluations measured in the same run.
 * Scenario: tests/fixtures/scenario-hourly.json (the invented Harrowgate Flats cold store).
 */
import { readFileSync } from "node:fs";
import os from "node:os";
import { resolve } from "node:path";
import { parseEpw } from "@/lib/engine/climate";
import { analyzeScenario, physicsOf, prepareScenario } from "@/lib/engine";
import { computeOptionsPhysics } from "@/lib/engine/annual";
import { pressureFromElevationPa, psychroCounters, saturatedAirEnthalpyKJPerKg } from "@/lib/engine/psychrometrics";
import { parseScenario } from "@/lib/scenarios/schema";

function loadScenario() {
  const path = resolve(__dirname, "../tests/fixtures/scenario-hourly.json");
  const doc = JSON.parse(readFileSync(path, "utf8"));
  const epw = readFileSync(resolve(__dirname, "../tests/fixtures", doc.climate.epwPath), "utf8");
  const parsed = parseEpw(epw, { pressure: "site", sitePressurePa: pressureFromElevationPa(doc.site.elevationM) });
  if (!parsed.ok) throw new Error("EPW fixture does not parse");
  const y = parsed.value.year;
  doc.climate = { source: "hourly", label: doc.climate.label, month: y.month, day: y.day, hour: y.hour, dryBulbC: y.dryBulbC, wetBulbC: y.wetBulbC };
  const r = parseScenario(doc);
  if (!r.ok) throw new Error(r.errors.map((e) => `${e.path}: ${e.message}`).join("\n"));
  return r.value;
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? (s[m] ?? 0) : 0.5 * ((s[m - 1] ?? 0) + (s[m] ?? 0));
}

/**
 * CPU time of this process per run, ms (user + system): on a shared machine the wall-clock time also
 * counts the time other processes held the cores; the CPU time is what one core spends on the analysis.
 */
function time(fn: () => void, runs: number): number[] {
  const out: number[] = [];
  for (let i = 0; i < runs; i++) {
    const c0 = process.cpuUsage();
    fn();
    const c = process.cpuUsage(c0);
    out.push((c.user + c.system) / 1000);
  }
  return out;
}

function wall(fn: () => void, runs: number): number[] {
  const out: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    fn();
    out.push(performance.now() - t0);
  }
  return out;
}

const input = loadScenario();
const light = { ...input, sensitivity: undefined, monteCarlo: undefined };
const hours = input.climate.source === "hourly" ? input.climate.dryBulbC.length : 0;
const options = input.options.length;

// Warm-up (JIT), then count the primitive over one physics run.
for (let i = 0; i < 3; i++) physicsOf(prepareScenario(light));
psychroCounters.saturatedEnthalpyCalls = 0;
physicsOf(prepareScenario(light));
const calls = psychroCounters.saturatedEnthalpyCalls;
// The year loop alone (no cleaning-interval optimum, which adds two sub-sampled years per fouled option).
const bare = prepareScenario(light);
psychroCounters.saturatedEnthalpyCalls = 0;
computeOptionsPhysics(bare.options, bare.climate, light.duty, light.water, light.fouling, bare.pressurePa, {});
const yearCalls = psychroCounters.saturatedEnthalpyCalls;

const runs = 15;
const physicsMs = median(time(() => physicsOf(prepareScenario(light)), runs));
const fullMs = median(time(() => analyzeScenario(light), runs));
const fullWallMs = median(wall(() => analyzeScenario(light), runs));
const prepared = prepareScenario(light);
const rerunMs = median(time(() => physicsOf(prepared, { cyclesOfConcentration: 5 }), runs));

// The same number of bare primitive evaluations over the temperatures the solvers visit.
let sink = 0;
const primitive = (): void => {
  for (let i = 0; i < calls; i++) sink += saturatedAirEnthalpyKJPerKg(-10 + (i % 600) * 0.1, 98_500);
};
for (let i = 0; i < 3; i++) primitive();
const primitiveMs = median(time(primitive, runs));

// The same year under floating head pressure (each hour's fan speed and cooler mode by the fan +
// spray + compressor optimum).
const floating = { ...light, duty: { ...light.duty, headPressureControl: "floating" as const } };
const floatingMs = median(time(() => physicsOf(prepareScenario(floating)), runs));
psychroCounters.saturatedEnthalpyCalls = 0;
physicsOf(prepareScenario(floating));
const floatingCalls = psychroCounters.saturatedEnthalpyCalls;

const c0 = process.cpuUsage();
analyzeScenario(input);
const c1 = process.cpuUsage(c0);
const withSensitivityMs = (c1.user + c1.system) / 1000;

const perHourOption = calls / (hours * options);
const lines = [
  `LoopLedger engine benchmark — ${hours} h × ${options} options (tests/fixtures/scenario-hourly.json), median of ${runs}, CPU time`,
  `physics only (climate + calibration + year):     ${physicsMs.toFixed(1)} ms`,
  `physics re-run on a prepared scenario (what-if):  ${rerunMs.toFixed(1)} ms`,
  `physics only, floating head pressure:            ${floatingMs.toFixed(1)} ms (${(floatingCalls / (hours * options)).toFixed(2)} saturated-enthalpy evaluations per hour and option)`,
  `full analysis, deterministic economics:          ${fullMs.toFixed(1)} ms (wall clock ${fullWallMs.toFixed(1)} ms, load average ${os.loadavg()[0]?.toFixed(1)})`,
  `full analysis with the fixture's sensitivity and Monte Carlo (${input.monteCarlo?.draws ?? 0} draws), once: ${withSensitivityMs.toFixed(0)} ms`,
  `saturated-enthalpy evaluations per physics run:  ${calls} = ${perHourOption.toFixed(2)} per hour and option`,
  `  of which the year loop alone: ${(yearCalls / (hours * options)).toFixed(2)} per hour and option (the rest: the`,
  `  cleaning-interval optimum's two sub-sampled years per fouled option, the climate and the saturation table)`,
  `time of ${calls} bare evaluations:               ${primitiveMs.toFixed(2)} ms`,
  `ratio physics time / primitive time:             ${(physicsMs / primitiveMs).toFixed(1)}`,
];
process.stdout.write(`${lines.join("\n")}\n`);
if (sink === 42) process.stdout.write("\n");
