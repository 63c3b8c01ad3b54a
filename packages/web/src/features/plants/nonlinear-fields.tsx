import { Field, inputClass } from "../../components/field.js";
import type { PlantFieldsProps } from "./plant-form-fields.js";

/**
 * A nonlinear plant as formulas: state names, "name = value" parameters, one derivative and one
 * initial value per state, the output formula and the operating input.
 */
export function NonlinearFields({ register, errors, stateNames }: PlantFieldsProps & { stateNames: readonly string[] }) {
  const e = errors.model;
  return (
    <div className="space-y-4">
      <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
        <Field label="States" htmlFor="plant-states" name="model.states" error={e?.states?.message} hint="Names separated by spaces or commas, e.g. h or T1, T2">
          <input id="plant-states" spellCheck={false} className={`${inputClass} font-mono`} placeholder="h" aria-invalid={Boolean(e?.states)} {...register("model.states")} />
        </Field>
        <Field
          label="Parameters"
          htmlFor="plant-parameters"
          name="model.parameters"
          error={e?.parameters?.message}
          hint="One per line: name = value"
        >
          <textarea
            id="plant-parameters"
            rows={3}
            spellCheck={false}
            className={`${inputClass} font-mono leading-relaxed`}
            placeholder={"a = 0.8\nb = 1.5\nA = 2"}
            aria-invalid={Boolean(e?.parameters)}
            {...register("model.parameters")}
          />
        </Field>
      </div>

      <fieldset className="rounded-md border border-line-soft px-3 pb-3 pt-2" data-testid="derivative-fields">
        <legend className="px-1 text-xs font-medium text-ink-soft">Derivatives and initial state</legend>
        {stateNames.length === 0 ? (
          <p className="text-sm text-ink-faint">Name the states above; one line per state appears here.</p>
        ) : (
          <div className="grid grid-cols-[max-content_1fr_7rem] items-start gap-x-3 gap-y-3">
            <span />
            <span className="text-[11px] font-medium uppercase tracking-wide text-ink-faint">formula</span>
            <span className="text-[11px] font-medium uppercase tracking-wide text-ink-faint">value at t = 0</span>
            {stateNames.map((name, i) => {
              const derivativeError = e?.derivatives?.[i]?.message;
              const initialError = e?.initial?.[i]?.message;
              return (
                <DerivativeRow key={`${i}-${name}`} index={i} name={name} derivativeError={derivativeError} initialError={initialError} register={register} />
              );
            })}
          </div>
        )}
        {e?.derivatives?.message || e?.derivatives?.root?.message ? (
          <p role="alert" data-testid="field-error-model.derivatives" className="mt-2 text-xs text-rust">
            {e.derivatives.message ?? e.derivatives.root?.message}
          </p>
        ) : null}
      </fieldset>

      <div className="grid grid-cols-1 gap-4 sm:grid-cols-[1fr_10rem]">
        <Field label={<span className="font-mono">y =</span>} htmlFor="plant-output" name="model.output" error={e?.output?.message} hint="The measured output, a formula such as h">
          <input id="plant-output" spellCheck={false} className={`${inputClass} font-mono`} placeholder="h" aria-invalid={Boolean(e?.output)} {...register("model.output")} />
        </Field>
        <Field
          label={<>Operating input <span className="font-mono">u₀</span></>}
          htmlFor="plant-operating-input"
          name="model.operatingInput"
          error={e?.operatingInput?.message}
          hint="u held before t = 0"
        >
          <input id="plant-operating-input" inputMode="decimal" className={`${inputClass} font-mono`} aria-invalid={Boolean(e?.operatingInput)} {...register("model.operatingInput")} />
        </Field>
      </div>
      <p className="text-xs text-ink-faint">
        The initial state with the operating input is the operating point: steps start from there, and the poles shown are those of the linearisation
        there. If it is not an equilibrium, the loop starts from it anyway and drifts.
      </p>
    </div>
  );
}

function DerivativeRow({
  index,
  name,
  derivativeError,
  initialError,
  register,
}: {
  index: number;
  name: string;
  derivativeError?: string;
  initialError?: string;
  register: PlantFieldsProps["register"];
}) {
  return (
    <>
      <label htmlFor={`plant-derivative-${index}`} className="whitespace-nowrap pt-1.5 font-mono text-sm text-ink">
        d{name}/dt =
      </label>
      <div>
        <input
          id={`plant-derivative-${index}`}
          spellCheck={false}
          className={`${inputClass} font-mono`}
          placeholder={index === 0 ? "(-a*sqrt(h) + b*u)/A" : ""}
          aria-invalid={Boolean(derivativeError)}
          data-testid={`derivative-${index}`}
          {...register(`model.derivatives.${index}`)}
        />
        {derivativeError ? (
          <p role="alert" data-testid={`field-error-model.derivatives.${index}`} className="mt-1 text-xs text-rust">
            {derivativeError}
          </p>
        ) : null}
      </div>
      <div>
        <input
          id={`plant-initial-${index}`}
          aria-label={`${name} at t = 0`}
          inputMode="decimal"
          className={`${inputClass} font-mono`}
          placeholder="0"
          aria-invalid={Boolean(initialError)}
          data-testid={`initial-${index}`}
          {...register(`model.initial.${index}`)}
        />
        {initialError ? (
          <p role="alert" data-testid={`field-error-model.initial.${index}`} className="mt-1 text-xs text-rust">
            {initialError}
          </p>
        ) : null}
      </div>
    </>
  );
}
