import type { ControllerKind } from "@loopyard/core";
import { Field, inputClass } from "../../components/field.js";
import { Section } from "../../components/section.js";
import { FieldErrorText } from "./field-error-text.js";
import type { AntiWindupChoice, SweepFormValues } from "./sweep-form-values.js";
import type { SweepSectionProps } from "./sweep-form-types.js";
import { STRUCTURES, STRUCTURE_ORDER, parameterRows, type ParameterRow } from "./structure-choices.js";

const ANTI_WINDUP: readonly { value: AntiWindupChoice; label: string }[] = [
  { value: "default", label: "Back-calculation (default tracking time)" },
  { value: "back-calculation", label: "Back-calculation, tracking time given" },
  { value: "conditional", label: "Conditional integration" },
  { value: "none", label: "None" },
];

/** Structure, one min/max/count row per parameter, derivative filter, sampling and anti-windup. */
export function StructureSection({
  register,
  errors,
  structure,
  stateNames,
  filterMode,
  sampled,
  antiWindup,
  hasLimits,
  ownCount = false,
}: SweepSectionProps & {
  structure: ControllerKind;
  stateNames: readonly string[];
  filterMode: SweepFormValues["filter"]["mode"];
  sampled: boolean;
  antiWindup: AntiWindupChoice;
  /** Whether the chosen revision has actuator limits (null while it loads). */
  hasLimits: boolean | null;
  /** True when the design draws its own count of candidates, so the counts are not used. */
  ownCount?: boolean;
}) {
  const rows = parameterRows(structure, stateNames);
  const pidLike = structure === "pid" || structure === "pid2dof";
  const stateFeedbackOk = stateNames.length > 0 && stateNames.length <= 10;
  return (
    <Section title="Controller" aside={<span className="font-mono" data-testid="structure-law">{STRUCTURES[structure].law}</span>}>
      <div className="space-y-5">
        <div>
          <div className="mb-1 text-xs font-medium text-ink-soft">Structure</div>
          <div className="flex flex-wrap gap-2" data-testid="structure-choice">
            {STRUCTURE_ORDER.map((kind) => {
              const disabled = kind === "state-feedback" && !stateFeedbackOk;
              return (
                <label
                  key={kind}
                  title={disabled ? "State feedback needs a plant with 1 to 10 states; this revision has none to feed back." : STRUCTURES[kind].law}
                  className={`flex items-center gap-2 rounded-md border px-3 py-1.5 text-sm ${
                    structure === kind ? "border-moss bg-moss-wash" : "border-line bg-white"
                  } ${disabled ? "cursor-not-allowed opacity-50" : "cursor-pointer hover:border-ink-faint"}`}
                >
                  <input type="radio" value={kind} disabled={disabled} className="accent-moss" data-testid={`structure-${kind}`} {...register("structure")} />
                  {STRUCTURES[kind].label}
                </label>
              );
            })}
          </div>
          <FieldErrorText field="structure" message={errors.structure?.message} />
          {structure === "state-feedback" ? (
            <p className="mt-2 text-xs text-ink-soft">
              One gain per plant state ({stateNames.length}: {stateNames.join(", ")}), and the reference gain n.
            </p>
          ) : null}
        </div>

        <div>
          <div className="mb-1 flex flex-wrap items-baseline justify-between gap-x-3 gap-y-0.5 text-xs text-ink-soft">
            <span className="font-medium">Parameters</span>
            <span>
              {ownCount
                ? "the design draws every parameter from min to max; max = min holds it there"
                : "count values spaced from min to max; count 1 holds the parameter at min"}
            </span>
          </div>
          {/* On a phone each parameter's name takes a line of its own above its four fields. */}
          <div className="grid grid-cols-[1fr_1fr_1fr_5.5rem] items-start gap-x-2 gap-y-2 sm:grid-cols-[7rem_1fr_1fr_1fr_6.5rem] sm:gap-x-3 sm:gap-y-3" data-testid="parameter-grid">
            <span className="hidden sm:block" />
            <span className="text-xs font-medium uppercase tracking-wide text-ink-soft">min</span>
            <span className="text-xs font-medium uppercase tracking-wide text-ink-soft">max</span>
            <span className="text-xs font-medium uppercase tracking-wide text-ink-soft" title={ownCount ? "Not used: the design sets the number of candidates." : undefined}>
              count{ownCount ? " (unused)" : ""}
            </span>
            <span className="text-xs font-medium uppercase tracking-wide text-ink-soft" title="linear: evenly spaced; log: evenly spaced in decades (min > 0)">
              scale
            </span>
            {rows.map((row) => (
              <ParameterRangeRow key={row.key} row={row} register={register} errors={errors} ownCount={ownCount} />
            ))}
          </div>
        </div>

        {pidLike ? (
          <div>
            <div className="mb-1 text-xs font-medium text-ink-soft">Derivative filter tf</div>
            <div className="flex flex-wrap items-start gap-6">
              <label className="flex items-center gap-2 pt-1.5 text-sm">
                <input type="radio" value="ratio" className="accent-moss" {...register("filter.mode")} />
                tf = Td / n, with Td = kd/kp
              </label>
              <Field label="n" htmlFor="filter-n" name="filter.n" error={errors.filter?.n?.message} className="w-28">
                <input id="filter-n" type="number" step="any" disabled={filterMode !== "ratio"} className={`${inputClass} font-mono`} {...register("filter.n", { valueAsNumber: true })} />
              </Field>
              <label className="flex items-center gap-2 pt-1.5 text-sm">
                <input type="radio" value="fixed" className="accent-moss" {...register("filter.mode")} />
                fixed tf
              </label>
              <Field label="tf [s]" htmlFor="filter-tf" name="filter.tf" error={errors.filter?.tf?.message} className="w-28">
                <input id="filter-tf" type="number" step="any" disabled={filterMode !== "fixed"} className={`${inputClass} font-mono`} {...register("filter.tf", { valueAsNumber: true })} />
              </Field>
            </div>
          </div>
        ) : null}

        <div className="grid grid-cols-1 gap-4 border-t border-line-soft pt-4 sm:grid-cols-2">
          <div>
            <label className="flex items-center gap-2 text-sm">
              <input type="checkbox" className="accent-moss" data-testid="sampled" {...register("sampled")} />
              Sampled controller (zero-order hold)
            </label>
            <Field label="Sample time [s]" htmlFor="sample-time" name="sampleTime" error={errors.sampleTime?.message} hint="at least the time step dt" className="mt-2 w-40">
              <input id="sample-time" type="number" step="any" disabled={!sampled} className={`${inputClass} font-mono`} {...register("sampleTime", { valueAsNumber: true })} />
            </Field>
          </div>
          <div>
            <Field
              label="Anti-windup"
              htmlFor="anti-windup"
              name="antiWindup"
              error={errors.antiWindup?.message}
              hint={
                hasLimits === false
                  ? "This revision has no actuator limits, so anti-windup changes nothing here. Add limits in a new plant revision to use it."
                  : "Acts only while the actuator saturates (the plant's actuator limits). Default tracking time √(Ti·Td), or Ti without derivative."
              }
            >
              <select id="anti-windup" className={inputClass} data-testid="anti-windup" {...register("antiWindup.kind")}>
                {ANTI_WINDUP.map((a) => (
                  <option key={a.value} value={a.value}>
                    {a.label}
                  </option>
                ))}
              </select>
            </Field>
            {antiWindup === "back-calculation" ? (
              <Field label="Tracking time tt [s]" htmlFor="anti-windup-tt" name="antiWindup.tt" error={errors.antiWindup?.tt?.message} className="mt-2 w-40">
                <input id="anti-windup-tt" type="number" step="any" className={`${inputClass} font-mono`} {...register("antiWindup.tt", { valueAsNumber: true })} />
              </Field>
            ) : null}
          </div>
        </div>
      </div>
    </Section>
  );
}

function ParameterRangeRow({ row, register, errors, ownCount }: SweepSectionProps & { row: ParameterRow; ownCount: boolean }) {
  const rowErrors = errors.ranges?.[row.key];
  const cell = (part: "min" | "max" | "count") => {
    const message = rowErrors?.[part]?.message;
    return (
      <div>
        <input
          id={`${row.key}-${part}`}
          aria-label={`${row.name} ${part}`}
          type="number"
          step={part === "count" ? 1 : "any"}
          disabled={part === "count" && ownCount}
          min={part === "count" ? 1 : row.sign === "any" ? undefined : 0}
          className={`${inputClass} font-mono disabled:bg-line-soft/60 disabled:text-ink-faint`}
          aria-invalid={Boolean(message)}
          data-testid={`${row.key}-${part}`}
          {...register(`ranges.${row.key}.${part}`, { valueAsNumber: true })}
        />
        <FieldErrorText field={`ranges.${row.key}.${part}`} message={message} />
      </div>
    );
  };
  const rowMessage = rowErrors?.message ?? rowErrors?.root?.message;
  return (
    <>
      <div className="col-span-4 flex items-baseline gap-2 pt-1.5 sm:col-span-1 sm:block">
        <div className="font-mono text-sm">{row.name}</div>
        <div className="text-[11px] leading-tight text-ink-faint">{row.unit}</div>
        <FieldErrorText field={`ranges.${row.key}`} message={rowMessage} />
      </div>
      {cell("min")}
      {cell("max")}
      {cell("count")}
      <div>
        <select
          aria-label={`${row.name} scale`}
          className={inputClass}
          data-testid={`${row.key}-scale`}
          {...register(`ranges.${row.key}.scale`)}
        >
          <option value="linear">linear</option>
          <option value="log">log</option>
        </select>
        <FieldErrorText field={`ranges.${row.key}.scale`} message={rowErrors?.scale?.message} />
      </div>
    </>
  );
}
