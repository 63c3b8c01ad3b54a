import type { Complex } from "../linear-algebra/complex.js";
import { polynomialAdd } from "../linear-algebra/polynomial-add.js";
import { polynomialMultiply } from "../linear-algebra/polynomial-multiply.js";
import { polynomialRoots } from "../linear-algebra/polynomial-roots.js";
import { trimLeadingZeros } from "../linear-algebra/polynomial-trim.js";
import type { Controller } from "../controllers/controller.js";
import { DELAY_PADE_ORDER, padeDelay } from "../plants/pade-delay.js";
import type { LinearPlant } from "../plants/plant.js";
import { loopTransferFunction } from "./loop-transfer-function.js";

/**
 * Closed-loop poles of the loop of a linear plant and a controller: the roots of
 * den_L + num_L of the loop transfer function (see closedLoopCharacteristicPolynomial; for output
 * feedback den_p·den_c + num_p·num_c). A sampled controller is judged by its continuous counterpart.
 *
 * Dead time: a loop with e^(−θs) has infinitely many poles. For θ > 0 the dead time is replaced by
 * its [m/m] Padé approximant, m = DELAY_PADE_ORDER (see padeDelay), num_p ← num_p·q(−θs),
 * den_p ← den_p·q(θs), and the roots of that polynomial are returned. This is an approximation:
 * it is reliable while the loop's crossover frequency ω_c satisfies ω_c·θ ≲ m, and the poles it
 * adds near −2m/θ are artefacts of the approximation.
 *
 * Sorted by real part, then imaginary part, ascending.
 */
export function closedLoopPoles(plant: LinearPlant, controller: Controller): Complex[] {
  const { num, den, delay } = loopTransferFunction(plant, controller);
  if (delay === 0) return polynomialRoots(trimLeadingZeros(polynomialAdd(den, num)));
  const pade = padeDelay(delay, DELAY_PADE_ORDER);
  return polynomialRoots(trimLeadingZeros(polynomialAdd(polynomialMultiply(den, pade.den), polynomialMultiply(num, pade.num))));
}
