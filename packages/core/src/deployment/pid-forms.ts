import type { IdealPidParameters } from "../controllers/pid-ideal-form.js";
import type { DeployablePid } from "./deployable-pid.js";

/**
 * The series (interacting) form of a PID with derivative filter,
 *
 *   C(s) = K'·(1 + 1/(Ti'·s))·(1 + Td'·s)/(1 + Tf·s),
 *
 * gain K', integralTime Ti' [s] (Infinity: no integral action), derivativeTime Td' [s],
 * filterTime Tf [s] (the parallel form's tf).
 */
export interface SeriesPidParameters {
  gain: number;
  integralTime: number;
  derivativeTime: number;
  filterTime: number;
}

/** A form that exists, or why it does not. */
export type PidForm<T> = ({ exists: true } & T) | { exists: false; reason: string };

/** One PID in the forms a firmware engineer may need; the set-point weights b, c belong to the parallel and ideal forms. */
export interface PidForms {
  parallel: { kp: number; ki: number; kd: number; tf: number };
  ideal: PidForm<IdealPidParameters>;
  series: PidForm<SeriesPidParameters>;
  weights: { b: number; c: number };
}

/**
 * The parallel, ideal (standard) and series forms of one PID (set-point weights apart: they act
 * on r in the P and D terms of the parallel and ideal forms; the series form is the feedback path
 * C(s) from e = r − y).
 *
 * Ideal form K·(1 + 1/(Ti s) + Td s/((Td/N)s + 1)): K = kp, Ti = kp/ki, Td = kd/kp, N = Td/tf
 * (as pidToIdealForm; N = Infinity without a filter); exists when kp ≠ 0. tf = 0 with kd ≠ 0 (the
 * unfiltered textbook PID) is accepted here, for the forms only.
 *
 * Series form: both forms share the denominator s·(tf s + 1); matching numerators,
 *   (kp·tf + kd)s² + (kp + ki·tf)s + ki = (K'/Ti')·(Ti' s + 1)(Td' s + 1),
 * so Ti', Td' are the roots x of ki·x² − (kp + ki·tf)·x + (kp·tf + kd) = 0 (Ti' the larger) and
 * K' = ki·Ti'. It exists when these roots are real and ≥ 0:
 *   (kp + ki·tf)² ≥ 4·ki·(kp·tf + kd),   i.e.   Ti·(1 + Tf/Ti)² ≥ 4·(Td + Tf),
 * which at Tf = 0 is the textbook condition Ti ≥ 4·Td with K' = (K/2)(1 + √(1 − 4Td/Ti)),
 * Ti' = (Ti/2)(1 + √(1 − 4Td/Ti)), Td' = (Ti/2)(1 − √(1 − 4Td/Ti)). Without integral action
 * (ki = 0): K' = kp, Td' = (kp·tf + kd)/kp, Ti' = Infinity (needs kp ≠ 0). A filter time tf with
 * kd = 0 is no filter (the derivative term is absent) and is dropped.
 *
 * Reference: K. J. Åström and T. Hägglund, Advanced PID Control, ISA, 2006, §3.2 (eq. 3.8–3.11).
 */
export function pidForms(pid: DeployablePid): PidForms {
  const { kp, ki, kd } = pid;
  const tf = kd === 0 ? 0 : pid.tf;
  let ideal: PidForm<IdealPidParameters>;
  if (kp === 0) ideal = { exists: false, reason: "the ideal form needs kp ≠ 0 (K = kp, Ti = kp/ki, Td = kd/kp)" };
  else {
    // As pidToIdealForm, but also for the unfiltered textbook PID (kd ≠ 0, tf = 0 ⇒ N = Infinity).
    const derivativeTime = kd / kp;
    ideal = { exists: true, gain: kp, integralTime: ki === 0 ? Infinity : kp / ki, derivativeTime, filterDivisor: tf === 0 ? Infinity : derivativeTime / tf };
  }
  return { parallel: { kp, ki, kd, tf }, ideal, series: seriesForm(kp, ki, kd, tf), weights: { b: pid.b, c: pid.c } };
}

function seriesForm(kp: number, ki: number, kd: number, tf: number): PidForm<SeriesPidParameters> {
  const c2 = kp * tf + kd;
  if (ki === 0) {
    if (kp === 0) return { exists: false, reason: "a series form needs kp ≠ 0 or ki ≠ 0" };
    const td = c2 / kp;
    if (td < 0) return { exists: false, reason: `the derivative time (kp·tf + kd)/kp = ${td} s is negative` };
    return { exists: true, gain: kp, integralTime: Infinity, derivativeTime: td, filterTime: tf };
  }
  const c1 = kp + ki * tf;
  const discriminant = c1 * c1 - 4 * ki * c2;
  if (discriminant < 0) {
    return { exists: false, reason: `the zeros are complex: (kp + ki·tf)² = ${c1 * c1} < 4·ki·(kp·tf + kd) = ${4 * ki * c2} (at tf = 0: Ti < 4·Td)` };
  }
  const root = Math.sqrt(discriminant);
  // Roots of ki·x² − c1·x + c2 = 0; the product form avoids cancellation for the smaller one.
  const big = c1 !== 0 ? (c1 + Math.sign(c1) * root) / (2 * ki) : root / (2 * ki);
  const small = big === 0 ? 0 : c2 / (ki * big);
  const ti = Math.max(big, small);
  const td = Math.min(big, small);
  if (!(td >= 0)) return { exists: false, reason: `the series times would be negative (Ti' = ${ti} s, Td' = ${td} s)` };
  return { exists: true, gain: ki * ti, integralTime: ti, derivativeTime: td, filterTime: tf };
}
