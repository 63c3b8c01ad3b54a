import { DEFAULT_MAX_CANDIDATES } from "./grid-design.js";
import { assertValidSpace, axisValue, type ParameterSpace } from "./parameter-space.js";
import { createSeededRandom } from "./seeded-random.js";

/**
 * A Latin hypercube sample of n points in the unit cube [0, 1)^d: each axis is cut into n equal
 * strata [k/n, (k+1)/n), and each stratum of each axis holds exactly one point. For each axis j
 * independently, a uniformly random permutation π_j of 0…n−1 (Fisher–Yates) assigns strata, and
 * the point sits uniformly at random inside its stratum:
 *
 *   w_ij = (π_j(i) + U_ij) / n,   U_ij ~ U[0, 1).
 *
 * Returns n × d row-major. random: a generator of uniform numbers in [0, 1) (createSeededRandom);
 * draws are taken axis by axis — first the permutation, then the n offsets — so a given generator
 * state always yields the same design.
 *
 * References: M. D. McKay, R. J. Beckman and W. J. Conover, "A comparison of three methods for
 * selecting values of input variables in the analysis of output from a computer code",
 * Technometrics 21(2), 239–245, 1979; R. A. Fisher and F. Yates, Statistical Tables, 1938
 * (the shuffle, in Durstenfeld's in-place form, CACM 7(7), 1964).
 */
export function latinHypercubeUnit(n: number, d: number, random: () => number): Float64Array {
  if (!Number.isInteger(n) || n < 1) throw new RangeError(`count must be a whole number ≥ 1, got ${String(n)}`);
  if (!Number.isInteger(d) || d < 1) throw new RangeError(`d must be a whole number ≥ 1, got ${String(d)}`);
  const out = new Float64Array(n * d);
  const perm = new Int32Array(n);
  for (let j = 0; j < d; j++) {
    for (let i = 0; i < n; i++) perm[i] = i;
    for (let i = n - 1; i > 0; i--) {
      const k = Math.floor(random() * (i + 1));
      const tmp = perm[i];
      perm[i] = perm[k];
      perm[k] = tmp;
    }
    for (let i = 0; i < n; i++) out[i * d + j] = (perm[i] + random()) / n;
  }
  return out;
}

/**
 * A Latin hypercube design of `count` candidates over a parameter space (see latinHypercubeUnit),
 * each unit coordinate mapped to its axis by axisValue (so on a log axis the strata are equal in
 * log(value)). Reproducible: the same space, count and seed give the same candidates, n × d
 * row-major in the space's axis order.
 *
 * Throws a RangeError naming the bad axis, `count` (whole number 1…maxCandidates) or `seed`.
 */
export function latinHypercube(space: ParameterSpace, count: number, seed: number, maxCandidates = DEFAULT_MAX_CANDIDATES): Float64Array {
  assertValidSpace(space);
  if (!Number.isInteger(count) || count < 1 || count > maxCandidates) {
    throw new RangeError(`count must be a whole number from 1 to ${maxCandidates}, got ${String(count)}`);
  }
  const d = space.length;
  const out = latinHypercubeUnit(count, d, createSeededRandom(seed));
  for (let i = 0; i < count; i++) {
    for (let j = 0; j < d; j++) out[i * d + j] = axisValue(space[j], out[i * d + j]);
  }
  return out;
}
