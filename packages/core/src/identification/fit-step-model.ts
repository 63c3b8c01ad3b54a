import { chargeEvaluations } from "../simulation/work-budget.js";
import { levenbergMarquardt } from "ml-levenberg-marquardt";
import { inverse, Matrix, solve } from "ml-matrix";
import type { PreparedStepTest } from "./prepare-step-test.js";
import { rampEstimate } from "./ramp-estimate.js";
import { STEP_MODELS, type IdentifiedTransferFunction, type StepModelKind } from "./step-model.js";
import { studentTQuantile } from "./student-t-quantile.js";
import { twoPointEstimate } from "./two-point-estimate.js";

/** Confidence level of the reported intervals. */
export const CONFIDENCE_LEVEL = 0.95;

/** A model fitted to a step test. Parameters in seconds and [y/u] (or [y/(u·s)] for IPDT). */
export interface StepModelFit {
  ok: true;
  kind: StepModelKind;
  /** Fitted parameters by name (k, tau, theta; k, tau1, tau2, theta; k, theta). */
  parameters: Record<string, number>;
  /** 95 % confidence interval [low, high] of each parameter (NaN bounds when JᵀJ is singular). */
  intervals: Record<string, [number, number]>;
  /** Standard error of each parameter, √(s²·(JᵀJ)⁻¹)ᵢᵢ. */
  standardErrors: Record<string, number>;
  /** The two-point (or ramp) estimate the search started from. */
  start: Record<string, number>;
  /** Coefficient of determination R² = 1 − SSE/SST over the fitted samples. */
  r2: number;
  /** Sum of squared residuals [y²] and degrees of freedom n − p. */
  sse: number;
  dof: number;
  /** The model as a plant. */
  model: IdentifiedTransferFunction;
  /**
   * Times [s], the model's output and the residuals y − ŷ per fitted sample, both in the prepared
   * test's coordinates (the output less prepareStepTest's y0; the model output includes δ).
   */
  t: Float64Array;
  fitted: Float64Array;
  residuals: Float64Array;
  /** The step the model is driven by; u0 the initial input; y0 the fitted initial output level (prepareStepTest's y0 + δ). */
  stepTime: number;
  stepSize: number;
  u0: number;
  y0: number;
  /** Levenberg–Marquardt iterations spent. */
  iterations: number;
}

/** Iterations per Levenberg–Marquardt round; rounds go on while the sum of squares still falls. */
const ROUND_ITERATIONS = 25;
const MAX_ROUNDS = 40;
/** A round that lowers the sum of squares by less than this fraction ends the search. */
const RELATIVE_IMPROVEMENT = 1e-12;
/** Sum of squares (normalised output) at which the search stops: an exact fit. */
const EXACT_FIT_SSE = 1e-24;
/** Central-difference step on the normalised parameters (Jacobian of the search and of the intervals). */
const DIFFERENCE_STEP = 1e-7;
/** Bounds of the normalised parameters: gains, time constants (≥ a millionth of the test), dead time (within the test). */
const GAIN_BOUND = 1e4;
const MIN_TIME_CONSTANT = 1e-6;
const MAX_TIME_CONSTANT = 1e3;
/**
 * Most samples the Levenberg–Marquardt search sees: a longer test is searched on an evenly strided
 * subset, then refined on every sample by Gauss–Newton (the search's cost grows with the samples;
 * the subset's optimum is already within the noise of the full one).
 */
export const MAX_SEARCH_SAMPLES = 4000;
/** Gauss–Newton refinement on all samples: at most this many steps, each halved up to 30 times until the sum of squares falls. */
const REFINE_STEPS = 20;
const REFINE_HALVINGS = 30;
/** SOPDT starts: τ2 = ρ·τ, τ1 = τ, θ = max(0, θ_2pt − ρ·τ) for each ρ; the best fit is kept. */
const SOPDT_RATIOS = [0.1, 0.3, 0.6];

/**
 * Fits a FOPDT, SOPDT or IPDT model (see step-model.ts) to a prepared step test by nonlinear least
 * squares, the model driven by an ideal step of the measured size at the measured step time:
 *
 *   minimise SSE(p, δ) = Σ_k (y_k − δ − ŷ(t_k − t_step; p))²   over all kept samples,
 *
 * y_k the output less the initial level y0 of prepareStepTest, and δ a correction of that level
 * fitted alongside (offset "initial"; δ = 0 with offset "none"), so that the intervals account for
 * the uncertainty of the initial level too (it is estimated from the samples before the step only);
 * with Levenberg–Marquardt (ml-levenberg-marquardt; central-difference Jacobian) on parameters
 * scaled to order one (times by the test's length after the step, gains by max|y|/|Δu|), started
 * from Smith's two-point estimate (twoPointEstimate; SOPDT from three splits of τ, the best kept)
 * or, for IPDT, from the final ramp (rampEstimate). Run in rounds until a round no longer lowers
 * the sum of squares; a test longer than MAX_SEARCH_SAMPLES is searched on an evenly strided
 * subset and then refined on all samples by Gauss–Newton steps (Δp = (JᵀJ)⁻¹Jᵀr, halved until the
 * sum of squares falls).
 *
 * Intervals from the linearisation at the optimum, J the n×q Jacobian of δ + ŷ:
 *
 *   s² = SSE/(n − q),   Cov = s²·(JᵀJ)⁻¹,   p̂ᵢ ± t_{0.975}(n − q)·√Covᵢᵢ   (q parameters, δ included).
 *
 * R² = 1 − SSE/Σ(y_k − ȳ)². SOPDT time constants are reported with τ1 ≥ τ2.
 * Returns { ok: false, reason } when no start can be read from the data. Every model evaluation is
 * charged to the active work budget (withWorkBudget), so a caller can bound the work of a fit.
 * References: D. W. Marquardt, "An algorithm for least-squares estimation of nonlinear parameters",
 * J. SIAM 11(2), 431–441, 1963; D. M. Bates and D. G. Watts, Nonlinear Regression Analysis and Its
 * Applications, Wiley, 1988, §2.3 (linear-approximation intervals).
 */
export function fitStepModel(test: PreparedStepTest, kind: StepModelKind): StepModelFit | { ok: false; reason: string } {
  const model = STEP_MODELS[kind];
  if (!model) throw new RangeError(`model must be one of fopdt, sopdt, ipdt, got "${String(kind)}"`);
  const { t, y, stepTime, stepSize } = test;
  const n = t.length;
  const m = model.parameters.length;
  const fitOffset = test.offset !== "none";
  const q = m + (fitOffset ? 1 : 0);
  if (n <= q) return { ok: false, reason: `${n} samples cannot fit ${q} parameters` };
  const span = t[n - 1] - stepTime;
  let peak = 0;
  for (let k = 0; k < n; k++) peak = Math.max(peak, Math.abs(y[k]));
  if (!(peak > 0) || !(span > 0)) return { ok: false, reason: "the output does not change after the step" };
  const gainScale = kind === "ipdt" ? peak / (Math.abs(stepSize) * span) : peak / Math.abs(stepSize);
  const scales = [...model.gains.map((g) => (g ? gainScale : span)), ...(fitOffset ? [peak] : [])];
  const du = Math.sign(stepSize);
  // ŷ(x; p) in normalised units: the model's response plus, with offset "initial", a correction δ of y0.
  // Each model evaluation is charged to the active work budget (withWorkBudget), one evaluation each.
  const evaluate: Evaluate = fitOffset
    ? (p, xi) => {
        chargeEvaluations(1);
        return p[m] + model.response(p, xi, du);
      }
    : (p, xi) => {
        chargeEvaluations(1);
        return model.response(p, xi, du);
      };

  const starts = startingPoints(test, kind);
  if (!starts.ok) return starts;
  const x = new Float64Array(n);
  const yn = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    x[k] = (t[k] - stepTime) / span;
    yn[k] = y[k] / peak;
  }
  const minValues = model.gains.map((g, i) => (g ? -GAIN_BOUND : model.parameters[i] === "theta" ? 0 : MIN_TIME_CONSTANT));
  const maxValues = model.gains.map((g, i) => (g ? GAIN_BOUND : model.parameters[i] === "theta" ? 1 : MAX_TIME_CONSTANT));
  if (fitOffset) {
    minValues.push(-GAIN_BOUND);
    maxValues.push(GAIN_BOUND);
  }
  const stride = Math.ceil(n / MAX_SEARCH_SAMPLES);
  const xs = stride === 1 ? x : x.filter((_, k) => k % stride === 0);
  const ys = stride === 1 ? yn : yn.filter((_, k) => k % stride === 0);
  let pn: number[] = [];
  let bestSse = Infinity;
  let iterations = 0;
  for (const start of starts.points) {
    const p0 = [...start, ...(fitOffset ? [0] : [])].map((v, i) => Math.min(maxValues[i], Math.max(minValues[i], v / scales[i])));
    const found = search(evaluate, xs, ys, p0, minValues, maxValues);
    iterations += found.iterations;
    if (found.sse < bestSse || pn.length === 0) {
      pn = found.p;
      bestSse = found.sse;
    }
  }
  if (stride > 1) pn = refine(evaluate, x, yn, pn, minValues, maxValues);
  if (kind === "sopdt" && pn[2] > pn[1]) [pn[1], pn[2]] = [pn[2], pn[1]];

  // Intervals from the Jacobian at the optimum (all q parameters, the offset included), in
  // normalised units, then scaled back.
  const jac = jacobian(evaluate, x, pn);
  const fittedN = new Float64Array(n);
  let sseN = 0;
  for (let k = 0; k < n; k++) {
    fittedN[k] = evaluate(pn, x[k]);
    sseN += (yn[k] - fittedN[k]) ** 2;
  }
  const dof = n - q;
  const s2 = sseN / dof;
  let covDiag: number[];
  try {
    const inv = inverse(normalMatrix(jac, q, n));
    covDiag = pn.map((_, i) => s2 * inv.get(i, i));
  } catch {
    covDiag = pn.map(() => NaN);
  }
  const tq = studentTQuantile(0.5 + CONFIDENCE_LEVEL / 2, dof);
  const parameters: Record<string, number> = {};
  const intervals: Record<string, [number, number]> = {};
  const standardErrors: Record<string, number> = {};
  const values = pn.map((v, i) => v * scales[i]);
  model.parameters.forEach((name, i) => {
    const se = covDiag[i] >= 0 ? Math.sqrt(covDiag[i]) * scales[i] : NaN;
    parameters[name] = values[i];
    standardErrors[name] = se;
    intervals[name] = [values[i] - tq * se, values[i] + tq * se];
  });
  const fitted = new Float64Array(n);
  const residuals = new Float64Array(n);
  let mean = 0;
  for (let k = 0; k < n; k++) mean += y[k];
  mean /= n;
  let sse = 0;
  let sst = 0;
  for (let k = 0; k < n; k++) {
    fitted[k] = fittedN[k] * peak;
    residuals[k] = y[k] - fitted[k];
    sse += residuals[k] ** 2;
    sst += (y[k] - mean) ** 2;
  }
  const start: Record<string, number> = {};
  model.parameters.forEach((name, i) => (start[name] = starts.points[0][i]));
  return {
    ok: true,
    kind,
    parameters,
    intervals,
    standardErrors,
    start,
    r2: 1 - sse / sst,
    sse,
    dof,
    model: model.transferFunction(values),
    t: Float64Array.from(t),
    fitted,
    residuals,
    stepTime,
    stepSize,
    u0: test.u0,
    y0: test.y0 + (fitOffset ? values[m] : 0),
    iterations,
  };
}

/** The normalised model ŷ(x; p). */
type Evaluate = (p: ArrayLike<number>, x: number) => number;

/** JᵀJ of a row-major q×n Jacobian. */
function normalMatrix(jac: Float64Array, q: number, n: number): Matrix {
  const jtj = new Matrix(q, q);
  for (let i = 0; i < q; i++) {
    for (let j = 0; j <= i; j++) {
      let acc = 0;
      for (let k = 0; k < n; k++) acc += jac[i * n + k] * jac[j * n + k];
      jtj.set(i, j, acc);
      jtj.set(j, i, acc);
    }
  }
  return jtj;
}

/** Starting parameter vectors in physical units, the first being the plain two-point (or ramp) estimate. */
function startingPoints(test: PreparedStepTest, kind: StepModelKind): { ok: true; points: number[][] } | { ok: false; reason: string } {
  if (kind === "ipdt") {
    const ramp = rampEstimate(test);
    return ramp.ok ? { ok: true, points: [[ramp.k, ramp.theta]] } : ramp;
  }
  const est = twoPointEstimate(test);
  if (!est.ok) return est;
  if (kind === "fopdt") return { ok: true, points: [[est.k, est.tau, est.theta]] };
  return { ok: true, points: SOPDT_RATIOS.map((rho) => [est.k, est.tau, rho * est.tau, Math.max(0, est.theta - rho * est.tau)]) };
}

/** Levenberg–Marquardt in rounds from p0 until the sum of squares stops falling. */
function search(evaluate: Evaluate, x: Float64Array, y: Float64Array, p0: number[], minValues: number[], maxValues: number[]): { p: number[]; sse: number; iterations: number } {
  const f = (p: number[]) => (xi: number) => evaluate(p, xi);
  let p = p0;
  let sse = sumOfSquares(evaluate, x, y, p);
  let iterations = 0;
  for (let round = 0; round < MAX_ROUNDS && sse > EXACT_FIT_SSE; round++) {
    const result = levenbergMarquardt({ x, y }, f, {
      initialValues: p,
      minValues,
      maxValues,
      maxIterations: ROUND_ITERATIONS,
      errorTolerance: EXACT_FIT_SSE,
      centralDifference: true,
      gradientDifference: DIFFERENCE_STEP,
      damping: 1e-3,
    });
    iterations += result.iterations;
    const improved = result.parameterError < sse;
    const enough = result.parameterError < sse * (1 - RELATIVE_IMPROVEMENT);
    if (improved) {
      p = result.parameterValues;
      sse = result.parameterError;
    }
    if (!enough) break;
  }
  return { p, sse, iterations };
}

/** Gauss–Newton on all samples from p, each step halved until the sum of squares falls; stops when it no longer does. */
function refine(evaluate: Evaluate, x: Float64Array, y: Float64Array, p0: number[], minValues: number[], maxValues: number[]): number[] {
  const n = x.length;
  const np = p0.length;
  let p = p0.slice();
  let sse = sumOfSquares(evaluate, x, y, p);
  for (let step = 0; step < REFINE_STEPS && sse > EXACT_FIT_SSE; step++) {
    const jac = jacobian(evaluate, x, p);
    const jtj = normalMatrix(jac, np, n);
    const jtr = new Matrix(np, 1);
    for (let i = 0; i < np; i++) {
      let g = 0;
      for (let k = 0; k < n; k++) g += jac[i * n + k] * (y[k] - evaluate(p, x[k]));
      jtr.set(i, 0, g);
    }
    let delta: Matrix;
    try {
      delta = solve(jtj, jtr);
    } catch {
      break;
    }
    let improved = false;
    for (let a = 1, h = 0; h < REFINE_HALVINGS; h++, a /= 2) {
      const trial = p.map((v, i) => Math.min(maxValues[i], Math.max(minValues[i], v + a * delta.get(i, 0))));
      const trialSse = sumOfSquares(evaluate, x, y, trial);
      if (trialSse < sse) {
        improved = sse - trialSse > RELATIVE_IMPROVEMENT * sse;
        p = trial;
        sse = trialSse;
        break;
      }
    }
    if (!improved) break;
  }
  return p;
}

function sumOfSquares(evaluate: Evaluate, x: Float64Array, y: Float64Array, p: number[]): number {
  let s = 0;
  for (let k = 0; k < x.length; k++) s += (y[k] - evaluate(p, x[k])) ** 2;
  return s;
}

/** ∂ŷ_k/∂p_i by central differences, row-major p×n. */
function jacobian(evaluate: Evaluate, x: Float64Array, p: number[]): Float64Array {
  const n = x.length;
  const out = new Float64Array(p.length * n);
  for (let i = 0; i < p.length; i++) {
    const h = DIFFERENCE_STEP * Math.max(1, Math.abs(p[i]));
    const plus = p.slice();
    const minus = p.slice();
    plus[i] += h;
    minus[i] -= h;
    for (let k = 0; k < n; k++) out[i * n + k] = (evaluate(plus, x[k]) - evaluate(minus, x[k])) / (2 * h);
  }
  return out;
}
