import { useEffect } from "react";
import { useFieldArray, useWatch, type Control, type FieldErrors, type UseFormRegister, type UseFormSetValue } from "react-hook-form";
import { MAX_FAMILY_VARIANTS, type PlantSummaryDto } from "@loopyard/core";
import { usePlant } from "../../api/use-plants.js";
import { Button } from "../../components/button.js";
import { Field, inputClass } from "../../components/field.js";
import { FieldErrorText } from "./field-error-text.js";
import type { SweepFormValues } from "./sweep-form-values.js";

const OVERRIDES_HINT = "name = value, separated by commas; leave empty to keep the revision's values";

/**
 * The family's variants after the first (the plant and revision above it): each a plant revision
 * with a label and, for a nonlinear plant, overrides of its parameters. Every candidate is scored
 * on every variant.
 */
export function FamilyVariants({
  slug,
  plants,
  control,
  register,
  setValue,
  errors,
}: {
  slug: string;
  plants: readonly PlantSummaryDto[];
  control: Control<SweepFormValues, unknown, unknown>;
  register: UseFormRegister<SweepFormValues>;
  setValue: UseFormSetValue<SweepFormValues>;
  errors: FieldErrors<SweepFormValues>;
}) {
  const { fields, append, remove } = useFieldArray({ control, name: "variants" });
  const full = fields.length + 1 >= MAX_FAMILY_VARIANTS;
  const next = plants[(fields.length + 1) % plants.length] ?? plants[0];
  return (
    <div className="mt-4 border-t border-line-soft pt-4" data-testid="family-variants">
      <div className="mb-2 flex items-baseline justify-between gap-3">
        <span className="text-xs font-medium text-ink-soft">Other variants of the family</span>
        <span className="text-xs text-ink-faint">
          {fields.length === 0 ? "none: a one-plant sweep" : `${fields.length + 1} variants; every candidate is scored on each`}
        </span>
      </div>
      <div className="space-y-3">
        {fields.map((field, i) => (
          <VariantRow key={field.id} index={i} slug={slug} plants={plants} control={control} register={register} setValue={setValue} errors={errors} onRemove={() => remove(i)} />
        ))}
      </div>
      <Button
        className="mt-3"
        disabled={full || !next}
        title={full ? `A family holds at most ${MAX_FAMILY_VARIANTS} variants.` : undefined}
        onClick={() => next && append({ plantId: next.id, plantRevisionId: next.latestRevision.id, label: next.name, labelTyped: false, parameters: "" })}
        data-testid="add-variant"
      >
        Add a variant
      </Button>
      <FieldErrorText field="variants" message={errors.variants?.message ?? errors.variants?.root?.message} />
    </div>
  );
}

function VariantRow({
  index,
  slug,
  plants,
  control,
  register,
  setValue,
  errors,
  onRemove,
}: {
  index: number;
  slug: string;
  plants: readonly PlantSummaryDto[];
  control: Control<SweepFormValues, unknown, unknown>;
  register: UseFormRegister<SweepFormValues>;
  setValue: UseFormSetValue<SweepFormValues>;
  errors: FieldErrors<SweepFormValues>;
  onRemove: () => void;
}) {
  const plantId = useWatch({ control, name: `variants.${index}.plantId` });
  const revisionId = useWatch({ control, name: `variants.${index}.plantRevisionId` });
  const plant = usePlant(slug, plantId || undefined);
  const summary = plants.find((p) => p.id === plantId);
  const e = errors.variants?.[index];
  const labelTyped = useWatch({ control, name: `variants.${index}.labelTyped` });
  // The label follows the chosen plant's name until the user types one (a cleared label follows again).
  useEffect(() => {
    if (!labelTyped && summary) setValue(`variants.${index}.label`, summary.name);
  }, [summary, labelTyped, index, setValue]);
  // A newly chosen plant starts at its latest revision.
  useEffect(() => {
    if (plant.data && !plant.data.revisions.some((r) => r.id === revisionId)) {
      setValue(`variants.${index}.plantRevisionId`, plant.data.plant.latestRevision.id);
    }
  }, [plant.data, revisionId, index, setValue]);
  return (
    <div className="grid grid-cols-1 items-start gap-3 rounded-md border border-line-soft bg-white/60 p-3 sm:grid-cols-[1fr_7rem_1fr_auto]" data-testid="variant-row-form">
      <Field label={`Variant ${index + 2}: plant`} htmlFor={`variant-${index}-plant`} name={`variants.${index}.plantId`}>
        <select id={`variant-${index}-plant`} className={inputClass} data-testid={`variant-${index}-plant`} {...register(`variants.${index}.plantId`)}>
          {plants.map((p) => (
            <option key={p.id} value={p.id}>
              {p.name}
            </option>
          ))}
        </select>
      </Field>
      <Field label="Revision" htmlFor={`variant-${index}-revision`} name={`variants.${index}.plantRevisionId`} error={e?.plantRevisionId?.message}>
        <select id={`variant-${index}-revision`} className={inputClass} {...register(`variants.${index}.plantRevisionId`)}>
          {plant.data
            ? [...plant.data.revisions]
                .sort((a, b) => b.number - a.number)
                .map((r) => (
                  <option key={r.id} value={r.id}>
                    rev {r.number}
                  </option>
                ))
            : <option value={revisionId}>…</option>}
        </select>
      </Field>
      <Field label="Label" htmlFor={`variant-${index}-label`} name={`variants.${index}.label`} error={e?.label?.message}>
        <input id={`variant-${index}-label`} className={inputClass} data-testid={`variant-${index}-label`} {...register(`variants.${index}.label`, { onChange: (event: { target: { value: string } }) => setValue(`variants.${index}.labelTyped`, event.target.value.trim() !== "") })} />
      </Field>
      <Button tone="plain" className="mt-5" onClick={onRemove} aria-label={`Remove variant ${index + 2}`}>
        Remove
      </Button>
      {summary?.kind === "nonlinear" ? (
        <Field
          label="Parameter overrides"
          htmlFor={`variant-${index}-parameters`}
          name={`variants.${index}.parameters`}
          error={e?.parameters?.message}
          hint={OVERRIDES_HINT}
          className="sm:col-span-4"
        >
          <input id={`variant-${index}-parameters`} className={`${inputClass} font-mono`} placeholder="e.g. area = 1.2, k = 0.8" {...register(`variants.${index}.parameters`)} />
        </Field>
      ) : null}
    </div>
  );
}

export { OVERRIDES_HINT };
