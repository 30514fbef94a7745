/** Test helpers: load the example scenarios (the hourly one with its EPW resolved) through the schema. */
import { readFileSync } from "node:fs";
import { resolve } from "node:path";
import { parseEpw } from "@/lib/engine/climate";
import type { ScenarioInput } from "@/lib/engine/input";
import { pressureFromElevationPa } from "@/lib/engine/psychrometrics";
import { parseScenario } from "@/lib/scenarios/schema";

export const FIXTURES = resolve(__dirname, "../../fixtures");

export function readFixture(name: string): Record<string, unknown> {
  return JSON.parse(readFileSync(resolve(FIXTURES, name), "utf8")) as Record<string, unknown>;
}

/** The fixture document with `climate.epwPath` replaced by the parsed hourly arrays (as the CLI does). */
export function fixtureDocument(name: string): Record<string, unknown> {
  const doc = readFixture(name);
  const climate = doc.climate as { epwPath?: string; label?: string };
  if (climate.epwPath) {
    const site = doc.site as { elevationM: number };
    const parsed = parseEpw(readFileSync(resolve(FIXTURES, climate.epwPath), "utf8"), {
      pressure: "site",
      sitePressurePa: pressureFromElevationPa(site.elevationM),
    });
    if (!parsed.ok) throw new Error("fixture EPW does not parse");
    const y = parsed.value.year;
    doc.climate = { source: "hourly", label: climate.label ?? "x", month: y.month, day: y.day, hour: y.hour, dryBulbC: y.dryBulbC, wetBulbC: y.wetBulbC };
  }
  return doc;
}

export function fixtureInput(name: string): ScenarioInput {
  const r = parseScenario(fixtureDocument(name));
  if (!r.ok) throw new Error(r.errors.map((e) => `${e.path}: ${e.message}`).join("\n"));
  return r.value;
}
