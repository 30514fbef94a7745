/**
 * npm run analyze -- <scenario.json> [--summary]
 *
 * Validates a scenario document with the scenario schema and prints the engine's result as JSON on
 * stdout. An invalid document prints one line per field error ("path: message") on stderr and exits
 * with code 2; an unreadable file exits with 1.
 *
 * Command-line convenience (not part of the stored scenario format): `climate` may be
 * `{ "epwPath": "relative/or/absolute.epw", "label"?: string }`; the file is parsed with the EPW
 * parser (wet-bulb at the site's standard pressure from `site.elevationM`) and replaced by the hourly
 * arrays before validation. Paths are relative to the scenario file.
 */
import { readFileSync } from "node:fs";
import { dirname, resolve } from "node:path";
import { parseEpw } from "@/lib/engine/climate";
import { analyzeScenario } from "@/lib/engine";
import { pressureFromElevationPa } from "@/lib/engine/psychrometrics";
import { parseScenario } from "@/lib/scenarios/schema";

function fail(code: number, lines: string[]): never {
  for (const l of lines) process.stderr.write(`${l}\n`);
  process.exit(code);
}

function resolveEpwClimate(doc: Record<string, unknown>, baseDir: string): void {
  const climate = doc.climate as Record<string, unknown> | undefined;
  if (!climate || typeof climate.epwPath !== "string") return;
  const site = doc.site as { elevationM?: unknown } | undefined;
  const elevationM = typeof site?.elevationM === "number" ? site.elevationM : 0;
  const path = resolve(baseDir, climate.epwPath);
  let text: string;
  try {
    text = readFileSync(path, "utf8");
  } catch (e) {
    fail(1, [`climate.epwPath: cannot read ${path}: ${(e as Error).message}`]);
  }
  const parsed = parseEpw(text, { pressure: "site", sitePressurePa: pressureFromElevationPa(elevationM) });
  if (!parsed.ok) fail(2, parsed.errors.map((e) => `climate.epwPath: line ${e.line}, ${e.field}: ${e.message}`));
  const y = parsed.value.year;
  doc.climate = {
    source: "hourly",
    label: typeof climate.label === "string" ? climate.label : (parsed.value.location?.name ?? path),
    month: y.month,
    day: y.day,
    hour: y.hour,
    dryBulbC: y.dryBulbC,
    wetBulbC: y.wetBulbC,
  };
}

function main(): void {
  const args = process.argv.slice(2).filter((a) => a !== "--");
  const file = args.find((a) => !a.startsWith("--"));
  if (!file) fail(1, ["usage: npm run analyze -- <scenario.json> [--summary]"]);
  let doc: unknown;
  try {
    doc = JSON.parse(readFileSync(file, "utf8"));
  } catch (e) {
    fail(1, [`${file}: ${(e as Error).message}`]);
  }
  if (doc && typeof doc === "object" && !Array.isArray(doc)) resolveEpwClimate(doc as Record<string, unknown>, dirname(resolve(file)));
  const parsed = parseScenario(doc);
  if (!parsed.ok) fail(2, parsed.errors.map((e) => `${e.path || "(document)"}: ${e.message}`));
  const result = analyzeScenario(parsed.value);
  if (args.includes("--summary")) {
    const rows = result.physics.map((p) => ({
      option: p.optionId,
      kWh: Math.round(p.energyKWh.total),
      fanKWh: Math.round(p.energyKWh.fan),
      compressorKWh: Math.round(p.energyKWh.compressor),
      aboveCleanKWh: Math.round(p.compressorAboveCleanReferenceKWh),
      makeupM3: Math.round(p.waterM3.makeup),
      evapM3: Math.round(p.waterM3.evaporation),
      cycles: Math.round(p.cyclesOfConcentration * 100) / 100,
      dryH: Math.round(p.dryModeHours),
      unmetH: Math.round(p.unmetHours),
      lcc: Math.round(result.economics.options.find((o) => o.optionId === p.optionId)?.lcc ?? Number.NaN),
    }));
    process.stdout.write(`${JSON.stringify(rows, null, 1)}\n`);
    return;
  }
  process.stdout.write(`${JSON.stringify(result, null, 2)}\n`);
}

main();
