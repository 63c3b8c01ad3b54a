/** The models fitted to a step test. */
export const STEP_MODEL_KINDS = ["fopdt", "sopdt", "ipdt"] as const;
export type StepModelKind = (typeof STEP_MODEL_KINDS)[number];

/** A fitted model as a plant: G(s) = num(s)/den(s)·e^(−delay·s), descending powers of s. */
export interface IdentifiedTransferFunction {
  kind: "transfer-function";
  num: number[];
  den: number[];
  delay: number;
}

/**
 * One model family of step-test identification: its parameters, its response to an input step
 * and its transfer function. Time parameters are in seconds; k in [y/u] (FOPDT, SOPDT) or
 * [y/(u·s)] (IPDT).
 */
export interface StepModel {
  kind: StepModelKind;
  /** Parameter names in vector order. */
  parameters: readonly string[];
  /** Which parameters are gains (scaled by the output/input ratio) rather than times. */
  gains: readonly boolean[];
  /** Output deviation at time `t` [s] after an input step of size `du` at t = 0 (0 for t ≤ θ). */
  response(p: ArrayLike<number>, t: number, du: number): number;
  transferFunction(p: ArrayLike<number>): IdentifiedTransferFunction;
}

/**
 * First order plus dead time, G(s) = k·e^(−θs)/(τs + 1):
 *   y(t) = k·Δu·(1 − e^(−(t − θ)/τ)) for t > θ, else 0.
 */
export const FOPDT: StepModel = {
  kind: "fopdt",
  parameters: ["k", "tau", "theta"],
  gains: [true, false, false],
  response(p, t, du) {
    const s = t - p[2];
    return s > 0 ? -p[0] * du * Math.expm1(-s / p[1]) : 0;
  },
  transferFunction: (p) => ({ kind: "transfer-function", num: [p[0]], den: [p[1], 1], delay: p[2] }),
};

/** Above this exponent the SOPDT divided difference is taken directly (no cancellation there). */
const DIRECT_EXPONENT = 30;
/** Below this |x|, expm1(x)/x is taken from its series 1 + x/2 (error below x²/6 < 2e-17). */
const SERIES_LIMIT = 1e-8;

/**
 * Second order plus dead time with real poles, G(s) = k·e^(−θs)/((τ1 s + 1)(τ2 s + 1)):
 *   y(t) = k·Δu·(1 − (τ1 e^(−t'/τ1) − τ2 e^(−t'/τ2))/(τ1 − τ2)),   t' = t − θ > 0,
 * and the limit k·Δu·(1 − (1 + t'/τ)e^(−t'/τ)) at τ1 = τ2 = τ (Seborg et al., Process Dynamics and
 * Control, 4th ed., 2016, §5.3). The divided difference is evaluated without cancellation as
 *   e^(−t'/τ1) + τ2·e^(−t'/τ2)·expm1(a·δ)/δ,   δ = τ1 − τ2,   a = t'/(τ1 τ2),
 * which tends to the repeated-pole form as δ → 0.
 */
export const SOPDT: StepModel = {
  kind: "sopdt",
  parameters: ["k", "tau1", "tau2", "theta"],
  gains: [true, false, false, false],
  response(p, t, du) {
    const s = t - p[3];
    if (!(s > 0)) return 0;
    const t1 = p[1];
    const t2 = p[2];
    const delta = t1 - t2;
    const x = (s / (t1 * t2)) * delta;
    let ratio: number;
    if (x > DIRECT_EXPONENT || x < -DIRECT_EXPONENT) ratio = (t1 * Math.exp(-s / t1) - t2 * Math.exp(-s / t2)) / delta;
    else {
      const e = Math.abs(x) < SERIES_LIMIT ? (s / (t1 * t2)) * (1 + x / 2) : Math.expm1(x) / delta;
      ratio = Math.exp(-s / t1) + t2 * Math.exp(-s / t2) * e;
    }
    return p[0] * du * (1 - ratio);
  },
  transferFunction: (p) => ({ kind: "transfer-function", num: [p[0]], den: [p[1] * p[2], p[1] + p[2], 1], delay: p[3] }),
};

/**
 * Integrating plus dead time, G(s) = k·e^(−θs)/s:
 *   y(t) = k·Δu·(t − θ) for t > θ, else 0.
 */
export const IPDT: StepModel = {
  kind: "ipdt",
  parameters: ["k", "theta"],
  gains: [true, false],
  response(p, t, du) {
    const s = t - p[1];
    return s > 0 ? p[0] * du * s : 0;
  },
  transferFunction: (p) => ({ kind: "transfer-function", num: [p[0]], den: [1, 0], delay: p[1] }),
};

/** The model of each kind. */
export const STEP_MODELS: Record<StepModelKind, StepModel> = { fopdt: FOPDT, sopdt: SOPDT, ipdt: IPDT };
