import { describe, expect, it } from "vitest";
import { searchBudget } from "../../src/sweeps/search-budget.js";

describe("searchBudget", () => {
  it("searchBudget is starts × iterations for Nelder–Mead and population × (generations + 1) for NSGA-II (the initial population counts)", () => {
    expect(searchBudget({ method: "nelder-mead", starts: 8, iterations: 200 })).toBe(1600);
    expect(searchBudget({ method: "nsga2", population: 60, generations: 40 })).toBe(2460);
  });
});
