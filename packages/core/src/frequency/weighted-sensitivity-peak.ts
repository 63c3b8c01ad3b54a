import { polynomialAdd } from "../linear-algebra/polynomial-add.js";
import { polynomialMultiply } from "../linear-algebra/polynomial-multiply.js";
import { polynomialRoots } from "../linear-algebra/polynomial-roots.js";
import { loopValueAt } from "../stability/evaluate-loop.js";
import { rootHints } from "./frequency-span.js";
import { gridPeak, type FrequencyPeak } from "./grid-peak.js";
import { assertValidWeight, type SensitivityWeight } from "./sensitivity-weight.js";

/**
 * ‖W·S‖∞ = sup_ω |W(jω)|/|1 + L(jω)| for a proper weight W = num_W/den_W, on the loop's refined
 * grid `omega` (from frequencyResponse) joined with the hint frequencies of W's poles and zeros,
 * refined by golden section at every large local maximum (gridPeak), and compared with the limit
 * at ω = 0 (common factors s^k cancelled, see lowFrequencyLimit) and the high-frequency limit
 * |W(∞)|·sTail (sTail = lim sup |S| at high frequency, from frequencyResponse).
 *
 * ‖W·S‖∞ < 1 ⇔ |S(jω)| < 1/|W(jω)| for every ω: the weight's inverse is the bound on |S|.
 *
 * loop: trimmed and checked (frequencyResponse's assertValidLoop); weight: checked here
 * (assertValidWeight names weight.num or weight.den). A weight with a pole on the imaginary axis
 * gives Infinity unless the loop cancels it.
 *
 * References: S. Skogestad and I. Postlethwaite, Multivariable Feedback Control, 2nd ed., 2005,
 * §2.8.2 (weighted sensitivity, eq. 2.104–2.106); K. Zhou, J. C. Doyle and K. Glover, Robust and
 * Optimal Control, Prentice Hall, 1996, §4.3 (the H∞ norm as the peak gain over frequency).
 */
export function weightedSensitivityPeak(
  loop: { num: readonly number[]; den: readonly number[]; delay: number },
  omega: ArrayLike<number>,
  weight: SensitivityWeight,
  sTail: number,
): FrequencyPeak {
  const w = assertValidWeight(weight);
  const hints: number[] = [];
  if (w.num.length > 1) hints.push(...rootHints(polynomialRoots(w.num)));
  if (w.den.length > 1) hints.push(...rootHints(polynomialRoots(w.den)));
  const lo = omega[0];
  const hi = omega[omega.length - 1];
  const grid = Array.from(omega);
  for (const h of hints) if (h > lo && h < hi) grid.push(h);
  grid.sort((a, b) => a - b);
  const f = (x: number) => {
    const l = loopValueAt(loop.num, loop.den, loop.delay, 0, x);
    const a = loopValueAt(w.num, w.den, 0, 0, x);
    return Math.hypot(a.re, a.im) / Math.hypot(1 + l.re, l.im);
  };
  const values = Float64Array.from(grid, f);
  let peak = gridPeak(grid, values, f);
  for (let i = 0; i < values.length; i++) if (Number.isNaN(values[i]) || values[i] === Infinity) peak = { omega: grid[i], value: Infinity };
  const low = lowFrequencyLimit(polynomialMultiply(w.num, loop.den), polynomialMultiply(w.den, polynomialAdd(loop.den, loop.num)));
  if (low > peak.value) peak = { omega: 0, value: low };
  const wInfinity = w.num.length === w.den.length ? Math.abs(w.num[0] / w.den[0]) : 0;
  const tail = wInfinity * sTail;
  return tail > peak.value ? { omega: Infinity, value: tail } : peak;
}

/**
 * lim_{s→0} |P(s)/Q(s)| with W·S = P/Q at s → 0 (e^(−θs) → 1): P = num_W·den_L,
 * Q = den_W·(den_L + num_L). Common factors s^k cancel, so a weight with a pole at 0 (A = 0) on a
 * loop with integral action has a finite limit: the ratio of the lowest non-zero coefficients.
 */
function lowFrequencyLimit(p: readonly number[], q: readonly number[]): number {
  let i = p.length - 1;
  let j = q.length - 1;
  while (i > 0 && p[i] === 0 && j > 0 && q[j] === 0) {
    i--;
    j--;
  }
  if (q[j] === 0) return p[i] === 0 ? NaN : Infinity;
  return Math.abs(p[i] / q[j]);
}
