import type { Controller } from "../controllers/controller.js";
import { controllerTransferFunction } from "../controllers/controller-transfer-function.js";
import { polynomialMultiply } from "../linear-algebra/polynomial-multiply.js";
import { trimLeadingZeros } from "../linear-algebra/polynomial-trim.js";
import { linearPlantModel } from "../plants/linear-plant-model.js";
import type { LinearPlant } from "../plants/plant.js";
import { stateSpaceToTransferFunction } from "../plants/state-space-to-transfer-function.js";

/**
 * The loop transfer function L(s) = num/den · e^(−θs), loop broken at the plant input, so that the
 * closed loop is stable exactly when 1 + L has no zeros in the closed right half-plane:
 * - output feedback (p, pi, pid, pid2dof, lead-lag): L = C_y(s)·G(s), C_y = controllerTransferFunction;
 * - state feedback u = −K x + N r: L = K (sI − A)⁻¹ B, by stateSpaceToTransferFunction with C = K, D = 0.
 * Products are not cancelled, so den holds every plant and controller pole. Built once per
 * (plant, controller) pair; later calls return the same, read-only object.
 * Reference: K. J. Åström and R. M. Murray, Feedback Systems, 2008, §9.2 (loop transfer function).
 */
export function loopTransferFunction(plant: LinearPlant, controller: Controller): { num: number[]; den: number[]; delay: number } {
  let perPlant = loops.get(controller);
  if (perPlant === undefined) {
    perPlant = new WeakMap();
    loops.set(controller, perPlant);
  }
  let loop = perPlant.get(plant);
  if (loop === undefined) {
    loop = buildLoopTransferFunction(plant, controller);
    perPlant.set(plant, loop);
  }
  return loop;
}

/**
 * Loop transfer functions already built, per controller and plant object: one candidate on one
 * variant builds its L(s) once for its poles, its stability verdict and its frequency criteria.
 * Plants and controllers are treated as immutable; callers never modify the returned polynomials.
 */
const loops = new WeakMap<Controller, WeakMap<LinearPlant, { num: number[]; den: number[]; delay: number }>>();

function buildLoopTransferFunction(plant: LinearPlant, controller: Controller): { num: number[]; den: number[]; delay: number } {
  const model = linearPlantModel(plant);
  if (controller.kind === "state-feedback") {
    const { ss } = model;
    if (controller.k.length !== ss.n) throw new RangeError(`controller.k: give one gain per plant state (${ss.n}), got ${controller.k.length}`);
    const tf = stateSpaceToTransferFunction({ n: ss.n, a: ss.a, b: ss.b, c: Float64Array.from(controller.k), d: 0 });
    const num = trimLeadingZeros(tf.num);
    return { num: num.length > 0 ? num : [0], den: tf.den, delay: model.delay };
  }
  const c = controllerTransferFunction(controller);
  return { num: polynomialMultiply(c.num, model.num), den: polynomialMultiply(c.den, model.den), delay: model.delay };
}
