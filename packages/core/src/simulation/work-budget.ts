/**
 * A work budget for one computation whose cost users control (a stiff plant's open-loop step, a
 * candidate's response): right-hand-side evaluations of the Dormand–Prince integrator. While a
 * budget is active (withWorkBudget), DormandPrince charges every evaluation to it; once the
 * evaluations pass the limit, the computation stops with a WorkBudgetError. Budgets are per thread
 * (module state) and computations are synchronous, so one budget covers exactly one computation.
 */

/** How much work one computation may do. */
export interface WorkBudget {
  /** Most right-hand-side evaluations f(t, x, p, u), a whole number ≥ 1. */
  evaluations: number;
}

/** Thrown inside a budgeted computation when it has used up its budget; carries a sentence. */
export class WorkBudgetError extends Error {
  override name = "WorkBudgetError";
  constructor(readonly limit: number) {
    super(`it needs more than ${limit.toLocaleString("en-GB")} right-hand-side evaluations`);
  }
}

/** The outcome of withWorkBudget: the value, or why the budget ran out. */
export type Budgeted<T> = { ok: true; value: T; evaluations: number } | { ok: false; reason: string; evaluations: number };

let limit = Infinity;
let used = 0;

/** Charges `n` right-hand-side evaluations to the active budget (none: free); throws WorkBudgetError past it. */
export function chargeEvaluations(n: number): void {
  used += n;
  if (used > limit) throw new WorkBudgetError(limit);
}

/**
 * Runs `compute` under `budget` and reports { ok: false, reason } when it ran out (reason: "it needs
 * more than N right-hand-side evaluations"); any other error is rethrown. Budgets do not nest: the
 * inner call replaces the outer one and restores it afterwards.
 */
export function withWorkBudget<T>(budget: WorkBudget, compute: () => T): Budgeted<T> {
  if (!Number.isInteger(budget.evaluations) || budget.evaluations < 1) {
    throw new RangeError(`budget.evaluations must be a whole number ≥ 1, got ${String(budget.evaluations)}`);
  }
  const outer = { limit, used };
  limit = budget.evaluations;
  used = 0;
  try {
    const value = compute();
    return { ok: true, value, evaluations: used };
  } catch (error) {
    if (error instanceof WorkBudgetError) return { ok: false, reason: error.message, evaluations: used };
    throw error;
  } finally {
    limit = outer.limit;
    used = outer.used;
  }
}
