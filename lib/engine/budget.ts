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

/**
 * A schedule or loop of the economics that would need more steps than any valid input can ask for (an
 * interval or life far below the schema's minimum, a study period beyond its maximum). The schema refuses
 * such input first; this stops the engine with a clear message if one ever slips past, instead of looping.
 */
export class AnalysisLimitExceeded extends Error {
  readonly code = "analysis.limitExceeded";
  constructor(
    readonly what: string,
    readonly steps: number,
    readonly limit: number,
  ) {
    super(
      `The analysis stopped: ${what} would need ${Number.isFinite(steps) ? Math.round(steps).toLocaleString("en-US") : "endless"} steps ` +
        `(at most ${limit.toLocaleString("en-US")}). Check that intervals and lives are at least a week and the study period at most 60 years.`,
    );
    this.name = "AnalysisLimitExceeded";
  }
}

/** Most dated events one schedule (a periodic item, a component's or a first-cost item's replacements) may hold. */
export const MAX_SCHEDULE_EVENTS = 10_000;
/** Most Monte Carlo draws the engine runs (the schema allows 200,000). */
export const MAX_MONTE_CARLO_DRAWS = 1_000_000;
/** Longest study period the engine walks, years (the schema allows 60). */
export const MAX_STUDY_YEARS = 200;

/** Throws AnalysisLimitExceeded when `steps` (NaN and ∞ included) exceeds `limit`. */
export function checkSteps(what: string, steps: number, limit: number): void {
  if (!(steps <= limit)) throw new AnalysisLimitExceeded(what, steps, limit);
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

/** The analysis stopped by its time budget or by a step limit (its message says which and what to change). */
export function isBudgetExceeded(err: unknown): err is AnalysisBudgetExceeded | AnalysisLimitExceeded {
  if (err instanceof AnalysisBudgetExceeded || err instanceof AnalysisLimitExceeded) return true;
  const code = typeof err === "object" && err !== null ? (err as { code?: unknown }).code : undefined;
  return code === "analysis.budgetExceeded" || code === "analysis.limitExceeded";
}
