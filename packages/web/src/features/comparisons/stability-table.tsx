import type { ComparisonResultJson } from "./comparison-result-types.js";
import { numberOf } from "./comparison-result-types.js";
import { formatPercent } from "./format-value.js";

/** A pick "holds" under a variation when no parameter moves more than this [%]. */
export const ROBUST_MOVE_PERCENT = 10;

/**
 * How each pick moves when the question changes a little: each variant left out, each quadratic
 * weight r halved and doubled. A cell gives the largest parameter move [%] and the largest change
 * of its regrets [points]; moves over ROBUST_MOVE_PERCENT are marked as knife-edge.
 */
export function StabilityTable({ result }: { result: ComparisonResultJson }) {
  const { stability, columns } = result;
  if (stability.length === 0) {
    return <p className="text-sm text-ink-soft">This comparison was run without the stability check (budget.stability off), or its family has one variant and no quadratic contender.</p>;
  }
  const contenders = result.picks.map((p, k) => columns[k]?.label ?? p.contender);
  return (
    <div className="overflow-x-auto" data-testid="stability">
      <table className="w-full text-xs">
        <thead>
          <tr className="border-b border-line text-left text-ink-soft">
            <th className="px-2 py-1.5 font-medium">Change</th>
            {contenders.map((c) => (
              <th key={c} className="whitespace-nowrap px-2 py-1.5 text-right font-medium">
                {c}'s pick
              </th>
            ))}
          </tr>
        </thead>
        <tbody className="divide-y divide-line-soft">
          {stability.map((entry) => (
            <tr key={entry.label} data-testid="stability-row">
              <td className="whitespace-nowrap px-2 py-1.5">{entry.label}</td>
              {entry.picks.map((pick, k) => {
                const move = numberOf(pick.maxMove);
                const shift = numberOf(pick.regretShift);
                const knife = Number.isFinite(move) && move > ROBUST_MOVE_PERCENT;
                return (
                  <td key={k} className={`whitespace-nowrap px-2 py-1.5 text-right font-mono tabular ${knife ? "bg-amber-wash text-ink" : "text-ink-soft"}`}>
                    {!pick.found ? (
                      <span className="text-rust">no pick</span>
                    ) : (
                      <>
                        {knife ? <span className="mr-1 text-amber" aria-label="knife-edge">◆</span> : null}
                        moves {formatPercent(move)}<span className="block text-[10px] text-ink-faint">regret ±{formatPercent(shift).replace(" %", " pts")}</span>
                      </>
                    )}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-2 text-xs text-ink-soft">
        Largest parameter move of each pick, in per cent of its value, and the largest change of its regrets in percentage points; ◆ marks a move over {ROBUST_MOVE_PERCENT} %: a knife-edge answer.
      </p>
    </div>
  );
}
