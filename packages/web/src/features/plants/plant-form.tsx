import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import type { PlantInput } from "@loopyard/core";
import { Button } from "../../components/button.js";
import { RoleNote } from "../../components/role-note.js";
import { ErrorNote } from "../../components/error-note.js";
import { Field, inputClass } from "../../components/field.js";
import { applyServerErrors } from "../../forms/apply-server-errors.js";
import { parseCoefficients } from "./coefficient-text.js";
import { PLANT_FORM_FIELDS, plantFormResolver, type PlantFormValues } from "./plant-form-values.js";
import { TransferFunctionView } from "./transfer-function-view.js";

/**
 * Name, units note, coefficients and dead time of a transfer-function plant, with a live preview
 * of G(s). Checked with the shared schema on submit; a 400 from the server lands on the field it names.
 */
export function PlantForm({
  initial,
  submitLabel,
  pendingLabel,
  onSubmit,
  refusal,
}: {
  initial: PlantFormValues;
  submitLabel: string;
  pendingLabel: string;
  /** Sends the input; rejects with an ApiError on failure. */
  onSubmit: (input: PlantInput) => Promise<unknown>;
  /** When set, the caller may not submit; the sentence says why. */
  refusal?: string | null;
}) {
  const form = useForm<PlantFormValues, unknown, PlantInput>({ defaultValues: initial, resolver: plantFormResolver });
  const { register, handleSubmit, formState, setError, control } = form;
  const errors = formState.errors;
  const model = useWatch({ control, name: "model" });
  /** A refusal or failure that names no field (403, 404, network), shown above the form. */
  const [failure, setFailure] = useState<unknown>(null);

  const submit = handleSubmit(async (input) => {
    setFailure(null);
    try {
      await onSubmit(input);
    } catch (error) {
      if (!applyServerErrors(error, PLANT_FORM_FIELDS, setError)) setFailure(error);
    }
  });

  return (
    <form onSubmit={submit} noValidate className="grid grid-cols-1 gap-6 lg:grid-cols-5" data-testid="plant-form">
      <div className="space-y-5 lg:col-span-3">
        {refusal ? <RoleNote sentence={refusal} /> : null}
        {failure ? <ErrorNote error={failure} title="The plant was not saved" /> : null}
        {errors.root?.server?.message || errors.root?.message ? (
          <p role="alert" data-testid="form-error" className="rounded-md border border-rust/40 bg-rust-wash px-4 py-2.5 text-sm text-rust">
            {errors.root?.server?.message ?? errors.root?.message}
          </p>
        ) : null}
        <Field label="Name" htmlFor="plant-name" name="name" error={errors.name?.message} hint="e.g. Ember 200 plate">
          <input id="plant-name" className={inputClass} aria-invalid={Boolean(errors.name)} {...register("name")} />
        </Field>
        <Field
          label="Units note"
          htmlFor="plant-units"
          name="unitsNote"
          error={errors.unitsNote?.message}
          hint="What u and y stand for, with units — e.g. u: heater power fraction [0–1]; y: plate temperature rise [K]"
        >
          <textarea id="plant-units" rows={2} className={inputClass} aria-invalid={Boolean(errors.unitsNote)} {...register("unitsNote")} />
        </Field>
        <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
          <Field
            label="Numerator coefficients"
            htmlFor="plant-num"
            name="model.num"
            error={errors.model?.num?.message}
            hint="Descending powers of s, separated by spaces or commas"
          >
            <input id="plant-num" className={`${inputClass} font-mono`} placeholder="1.2" aria-invalid={Boolean(errors.model?.num)} {...register("model.num")} />
          </Field>
          <Field
            label="Denominator coefficients"
            htmlFor="plant-den"
            name="model.den"
            error={errors.model?.den?.message}
            hint="e.g. 16 10 1 for 16s² + 10s + 1"
          >
            <input id="plant-den" className={`${inputClass} font-mono`} placeholder="16 10 1" aria-invalid={Boolean(errors.model?.den)} {...register("model.den")} />
          </Field>
        </div>
        <Field label="Dead time θ [s]" htmlFor="plant-delay" name="model.delay" error={errors.model?.delay?.message} hint="0 when the plant has none" className="max-w-48">
          <input id="plant-delay" inputMode="decimal" className={`${inputClass} font-mono`} aria-invalid={Boolean(errors.model?.delay)} {...register("model.delay")} />
        </Field>
        <div className="flex items-center gap-3 pt-2">
          <Button type="submit" tone="primary" disabled={formState.isSubmitting || Boolean(refusal)} data-testid="plant-submit">
            {formState.isSubmitting ? pendingLabel : submitLabel}
          </Button>
        </div>
      </div>
      <aside className="lg:col-span-2">
        <div className="sticky top-20 rounded-lg border border-line bg-sheet p-4">
          <div className="mb-3 text-xs font-medium uppercase tracking-wide text-ink-soft">Preview</div>
          <Preview num={model?.num ?? ""} den={model?.den ?? ""} delay={model?.delay ?? ""} />
          <p className="mt-4 text-xs text-ink-faint">
            Input u to output y. Loopyard checks that the plant is proper (numerator degree ≤ denominator degree), of order at most 10, with a non-zero
            leading denominator coefficient.
          </p>
        </div>
      </aside>
    </form>
  );
}

function Preview({ num, den, delay }: { num: string; den: string; delay: string }) {
  const n = parseCoefficients(num);
  const d = parseCoefficients(den);
  const theta = Number(delay.trim() === "" ? 0 : delay);
  if (!n.ok || !d.ok) {
    return (
      <p className="font-mono text-sm text-ink-faint" data-testid="plant-preview">
        G(s) = … <span className="font-sans">— type both coefficient lists to see the plant</span>
      </p>
    );
  }
  return (
    <div data-testid="plant-preview" className="overflow-x-auto">
      <TransferFunctionView num={n.values} den={d.values} delay={Number.isFinite(theta) && theta > 0 ? theta : 0} testId="plant-preview-tf" />
    </div>
  );
}
