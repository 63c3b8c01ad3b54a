import { Matrix } from "ml-matrix";
import type { ControllerRealization } from "../controllers/controller-realization.js";
import type { Complex } from "../linear-algebra/complex.js";
import { discretizeZohInputs } from "../linear-algebra/discretize-zoh-inputs.js";
import { polynomialMultiply } from "../linear-algebra/polynomial-multiply.js";
import type { SisoStateSpace } from "../linear-algebra/siso-state-space.js";
import { matrixEigenvalues } from "../optimal/matrix-eigenvalues.js";
import { stateSpaceToTransferFunction } from "../plants/state-space-to-transfer-function.js";
import { isWellPosedLoop } from "../simulation/ill-posed-loop-error.js";
import { isSchurStable } from "./schur-cohn.js";

/**
 * Margin of the discrete verdict: a pole z counts as stable only when |z| < 1 − SAMPLED_STABILITY_TOLERANCE.
 * Eigenvalues of the closed-loop matrix carry rounding errors of about 1e-16·‖M‖; this margin keeps a
 * pole on the unit circle in exact arithmetic (an integrator left without feedback) from being called stable.
 */
export const SAMPLED_STABILITY_TOLERANCE = 1e-12;
/**
 * Largest closed-loop order judged by eigenvalues (O(N³); about 1 ms at N = 14 on the development
 * machine); larger loops — long dead times in samples — go to the O(N²) Schur–Cohn recursion (about
 * 2 ms at N = 214). The recursion works on polynomial coefficients, which blur roots that cluster
 * near z = 1 (several slow poles at a short sample time, |1 − z| ≲ 1e-3): there the verdict is only
 * as good as those coefficients.
 */
export const MAX_SAMPLED_EIGEN_ORDER = 24;
/** Largest closed-loop order judged at all (O(N²) Schur–Cohn); beyond, the verdict is left to the simulation. */
export const MAX_SAMPLED_ORDER = 4000;
/** Relative tolerance within which θ counts as a whole number of samples (as the grid loop). */
const GRID_TOLERANCE = 1e-9;

/** The sampled loop as the grid loop runs it: plant, dead time, controller realisation and the sample time. */
export interface SampledLoop {
  plant: SisoStateSpace;
  /** Dead time θ ≥ 0 [s] on the plant input. */
  delay: number;
  controller: ControllerRealization;
  /** Sample time h = Ts > 0 [s] of the controller (zero-order hold on its output). */
  sampleTime: number;
}

/** The verdict of a sampled loop: its z-plane poles (empty when judged by the polynomial) and the method. */
export type SampledLoopVerdict =
  | { stable: boolean; poles: Complex[]; method: "eigenvalues" | "schur-cohn" }
  | { stable: null; poles: []; method: "too-large" };

/**
 * The dead time θ = m·h + φ, 0 ≤ φ < h, as the grid loop splits it (θ within 1e-9 relative of a
 * whole number of samples counts as one).
 */
export function splitDelay(delay: number, h: number): { m: number; phi: number } {
  const q = delay / h;
  if (Math.abs(q - Math.round(q)) <= GRID_TOLERANCE * Math.max(1, q)) return { m: Math.round(q), phi: 0 };
  const m = Math.floor(q);
  return { m, phi: delay - m * h };
}

/**
 * Stability of the discrete-time closed loop of a sampled controller (zero-order hold at the sample
 * time h) and a linear plant with dead time, r = 0, actuator limits ignored (so for a limited
 * actuator the verdict is the local one):
 *
 * - plant, ZOH over h with θ = m·h + φ: over [kh, (k+1)h) the plant sees u_{k−m−1} for φ and u_{k−m}
 *   for h − φ, so
 *     x_{k+1} = Φ(h) x_k + Γ(h − φ) u_{k−m} + Φ(h − φ)Γ(φ) u_{k−m−1},   y_k = C x_k + D u_{k−m−δ},
 *   δ = 1 when φ > 0 (the modified z-transform: Åström & Wittenmark 1997, §2.3, "systems with time
 *   delays"; Franklin, Powell & Workman, Digital Control of Dynamic Systems, 3rd ed., 1998, §4.3.4);
 * - controller exactly as the grid loop updates it: x_c,k+1 = Φ_c x_c,k + Γ_c,y y_k with (Φ_c, Γ_c,y)
 *   the ZOH discretisation of (A_c, B_y) at h, u_k = C_c x_c,k + D_y y_k + K_x x_k;
 * - the past inputs u_{k−1} … u_{k−m−δ} as a shift register.
 *
 * The loop is stable when every eigenvalue of the closed-loop matrix lies inside the unit circle
 * (|z| < 1 − SAMPLED_STABILITY_TOLERANCE). Orders above MAX_SAMPLED_EIGEN_ORDER are judged on the
 * characteristic polynomial
 *
 *   χ(z) = z^(m+δ)·D_p(z)·D_c(z) − N_c(z)·N_p(z),
 *
 * (G_w = N_p/(z^(m+δ) D_p) the pulse transfer function from u to the fed-back signal, K = N_c/D_c
 * the controller's, u = K·w) by the Schur–Cohn recursion (isSchurStable); above MAX_SAMPLED_ORDER
 * the verdict is `stable: null` and left to the simulation. options.method forces one of the two
 * (for checking one against the other). An ill-posed loop (m = φ = 0 and
 * 1 − D_y·D = 0) is unstable. The grid loop updates at the grid step nearest each j·Ts; when Ts is a
 * multiple of the simulation step the two describe the same loop exactly.
 * References: K. J. Åström and B. Wittenmark, Computer-Controlled Systems, 3rd ed., Prentice Hall,
 * 1997, §2.3 (sampling with a delay), §3.2 (stability: poles inside the unit circle, Jury's test).
 */
export function sampledLoopStability(loop: SampledLoop, options: { method?: "eigenvalues" | "schur-cohn" } = {}): SampledLoopVerdict {
  const { plant: p, controller: c, sampleTime: h } = loop;
  if (!(h > 0) || !Number.isFinite(h)) throw new RangeError(`controller.sampleTime must be a finite time > 0 s, got ${String(h)}`);
  const { m, phi } = splitDelay(loop.delay, h);
  const delta = phi > 0 ? 1 : 0;
  const lags = m + delta;
  const n = p.n;
  const nc = c.n;
  const order = n + nc + lags;
  if (lags === 0 && c.kx === null && !isWellPosedLoop(-c.dy, p.d)) return { stable: false, poles: [], method: "eigenvalues" };
  if (order > MAX_SAMPLED_ORDER) return { stable: null, poles: [], method: "too-large" };
  const plantSteps = plantDiscretisation(p, h, phi);
  const controllerStep = nc > 0 ? discretizeZohInputs(c.a, c.by, nc, 1, h) : { phi: new Float64Array(0), gamma: new Float64Array(0) };
  const method = options.method ?? (order <= MAX_SAMPLED_EIGEN_ORDER ? "eigenvalues" : "schur-cohn");
  if (method === "eigenvalues") {
    const poles = matrixEigenvalues(closedLoopMatrix(loop, plantSteps, controllerStep, m, delta));
    const limit = 1 - SAMPLED_STABILITY_TOLERANCE;
    return { stable: poles.every((z) => Math.hypot(z.re, z.im) < limit), poles, method: "eigenvalues" };
  }
  return { stable: isSchurStable(characteristicPolynomial(loop, plantSteps, controllerStep, lags)), poles: [], method: "schur-cohn" };
}

interface PlantSteps {
  phi: Float64Array;
  /** Γ(h − φ): multiplies u_{k−m}. */
  gNew: Float64Array;
  /** Φ(h − φ)Γ(φ): multiplies u_{k−m−1} (zero when φ = 0). */
  gOld: Float64Array;
}

function plantDiscretisation(p: SisoStateSpace, h: number, phi: number): PlantSteps {
  const n = p.n;
  if (n === 0) return { phi: new Float64Array(0), gNew: new Float64Array(0), gOld: new Float64Array(0) };
  const full = discretizeZohInputs(p.a, p.b, n, 1, h);
  if (phi === 0) return { phi: full.phi, gNew: full.gamma, gOld: new Float64Array(n) };
  const tail = discretizeZohInputs(p.a, p.b, n, 1, h - phi);
  const head = discretizeZohInputs(p.a, p.b, n, 1, phi);
  const gOld = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let acc = 0;
    for (let j = 0; j < n; j++) acc += tail.phi[i * n + j] * head.gamma[j];
    gOld[i] = acc;
  }
  return { phi: full.phi, gNew: tail.gamma, gOld };
}

/**
 * The closed-loop matrix M in ξ_{k+1} = M ξ_k, ξ_k = [x_k; x_c,k; u_{k−1}; …; u_{k−m−δ}]. Rows U and Y
 * give u_k and y_k in terms of ξ_k (with the algebraic loop solved when m = δ = 0).
 */
function closedLoopMatrix(
  loop: SampledLoop,
  plant: PlantSteps,
  ctrl: { phi: Float64Array; gamma: Float64Array },
  m: number,
  delta: number,
): Matrix {
  const { plant: p, controller: c } = loop;
  const n = p.n;
  const nc = c.n;
  const lags = m + delta;
  const size = n + nc + lags;
  const lagIndex = (j: number) => n + nc + j - 1; // state index of u_{k−j}, j = 1…lags
  // u_k = (D_y C + K_x) x + C_c x_c + D_y D v_k, v_k = u_{k−lags} (or u_k itself when lags = 0).
  const uRow = new Float64Array(size);
  for (let j = 0; j < n; j++) uRow[j] = c.dy * p.c[j] + (c.kx ? c.kx[j] : 0);
  for (let j = 0; j < nc; j++) uRow[n + j] = c.c[j];
  if (lags > 0) uRow[lagIndex(lags)] += c.dy * p.d;
  else {
    const k = 1 / (1 - c.dy * p.d);
    for (let j = 0; j < size; j++) uRow[j] *= k;
  }
  // y_k = C x + D v_k.
  const yRow = new Float64Array(size);
  for (let j = 0; j < n; j++) yRow[j] = p.c[j];
  if (lags > 0) yRow[lagIndex(lags)] += p.d;
  else for (let j = 0; j < size; j++) yRow[j] += p.d * uRow[j];
  const mat = new Matrix(size, size);
  // The row of the input the plant sees over the new part of the step (u_{k−m}) and the old part (u_{k−m−1}).
  const inputRow = (j: number): Float64Array => {
    if (j === 0) return uRow;
    const row = new Float64Array(size);
    row[lagIndex(j)] = 1;
    return row;
  };
  const newInput = inputRow(m);
  const oldInput = delta > 0 ? inputRow(m + 1) : null;
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) mat.set(i, j, plant.phi[i * n + j]);
    for (let j = 0; j < size; j++) {
      let v = mat.get(i, j) + plant.gNew[i] * newInput[j];
      if (oldInput) v += plant.gOld[i] * oldInput[j];
      mat.set(i, j, v);
    }
  }
  for (let i = 0; i < nc; i++) {
    const row = n + i;
    for (let j = 0; j < size; j++) mat.set(row, j, ctrl.gamma[i] * yRow[j]);
    for (let j = 0; j < nc; j++) mat.set(row, n + j, mat.get(row, n + j) + ctrl.phi[i * nc + j]);
  }
  if (lags > 0) {
    for (let j = 0; j < size; j++) mat.set(lagIndex(1), j, uRow[j]);
    for (let l = 2; l <= lags; l++) mat.set(lagIndex(l), lagIndex(l - 1), 1);
  }
  return mat;
}

/**
 * The characteristic polynomial χ(z) = z^(m+δ)·D_p(z)·D_c(z) − N_c(z)·N_p(z) of a sampled loop
 * (see sampledLoopStability), descending powers, monic unless the loop is ill-posed.
 */
export function sampledLoopCharacteristicPolynomial(loop: SampledLoop): number[] {
  const h = loop.sampleTime;
  const { m, phi } = splitDelay(loop.delay, h);
  const c = loop.controller;
  const controllerStep = c.n > 0 ? discretizeZohInputs(c.a, c.by, c.n, 1, h) : { phi: new Float64Array(0), gamma: new Float64Array(0) };
  return characteristicPolynomial(loop, plantDiscretisation(loop.plant, h, phi), controllerStep, m + (phi > 0 ? 1 : 0));
}

function characteristicPolynomial(loop: SampledLoop, plant: PlantSteps, ctrl: { phi: Float64Array; gamma: Float64Array }, lags: number): number[] {
  const { plant: p, controller: c } = loop;
  const n = p.n;
  // Fed-back signal w = c̃ x + d̃ v: the output (c̃ = C, d̃ = D) or, for state feedback, K_x x (controller 1).
  const stateFeedback = c.kx !== null;
  const cw = stateFeedback ? c.kx! : p.c;
  const dw = stateFeedback ? 0 : p.d;
  const delta = plant.gOld.some((v) => v !== 0) ? 1 : 0;
  const zero = (k: number) => new Array<number>(k).fill(0);
  const tf0 = stateSpaceToTransferFunction({ n, a: plant.phi, b: plant.gNew, c: Float64Array.from(cw), d: 0 });
  const tf1 = stateSpaceToTransferFunction({ n, a: plant.phi, b: plant.gOld, c: Float64Array.from(cw), d: 0 });
  const dp = tf0.den;
  // N_p = z^δ·n0 + δ·n1 + d̃·D_p (degree ≤ n + δ).
  const np = polynomialAddAligned(polynomialAddAligned(delta ? [...tf0.num, 0] : tf0.num, delta ? tf1.num : [0]), dp.map((v) => v * dw));
  let nk: number[];
  let dk: number[];
  if (stateFeedback) {
    nk = [1];
    dk = [1];
  } else {
    const kt = stateSpaceToTransferFunction({ n: c.n, a: ctrl.phi, b: ctrl.gamma, c: c.c, d: c.dy });
    nk = kt.num;
    dk = kt.den;
  }
  const left = [...polynomialMultiply(dp, dk), ...zero(lags)];
  const right = polynomialMultiply(nk, np).map((v) => -v);
  return polynomialAddAligned(left, right);
}

/** Sum of two polynomials in descending powers, aligned at the constant term. */
function polynomialAddAligned(a: readonly number[], b: readonly number[]): number[] {
  const size = Math.max(a.length, b.length);
  const out = new Array<number>(size).fill(0);
  for (let i = 0; i < a.length; i++) out[size - a.length + i] += a[i];
  for (let i = 0; i < b.length; i++) out[size - b.length + i] += b[i];
  return out;
}

/**
 * A discrete-time controller in state space, from the measurement y to the output u, updated once
 * per sample: x_c,k+1 = A x_c,k + B y_k,  u_k = C x_c,k + D y_k (A: n × n row-major).
 */
export interface DiscreteStateSpaceController {
  n: number;
  a: Float64Array;
  b: Float64Array;
  c: Float64Array;
  d: number;
}

/**
 * Stability of the closed loop of a linear plant with dead time (zero-order hold at h, as in
 * sampledLoopStability) and a controller that is ALREADY discrete (its difference equations, e.g. a
 * PID discretised by Tustin or backward Euler): the same closed-loop matrix and characteristic
 * polynomial, with the controller's (A, B, C, D) taken as they are instead of the ZOH sampling of
 * a continuous realisation. Actuator limits are ignored (the verdict is the local one).
 * References: as sampledLoopStability (Åström & Wittenmark 1997, §2.3 and §3.2).
 */
export function discreteControllerLoopStability(
  plant: SisoStateSpace,
  delay: number,
  sampleTime: number,
  controller: DiscreteStateSpaceController,
  options: { method?: "eigenvalues" | "schur-cohn" } = {},
): SampledLoopVerdict {
  const h = sampleTime;
  if (!(h > 0) || !Number.isFinite(h)) throw new RangeError(`sampleTime must be a finite time > 0 s, got ${String(h)}`);
  const realization: ControllerRealization = {
    n: controller.n,
    a: new Float64Array(controller.n * controller.n),
    br: new Float64Array(controller.n),
    by: new Float64Array(controller.n),
    c: controller.c,
    dr: 0,
    dy: controller.d,
    kx: null,
    integrator: -1,
    ki: 0,
    trackingTime: Number.NaN,
  };
  const loop: SampledLoop = { plant, delay, controller: realization, sampleTime: h };
  const { m, phi } = splitDelay(delay, h);
  const delta = phi > 0 ? 1 : 0;
  const lags = m + delta;
  const order = plant.n + controller.n + lags;
  if (lags === 0 && !isWellPosedLoop(-controller.d, plant.d)) return { stable: false, poles: [], method: "eigenvalues" };
  if (order > MAX_SAMPLED_ORDER) return { stable: null, poles: [], method: "too-large" };
  const plantSteps = plantDiscretisation(plant, h, phi);
  const controllerStep = { phi: controller.a, gamma: controller.b };
  const method = options.method ?? (order <= MAX_SAMPLED_EIGEN_ORDER ? "eigenvalues" : "schur-cohn");
  if (method === "eigenvalues") {
    const poles = matrixEigenvalues(closedLoopMatrix(loop, plantSteps, controllerStep, m, delta));
    const limit = 1 - SAMPLED_STABILITY_TOLERANCE;
    return { stable: poles.every((z) => Math.hypot(z.re, z.im) < limit), poles, method: "eigenvalues" };
  }
  return { stable: isSchurStable(characteristicPolynomial(loop, plantSteps, controllerStep, lags)), poles: [], method: "schur-cohn" };
}
