import { Field, inputClass } from "../../components/field.js";
import type { PlantFieldsProps } from "./plant-form-fields.js";

/** Numerator, denominator and dead time of a transfer-function plant. */
export function TransferFunctionFields({ register, errors }: PlantFieldsProps) {
  return (
    <>
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
        <Field label="Denominator coefficients" htmlFor="plant-den" name="model.den" error={errors.model?.den?.message} hint="e.g. 16 10 1 for 16s² + 10s + 1">
          <input id="plant-den" className={`${inputClass} font-mono`} placeholder="16 10 1" aria-invalid={Boolean(errors.model?.den)} {...register("model.den")} />
        </Field>
      </div>
      <Field label="Dead time θ [s]" htmlFor="plant-delay" name="model.delay" error={errors.model?.delay?.message} hint="0 when the plant has none" className="max-w-48">
        <input id="plant-delay" inputMode="decimal" className={`${inputClass} font-mono`} aria-invalid={Boolean(errors.model?.delay)} {...register("model.delay")} />
      </Field>
    </>
  );
}
