import { assertFiniteCoefficients, trimLeadingZeros } from "../linear-algebra/polynomial-trim.js";

/**
 * Relative cancellation below which a computed Routh entry counts as zero. An entry is formed as
 * b − μ·d (see routhHurwitz); it is set to 0 when |b − μ·d| ≤ ROUTH_ZERO_TOLERANCE·(|b| + |μ·d|),
 * i.e. when the subtraction cancelled all but the last few digits that rounding can produce.
 * Such a zero means a root pair that sums to (nearly) zero — on or near the imaginary axis — so a
 * nearly-marginal polynomial is called not stable, in line with STABILITY_TOLERANCE for poles.
 */
export const ROUTH_ZERO_TOLERANCE = 1e-10;

/**
 * Size of the ε that replaces a zero first-column entry, relative to the largest magnitude in that
 * row and the row above it. It must be small against every other entry for the signs to be those of
 * the limit ε → 0⁺, yet large enough that the terms of order 1/ε it creates in the next row do not
 * swamp the order-1 terms beyond double precision (1e-8 keeps about 8 digits of both).
 */
export const ROUTH_EPSILON = 1e-8;

/** Which special case of the Routh array occurred (a zero row takes precedence when both did). */
export type RouthSpecialCase = "none" | "zero-pivot" | "zero-row";

/** Result of routhHurwitz. */
export interface RouthHurwitzResult {
  /** True when every root lies in the open left half-plane. */
  stable: boolean;
  /** Number of sign changes in the first column = number of roots with positive real part. */
  rhpRoots: number;
  /** True when some roots lie on the imaginary axis (including s = 0). */
  imaginaryAxisRoots: boolean;
  /** The Routh array after the special-case substitutions; row i belongs to s^(n−i). */
  table: number[][];
  special: RouthSpecialCase;
}

/**
 * Routh–Hurwitz test of the real polynomial p(s) = a₀sⁿ + a₁sⁿ⁻¹ + … + aₙ (descending powers).
 *
 * The Routh array has rows r₀ = [a₀, a₂, a₄, …], r₁ = [a₁, a₃, a₅, …] and, for i ≥ 2,
 *
 *   r_i[j] = r_{i−2}[j+1] − μ_i·r_{i−1}[j+1],   μ_i = r_{i−2}[0] / r_{i−1}[0]
 *
 * (the usual (r_{i−1}[0]·r_{i−2}[j+1] − r_{i−2}[0]·r_{i−1}[j+1]) / r_{i−1}[0]), missing entries
 * read as 0. Row i belongs to s^(n−i) and has ⌊(n−i)/2⌋ + 1 entries. The number of sign changes
 * down the first column equals the number of roots in the open right half-plane; all roots are in
 * the open left half-plane iff the first column has no zero and no sign change.
 *
 * Special cases (Ogata 2010 §5-6):
 * - zero pivot — a row whose first entry is 0 but which is not all zero: the 0 is replaced by
 *   ε = ROUTH_EPSILON·(largest magnitude in this row and the row above), counted as positive, and
 *   the array continued. The sign pattern is the one of the limit ε → 0⁺. Limits of the ε rule: the
 *   count is exact only if no root lies on the imaginary axis; with imaginary-axis roots that do
 *   not produce a zero row the count can be wrong. A Hurwitz polynomial never has a zero pivot, so
 *   `stable` is false in this case whatever the count.
 * - zero row — a whole row r_i is 0: the row above gives the auxiliary polynomial
 *   A(s) = Σ_k r_{i−1}[k]·s^(m−2k), m = n − i + 1, a factor of p whose roots are symmetric about
 *   the origin; r_i is replaced by the coefficients of dA/ds, r_i[k] = (m − 2k)·r_{i−1}[k], and the
 *   array continued. The rows from r_{i−1} down form the array of A, so with q sign changes in them
 *   A has q right-half-plane roots, q mirror images and m − 2q roots on the imaginary axis
 *   (`imaginaryAxisRoots` when m − 2q > 0). A polynomial with a zero row is never stable.
 *   A root at s = 0 (aₙ = 0) shows up as a zero last row with A(s) = c·s and is handled the same way.
 *
 * Leading zero coefficients are dropped. Degree 0 (a non-zero constant) has no roots: stable.
 * Necessary condition (Stodola): a polynomial with a zero coefficient or coefficients of both signs
 * is not stable — `stable` is then false at once, and the array is still built for the count.
 * An overall sign does not matter (−p has the roots of p).
 *
 * coeffs: finite coefficients, descending powers, not all zero. Throws a RangeError naming
 * `coeffs` otherwise.
 *
 * References: E. J. Routh, A Treatise on the Stability of a Given State of Motion, Macmillan, 1877;
 * A. Hurwitz, "Ueber die Bedingungen, unter welchen eine Gleichung nur Wurzeln mit negativen reellen
 * Theilen besitzt", Mathematische Annalen 46, 273–284, 1895; K. Ogata, Modern Control Engineering,
 * 5th ed., Prentice Hall, 2010, §5-6; R. C. Dorf and R. H. Bishop, Modern Control Systems, 12th ed.,
 * Prentice Hall, 2011, §6.2.
 */
export function routhHurwitz(coeffs: readonly number[]): RouthHurwitzResult {
  assertFiniteCoefficients(coeffs, "coeffs");
  const p = trimLeadingZeros(coeffs);
  if (p.length === 0) throw new RangeError("coeffs: the zero polynomial has no roots to locate");
  const n = p.length - 1;

  const table: number[][] = [];
  for (let i = 0; i <= n; i++) table.push(new Array<number>(Math.floor((n - i) / 2) + 1).fill(0));
  for (let k = 0; k <= n; k++) table[k % 2][k >> 1] = p[k];

  let zeroPivot = false;
  let auxiliaryRow = -1; // row holding the first auxiliary polynomial
  for (let i = 1; i <= n; i++) {
    const row = table[i];
    if (i >= 2) {
      const above = table[i - 1];
      const twoAbove = table[i - 2];
      const mu = twoAbove[0] / above[0];
      for (let j = 0; j < row.length; j++) {
        const b = twoAbove[j + 1] ?? 0;
        const d = mu * (above[j + 1] ?? 0);
        const v = b - d;
        row[j] = Math.abs(v) <= ROUTH_ZERO_TOLERANCE * (Math.abs(b) + Math.abs(d)) ? 0 : v;
      }
    }
    if (!row.some((v) => v !== 0)) {
      const above = table[i - 1];
      const m = n - i + 1;
      for (let k = 0; k < row.length; k++) row[k] = (m - 2 * k) * above[k];
      if (auxiliaryRow < 0) auxiliaryRow = i - 1;
    } else if (row[0] === 0) {
      let scale = 0;
      for (const v of row) scale = Math.max(scale, Math.abs(v));
      for (const v of table[i - 1]) scale = Math.max(scale, Math.abs(v));
      row[0] = ROUTH_EPSILON * scale;
      zeroPivot = true;
    }
  }

  const rhpRoots = signChanges(table, 0);
  let imaginaryAxisRoots = false;
  if (auxiliaryRow >= 0) {
    const m = n - auxiliaryRow;
    imaginaryAxisRoots = m - 2 * signChanges(table, auxiliaryRow) > 0;
  }
  const special: RouthSpecialCase = auxiliaryRow >= 0 ? "zero-row" : zeroPivot ? "zero-pivot" : "none";
  const stable = special === "none" && rhpRoots === 0 && hasStrictlyOneSign(p);
  return { stable, rhpRoots, imaginaryAxisRoots, table, special };
}

/** Sign changes down the first column from row `from` to the last row. */
function signChanges(table: readonly number[][], from: number): number {
  let changes = 0;
  for (let i = from + 1; i < table.length; i++) {
    if (table[i][0] > 0 !== table[i - 1][0] > 0) changes++;
  }
  return changes;
}

/** True when every coefficient is non-zero and all share one sign. */
function hasStrictlyOneSign(p: readonly number[]): boolean {
  const positive = p[0] > 0;
  for (const c of p) if (c === 0 || c > 0 !== positive) return false;
  return true;
}
