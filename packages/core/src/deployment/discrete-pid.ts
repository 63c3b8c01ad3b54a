import type { DeployablePid } from "./deployable-pid.js";

/** How the continuous PID is turned into difference equations. */
export const DISCRETIZATION_METHODS = ["tustin", "backward-euler"] as const;
export type DiscretizationMethod = (typeof DISCRETIZATION_METHODS)[number];

/**
 * The coefficients of the discrete PID's difference equations (see discretizePid), at sample
 * time h:
 *
 *   P[k] = pr·r[k] − py·y[k]
 *   I[k] = Ī[k] + bi1·e[k] + bi0·e[k−1],        e = r − y
 *   D[k] = ad·D[k−1] + dr·(r[k] − r[k−1]) − dy·(y[k] − y[k−1])
 *   v[k] = P[k] + I[k] + D[k]
 *   u[k] = rate-limit(saturate(v[k]))
 *   Ī[k+1] = I[k] + at·(u[k] − v[k])            (back-calculation)
 */
export interface DiscretePidCoefficients {
  pr: number;
  py: number;
  bi1: number;
  bi0: number;
  ad: number;
  dr: number;
  dy: number;
  at: number;
}

/** Names of the coefficients in the order firmware tables list them. */
export const DISCRETE_PID_COEFFICIENTS = ["pr", "py", "bi1", "bi0", "ad", "dr", "dy", "at"] as const satisfies readonly (keyof DiscretePidCoefficients)[];

/** A PID as difference equations at one sample time, with its output limits. */
export interface DiscretePid {
  method: DiscretizationMethod;
  /** Sample time h [s]. */
  sampleTime: number;
  coefficients: DiscretePidCoefficients;
  /** Output limits [u] (±Infinity: none) and the largest change per sample du_max = rate·h [u] (Infinity: none). */
  limits: { min: number; max: number; step: number };
  /** Tracking time Tt [s] of back-calculation (NaN without integral action or anti-windup). */
  trackingTime: number;
  /** The continuous PID the coefficients came from. */
  pid: DeployablePid;
}
