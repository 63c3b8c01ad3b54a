import { Field, inputClass } from "../../components/field.js";
import type { PlantFieldsProps } from "./plant-form-fields.js";

const MATRICES = [
  { name: "A", rows: 3, placeholder: "0 1\n-2 -3", hint: "n × n: one row per line, numbers separated by spaces or commas" },
  { name: "B", rows: 3, placeholder: "0\n1", hint: "n × 1: one number per line" },
  { name: "C", rows: 1, placeholder: "1 0", hint: "1 × n: one row of n numbers" },
  { name: "D", rows: 1, placeholder: "0", hint: "1 × 1: the direct feed-through, usually 0" },
] as const;

/** The four matrices of x′ = Ax + Bu, y = Cx + Du, typed as rows; the order n is read from A. */
export function StateSpaceFields({ register, errors, order }: PlantFieldsProps & { order: number | null }) {
  return (
    <div>
      <p className="mb-3 text-sm text-ink-soft">
        x′ = A x + B u, y = C x + D u, with x(0) = 0. One input u, one output y.{" "}
        <span data-testid="state-space-order">{order === null ? "The order n is the number of rows of A." : <>Order <span className="font-mono text-ink">n = {order}</span> (rows of A).</>}</span>
      </p>
      <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
        {MATRICES.map((m) => {
          const error = errors.model?.[m.name]?.message;
          return (
            <Field key={m.name} label={`Matrix ${m.name}`} htmlFor={`plant-${m.name}`} name={`model.${m.name}`} error={error} hint={m.hint}>
              <textarea
                id={`plant-${m.name}`}
                rows={m.rows}
                spellCheck={false}
                placeholder={m.placeholder}
                className={`${inputClass} font-mono leading-relaxed`}
                aria-invalid={Boolean(error)}
                {...register(`model.${m.name}`)}
              />
            </Field>
          );
        })}
      </div>
    </div>
  );
}
