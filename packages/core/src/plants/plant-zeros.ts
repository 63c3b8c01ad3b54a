import type { Complex } from "../linear-algebra/complex.js";
import { polynomialRoots } from "../linear-algebra/polynomial-roots.js";
import { linearPlantModel } from "./linear-plant-model.js";
import { linearizeNonlinearPlant } from "./nonlinear-plant-model.js";
import type { Plant } from "./plant.js";
import { stateSpaceToTransferFunction } from "./state-space-to-transfer-function.js";

/**
 * Zeros of a plant: the roots of its numerator num(s) once leading zeros are dropped (the dead time
 * e^(−θs) adds none); for a state-space plant those of C·adj(sI − A)·B + D·det(sI − A); for a
 * nonlinear plant those of its linearisation at the operating point. Sorted like plantPoles. A zero
 * with Re z > 0 (right half-plane) makes the step response start the wrong way (Åström & Murray,
 * Feedback Systems, 2nd ed., 2021, §14.3). Common factors of num and den are not cancelled.
 */
export function plantZeros(plant: Plant): Complex[] {
  const num = plant.kind === "nonlinear" ? stateSpaceToTransferFunction(linearizeNonlinearPlant(plant)).num : linearPlantModel(plant).num;
  let first = 0;
  while (first < num.length - 1 && num[first] === 0) first++;
  const trimmed = num.slice(first);
  if (trimmed.length <= 1) return [];
  return polynomialRoots(trimmed);
}
