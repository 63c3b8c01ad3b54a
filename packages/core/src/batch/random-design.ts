import { DEFAULT_MAX_CANDIDATES } from "./grid-design.js";
import { assertValidSpace, axisValue, type ParameterSpace } from "./parameter-space.js";
import { createSeededRandom } from "./seeded-random.js";

/**
 * `count` candidates drawn independently and uniformly over a parameter space (uniform in
 * log(value) on a log axis), from createSeededRandom(seed): candidate by candidate, axis by axis,
 * w_ij = U_ij, v_ij = axisValue(space[j], w_ij). Reproducible per seed. Returns count × d row-major.
 *
 * Throws a RangeError naming the bad axis, `count` (whole number 1…maxCandidates) or `seed`.
 * Reference: common practice (simple random sampling, the baseline of McKay, Beckman & Conover 1979).
 */
export function seededRandomDesign(space: ParameterSpace, count: number, seed: number, maxCandidates = DEFAULT_MAX_CANDIDATES): Float64Array {
  assertValidSpace(space);
  if (!Number.isInteger(count) || count < 1 || count > maxCandidates) {
    throw new RangeError(`count must be a whole number from 1 to ${maxCandidates}, got ${String(count)}`);
  }
  const random = createSeededRandom(seed);
  const d = space.length;
  const out = new Float64Array(count * d);
  for (let i = 0; i < count; i++) {
    for (let j = 0; j < d; j++) out[i * d + j] = axisValue(space[j], random());
  }
  return out;
}
