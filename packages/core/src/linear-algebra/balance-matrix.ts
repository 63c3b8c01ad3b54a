/** Base of the floating-point radix: scaling by powers of it is exact (Parlett & Reinsch 1969). */
const RADIX = 2;
/** A sweep that reduces a row+column norm by less than this factor does not count as progress. */
const SIGNIFICANT_REDUCTION = 0.95;

/**
 * Balances a square matrix in place by a diagonal similarity D⁻¹AD with D made of powers of two,
 * so that each row and the matching column have comparable 1-norms. Eigenvalues are unchanged
 * (a similarity), but the eigenvalue routine meets less rounding error — this matters for
 * companion matrices, whose entries can span many orders of magnitude.
 *
 * a: n×n matrix, row-major, modified in place.
 *
 * References: B. N. Parlett and C. Reinsch, "Balancing a matrix for calculation of eigenvalues
 * and eigenvectors", Numerische Mathematik 13, 293–304, 1969 (procedure `balance`, without
 * the permutation step).
 */
export function balanceMatrix(a: Float64Array, n: number): void {
  if (a.length !== n * n) throw new RangeError(`a must hold n·n = ${n * n} entries, got ${a.length}`);
  const radixSquared = RADIX * RADIX;
  let converged = false;
  while (!converged) {
    converged = true;
    for (let i = 0; i < n; i++) {
      let c = 0;
      let r = 0;
      for (let j = 0; j < n; j++) {
        if (j === i) continue;
        c += Math.abs(a[j * n + i]);
        r += Math.abs(a[i * n + j]);
      }
      if (c === 0 || r === 0) continue;
      const s = c + r;
      let f = 1;
      let g = r / RADIX;
      while (c < g) {
        f *= RADIX;
        c *= radixSquared;
      }
      g = r * RADIX;
      while (c > g) {
        f /= RADIX;
        c /= radixSquared;
      }
      if ((c + r) / f < SIGNIFICANT_REDUCTION * s) {
        converged = false;
        const inv = 1 / f;
        for (let j = 0; j < n; j++) a[i * n + j] *= inv;
        for (let j = 0; j < n; j++) a[j * n + i] *= f;
      }
    }
  }
}
