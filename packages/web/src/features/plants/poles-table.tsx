import type { Complex } from "@loopyard/core";
import { NumberCell } from "../../components/number-cell.js";

/** What a pole means for the response: a real pole p < 0 is a lag with time constant τ = −1/p; p > 0 grows as e^(pt). */
export function poleMeaning(p: Complex): { stable: boolean; verdict: string; timeConstant: number | null; naturalFrequency: number | null; damping: number | null } {
  const magnitude = Math.hypot(p.re, p.im);
  const isReal = Math.abs(p.im) <= 1e-12 * Math.max(1, magnitude);
  const stable = p.re < 0;
  const verdict = stable ? "stable" : p.re === 0 ? "on the imaginary axis" : isReal ? `unstable: grows as e^(${formatRate(p.re)}t)` : "unstable: growing oscillation";
  return {
    stable,
    verdict,
    // Only a decaying real pole has a time constant; an unstable one has none (not a negative τ).
    timeConstant: isReal && stable ? -1 / p.re : null,
    naturalFrequency: isReal ? null : magnitude,
    damping: isReal || magnitude === 0 ? null : -p.re / magnitude,
  };
}

function formatRate(value: number): string {
  return Number(value.toPrecision(3)).toString();
}

/**
 * The poles of a plant with what they mean for its response: a real pole p < 0 is a lag with time
 * constant τ = −1/p; a complex pair has natural frequency ωn = |p| and damping ζ = −Re p/|p|
 * (standard second-order parametrisation, closed form); a pole with Re p ≥ 0 is marked unstable.
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
            const m = poleMeaning(p);
            return (
              <tr key={i} data-testid="pole-row">
                <NumberCell value={p.re} />
                <NumberCell value={m.naturalFrequency === null ? 0 : p.im} />
                <NumberCell value={m.timeConstant} />
                <NumberCell value={m.naturalFrequency} />
                <NumberCell value={m.damping} />
                <td className={`px-3 py-1.5 text-xs ${m.stable ? "text-ink-soft" : "font-medium text-rust"}`}>{m.verdict}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}

/** The zeros of a plant; a right-half-plane zero (Re z > 0) is marked: the step response starts the wrong way. */
export function ZerosTable({ zeros }: { zeros: readonly Complex[] }) {
  if (zeros.length === 0) return <p className="text-sm text-ink-soft" data-testid="zeros-none">No finite zeros: the numerator is a constant.</p>;
  return (
    <table className="w-full text-sm" data-testid="zeros-table">
      <thead>
        <tr className="border-b border-line text-xs text-ink-soft">
          <th className="px-3 py-1.5 text-right font-medium">Re</th>
          <th className="px-3 py-1.5 text-right font-medium">Im</th>
          <th className="px-3 py-1.5 text-left font-medium" />
        </tr>
      </thead>
      <tbody className="divide-y divide-line-soft">
        {zeros.map((z, i) => (
          <tr key={i} data-testid="zero-row">
            <NumberCell value={z.re} />
            <NumberCell value={z.im} />
            <td className={`px-3 py-1.5 text-xs ${z.re > 0 ? "font-medium text-rust" : "text-ink-soft"}`}>{zeroVerdict(z)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

/** "right half-plane: the response starts the wrong way", "left half-plane", "on the imaginary axis". */
export function zeroVerdict(z: Complex): string {
  if (z.re > 0) return "right half-plane: the step response starts the wrong way";
  return z.re === 0 ? "on the imaginary axis" : "left half-plane";
}
