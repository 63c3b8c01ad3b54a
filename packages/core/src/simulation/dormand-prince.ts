import type { CompiledSystem } from "../expressions/compile-system.js";
import { chargeEvaluations } from "./work-budget.js";

/*
 * Dormand–Prince 5(4) tableau, as in J. R. Dormand and P. J. Prince, "A family of embedded
 * Runge–Kutta formulae", J. Comput. Appl. Math. 6(1), 19–26, 1980 (Table 2, RK5(4)7M), with the
 * FSAL property (the 7th stage is the 1st of the next step).
 */
const C2 = 1 / 5, C3 = 3 / 10, C4 = 4 / 5, C5 = 8 / 9;
const A21 = 1 / 5;
const A31 = 3 / 40, A32 = 9 / 40;
const A41 = 44 / 45, A42 = -56 / 15, A43 = 32 / 9;
const A51 = 19372 / 6561, A52 = -25360 / 2187, A53 = 64448 / 6561, A54 = -212 / 729;
const A61 = 9017 / 3168, A62 = -355 / 33, A63 = 46732 / 5247, A64 = 49 / 176, A65 = -5103 / 18656;
const B1 = 35 / 384, B3 = 500 / 1113, B4 = 125 / 192, B5 = -2187 / 6784, B6 = 11 / 84;
/** Error weights E = b − b̂ (5th minus 4th order weights). */
const E1 = 71 / 57600, E3 = -71 / 16695, E4 = 71 / 1920, E5 = -17253 / 339200, E6 = 22 / 525, E7 = -1 / 40;

/** Step-size control constants (E. Hairer, S. P. Nørsett and G. Wanner, Solving ODEs I, 2nd ed., 1993, §II.4). */
const SAFETY = 0.9;
const MIN_FACTOR = 0.2;
const MAX_FACTOR = 10;
const ERROR_EXPONENT = -1 / 5;
/** Most step attempts per call to `advance` before it reports failure. */
const MAX_ATTEMPTS = 100_000;

/** Tolerances of the embedded error estimate: |err_i| ≤ atol + rtol·max(|x_i|, |x_i,new|). */
export interface DormandPrinceTolerance {
  rtol: number;
  atol: number;
}

/** Default tolerances for loop simulation: far below the O(dt) errors of the sampled loop. */
export const DEFAULT_TOLERANCE: DormandPrinceTolerance = { rtol: 1e-8, atol: 1e-10 };

/**
 * An embedded Runge–Kutta integrator (Dormand–Prince 5(4), adaptive step) for a compiled plant
 * x' = f(t, x, p, u) with the input u held constant over each call of `advance`. Buffers are
 * allocated once; the accepted step size carries over between calls. Not re-entrant.
 */
export class DormandPrince {
  readonly n: number;
  /** Right-hand-side evaluations so far (a work budget for tests). */
  evaluations = 0;
  private h = 0;
  private readonly k1: Float64Array;
  private readonly k2: Float64Array;
  private readonly k3: Float64Array;
  private readonly k4: Float64Array;
  private readonly k5: Float64Array;
  private readonly k6: Float64Array;
  private readonly k7: Float64Array;
  private readonly stage: Float64Array;
  private readonly next: Float64Array;

  constructor(
    private readonly system: CompiledSystem,
    private readonly parameters: Float64Array,
    private readonly tolerance: DormandPrinceTolerance = DEFAULT_TOLERANCE,
  ) {
    const n = system.stateCount;
    this.n = n;
    this.k1 = new Float64Array(n);
    this.k2 = new Float64Array(n);
    this.k3 = new Float64Array(n);
    this.k4 = new Float64Array(n);
    this.k5 = new Float64Array(n);
    this.k6 = new Float64Array(n);
    this.k7 = new Float64Array(n);
    this.stage = new Float64Array(n);
    this.next = new Float64Array(n);
  }

  /**
   * Integrates x from t0 to t1 > t0 in place with the input u(t) = u + uRate·(t − t0) (held at u
   * when uRate is 0, the default; a ramp of an actuator's rate limit otherwise). Returns false when
   * the state became non-finite or the step size collapsed (the caller reports divergence).
   */
  advance(x: Float64Array, t0: number, t1: number, u0: number, uRate = 0): boolean {
    const { n, system, parameters, k1, k2, k3, k4, k5, k6, k7, stage, next } = this;
    const { rtol, atol } = this.tolerance;
    const f = system.derivatives;
    let t = t0;
    let h = this.h > 0 ? this.h : (t1 - t0);
    f(t, x, parameters, u0, k1);
    this.evaluations++;
    chargeEvaluations(1);
    for (let attempt = 0; attempt < MAX_ATTEMPTS; attempt++) {
      const remaining = t1 - t;
      if (remaining <= 1e-14 * Math.max(1, Math.abs(t1))) return true;
      const last = h >= remaining;
      const step = last ? remaining : h;
      for (let i = 0; i < n; i++) stage[i] = x[i] + step * A21 * k1[i];
      f(t + C2 * step, stage, parameters, u0 + uRate * (t + C2 * step - t0), k2);
      for (let i = 0; i < n; i++) stage[i] = x[i] + step * (A31 * k1[i] + A32 * k2[i]);
      f(t + C3 * step, stage, parameters, u0 + uRate * (t + C3 * step - t0), k3);
      for (let i = 0; i < n; i++) stage[i] = x[i] + step * (A41 * k1[i] + A42 * k2[i] + A43 * k3[i]);
      f(t + C4 * step, stage, parameters, u0 + uRate * (t + C4 * step - t0), k4);
      for (let i = 0; i < n; i++) stage[i] = x[i] + step * (A51 * k1[i] + A52 * k2[i] + A53 * k3[i] + A54 * k4[i]);
      f(t + C5 * step, stage, parameters, u0 + uRate * (t + C5 * step - t0), k5);
      for (let i = 0; i < n; i++) stage[i] = x[i] + step * (A61 * k1[i] + A62 * k2[i] + A63 * k3[i] + A64 * k4[i] + A65 * k5[i]);
      f(t + step, stage, parameters, u0 + uRate * (t + step - t0), k6);
      for (let i = 0; i < n; i++) next[i] = x[i] + step * (B1 * k1[i] + B3 * k3[i] + B4 * k4[i] + B5 * k5[i] + B6 * k6[i]);
      f(t + step, next, parameters, u0 + uRate * (t + step - t0), k7);
      this.evaluations += 6;
      chargeEvaluations(6);
      let err = 0;
      for (let i = 0; i < n; i++) {
        const e = step * (E1 * k1[i] + E3 * k3[i] + E4 * k4[i] + E5 * k5[i] + E6 * k6[i] + E7 * k7[i]);
        const scale = atol + rtol * Math.max(Math.abs(x[i]), Math.abs(next[i]));
        const r = e / scale;
        err += r * r;
      }
      err = Math.sqrt(err / n);
      if (!Number.isFinite(err)) {
        h = step * MIN_FACTOR;
        if (!(h > 1e-14 * Math.max(1, Math.abs(t)))) return false;
        continue;
      }
      const factor = err === 0 ? MAX_FACTOR : Math.min(MAX_FACTOR, Math.max(MIN_FACTOR, SAFETY * err ** ERROR_EXPONENT));
      if (err <= 1) {
        t = last ? t1 : t + step;
        for (let i = 0; i < n; i++) {
          x[i] = next[i];
          k1[i] = k7[i];
        }
        // Keep the controller's step for the next call, not the truncated last one.
        if (!last || factor < 1) h = step * factor;
        else h = Math.max(h, step * factor);
        this.h = h;
        if (last) return true;
      } else {
        h = step * factor;
        if (!(h > 1e-14 * Math.max(1, Math.abs(t)))) return false;
      }
    }
    return false;
  }
}
