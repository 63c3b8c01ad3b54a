import type { FieldErrors, UseFormRegister } from "react-hook-form";
import { Field, inputClass } from "../../components/field.js";
import { Section } from "../../components/section.js";
import { AGGREGATES } from "../sweeps/sweep-design-values.js";
import type { ComparisonFormValues } from "./comparison-form-values.js";

const numberInput = `${inputClass} font-mono`;

/** The aggregate over the family, and how hard the search works (pre-scan, local starts, evaluations), with the seed. */
export function BudgetSection({
  register,
  errors,
  aggregate,
  variantCount,
}: {
  register: UseFormRegister<ComparisonFormValues>;
  errors: FieldErrors<ComparisonFormValues>;
  aggregate: ComparisonFormValues["aggregate"]["kind"];
  variantCount: number;
}) {
  return (
    <Section title="Over the family, and how hard to search">
      <div className="grid grid-cols-1 gap-4 sm:grid-cols-3">
        <Field label="Aggregate over the variants" htmlFor="aggregate-kind" name="aggregate" hint={variantCount > 1 ? AGGREGATES[aggregate].line : "one variant: its own scores"}>
          <select id="aggregate-kind" className={inputClass} {...register("aggregate.kind")} data-testid="aggregate-kind">
            {(Object.keys(AGGREGATES) as (keyof typeof AGGREGATES)[]).map((kind) => (
              <option key={kind} value={kind}>
                {AGGREGATES[kind].label}
              </option>
            ))}
          </select>
        </Field>
        {aggregate === "percentile" ? (
          <Field label="Percentile p" htmlFor="aggregate-p" name="aggregate.p" error={errors.aggregate?.p?.message}>
            <input id="aggregate-p" type="number" step="any" className={numberInput} {...register("aggregate.p", { valueAsNumber: true })} />
          </Field>
        ) : (
          <div />
        )}
        <div />
        <Field label="Pre-scan points (Sobol, shared)" htmlFor="budget-prescan" name="budget.prescan" error={errors.budget?.prescan?.message} hint="a power of two keeps the design balanced">
          <input id="budget-prescan" type="number" className={numberInput} {...register("budget.prescan", { valueAsNumber: true })} />
        </Field>
        <Field label="Local starts per contender" htmlFor="budget-starts" name="budget.starts" error={errors.budget?.starts?.message}>
          <input id="budget-starts" type="number" className={numberInput} {...register("budget.starts", { valueAsNumber: true })} />
        </Field>
        <Field label="Evaluations per start" htmlFor="budget-evaluations" name="budget.evaluations" error={errors.budget?.evaluations?.message}>
          <input id="budget-evaluations" type="number" className={numberInput} {...register("budget.evaluations", { valueAsNumber: true })} />
        </Field>
        <Field label="Seed" htmlFor="seed" name="seed" error={errors.seed?.message} hint="same seed, same picks">
          <input id="seed" type="number" className={numberInput} {...register("seed", { valueAsNumber: true })} />
        </Field>
        <label className="flex items-center gap-2 self-end pb-2 text-sm sm:col-span-2">
          <input type="checkbox" className="accent-moss" {...register("budget.stability")} data-testid="budget-stability" />
          Check the stability of the answer (each variant left out, each r halved and doubled)
        </label>
      </div>
    </Section>
  );
}
