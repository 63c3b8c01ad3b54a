/**
 * Parallel PID with first-order derivative filter:
 *
 *   C(s) = kp + ki/s + kd·s/(tf·s + 1)
 *
 * kp [u/y], ki [u/(y·s)], kd [u·s/y], tf [s] ≥ 0 (tf = 0 only when kd = 0).
 */
export interface PidController {
  kind: "pid";
  kp: number;
  ki: number;
  kd: number;
  tf: number;
}
