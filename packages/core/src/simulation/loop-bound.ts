/** Factor of the divergence bound: a loop diverged when a signal exceeds 1e6 times its scale. */
export const DIVERGENCE_FACTOR = 1e6;

/**
 * The divergence bound of a simulation: 1e6·(1 + scale), scale = the largest magnitude among the
 * operating point (initial state, y0, u_op), the setpoint step and the load step. A state or
 * output beyond it, or not finite, ends the simulation with status "diverged" (common practice:
 * a loop that amplifies its inputs a millionfold has left any meaningful operating range).
 */
export function divergenceBound(...magnitudes: ArrayLike<number>[]): number {
  let scale = 0;
  for (const list of magnitudes) for (let i = 0; i < list.length; i++) scale = Math.max(scale, Math.abs(list[i]));
  return DIVERGENCE_FACTOR * (1 + scale);
}
