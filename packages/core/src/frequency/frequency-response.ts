import { assertValidLoop } from "../stability/assert-valid-loop.js";
import { loopValueAt, type LoopTransferFunction } from "../stability/evaluate-loop.js";
import { bisectSignChange } from "./bisect-sign-change.js";
import { frequencySpan } from "./frequency-span.js";
import { gridPeak, type FrequencyPeak } from "./grid-peak.js";
import type { SensitivityWeight } from "./sensitivity-weight.js";
import { weightedSensitivityPeak } from "./weighted-sensitivity-peak.js";

/** Where |L| < TRACK_GAIN (and the loop is still SMALL_GAIN from its high-frequency form) arg L may change by up to COARSE_PHASE_STEP between neighbours. */
export const TRACK_GAIN = 0.1;
/** π/2: enough to see every crossing of the negative real axis (each quadrant is sampled). */
export const COARSE_PHASE_STEP = Math.PI / 2;
/** Base grid density: log-spaced points per decade before refinement. */
export const POINTS_PER_DECADE = 40;
/** Largest change of arg(1 + L) (and of arg L where |L| ≥ SMALL_GAIN) between neighbours [rad]. */
export const MAX_PHASE_STEP = 0.2;
/** Largest change of ln|1 + L| (and of ln|L| where |L| ≥ SMALL_GAIN) between neighbours. */
export const MAX_LOG_STEP = 0.2;
/**
 * Where |L(jω) − D·e^(−jωθ)| < SMALL_GAIN (for a strictly proper loop: |L| < SMALL_GAIN) the loop's
 * own phase and gain no longer drive refinement (S ≈ 1, T ≈ L there, or L ≈ its high-frequency form).
 */
export const SMALL_GAIN = 1e-3;
/**
 * Phase crossovers are located only where |L| is at least this fraction of the largest |L| next to
 * any crossing: the others cannot set the gain margin (a dead-time loop has thousands of them).
 */
export const PHASE_CROSSOVER_RELATIVE_GAIN = 0.1;
/** Phase crossovers with |L| below this are not reported (a gain margin above 1/SMALL_GAIN = 60 dB). */
export const PHASE_CROSSOVER_MIN_GAIN = SMALL_GAIN;
/** The grid extends upward by decades until |L(jω) − D·e^(−jωθ)| ≤ TAIL_GAIN·max(1, |D|). */
export const TAIL_GAIN = 1e-6;
/** At most this many decades are added by the tail extension. */
export const MAX_TAIL_DECADES = 30;
/** Refinement never splits an interval narrower than this in ln ω. */
export const MIN_LOG_STEP = 1e-9;
/** Cap on the grid size (the refinement stops adding points beyond it). */
export const MAX_POINTS = 200_000;
/** Crossing frequencies are bisected to this width in ln ω (relative frequency 1e-13). */
export const CROSSING_TOLERANCE = 1e-13;
/** The bandwidth level of |S|: 1/√2 (−3 dB). */
export const BANDWIDTH_LEVEL = Math.SQRT1_2;

/** Complex samples on a frequency grid, real and imaginary parts apart. */
export interface ComplexSamples {
  re: Float64Array;
  im: Float64Array;
}

/** Options of frequencyResponse. */
export interface FrequencyResponseOptions {
  /** A sensitivity weight W(s): adds `weightedPeak` = ‖W·S‖∞ and `weightMagnitude` = |W(jω)|. */
  weight?: SensitivityWeight;
}

/**
 * The frequency response of a loop under negative unity feedback on an adaptive grid, and the
 * figures read from it. See frequencyResponse.
 */
export interface FrequencyResponse {
  /** ω [rad/s], ascending, > 0: the refined grid, including every peak and crossing below. */
  omega: Float64Array;
  /** L(jω) = num(jω)/den(jω)·e^(−jωθ). */
  L: ComplexSamples;
  /** S(jω) = 1/(1 + L(jω)), the sensitivity. */
  S: ComplexSamples;
  /** T(jω) = L(jω)/(1 + L(jω)) = 1 − S(jω), the complementary sensitivity. */
  T: ComplexSamples;
  /** |W(jω)| on the grid when options.weight is given. */
  weightMagnitude?: Float64Array;
  /** Ms = sup_ω |S(jω)| and where (ω = 0 or Infinity when the supremum is the low- or high-frequency limit). */
  sensitivityPeak: FrequencyPeak;
  /** Mt = sup_ω |T(jω)| and where. */
  complementaryPeak: FrequencyPeak;
  /** ‖W·S‖∞ and where, when options.weight is given; else null. */
  weightedPeak: FrequencyPeak | null;
  /** Gain crossover frequencies ω (|L(jω)| = 1), ascending. */
  gainCrossovers: number[];
  /** For each gain crossover: true when |L| falls through 1 there (from above), false when it rises. */
  gainCrossoverFalling: boolean[];
  /**
   * Phase crossover frequencies ω (L(jω) real and negative), ascending: those with |L| ≥
   * PHASE_CROSSOVER_MIN_GAIN and ≥ PHASE_CROSSOVER_RELATIVE_GAIN × the largest |L| at a crossing.
   */
  phaseCrossovers: number[];
  /** ωB: the first frequency where |S| crosses 1/√2 from below; 0 when |S| ≥ 1/√2 already at the grid's low end, Infinity when never. */
  bandwidth: number;
  /** D = lim_{ω→∞} L(jω)·e^(jωθ): num₀/den₀ for a biproper loop, 0 for a strictly proper one. */
  highFrequencyGain: number;
}

/**
 * Frequency response of L(s) = num(s)/den(s)·e^(−θs) under negative unity feedback: L, S = 1/(1 + L)
 * and T = L/(1 + L) at s = jω, the dead time exactly as e^(−jωθ) (evaluateLoop), on an adaptive
 * logarithmic grid, with the peaks and crossings located to near machine precision.
 *
 * Grid:
 * 1. Span (frequencySpan): two decades below the slowest and above the fastest of the open-loop
 *    poles and zeros, the closed-loop poles (dead time as its [6/6] Padé approximant, only to place
 *    the grid) and 1/θ; then extended upward by decades until the rational part has settled,
 *    |L(jω) − D·e^(−jωθ)| ≤ TAIL_GAIN·max(1, |D|), D = lim L·e^(θs) (0 when strictly proper).
 * 2. POINTS_PER_DECADE log-spaced points, plus the hint frequencies of lightly damped roots
 *    (|Im p| + k·|Re p|, k = −3…3), so a narrow resonance cannot fall between points.
 * 3. Refinement: where |L − D·e^(−jωθ)| ≥ SMALL_GAIN at either end (the loop is not yet within
 *    SMALL_GAIN of its high-frequency form; for a strictly proper loop: |L| ≥ SMALL_GAIN), an
 *    interval [ω_a, ω_b] is halved at √(ω_a·ω_b) while, between its ends, arg(1 + L), ln|1 + L|,
 *    arg L or ln|L| changes by more than MAX_PHASE_STEP [rad] / MAX_LOG_STEP (the dead time's own
 *    turn θ·(ω_b − ω_a) is tested apart, since a principal-value difference would alias it) — by more than
 *    COARSE_PHASE_STEP = π/2 where |L| < TRACK_GAIN at both ends (S, T ≈ 1, L there; π/2 still
 *    samples every quadrant, so no crossing of the negative real axis is skipped and each peak of
 *    |S| stays unimodal between neighbours). The dead time's phase lag makes this dense (steps
 *    ≤ MAX_PHASE_STEP/θ, then ≤ (π/2)/θ) up to where the loop reaches its high-frequency form;
 *    beyond, |S| and |T| are within about SMALL_GAIN of their limits, which are handled in closed
 *    form below. Stops at MIN_LOG_STEP or MAX_POINTS. Cost: a few hundred points for a rational
 *    loop; for a dead-time loop of relative degree 1 about ω₁θ/(π/2) points, ω₁ where |L| = SMALL_GAIN.
 * Figures (stopping tolerances as named constants):
 * - peaks of |S|, |T| (and |W·S|): the local maxima of the samples refined by golden-section
 *   search on ln ω to PEAK_TOLERANCE (gridPeak), compared with the limits at ω = 0 (from L(0);
 *   S(0) = 0 and T(0) = 1 with an integrator) and the high-frequency limits
 *   1/|1 + D| and |D|/|1 + D| (no dead time) or 1/(1 − |D|) and |D|/(1 − |D|) (dead time and
 *   D ≠ 0: e^(−jωθ) turns D through every phase; |D| < 1 for a stable loop);
 * - gain crossovers: sign changes of ln|L| between neighbours, bisected on ln ω to CROSSING_TOLERANCE;
 * - phase crossovers: sign changes of Im L with Re L < 0 (L on the negative real axis, phase
 *   −180° modulo 360°, no unwrapping needed), bisected likewise; those with |L| <
 *   PHASE_CROSSOVER_MIN_GAIN, or below PHASE_CROSSOVER_RELATIVE_GAIN times the largest |L| at a
 *   crossing (they cannot set the gain margin), are skipped, as are jumps across an
 *   imaginary-axis pole of L;
 * - bandwidth ωB: the first frequency where |S| crosses 1/√2 from below (Skogestad & Postlethwaite
 *   2005, §2.4.5, who prefer it to the |T| definition ωBT because it measures where feedback
 *   starts to help), bisected likewise.
 * The located points are merged into the returned grid.
 *
 * loop: finite num and den, den not all zero, deg num ≤ deg den (proper), delay finite ≥ 0; a
 * RangeError names the bad field. Stability is not checked: the figures of an unstable loop are
 * computed but mean nothing (callers report them only for stable loops).
 *
 * References: S. Skogestad and I. Postlethwaite, Multivariable Feedback Control, 2nd ed., 2005,
 * §2.4 (L, S, T, peaks, crossover and bandwidth); K. J. Åström and T. Hägglund, Advanced PID
 * Control, ISA, 2006, ch. 4 (Ms, Mt and the margins as robustness measures).
 */
export function frequencyResponse(loop: LoopTransferFunction, options: FrequencyResponseOptions = {}): FrequencyResponse {
  const { num, den, delay } = assertValidLoop(loop);
  const d = num.length === den.length ? num[0] / den[0] : 0;
  const span = frequencySpan(num, den, delay);
  const value = (omega: number) => loopValueAt(num, den, delay, 0, omega);
  // |L(jω) − D·e^(−jωθ)|: how far the loop still is from its high-frequency form.
  const deviation = (omega: number, l: { re: number; im: number }) =>
    d === 0 ? abs2(l.re, l.im) : abs2(l.re - d * Math.cos(omega * delay), l.im + d * Math.sin(omega * delay));

  // 1. Span with the tail extension.
  const lo = span.omegaMin;
  let hi = span.omegaMax;
  const tailLevel = TAIL_GAIN * Math.max(1, Math.abs(d));
  for (let k = 0; k < MAX_TAIL_DECADES; k++) {
    const rational = loopValueAt(num, den, 0, 0, hi);
    if (abs2(rational.re - d, rational.im) <= tailLevel) break;
    hi *= 10;
  }

  // 2. Base grid and hints.
  const steps = Math.max(2, Math.ceil(Math.log10(hi / lo) * POINTS_PER_DECADE));
  const seeds: number[] = [];
  for (let k = 0; k <= steps; k++) seeds.push(lo * (hi / lo) ** (k / steps));
  for (const h of span.hints) if (h > lo && h < hi) seeds.push(h);
  seeds.sort((a, b) => a - b);

  // 3. Refinement, depth first so the output stays ordered.
  const omega: number[] = [];
  const re: number[] = [];
  const im: number[] = [];
  const push = (w: number, l: { re: number; im: number }) => {
    if (!Number.isFinite(l.re) || !Number.isFinite(l.im)) return; // exactly on an imaginary-axis pole
    omega.push(w);
    re.push(l.re);
    im.push(l.im);
  };
  const refine = (a: number, la: { re: number; im: number }, b: number, lb: { re: number; im: number }) => {
    if (omega.length >= MAX_POINTS || Math.log(b / a) <= MIN_LOG_STEP) return;
    if (!needsSplit(la, lb, delay * (b - a), deviation(a, la) >= SMALL_GAIN || deviation(b, lb) >= SMALL_GAIN)) return;
    const m = Math.sqrt(a * b);
    const lm = value(m);
    refine(a, la, m, lm);
    push(m, lm);
    refine(m, lm, b, lb);
  };
  let previous = seeds[0];
  let lPrevious = value(previous);
  push(previous, lPrevious);
  for (let k = 1; k < seeds.length; k++) {
    const w = seeds[k];
    if (Math.log(w / previous) <= MIN_LOG_STEP) continue;
    const l = value(w);
    if (Number.isFinite(lPrevious.re) && Number.isFinite(l.re)) refine(previous, lPrevious, w, l);
    push(w, l);
    previous = w;
    lPrevious = l;
  }

  // 4. Figures.
  const n = omega.length;
  const sMag = new Float64Array(n);
  const tMag = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const f = abs2(1 + re[i], im[i]);
    sMag[i] = 1 / f;
    tMag[i] = abs2(re[i], im[i]) / f;
  }
  const sensitivity = (w: number) => {
    const l = value(w);
    return 1 / abs2(1 + l.re, l.im);
  };
  const complementary = (w: number) => {
    const l = value(w);
    return abs2(l.re, l.im) / abs2(1 + l.re, l.im);
  };
  const sTail = sensitivityTail(d, delay);
  const tTail = Math.abs(d) * sTail;
  // ω → 0: L(0) (infinite with an integrator, so S(0) = 0 and T(0) = 1).
  const l0 = loopValueAt(num, den, 0, 0, 0);
  const g0 = abs2(l0.re, l0.im);
  const sLow = Number.isFinite(g0) ? 1 / abs2(1 + l0.re, l0.im) : 0;
  const tLow = Number.isFinite(g0) ? g0 * sLow : 1;
  const sensitivityPeak = withLimits(gridPeak(omega, sMag, sensitivity), sLow, sTail);
  const complementaryPeak = withLimits(gridPeak(omega, tMag, complementary), tLow, tTail);

  const gainCrossovers: number[] = [];
  const gainCrossoverFalling: boolean[] = [];
  const phaseCrossovers: number[] = [];
  const phaseBrackets: number[] = [];
  let largestBracketGain = 0;
  const logOmega = (x: number) => Math.exp(x);
  for (let i = 0; i + 1 < n; i++) {
    const a = Math.log(omega[i]);
    const b = Math.log(omega[i + 1]);
    const aboveA = abs2(re[i], im[i]) > 1;
    if (aboveA !== abs2(re[i + 1], im[i + 1]) > 1) {
      const x = bisectSignChange((x) => {
        const l = value(logOmega(x));
        return abs2(l.re, l.im) > 1;
      }, a, b, aboveA, CROSSING_TOLERANCE);
      gainCrossovers.push(Math.exp(x));
      gainCrossoverFalling.push(aboveA);
    }
    if (im[i] > 0 !== im[i + 1] > 0 && (re[i] < 0 || re[i + 1] < 0)) {
      const gain = Math.max(abs2(re[i], im[i]), abs2(re[i + 1], im[i + 1]));
      if (Number.isFinite(gain)) phaseBrackets.push(i);
      if (Number.isFinite(gain) && gain > largestBracketGain) largestBracketGain = gain;
    }
  }
  // Only crossings that can set the gain margin are located (see PHASE_CROSSOVER_RELATIVE_GAIN).
  const phaseFloor = Math.max(PHASE_CROSSOVER_MIN_GAIN, PHASE_CROSSOVER_RELATIVE_GAIN * largestBracketGain);
  for (const i of phaseBrackets) {
    if (Math.max(abs2(re[i], im[i]), abs2(re[i + 1], im[i + 1])) < phaseFloor) continue;
    const upperA = im[i] > 0;
    const x = bisectSignChange((x) => value(logOmega(x)).im > 0, Math.log(omega[i]), Math.log(omega[i + 1]), upperA, CROSSING_TOLERANCE);
    const w = Math.exp(x);
    const l = value(w);
    const gain = abs2(l.re, l.im);
    // On the negative real axis (not a jump across an imaginary-axis pole of L).
    if (Number.isFinite(gain) && l.re < 0 && Math.abs(l.im) <= 1e-6 * gain && gain >= PHASE_CROSSOVER_MIN_GAIN) phaseCrossovers.push(w);
  }

  let bandwidth = Infinity;
  if (n > 0 && sMag[0] >= BANDWIDTH_LEVEL) bandwidth = 0;
  else {
    for (let i = 0; i + 1 < n; i++) {
      if (sMag[i + 1] >= BANDWIDTH_LEVEL) {
        const x = bisectSignChange((x) => sensitivity(Math.exp(x)) >= BANDWIDTH_LEVEL, Math.log(omega[i]), Math.log(omega[i + 1]), false, CROSSING_TOLERANCE);
        bandwidth = Math.exp(x);
        break;
      }
    }
  }

  let weightedPeak: FrequencyPeak | null = null;
  if (options.weight !== undefined) weightedPeak = weightedSensitivityPeak({ num, den, delay }, omega, options.weight, sTail);

  // 5. Merge the located points into the grid and fill L, S, T.
  const extra = [sensitivityPeak.omega, complementaryPeak.omega, weightedPeak?.omega ?? NaN, ...gainCrossovers, ...phaseCrossovers, bandwidth];
  const extraSorted = extra.filter((w) => Number.isFinite(w) && w > 0).sort((a, b) => a - b);
  // Merge the (few, sorted) located points into the sorted grid; source[k] = grid index or −1.
  const grid: number[] = [];
  const source: number[] = [];
  let e = 0;
  for (let i = 0; i <= n; i++) {
    const next = i < n ? omega[i] : Infinity;
    while (e < extraSorted.length && extraSorted[e] < next) {
      if (grid.length === 0 || extraSorted[e] > grid[grid.length - 1]) {
        grid.push(extraSorted[e]);
        source.push(-1);
      }
      e++;
    }
    if (i < n && (grid.length === 0 || next > grid[grid.length - 1])) {
      grid.push(next);
      source.push(i);
    }
  }
  const size = grid.length;
  const result: FrequencyResponse = {
    omega: Float64Array.from(grid),
    L: { re: new Float64Array(size), im: new Float64Array(size) },
    S: { re: new Float64Array(size), im: new Float64Array(size) },
    T: { re: new Float64Array(size), im: new Float64Array(size) },
    sensitivityPeak,
    complementaryPeak,
    weightedPeak,
    gainCrossovers,
    gainCrossoverFalling,
    phaseCrossovers,
    bandwidth,
    highFrequencyGain: d,
  };
  for (let i = 0; i < size; i++) {
    const j = source[i];
    const l = j < 0 ? value(grid[i]) : { re: re[j], im: im[j] };
    const fr = 1 + l.re;
    const fi = l.im;
    const f2 = fr * fr + fi * fi;
    result.L.re[i] = l.re;
    result.L.im[i] = l.im;
    result.S.re[i] = fr / f2;
    result.S.im[i] = -fi / f2;
    result.T.re[i] = 1 - fr / f2; // T = 1 − S
    result.T.im[i] = fi / f2;
  }
  if (options.weight !== undefined) {
    const { num: wn, den: wd } = options.weight;
    result.weightMagnitude = Float64Array.from(grid, (w) => {
      const a = loopValueAt(wn, wd, 0, 0, w);
      return abs2(a.re, a.im);
    });
  }
  return result;
}

/**
 * lim sup_{ω→∞} |S(jω)| for L → D·e^(−jωθ): 1/|1 + D| without dead time; with dead time and
 * D ≠ 0, e^(−jωθ) turns D through every phase, so 1/(1 − |D|) (|D| < 1 for a stable loop;
 * Infinity otherwise). The limit of |T| is |D| times this.
 */
export function sensitivityTail(d: number, delay: number): number {
  if (delay > 0 && d !== 0) return Math.abs(d) < 1 ? 1 / (1 - Math.abs(d)) : Infinity;
  return 1 / Math.abs(1 + d);
}

/** √(x² + y²) without Math.hypot's overflow guard (3–5× faster; |L| stays far from 1e154 here). */
function abs2(x: number, y: number): number {
  return Math.sqrt(x * x + y * y);
}

/** The peak, or the low- or high-frequency limit when that is larger. */
function withLimits(peak: FrequencyPeak, low: number, high: number): FrequencyPeak {
  if (low > peak.value && low >= high) return { omega: 0, value: low };
  return high > peak.value ? { omega: Infinity, value: high } : peak;
}

/** See frequencyResponse, step 3; `active`: the loop is still SMALL_GAIN or more from its high-frequency form at an end. */
function needsSplit(la: { re: number; im: number }, lb: { re: number; im: number }, delayPhase: number, active: boolean): boolean {
  if (!active) return false;
  const large = abs2(la.re, la.im) >= TRACK_GAIN || abs2(lb.re, lb.im) >= TRACK_GAIN;
  const step = large ? MAX_PHASE_STEP : COARSE_PHASE_STEP;
  // The dead time turns L by θ·Δω, which a principal-value difference would alias: test it apart.
  if (delayPhase > step) return true;
  if (changesTooMuch(1 + la.re, la.im, 1 + lb.re, lb.im, MAX_PHASE_STEP)) return true;
  return changesTooMuch(la.re, la.im, lb.re, lb.im, step);
}

/** True when arg or ln|·| of a complex number changes by more than the allowed step from a to b. */
function changesTooMuch(ar: number, ai: number, br: number, bi: number, maxPhaseStep: number): boolean {
  const phase = Math.atan2(ar * bi - ai * br, ar * br + ai * bi);
  if (Math.abs(phase) > maxPhaseStep) return true;
  const ratio = abs2(br, bi) / abs2(ar, ai);
  return !(Math.abs(Math.log(ratio)) <= MAX_LOG_STEP);
}
