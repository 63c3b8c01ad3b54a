import { CRITERIA, type CriterionId, type ScenarioKind } from "@loopyard/core";
import { Field, inputClass } from "../../components/field.js";
import { Section } from "../../components/section.js";
import { criterionDescription, criterionShortLabel } from "../fronts/criterion-label.js";
import { criterionGroups, isFrequencyCriterion, STEP_RESPONSE_CRITERIA } from "./criterion-groups.js";
import { FieldErrorText } from "./field-error-text.js";
import { INFINITE_HORIZON_CRITERIA } from "./sweep-form-values.js";
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
    <Section title="Criteria" aside="every chosen criterion is scored for every stable candidate; smaller is better, except margins, crossover and bandwidth (larger is better)">
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
      <label className={`mt-4 flex items-start gap-2 text-sm ${chosen.some((c) => INFINITE_HORIZON_CRITERIA.includes(c)) ? "" : "opacity-50"}`}>
        <input
          type="checkbox"
          className="mt-0.5 accent-moss"
          disabled={!chosen.some((c) => INFINITE_HORIZON_CRITERIA.includes(c))}
          data-testid="option-infinite-horizon"
          {...register("criterionOptions.infiniteHorizon")}
        />
        <span>
          ISE, effort and quadratic cost over an infinite horizon (exact, linear loops without dead time)
          <span className="block text-xs text-ink-soft">
            Computed from a Lyapunov equation instead of the simulated trace, so slow loops are not cut off at the horizon. They do not apply
            (shown as “—”) to nonlinear plants, dead time, actuator limits, sampled controllers, noise or a load step; other criteria keep the
            simulated horizon.
          </span>
        </span>
      </label>
      {chosen.includes("wsNorm") ? (
        <fieldset className="mt-4 border-t border-line-soft pt-4" data-testid="weight-options">
          <legend className="mb-2 text-xs font-medium uppercase tracking-wide text-ink-soft">Weight of ‖W·S‖∞ — W(s) = (s/M + ωB)/(s + ωB·A)</legend>
          <div className="grid grid-cols-3 gap-4 sm:max-w-lg">
            <Field label="M (peak of |S| allowed)" htmlFor="weight-m" name="criterionOptions.weight.M" error={o?.weight?.M?.message ?? o?.weight?.message} hint="2 is a common choice">
              <input id="weight-m" type="number" step="any" min={0} className={`${inputClass} font-mono`} {...register("criterionOptions.weight.M", { valueAsNumber: true })} />
            </Field>
            <Field label="ωB [rad/s]" htmlFor="weight-omega" name="criterionOptions.weight.omegaB" error={o?.weight?.omegaB?.message} hint="bandwidth wanted">
              <input id="weight-omega" type="number" step="any" min={0} className={`${inputClass} font-mono`} {...register("criterionOptions.weight.omegaB", { valueAsNumber: true })} />
            </Field>
            <Field label="A (|S| at ω = 0)" htmlFor="weight-a" name="criterionOptions.weight.A" error={o?.weight?.A?.message} hint="small: integral action">
              <input id="weight-a" type="number" step="any" min={0} className={`${inputClass} font-mono`} {...register("criterionOptions.weight.A", { valueAsNumber: true })} />
            </Field>
          </div>
          <p className="mt-2 text-xs text-ink-soft">‖W·S‖∞ &lt; 1 means |S| stays under 1/|W| at every frequency.</p>
        </fieldset>
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
