/**
 * Solves the dense system M x = rhs (n×n row-major) by Gaussian elimination with partial
 * pivoting. Returns null when M is singular to working precision (a pivot below 1e-14·‖M‖∞).
 * Reference: G. H. Golub and C. F. Van Loan, Matrix Computations, 4th ed., 2013, §3.4.
 */
export function solveLinear(m: Float64Array, rhs: Float64Array, n: number): Float64Array | null {
  const a = new Float64Array(m);
  const x = new Float64Array(rhs);
  let scale = 0;
  for (let i = 0; i < n; i++) {
    let row = 0;
    for (let j = 0; j < n; j++) row += Math.abs(a[i * n + j]);
    scale = Math.max(scale, row);
  }
  const tiny = 1e-14 * scale;
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let i = col + 1; i < n; i++) if (Math.abs(a[i * n + col]) > Math.abs(a[pivot * n + col])) pivot = i;
    if (!(Math.abs(a[pivot * n + col]) > tiny)) return null;
    if (pivot !== col) {
      for (let j = 0; j < n; j++) {
        const tmp = a[col * n + j];
        a[col * n + j] = a[pivot * n + j];
        a[pivot * n + j] = tmp;
      }
      const tmp = x[col];
      x[col] = x[pivot];
      x[pivot] = tmp;
    }
    for (let i = col + 1; i < n; i++) {
      const f = a[i * n + col] / a[col * n + col];
      if (f === 0) continue;
      for (let j = col; j < n; j++) a[i * n + j] -= f * a[col * n + j];
      x[i] -= f * x[col];
    }
  }
  for (let i = n - 1; i >= 0; i--) {
    let acc = x[i];
    for (let j = i + 1; j < n; j++) acc -= a[i * n + j] * x[j];
    x[i] = acc / a[i * n + i];
  }
  return x;
}
