import { polynomialEvaluate } from "../linear-algebra/polynomial-evaluate.js";
import { pidTransferFunction } from "../controllers/pid-transfer-function.js";
import type { PidController } from "../controllers/pid.js";
import { linearPlantModel } from "../plants/linear-plant-model.js";
import type { LinearPlant } from "../plants/plant.js";
import { characteristicPolynomial } from "./closed-loop-characteristic-polynomial.js";

/**
 * Exact steady-state input u∞ = lim_{t→∞} u(t) of a stable loop after a unit setpoint step,
 * by the final-value theorem on the transfer function from r to u:
 *
 *   u∞ = C(0) / (1 + C(0)·G(0)) = num_c(0)·den_p(0) / χ(0),   χ = den_p·den_c + num_p·num_c.
 *
 * The polynomial form covers the limiting cases without special code:
 * - with integral action (den_c(0) = 0, num_c(0) = ki): u∞ = den_p(0)/num_p(0) = 1/G(0);
 * - a plant with a pole at s = 0 (den_p(0) = 0): u∞ = 0;
 * - without integral action: u∞ = kp/(1 + kp·G(0)), the DC value of C/(1 + CG) with C(0) = kp.
 * The dead time does not change it (e^(−θ·0) = 1). Returns NaN when χ(0) = 0 (a closed-loop pole
 * at s = 0, so there is no steady state).
 *
 * Reference: G. F. Franklin, J. D. Powell and A. Emami-Naeini, Feedback Control of Dynamic
 * Systems, 4th ed., 2002, §3.1.6 (final value theorem) and §4.2 (steady-state error).
 */
export function steadyStateInput(plant: LinearPlant, controller: PidController): number {
  const { num, den } = linearPlantModel(plant);
  const c = pidTransferFunction(controller);
  const chi0 = polynomialEvaluate(characteristicPolynomial(num, den, controller), 0);
  if (chi0 === 0) return NaN;
  return (polynomialEvaluate(c.num, 0) * polynomialEvaluate(den, 0)) / chi0;
}

/**
 * Exact steady-state output y∞ = lim_{t→∞} y(t) of a stable loop after a unit setpoint step, by
 * the final-value theorem: y∞ = C(0)G(0)/(1 + C(0)G(0)) = num_c(0)·num_p(0)/χ(0) (1 with integral
 * action or an integrating plant). NaN when χ(0) = 0. Same reference as steadyStateInput.
 */
export function steadyStateOutput(plant: LinearPlant, controller: PidController): number {
  const { num, den } = linearPlantModel(plant);
  const c = pidTransferFunction(controller);
  const chi0 = polynomialEvaluate(characteristicPolynomial(num, den, controller), 0);
  if (chi0 === 0) return NaN;
  return (polynomialEvaluate(c.num, 0) * polynomialEvaluate(num, 0)) / chi0;
}
