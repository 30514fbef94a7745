/**
 * npm run figures — each option's life-cycle cost and yearly energy on the demo scenario and on the two
 * test fixtures (tests/fixtures/scenario-bins.json, scenario-hourly.json). Prints one table per scenario;
 * used to report how an engine change moves the answer (before/after).
 */
import { readFileSync } from "node:fs";
import { resolve } from "node:path";
import { parseEpw } from "@/lib/engine/climate";
import { analyzeScenario, type ScenarioInput } from "@/lib/engine";
import { pressureFromElevationPa } from "@/lib/engine/psychrometrics";
import { parseScenario } from "@/lib/scenarios/schema";
import { demoEngineInput } from "./support/demo-input";

function fixture(name: string): ScenarioInput {
  const dir = resolve(__dirname, "../tests/fixtures");
  const doc = JSON.parse(readFileSync(resolve(dir, name), "utf8"));
  if (doc.climate?.epwPath) {
    const parsed = parseEpw(readFileSync(resolve(dir, doc.climate.epwPath), "utf8"), {
      pressure: "site",
      sitePressurePa: pressureFromElevationPa(doc.site.elevationM),
    });
    if (!parsed.ok) throw new Error("EPW fixture does not parse");
    const y = parsed.value.year;
    doc.climate = { source: "hourly", label: doc.climate.label, month: y.month, day: y.day, hour: y.hour, dryBulbC: y.dryBulbC, wetBulbC: y.wetBulbC };
  }
  const r = parseScenario(doc);
  if (!r.ok) throw new Error(r.errors.map((e) => `${e.path}: ${e.message}`).join("\n"));
  return r.value;
}

const demo = demoEngineInput;

const cases: [string, () => ScenarioInput][] = [
  ["demo", demo],
  ["scenario-bins.json", () => fixture("scenario-bins.json")],
  ["scenario-hourly.json", () => fixture("scenario-hourly.json")],
];
for (const [name, load] of cases) {
  const input = load();
  const result = analyzeScenario({ ...input, sensitivity: undefined, monteCarlo: undefined });
  process.stdout.write(`\n${name} (${input.duty.headPressureControl}, compressor model ${input.duty.compressorModel.kind})\n`);
  for (const p of result.physics) {
    const e = result.economics.options.find((o) => o.optionId === p.optionId);
    const en = p.energyKWh as unknown as Record<string, number>;
    const parts = Object.entries(en)
      .map(([k, v]) => `${k} ${Math.round(v)}`)
      .join(", ");
    process.stdout.write(
      `  ${p.optionId.padEnd(16)} LCC ${Math.round(e?.lcc ?? Number.NaN).toLocaleString("en-US").padStart(12)}  kWh/yr: ${parts}; above clean reference (not priced) ${Math.round(p.compressorAboveCleanReferenceKWh ?? Number.NaN)}; mean Tc ${p.meanCondensingC.toFixed(2)} °C; unmet ${Math.round(p.unmetHours)} h; dry ${Math.round(p.dryModeHours)} h; makeup ${Math.round(p.waterM3.makeup)} m³\n`,
    );
  }
}
