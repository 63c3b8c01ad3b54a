/**
 * Closed forms for the comparison tests, written out by hand and independent of core.
 *
 * ∫₀^∞ h(t)² dt of a stable strictly proper H(s) is xᵀPx of the Lyapunov equation AᵀP + PA = −CᵀC
 * of any realisation; solved by hand for orders 2 and 3 it gives the classic table entries
 * (H. M. James, N. B. Nichols and R. S. Phillips, Theory of Servomechanisms, McGraw-Hill, 1947,
 * §7.9, table of I_n; from memory, and checked in the tests against impulse responses in closed form):
 *
 *   H = (b1 s + b0)/(a2 s² + a1 s + a0):             I₂ = (b1²·a0 + b0²·a2) / (2·a0·a1·a2)
 *   H = (b2 s² + b1 s + b0)/(a3 s³ + a2 s² + a1 s + a0):
 *       I₃ = (b2²·a0·a1 + (b1² − 2·b0·b2)·a0·a3 + b0²·a2·a3) / (2·a0·a3·(a1·a2 − a0·a3))
 *
 * Both hold only for a stable denominator (all a > 0 and, for n = 3, a1·a2 > a0·a3); NaN otherwise.
 */
export function integralSquare2(b1: number, b0: number, a2: number, a1: number, a0: number): number {
  if (!(a2 > 0 && a1 > 0 && a0 > 0)) return NaN;
  return (b1 * b1 * a0 + b0 * b0 * a2) / (2 * a0 * a1 * a2);
}

export function integralSquare3(b2: number, b1: number, b0: number, a3: number, a2: number, a1: number, a0: number): number {
  if (!(a3 > 0 && a2 > 0 && a1 > 0 && a0 > 0 && a1 * a2 > a0 * a3)) return NaN;
  return (b2 * b2 * a0 * a1 + (b1 * b1 - 2 * b0 * b2) * a0 * a3 + b0 * b0 * a2 * a3) / (2 * a0 * a3 * (a1 * a2 - a0 * a3));
}

/**
 * ISE and effort of a PI controller C = kp + ki/s on G = K/(τs + 1) after a unit setpoint step,
 * infinite horizon. Worked by hand: with χ(s) = τs² + (1 + K·kp)s + K·ki,
 *
 *   E(s) = (τs + 1)/χ(s),
 *   U(s) − u∞/s = (τ(kp − 1/K)·s + (ki·τ − 1/K))/χ(s),   u∞ = 1/K
 *
 * (the constant term K·ki/K − ki cancels), so ISE = I₂(τ, 1; τ, 1 + K·kp, K·ki) and
 * Effort = I₂(τ(kp − 1/K), ki·τ − 1/K; τ, 1 + K·kp, K·ki). The kick u(0⁺) = kp is part of U.
 */
export function piFirstOrderCosts(K: number, tau: number, kp: number, ki: number): { ise: number; effort: number } {
  const a2 = tau;
  const a1 = 1 + K * kp;
  const a0 = K * ki;
  return { ise: integralSquare2(tau, 1, a2, a1, a0), effort: integralSquare2(tau * (kp - 1 / K), ki * tau - 1 / K, a2, a1, a0) };
}

/**
 * ISE of a PI controller on G = 1/(s + 1)² after a unit setpoint step, infinite horizon: by hand,
 * E(s) = (s + 1)²/(s³ + 2s² + (1 + kp)s + ki), so ISE = I₃(1, 2, 1; 1, 2, 1 + kp, ki).
 */
export function piSecondOrderIse(kp: number, ki: number): number {
  return integralSquare3(1, 2, 1, 1, 2, 1 + kp, ki);
}

/**
 * Ms = max_ω |1/(1 + L(jω))| of L(s) = (kp·s + ki)/(s·(s + 1)²), by a dense logarithmic grid
 * (1500 points over 10⁻³ … 10³ rad/s) refined by golden-section search on the best cell — the
 * sensitivity peak as defined in K. J. Åström and T. Hägglund, Advanced PID Control, ISA, 2006, §4.2.
 */
export function piSecondOrderMs(kp: number, ki: number): number {
  const s = (w: number) => {
    // L(jw) = (ki + j·kp·w) / (j·w·(1 + jw)²); (1 + jw)² = (1 − w²) + 2jw.
    const denRe = -2 * w * w; // j·w·((1 − w²) + 2jw) = −2w² + j·w(1 − w²)
    const denIm = w * (1 - w * w);
    const numRe = ki;
    const numIm = kp * w;
    const d = denRe * denRe + denIm * denIm;
    const lRe = (numRe * denRe + numIm * denIm) / d;
    const lIm = (numIm * denRe - numRe * denIm) / d;
    return 1 / Math.hypot(1 + lRe, lIm);
  };
  const points = 1500;
  const lw = (i: number) => -3 + (6 * i) / (points - 1);
  let best = 0;
  for (let i = 1; i < points; i++) if (s(10 ** lw(i)) > s(10 ** lw(best))) best = i;
  let a = lw(Math.max(0, best - 1));
  let b = lw(Math.min(points - 1, best + 1));
  const ratio = (Math.sqrt(5) - 1) / 2;
  for (let k = 0; k < 80; k++) {
    const c = b - ratio * (b - a);
    const d = a + ratio * (b - a);
    if (s(10 ** c) > s(10 ** d)) b = d;
    else a = c;
  }
  return Math.max(s(10 ** ((a + b) / 2)), s(10 ** lw(best)));
}

/**
 * The minimum of f over a 2-D box, found independently of core: a dense grid of `n` × `n` points
 * (evenly in log when `log`), then a Nelder–Mead polish from the best grid point in the same
 * coordinates (test/support/nelder-mead.ts), every point outside the box or with f non-finite
 * counting as +∞. `feasible` (default: everything) is asked only of points that would improve on
 * the best grid value so far, to spare an expensive constraint.
 */
export function minimiseOnBox(
  f: (x: number, y: number) => number,
  box: { x: [number, number]; y: [number, number] },
  n: number,
  polish: (g: (p: readonly number[]) => number, start: number[]) => { x: number[]; value: number },
  feasible: (x: number, y: number) => boolean = () => true,
): { x: number; y: number; value: number } {
  const lx = box.x.map(Math.log);
  const ly = box.y.map(Math.log);
  const at = (u: number, v: number) => [Math.exp(lx[0] + u * (lx[1] - lx[0])), Math.exp(ly[0] + v * (ly[1] - ly[0]))];
  let best = [0, 0];
  let bestValue = Infinity;
  const g = (p: readonly number[]) => {
    if (p[0] < 0 || p[0] > 1 || p[1] < 0 || p[1] > 1) return Infinity;
    const [x, y] = at(p[0], p[1]);
    const value = f(x, y);
    if (!Number.isFinite(value)) return Infinity;
    return value < bestValue && !feasible(x, y) ? Infinity : value;
  };
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const p = [i / (n - 1), j / (n - 1)];
      const value = g(p);
      if (value < bestValue) {
        bestValue = value;
        best = p;
      }
    }
  }
  const grid = bestValue;
  bestValue = Infinity; // the polish checks every point it asks
  const polished = polish(g, best);
  bestValue = grid;
  const final = polished.value <= bestValue ? polished.x : best;
  const [x, y] = at(final[0], final[1]);
  return { x, y, value: Math.min(polished.value, bestValue) };
}
