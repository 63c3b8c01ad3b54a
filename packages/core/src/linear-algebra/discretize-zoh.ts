import { expm } from "./expm.js";
import type { DiscreteSisoStateSpace, SisoStateSpace } from "./siso-state-space.js";

/**
 * Exact zero-order-hold discretisation of x' = A x + B u over a step h, from one matrix
 * exponential of the augmented matrix
 *
 *   exp( ⎡A  B⎤ h ) = ⎡Φ  Γ⎤ ,   Φ = e^(A h),   Γ = ∫₀ʰ e^(A τ) dτ B,
 *        ( ⎣0  0⎦   )   ⎣0  1⎦
 *
 * exact for inputs held constant over each step.
 *
 * system: continuous SisoStateSpace; h: step [s], > 0 and finite.
 *
 * References: C. F. Van Loan, "Computing integrals involving the matrix exponential",
 * IEEE Trans. Automatic Control 23(3), 395–404, 1978; K. J. Åström and B. Wittenmark,
 * Computer-Controlled Systems, 3rd ed., Prentice Hall, 1997, §2.3.
 */
export function discretizeZoh(system: SisoStateSpace, h: number): DiscreteSisoStateSpace {
  if (!(h > 0) || !Number.isFinite(h)) throw new RangeError(`h must be a finite step > 0 s, got ${h}`);
  const { n } = system;
  const m = n + 1;
  const augmented = new Float64Array(m * m);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) augmented[i * m + j] = system.a[i * n + j] * h;
    augmented[i * m + n] = system.b[i] * h;
  }
  const e = expm(augmented, m);
  const phi = new Float64Array(n * n);
  const gamma = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) phi[i * n + j] = e[i * m + j];
    gamma[i] = e[i * m + n];
  }
  return { n, phi, gamma, c: Float64Array.from(system.c), d: system.d, h };
}
