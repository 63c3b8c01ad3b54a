import { assertValidPid } from "./assert-valid-pid.js";
import type { PidController } from "./pid.js";

/**
 * The PID C(s) = kp + ki/s + kd·s/(tf·s + 1) as one rational function num_c/den_c in lowest
 * terms with respect to its own structure — a term with a zero gain contributes no pole:
 *
 *   den_c = s^[ki ≠ 0] · (tf·s + 1)^[kd ≠ 0]
 *   num_c = kp·den_c + ki·(tf·s + 1)^[kd ≠ 0] + kd·s·s^[ki ≠ 0]
 *
 * e.g. full PID: num_c = (kp·tf + kd) s² + (kp + ki·tf) s + ki,  den_c = tf s² + s.
 * Leaving out the unused factors matters: a spurious factor s (with ki = 0) would add a closed-loop
 * root at s = 0 and a stable loop would look marginally stable.
 * Coefficients in descending powers of s. Throws like assertValidPid.
 */
export function pidTransferFunction(pid: PidController): { num: number[]; den: number[] } {
  assertValidPid(pid);
  const { kp, ki, kd, tf } = pid;
  const hasI = ki !== 0;
  const hasD = kd !== 0;
  if (hasI && hasD) return { num: [kp * tf + kd, kp + ki * tf, ki], den: [tf, 1, 0] };
  if (hasI) return { num: [kp, ki], den: [1, 0] };
  if (hasD) return { num: [kp * tf + kd, kp], den: [tf, 1] };
  return { num: [kp], den: [1] };
}
