import { useFieldArray, type Control, type FieldErrors, type UseFormRegister } from "react-hook-form";
import { CRITERIA, type CriterionId } from "@loopyard/core";
import { Button } from "../../components/button.js";
import { Field, inputClass } from "../../components/field.js";
import { Section } from "../../components/section.js";
import { criterionGroups } from "../sweeps/criterion-groups.js";
import { ALL_CRITERIA, type ComparisonFormValues } from "./comparison-form-values.js";

/** Criteria a team would tune by: the integral and quadratic costs, effort, ‖W·S‖∞. */
const CONTENDER_CHOICES: readonly CriterionId[] = ["iae", "ise", "itae", "itse", "quadratic", "effort", "tv", "wsNorm"];

/**
 * Contenders (criteria competing to be the tuning objective, plus weighted quadratic costs by r),
 * judges (every other figure the picks are scored on) and constraints (limits held on every variant).
 */
export function ContendersSection({
  register,
  control,
  errors,
  contenders,
}: {
  register: UseFormRegister<ComparisonFormValues>;
  control: Control<ComparisonFormValues, unknown, unknown>;
  errors: FieldErrors<ComparisonFormValues>;
  contenders: readonly CriterionId[];
}) {
  const constraints = useFieldArray({ control, name: "constraints" });
  const known = CONTENDER_CHOICES.filter((id) => id in CRITERIA);
  return (
    <Section title="Contenders, judges and limits" aside="each contender's pick is scored on every column">
      <div className="space-y-5">
        <div>
          <div className="mb-1 text-xs font-medium text-ink-soft">Contenders — criteria competing to be the team's tuning objective</div>
          <div className="flex flex-wrap gap-2" data-testid="contender-choice">
            {known.map((id) => (
              <label key={id} className="flex cursor-pointer items-center gap-2 rounded-md border border-line bg-white px-2.5 py-1 text-sm hover:border-ink-faint" title={CRITERIA[id].description}>
                <input type="checkbox" value={id} className="accent-moss" data-testid={`contender-${id}`} {...register("contenders")} />
                {CRITERIA[id].label}
              </label>
            ))}
          </div>
          {errors.contenders?.message ? <p role="alert" data-testid="field-error-contenders" className="mt-1 text-xs text-rust">{errors.contenders.message}</p> : null}
        </div>
        <Field
          label="Weighted quadratic costs J = ∫(e² + r·(u − u∞)²) dt, one contender per weight r"
          htmlFor="quadratic-weights"
          name="quadraticWeights"
          error={errors.quadraticWeights?.message}
          hint="e.g. 0.1, 1 — a small r lets the actuator work hard, a large r spares it"
        >
          <input id="quadratic-weights" className={`${inputClass} font-mono`} data-testid="quadratic-weights" {...register("quadraticWeights")} />
        </Field>
        <div>
          <div className="mb-1 text-xs font-medium text-ink-soft">Judges — scored on every pick, never optimised</div>
          <div className="space-y-2" data-testid="judge-choice">
            {criterionGroups().map((group) => (
              <div key={group.title}>
                <div className="text-[11px] uppercase tracking-wide text-ink-faint">{group.title}</div>
                <div className="mt-1 flex flex-wrap gap-x-4 gap-y-1">
                  {group.ids
                    .filter((id) => ALL_CRITERIA.includes(id))
                    .map((id) => {
                      const taken = contenders.includes(id);
                      return (
                        <label key={id} className={`flex items-center gap-1.5 text-sm ${taken ? "text-ink-faint" : ""}`} title={taken ? "already a contender: every contender is a column too" : CRITERIA[id].description}>
                          <input type="checkbox" value={id} disabled={taken} className="accent-moss" data-testid={`judge-${id}`} {...register("judges")} />
                          {CRITERIA[id].label}
                        </label>
                      );
                    })}
                </div>
              </div>
            ))}
          </div>
          {errors.judges?.message ? <p role="alert" data-testid="field-error-judges" className="mt-1 text-xs text-rust">{errors.judges.message}</p> : null}
        </div>
        <div>
          <div className="mb-1 text-xs font-medium text-ink-soft">Constraints — a candidate that breaks one on any variant is out</div>
          <div className="space-y-2" data-testid="constraints">
            {constraints.fields.map((field, i) => (
              <div key={field.id} className="flex items-center gap-2">
                <select className={`${inputClass} w-48`} aria-label="criterion" {...register(`constraints.${i}.criterion`)}>
                  {ALL_CRITERIA.map((id) => (
                    <option key={id} value={id}>
                      {CRITERIA[id].label}
                    </option>
                  ))}
                </select>
                <select className={`${inputClass} w-20`} aria-label="bound" {...register(`constraints.${i}.bound`)}>
                  <option value="max">≤</option>
                  <option value="min">≥</option>
                </select>
                <input type="number" step="any" className={`${inputClass} w-28 font-mono`} aria-label="limit" {...register(`constraints.${i}.limit`, { valueAsNumber: true })} />
                <Button tone="plain" onClick={() => constraints.remove(i)}>
                  Remove
                </Button>
              </div>
            ))}
            <Button onClick={() => constraints.append({ criterion: "upeak", bound: "max", limit: 1 })} data-testid="add-constraint">
              Add a constraint
            </Button>
          </div>
          {errors.constraints?.message ? <p role="alert" data-testid="field-error-constraints" className="mt-1 text-xs text-rust">{errors.constraints.message}</p> : null}
        </div>
      </div>
    </Section>
  );
}
