import type { ComparisonResultJson } from "./comparison-result-types.js";
import { numberOf } from "./comparison-result-types.js";

/**
 * The agreement of the criteria over the pre-scan: Kendall's τ_b of every pair (1: they order
 * designs alike; −1: what one prefers the other rejects), as a matrix whose cells darken with |τ|
 * (one hue; the sign printed and marked "opposed" below zero), with core's one-line reading.
 */
export function AgreementMatrix({ result }: { result: ComparisonResultJson }) {
  const { agreement, columns } = result;
  const labelOf = (key: string) => columns.find((c) => c.key === key)?.label ?? key;
  return (
    <div data-testid="agreement">
      <p className="mb-3 text-sm text-ink" data-testid="agreement-reading">
        {agreement.reading}
      </p>
      <div className="overflow-x-auto">
        <table className="text-xs">
          <thead>
            <tr>
              <th />
              {agreement.columns.map((key) => (
                <th key={key} className="px-1 pb-1 text-center font-medium text-ink-soft">
                  {labelOf(key)}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {agreement.columns.map((a, i) => (
              <tr key={a}>
                <th className="whitespace-nowrap pr-2 text-right font-medium text-ink-soft">{labelOf(a)}</th>
                {agreement.columns.map((b, j) => {
                  const tau = numberOf(agreement.tau[i]?.[j] ?? null);
                  const strength = Number.isNaN(tau) ? 0 : Math.abs(tau);
                  const lightness = 99 - strength * 55;
                  return (
                    <td
                      key={b}
                      className="h-9 w-16 border border-sheet text-center font-mono tabular"
                      style={{ background: Number.isNaN(tau) ? "transparent" : `hsl(205 35% ${lightness}%)`, color: lightness < 62 ? "#fff" : "#22262b" }}
                      title={Number.isNaN(tau) ? "too few candidates with both values" : `τ(${labelOf(a)}, ${labelOf(b)}) = ${tau.toFixed(3)}`}
                    >
                      {Number.isNaN(tau) ? "—" : tau.toFixed(2).replace("-", "−")}
                      {tau < -0.2 ? <span className="block text-[9px] leading-none">opposed</span> : null}
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="mt-2 text-xs text-ink-soft">
        Kendall's τ over the {agreement.candidates} pre-scan candidates stable on every variant, each criterion aggregated over the family and oriented so that smaller is better.
      </p>
    </div>
  );
}
