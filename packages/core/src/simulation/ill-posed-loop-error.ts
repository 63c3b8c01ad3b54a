/**
 * Thrown when a loop has no solution at t = 0⁺ because the algebraic loop through the plant's
 * and the controller's direct feedthroughs is singular: 1 + D_c·D_p = 0 (the closed-loop
 * transfer function is then improper).
 */
export class IllPosedLoopError extends Error {
  override readonly name = "IllPosedLoopError";
  constructor(
    /** Controller feedthrough D_c = kp + kd/tf. */
    readonly controllerFeedthrough: number,
    /** Plant feedthrough D_p = lim_{s→∞} G(s). */
    readonly plantFeedthrough: number,
  ) {
    super(
      `the loop is ill-posed: 1 + Dc·Dp = 0 with controller feedthrough ${controllerFeedthrough} and plant feedthrough ${plantFeedthrough}`,
    );
  }
}

/** Relative size below which 1 + D_c·D_p counts as zero. */
export const WELL_POSEDNESS_TOLERANCE = 1e-12;

/** True when 1 + D_c·D_p is clearly non-zero, so u(0⁺) = D_c/(1 + D_c·D_p) exists. */
export function isWellPosedLoop(controllerFeedthrough: number, plantFeedthrough: number): boolean {
  const product = controllerFeedthrough * plantFeedthrough;
  return Math.abs(1 + product) > WELL_POSEDNESS_TOLERANCE * Math.max(1, Math.abs(product));
}
