import type { DiscreteStateSpaceController } from "../stability/sampled-loop-stability.js";
import type { DiscretePid } from "./discrete-pid.js";

/**
 * The linear part of a discrete PID (limits not reached, r = 0) as a state space from y to u, for
 * the stability verdict of its sampled loop. From the difference equations (DiscretePidCoefficients)
 * with e = −y and the states Ī (integral before the sample), D[k−1] and y[k−1]:
 *
 *   Ī[k+1]  = Ī[k] − bi1·y[k] − bi0·y[k−1]
 *   D[k]    = ad·D[k−1] − dy·y[k] + dy·y[k−1]
 *   u[k]    = Ī[k] + ad·D[k−1] + (dy − bi0)·y[k−1] − (py + bi1 + dy)·y[k]
 *
 * A state whose term is absent is left out (without integral action Ī would be an uncontrollable
 * pole at z = 1 that the loop never excites). The back-calculation term at·(u − v) is zero while
 * no limit is reached. Derived from stepDiscretePid's equations (Åström & Hägglund 2006, §3.6).
 */
export function discretePidRealization(pid: DiscretePid): DiscreteStateSpaceController {
  const { py, bi1, bi0, ad, dy } = pid.coefficients;
  const integral = bi1 !== 0 || bi0 !== 0;
  const derivative = ad !== 0 || dy !== 0;
  const past = bi0 !== 0 || dy !== 0;
  const names: ("i" | "d" | "y")[] = [];
  if (integral) names.push("i");
  if (derivative) names.push("d");
  if (past) names.push("y");
  const n = names.length;
  const at = (name: "i" | "d" | "y") => names.indexOf(name);
  const a = new Float64Array(n * n);
  const b = new Float64Array(n);
  const c = new Float64Array(n);
  if (integral) {
    const i = at("i");
    a[i * n + i] = 1;
    if (past) a[i * n + at("y")] = -bi0;
    b[i] = -bi1;
    c[i] = 1;
  }
  if (derivative) {
    const d = at("d");
    a[d * n + d] = ad;
    if (past) a[d * n + at("y")] = dy;
    b[d] = -dy;
    c[d] = ad;
  }
  if (past) {
    b[at("y")] = 1;
    c[at("y")] = dy - bi0;
  }
  return { n, a, b, c, d: -(py + bi1 + dy) };
}
