import { polynomialAdd } from "../linear-algebra/polynomial-add.js";
import { polynomialMultiply } from "../linear-algebra/polynomial-multiply.js";
import { trimLeadingZeros } from "../linear-algebra/polynomial-trim.js";
import type { Controller } from "../controllers/controller.js";
import { controllerTransferFunction } from "../controllers/controller-transfer-function.js";
import type { LinearPlant } from "../plants/plant.js";
import { loopTransferFunction } from "./loop-transfer-function.js";

/**
 * Characteristic polynomial of the unity-feedback loop of a linear plant G = num_p/den_p and a
 * controller C = num_c/den_c (see controllerTransferFunction), with the dead time ignored:
 *
 *   χ(s) = den_p(s)·den_c(s) + num_p(s)·num_c(s),
 *
 * whose roots are the closed-loop poles (1 + G·C = χ/(den_p·den_c)). den_p is normalised to be
 * monic. The degree drops below deg den_p + deg den_c exactly when the loop is ill-posed
 * (1 + D_c·D_p = 0). Descending powers of s, leading zeros removed. In general χ = den_L + num_L
 * of the loop transfer function (loopTransferFunction), which also covers state feedback.
 *
 * Reference: K. J. Åström and R. M. Murray, Feedback Systems, Princeton University Press, 2008,
 * §11.1 (closed-loop characteristic polynomial of a feedback loop).
 */
export function closedLoopCharacteristicPolynomial(plant: LinearPlant, controller: Controller): number[] {
  const { num, den } = loopTransferFunction(plant, controller);
  return trimLeadingZeros(polynomialAdd(den, num));
}

/** χ for a rational plant given by coefficients (used with a Padé-approximated dead time too). */
export function characteristicPolynomial(numP: readonly number[], denP: readonly number[], controller: Controller): number[] {
  const c = controllerTransferFunction(controller);
  return trimLeadingZeros(polynomialAdd(polynomialMultiply(denP, c.den), polynomialMultiply(numP, c.num)));
}
