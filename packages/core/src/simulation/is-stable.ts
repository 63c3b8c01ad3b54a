import type { Complex } from "../linear-algebra/complex.js";

/**
 * Relative margin for the stability verdict: a pole p counts as stable only when
 * Re p < −STABILITY_TOLERANCE · max(1, |p|). Roots from the companion matrix carry rounding
 * errors of roughly 1e-15·|p| for simple roots, more for clustered ones; this margin keeps a
 * pole that is on the imaginary axis in exact arithmetic (an integrator, an undamped pair) from
 * being called stable. Poles slower than about 1e-9 s⁻¹ count as marginal, hence unstable.
 */
export const STABILITY_TOLERANCE = 1e-9;

/**
 * True when every pole lies strictly in the open left half-plane (with the margin above).
 * An empty set of poles (a static loop) is stable.
 * Reference: Åström & Murray, Feedback Systems, 2008, §4.3 (asymptotic stability of LTI systems).
 */
export function isStable(poles: readonly Complex[]): boolean {
  for (const p of poles) {
    if (!(p.re < -STABILITY_TOLERANCE * Math.max(1, Math.hypot(p.re, p.im)))) return false;
  }
  return true;
}
