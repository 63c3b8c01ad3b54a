import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { MAX_NONLINEAR_STATES, type PlantInput } from "@loopyard/core";
import { Button } from "../../components/button.js";
import { RoleNote } from "../../components/role-note.js";
import { ErrorNote } from "../../components/error-note.js";
import { Field, inputClass } from "../../components/field.js";
import { applyServerErrors } from "../../forms/apply-server-errors.js";
import { ActuatorFields } from "./actuator-fields.js";
import { NonlinearFields } from "./nonlinear-fields.js";
import { parseMatrix } from "./matrix-text.js";
import { previewNames } from "./nonlinear-text.js";
import { PLANT_FORM_FIELDS, plantFormResolver, type PlantFormValues } from "./plant-form-values.js";
import { PLANT_KINDS } from "./plant-kind.js";
import { PlantPreview } from "./plant-preview.js";
import { StateSpaceFields } from "./state-space-fields.js";
import { TransferFunctionFields } from "./transfer-function-fields.js";

/**
 * Name, units note, the kind of model and its fields, actuator limits, with a live preview.
 * Checked with the shared plantInputSchema on submit; a 400 from the server lands on the field it names
 * (a refused formula next to its derivative, with the token at fault).
 */
export function PlantForm({
  initial,
  submitLabel,
  pendingLabel,
  onSubmit,
  refusal,
  noteRequired = false,
}: {
  initial: PlantFormValues;
  submitLabel: string;
  pendingLabel: string;
  /** Sends the input; rejects with an ApiError on failure. */
  onSubmit: (input: PlantInput) => Promise<unknown>;
  /** When set, the caller may not submit; the sentence says why. */
  refusal?: string | null;
  /** A new revision must say what changed (the server refuses it otherwise). */
  noteRequired?: boolean;
}) {
  const form = useForm<PlantFormValues, unknown, PlantInput>({ defaultValues: initial, resolver: plantFormResolver });
  const { register, handleSubmit, formState, setError, control } = form;
  const errors = formState.errors;
  const model = useWatch({ control, name: "model" });
  const kind = model?.kind ?? "transfer-function";
  const stateNames = previewNames(model?.states ?? "", MAX_NONLINEAR_STATES);
  const a = parseMatrix(model?.A ?? "", "A");
  const order = a.ok ? a.rows.length : null;
  /** A refusal or failure that names no field (403, 404, network), shown above the form. */
  const [failure, setFailure] = useState<unknown>(null);

  const submit = handleSubmit(async (input) => {
    setFailure(null);
    if (noteRequired && !input.note?.trim()) {
      setError("note", { type: "required", message: "say what changed in this revision and why" });
      return;
    }
    try {
      await onSubmit(input);
    } catch (error) {
      if (!applyServerErrors(error, PLANT_FORM_FIELDS, setError)) setFailure(error);
    }
  });

  return (
    <form onSubmit={submit} noValidate className="grid grid-cols-1 gap-6 lg:grid-cols-5" data-testid="plant-form" data-kind={kind}>
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

        <Field
          label={noteRequired ? "Change note" : "Change note (optional)"}
          htmlFor="plant-note"
          name="note"
          error={errors.note?.message}
          hint={noteRequired ? "What changed and why — e.g. refitted from the March step test; dead time 0.8 s" : "Where the model comes from — e.g. fitted from the bench step test"}
        >
          <input id="plant-note" className={inputClass} aria-invalid={Boolean(errors.note)} data-testid="plant-note" {...register("note")} />
        </Field>

        <fieldset data-testid="plant-kind">
          <legend className="mb-1 block text-xs font-medium text-ink-soft">Model</legend>
          <div className="grid grid-cols-1 gap-2 sm:grid-cols-3">
            {PLANT_KINDS.map((k) => (
              <label
                key={k.kind}
                className={`flex cursor-pointer flex-col gap-0.5 rounded-md border px-3 py-2 text-sm ${kind === k.kind ? "border-moss bg-moss-wash" : "border-line bg-white hover:border-ink-faint"}`}
              >
                <span className="flex items-center gap-2 font-medium">
                  <input type="radio" value={k.kind} className="accent-moss" data-testid={`plant-kind-${k.kind}`} {...register("model.kind")} />
                  {k.label}
                </span>
                <span className="pl-5 text-xs text-ink-soft">{k.summary}</span>
              </label>
            ))}
          </div>
        </fieldset>

        {kind === "transfer-function" ? <TransferFunctionFields register={register} errors={errors} /> : null}
        {kind === "state-space" ? <StateSpaceFields register={register} errors={errors} order={order} /> : null}
        {kind === "nonlinear" ? <NonlinearFields register={register} errors={errors} stateNames={stateNames} /> : null}
        <ActuatorFields register={register} errors={errors} />

        <div className="flex items-center gap-3 pt-2">
          <Button type="submit" tone="primary" disabled={formState.isSubmitting || Boolean(refusal)} data-testid="plant-submit">
            {formState.isSubmitting ? pendingLabel : submitLabel}
          </Button>
        </div>
      </div>
      <aside className="lg:col-span-2">
        <div className="sticky top-20">
          <PlantPreview model={model} stateNames={stateNames} />
        </div>
      </aside>
    </form>
  );
}
