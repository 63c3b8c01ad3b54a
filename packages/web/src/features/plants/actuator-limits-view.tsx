import type { ActuatorLimitsView } from "./plant-summary.js";
import { formatEntry } from "./matrix-view.js";

/** The actuator limits of a revision, or a sentence saying there are none. */
export function ActuatorLimitsList({ limits }: { limits: ActuatorLimitsView | undefined }) {
  const rows = [
    { label: "Lowest u", value: limits?.min, unit: "u" },
    { label: "Highest u", value: limits?.max, unit: "u" },
    { label: "Fastest change |du/dt|", value: limits?.rate, unit: "u/s" },
  ].filter((r) => r.value !== undefined);
  if (rows.length === 0) {
    return (
      <p className="text-sm text-ink-soft" data-testid="actuator-limits">
        No actuator limits: the loop may drive u as far and as fast as the controller asks.
      </p>
    );
  }
  return (
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
  );
}
