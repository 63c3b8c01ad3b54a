import { polynomialAdd } from "../linear-algebra/polynomial-add.js";
import { polynomialMultiply } from "../linear-algebra/polynomial-multiply.js";
import { trimLeadingZeros } from "../linear-algebra/polynomial-trim.js";
import { pidTransferFunction } from "../controllers/pid-transfer-function.js";
import type { PidController } from "../controllers/pid.js";
import { normalizeTransferFunction } from "../plants/normalize-transfer-function.js";
import type { Plant } from "../plants/plant.js";

/**
 * Characteristic polynomial of the unity-feedback loop of plant G = num_p/den_p and PID
 * C = num_c/den_c (see pidTransferFunction), with the dead time ignored:
 *
 *   χ(s) = den_p(s)·den_c(s) + num_p(s)·num_c(s),
 *
 * whose roots are the closed-loop poles (1 + G·C = χ/(den_p·den_c)). den_p is normalised to be
 * monic. The degree drops below deg den_p + deg den_c exactly when the loop is ill-posed
 * (1 + D_c·D_p = 0). Descending powers of s, leading zeros removed.
 *
 * Reference: K. J. Åström and R. M. Murray, Feedback Systems, Princeton University Press, 2008,
 * §11.1 (closed-loop characteristic polynomial of a feedback loop).
 */
export function closedLoopCharacteristicPolynomial(plant: Plant, controller: PidController): number[] {
  const { num, den } = normalizeTransferFunction(plant);
  return characteristicPolynomial(num, den, controller);
}

/** χ for a rational plant given by coefficients (used with a Padé-approximated dead time too). */
export function characteristicPolynomial(numP: readonly number[], denP: readonly number[], controller: PidController): number[] {
  const c = pidTransferFunction(controller);
  return trimLeadingZeros(polynomialAdd(polynomialMultiply(denP, c.den), polynomialMultiply(numP, c.num)));
}
