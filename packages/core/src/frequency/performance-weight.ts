import type { SensitivityWeight } from "./sensitivity-weight.js";

/** Parameters of the first-order performance weight. */
export interface PerformanceWeightConfig {
  /** M: the largest |S| allowed at high frequency (the bound on the peak, e.g. 2); > 0. */
  M: number;
  /** ωB [rad/s]: the bandwidth asked for, where the bound 1/|W| crosses about 1; > 0. */
  omegaB: number;
  /** A: the largest |S| allowed at low frequency (steady-state offset, A ≪ 1; 0 for none); ≥ 0. */
  A: number;
}

/**
 * The common first-order performance weight on the sensitivity,
 *
 *   W(s) = (s/M + ωB)/(s + ωB·A),
 *
 * whose inverse bound 1/|W| equals A at low frequency, rises through about 1 near ωB and levels
 * off at M at high frequency. ‖W·S‖∞ < 1 means |S(jω)| < 1/|W(jω)| at every frequency.
 * Throws a RangeError naming M, omegaB or A when not finite or out of range.
 *
 * Reference: S. Skogestad and I. Postlethwaite, Multivariable Feedback Control: Analysis and
 * Design, 2nd ed., Wiley, 2005, §2.8.2, eq. (2.105).
 */
export function performanceWeight({ M, omegaB, A }: PerformanceWeightConfig): SensitivityWeight {
  if (typeof M !== "number" || !Number.isFinite(M) || !(M > 0)) throw new RangeError(`M must be a finite number > 0, got ${String(M)}`);
  if (typeof omegaB !== "number" || !Number.isFinite(omegaB) || !(omegaB > 0)) throw new RangeError(`omegaB must be a finite frequency > 0 rad/s, got ${String(omegaB)}`);
  if (typeof A !== "number" || !Number.isFinite(A) || A < 0) throw new RangeError(`A must be a finite number ≥ 0, got ${String(A)}`);
  return { num: [1 / M, omegaB], den: [1, omegaB * A] };
}
