import type { Complex } from "../linear-algebra/complex.js";
import { polynomialRoots } from "../linear-algebra/polynomial-roots.js";
import { linearPlantModel } from "../plants/linear-plant-model.js";
import { linearizeNonlinearPlant } from "../plants/nonlinear-plant-model.js";
import type { Plant } from "../plants/plant.js";
import { stateSpaceToTransferFunction } from "../plants/state-space-to-transfer-function.js";

/**
 * Relative distance below which a zero and a pole are taken to cancel, |z − p| ≤ ε·max(1, |p|).
 * State-space plants keep hidden modes as equal roots of num and den (stateSpaceToTransferFunction
 * does not cancel); companion-matrix roots of a repeated factor are only accurate to about eps^(1/m).
 */
export const CANCELLATION_TOLERANCE = 1e-5;

/** A rational plant factored as G(s) = c·Π(s − zᵢ)/Π(s − pⱼ)·e^(−θs). */
export interface PlantFactors {
  /** c: ratio of the leading numerator to the leading denominator coefficient. */
  leading: number;
  zeros: Complex[];
  poles: Complex[];
  /** θ [s]. */
  delay: number;
  /** G(0) = num(0)/den(0); ±Infinity with a pole at the origin, 0 with a zero there. */
  staticGain: number;
}

/**
 * The zeros, poles, leading coefficient and dead time of a plant's rational model (transfer
 * function as given; state space via its transfer function; nonlinear via its linearisation at the
 * operating point, linearizeNonlinearPlant). Zero–pole pairs that coincide within
 * CANCELLATION_TOLERANCE are cancelled. Throws a RangeError naming the field of a bad plant.
 */
export function plantFactors(plant: Plant): PlantFactors {
  let num: readonly number[];
  let den: readonly number[];
  let delay = 0;
  if (plant.kind === "nonlinear") {
    const tf = stateSpaceToTransferFunction(linearizeNonlinearPlant(plant));
    num = dropLeadingZeros(tf.num);
    den = tf.den;
  } else {
    const model = linearPlantModel(plant);
    num = dropLeadingZeros(model.num);
    den = model.den;
    delay = model.delay;
  }
  const zeros = num.length > 0 ? polynomialRoots(num) : [];
  const poles = polynomialRoots(den);
  cancelCommonRoots(zeros, poles);
  const leading = num.length > 0 ? num[0] / den[0] : 0;
  const n0 = num.length > 0 ? num[num.length - 1] : 0;
  const d0 = den[den.length - 1];
  const staticGain = d0 === 0 ? (n0 === 0 ? NaN : Math.sign(n0) * Infinity) : n0 / d0;
  return { leading, zeros, poles, delay, staticGain };
}

function dropLeadingZeros(p: readonly number[]): number[] {
  let first = 0;
  while (first < p.length && p[first] === 0) first++;
  return p.slice(first);
}

function cancelCommonRoots(zeros: Complex[], poles: Complex[]): void {
  for (let i = zeros.length - 1; i >= 0; i--) {
    const z = zeros[i];
    const j = poles.findIndex((p) => Math.hypot(z.re - p.re, z.im - p.im) <= CANCELLATION_TOLERANCE * Math.max(1, Math.hypot(p.re, p.im)));
    if (j >= 0) {
      zeros.splice(i, 1);
      poles.splice(j, 1);
    }
  }
}
