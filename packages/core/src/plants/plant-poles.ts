import type { Complex } from "../linear-algebra/complex.js";
import { polynomialRoots } from "../linear-algebra/polynomial-roots.js";
import { normalizeTransferFunction } from "./normalize-transfer-function.js";
import type { Plant } from "./plant.js";

/**
 * Poles of a plant: the roots of its denominator den(s) (the dead time e^(−θs) adds none).
 * Sorted by real part, then imaginary part, ascending. Common factors of num and den are not
 * cancelled, so a cancelled pole is still reported.
 */
export function plantPoles(plant: Plant): Complex[] {
  const { den } = normalizeTransferFunction(plant);
  return polynomialRoots(den);
}
