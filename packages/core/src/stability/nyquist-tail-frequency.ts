/**
 * A frequency R beyond which the loop can no longer wind around −1: for every s with |s| ≥ R in
 * the closed right half-plane, 1 + L(s) stays in the disc around its centre c (real) of radius
 * < |c|, so arg(1 + L) varies continuously there without a full turn.
 *
 * With den(s) = a₀ Π(s − p_i) of degree n, ρ = max|p_i|, D = lim L at infinity without the delay
 * (num₀/a₀ when deg num = n, else 0) and r = num − D·den (deg r < n), for |s| = R > ρ:
 *
 *   |num(s)/den(s) − D| = |r(s)|/|den(s)| ≤ B(R) = Σ_k |r_k| R^k / (|a₀| (R − ρ)^n),
 *
 * and each term R^k/(R − ρ)^n (k < n) decreases for R > ρ, so B(R) ≤ target at one R means so
 * for all larger |s|. On Re s ≥ 0 also |e^(−θs)| ≤ 1. Targets (TAIL_GAIN = a small fraction):
 * - no delay: B ≤ TAIL_GAIN·|1 + D|, centre c = 1 + D (|1 + D| > 0 is checked by the caller);
 * - with delay: |D| + B ≤ |D| + TAIL_GAIN·(1 − |D|) < 1, centre c = 1 (needs |D| < 1, else the
 *   loop is neutral and the caller stops earlier). For a strictly proper loop this is |L| ≤ TAIL_GAIN.
 *
 * R is found by doubling from 2ρ + 1 (at most MAX_DOUBLINGS times).
 * Reference: the bound |den(s)| ≥ |a₀|(|s| − ρ)^n follows from |s − p_i| ≥ |s| − |p_i| (triangle
 * inequality); the use for the Nyquist contour's large arc is as in K. J. Åström and
 * R. M. Murray, Feedback Systems, 2008, §9.2.
 */
export const TAIL_GAIN = 0.05;

const MAX_DOUBLINGS = 200;

export interface NyquistTail {
  /** ω_max [rad/s]: beyond it (and on the large arc) the winding is settled. */
  omegaMax: number;
  /** Real centre c of the disc that holds 1 + L(s) for |s| ≥ ω_max, Re s ≥ 0. */
  centre: number;
}

/**
 * num, den: trimmed, den non-empty, deg num ≤ deg den; rootRadius = ρ; delay ≥ 0.
 * Returns null when no such frequency is found (cannot happen for deg r < n; a guard).
 */
export function nyquistTailFrequency(num: readonly number[], den: readonly number[], delay: number, rootRadius: number): NyquistTail | null {
  const n = den.length - 1;
  const biproper = num.length === den.length;
  const d = biproper ? num[0] / den[0] : 0;
  // r = num − D·den, aligned on den's powers; its leading coefficient is 0 by construction.
  const r = new Array<number>(n + 1).fill(0);
  for (let k = 0; k < num.length; k++) r[n + 1 - num.length + k] = num[k];
  if (biproper) {
    for (let k = 0; k <= n; k++) r[k] -= d * den[k];
    r[0] = 0;
  }
  const target = delay > 0 ? TAIL_GAIN * (1 - Math.abs(d)) : TAIL_GAIN * Math.abs(1 + d);
  const centre = delay > 0 ? 1 : 1 + d;
  const lead = Math.abs(den[0]);
  let radius = 2 * rootRadius + 1;
  for (let step = 0; step <= MAX_DOUBLINGS; step++) {
    let sum = 0;
    for (let k = 0; k <= n; k++) sum += Math.abs(r[k]) * radius ** (n - k);
    const bound = sum / (lead * (radius - rootRadius) ** n);
    if (bound <= target) return { omegaMax: radius, centre };
    radius *= 2;
  }
  return null;
}
