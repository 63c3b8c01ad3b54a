import { assertFiniteCoefficients, trimLeadingZeros } from "../linear-algebra/polynomial-trim.js";
import type { TransferFunctionPlant } from "./transfer-function.js";

/** A transfer function checked and cleaned: leading zeros dropped, den monic (den[0] = 1). */
export interface NormalizedTransferFunction {
  /** Numerator, descending powers, divided by the leading denominator coefficient. */
  num: number[];
  /** Monic denominator, descending powers. */
  den: number[];
  /** Dead time θ [s]. */
  delay: number;
}

/**
 * Checks a transfer-function plant and returns it with leading zeros removed and both
 * polynomials divided by the leading denominator coefficient, so den is monic:
 *
 *   G(s) = (num(s)/den₀) / (den(s)/den₀) · e^(−θ s).
 *
 * Throws a RangeError naming `plant.num`, `plant.den` or `plant.delay` for non-finite
 * coefficients, an all-zero polynomial, an improper plant (deg num > deg den) or a negative
 * or non-finite dead time.
 */
export function normalizeTransferFunction(plant: TransferFunctionPlant): NormalizedTransferFunction {
  if (plant === null || typeof plant !== "object" || plant.kind !== "transfer-function") {
    throw new TypeError('plant must be a transfer-function plant ({ kind: "transfer-function", num, den, delay })');
  }
  assertFiniteCoefficients(plant.num, "plant.num");
  assertFiniteCoefficients(plant.den, "plant.den");
  const num = trimLeadingZeros(plant.num);
  const den = trimLeadingZeros(plant.den);
  if (den.length === 0) throw new RangeError("plant.den: the denominator must not be all zeros");
  if (num.length === 0) throw new RangeError("plant.num: the numerator must not be all zeros");
  if (num.length > den.length) {
    throw new RangeError(
      `plant.num: the plant must be proper, numerator degree ${num.length - 1} exceeds denominator degree ${den.length - 1}`,
    );
  }
  const delay = plant.delay ?? 0;
  if (typeof delay !== "number" || !Number.isFinite(delay) || delay < 0) {
    throw new RangeError(`plant.delay: the dead time must be a finite number ≥ 0 s, got ${String(delay)}`);
  }
  const lead = den[0];
  return { num: num.map((v) => v / lead), den: den.map((v) => v / lead), delay };
}
