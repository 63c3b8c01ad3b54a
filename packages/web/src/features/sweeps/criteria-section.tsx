import { CRITERIA, type CriterionId, type ScenarioKind } from "@loopyard/core";
import { Field, inputClass } from "../../components/field.js";
import { Section } from "../../components/section.js";
import { criterionDescription, criterionShortLabel } from "../fronts/criterion-label.js";
import { criterionGroups, isFrequencyCriterion, STEP_RESPONSE_CRITERIA } from "./criterion-groups.js";
import { FieldErrorText } from "./field-error-text.js";
import type { SweepSectionProps } from "./sweep-form-types.js";

/** Every registered criterion in groups with its unit; options of the quadratic cost and the settling band. */
export function CriteriaSection({
  register,
  errors,
  chosen,
  scenarioKind,
  nonlinearPlant,
}: SweepSectionProps & { chosen: readonly CriterionId[]; scenarioKind: ScenarioKind; nonlinearPlant: boolean }) {
  const o = errors.criterionOptions;
  return (
    <Section title="Criteria" aside="every chosen criterion is scored for every stable candidate; smaller is better">
      <div className="grid grid-cols-1 gap-5 md:grid-cols-3" data-testid="criteria-groups">
        {criterionGroups().map((group) => (
          <fieldset key={group.title} className={group.wide ? "md:col-span-3" : ""}>
            <legend className="mb-2 text-xs font-medium uppercase tracking-wide text-ink-soft">{group.title}</legend>
            {group.wide && nonlinearPlant && group.ids.some(isFrequencyCriterion) ? (
              <p className="mb-2 text-xs text-ink-soft">This plant is nonlinear: it has no frequency response, so these do not apply.</p>
            ) : null}
            <div className={group.wide ? "grid grid-cols-1 gap-2 md:grid-cols-3" : "space-y-2"}>
              {group.ids.map((c) => (
                <label key={c} className={`flex items-start gap-2 text-sm ${nonlinearPlant && isFrequencyCriterion(c) ? "opacity-50" : ""}`}>
                  <input
                    type="checkbox"
                    value={c}
                    disabled={nonlinearPlant && isFrequencyCriterion(c)}
                    className="mt-0.5 accent-moss"
                    data-testid={`criterion-${c}`}
                    {...register("criteria")}
                  />
                  <span>
                    <span className="font-medium">{criterionShortLabel(c)}</span>
                    {CRITERIA[c]?.unit ? <span className="ml-1.5 font-mono text-[11px] text-ink-faint">[{CRITERIA[c].unit}]</span> : null}
                    <span className="block text-xs text-ink-soft">{criterionDescription(c)}</span>
                  </span>
                </label>
              ))}
            </div>
          </fieldset>
        ))}
      </div>
      <FieldErrorText field="criteria" message={errors.criteria?.message ?? errors.criteria?.root?.message} />
      {scenarioKind === "load-step" && chosen.some((c) => STEP_RESPONSE_CRITERIA.includes(c) && c !== "steadyStateError") ? (
        <p className="mt-3 text-xs text-ink-soft" data-testid="criteria-scenario-note">
          With a load step alone there is no setpoint change, so overshoot, undershoot, rise time and settling time do not apply: they show as “—” and
          cannot be drawn on the front. Choose “Both” to score them, or add an integral or effort criterion.
        </p>
      ) : null}
      <div className="mt-4 grid grid-cols-3 gap-4 border-t border-line-soft pt-4 sm:max-w-lg">
        <Field label="q (weight on e²)" htmlFor="option-q" name="criterionOptions.q" error={o?.q?.message} hint="quadratic J">
          <input id="option-q" type="number" step="any" min={0} disabled={!chosen.includes("quadratic")} className={`${inputClass} font-mono`} {...register("criterionOptions.q", { valueAsNumber: true })} />
        </Field>
        <Field label="r (weight on u²)" htmlFor="option-r" name="criterionOptions.r" error={o?.r?.message} hint="quadratic J">
          <input id="option-r" type="number" step="any" min={0} disabled={!chosen.includes("quadratic")} className={`${inputClass} font-mono`} {...register("criterionOptions.r", { valueAsNumber: true })} />
        </Field>
        <Field label="Settling band" htmlFor="option-band" name="criterionOptions.settlingBand" error={o?.settlingBand?.message} hint="fraction: 0.02 = ±2 %">
          <input
            id="option-band"
            type="number"
            step="any"
            min={0}
            max={1}
            disabled={!chosen.includes("settlingTime")}
            className={`${inputClass} font-mono`}
            {...register("criterionOptions.settlingBand", { valueAsNumber: true })}
          />
        </Field>
      </div>
    </Section>
  );
}
