import type { FamilyRevisionDto, FamilySummaryDto } from "@loopyard/core";
import { Field, inputClass } from "../../components/field.js";
import { FamilyVariantsTable } from "../families/family-variants-table.js";

/**
 * Chooses a saved family of the library (its latest revision; archived families are not offered)
 * or "build one here". With a saved family chosen, its variants are listed read-only: the server
 * expands the same revision when the sweep or comparison starts.
 */
export function SavedFamilyPicker({
  slug,
  families,
  chosen,
  onChoose,
}: {
  slug: string;
  families: readonly FamilySummaryDto[];
  chosen: FamilyRevisionDto | null;
  onChoose: (revision: FamilyRevisionDto | null) => void;
}) {
  const offered = families.filter((f) => f.archivedAt === null).map((f) => f.latestRevision);
  // A copied sweep may name an older (or archived) revision: keep it offered.
  if (chosen && !offered.some((r) => r.id === chosen.id)) offered.unshift(chosen);
  return (
    <div data-testid="saved-family-picker">
      <Field
        label="Family"
        htmlFor="saved-family"
        name="familyRevisionId"
        hint={chosen ? "variants from the library; revise the family to change them" : "build the variants below, or choose a family saved in the library"}
      >
        <select
          id="saved-family"
          className={inputClass}
          value={chosen?.id ?? ""}
          onChange={(e) => onChoose(offered.find((r) => r.id === e.target.value) ?? null)}
          data-testid="saved-family"
        >
          <option value="">Build one here</option>
          {offered.map((r) => (
            <option key={r.id} value={r.id}>
              {r.name} · rev {r.number} · {r.variants.length} variant{r.variants.length === 1 ? "" : "s"}
            </option>
          ))}
        </select>
      </Field>
      {chosen ? (
        <div className="mt-3">
          <FamilyVariantsTable slug={slug} variants={chosen.variants} testId="saved-family-variants" />
        </div>
      ) : null}
    </div>
  );
}
