import type { Complex } from "../linear-algebra/complex.js";
import { polynomialRoots } from "../linear-algebra/polynomial-roots.js";
import { linearPlantModel } from "./linear-plant-model.js";
import { linearizeNonlinearPlant } from "./nonlinear-plant-model.js";
import type { Plant } from "./plant.js";
import { stateSpaceToTransferFunction } from "./state-space-to-transfer-function.js";

/**
 * Poles of a plant: the roots of its denominator den(s) (the dead time e^(−θs) adds none); for a
 * state-space plant the eigenvalues of A (roots of det(sI − A)); for a nonlinear plant those of its
 * linearisation at the operating point (linearizeNonlinearPlant). Sorted by real part, then
 * imaginary part, ascending. Common factors of num and den are not cancelled.
 */
export function plantPoles(plant: Plant): Complex[] {
  if (plant.kind === "nonlinear") return polynomialRoots(stateSpaceToTransferFunction(linearizeNonlinearPlant(plant)).den);
  return polynomialRoots(linearPlantModel(plant).den);
}
