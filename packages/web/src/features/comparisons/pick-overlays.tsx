import { useState } from "react";
import { usePickResponses } from "../../api/use-comparisons.js";
import { LazyPlot } from "../../components/charts/lazy-plot.js";
import { CHART_COLORS, CHART_CONFIG, axis, baseLayout } from "../../components/charts/chart-theme.js";
import { ErrorNote } from "../../components/error-note.js";
import { Loading } from "../../components/loading.js";
import { pickStyle } from "./pick-styles.js";

/**
 * Every pick's closed loop side by side on one variant: y(t) with the setpoint, u(t), and |S(jω)|,
 * overlaid in each pick's style. The variant is chosen above the charts ("each pick's worst" by
 * default: the variant that sets its contender's aggregate); switching redraws all three.
 */
export function PickOverlays({
  slug,
  comparisonId,
  variants,
  labels,
  names,
}: {
  slug: string;
  comparisonId: string;
  variants: readonly string[];
  /** Contender keys of the picks, in order (as the responses name them). */
  labels: readonly string[];
  /** What to call each pick in the legend (its column's label). */
  names: readonly string[];
}) {
  const [variant, setVariant] = useState<number | null>(null);
  const responses = usePickResponses(slug, comparisonId, variant, true);
  const choices: { value: number | null; label: string }[] = [{ value: null, label: "each pick's worst" }, ...variants.map((label, f) => ({ value: f, label }))];
  const picks = responses.data?.picks ?? [];
  const styleOf = (contender: string) => pickStyle(Math.max(0, labels.indexOf(contender)));
  const nameOf = (p: (typeof picks)[number]) => `${names[labels.indexOf(p.contender)] ?? p.contender}'s pick${variant === null ? ` (on ${p.variantLabel})` : ""}`;
  const drawn = picks.filter((p) => p.status === "ok");
  const line = (p: (typeof picks)[number], x: readonly number[], y: readonly number[], unit: string) => ({
    type: "scatter",
    mode: "lines",
    name: nameOf(p),
    x,
    y,
    line: { color: styleOf(p.contender).color, dash: styleOf(p.contender).dash, width: 2 },
    hovertemplate: `${nameOf(p)}: %{y:.4g}<br>${unit}<extra></extra>`,
  });
  const setpoint = drawn[0];
  return (
    <div data-testid="pick-overlays">
      <div className="mb-3 flex flex-wrap items-center gap-2 text-sm" role="radiogroup" aria-label="Variant to simulate">
        <span className="text-xs text-ink-soft">Simulate on</span>
        {choices.map((choice) => (
          <button
            key={String(choice.value)}
            type="button"
            role="radio"
            aria-checked={variant === choice.value}
            onClick={() => setVariant(choice.value)}
            data-testid={`overlay-variant-${choice.value === null ? "worst" : choice.value}`}
            className={`rounded-full border px-2.5 py-0.5 text-xs ${variant === choice.value ? "border-moss bg-moss-wash font-medium text-moss" : "border-line text-ink-soft hover:border-ink-faint"}`}
          >
            {choice.label}
          </button>
        ))}
        {responses.isFetching ? <span className="text-xs text-ink-faint">simulating…</span> : null}
      </div>
      {responses.isPending ? (
        <Loading label="Simulating every pick…" />
      ) : responses.isError ? (
        <ErrorNote error={responses.error} title="Could not simulate the picks" />
      ) : (
        <>
          {picks.filter((p) => p.status === "failed").map((p) => (
            <p key={p.contender} className="mb-2 text-xs text-rust">
              {p.contender}: no response on {p.variantLabel} — {p.reason}
            </p>
          ))}
          <p className="mb-1 text-xs text-ink-soft" data-testid="overlay-caption">
            {variant === null
              ? "Each pick on the variant that sets its worst case for its own criterion."
              : `Every pick on ${variants[variant] ?? `variant ${variant + 1}`}.`}
          </p>
          <div className="grid grid-cols-1 gap-4 xl:grid-cols-2">
            <div data-testid="overlay-output">
              <LazyPlot
                height={280}
                data={[
                  ...(setpoint ? [{ type: "scatter", mode: "lines", name: "setpoint r", x: setpoint.t, y: setpoint.r, line: { color: CHART_COLORS.faint, width: 1, dash: "dot" }, hoverinfo: "skip" }] : []),
                  ...drawn.map((p) => line(p, p.t, p.y, "t = %{x:.4g} s")),
                ]}
                layout={baseLayout({ xaxis: axis("time t [s]"), yaxis: axis("output y"), showlegend: true, legend: { orientation: "h", x: 0, y: -0.25, font: { size: 11 } }, margin: { l: 56, r: 16, t: 12, b: 90 } })}
                config={CHART_CONFIG}
              />
            </div>
            <div data-testid="overlay-input">
              <LazyPlot
                height={280}
                data={drawn.map((p) => ({ ...line(p, p.t, p.u, "t = %{x:.4g} s"), showlegend: false }))}
                layout={baseLayout({ xaxis: axis("time t [s]"), yaxis: axis("controller output u"), showlegend: false, margin: { l: 56, r: 16, t: 12, b: 90 } })}
                config={CHART_CONFIG}
              />
            </div>
          </div>
          {drawn.some((p) => p.omega.length > 0) ? (
            <div data-testid="overlay-sensitivity" className="mt-2">
              <LazyPlot
                height={280}
                data={drawn.filter((p) => p.omega.length > 0).map((p) => ({ ...line(p, p.omega, p.sensitivity, "ω = %{x:.4g} rad/s"), showlegend: false }))}
                layout={baseLayout({
                  xaxis: axis("frequency ω [rad/s]", { type: "log", exponentformat: "power" }),
                  yaxis: axis("|S(jω)| — its peak is Ms", { type: "log", exponentformat: "power" }),
                  showlegend: false,
                  shapes: [{ type: "line", xref: "paper", yref: "y", x0: 0, x1: 1, y0: 1, y1: 1, line: { color: CHART_COLORS.faint, width: 1, dash: "dot" } }],
                })}
                config={CHART_CONFIG}
              />
            </div>
          ) : (
            <p className="mt-2 text-xs text-ink-soft">|S(jω)| needs a linear plant; this variant is nonlinear, so only the time responses are shown.</p>
          )}
        </>
      )}
    </div>
  );
}
