import { assertFiniteCoefficients, trimLeadingZeros } from "../linear-algebra/polynomial-trim.js";
import type { LoopTransferFunction } from "./evaluate-loop.js";

/**
 * Checks a loop transfer function L(s) = num(s)/den(s)·e^(−θs) and returns it with leading zero
 * coefficients trimmed and the dead time θ defaulted to 0 s.
 *
 * loop: num, den finite coefficient arrays (highest power first), den not all zero, deg num ≤ deg den
 * (a proper loop), delay θ finite ≥ 0 s. A TypeError (not an object) or a RangeError naming the bad
 * field (loop.num, loop.den, loop.delay) otherwise.
 */
export function assertValidLoop(loop: LoopTransferFunction): { num: number[]; den: number[]; delay: number } {
  if (loop === null || typeof loop !== "object") throw new TypeError("loop must be { num, den, delay }");
  assertFiniteCoefficients(loop.num, "loop.num");
  assertFiniteCoefficients(loop.den, "loop.den");
  const delay = loop.delay ?? 0;
  if (typeof delay !== "number" || !Number.isFinite(delay) || delay < 0) {
    throw new RangeError(`loop.delay: the dead time must be a finite number ≥ 0 s, got ${String(loop.delay)}`);
  }
  const num = trimLeadingZeros(loop.num);
  const den = trimLeadingZeros(loop.den);
  if (den.length === 0) throw new RangeError("loop.den: the denominator must not be all zeros");
  if (num.length > den.length) {
    throw new RangeError(`loop.num: the loop must be proper, numerator degree ${num.length - 1} exceeds denominator degree ${den.length - 1}`);
  }
  return { num, den, delay };
}
