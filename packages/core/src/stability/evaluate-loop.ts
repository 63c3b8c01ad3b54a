import type { Complex } from "../linear-algebra/complex.js";
import { assertFiniteCoefficients } from "../linear-algebra/polynomial-trim.js";

/**
 * A loop transfer function L(s) = num(s)/den(s)·e^(−delay·s): polynomials in descending powers of
 * s, dead time `delay` [s] ≥ 0. Under negative unity feedback the closed loop is L/(1 + L).
 */
export interface LoopTransferFunction {
  num: readonly number[];
  den: readonly number[];
  delay: number;
}

/**
 * Frequency response of a loop at the angular frequency ω [rad/s]:
 *
 *   L(jω) = num(jω)/den(jω) · e^(−jωθ),   e^(−jωθ) = cos ωθ − j sin ωθ,
 *
 * with both polynomials evaluated by Horner's scheme in complex arithmetic. Negative ω gives the
 * complex conjugate of L(j|ω|) (real coefficients). At a pole on the imaginary axis the value is
 * not finite.
 *
 * loop: finite coefficients, den not all zero, delay finite ≥ 0; omega: finite. Throws a
 * RangeError naming the bad field.
 *
 * Reference: K. J. Åström and R. M. Murray, Feedback Systems, Princeton University Press, 2008,
 * §9.1 (the loop transfer function and its frequency response).
 */
export function evaluateLoop(loop: LoopTransferFunction, omega: number): Complex {
  assertFiniteCoefficients(loop.num, "loop.num");
  assertFiniteCoefficients(loop.den, "loop.den");
  if (!loop.den.some((c) => c !== 0)) throw new RangeError("loop.den: the denominator must not be all zeros");
  if (typeof loop.delay !== "number" || !Number.isFinite(loop.delay) || loop.delay < 0) {
    throw new RangeError(`loop.delay: the dead time must be a finite number ≥ 0 s, got ${String(loop.delay)}`);
  }
  if (typeof omega !== "number" || !Number.isFinite(omega)) throw new RangeError(`omega must be a finite angular frequency, got ${String(omega)}`);
  return loopValueAt(loop.num, loop.den, loop.delay, 0, omega);
}

/**
 * L(s) at a complex point s = σ + jω, unchecked (callers validate once):
 * num(s)/den(s)·e^(−θσ)(cos θω − j sin θω). Used on the indentations of the Nyquist contour.
 */
export function loopValueAt(num: readonly number[], den: readonly number[], delay: number, sigma: number, omega: number): Complex {
  let nr = 0;
  let ni = 0;
  for (let k = 0; k < num.length; k++) {
    const r = nr * sigma - ni * omega + num[k];
    ni = nr * omega + ni * sigma;
    nr = r;
  }
  let dr = 0;
  let di = 0;
  for (let k = 0; k < den.length; k++) {
    const r = dr * sigma - di * omega + den[k];
    di = dr * omega + di * sigma;
    dr = r;
  }
  // (nr + j ni)/(dr + j di), scaled to avoid overflow (Smith 1962).
  let qr: number;
  let qi: number;
  if (Math.abs(dr) >= Math.abs(di)) {
    const t = di / dr;
    const w = dr + di * t;
    qr = (nr + ni * t) / w;
    qi = (ni - nr * t) / w;
  } else {
    const t = dr / di;
    const w = dr * t + di;
    qr = (nr * t + ni) / w;
    qi = (ni * t - nr) / w;
  }
  if (delay === 0) return { re: qr, im: qi };
  const gain = Math.exp(-delay * sigma);
  const c = gain * Math.cos(delay * omega);
  const s = -gain * Math.sin(delay * omega);
  return { re: qr * c - qi * s, im: qr * s + qi * c };
}
