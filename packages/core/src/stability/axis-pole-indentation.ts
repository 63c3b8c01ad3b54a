import type { Complex } from "../linear-algebra/complex.js";
import { loopValueAt } from "./evaluate-loop.js";

/** Indentation radius around an imaginary-axis pole, as a fraction of its distance to the nearest
 *  other pole or zero of L (or of max(1, |ω_k|) when there is none). */
export const INDENT_FRACTION = 1e-3;
/** The radius is shrunk (÷10, at most INDENT_SHRINKS times) until |L| ≥ INDENT_MIN_GAIN on the
 *  indentation, so that no root of 1 + L can hide inside it. */
export const INDENT_MIN_GAIN = 10;
const INDENT_SHRINKS = 8;

/** Imaginary-axis poles of L at (about) one frequency. */
export interface AxisPoleCluster {
  /** Centre frequency ω_k [rad/s] (the pole sits at jω_k). */
  omega: number;
  /** Largest distance of a member from jω_k (rounding spread of a multiple pole). */
  spread: number;
  members: Complex[];
}

/**
 * Groups the poles found on the imaginary axis by frequency: a multiple pole comes out of the
 * companion matrix as a tight cluster (spread about eps^(1/m)), which is indented as one pole.
 * A cluster whose mean frequency is within axisTolerance of 0 is centred at s = 0.
 */
export function clusterAxisPoles(axisPoles: readonly Complex[], axisTolerance: number): AxisPoleCluster[] {
  const sorted = [...axisPoles].sort((a, b) => a.im - b.im);
  const clusters: AxisPoleCluster[] = [];
  for (const p of sorted) {
    const last = clusters[clusters.length - 1];
    if (last && Math.abs(p.im - last.members[last.members.length - 1].im) <= 1e-5 * Math.max(1, Math.abs(p.im))) {
      last.members.push(p);
    } else {
      clusters.push({ omega: 0, spread: 0, members: [p] });
    }
  }
  for (const c of clusters) {
    const mean = c.members.reduce((acc, p) => acc + p.im, 0) / c.members.length;
    c.omega = Math.abs(mean) <= axisTolerance ? 0 : mean;
    c.spread = Math.max(...c.members.map((p) => Math.hypot(p.re, p.im - c.omega)));
  }
  return clusters;
}

/**
 * Radius r of the semicircle s = jω_k + r·e^(jφ), φ ∈ [−π/2, π/2], by which the Nyquist contour
 * passes an imaginary-axis pole of L to its right: r = INDENT_FRACTION × the distance from jω_k to
 * the nearest other pole or zero of L (max(1, ω_k) when there is none), then divided by 10 (at most
 * INDENT_SHRINKS times, never below 100 × the cluster's spread) until |L| ≥ INDENT_MIN_GAIN at
 * φ = −π/2, 0, π/2. Near a pole of order m, L ≈ c/(s − jω_k)^m, so |L| only grows inside the
 * semicircle and 1 + L has no root there; the indented contour then counts exactly the closed-loop
 * poles in the open right half-plane.
 *
 * Reference: K. J. Åström and R. M. Murray, Feedback Systems, 2008, §9.2 (indentation of the
 * Nyquist contour around poles on the imaginary axis).
 */
export function indentationRadius(
  cluster: AxisPoleCluster,
  features: readonly Complex[],
  num: readonly number[],
  den: readonly number[],
  delay: number,
): number {
  let separation = Number.POSITIVE_INFINITY;
  for (const q of features) {
    const dist = Math.hypot(q.re, q.im - cluster.omega);
    if (dist > 100 * cluster.spread + 1e-300 && !cluster.members.includes(q)) separation = Math.min(separation, dist);
  }
  if (!Number.isFinite(separation)) separation = Math.max(1, cluster.omega);
  let radius = INDENT_FRACTION * separation;
  const floor = Math.max(100 * cluster.spread, 1e-12 * Math.max(1, cluster.omega));
  for (let shrink = 0; shrink < INDENT_SHRINKS && radius / 10 >= floor; shrink++) {
    let weakest = Number.POSITIVE_INFINITY;
    for (const phi of [-Math.PI / 2, 0, Math.PI / 2]) {
      const l = loopValueAt(num, den, delay, radius * Math.cos(phi), cluster.omega + radius * Math.sin(phi));
      weakest = Math.min(weakest, Math.hypot(l.re, l.im));
    }
    if (weakest >= INDENT_MIN_GAIN) break;
    radius /= 10;
  }
  return radius;
}
