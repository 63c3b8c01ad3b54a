import { DEFAULT_MAX_CANDIDATES } from "./grid-design.js";
import { assertValidSpace, axisValue, type ParameterSpace } from "./parameter-space.js";
import { createSeededRandom } from "./seeded-random.js";
import { JOE_KUO_DIRECTION_ROWS, SOBOL_MAX_DIMENSION } from "./sobol-direction-numbers.js";

export { SOBOL_MAX_DIMENSION };

/** Bits of every Sobol coordinate: points are integers below 2^L scaled by 2^−L. */
export const SOBOL_BITS = 32;
/** Most points a 32-bit Sobol sequence holds before it repeats: 2^L. */
export const SOBOL_MAX_POINTS = 2 ** SOBOL_BITS;
const TWO_POW_L = 2 ** SOBOL_BITS;

/** Options of sobolDesign. */
export interface SobolOptions {
  /** Points of the sequence to leave out at its start (whole number ≥ 0, default 0). */
  skip?: number;
  /** A random digital shift drawn from createSeededRandom(seed); omitted: the plain sequence. */
  scramble?: { seed: number };
}

/**
 * Direction integers V_j,k = m_j,k · 2^(L−k), k = 1…L, of dimension j (0-based) of the Sobol
 * sequence, as unsigned 32-bit integers. Beyond the s initial m_k the recurrence of Sobol (1967)
 * in Bratley & Fox's bit form (1988, eq. 2) gives
 *
 *   V_k = a_1·V_(k−1) ⊕ a_2·V_(k−2) ⊕ … ⊕ a_(s−1)·V_(k−s+1) ⊕ V_(k−s) ⊕ (V_(k−s) ≫ s).
 *
 * Dimension 0 has m_k = 1 for every k (V_k = 2^(L−k)): the van der Corput sequence in base 2.
 */
export function sobolDirections(dimension: number): Uint32Array {
  if (!Number.isInteger(dimension) || dimension < 0 || dimension >= SOBOL_MAX_DIMENSION) {
    throw new RangeError(`dimension must be a whole number from 0 to ${SOBOL_MAX_DIMENSION - 1}, got ${String(dimension)}`);
  }
  const v = new Uint32Array(SOBOL_BITS + 1); // 1-based: v[k], k = 1…L
  if (dimension === 0) {
    for (let k = 1; k <= SOBOL_BITS; k++) v[k] = 2 ** (SOBOL_BITS - k);
    return v.subarray(1);
  }
  const { s, a, m } = JOE_KUO_DIRECTION_ROWS[dimension - 1];
  for (let k = 1; k <= Math.min(s, SOBOL_BITS); k++) v[k] = (m[k - 1] * 2 ** (SOBOL_BITS - k)) >>> 0;
  for (let k = s + 1; k <= SOBOL_BITS; k++) {
    let x = (v[k - s] ^ (v[k - s] >>> s)) >>> 0;
    for (let i = 1; i <= s - 1; i++) if ((a >>> (s - 1 - i)) & 1) x = (x ^ v[k - i]) >>> 0;
    v[k] = x;
  }
  return v.subarray(1);
}

/**
 * Points skip … skip+n−1 of the d-dimensional Sobol sequence in the unit cube [0, 1)^d, n × d
 * row-major. Point i is x_i = (X_i ⊕ S) · 2^−L with the integer X_i built in Gray-code order
 * (Antonov & Saleev 1979):
 *
 *   X_0 = 0,   X_i = X_(i−1) ⊕ V_c(i−1),   c(i−1) = 1 + (position of the lowest zero bit of i−1),
 *
 * so X_i = ⊕_k g_k·V_k with g = i ⊕ ⌊i/2⌋ the Gray code of i (how a skipped start is computed).
 * The Gray-code order visits, over every block of 2^m points starting at a multiple of 2^m, the
 * same set of points as Sobol's original order, so the net properties hold per block.
 *
 * S is 0 or, with `scramble`, a random digital shift: one uniform L-bit integer per dimension from
 * createSeededRandom(seed) (⌊U·2^32⌋, dimension by dimension), XOR-ed onto every point. A digital
 * shift keeps each (t, m, s)-net a (t, m, s)-net with the same t, and makes every point uniform on
 * [0, 1)^d (Owen 1995; Dick & Pillichshammer 2010, Lemma 4.26 — the shifted points' set property,
 * from memory), while the plain sequence starts with the point 0.
 *
 * References: I. M. Sobol', "On the distribution of points in a cube and the approximate
 * evaluation of integrals", USSR Comput. Math. Math. Phys. 7(4), 86–112, 1967; I. A. Antonov and
 * V. M. Saleev, USSR Comput. Math. Math. Phys. 19(1), 252–256, 1979; P. Bratley and B. L. Fox,
 * "Algorithm 659", ACM TOMS 14(1), 88–100, 1988; S. Joe and F. Y. Kuo, SIAM J. Sci. Comput. 30(5),
 * 2635–2654, 2008 (direction numbers); H. Niederreiter, Random Number Generation and Quasi-Monte
 * Carlo Methods, SIAM, 1992, ch. 4 (nets).
 */
export function sobolUnit(n: number, d: number, options: SobolOptions = {}): Float64Array {
  if (!Number.isInteger(n) || n < 1) throw new RangeError(`count must be a whole number ≥ 1, got ${String(n)}`);
  if (!Number.isInteger(d) || d < 1 || d > SOBOL_MAX_DIMENSION) {
    throw new RangeError(`d must be a whole number from 1 to ${SOBOL_MAX_DIMENSION} (the Sobol direction table), got ${String(d)}`);
  }
  const skip = options.skip ?? 0;
  if (!Number.isInteger(skip) || skip < 0) throw new RangeError(`skip must be a whole number ≥ 0, got ${String(skip)}`);
  if (skip + n > SOBOL_MAX_POINTS) throw new RangeError(`skip + count must not exceed 2^${SOBOL_BITS}, got ${skip + n}`);
  const shift = new Uint32Array(d);
  if (options.scramble !== undefined) {
    const seed = options.scramble?.seed;
    if (typeof seed !== "number" || !Number.isFinite(seed)) throw new RangeError(`scramble.seed must be a finite number, got ${String(seed)}`);
    const random = createSeededRandom(seed);
    for (let j = 0; j < d; j++) shift[j] = Math.floor(random() * TWO_POW_L) >>> 0;
  }
  const directions = Array.from({ length: d }, (_, j) => sobolDirections(j));
  // X_skip from the Gray code of skip.
  const x = new Uint32Array(d);
  const gray = grayCode(skip);
  for (let j = 0; j < d; j++) {
    let value = 0;
    for (let k = 0; k < SOBOL_BITS; k++) if (bitOf(gray, k)) value ^= directions[j][k];
    x[j] = value >>> 0;
  }
  const out = new Float64Array(n * d);
  for (let i = 0; i < n; i++) {
    if (i > 0) {
      const c = lowestZeroBit(skip + i - 1);
      for (let j = 0; j < d; j++) x[j] = (x[j] ^ directions[j][c]) >>> 0;
    }
    for (let j = 0; j < d; j++) out[i * d + j] = ((x[j] ^ shift[j]) >>> 0) / TWO_POW_L;
  }
  return out;
}

/**
 * A Sobol design of `count` candidates over a parameter space: sobolUnit(count, d, options) with
 * each unit coordinate mapped to its axis by axisValue (so on a log axis the points are spread
 * evenly in log(value)). Deterministic: the same space, count and options give the same bytes.
 * For the best balance take count (and skip) a power of two: every block of 2^m consecutive points
 * starting at a multiple of 2^m is stratified along each axis into 2^m equal bins.
 *
 * Throws a RangeError naming the bad axis, `count` (1…maxCandidates), `skip` or `scramble.seed`,
 * or `d` when the space has more axes than the direction table (SOBOL_MAX_DIMENSION).
 */
export function sobolDesign(space: ParameterSpace, count: number, options: SobolOptions = {}, maxCandidates = DEFAULT_MAX_CANDIDATES): Float64Array {
  assertValidSpace(space);
  if (!Number.isInteger(count) || count < 1 || count > maxCandidates) {
    throw new RangeError(`count must be a whole number from 1 to ${maxCandidates}, got ${String(count)}`);
  }
  const d = space.length;
  const out = sobolUnit(count, d, options);
  for (let i = 0; i < count; i++) {
    for (let j = 0; j < d; j++) out[i * d + j] = axisValue(space[j], out[i * d + j]);
  }
  return out;
}

/** Gray code g = i ⊕ ⌊i/2⌋ of a whole number below 2^32, as a number. */
function grayCode(i: number): number {
  return Number((BigInt(i) ^ (BigInt(i) >> 1n)) & 0xffffffffn);
}

function bitOf(value: number, k: number): boolean {
  return Math.floor(value / 2 ** k) % 2 === 1;
}

/** 0-based position of the lowest zero bit of a whole number i ≤ 2^32 − 2: the single set bit of ¬i ∧ (i + 1). */
function lowestZeroBit(i: number): number {
  return 31 - Math.clz32(~i & (i + 1));
}
