import { gridDesign } from "../batch/grid-design.js";
import { latinHypercube } from "../batch/latin-hypercube.js";
import type { ParameterSpace } from "../batch/parameter-space.js";
import { seededRandomDesign } from "../batch/random-design.js";
import { MAX_FAMILY_VARIANTS, MAX_TITLE_LENGTH } from "../limits.js";
import type { SweepFamily } from "../sweeps/sweep-input.js";

/** The shape expandFamily reads (a parsed FamilyDefinition; kept structural so the schema can call it while checking). */
export interface FamilyDefinitionShape {
  entries: readonly {
    plantRevisionId: string;
    label?: string | undefined;
    parameters?: Readonly<Record<string, number>> | undefined;
    spread?:
      | {
          ranges: Readonly<Record<string, { min: number; max: number; count?: number | undefined; scale?: "linear" | "log" | undefined }>>;
          design: { kind: "grid" } | { kind: "random" | "latin-hypercube"; count: number; seed: number };
        }
      | undefined;
  }[];
}

type Spread = NonNullable<FamilyDefinitionShape["entries"][number]["spread"]>;

/** Names of a spread in the order its variants vary: sorted by code unit (first slowest on a grid), so storage cannot reorder them. */
export function spreadParameterNames(spread: Spread): string[] {
  return Object.keys(spread.ranges).sort();
}

/** Variants one spread stands for: Π counts on a grid, the design's count otherwise. */
function spreadCount(spread: Spread): number {
  if (spread.design.kind !== "grid") return spread.design.count;
  return spreadParameterNames(spread).reduce((n, name) => n * (spread.ranges[name]?.count ?? 1), 1);
}

/** Number of variants a family definition expands to (without building them). */
export function familyVariantCount(definition: FamilyDefinitionShape): number {
  return definition.entries.reduce((n, entry) => n + (entry.spread ? spreadCount(entry.spread) : 1), 0);
}

/** A value as a variant label shows it: four significant digits, no trailing zeros. */
function shortValue(v: number): string {
  return String(Number(v.toPrecision(4)));
}

/**
 * The variant list of a family revision — exactly what a sweep's or a comparison's family holds
 * (sweepFamilySchema's variants), in this order:
 * - entries in the order given; an entry without a spread is one variant as written;
 * - an entry with a spread gives one variant per parameter set of its design over its ranges
 *   (the sweep contract's designs: gridDesign, seededRandomDesign, latinHypercube), parameters
 *   sorted by name (spreadParameterNames). On a grid of counts c₁ × c₂ the first name varies
 *   slowest: variant (j₁, j₂) is the (j₁·c₂ + j₂)-th of the entry. A seeded draw gives the same
 *   variants for the same seed. Each variant's parameters are the entry's fixed values with the
 *   drawn ones, its label the entry's label (or "spread") with the drawn values.
 *
 * Does not check the plants (variantPlant does, when the sweep is planned). Throws a RangeError
 * naming `entries` when the family would exceed MAX_FAMILY_VARIANTS.
 */
export function expandFamily(definition: FamilyDefinitionShape, name?: string): SweepFamily {
  const count = familyVariantCount(definition);
  if (count > MAX_FAMILY_VARIANTS) {
    throw new RangeError(`entries: the family expands to ${count} variants, more than the ${MAX_FAMILY_VARIANTS} a family holds`);
  }
  const variants: SweepFamily["variants"] = [];
  for (const entry of definition.entries) {
    if (!entry.spread) {
      const variant: SweepFamily["variants"][number] = { plantRevisionId: entry.plantRevisionId };
      if (entry.label !== undefined) variant.label = entry.label;
      if (entry.parameters && Object.keys(entry.parameters).length > 0) variant.parameters = { ...entry.parameters };
      variants.push(variant);
      continue;
    }
    const names = spreadParameterNames(entry.spread);
    const space: ParameterSpace = names.map((n) => {
      const r = entry.spread!.ranges[n]!;
      return { name: n, min: r.min, max: r.max, scale: r.scale ?? "linear" };
    });
    const design = entry.spread.design;
    const values =
      design.kind === "grid"
        ? gridDesign(space, names.map((n) => entry.spread!.ranges[n]?.count ?? 1), MAX_FAMILY_VARIANTS)
        : design.kind === "random"
          ? seededRandomDesign(space, design.count, design.seed, MAX_FAMILY_VARIANTS)
          : latinHypercube(space, design.count, design.seed, MAX_FAMILY_VARIANTS);
    const d = names.length;
    for (let i = 0; i < values.length / d; i++) {
      const drawn: Record<string, number> = {};
      names.forEach((n, j) => (drawn[n] = values[i * d + j] as number));
      const label = `${entry.label ?? "spread"} · ${names.map((n) => `${n} ${shortValue(drawn[n] as number)}`).join(", ")}`;
      variants.push({
        plantRevisionId: entry.plantRevisionId,
        label: label.length > MAX_TITLE_LENGTH ? `${label.slice(0, MAX_TITLE_LENGTH - 1)}…` : label,
        parameters: { ...(entry.parameters ?? {}), ...drawn },
      });
    }
  }
  return name === undefined ? { variants } : { name, variants };
}
