import type { Plant } from "./plant.js";
import { plantPoles } from "./plant-poles.js";

/** Time constants to show after the slowest stable pole: e^(−5) < 1 %, the usual settling band. */
const SETTLING_TIME_CONSTANTS = 5;
/** Horizon [s] used when the plant has no pole to take a time scale from. */
const FALLBACK_HORIZON = 10;
/** Mantissas of the "nice" horizons: 1, 1.5, 2, 2.5, 3, 4, 5, 6, 8 × 10^k. */
const NICE_STEPS = [1, 1.5, 2, 2.5, 3, 4, 5, 6, 8, 10];

/**
 * A sensible plot or simulation horizon [s] for a plant:
 *
 *   T = θ + 5 · max_i 1/|Re pᵢ|   over the poles with Re pᵢ < 0,
 *
 * rounded up to 1, 1.5, 2, 2.5, 3, 4, 5, 6 or 8 × 10^k. Poles on or right of the imaginary axis have no decay
 * time; when there are only such poles, their magnitudes give the time scale (5 · max 1/|pᵢ|
 * over pᵢ ≠ 0), and 10 s + θ when every pole is at 0 or there is none.
 * Five time constants cover the usual 1 % settling band (e^(−5) ≈ 0.7 %): common practice.
 */
export function suggestHorizon(plant: Plant): number {
  const delay = plant.kind === "transfer-function" || plant.kind === "identified" ? plant.delay ?? 0 : 0;
  const poles = plantPoles(plant);
  let slowest = 0;
  for (const p of poles) if (p.re < 0) slowest = Math.max(slowest, 1 / -p.re);
  if (slowest === 0) {
    for (const p of poles) {
      const magnitude = Math.hypot(p.re, p.im);
      if (magnitude > 0) slowest = Math.max(slowest, 1 / magnitude);
    }
  }
  const raw = slowest > 0 ? delay + SETTLING_TIME_CONSTANTS * slowest : delay + FALLBACK_HORIZON;
  return niceCeil(raw);
}

function niceCeil(x: number): number {
  const decade = 10 ** Math.floor(Math.log10(x));
  for (const m of NICE_STEPS) {
    const candidate = m * decade;
    if (candidate >= x * (1 - 1e-12)) return Number(candidate.toPrecision(12));
  }
  return 10 * decade;
}
