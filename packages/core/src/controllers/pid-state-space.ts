import type { SisoStateSpace } from "../linear-algebra/siso-state-space.js";
import { assertValidPid } from "./assert-valid-pid.js";
import type { PidController } from "./pid.js";

/**
 * A state-space form of C(s) = kp + ki/s + kd·s/(tf·s + 1), input the error e, output u.
 * States: the integral of the error x_i (present when ki ≠ 0) and the derivative-filter state
 * x_d (present when kd ≠ 0), in that order:
 *
 *   x_i' = e
 *   x_d' = −x_d/tf + e
 *   u    = ki·x_i − (kd/tf²)·x_d + (kp + kd/tf)·e
 *
 * from kd·s/(tf·s + 1) = kd/tf − (kd/tf²)/(s + 1/tf). The feedthrough D_c = kp + kd/tf is what
 * makes u jump at a setpoint step: u(0⁺) = (kp + kd/tf)·Δr on a strictly proper plant.
 * Throws like assertValidPid (tf > 0 is required when kd ≠ 0).
 *
 * Reference: K. J. Åström and T. Hägglund, Advanced PID Control, ISA, 2006, §3.3 (filtered
 * derivative) and §13.3 (state realisation for implementation).
 */
export function pidStateSpace(pid: PidController): SisoStateSpace {
  assertValidPid(pid);
  const { kp, ki, kd, tf } = pid;
  const hasI = ki !== 0;
  const hasD = kd !== 0;
  const n = (hasI ? 1 : 0) + (hasD ? 1 : 0);
  const a = new Float64Array(n * n);
  const b = new Float64Array(n).fill(1);
  const c = new Float64Array(n);
  let i = 0;
  if (hasI) {
    c[i] = ki;
    i++;
  }
  if (hasD) {
    a[i * n + i] = -1 / tf;
    c[i] = -kd / (tf * tf);
  }
  return { n, a, b, c, d: kp + (hasD ? kd / tf : 0) };
}
