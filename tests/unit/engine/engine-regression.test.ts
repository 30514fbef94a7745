/**
 * Regression guard for engine speed work — NOT a physics check. The reference figures in
 * tests/fixtures/regression/engine-regression.json were frozen from the engine itself (scripts/engine-regression.ts)
 * before the solvers were made faster; this test only shows that faster solvers give the same answer.
 * The physics is checked against outside sources (ASHRAE, CTI, psychrolib, hand calculations) in the
 * other engine tests.
 *
 * Tolerances: yearly energy per component, makeup, evaporation and life-cycle cost within 0.01 % (1e-4
 * relative, with a floor of 1e-4 of the option's total energy for small components); mean condensing
 * temperature within 0.005 K; unmet and dry-mode hours within 2 h (an hour at the edge of the set-point
 * tolerance may flip); the cleaning optimum within 0.1 %.
 */
import { readFileSync } from "node:fs";
import { resolve } from "node:path";
import { describe, expect, it, vi } from "vitest";
import { FIXTURES } from "./helpers";
import { REGRESSION_CASES, type RegressionFigures, regressionFigures } from "./regression-cases";

vi.setConfig({ testTimeout: 120_000 });

const frozen = JSON.parse(readFileSync(resolve(FIXTURES, "regression", "engine-regression.json"), "utf8")) as Record<string, RegressionFigures>;

describe("engine regression guard (frozen from the engine itself; physics is tested elsewhere)", () => {
  for (const [name, load] of REGRESSION_CASES) {
    it(`${name}: per-option yearly totals unchanged`, () => {
      const want = frozen[name];
      expect(want, `no frozen figures for ${name}`).toBeDefined();
      const got = regressionFigures(load());
      expect(Object.keys(got).sort()).toEqual(Object.keys(want ?? {}).sort());
      for (const [optionId, row] of Object.entries(want ?? {})) {
        const g = got[optionId] ?? {};
        const totalKWh = Math.abs(row["kWh.total"] ?? 0);
        for (const [key, w] of Object.entries(row)) {
          const v = g[key];
          const where = `${name} / ${optionId} / ${key}`;
          if (w === null || v === null || v === undefined) {
            expect(v ?? null, where).toBe(w);
            continue;
          }
          let tol: number;
          if (key === "meanCondensingC") tol = 0.005;
          else if (key === "unmetHours" || key === "dryModeHours") tol = 2;
          else if (key === "optimalCleaningIntervalMonths") tol = 1e-3 * Math.abs(w);
          else if (key.startsWith("kWh.")) tol = Math.max(1e-4 * Math.abs(w), 1e-4 * totalKWh, 1e-6);
          else tol = Math.max(1e-4 * Math.abs(w), 1e-6);
          expect(Math.abs(v - w), `${where}: ${v} vs frozen ${w}`).toBeLessThanOrEqual(tol);
        }
      }
    });
  }
});
