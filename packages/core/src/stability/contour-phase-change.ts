import type { Complex } from "../linear-algebra/complex.js";
import type { ContourSegment } from "./nyquist-contour.js";

/** Adaptive grid: accept a step when |F(b) − F(a)| ≤ CHORD_RATIO·min(|F(a)|, |F(b)|) (F = 1 + L);
 *  the phase step is then below 2·asin(CHORD_RATIO/2) ≈ 0.34 rad. */
export const CHORD_RATIO = 0.35;
/** Tighter ratio on steps where L crosses the negative real axis. */
export const CROSSING_CHORD_RATIO = 0.05;

export type PhaseChangeResult =
  | { kind: "ok"; phase: number; evaluations: number }
  | { kind: "marginal"; omega: number; evaluations: number }
  | { kind: "budget"; evaluations: number };

/**
 * Unwrapped change of arg F(s) along one contour segment, by adaptive bisection of its initial grid:
 * a step [a, b] is accepted when |F(b) − F(a)| ≤ CHORD_RATIO·min(|F(a)|, |F(b)|) — the chord then
 * stays away from 0 and the phase step, the principal value of arg(F(b)/F(a)) = atan2(Im, Re) of
 * F(b)·conj F(a), is well below π, so the sum of the steps is the unwrapped phase change. On the
 * imaginary axis, steps across which L = F − 1 crosses the negative real axis must meet the tighter
 * CROSSING_CHORD_RATIO (the critical region around −1). A step that reaches segment.minStep and
 * still fails, or a zero or non-finite value, means F vanishes on the contour: "marginal". More than
 * `budget` evaluations: "budget".
 *
 * Reference: the argument principle as used in K. J. Åström and R. M. Murray, Feedback Systems, 2008,
 * §9.2; adaptive bisection on phase increments is common practice for winding numbers.
 */
export function contourPhaseChange(segment: ContourSegment, F: (sigma: number, omega: number) => Complex, budget: number): PhaseChangeResult {
  let evaluations = 0;
  const value = (t: number): Complex => {
    evaluations++;
    const s = segment.at(t);
    return F(s.sigma, s.omega);
  };
  let phase = 0;
  const grid = segment.grid;
  let left = value(grid[0]);
  for (let g = 1; g < grid.length; g++) {
    const right = value(grid[g]);
    // Explicit stack of intervals [a, b] with their values.
    const stack: { a: number; b: number; fa: Complex; fb: Complex }[] = [{ a: grid[g - 1], b: grid[g], fa: left, fb: right }];
    while (stack.length > 0) {
      const { a, b, fa, fb } = stack.pop()!;
      const ma = Math.hypot(fa.re, fa.im);
      const mb = Math.hypot(fb.re, fb.im);
      if (!(ma > 0 && mb > 0) || !Number.isFinite(ma) || !Number.isFinite(mb)) {
        return { kind: "marginal", omega: segment.at(ma > 0 ? b : a).omega, evaluations };
      }
      const chord = Math.hypot(fb.re - fa.re, fb.im - fa.im);
      const la = fa.im;
      const lb = fb.im;
      const crossesNegativeAxis = segment.onAxis && la * lb <= 0 && (fa.re - 1 < 0 || fb.re - 1 < 0);
      const ratio = crossesNegativeAxis ? CROSSING_CHORD_RATIO : CHORD_RATIO;
      if (chord <= ratio * Math.min(ma, mb)) {
        phase += Math.atan2(fa.re * fb.im - fa.im * fb.re, fa.re * fb.re + fa.im * fb.im);
        continue;
      }
      if (b - a <= segment.minStep(a, b)) {
        if (chord <= CHORD_RATIO * Math.min(ma, mb)) {
          phase += Math.atan2(fa.re * fb.im - fa.im * fb.re, fa.re * fb.re + fa.im * fb.im);
          continue;
        }
        return { kind: "marginal", omega: segment.at((a + b) / 2).omega, evaluations };
      }
      if (evaluations >= budget) return { kind: "budget", evaluations };
      const mid = (a + b) / 2;
      const fm = value(mid);
      stack.push({ a: mid, b, fa: fm, fb }, { a, b: mid, fa, fb: fm });
    }
    left = right;
  }
  return { kind: "ok", phase, evaluations };
}

