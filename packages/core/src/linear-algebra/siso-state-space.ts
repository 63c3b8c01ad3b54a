/**
 * A single-input single-output linear time-invariant system in state-space form
 *
 *   x' = A x + B u,   y = C x + D u,
 *
 * with n states. `a` is n×n row-major, `b` and `c` have n entries, `d` is a scalar.
 * n = 0 is a static gain y = D u.
 */
export interface SisoStateSpace {
  n: number;
  a: Float64Array;
  b: Float64Array;
  c: Float64Array;
  d: number;
}

/**
 * The exact zero-order-hold discretisation of a SisoStateSpace over one step h:
 *
 *   x[k+1] = Φ x[k] + Γ u[k],   y[k] = C x[k] + D u[k],
 *   Φ = e^(A h),   Γ = ∫₀ʰ e^(A τ) dτ · B.
 *
 * `phi` is n×n row-major, `gamma` has n entries.
 */
export interface DiscreteSisoStateSpace {
  n: number;
  phi: Float64Array;
  gamma: Float64Array;
  c: Float64Array;
  d: number;
  /** The step h [s] the system was discretised with. */
  h: number;
}
