import type { Complex } from "../linear-algebra/complex.js";
import { polynomialRoots } from "../linear-algebra/polynomial-roots.js";
import { assertValidLoop } from "./assert-valid-loop.js";
import { loopValueAt, type LoopTransferFunction } from "./evaluate-loop.js";
import { nyquistTailFrequency } from "./nyquist-tail-frequency.js";
import { nyquistContour } from "./nyquist-contour.js";
import { contourPhaseChange } from "./contour-phase-change.js";
import { clusterAxisPoles, indentationRadius } from "./axis-pole-indentation.js";

/** An open-loop pole counts as on the imaginary axis when |Re p| ≤ AXIS_TOLERANCE·max(1, |p|)
 *  (roots of a double pole come out of the companion matrix only to about √eps ≈ 1e-8). */
export const AXIS_TOLERANCE = 1e-6;
/** Cap on the number of evaluations of L along the contour. */
export const MAX_EVALUATIONS = 2_000_000;
/** 1 + D within this of 0 (no delay) is an ill-posed loop. */
const WELL_POSED_TOLERANCE = 1e-12;

/** Verdict of nyquistStability. */
export interface NyquistVerdict {
  /** True when the closed loop has no pole in the closed right half-plane. */
  stable: boolean;
  /** N: net clockwise encirclements of −1 by L(s) along the Nyquist contour (NaN when not counted, see reason). */
  encirclements: number;
  /** P: poles of L in the open right half-plane. */
  openLoopRhpPoles: number;
  /** Why the loop is not stable (or why the count could not be made). */
  reason?: string;
}

/**
 * Nyquist stability verdict for L(s) = num(s)/den(s)·e^(−delay·s) under negative unity feedback.
 *
 * Nyquist criterion: Z = N + P, where Z = closed-loop poles (roots of 1 + L) in the right
 * half-plane, P = poles of L in the open right half-plane (roots of den by polynomialRoots), and N =
 * net clockwise encirclements of −1 by L(s) — i.e. of 0 by F = 1 + L — as s runs along the Nyquist
 * contour: up the imaginary axis from −j∞ to +j∞, then back along a large arc through the right
 * half-plane. The loop is stable iff Z = 0 and no closed-loop root lies on the contour.
 *
 * - Indentations: a pole of L on the imaginary axis at jω_k (an integrator at 0, an undamped pair)
 *   is passed on a small semicircle s = jω_k + r·e^(jφ), φ from −π/2 to π/2, to its right, so it
 *   stays outside the contour and is not counted in P. r = INDENT_FRACTION × distance to the
 *   nearest other pole or zero, shrunk until |L| ≥ INDENT_MIN_GAIN on the semicircle; near a pole
 *   of order m, arg L then turns by about −mπ along it.
 * - Large arc: nyquistTailFrequency gives ω_max such that for |s| ≥ ω_max, Re s ≥ 0, 1 + L stays in
 *   a disc around a real centre c (c = 1 for strictly proper L: |L| ≤ TAIL_GAIN there, so the arc
 *   maps to a neighbourhood of 0 of L). The arc from +jω_max to −jω_max then changes arg F by
 *   exactly −2·arg(F(jω_max)/c) (principal value).
 * - Biproper L (deg num = deg den) with D = lim L/e^(−θs) at infinity: without delay, 1 + D = 0 is
 *   an ill-posed loop (not stable). With a delay, |D| ≥ 1 is a neutral closed loop whose
 *   characteristic equation has chains of roots approaching Re s = ln|D|/θ ≥ 0: reported not stable
 *   with a reason. With |D| < 1 the arc is handled as above.
 * - Winding: arg F(jω) is unwrapped on an adaptive grid from ω = 0⁺ (or the indentation at 0) to
 *   ω_max: an initial grid of POINTS_PER_DECADE log-spaced points, steps of at most
 *   DELAY_PHASE_STEP/θ in ω, and points at the poles' and zeros' frequencies; each step is halved
 *   until |F(b) − F(a)| ≤ CHORD_RATIO·min|F| (CROSSING_CHORD_RATIO where L crosses the negative real
 *   axis), so consecutive phases differ by well under π. The part ω < 0 follows by conjugate
 *   symmetry, F(−jω) = conj F(jω), and doubles the half-contour's phase change. A step that cannot
 *   meet the test before MIN_STEP_FRACTION·ω means F ≈ 0 on the axis: a closed-loop pole on the
 *   imaginary axis (marginal), reported not stable.
 *
 * - An imaginary-axis pole of den that is also a root of num stays a closed-loop pole (feedback
 *   cannot move it): reported not stable. Z counts the right-half-plane roots of
 *   den(s) + num(s)·e^(−θs), so a cancelled right-half-plane pole counts too (it is in P).
 *
 * Limits: the indentation radius stops shrinking after INDENT_SHRINKS steps, so a closed-loop root
 * closer than about 1e-11·max(1, ω_k) to an integrator or undamped pole could be missed; at most
 * MAX_EVALUATIONS evaluations of L (else not stable, with a reason). Cost: about 0.1–0.2 ms for a
 * low-order loop — fine per candidate for dead-time loops, but rational loops should use isHurwitz.
 * Verdicts are numerical failures returned as { stable: false, reason }, never thrown.
 *
 * loop: num, den finite, den not all zero, deg num ≤ deg den (a proper loop), delay finite ≥ 0;
 * a RangeError names the bad field otherwise.
 *
 * References: H. Nyquist, "Regeneration theory", Bell System Technical Journal 11(1), 126–147,
 * 1932; K. J. Åström and R. M. Murray, Feedback Systems, Princeton University Press, 2008, §9.2
 * (Nyquist criterion, indentations around imaginary-axis poles); for neutral delay systems
 * J. K. Hale and S. M. Verduyn Lunel, Introduction to Functional Differential Equations, Springer,
 * 1993, ch. 9.
 */
export function nyquistStability(loop: LoopTransferFunction): NyquistVerdict {
  const { num, den, delay } = assertValidLoop(loop);

  const poles = polynomialRoots(den);
  const zeros = num.length > 1 ? polynomialRoots(num) : [];
  let openLoopRhpPoles = 0;
  const axisPoles: Complex[] = [];
  let rootRadius = 0;
  for (const p of poles) {
    const size = Math.hypot(p.re, p.im);
    rootRadius = Math.max(rootRadius, size);
    if (Math.abs(p.re) <= AXIS_TOLERANCE * Math.max(1, size)) axisPoles.push(p);
    else if (p.re > 0) openLoopRhpPoles++;
  }
  const notStable = (reason: string): NyquistVerdict => ({ stable: false, encirclements: Number.NaN, openLoopRhpPoles, reason });

  const d = num.length === den.length ? num[0] / den[0] : 0;
  if (delay === 0 && Math.abs(1 + d) <= WELL_POSED_TOLERANCE * Math.max(1, Math.abs(d))) {
    return notStable("the loop is ill-posed: 1 + L(s) tends to 0 at high frequency (num and den of equal degree with num₀/den₀ = −1)");
  }
  if (delay > 0 && Math.abs(d) >= 1) {
    return notStable(
      `the closed loop is a neutral delay system: |L| tends to |num₀/den₀| = ${Math.abs(d)} ≥ 1 at high frequency with a dead time, so it has infinitely many poles near or right of the imaginary axis`,
    );
  }

  const clusters = clusterAxisPoles(axisPoles, AXIS_TOLERANCE);
  for (const { omega } of clusters) {
    if (num.length === 0 || Math.hypot(...complexPolynomial(num, 0, omega)) <= 1e-9 * absPolynomial(num, Math.abs(omega))) {
      return notStable(`the loop has an imaginary-axis pole at s = ${omega === 0 ? "0" : `±${omega}j`} that feedback does not move (cancelled by a zero of num)`);
    }
  }

  const tail = nyquistTailFrequency(num, den, delay, rootRadius);
  if (tail === null) return notStable("no frequency was found beyond which the loop stays away from −1");
  const { omegaMax, centre } = tail;

  const F = (sigma: number, omega: number): Complex => {
    const l = loopValueAt(num, den, delay, sigma, omega);
    return { re: 1 + l.re, im: l.im };
  };

  // Indentations for clusters with ω_k ≥ 0 (the mirror images follow by symmetry).
  const features = [...poles, ...zeros];
  const indents: { omega: number; radius: number }[] = [];
  for (const cluster of clusters) {
    if (cluster.omega >= 0) indents.push({ omega: cluster.omega, radius: indentationRadius(cluster, features, num, den, delay) });
  }
  indents.sort((a, b) => a.omega - b.omega);

  const segments = nyquistContour(indents, omegaMax, delay, features);
  let total = 0;
  let evaluations = 0;
  for (const segment of segments) {
    const result = contourPhaseChange(segment, F, MAX_EVALUATIONS - evaluations);
    evaluations += result.evaluations;
    if (result.kind === "marginal") {
      return notStable(`the closed loop has a pole on (or within rounding of) the imaginary axis near ω = ${result.omega.toPrecision(6)} rad/s`);
    }
    if (result.kind === "budget") return notStable(`the frequency grid needed more than ${MAX_EVALUATIONS} evaluations of L`);
    total += result.phase;
  }
  // Both halves of the imaginary-axis part, then the large arc.
  const fMax = F(0, omegaMax);
  total = 2 * total - 2 * Math.atan2(fMax.im / centre, fMax.re / centre);
  const turns = total / (2 * Math.PI);
  const counterClockwise = Math.round(turns);
  if (Math.abs(turns - counterClockwise) > 0.1) {
    return notStable(`the winding number could not be resolved (${turns.toFixed(3)} turns)`);
  }
  const encirclements = -counterClockwise + 0; // clockwise count; + 0 turns −0 into 0
  const closedLoopRhpPoles = encirclements + openLoopRhpPoles;
  if (closedLoopRhpPoles === 0) return { stable: true, encirclements, openLoopRhpPoles };
  return {
    stable: false,
    encirclements,
    openLoopRhpPoles,
    reason:
      closedLoopRhpPoles > 0
        ? `Z = N + P = ${encirclements} + ${openLoopRhpPoles} = ${closedLoopRhpPoles} closed-loop poles in the right half-plane`
        : `inconsistent count Z = N + P = ${closedLoopRhpPoles} < 0; the loop is not resolved`,
  };
}

/** num(σ + jω) as [re, im]. */
function complexPolynomial(p: readonly number[], sigma: number, omega: number): [number, number] {
  let re = 0;
  let im = 0;
  for (const c of p) {
    const r = re * sigma - im * omega + c;
    im = re * omega + im * sigma;
    re = r;
  }
  return [re, im];
}

/** Σ|p_k|·x^k, the scale against which |p(jx)| is judged to vanish. */
function absPolynomial(p: readonly number[], x: number): number {
  let acc = 0;
  for (const c of p) acc = acc * x + Math.abs(c);
  return acc;
}
