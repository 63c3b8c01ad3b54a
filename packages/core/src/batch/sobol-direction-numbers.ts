/**
 * Direction numbers of the Sobol sequence for dimensions 2…32 (dimension 1 is the van der Corput
 * sequence in base 2, m_k = 1 for all k, and needs no entry), from the table "new-joe-kuo-6.21201"
 * of S. Joe and F. Y. Kuo, "Constructing Sobol sequences with better two-dimensional projections",
 * SIAM J. Sci. Comput. 30(5), 2635–2654, 2008 (https://web.maths.unsw.edu.au/~fkuo/sobol/).
 *
 * Written from memory of that published file, not copied from it. The tests check what makes the
 * table valid whatever its provenance: every polynomial is primitive over GF(2) and the 31
 * polynomials are distinct, every initial m_k is odd and < 2^k, and the resulting points have the
 * net and stratification properties of a Sobol sequence.
 *
 * Row notation as in the file: `s` is the degree of the primitive polynomial
 *   p(x) = x^s + a_1·x^(s−1) + … + a_(s−1)·x + 1,
 * `a` the integer whose binary digits (most significant first) are a_1 … a_(s−1), and `m` the s
 * initial direction integers m_1 … m_s (m_k odd, m_k < 2^k).
 */
export interface SobolDirectionRow {
  /** Degree s of the primitive polynomial. */
  s: number;
  /** Interior coefficients a_1 … a_(s−1) as an integer (most significant bit first). */
  a: number;
  /** Initial direction integers m_1 … m_s. */
  m: readonly number[];
}

/** Rows for dimensions 2, 3, …, 32 (index 0 is dimension 2). */
export const JOE_KUO_DIRECTION_ROWS: readonly SobolDirectionRow[] = [
  { s: 1, a: 0, m: [1] },
  { s: 2, a: 1, m: [1, 3] },
  { s: 3, a: 1, m: [1, 3, 1] },
  { s: 3, a: 2, m: [1, 1, 1] },
  { s: 4, a: 1, m: [1, 1, 3, 3] },
  { s: 4, a: 4, m: [1, 3, 5, 13] },
  { s: 5, a: 2, m: [1, 1, 5, 5, 17] },
  { s: 5, a: 4, m: [1, 1, 5, 5, 5] },
  { s: 5, a: 7, m: [1, 1, 7, 11, 19] },
  { s: 5, a: 11, m: [1, 1, 5, 1, 1] },
  { s: 5, a: 13, m: [1, 1, 1, 3, 11] },
  { s: 5, a: 14, m: [1, 3, 5, 5, 31] },
  { s: 6, a: 1, m: [1, 3, 3, 9, 7, 49] },
  { s: 6, a: 13, m: [1, 1, 1, 15, 21, 21] },
  { s: 6, a: 16, m: [1, 3, 1, 13, 27, 49] },
  { s: 6, a: 19, m: [1, 1, 1, 15, 7, 5] },
  { s: 6, a: 22, m: [1, 3, 1, 15, 13, 25] },
  { s: 6, a: 25, m: [1, 1, 5, 5, 19, 61] },
  { s: 7, a: 1, m: [1, 3, 7, 11, 23, 15, 103] },
  { s: 7, a: 4, m: [1, 3, 7, 13, 13, 15, 69] },
  { s: 7, a: 7, m: [1, 1, 3, 13, 7, 35, 63] },
  { s: 7, a: 8, m: [1, 3, 5, 9, 1, 25, 53] },
  { s: 7, a: 14, m: [1, 3, 1, 13, 9, 35, 107] },
  { s: 7, a: 19, m: [1, 3, 1, 5, 27, 61, 31] },
  { s: 7, a: 21, m: [1, 1, 5, 11, 19, 41, 61] },
  { s: 7, a: 28, m: [1, 3, 5, 3, 3, 13, 69] },
  { s: 7, a: 31, m: [1, 1, 7, 13, 1, 19, 1] },
  { s: 7, a: 32, m: [1, 3, 7, 5, 13, 19, 59] },
  { s: 7, a: 37, m: [1, 1, 3, 9, 25, 29, 41] },
  { s: 7, a: 41, m: [1, 3, 5, 13, 23, 1, 55] },
  { s: 7, a: 42, m: [1, 3, 7, 3, 13, 59, 17] },
];

/** Largest dimension sobolDesign supports: 1 + the rows above. */
export const SOBOL_MAX_DIMENSION = 1 + JOE_KUO_DIRECTION_ROWS.length;
