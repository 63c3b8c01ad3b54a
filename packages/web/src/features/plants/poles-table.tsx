import type { Complex } from "@loopyard/core";
import { NumberCell } from "../../components/number-cell.js";

/**
 * The poles of a plant with what they mean for its response: a real pole p < 0 is a lag with time
 * constant τ = −1/p; a complex pair has natural frequency ωn = |p| and damping ζ = −Re p/|p|
 * (standard second-order parametrisation, closed form).
 */
export function PolesTable({ poles }: { poles: readonly Complex[] }) {
  if (poles.length === 0) return <p className="text-sm text-ink-soft">A static gain: no poles.</p>;
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm" data-testid="poles-table">
        <thead>
          <tr className="border-b border-line text-xs text-ink-soft">
            <th className="px-3 py-1.5 text-right font-medium">Re</th>
            <th className="px-3 py-1.5 text-right font-medium">Im</th>
            <th className="px-3 py-1.5 text-right font-medium">τ [s]</th>
            <th className="px-3 py-1.5 text-right font-medium">ωn [rad/s]</th>
            <th className="px-3 py-1.5 text-right font-medium">ζ</th>
            <th className="px-3 py-1.5 text-left font-medium" />
          </tr>
        </thead>
        <tbody className="divide-y divide-line-soft">
          {poles.map((p, i) => {
            const magnitude = Math.hypot(p.re, p.im);
            const isReal = Math.abs(p.im) <= 1e-12 * Math.max(1, magnitude);
            const stable = p.re < 0;
            return (
              <tr key={i}>
                <NumberCell value={p.re} />
                <NumberCell value={isReal ? 0 : p.im} />
                <NumberCell value={isReal && p.re !== 0 ? -1 / p.re : null} />
                <NumberCell value={isReal ? null : magnitude} />
                <NumberCell value={isReal || magnitude === 0 ? null : -p.re / magnitude} />
                <td className={`px-3 py-1.5 text-xs ${stable ? "text-ink-soft" : "text-rust"}`}>
                  {stable ? "stable" : p.re === 0 ? "on the imaginary axis" : "unstable"}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
