import { Field, inputClass } from "../../components/field.js";
import type { PlantFieldsProps } from "./plant-form-fields.js";

const LIMITS = [
  { key: "min", label: "Lowest u", hint: "saturation below" },
  { key: "max", label: "Highest u", hint: "saturation above" },
  { key: "rate", label: "Fastest change |du/dt| [u/s]", hint: "rate limit, > 0" },
] as const;

/** Optional actuator limits on any plant kind: saturation and rate limit; empty means no limit. */
export function ActuatorFields({ register, errors }: PlantFieldsProps) {
  const e = errors.model?.actuator;
  return (
    <fieldset className="rounded-md border border-line-soft px-3 pb-3 pt-2" data-testid="actuator-fields">
      <legend className="px-1 text-xs font-medium text-ink-soft">Actuator limits (optional)</legend>
      <div className="grid grid-cols-1 gap-4 sm:grid-cols-3">
        {LIMITS.map((l) => (
          <Field key={l.key} label={l.label} htmlFor={`plant-actuator-${l.key}`} name={`model.actuator.${l.key}`} error={e?.[l.key]?.message} hint={l.hint}>
            <input
              id={`plant-actuator-${l.key}`}
              inputMode="decimal"
              placeholder="none"
              className={`${inputClass} font-mono`}
              aria-invalid={Boolean(e?.[l.key])}
              {...register(`model.actuator.${l.key}`)}
            />
          </Field>
        ))}
      </div>
      <p className="mt-2 text-xs text-ink-faint">Leave a box empty for no limit. Sweeps apply saturation first, then the rate limit, and offer anti-windup when limits are set.</p>
    </fieldset>
  );
}
