import type { CriterionId } from "@loopyard/core";
import { Field, inputClass } from "../../components/field.js";
import { Section } from "../../components/section.js";
import { criterionShortLabel } from "../fronts/criterion-label.js";
import { AGGREGATES, DESIGNS, DESIGN_ORDER, type AggregateValues, type DesignChoice } from "./sweep-design-values.js";
import type { SweepSectionProps } from "./sweep-form-types.js";

/** How the candidates are chosen (grid, three samplings, two searches) and, for a family, how its variants are combined. */
export function DesignSection({
  register,
  errors,
  design,
  aggregate,
  criteria,
  variantCount,
}: SweepSectionProps & { design: DesignChoice; aggregate: AggregateValues["kind"]; criteria: readonly CriterionId[]; variantCount: number }) {
  const e = errors.design;
  const number = (name: "count" | "seed" | "starts" | "iterations" | "population" | "generations", label: string, hint?: string) => (
    <Field label={label} htmlFor={`design-${name}`} name={`design.${name}`} error={e?.[name]?.message} hint={hint} className="w-36">
      <input
        id={`design-${name}`}
        type="number"
        step={1}
        min={name === "seed" ? undefined : 1}
        className={`${inputClass} font-mono`}
        aria-invalid={Boolean(e?.[name])}
        data-testid={`design-${name}`}
        {...register(`design.${name}`, { valueAsNumber: true })}
      />
    </Field>
  );
  return (
    <Section title="Design" aside="how candidates are chosen inside the ranges">
      <div className="space-y-4">
        <div className="grid grid-cols-1 gap-2 md:grid-cols-2" data-testid="design-choice">
          {DESIGN_ORDER.map((kind) => (
            <label
              key={kind}
              className={`flex cursor-pointer items-start gap-2 rounded-md border px-3 py-2 text-sm ${design === kind ? "border-moss bg-moss-wash" : "border-line bg-white hover:border-ink-faint"}`}
            >
              <input type="radio" value={kind} className="mt-0.5 accent-moss" data-testid={`design-${kind}`} {...register("design.kind")} />
              <span>
                <span className="font-medium">{DESIGNS[kind].label}</span>
                <span className="block text-xs text-ink-soft">{DESIGNS[kind].line}</span>
              </span>
            </label>
          ))}
        </div>
        {design === "latin-hypercube" || design === "sobol" || design === "random" ? (
          <div className="flex flex-wrap gap-4">
            {number("count", "Candidates")}
            {number("seed", "Seed", design === "sobol" ? "scrambles the sequence" : "same seed, same candidates")}
          </div>
        ) : design === "nelder-mead" ? (
          <div className="flex flex-wrap gap-4">
            <Field label="Criterion" htmlFor="design-criterion" name="design.criterion" error={e && "criterion" in e ? e.criterion?.message : undefined} className="w-44">
              <select id="design-criterion" className={inputClass} data-testid="design-criterion" {...register("design.criterion")}>
                {criteria.map((c) => (
                  <option key={c} value={c}>
                    {criterionShortLabel(c)}
                  </option>
                ))}
              </select>
            </Field>
            {number("starts", "Starts")}
            {number("iterations", "Evaluations per start")}
            {number("seed", "Seed", "places the starts")}
          </div>
        ) : design === "nsga2" ? (
          <div className="flex flex-wrap gap-4">
            {number("population", "Population")}
            {number("generations", "Generations")}
            {number("seed", "Seed")}
          </div>
        ) : null}
        {e?.message ? <p role="alert" data-testid="field-error-design" className="text-xs text-rust">{e.message}</p> : null}

        <div className="border-t border-line-soft pt-4">
          <div className="mb-1 text-xs font-medium text-ink-soft">Over the family</div>
          {variantCount < 2 ? (
            <p className="text-xs text-ink-soft">One variant: its scores are the candidate's scores. Add a variant above to study a product line.</p>
          ) : (
            <div className="flex flex-wrap items-start gap-3" data-testid="aggregate-choice">
              {(Object.keys(AGGREGATES) as AggregateValues["kind"][]).map((kind) => (
                <label
                  key={kind}
                  className={`flex max-w-56 cursor-pointer items-start gap-2 rounded-md border px-3 py-2 text-sm ${aggregate === kind ? "border-moss bg-moss-wash" : "border-line bg-white hover:border-ink-faint"}`}
                >
                  <input type="radio" value={kind} className="mt-0.5 accent-moss" data-testid={`aggregate-${kind}`} {...register("aggregate.kind")} />
                  <span>
                    <span className="font-medium">{AGGREGATES[kind].label}</span>
                    <span className="block text-xs text-ink-soft">{AGGREGATES[kind].line}</span>
                  </span>
                </label>
              ))}
              {aggregate === "percentile" ? (
                <Field label="p [%]" htmlFor="aggregate-p" name="aggregate.p" error={errors.aggregate?.p?.message} className="w-24">
                  <input id="aggregate-p" type="number" step="any" min={0} max={100} className={`${inputClass} font-mono`} {...register("aggregate.p", { valueAsNumber: true })} />
                </Field>
              ) : null}
            </div>
          )}
        </div>
      </div>
    </Section>
  );
}
