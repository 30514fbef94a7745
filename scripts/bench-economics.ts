/**
 * Benchmark of the life-cycle economics: median wall time of
 *   1. a 25-year LCC of three options (cash-flow tables + measures),
 *   2. a full tornado + break-evens (9 inputs, physics re-runs included),
 *   3. 10,000 Monte Carlo draws.
 * Uses the engine's real physics of the first scenario fixture (tests/fixtures/*.json) with real physics
 * re-runs; `--synthetic` (or an unusable fixture) uses synthetic yearly physics instead. `--summary`
 * also prints the full economic summary.
 *
 *   npm run bench:economics [-- --synthetic] [-- --summary]
 */
import { existsSync, readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import {
  analyzeEconomics,
  formatEconomicsSummary,
  whatIf,
  type AnalyzeEconomicsArgs,
  type PhysicsOverrides,
} from "@/lib/engine/economics";
import { parseEpw } from "@/lib/engine/climate";
import { physicsOf, prepareScenario } from "@/lib/engine";
import { pressureFromElevationPa } from "@/lib/engine/psychrometrics";
import { parseScenario } from "@/lib/scenarios/schema";
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
} from "./support/synthetic-options";

const root = path.resolve(__dirname, "..");

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? (s[m] ?? 0) : 0.5 * ((s[m - 1] ?? 0) + (s[m] ?? 0));
}

function time(runs: number, f: () => void): number {
  f(); // warm-up (JIT)
  const ts: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    f();
    ts.push(performance.now() - t0);
  }
  return median(ts);
}

function syntheticArgs(): { args: AnalyzeEconomicsArgs; source: string } {
  return {
    source: "synthetic yearly physics (scripts/support/synthetic-options.ts), three options",
    args: {
      physics: syntheticOptionsPhysics(),
      options: SYNTHETIC_OPTIONS.map((s) => ({
        optionId: s.id,
        kind: s.kind,
        label: s.label,
        costs: syntheticOptionCosts(s),
      })),
      tariffs: tariffsSchema.parse({}),
      upkeep: upkeepSchema.parse({}),
      economics: economicsSchema.parse({ studyPeriodYears: 25 }),
      rerunPhysics: (o: PhysicsOverrides) => syntheticOptionsPhysics(o),
    },
  };
}

/** The engine's own physics of the first fixture (its `climate.epwPath` resolved as `npm run analyze` does). */
function realArgs(): { args: AnalyzeEconomicsArgs; source: string } | null {
  const fixtures = path.join(root, "tests", "fixtures");
  if (!existsSync(fixtures)) return null;
  const file = readdirSync(fixtures)
    .filter((f) => f.endsWith(".json"))
    .sort()[0];
  if (!file) return null;
  try {
    const doc = JSON.parse(readFileSync(path.join(fixtures, file), "utf8")) as Record<string, unknown>;
    const climate = doc.climate as { epwPath?: unknown; label?: unknown } | undefined;
    if (climate && typeof climate.epwPath === "string") {
      const elevationM = (doc.site as { elevationM?: number } | undefined)?.elevationM ?? 0;
      const parsedEpw = parseEpw(readFileSync(path.resolve(fixtures, climate.epwPath), "utf8"), {
        pressure: "site",
        sitePressurePa: pressureFromElevationPa(elevationM),
      });
      if (!parsedEpw.ok) throw new Error(`cannot parse ${climate.epwPath}`);
      const y = parsedEpw.value.year;
      doc.climate = {
        source: "hourly",
        label: typeof climate.label === "string" ? climate.label : file,
        month: y.month,
        day: y.day,
        hour: y.hour,
        dryBulbC: y.dryBulbC,
        wetBulbC: y.wetBulbC,
      };
    }
    const parsed = parseScenario(doc);
    if (!parsed.ok) throw new Error(parsed.errors.map((e) => `${e.path}: ${e.message}`).join("; "));
    const input = parsed.value;
    const prepared = prepareScenario(input);
    return {
      source: `engine physics of tests/fixtures/${file} (${input.options.length} options, real physics re-runs)`,
      args: {
        physics: physicsOf(prepared),
        options: input.options.map((o) => ({ optionId: o.id, kind: o.kind, label: o.label, costs: o.costs })),
        tariffs: input.tariffs,
        upkeep: input.upkeep,
        economics: { ...input.economics, studyPeriodYears: 25 },
        rerunPhysics: (o: PhysicsOverrides) => physicsOf(prepared, o),
      },
    };
  } catch (e) {
    console.log(
      `(fixture ${file} not usable, synthetic physics instead: ${(e as Error).message.split("\n")[0]})`,
    );
    return null;
  }
}

function main() {
  const chosen = (process.argv.includes("--synthetic") ? null : realArgs()) ?? syntheticArgs();
  const { args } = chosen;
  console.log(`economics benchmark — ${chosen.source}; node ${process.version}`);

  const lccMs = time(200, () => analyzeEconomics({ ...args, sensitivity: undefined, monteCarlo: undefined }));
  let reruns = 0;
  const tornadoMs = time(10, () => {
    const r = analyzeEconomics({ ...args, sensitivity: sensitivitySchema.parse({}), monteCarlo: undefined });
    reruns = r.sensitivity?.physicsReruns ?? 0;
  });
  const mcInput = monteCarloSchema.parse({ draws: 10_000 });
  let mcReruns = 0;
  const mcMs = time(10, () => {
    const r = analyzeEconomics({ ...args, sensitivity: undefined, monteCarlo: mcInput });
    mcReruns = r.monteCarlo?.physicsReruns ?? 0;
  });
  const mcFoulingMs = time(10, () => {
    analyzeEconomics({
      ...args,
      sensitivity: undefined,
      monteCarlo: {
        ...mcInput,
        distributions: {
          ...mcInput.distributions,
          cyclesOfConcentration: { type: "triangular", min: 3, mode: 4, max: 6 },
          foulingRateFactor: { type: "triangular", min: 0.5, mode: 1, max: 2 },
        },
      },
    });
  });
  const stored = {
    physics: args.physics,
    options: args.options,
    tariffs: args.tariffs,
    upkeep: args.upkeep,
    economics: args.economics,
  };
  let k = 0;
  const whatIfMs = time(200, () => {
    k++;
    whatIf(stored, { waterAndSewerPriceFactor: 1 + 0.001 * k, discountRate: 0.04, cyclesOfConcentration: 5 });
  });

  if (process.argv.includes("--summary")) {
    const full = analyzeEconomics({ ...args, sensitivity: sensitivitySchema.parse({}), monteCarlo: mcInput });
    console.log(formatEconomicsSummary(full));
  }
  console.log(
    `25-year LCC, ${args.options.length} options (cash flows + measures): median ${lccMs.toFixed(3)} ms`,
  );
  console.log(
    `full tornado (9 inputs) + 4 break-evens per pair: median ${tornadoMs.toFixed(2)} ms (${reruns} physics re-runs)`,
  );
  console.log(
    `Monte Carlo 10,000 draws (prices, escalation, first cost): median ${mcMs.toFixed(1)} ms (${mcReruns} physics re-runs)`,
  );
  console.log(
    `what-if (price factor, discount rate, cycles by water balance): median ${whatIfMs.toFixed(3)} ms`,
  );
  console.log(
    `Monte Carlo 10,000 draws + cycles + fouling (node re-runs, interpolation): median ${mcFoulingMs.toFixed(1)} ms`,
  );
}

main();
