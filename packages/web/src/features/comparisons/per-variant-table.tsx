import type { ComparisonResultJson } from "./comparison-result-types.js";
import { numberOf } from "./comparison-result-types.js";
import { formatFigure } from "./format-value.js";

/**
 * Each pick's scores on every variant (rows: picks, then their variants), one column per contender
 * and judge; in each pick's rows the variant that sets its worst value of a column is marked ▲ (it
 * sets the worst-case aggregate), and a last row per pick gives the spread over the family (min – max).
 */
export function PerVariantTable({ result }: { result: ComparisonResultJson }) {
  const { columns, variants } = result;
  return (
    <div className="overflow-x-auto" data-testid="per-variant">
      <table className="w-full text-xs">
        <thead>
          <tr className="border-b border-line text-left text-ink-soft">
            <th className="px-2 py-1.5 font-medium">Pick · variant</th>
            {columns.map((c) => (
              <th key={c.key} className="px-2 py-1.5 text-right font-medium">
                {c.label}
                <span className="block font-mono text-[10px] font-normal text-ink-faint">{c.role}</span>
              </th>
            ))}
          </tr>
        </thead>
        {result.perVariant.map((pick, p) => (
          <tbody key={pick.contender} className="border-b border-line" data-testid="per-variant-pick">
            {variants.map((variant, f) => (
              <tr key={variant} className={f === 0 ? "border-t border-line" : ""}>
                <td className="whitespace-nowrap px-2 py-1">
                  {f === 0 ? <span className="font-medium text-ink">{columns[p]?.label ?? pick.contender}</span> : null}
                  <span className="ml-2 text-ink-soft">{variant}</span>
                </td>
                {columns.map((c, k) => {
                  const worst = pick.worst[k] === f;
                  return (
                    <td key={c.key} className={`px-2 py-1 text-right font-mono tabular ${worst ? "bg-amber-wash font-semibold text-ink" : "text-ink-soft"}`} data-worst={worst ? "true" : undefined}>
                      {worst ? <span aria-label="worst variant" className="mr-1 text-amber">▲</span> : null}
                      {formatFigure(numberOf(pick.scores[f]?.[k] ?? null))}
                    </td>
                  );
                })}
              </tr>
            ))}
            <tr className="text-ink-faint">
              <td className="px-2 pb-2 pt-0.5 italic">spread over the family</td>
              {columns.map((c, k) => {
                const s = pick.spread[k];
                return (
                  <td key={c.key} className="px-2 pb-2 pt-0.5 text-right font-mono tabular" data-testid={c.role === "judge" ? "judge-spread" : undefined}>
                    {s ? `${formatFigure(numberOf(s.min))} – ${formatFigure(numberOf(s.max))}` : "—"}
                  </td>
                );
              })}
            </tr>
          </tbody>
        ))}
      </table>
    </div>
  );
}
