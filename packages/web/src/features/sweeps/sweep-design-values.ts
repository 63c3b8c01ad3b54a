import type { CriterionId, SweepAggregate, SweepDesign, SweepFamily } from "@loopyard/core";
import { formatCount } from "./sweep-progress.js";

/** The design choices of the sweep form (the two search methods are separate choices). */
export type DesignChoice = "grid" | "latin-hypercube" | "sobol" | "random" | "nelder-mead" | "nsga2";

/** How each design is named in the form, with one line saying what it does. */
export const DESIGNS: Readonly<Record<DesignChoice, { label: string; line: string }>> = {
  grid: { label: "Even grid", line: "Every combination of the values per parameter: count values spaced evenly on each range." },
  "latin-hypercube": {
    label: "Latin hypercube",
    line: "A set number of candidates; each parameter's range is cut into that many equal slices and every slice is used once.",
  },
  sobol: { label: "Sobol sequence", line: "Low-discrepancy points that fill the box ever more evenly as the count grows." },
  random: { label: "Seeded random", line: "Independent uniform draws over the box; the same seed gives the same candidates." },
  "nelder-mead": {
    label: "Simplex search on one criterion (Nelder–Mead)",
    line: "Several simplex searches from spread-out starts, each walking downhill on one criterion's family aggregate.",
  },
  nsga2: {
    label: "Evolving front (NSGA-II)",
    line: "A population bred over generations towards the front of all chosen criteria at once.",
  },
};

export const DESIGN_ORDER: readonly DesignChoice[] = ["grid", "latin-hypercube", "sobol", "random", "nelder-mead", "nsga2"];

/** Aggregate choices over the family, each with one line. */
export const AGGREGATES: Readonly<Record<SweepAggregate["kind"], { label: string; line: string }>> = {
  worst: { label: "Worst variant", line: "A candidate counts as good as its weakest variant allows." },
  mean: { label: "Mean over variants", line: "Every variant weighs the same." },
  percentile: { label: "Percentile", line: "The p-th percentile over the variants (p = 50 is the median, 100 the worst)." },
};

export interface DesignValues {
  kind: DesignChoice;
  count: number;
  seed: number;
  criterion: CriterionId;
  starts: number;
  iterations: number;
  population: number;
  generations: number;
}

export interface AggregateValues {
  kind: SweepAggregate["kind"];
  p: number;
}

/** One plant variant after the first: its plant (for the revision list), revision, label and parameter overrides as text. */
export interface VariantValues {
  plantId: string;
  plantRevisionId: string;
  label: string;
  /** True once the user typed a label; until then (and again when it is cleared) the label follows the plant's name. */
  labelTyped: boolean;
  parameters: string;
}

export function defaultDesign(criterion: CriterionId = "ise"): DesignValues {
  return { kind: "grid", count: 500, seed: 1, criterion, starts: 8, iterations: 200, population: 60, generations: 40 };
}

export const DEFAULT_AGGREGATE: AggregateValues = { kind: "worst", p: 90 };

/** True for designs that draw their own count of candidates (the ranges' counts are ignored). */
export function drawsOwnCount(kind: DesignChoice): boolean {
  return kind !== "grid";
}

/** A stored design in a few words, e.g. "Latin hypercube, 300 candidates, seed 7". */
export function designSummary(design: SweepDesign | undefined): string {
  if (!design || design.kind === "grid") return DESIGNS.grid.label;
  if (design.kind === "search") {
    return design.method === "nelder-mead"
      ? `${DESIGNS["nelder-mead"].label} on ${design.criterion}: ${design.starts} starts × ${design.iterations} evaluations, seed ${design.seed}`
      : `${DESIGNS.nsga2.label}: population ${design.population} × ${design.generations} generations, seed ${design.seed}`;
  }
  return `${DESIGNS[design.kind].label}, ${formatCount(design.count)} candidates${design.seed !== undefined ? `, seed ${design.seed}` : ""}`;
}

/** The design as the API takes it. */
export function toDesign(values: DesignValues): SweepDesign {
  switch (values.kind) {
    case "grid":
      return { kind: "grid" };
    case "latin-hypercube":
    case "random":
      return { kind: values.kind, count: values.count, seed: values.seed };
    case "sobol":
      return { kind: "sobol", count: values.count, seed: values.seed };
    case "nelder-mead":
      return { kind: "search", method: "nelder-mead", criterion: values.criterion, starts: values.starts, iterations: values.iterations, seed: values.seed };
    case "nsga2":
      return { kind: "search", method: "nsga2", population: values.population, generations: values.generations, seed: values.seed };
  }
}

/** The form's design values of a stored design (unused fields keep their defaults). */
export function fromDesign(design: SweepDesign | undefined, criterion: CriterionId): DesignValues {
  const base = defaultDesign(criterion);
  if (!design || design.kind === "grid") return base;
  if (design.kind === "search") {
    return design.method === "nelder-mead"
      ? { ...base, kind: "nelder-mead", criterion: design.criterion, starts: design.starts, iterations: design.iterations, seed: design.seed }
      : { ...base, kind: "nsga2", population: design.population, generations: design.generations, seed: design.seed };
  }
  return { ...base, kind: design.kind, count: design.count, seed: design.seed ?? base.seed };
}

export function toAggregate(values: AggregateValues): SweepAggregate {
  return values.kind === "percentile" ? { kind: "percentile", p: values.p } : { kind: values.kind };
}

export function fromAggregate(aggregate: SweepAggregate | undefined): AggregateValues {
  if (!aggregate) return { ...DEFAULT_AGGREGATE };
  return aggregate.kind === "percentile" ? { kind: "percentile", p: aggregate.p } : { ...DEFAULT_AGGREGATE, kind: aggregate.kind };
}

/** Candidates the design asks for: the grid's product, the design's count, or the search's budget; null while a number is missing. */
export function designCandidateCount(values: DesignValues, gridCount: number | null): number | null {
  const whole = (...xs: number[]) => xs.every((x) => Number.isInteger(x) && x >= 1);
  switch (values.kind) {
    case "grid":
      return gridCount;
    case "nelder-mead":
      return whole(values.starts, values.iterations) ? values.starts * values.iterations : null;
    case "nsga2":
      // The initial population is evaluated too: population × (generations + 1), as sweepCandidateCount counts it.
      return whole(values.population, values.generations) ? values.population * (values.generations + 1) : null;
    default:
      return whole(values.count) ? values.count : null;
  }
}

/**
 * Parameter overrides of a nonlinear variant written as "name = value", one per line or separated
 * by commas or semicolons; an empty text is no override. Returns the values or the first problem.
 */
export function parseOverrides(text: string): { ok: true; values: Record<string, number> } | { ok: false; message: string } {
  const values: Record<string, number> = {};
  for (const raw of text.split(/[\n,;]/)) {
    const part = raw.trim();
    if (part === "") continue;
    const match = /^([A-Za-z_][A-Za-z0-9_]*)\s*=\s*(\S+)$/.exec(part);
    if (!match) return { ok: false, message: `"${part}" is not of the form name = value` };
    const value = Number(match[2].replace("−", "-"));
    if (!Number.isFinite(value)) return { ok: false, message: `${match[1]}: "${match[2]}" is not a finite number` };
    if (match[1] in values) return { ok: false, message: `${match[1]} is given twice` };
    values[match[1]] = value;
  }
  return { ok: true, values };
}

/** Overrides as the form's text: "a = 1, b = 2". */
export function formatOverrides(values: Record<string, number> | undefined): string {
  return Object.entries(values ?? {})
    .map(([name, value]) => `${name} = ${value}`)
    .join(", ");
}

/**
 * The family of the form: undefined for a single variant without label or overrides (a plain
 * one-plant sweep); otherwise the first variant (the sweep's plant revision) and the others.
 */
export function toFamily(
  first: { plantRevisionId: string; label: string; parameters: string },
  others: readonly VariantValues[],
): SweepFamily | undefined {
  const variant = (v: { plantRevisionId: string; label: string; parameters: string }) => {
    const parsed = parseOverrides(v.parameters);
    const label = v.label.trim();
    return {
      plantRevisionId: v.plantRevisionId,
      ...(label ? { label } : {}),
      ...(parsed.ok && Object.keys(parsed.values).length > 0 ? { parameters: parsed.values } : {}),
    };
  };
  const firstVariant = variant(first);
  if (others.length === 0 && !firstVariant.label && !firstVariant.parameters) return undefined;
  return { variants: [firstVariant, ...others.map(variant)] };
}
