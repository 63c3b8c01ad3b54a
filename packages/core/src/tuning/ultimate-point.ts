import type { Complex } from "../linear-algebra/complex.js";
import type { Plant } from "../plants/plant.js";
import { plantFactors } from "./plant-factors.js";

/** The ultimate (critical) point of a plant: where its phase first reaches −180°. */
export interface UltimatePoint {
  /** Ultimate gain Ku = 1/|G(jω180)| (negative for a plant with negative static gain). */
  ku: number;
  /** Ultimate period Pu = 2π/ω180 [s]. */
  pu: number;
  /** Phase-crossover frequency ω180 [rad/s]. */
  omega180: number;
}

/** Grid points per decade of the crossover search (the phase is continuous; this only has to separate crossings). */
export const PHASE_SEARCH_POINTS_PER_DECADE = 60;
/** Decades searched below the slowest and above the fastest characteristic frequency of the plant. */
const SEARCH_MARGIN_DECADES = 4;
/** Bisection stops when the bracket is this small relative to ω. */
const BISECTION_RELATIVE_TOLERANCE = 1e-14;

/**
 * The ultimate gain and period from the plant's frequency response G(jω)·e^(−jωθ):
 *
 *   arg G(jω180) = −π (first crossing from low frequency),   Ku = 1/|G(jω180)|,   Pu = 2π/ω180.
 *
 * The phase is unwrapped exactly as a sum over the factors of G = c·Π(s − zᵢ)/Π(s − pⱼ)·e^(−θs):
 *
 *   φ(ω) = Σᵢ atan2(ω − Im zᵢ, −Re zᵢ) − Σⱼ atan2(ω − Im pⱼ, −Re pⱼ) − ωθ,
 *
 * each term continuous in ω > 0 for roots off the imaginary axis, and referred to the low-frequency
 * phase of k/s^m (k > 0; m the number of poles at the origin), so φ(0⁺) = −m·π/2. A plant with
 * negative static gain is taken as −G and gets a negative Ku (the loop then needs negative gain).
 * φ(ω) + π is scanned on a logarithmic grid (PHASE_SEARCH_POINTS_PER_DECADE) from 10⁻⁴ below the
 * slowest to 10⁴ above the fastest of |roots| and 1/θ; the first sign change is refined by
 * bisection to relative width 1e-14.
 *
 * Returns `{ ok: false, reason }` when the phase never reaches −180° (e.g. a delay-free plant of
 * relative degree ≤ 2 with stable zeros), for a plant with a pole in the open right half plane or on
 * the imaginary axis away from the origin (the ultimate-gain experiment needs a loop that is
 * stable at low gain), and for a plant with no finite non-zero low-frequency gain.
 * Throws a RangeError naming the field of a malformed plant.
 *
 * Reference: J. G. Ziegler and N. B. Nichols, "Optimum settings for automatic controllers",
 * Trans. ASME 64 (1942) 759–768 (the ultimate sensitivity and period); K. J. Åström and
 * T. Hägglund, Advanced PID Control, ISA, 2006, §2.7 (the ultimate point from the frequency
 * response — section number from memory).
 */
export function ultimatePoint(plant: Plant): { ok: true; point: UltimatePoint } | { ok: false; reason: string } {
  const f = plantFactors(plant);
  const scale = (r: Complex) => Math.hypot(r.re, r.im);
  if (f.poles.some((p) => p.re > 0)) return { ok: false, reason: "the plant is unstable; the ultimate point needs a loop that is stable at small gain" };
  if (f.poles.some((p) => p.re === 0 && p.im !== 0)) return { ok: false, reason: "the plant has poles on the imaginary axis; no ultimate point" };
  if (f.zeros.some((z) => scale(z) === 0)) return { ok: false, reason: "the plant has a zero at the origin; no ultimate point" };
  if (f.leading === 0) return { ok: false, reason: "the plant is zero" };
  const integrators = f.poles.filter((p) => scale(p) === 0).length;
  const sign = lowFrequencySign(f.leading, f.zeros, f.poles);

  const rawPhase = (w: number): number => {
    let phi = 0;
    for (const z of f.zeros) phi += Math.atan2(w - z.im, -z.re);
    for (const p of f.poles) phi -= p.re === 0 && p.im === 0 ? Math.PI / 2 : Math.atan2(w - p.im, -p.re);
    return phi - w * f.delay;
  };
  // φ(0⁺) of the factors (origin poles counted as −π/2 already), shifted to −m·π/2.
  const offset = -integrators * (Math.PI / 2) - rawPhase(0);
  const gap = (w: number) => rawPhase(w) + offset + Math.PI;

  const magnitudes = [...f.zeros, ...f.poles].map(scale).filter((m) => m > 0);
  if (f.delay > 0) magnitudes.push(1 / f.delay);
  if (magnitudes.length === 0) magnitudes.push(1);
  const low = Math.log10(Math.min(...magnitudes)) - SEARCH_MARGIN_DECADES;
  const high = Math.log10(Math.max(...magnitudes)) + SEARCH_MARGIN_DECADES;
  const steps = Math.ceil((high - low) * PHASE_SEARCH_POINTS_PER_DECADE);
  let wPrev = 10 ** low;
  let gPrev = gap(wPrev);
  if (gPrev <= 0) return { ok: false, reason: "the plant's phase is at or below −180° already at low frequency; no ultimate point" };
  for (let i = 1; i <= steps; i++) {
    const w = 10 ** (low + ((high - low) * i) / steps);
    const g = gap(w);
    if (g <= 0) {
      const omega180 = bisect(gap, wPrev, w);
      const magnitude = Math.abs(f.leading) * product(f.zeros, omega180) / product(f.poles, omega180);
      return { ok: true, point: { ku: sign / magnitude, pu: (2 * Math.PI) / omega180, omega180 } };
    }
    wPrev = w;
    gPrev = g;
  }
  return { ok: false, reason: "the plant's phase never reaches −180°; no ultimate point (the loop stays stable at any gain)" };
}

/** Π|jω − rᵢ|. */
function product(roots: readonly Complex[], w: number): number {
  let m = 1;
  for (const r of roots) m *= Math.hypot(r.re, w - r.im);
  return m;
}

/** Sign of the low-frequency gain c·Π(−zᵢ)/Π(−pⱼ) over the roots away from the origin. */
function lowFrequencySign(leading: number, zeros: readonly Complex[], poles: readonly Complex[]): number {
  let sign = Math.sign(leading);
  // Conjugate pairs give |r|² > 0; real roots give −r.
  for (const z of zeros) if (z.im === 0 && z.re > 0) sign = -sign;
  for (const p of poles) if (p.im === 0 && p.re > 0) sign = -sign;
  return sign;
}

function bisect(g: (w: number) => number, a: number, b: number): number {
  let lo = a;
  let hi = b;
  while (hi - lo > BISECTION_RELATIVE_TOLERANCE * hi) {
    const mid = 0.5 * (lo + hi);
    if (mid <= lo || mid >= hi) break;
    if (g(mid) > 0) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}
