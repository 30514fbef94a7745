/**
 * The scenarios of the engine regression guard (engine-regression.test.ts) and of the script that freezes
 * their reference figures (scripts/engine-regression.ts): the two test fixtures, the hourly one with
 * floating head pressure and with a fourth option (a second closed-circuit cooler, two-speed fans, as in
 * `npm run bench`), and the demo scenario (four options including an evaporative condenser).
 */
import { analyzeScenario, type ScenarioInput } from "@/lib/engine";
import { demoEngineInput } from "@/scripts/support/demo-input";
import { fixtureInput } from "./helpers";

const demo = demoEngineInput;

function withFourthOption(input: ScenarioInput): ScenarioInput {
  const cooler = input.options.find((o) => o.kind === "closedCircuitCooler");
  if (!cooler) throw new Error("fixture has no cooler");
  const fourth = { ...structuredClone(cooler), id: "cooler-two-speed", label: "Closed-circuit cooler, two-speed fans" };
  fourth.fan = { ...fourth.fan, control: "twoSpeed" };
  return { ...input, options: [...input.options, fourth] };
}

export const REGRESSION_CASES: [string, () => ScenarioInput][] = [
  ["demo", demo],
  ["scenario-bins.json", () => fixtureInput("scenario-bins.json")],
  ["scenario-hourly.json", () => fixtureInput("scenario-hourly.json")],
  [
    "scenario-hourly.json, floating head pressure",
    () => {
      const i = fixtureInput("scenario-hourly.json");
      return { ...i, duty: { ...i.duty, headPressureControl: "floating" } };
    },
  ],
  ["scenario-hourly.json + fourth option", () => withFourthOption(fixtureInput("scenario-hourly.json"))],
];

/** Per option: yearly energy by component (kWh), makeup (m³), mean condensing temperature, unmet hours, cleaning optimum, LCC. */
export type RegressionFigures = Record<string, Record<string, number | null>>;

export function regressionFigures(input: ScenarioInput): RegressionFigures {
  const result = analyzeScenario({ ...input, sensitivity: undefined, monteCarlo: undefined });
  const out: RegressionFigures = {};
  for (const p of result.physics) {
    const e = result.economics.options.find((o) => o.optionId === p.optionId);
    const row: Record<string, number | null> = {};
    for (const [k, v] of Object.entries(p.energyKWh)) row[`kWh.${k}`] = v as number;
    row["makeupM3"] = p.waterM3.makeup;
    row["evaporationM3"] = p.waterM3.evaporation;
    row["meanCondensingC"] = p.meanCondensingC;
    row["unmetHours"] = p.unmetHours;
    row["dryModeHours"] = p.dryModeHours;
    row["optimalCleaningIntervalMonths"] = p.optimalCleaningIntervalMonths;
    row["lcc"] = e?.lcc ?? null;
    out[p.optionId] = row;
  }
  return out;
}
