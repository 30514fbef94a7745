/**
 * A hard time budget for one analysis. The engine calls `check` between its steps (after the climate
 * is prepared, at every physics run — the base run and each re-run the tornado, break-evens and the
 * Monte Carlo's fouling nodes ask for — and every twentieth of the Monte Carlo draws); once the budget is
 * spent it throws `AnalysisBudgetExceeded`, so no input can keep a worker busy for longer than that.
 * The clock is passed in, so the engine itself reads no time (tests drive it with a fake clock).
 */
export class AnalysisBudgetExceeded extends Error {
  readonly code = "analysis.budgetExceeded";
  constructor(
    readonly budgetMs: number,
    readonly stage: string,
  ) {
    super(
      `The analysis stopped after its time budget of ${Math.round(budgetMs / 1000)} s (during ${stage}). ` +
        "Reduce the Monte Carlo draws, the number of options or the sensitivity cases, or use a bin table instead of an hourly year.",
    );
    this.name = "AnalysisBudgetExceeded";
  }
}

export interface AnalysisBudget {
  /** Throws AnalysisBudgetExceeded once the budget is spent; `stage` names the step for the message. */
  check(stage: string): void;
}

export const UNLIMITED_BUDGET: AnalysisBudget = { check() {} };

/** A budget of `budgetMs` from now, read from `now` (milliseconds, e.g. performance.now). */
export function timeBudget(budgetMs: number, now: () => number): AnalysisBudget {
  const deadline = now() + budgetMs;
  return {
    check(stage: string) {
      if (now() > deadline) throw new AnalysisBudgetExceeded(budgetMs, stage);
    },
  };
}

export function isBudgetExceeded(err: unknown): err is AnalysisBudgetExceeded {
  return err instanceof AnalysisBudgetExceeded || (typeof err === "object" && err !== null && (err as { code?: unknown }).code === "analysis.budgetExceeded");
}
