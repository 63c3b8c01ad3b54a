import { gaussianNoise } from "./gaussian-noise.js";
import type { MeasurementNoise } from "./scenario.js";

/**
 * The measurement noise on the states a state-feedback controller reads: one white Gaussian
 * sequence per plant state, each of standard deviation `sd` (in the state's units), state j drawn
 * from the seed `seed + j` (gaussianNoise). State 0 gets the very sequence that output feedback
 * adds to y, so on a one-state plant with y = x both controllers see the same noisy measurement.
 * Each sample is held over its grid step, like the output noise. Common practice: independent
 * sensor noise on each measured state.
 */
export function stateNoise(noise: MeasurementNoise, states: number, samples: number): Float64Array[] {
  const out: Float64Array[] = [];
  for (let j = 0; j < states; j++) out.push(gaussianNoise(noise.seed + j, noise.sd, samples));
  return out;
}
