import { familyInputSchema, familyVariantCount, type FamilyInput, type FamilyRevisionDto } from "@loopyard/core";
import { formatOverrides, parseOverrides } from "../sweeps/sweep-design-values.js";

/** One spread parameter as typed. */
export interface SpreadRowValues {
  name: string;
  min: string;
  max: string;
  count: string;
}

/** One entry of the family form: a plant revision, label, fixed values and an optional spread. */
export interface FamilyEntryValues {
  plantId: string;
  plantRevisionId: string;
  label: string;
  /** "name = value, …" (nonlinear plants only). */
  parameters: string;
  spreadOn: boolean;
  spread: { rows: SpreadRowValues[]; design: "grid" | "random" | "latin-hypercube"; count: string; seed: string };
}

export interface FamilyFormValues {
  name: string;
  description: string;
  note: string;
  entries: FamilyEntryValues[];
}

export const EMPTY_SPREAD: FamilyEntryValues["spread"] = { rows: [{ name: "", min: "", max: "", count: "3" }], design: "grid", count: "6", seed: "1" };

/** A blank entry on this plant revision. */
export function blankEntry(plantId: string, plantRevisionId: string, label: string): FamilyEntryValues {
  return { plantId, plantRevisionId, label, parameters: "", spreadOn: false, spread: { ...EMPTY_SPREAD, rows: EMPTY_SPREAD.rows.map((r) => ({ ...r })) } };
}

/** A saved revision as form values (for "New revision"); the note starts empty, as a new one is required. */
export function familyFormFromRevision(revision: FamilyRevisionDto, plantOf: (plantRevisionId: string) => string): FamilyFormValues {
  return {
    name: revision.name,
    description: revision.description,
    note: "",
    entries: revision.definition.entries.map((e) => {
      const spread = e.spread;
      const design = spread?.design ?? { kind: "grid" as const };
      return {
        plantId: plantOf(e.plantRevisionId),
        plantRevisionId: e.plantRevisionId,
        label: e.label ?? "",
        parameters: e.parameters ? formatOverrides(e.parameters) : "",
        spreadOn: spread !== undefined,
        spread: spread
          ? {
              rows: Object.entries(spread.ranges).map(([name, r]) => ({ name, min: String(r.min), max: String(r.max), count: String(r.count ?? 1) })),
              design: design.kind,
              count: design.kind === "grid" ? "6" : String(design.count),
              seed: design.kind === "grid" ? "1" : String(design.seed),
            }
          : { ...EMPTY_SPREAD, rows: EMPTY_SPREAD.rows.map((r) => ({ ...r })) },
      };
    }),
  };
}

const num = (text: string): number => (text.trim() === "" ? Number.NaN : Number(text.replace(/\u2212/g, "-")));

/**
 * The form as a FamilyInput checked with the shared familyInputSchema: the input, or the problems
 * keyed by the schema's dotted field ("definition.entries.1.spread.ranges.c.max", "name" …).
 */
export function readFamilyForm(values: FamilyFormValues): { ok: true; input: FamilyInput } | { ok: false; errors: Record<string, string> } {
  const errors: Record<string, string> = {};
  const entries = values.entries.map((e, i) => {
    const entry: FamilyInput["definition"]["entries"][number] = { plantRevisionId: e.plantRevisionId };
    if (e.label.trim()) entry.label = e.label.trim();
    const fixed = parseOverrides(e.parameters);
    if (!fixed.ok) errors[`definition.entries.${i}.parameters`] = fixed.message;
    else if (Object.keys(fixed.values).length > 0) entry.parameters = fixed.values;
    if (e.spreadOn) {
      const ranges: Record<string, { min: number; max: number; count: number }> = {};
      for (const row of e.spread.rows) if (row.name.trim()) ranges[row.name.trim()] = { min: num(row.min), max: num(row.max), count: e.spread.design === "grid" ? num(row.count) : 1 };
      entry.spread = {
        ranges,
        design: e.spread.design === "grid" ? { kind: "grid" } : { kind: e.spread.design, count: num(e.spread.count), seed: num(e.spread.seed) },
      };
    }
    return entry;
  });
  const input: FamilyInput = { name: values.name, description: values.description, definition: { entries } };
  if (values.note.trim()) input.note = values.note.trim();
  const parsed = familyInputSchema.safeParse(input);
  if (!parsed.success) for (const issue of parsed.error.issues) errors[issue.path.join(".")] ??= issue.message;
  return Object.keys(errors).length > 0 ? { ok: false, errors } : { ok: true, input };
}

/** Problems of one entry (fields under definition.entries.<i>), as "field: message" lines. */
export function entryProblems(errors: Record<string, string>, i: number): string[] {
  const prefix = `definition.entries.${i}.`;
  return Object.entries(errors)
    .filter(([field]) => field.startsWith(prefix))
    .map(([field, message]) => `${field.slice(prefix.length)}: ${message}`);
}

/** How many variants the form expands to as typed (NaN while a count does not read), even beyond the limit. */
export function formVariantCount(values: FamilyFormValues): number {
  return familyVariantCount({
    entries: values.entries.map((e) => ({
      plantRevisionId: e.plantRevisionId,
      spread: e.spreadOn
        ? {
            ranges: Object.fromEntries(e.spread.rows.filter((r) => r.name.trim()).map((r) => [r.name, { min: 0, max: 1, count: num(r.count) }])),
            design: e.spread.design === "grid" ? { kind: "grid" as const } : { kind: e.spread.design, count: num(e.spread.count), seed: 0 },
          }
        : undefined,
    })),
  });
}
