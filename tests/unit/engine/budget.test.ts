import { describe, expect, it } from "vitest";
import { AnalysisBudgetExceeded, analyzeScenario, isBudgetExceeded, timeBudget } from "@/lib/engine";
import { fixtureInput } from "./helpers";

const bins = fixtureInput("scenario-bins.json");

/** A clock that moves forward by `stepMs` at every reading (a stand-in for a slow machine). */
function steppingClock(stepMs: number) {
  let t = 0;
  return () => (t += stepMs);
}

describe("the analysis time budget", () => {
  it("lets an analysis finish inside its budget", () => {
    const r = analyzeScenario(bins, undefined, timeBudget(60_000, steppingClock(1)));
    expect(r.economics.options.length).toBe(bins.options.length);
  });

  it("stops an analysis that runs past its budget with a clear error naming the budget and the step", () => {
    // Every clock reading is 1 s later; the budget of 3 s is spent at the fourth check.
    let err: unknown;
    try {
      analyzeScenario(bins, undefined, timeBudget(3_000, steppingClock(1_000)));
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(AnalysisBudgetExceeded);
    expect(isBudgetExceeded(err)).toBe(true);
    const e = err as AnalysisBudgetExceeded;
    expect(e.budgetMs).toBe(3_000);
    expect(e.message).toMatch(/time budget of 3 s/);
    expect(e.message).toMatch(/Reduce the Monte Carlo draws/);
    expect(e.stage).toBeTruthy();
  });

  it("checks during the Monte Carlo draws, not only between steps", () => {
    const withMc = { ...bins, sensitivity: undefined, monteCarlo: { ...bins.monteCarlo!, enabled: true, draws: 2000 } };
    let readings = 0;
    const clock = () => (readings++ < 6 ? 0 : 10_000);
    expect(() => analyzeScenario(withMc, undefined, timeBudget(1_000, clock))).toThrow(/during the Monte Carlo draws/);
  });
});
