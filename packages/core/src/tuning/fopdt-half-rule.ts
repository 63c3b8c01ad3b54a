import type { Plant } from "../plants/plant.js";
import type { Complex } from "../linear-algebra/complex.js";
import { plantFactors } from "./plant-factors.js";

/** First-order plus dead time model k·e^(−θs)/(τs + 1): gain k, time constant τ [s], dead time θ [s]. */
export interface FopdtModel {
  k: number;
  tau: number;
  theta: number;
}

/** Second-order plus dead time model k·e^(−θs)/((τ1·s + 1)(τ2·s + 1)), τ1 ≥ τ2 ≥ 0 [s]. */
export interface SopdtModel {
  k: number;
  tau1: number;
  tau2: number;
  theta: number;
}

/** Both half-rule fits of one plant, or why the rule does not apply. */
export type HalfRuleFit = { ok: true; fopdt: FopdtModel; sopdt: SopdtModel } | { ok: false; reason: string };

/**
 * Relative radius of a root cluster, |pᵢ − pⱼ| ≤ ROOT_CLUSTER_TOLERANCE·max(|pᵢ|, |pⱼ|). Companion-matrix
 * roots of an m-fold real root come out as a ring of radius ≈ eps^(1/m)·|p| (0.03·|p| for m = 10)
 * around it, while the ring's mean is accurate to about eps·|p|. A conjugate-symmetric cluster is
 * therefore replaced by m real roots at its mean (our choice; a genuinely complex pair that close to
 * the real axis, damping ζ > 0.9997, is then treated as a double real root).
 */
export const ROOT_CLUSTER_TOLERANCE = 0.05;
/** |Im p|/|p| at or below which a (cluster-merged) root counts as real. */
export const REAL_ROOT_TOLERANCE = 1e-9;

/** The factor 5 of Skogestad's rules T2 and T3 (τ̃0 = min(τ0, 5τc)). */
const ZERO_RULE_FACTOR = 5;

/**
 * Skogestad's half rule: reduces a stable plant with real poles to a first-order (and a
 * second-order) plus dead time model. Starting from
 *
 *   G(s) = k·Π(−T_j0·s + 1)·Π(T_l0·s + 1) / Π(τ_i0·s + 1) · e^(−θ0·s),
 *
 * 1. each inverse-response (right-half-plane) zero becomes dead time: −T0·s + 1 ≈ e^(−T0·s);
 * 2. each left-half-plane zero T0 is cancelled against a neighbouring lag τ0 (the smallest lag
 *    larger than T0, else the largest lag) with τc the effective dead time of a first pass without
 *    these zeros (τc = θ, the paper's choice for tight control):
 *      T0 ≥ τ0:  T0/τ0 if τ0 ≥ τc (T1);  T0/τc if T0 ≥ τc ≥ τ0 (T1a);  1 if τc ≥ T0 (T1b);
 *      T0 < τ0:  T0/τ0 if T0 ≥ 5τc (T2);  (τ̃0/τ0)/((τ̃0 − T0)s + 1), τ̃0 = min(τ0, 5τc) (T3);
 *    a constant factor multiplies k, T3 leaves a new lag τ̃0 − T0;
 * 3. with the lags sorted τ1 ≥ τ2 ≥ τ3 ≥ …, the largest neglected lag is split half into the kept
 *    lag and half into the dead time, the smaller ones go fully to the dead time:
 *      FOPDT:  τ = τ1 + τ2/2,   θ = θ0 + ΣT_j0 + τ2/2 + Σ_{i≥3} τi,
 *      SOPDT:  τ1,  τ2' = τ2 + τ3/2,   θ = θ0 + ΣT_j0 + τ3/2 + Σ_{i≥4} τi.
 * k is the static gain G(0) times the constant factors of step 2.
 *
 * Does not apply (status, not an exception) to plants with a pole in the closed right half plane
 * (unstable or integrating), complex poles or zeros, a zero at the origin, or no lag at all; no
 * fallback fit is attempted. State-space plants are fitted through their transfer function,
 * nonlinear plants through their linearisation at the operating point.
 * Throws a RangeError naming the field of a malformed plant.
 *
 * Reference: S. Skogestad, "Simple analytic rules for model reduction and PID controller tuning",
 * Journal of Process Control 13 (2003) 291–309, §3 (half rule, eq. 10; zero rules T1–T3 of §3.2 —
 * the rule labels and the factor 5 from memory).
 */
export function halfRule(plant: Plant): HalfRuleFit {
  const factors = plantFactors(plant);
  const f = { ...factors, poles: mergeRootClusters(factors.poles), zeros: mergeRootClusters(factors.zeros) };
  const realTol = (re: number, im: number) => Math.abs(im) <= REAL_ROOT_TOLERANCE * Math.hypot(re, im);
  if (f.poles.some((p) => p.re > 0 && realTol(p.re, p.im))) return { ok: false, reason: "the plant is unstable (a real pole in the right half plane); the half rule needs a stable plant" };
  if (f.poles.some((p) => !realTol(p.re, p.im))) return { ok: false, reason: "the plant has complex poles; the half rule needs real poles" };
  if (f.poles.some((p) => p.re >= 0)) return { ok: false, reason: "the plant is integrating (a pole at the origin); the half rule fit needs a finite static gain" };
  if (f.zeros.some((z) => !realTol(z.re, z.im))) return { ok: false, reason: "the plant has complex zeros; the half rule needs real zeros" };
  if (f.zeros.some((z) => z.re === 0)) return { ok: false, reason: "the plant has a zero at the origin (no static gain)" };
  if (!Number.isFinite(f.staticGain) || f.staticGain === 0) return { ok: false, reason: "the plant has no finite non-zero static gain" };
  if (f.poles.length === 0) return { ok: false, reason: "the plant has no lag (a static gain with dead time); the FOPDT rules need a time constant" };

  let k = f.staticGain;
  let theta = f.delay;
  const lags = f.poles.map((p) => -1 / p.re);
  const zeroTimes: number[] = [];
  for (const z of f.zeros) {
    if (z.re > 0) theta += 1 / z.re;
    else zeroTimes.push(-1 / z.re);
  }
  if (zeroTimes.length > 0) {
    const tauC = fopdtFromLags(lags, theta).theta;
    zeroTimes.sort((a, b) => b - a);
    for (const T0 of zeroTimes) {
      if (lags.length === 0) {
        // No lag left to pair with: the zero acts above the closed-loop bandwidth as T0/τc (rule T1a/T1b with τ0 → 0).
        k *= tauC > 0 ? Math.max(1, T0 / tauC) : 1;
        continue;
      }
      let index = -1;
      for (let i = 0; i < lags.length; i++) if (lags[i] > T0 && (index < 0 || lags[i] < lags[index])) index = i;
      if (index < 0) for (let i = 0; i < lags.length; i++) if (index < 0 || lags[i] > lags[index]) index = i;
      const tau0 = lags[index];
      lags.splice(index, 1);
      if (T0 >= tau0) {
        if (tau0 >= tauC) k *= T0 / tau0; // T1
        else if (T0 >= tauC) k *= T0 / tauC; // T1a
        // T1b: factor 1
      } else if (T0 >= ZERO_RULE_FACTOR * tauC) {
        k *= T0 / tau0; // T2
      } else {
        const tauTilde = Math.min(tau0, ZERO_RULE_FACTOR * tauC); // T3
        k *= tauTilde / tau0;
        if (tauTilde - T0 > 0) lags.push(tauTilde - T0);
      }
    }
    if (lags.length === 0) return { ok: false, reason: "the zeros cancel every lag; the FOPDT rules need a time constant" };
  }
  const first = fopdtFromLags(lags, theta);
  const sorted = [...lags].sort((a, b) => b - a);
  const tau3 = sorted[2] ?? 0;
  let rest = 0;
  for (let i = 3; i < sorted.length; i++) rest += sorted[i];
  const sopdt: SopdtModel = { k, tau1: sorted[0], tau2: (sorted[1] ?? 0) + tau3 / 2, theta: theta + tau3 / 2 + rest };
  return { ok: true, fopdt: { k, tau: first.tau, theta: first.theta }, sopdt };
}

/** The half-rule FOPDT model of a plant (see halfRule), or why it does not apply. */
export function halfRuleFopdt(plant: Plant): { ok: true; model: FopdtModel } | { ok: false; reason: string } {
  const fit = halfRule(plant);
  return fit.ok ? { ok: true, model: fit.fopdt } : fit;
}

/** The half-rule SOPDT model of a plant (see halfRule), or why it does not apply. */
export function halfRuleSopdt(plant: Plant): { ok: true; model: SopdtModel } | { ok: false; reason: string } {
  const fit = halfRule(plant);
  return fit.ok ? { ok: true, model: fit.sopdt } : fit;
}

/** τ = τ1 + τ2/2, θ = θ0 + τ2/2 + Σ_{i≥3} τi over lags sorted descending. */
function fopdtFromLags(lags: readonly number[], theta0: number): { tau: number; theta: number } {
  const sorted = [...lags].sort((a, b) => b - a);
  const tau2 = sorted[1] ?? 0;
  let rest = 0;
  for (let i = 2; i < sorted.length; i++) rest += sorted[i];
  return { tau: (sorted[0] ?? 0) + tau2 / 2, theta: theta0 + tau2 / 2 + rest };
}

/**
 * Roots with every conjugate-symmetric cluster (single linkage, ROOT_CLUSTER_TOLERANCE) replaced by
 * as many real roots at the cluster's mean; other roots unchanged.
 */
function mergeRootClusters(roots: readonly Complex[]): Complex[] {
  const n = roots.length;
  const group = Array.from({ length: n }, (_, i) => i);
  const find = (i: number): number => (group[i] === i ? i : (group[i] = find(group[i])));
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const scale = Math.max(Math.hypot(roots[i].re, roots[i].im), Math.hypot(roots[j].re, roots[j].im));
      if (Math.hypot(roots[i].re - roots[j].re, roots[i].im - roots[j].im) <= ROOT_CLUSTER_TOLERANCE * scale) group[find(i)] = find(j);
    }
  }
  const members = new Map<number, number[]>();
  for (let i = 0; i < n; i++) members.set(find(i), [...(members.get(find(i)) ?? []), i]);
  const out = roots.map((r) => ({ re: r.re, im: r.im }));
  for (const list of members.values()) {
    if (list.length < 2) continue;
    let re = 0;
    let im = 0;
    for (const i of list) {
      re += roots[i].re;
      im += roots[i].im;
    }
    re /= list.length;
    im /= list.length;
    if (Math.abs(im) > REAL_ROOT_TOLERANCE * Math.hypot(re, im)) continue;
    for (const i of list) out[i] = { re, im: 0 };
  }
  return out;
}
