/**
 * A report source for tests. Uses the engine's own analyzeScenario on tests/fixtures/scenario-bins.json
 * when that fixture and lib/scenarios/schema.ts exist; otherwise the economics engine on synthetic yearly
 * physics (round invented numbers, scripts/support/synthetic-options.ts), which exercises every table and chart.
 */
import { existsSync, readFileSync } from "node:fs";
import path from "node:path";
import { analyzeEconomics, type PhysicsOverrides } from "@/lib/engine/economics";
import type { OptionAnnualPhysics } from "@/lib/engine/types";
import { readEngineResult } from "@/lib/reports/result";
import type { ReportSource } from "@/lib/reports/types";
import {
  economicsSchema,
  monteCarloSchema,
  sensitivitySchema,
  tariffsSchema,
  upkeepSchema,
} from "@/lib/scenarios/schema-economics";
import {
  SYNTHETIC_OPTIONS,
  syntheticOptionCosts,
  syntheticOptionsPhysics,
} from "@/scripts/support/synthetic-options";

const ROOT = path.resolve(__dirname, "../../..");

const SUMMER = [0.55, 0.6, 0.75, 0.9, 1.1, 1.3, 1.45, 1.4, 1.15, 0.9, 0.7, 0.6];

function physics(o: PhysicsOverrides = {}): OptionAnnualPhysics[] {
  return syntheticOptionsPhysics(o, SUMMER);
}

export interface FixtureOptions {
  scenarioName?: string;
  analysis?: "real" | "nominal";
  discounting?: "endOfYear" | "midYear";
  unitSystem?: "SI" | "IP";
  monteCarloDraws?: number;
}

export function syntheticInput(opts: FixtureOptions = {}) {
  return {
    inputVersion: 1,
    name: opts.scenarioName ?? "Base case, 2026 tariffs",
    site: { elevationM: 240, locationLabel: "Harrowgate Flats (invented inland valley site)" },
    options: SYNTHETIC_OPTIONS.map((s) => ({
      id: s.id,
      kind: s.kind,
      label: s.label,
      costs: syntheticOptionCosts(s),
    })),
    tariffs: tariffsSchema.parse({}),
    upkeep: upkeepSchema.parse({}),
    economics: economicsSchema.parse({
      studyPeriodYears: 25,
      analysis: opts.analysis ?? "real",
      discounting: opts.discounting ?? "endOfYear",
    }),
  };
}

/** The synthetic stored result, shaped like lib/engine's ScenarioResult. */
export function syntheticResult(opts: FixtureOptions = {}) {
  const input = syntheticInput(opts);
  const p = physics();
  const economics = analyzeEconomics({
    physics: p,
    options: input.options.map((o) => ({ optionId: o.id, kind: o.kind, label: o.label, costs: o.costs })),
    tariffs: input.tariffs,
    upkeep: input.upkeep,
    economics: input.economics,
    sensitivity: sensitivitySchema.parse({}),
    monteCarlo: monteCarloSchema.parse({ draws: opts.monteCarloDraws ?? 2000 }),
    rerunPhysics: physics,
  });
  return {
    input,
    result: { engineVersion: "synthetic", physics: p, economics, warnings: economics.warnings },
  };
}

/** Engine fixture when present (analyzeScenario on tests/fixtures/scenario-bins.json), else synthetic. */
export async function engineOrSynthetic(
  opts: FixtureOptions = {},
): Promise<{ input: unknown; result: unknown; source: "engine" | "synthetic" }> {
  const fixture = path.join(ROOT, "tests/fixtures/scenario-bins.json");
  if (
    existsSync(fixture) &&
    existsSync(path.join(ROOT, "lib/scenarios/schema.ts")) &&
    existsSync(path.join(ROOT, "lib/engine/index.ts"))
  ) {
    const schemaMod = (await import("@/lib/scenarios/schema")) as unknown as {
      scenarioSchema: { parse: (x: unknown) => Record<string, unknown> };
    };
    const engine = (await import("@/lib/engine/index")) as unknown as {
      analyzeScenario: (i: unknown) => unknown;
    };
    const raw = JSON.parse(readFileSync(fixture, "utf8")) as Record<string, unknown>;
    if (opts.scenarioName) raw.name = opts.scenarioName;
    const input = schemaMod.scenarioSchema.parse(raw);
    const economics = input.economics as Record<string, unknown>;
    if (opts.analysis) economics.analysis = opts.analysis;
    if (opts.discounting) economics.discounting = opts.discounting;
    if (opts.monteCarloDraws && input.monteCarlo)
      (input.monteCarlo as Record<string, unknown>).draws = opts.monteCarloDraws;
    return { input, result: JSON.parse(JSON.stringify(engine.analyzeScenario(input))), source: "engine" };
  }
  const s = syntheticResult(opts);
  return { input: s.input, result: JSON.parse(JSON.stringify(s.result)), source: "synthetic" };
}

export async function reportSource(
  opts: FixtureOptions = {},
): Promise<ReportSource & { fixture: "engine" | "synthetic" }> {
  const { input, result, source } = await engineOrSynthetic(opts);
  return {
    fixture: source,
    project: {
      id: "00000000-0000-4000-8000-000000000001",
      name: "Harrowgate Flats cold store — condenser loop",
      clientName: "Bellwether Cold Chain Co.",
      siteName: "Harrowgate Flats distribution centre",
      locationLabel: "Harrowgate Flats (invented inland valley site)",
      elevationM: 240,
      currency: "USD",
      firmName: "Corrandale Thermal Consulting",
    },
    scenarioId: "00000000-0000-4000-8000-0000000000aa",
    scenarioName: opts.scenarioName ?? (input as { name?: string }).name ?? "Base case",
    versionNumber: 1,
    versionLabel: "Version 1",
    input,
    result: readEngineResult(result),
    unitSystem: opts.unitSystem ?? "IP",
    preparedBy: { firmName: "Corrandale Thermal Consulting", consultantName: "Cole Pereira" },
    issuedAt: new Date("2026-12-01T10:00:00Z"),
    resultAt: new Date("2026-12-01T09:58:00Z"),
    engineVersion: "1.0.0",
  };
}
