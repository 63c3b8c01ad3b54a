import { seededRandom } from "../support/seeded-random.js";

/** A synthetic step test: an input step of `du` at `stepTime` from u0, output y0 + response(t − stepTime), plus noise. */
export interface SyntheticStep {
  h: number;
  horizon: number;
  stepTime: number;
  u0: number;
  du: number;
  y0: number;
  /** Output deviation at time s after the step (0 for s ≤ 0). */
  response: (s: number) => number;
  /** Standard deviation of white Gaussian output noise. */
  sd?: number;
  seed?: number;
}

/** Standard normal deviates by Box–Muller (G. E. P. Box and M. E. Muller, 1958) from seeded uniforms. */
export function normals(seed: number, count: number): Float64Array {
  const uniform = seededRandom(seed);
  const out = new Float64Array(count);
  for (let k = 0; k < count; k++) out[k] = Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
  return out;
}

/** The step test as CSV text with the header "time,power,temperature". */
export function stepCsv(s: SyntheticStep, delimiter = ","): string {
  const n = Math.round(s.horizon / s.h) + 1;
  const noise = normals(s.seed ?? 1, n);
  const lines = [["time", "power", "temperature"].join(delimiter)];
  for (let k = 0; k < n; k++) {
    const t = k * s.h;
    const u = t >= s.stepTime - 1e-12 ? s.u0 + s.du : s.u0;
    const y = s.y0 + s.response(t - s.stepTime) + (s.sd ?? 0) * noise[k];
    lines.push([t, u, y].map((v) => String(v)).join(delimiter));
  }
  return `${lines.join("\n")}\n`;
}
