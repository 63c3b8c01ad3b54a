import type { Complex } from "../linear-algebra/complex.js";
import { polynomialMultiply } from "../linear-algebra/polynomial-multiply.js";
import { polynomialRoots } from "../linear-algebra/polynomial-roots.js";
import type { PidController } from "../controllers/pid.js";
import { normalizeTransferFunction } from "../plants/normalize-transfer-function.js";
import { DELAY_PADE_ORDER, padeDelay } from "../plants/pade-delay.js";
import type { Plant } from "../plants/plant.js";
import { characteristicPolynomial } from "./closed-loop-characteristic-polynomial.js";

/**
 * Closed-loop poles of the unity-feedback loop of a plant and a PID: the roots of
 * den_p·den_c + num_p·num_c (see closedLoopCharacteristicPolynomial).
 *
 * Dead time: a loop with e^(−θs) has infinitely many poles. For θ > 0 the dead time is replaced by
 * its [m/m] Padé approximant, m = DELAY_PADE_ORDER (see padeDelay), num_p ← num_p·q(−θs),
 * den_p ← den_p·q(θs), and the roots of that polynomial are returned. This is an approximation:
 * it is reliable while the loop's crossover frequency ω_c satisfies ω_c·θ ≲ m, and the poles it
 * adds near −2m/θ are artefacts of the approximation.
 *
 * Sorted by real part, then imaginary part, ascending.
 */
export function closedLoopPoles(plant: Plant, controller: PidController): Complex[] {
  const { num, den, delay } = normalizeTransferFunction(plant);
  if (delay === 0) return polynomialRoots(characteristicPolynomial(num, den, controller));
  const pade = padeDelay(delay, DELAY_PADE_ORDER);
  return polynomialRoots(
    characteristicPolynomial(polynomialMultiply(num, pade.num), polynomialMultiply(den, pade.den), controller),
  );
}
