/** The parameters of a search design that set its evaluation budget. */
export type SearchBudgetDesign =
  | { method: "nelder-mead"; starts: number; iterations: number }
  | { method: "nsga2"; population: number; generations: number };

/**
 * The most candidates a search design may evaluate, its budget:
 * - Nelder–Mead: starts × iterations (each iteration of a start evaluates at most one new vertex
 *   beyond its shrink steps, so this bounds what the sweep stores);
 * - NSGA-II: population × (generations + 1), the initial population and its offspring generations.
 * The search stops at the budget even when it has not converged.
 */
export function searchBudget(design: SearchBudgetDesign): number {
  return design.method === "nelder-mead" ? design.starts * design.iterations : design.population * (design.generations + 1);
}
