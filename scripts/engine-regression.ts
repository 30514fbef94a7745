/**
 * Freezes the engine regression guard's reference figures (tests/fixtures/regression/engine-regression.json) from the
 * current engine: `npx tsx scripts/engine-regression.ts`. Run it only when an engine change is MEANT to move
 * the answer (a physics correction), and say so in the commit; speed work must leave the file unchanged.
 * The file is a regression guard, not a source of truth: the physics is checked against outside sources in
 * the other engine tests.
 */
import { writeFileSync } from "node:fs";
import { resolve } from "node:path";
import { REGRESSION_CASES, regressionFigures } from "../tests/unit/engine/regression-cases";

const out: Record<string, unknown> = {
  note: "Regression guard only (frozen from the engine by scripts/engine-regression.ts); the physics is checked against outside sources elsewhere.",
};
for (const [name, load] of REGRESSION_CASES) out[name] = regressionFigures(load());
writeFileSync(resolve(__dirname, "../tests/fixtures/regression/engine-regression.json"), `${JSON.stringify(out, null, 1)}\n`);
process.stdout.write("tests/fixtures/regression/engine-regression.json written\n");
