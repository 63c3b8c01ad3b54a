import { useMemo, useState } from "react";
import { MAX_FAMILY_VARIANTS, type FamilyInput, type PlantSummaryDto } from "@loopyard/core";
import { isApiError } from "../../api/api-error.js";
import { Button } from "../../components/button.js";
import { ErrorNote } from "../../components/error-note.js";
import { Field, inputClass } from "../../components/field.js";
import { RoleNote } from "../../components/role-note.js";
import { Section } from "../../components/section.js";
import { FamilyEntryRow } from "./family-entry-row.js";
import { blankEntry, entryProblems, formVariantCount, readFamilyForm, type FamilyFormValues } from "./family-form-values.js";

/**
 * Name, description, change note and the entries of a family, with the variant count they
 * expand to (core expandFamily, as the server will). Checked with the shared familyInputSchema;
 * a 400 from the server lands beside the entry or field it names.
 */
export function FamilyForm({
  slug,
  plants,
  initial,
  submitLabel,
  noteRequired,
  refusal,
  onSubmit,
}: {
  slug: string;
  plants: readonly PlantSummaryDto[];
  initial: FamilyFormValues;
  submitLabel: string;
  noteRequired: boolean;
  refusal: string | null;
  onSubmit: (input: FamilyInput) => Promise<unknown>;
}) {
  const [values, setValues] = useState(initial);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [failure, setFailure] = useState<unknown>(null);
  const [pending, setPending] = useState(false);
  const counted = useMemo(() => formVariantCount(values), [values]);
  const count = Number.isFinite(counted) ? counted : null;

  const submit = async (event: React.FormEvent) => {
    event.preventDefault();
    setFailure(null);
    const result = readFamilyForm(values);
    const problems: Record<string, string> = result.ok ? {} : { ...result.errors };
    if (noteRequired && !values.note.trim()) problems.note = "say what changed in this revision and why";
    setErrors(problems);
    if (!result.ok || Object.keys(problems).length > 0) return;
    setPending(true);
    try {
      await onSubmit(result.input);
    } catch (error) {
      if (isApiError(error) && error.field) setErrors({ [error.field]: error.message });
      else setFailure(error);
    } finally {
      setPending(false);
    }
  };

  const firstPlant = plants[0];
  const generalProblems = Object.entries(errors).filter(([field]) => field === "definition.entries" || field === "definition");
  return (
    <form onSubmit={(e) => void submit(e)} noValidate className="grid grid-cols-1 gap-6 lg:grid-cols-3" data-testid="family-form">
      <div className="space-y-6 lg:col-span-2">
        {refusal ? <RoleNote sentence={refusal} /> : null}
        {failure ? <ErrorNote error={failure} title="The family was not saved" /> : null}
        <Section title="The family">
          <div className="grid grid-cols-1 gap-4">
            <Field label="Name" htmlFor="family-name" name="name" error={errors.name} hint="e.g. Ember line">
              <input id="family-name" className={inputClass} value={values.name} onChange={(e) => setValues({ ...values, name: e.target.value })} data-testid="family-name" />
            </Field>
            <Field label="Description" htmlFor="family-description" name="description" error={errors.description} hint="what the variants stand for">
              <textarea id="family-description" rows={2} className={inputClass} value={values.description} onChange={(e) => setValues({ ...values, description: e.target.value })} />
            </Field>
            <Field
              label={noteRequired ? "Change note" : "Change note (optional)"}
              htmlFor="family-note"
              name="note"
              error={errors.note}
              hint={noteRequired ? "what changed and why — e.g. adds the 1200 plate" : "where the variants come from"}
            >
              <input id="family-note" className={inputClass} value={values.note} onChange={(e) => setValues({ ...values, note: e.target.value })} data-testid="family-note" />
            </Field>
          </div>
        </Section>
        <Section title="Variants" aside="each entry is one variant, or several with a spread">
          <div className="space-y-3">
            {values.entries.map((entry, i) => (
              <FamilyEntryRow
                key={i}
                index={i}
                slug={slug}
                plants={plants}
                value={entry}
                problems={entryProblems(errors, i)}
                onChange={(next) => setValues((v) => ({ ...v, entries: v.entries.map((e, j) => (j === i ? next : e)) }))}
                onRemove={values.entries.length > 1 ? () => setValues((v) => ({ ...v, entries: v.entries.filter((_, j) => j !== i) })) : null}
              />
            ))}
          </div>
          {generalProblems.map(([field, message]) => (
            <p key={field} role="alert" className="mt-2 text-xs text-rust" data-testid="family-entries-error">
              {message}
            </p>
          ))}
          <Button
            className="mt-3"
            disabled={!firstPlant || values.entries.length >= MAX_FAMILY_VARIANTS}
            onClick={() => firstPlant && setValues((v) => ({ ...v, entries: [...v.entries, blankEntry(firstPlant.id, firstPlant.latestRevision.id, firstPlant.name)] }))}
            data-testid="add-family-entry"
          >
            Add an entry
          </Button>
        </Section>
      </div>
      <aside>
        <div className="sticky top-20 space-y-4 rounded-lg border border-line bg-sheet p-5">
          <div>
            <div className="text-xs font-medium uppercase tracking-wide text-ink-soft">Variants</div>
            <div className={`font-mono text-3xl tabular ${count !== null && count > MAX_FAMILY_VARIANTS ? "text-rust" : "text-ink"}`} data-testid="family-variant-count">
              {count ?? "—"}
            </div>
            <p className="text-xs text-ink-soft">A family holds at most {MAX_FAMILY_VARIANTS} variants; every candidate of a sweep is simulated on each.</p>
          </div>
          <Button type="submit" tone="primary" className="w-full" disabled={pending || Boolean(refusal)} data-testid="family-submit">
            {pending ? "Saving…" : submitLabel}
          </Button>
        </div>
      </aside>
    </form>
  );
}
