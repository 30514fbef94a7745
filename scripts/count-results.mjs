// Sums vitest JSON reports into the one closing line CI reads: "N passed, N failed[, N skipped]".
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";

const dir = process.argv[2] ?? "test-results";
let passed = 0, failed = 0, skipped = 0;
for (const f of readdirSync(dir).filter((f) => f.startsWith("vitest-") && f.endsWith(".json"))) {
  try {
    const r = JSON.parse(readFileSync(path.join(dir, f), "utf8"));
    passed += r.numPassedTests ?? 0;
    failed += (r.numFailedTests ?? 0) + (r.numFailedTestSuites && !r.numFailedTests ? r.numFailedTestSuites : 0);
    skipped += (r.numPendingTests ?? 0) + (r.numTodoTests ?? 0);
  } catch {
    failed += 1;
  }
}
console.log(`${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ""}`);
process.exit(failed > 0 ? 1 : 0);
