import type { FamilySource } from "../sweeps/sweep-input.js";

/** What familyOfSweep reads: a sweep's or a comparison's definition (its plant revision and family). */
export interface FamilyBearing {
  plantRevisionId?: string | undefined;
  family?:
    | {
        name?: string | undefined;
        source?: FamilySource | undefined;
        variants: readonly { plantRevisionId?: string | undefined; label?: string | undefined; parameters?: Readonly<Record<string, number>> | undefined }[];
      }
    | undefined;
}

/** "The family" a sweep or a comparison is about, the one thing decisions and listings key on. */
export interface FamilyIdentity {
  /**
   * Stable key: `family:<familyId>` for a saved family (every revision of it is the same family),
   * else `variants:<…>` from the variants' revisions and parameter values (order-free), so two ad-hoc
   * families with the same variants share a key.
   */
  key: string;
  /** The family's name, else "<n> variants" / the single revision's label. */
  name: string;
  /** The saved family and revision, or null for a family built ad hoc (or a single plant). */
  source: FamilySource | null;
}

/** Canonical text of one variant: its revision and its parameters sorted by name. */
function variantText(variant: { plantRevisionId?: string | undefined; parameters?: Readonly<Record<string, number>> | undefined }): string {
  const params = Object.entries(variant.parameters ?? {})
    .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0))
    .map(([name, value]) => `${name}=${value}`)
    .join(",");
  return `${variant.plantRevisionId ?? "?"}[${params}]`;
}

/**
 * Names the family of a sweep or comparison definition — the one place that says which family a
 * study belongs to. A definition whose family came from the library (family.source) is keyed on
 * the saved family, whatever its revision; otherwise on its variant set (a definition without a
 * family is the one-variant family of its plant revision).
 */
export function familyOfSweep(definition: FamilyBearing): FamilyIdentity {
  const family = definition.family;
  if (family?.source) {
    return { key: `family:${family.source.familyId}`, name: family.name ?? `family revision ${family.source.number}`, source: { ...family.source } };
  }
  const variants = family?.variants ?? [{ plantRevisionId: definition.plantRevisionId }];
  const key = `variants:${variants.map(variantText).sort().join(";")}`;
  const single = variants.length === 1 ? variants[0]?.label : undefined;
  return { key, name: family?.name ?? single ?? `${variants.length} variant${variants.length === 1 ? "" : "s"}`, source: null };
}
