import { expm } from "./expm.js";

/**
 * Exact zero-order-hold discretisation of x' = A x + B w with m inputs over a step h
 * (Van Loan 1978, as discretizeZoh):
 *
 *   exp([A B; 0 0]·h) = [Φ Γ; 0 I],   Φ = e^(A h),   Γ = ∫₀ʰ e^(A τ) dτ B.
 *
 * a: n×n row-major; b: n×m row-major; h > 0. Returns phi (n×n) and gamma (n×m), row-major.
 * Reference: C. F. Van Loan, IEEE Trans. Automatic Control 23(3), 395–404, 1978.
 */
export function discretizeZohInputs(a: Float64Array, b: Float64Array, n: number, m: number, h: number): { phi: Float64Array; gamma: Float64Array } {
  if (!(h > 0) || !Number.isFinite(h)) throw new RangeError(`h must be a finite step > 0 s, got ${h}`);
  const size = n + m;
  const augmented = new Float64Array(size * size);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) augmented[i * size + j] = a[i * n + j] * h;
    for (let j = 0; j < m; j++) augmented[i * size + n + j] = b[i * m + j] * h;
  }
  const e = expm(augmented, size);
  const phi = new Float64Array(n * n);
  const gamma = new Float64Array(n * m);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) phi[i * n + j] = e[i * size + j];
    for (let j = 0; j < m; j++) gamma[i * m + j] = e[i * size + n + j];
  }
  return { phi, gamma };
}
