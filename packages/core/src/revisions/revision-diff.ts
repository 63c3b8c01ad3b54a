import { expandFamily, type FamilyDefinitionShape } from "../families/expand-family.js";
import type { Plant } from "../plants/plant.js";

/** Which part of a revision a change touches, for grouping on a page. */
export type RevisionChangeGroup = "description" | "coefficients" | "matrices" | "expressions" | "parameters" | "limits" | "variants";

/**
 * One difference between two revisions: the dotted path of the field (`model.den`, `model.A.0.1`,
 * `model.derivatives.1`, `model.actuator.max`, `variants.2.parameters.heaterMass`), what happened
 * to it, and its values before and after (absent when added or removed).
 */
export interface RevisionChange {
  field: string;
  group: RevisionChangeGroup;
  change: "added" | "removed" | "changed";
  before?: unknown;
  after?: unknown;
}

type Json = null | boolean | number | string | Json[] | { [key: string]: Json };

const MODEL_GROUPS: Record<string, RevisionChangeGroup> = {
  kind: "coefficients",
  num: "coefficients",
  den: "coefficients",
  delay: "coefficients",
  A: "matrices",
  B: "matrices",
  C: "matrices",
  D: "matrices",
  states: "expressions",
  derivatives: "expressions",
  output: "expressions",
  initial: "expressions",
  operatingInput: "expressions",
  parameters: "parameters",
  actuator: "limits",
};

function isObject(v: unknown): v is Record<string, Json> {
  return typeof v === "object" && v !== null && !Array.isArray(v);
}

/** Same value: numbers by Object.is except 0 = −0, the rest structurally. */
function same(a: unknown, b: unknown): boolean {
  if (typeof a === "number" && typeof b === "number") return a === b || (Number.isNaN(a) && Number.isNaN(b));
  if (Array.isArray(a) && Array.isArray(b)) return a.length === b.length && a.every((x, i) => same(x, b[i]));
  if (isObject(a) && isObject(b)) {
    const keys = new Set([...Object.keys(a), ...Object.keys(b)]);
    return [...keys].every((k) => same(a[k], b[k]));
  }
  return a === b;
}

/** An array whose shape is its meaning (coefficients by power, a matrix): a change of length is one change of the whole. */
function shapeBound(value: unknown): boolean {
  return Array.isArray(value) && value.every((x) => typeof x === "number" || (Array.isArray(x) && x.every((y) => typeof y === "number")));
}

function dims(value: unknown[]): string {
  return Array.isArray(value[0]) ? `${value.length}×${(value[0] as unknown[]).length}` : String(value.length);
}

/**
 * Leaf differences of two JSON values under `path`: objects key by key (sorted), arrays of numbers
 * and matrices entry by entry when their shapes agree and as a whole when they do not, other arrays
 * index by index.
 */
function diffValues(before: unknown, after: unknown, path: string, group: (field: string) => RevisionChangeGroup, out: RevisionChange[]): void {
  if (same(before, after)) return;
  const push = (change: RevisionChange["change"]) => {
    const c: RevisionChange = { field: path, group: group(path), change };
    if (change !== "added") c.before = before;
    if (change !== "removed") c.after = after;
    out.push(c);
  };
  if (before === undefined) return push("added");
  if (after === undefined) return push("removed");
  if (isObject(before) && isObject(after)) {
    for (const key of [...new Set([...Object.keys(before), ...Object.keys(after)])].sort()) {
      diffValues(before[key], after[key], path ? `${path}.${key}` : key, group, out);
    }
    return;
  }
  if (Array.isArray(before) && Array.isArray(after)) {
    if (shapeBound(before) && shapeBound(after) && (before.length !== after.length || dims(before) !== dims(after))) return push("changed");
    const n = Math.max(before.length, after.length);
    for (let i = 0; i < n; i++) diffValues(before[i], after[i], `${path}.${i}`, group, out);
    return;
  }
  push("changed");
}

function modelGroup(field: string): RevisionChangeGroup {
  const key = field.split(".")[1] ?? "";
  return MODEL_GROUPS[key] ?? "description";
}

/** What diffPlantRevisions compares: a plant revision's name, units note and model. */
export interface PlantRevisionContent {
  name: string;
  unitsNote: string;
  model: Plant;
}

/**
 * The changes from plant revision `before` to `after`: name and units note, then the model's
 * coefficients and dead time, matrices (entry by entry when the dimensions agree, else the whole
 * matrix), expressions, states and initial values, parameters and actuator limits. A change of
 * kind replaces the whole model. Pure; the same two revisions give the same list, sorted by field.
 */
export function diffPlantRevisions(before: PlantRevisionContent, after: PlantRevisionContent): RevisionChange[] {
  const out: RevisionChange[] = [];
  diffValues(before.name, after.name, "name", () => "description", out);
  diffValues(before.unitsNote, after.unitsNote, "unitsNote", () => "description", out);
  if (before.model.kind !== after.model.kind) {
    out.push({ field: "model", group: "coefficients", change: "changed", before: before.model, after: after.model });
    return out;
  }
  diffValues(before.model, after.model, "model", modelGroup, out);
  return out;
}

/** What diffFamilyRevisions compares: a family revision's name, description and definition. */
export interface FamilyRevisionContent {
  name: string;
  description: string;
  definition: FamilyDefinitionShape;
}

/** Variant identity across revisions: its plant revision and label. */
function variantKey(v: { plantRevisionId: string; label?: string | undefined }): string {
  return `${v.plantRevisionId}\u0000${v.label ?? ""}`;
}

/**
 * The changes from family revision `before` to `after`: name and description, then the variant
 * set both revisions expand to (expandFamily) — variants matched by plant revision and label,
 * each added, removed, or changed in its parameter values (`variants.<label>.parameters.<name>`),
 * and the entries' spreads (`entries.<i>.spread…`) where the rules that generate variants changed.
 */
export function diffFamilyRevisions(before: FamilyRevisionContent, after: FamilyRevisionContent): RevisionChange[] {
  const out: RevisionChange[] = [];
  diffValues(before.name, after.name, "name", () => "description", out);
  diffValues(before.description, after.description, "description", () => "description", out);
  const a = expandFamily(before.definition).variants;
  const b = expandFamily(after.definition).variants;
  const bKeys = new Map(b.map((v) => [variantKey(v), v]));
  const aKeys = new Set(a.map(variantKey));
  const name = (v: { plantRevisionId: string; label?: string | undefined }) => v.label ?? v.plantRevisionId;
  for (const v of a) {
    const match = bKeys.get(variantKey(v));
    if (!match) out.push({ field: `variants.${name(v)}`, group: "variants", change: "removed", before: v });
    else diffValues(v.parameters ?? {}, match.parameters ?? {}, `variants.${name(v)}.parameters`, () => "variants", out);
  }
  for (const v of b) if (!aKeys.has(variantKey(v))) out.push({ field: `variants.${name(v)}`, group: "variants", change: "added", after: v });
  const n = Math.max(before.definition.entries.length, after.definition.entries.length);
  for (let i = 0; i < n; i++) {
    diffValues(before.definition.entries[i]?.spread, after.definition.entries[i]?.spread, `entries.${i}.spread`, () => "variants", out);
  }
  return out;
}
