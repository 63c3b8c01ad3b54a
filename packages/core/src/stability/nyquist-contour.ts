import type { Complex } from "../linear-algebra/complex.js";

/** Initial grid: points per decade, and the largest step of the delay phase ω·θ [rad]. */
export const POINTS_PER_DECADE = 40;
export const DELAY_PHASE_STEP = Math.PI / 8;
/** A step shorter than this fraction of |ω| that still fails the chord test means 1 + L(jω) ≈ 0. */
export const MIN_STEP_FRACTION = 1e-12;

/** One piece of the Nyquist contour, s(t) for t over an increasing initial grid. */
export interface ContourSegment {
  /** s(t) on the contour. */
  at(t: number): { sigma: number; omega: number };
  /** Initial parameter grid, increasing. */
  grid: number[];
  /** Step below which a failing chord test means a closed-loop root on the contour. */
  minStep(a: number, b: number): number;
  onAxis: boolean;
}

/**
 * The upper half (ω ≥ 0) of the indented Nyquist contour as segments, for nyquistStability: a quarter
 * circle s = r·e^(jφ), φ ∈ [0, π/2], when a pole at s = 0 is indented; pieces of the imaginary axis
 * s = jω; semicircles s = jω_k + r_k·e^(jφ), φ ∈ [−π/2, π/2], around the indented poles; up to ω_max.
 * The lower half is its mirror image (conjugate symmetry).
 *
 * The initial axis grid: POINTS_PER_DECADE log-spaced points from 1 % of the smallest pole, zero or
 * indentation size (at most 0.01 rad/s) up to ω_max; with a dead time θ, steps of at most
 * DELAY_PHASE_STEP/θ so the delay's phase −ωθ cannot alias between points; and, for each pole and
 * zero p, the frequencies |p|, |Im p| and |Im p| ± |Re p|, |Im p| ± |Re p|/2 that bracket a resonance.
 * Semicircles start with 16 equal angular steps. contourPhaseChange refines all of them.
 *
 * indents: centres ω_k ≥ 0 and radii r_k, ascending; omegaMax: end of the axis part; features: poles
 * and zeros of L. Reference: K. J. Åström and R. M. Murray, Feedback Systems, 2008, §9.2 (contour
 * with indentations).
 */
export function nyquistContour(indents: readonly { omega: number; radius: number }[], omegaMax: number, delay: number, features: readonly Complex[]): ContourSegment[] {
  // Initial frequency grid on the axis.
  let low = 1;
  for (const q of features) {
    const size = Math.hypot(q.re, q.im);
    if (size > 0) low = Math.min(low, size);
  }
  for (const indent of indents) if (indent.radius > 0) low = Math.min(low, indent.radius);
  low *= 1e-2;
  const points: number[] = [0];
  const decades = Math.log10(omegaMax / low);
  const count = Math.max(2, Math.ceil(decades * POINTS_PER_DECADE));
  for (let i = 0; i <= count; i++) points.push(low * 10 ** ((decades * i) / count));
  if (delay > 0) {
    const step = DELAY_PHASE_STEP / delay;
    for (let w = step; w < omegaMax; w += step) points.push(w);
  }
  for (const q of features) {
    const w = Math.abs(q.im);
    const width = Math.abs(q.re);
    for (const v of [Math.hypot(q.re, q.im), w, w - width, w + width, w - width / 2, w + width / 2]) points.push(v);
  }
  points.push(omegaMax);
  const grid = [...new Set(points.filter((w) => w >= 0 && w <= omegaMax))].sort((a, b) => a - b);

  const segments: ContourSegment[] = [];
  const axis = (from: number, to: number): ContourSegment => ({
    at: (t) => ({ sigma: 0, omega: t }),
    grid: [from, ...grid.filter((w) => w > from && w < to), to],
    minStep: (a, b) => MIN_STEP_FRACTION * Math.max(Math.abs(a), Math.abs(b), 1e-3 * (to - from)),
    onAxis: true,
  });
  const arc = (centre: number, radius: number, from: number, to: number): ContourSegment => {
    const grid: number[] = [];
    const pieces = 16;
    for (let i = 0; i <= pieces; i++) grid.push(from + ((to - from) * i) / pieces);
    return {
      at: (phi) => ({ sigma: radius * Math.cos(phi), omega: centre + radius * Math.sin(phi) }),
      grid,
      minStep: () => MIN_STEP_FRACTION,
      onAxis: false,
    };
  };
  let start = 0;
  for (const indent of indents) {
    if (indent.omega === 0) {
      segments.push(arc(0, indent.radius, 0, Math.PI / 2));
      start = indent.radius;
      continue;
    }
    segments.push(axis(start, indent.omega - indent.radius));
    segments.push(arc(indent.omega, indent.radius, -Math.PI / 2, Math.PI / 2));
    start = indent.omega + indent.radius;
  }
  segments.push(axis(start, omegaMax));
  return segments;
}

