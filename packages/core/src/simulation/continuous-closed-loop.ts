import type { ControllerRealization } from "../controllers/controller-realization.js";
import type { SisoStateSpace } from "../linear-algebra/siso-state-space.js";
import { solveLinear } from "../linear-algebra/solve-linear.js";
import { IllPosedLoopError, isWellPosedLoop } from "./ill-posed-loop-error.js";

/** Number of exogenous inputs of a closed loop: w = [Δr, d, n]. */
export const LOOP_INPUTS = 3;

/**
 * The continuous closed loop of a linear plant (A, B, C, D) with input u + d and a controller
 * realisation (controllerRealization) seeing r and the measured output y + n, in the state
 * z = [x; x_c] and the inputs w = [Δr, d, n] (setpoint change, load at the plant input,
 * measurement noise):
 *
 *   z' = A_cl z + B_cl w,   u = U_z z + U_w w,   y = Y_z z + Y_w w.
 *
 * The algebraic loop through the feedthroughs is solved once, k = 1/(1 − D_y·D):
 *   u = k[(D_y C + K_x) x + C_c x_c + D_r Δr + D_y D d + D_y n],   y = C x + D(u + d),
 *   x' = A x + B(u + d),   x_c' = A_c x_c + B_r Δr + B_y (y + n).
 * Throws IllPosedLoopError when 1 − D_y·D = 0.
 * Reference: K. J. Åström and R. M. Murray, Feedback Systems, Princeton, 2008, §7.2 and §10.1.
 */
export interface ContinuousClosedLoop {
  nz: number;
  np: number;
  a: Float64Array;
  /** nz×3 row-major. */
  b: Float64Array;
  uz: Float64Array;
  uw: Float64Array;
  yz: Float64Array;
  yw: Float64Array;
}

export function continuousClosedLoop(p: SisoStateSpace, c: ControllerRealization): ContinuousClosedLoop {
  if (!isWellPosedLoop(-c.dy, p.d)) throw new IllPosedLoopError(-c.dy, p.d);
  const k = 1 / (1 - c.dy * p.d);
  const np = p.n;
  const nc = c.n;
  const nz = np + nc;
  const m = LOOP_INPUTS;
  const uz = new Float64Array(nz);
  for (let j = 0; j < np; j++) uz[j] = k * (c.dy * p.c[j] + (c.kx ? c.kx[j] : 0));
  for (let j = 0; j < nc; j++) uz[np + j] = k * c.c[j];
  const uw = Float64Array.of(k * c.dr, k * c.dy * p.d, k * c.dy);
  const yz = new Float64Array(nz);
  for (let j = 0; j < nz; j++) yz[j] = (j < np ? p.c[j] : 0) + p.d * uz[j];
  const yw = Float64Array.of(p.d * uw[0], p.d * (uw[1] + 1), p.d * uw[2]);
  const a = new Float64Array(nz * nz);
  const b = new Float64Array(nz * m);
  for (let i = 0; i < np; i++) {
    for (let j = 0; j < np; j++) a[i * nz + j] = p.a[i * np + j];
    for (let j = 0; j < nz; j++) a[i * nz + j] += p.b[i] * uz[j];
    for (let j = 0; j < m; j++) b[i * m + j] = p.b[i] * uw[j];
    b[i * m + 1] += p.b[i];
  }
  for (let i = 0; i < nc; i++) {
    const row = np + i;
    for (let j = 0; j < nz; j++) a[row * nz + j] = c.by[i] * yz[j];
    for (let j = 0; j < nc; j++) a[row * nz + np + j] += c.a[i * nc + j];
    b[row * m] = c.br[i] + c.by[i] * yw[0];
    b[row * m + 1] = c.by[i] * yw[1];
    b[row * m + 2] = c.by[i] * (yw[2] + 1);
  }
  return { nz, np, a, b, uz, uw, yz, yw };
}

/**
 * Steady state of the closed loop for constant inputs w: z∞ = −A_cl⁻¹ B_cl w, then u∞, y∞ (the
 * final-value theorem for a stable loop). NaN for both when A_cl is singular (a closed-loop pole at 0).
 */
export function closedLoopSteadyState(loop: ContinuousClosedLoop, w: readonly number[]): { u: number; y: number } {
  const { nz, a, b, uz, uw, yz, yw } = loop;
  let u = 0;
  let y = 0;
  for (let j = 0; j < LOOP_INPUTS; j++) {
    u += uw[j] * w[j];
    y += yw[j] * w[j];
  }
  if (nz === 0) return { u, y };
  const rhs = new Float64Array(nz);
  for (let i = 0; i < nz; i++) {
    let acc = 0;
    for (let j = 0; j < LOOP_INPUTS; j++) acc -= b[i * LOOP_INPUTS + j] * w[j];
    rhs[i] = acc;
  }
  const z = solveLinear(a, rhs, nz);
  if (!z) return { u: NaN, y: NaN };
  for (let j = 0; j < nz; j++) {
    u += uz[j] * z[j];
    y += yz[j] * z[j];
  }
  return { u, y };
}
