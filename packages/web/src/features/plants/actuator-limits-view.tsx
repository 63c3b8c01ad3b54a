import type { ActuatorLimitsView } from "./plant-summary.js";
import { formatEntry } from "./matrix-view.js";
import { actuatorUnits } from "./plant-units.js";

/** The actuator limits of a revision in the input's unit, or a sentence saying there are none. */
export function ActuatorLimitsList({ limits, inputUnit = null }: { limits: ActuatorLimitsView | undefined; inputUnit?: string | null }) {
  const units = actuatorUnits(inputUnit);
  const rows = [
    { label: "Lowest u", value: limits?.min, unit: units.level },
    { label: "Highest u", value: limits?.max, unit: units.level },
    { label: "Fastest change |du/dt|", value: limits?.rate, unit: units.rate },
  ].filter((r) => r.value !== undefined);
  if (rows.length === 0) {
    return (
      <p className="text-sm text-ink-soft" data-testid="actuator-limits">
        No actuator limits: the loop may drive u as far and as fast as the controller asks.
      </p>
    );
  }
  return (
    <>
      <dl className="grid grid-cols-[max-content_1fr] gap-x-6 gap-y-1.5 text-sm" data-testid="actuator-limits">
        {rows.map((r) => (
          <div key={r.label} className="contents">
            <dt className="text-ink-soft">{r.label}</dt>
            <dd className="font-mono text-[13px]">
              {formatEntry(r.value as number)} <span className="text-ink-faint">{r.unit}</span>
            </dd>
          </div>
        ))}
      </dl>
      {inputUnit === null ? <p className="mt-2 text-xs text-ink-faint">In the unit of the input u; name it in the units note as “u: … [unit]” to see it here.</p> : null}
    </>
  );
}
