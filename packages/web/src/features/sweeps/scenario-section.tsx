import { MAX_SIMULATION_SAMPLES, type ScenarioKind } from "@loopyard/core";
import { Field, inputClass } from "../../components/field.js";
import { Section } from "../../components/section.js";
import type { SweepSectionProps } from "./sweep-form-types.js";

const KINDS: readonly { kind: ScenarioKind; label: string; note: string }[] = [
  { kind: "setpoint-step", label: "Setpoint step", note: "r steps at t = 0 from the operating point" },
  { kind: "load-step", label: "Load step", note: "a step added to the plant input u at a chosen time" },
  { kind: "combined", label: "Both", note: "setpoint step at t = 0 and a load step later" },
];

const numberInput = `${inputClass} font-mono`;

/** What the loop must do: scenario kind, step sizes, load time, optional measurement noise, horizon and dt. */
export function ScenarioSection({
  register,
  errors,
  kind,
  noiseOn,
  samples,
}: SweepSectionProps & { kind: ScenarioKind; noiseOn: boolean; samples: number | null }) {
  const e = errors.scenario;
  const hasSetpoint = kind !== "load-step";
  const hasLoad = kind !== "setpoint-step";
  return (
    <Section title="Scenario" aside="the plant starts at its operating point">
      <div className="space-y-4">
        <div className="grid grid-cols-1 gap-2 sm:grid-cols-3" data-testid="scenario-kind">
          {KINDS.map((k) => (
            <label
              key={k.kind}
              className={`flex cursor-pointer flex-col gap-0.5 rounded-md border px-3 py-2 text-sm ${kind === k.kind ? "border-moss bg-moss-wash" : "border-line bg-white hover:border-ink-faint"}`}
            >
              <span className="flex items-center gap-2 font-medium">
                <input type="radio" value={k.kind} className="accent-moss" data-testid={`scenario-${k.kind}`} {...register("scenario.kind")} />
                {k.label}
              </span>
              <span className="pl-5 text-xs text-ink-soft">{k.note}</span>
            </label>
          ))}
        </div>

        <div className="grid grid-cols-2 gap-4 sm:grid-cols-4">
          {hasSetpoint ? (
            <Field label="Setpoint step [y]" htmlFor="setpoint" name="scenario.setpoint" error={e?.setpoint?.message}>
              <input id="setpoint" type="number" step="any" className={numberInput} {...register("scenario.setpoint", { valueAsNumber: true })} />
            </Field>
          ) : null}
          {hasLoad ? (
            <>
              <Field label="Load step [u]" htmlFor="load-size" name="scenario.load.size" error={e?.load?.size?.message} hint="added to u">
                <input id="load-size" type="number" step="any" className={numberInput} {...register("scenario.load.size", { valueAsNumber: true })} />
              </Field>
              <Field label="Load at t [s]" htmlFor="load-time" name="scenario.load.time" error={e?.load?.time?.message}>
                <input id="load-time" type="number" step="any" min={0} className={numberInput} {...register("scenario.load.time", { valueAsNumber: true })} />
              </Field>
            </>
          ) : null}
        </div>

        <div className="grid grid-cols-2 gap-4 sm:grid-cols-4">
          <Field label="Horizon [s]" htmlFor="horizon" name="scenario.horizon" error={e?.horizon?.message}>
            <input id="horizon" type="number" step="any" className={numberInput} {...register("scenario.horizon", { valueAsNumber: true })} />
          </Field>
          <Field
            label="Time step dt [s]"
            htmlFor="dt"
            name="scenario.dt"
            error={e?.dt?.message}
            hint={samples !== null && Number.isFinite(samples) ? `${samples} samples per run (at most ${MAX_SIMULATION_SAMPLES})` : undefined}
            className="sm:col-span-3 sm:max-w-56"
          >
            <input id="dt" type="number" step="any" className={numberInput} {...register("scenario.dt", { valueAsNumber: true })} />
          </Field>
        </div>

        <div className="border-t border-line-soft pt-4">
          <label className="flex items-center gap-2 text-sm">
            <input type="checkbox" className="accent-moss" data-testid="noise-on" {...register("scenario.noiseOn")} />
            Measurement noise on the y the controller sees (white, Gaussian, reproducible from the seed)
          </label>
          <div className="mt-2 grid grid-cols-2 gap-4 sm:grid-cols-4">
            <Field label="Standard deviation [y]" htmlFor="noise-sd" name="scenario.noise.sd" error={e?.noise?.sd?.message}>
              <input id="noise-sd" type="number" step="any" min={0} disabled={!noiseOn} className={numberInput} {...register("scenario.noise.sd", { valueAsNumber: true })} />
            </Field>
            <Field label="Seed" htmlFor="noise-seed" name="scenario.noise.seed" error={e?.noise?.seed?.message}>
              <input id="noise-seed" type="number" step={1} disabled={!noiseOn} className={numberInput} {...register("scenario.noise.seed", { valueAsNumber: true })} />
            </Field>
          </div>
        </div>
      </div>
    </Section>
  );
}
