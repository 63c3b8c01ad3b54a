import { frequencyResponse } from "../frequency/frequency-response.js";
import { thinFrequencyResponse } from "../frequency/thin-frequency-response.js";
import type { LinearPlant } from "../plants/plant.js";
import { loopTransferFunction } from "../simulation/loop-transfer-function.js";
import { simulateLoop } from "../simulation/simulate-loop.js";
import { downsampleIndices, pick } from "../traces/downsample-trace.js";
import type { DeploymentDesign } from "./deployment-design.js";

/** Most points per curve of a printed record (a page is about 500 points wide). */
export const RECORD_CURVE_POINTS = 400;

/** One variant's closed-loop curves for a record: the step response and |S(jω)|. */
export interface VariantCurves {
  label: string;
  /** Under the design's scenario: t [s], r and y [y], u [u]; empty with `reason` when the loop could not be simulated. */
  step: { t: number[]; r: number[]; y: number[]; u: number[] };
  /** |S(jω)| on a thinned log grid, ω [rad/s]; empty for a nonlinear plant. */
  sensitivity: { omega: number[]; magnitude: number[] };
  reason?: string;
}

/** The curves of a design on every variant (for the decision record's plots). */
export type DesignCurves = VariantCurves[];

/**
 * The closed loop of a design on every variant of its family, for plotting: the response under the
 * design's scenario (simulateLoop with the design's controller as it was studied, downsampled to
 * at most RECORD_CURVE_POINTS) and |S(jω)| = |1/(1 + L(jω))| of the continuous loop
 * (frequencyResponse of loopTransferFunction, thinned; linear plants only). A variant that cannot be
 * simulated keeps empty curves and the reason.
 */
export function designCurves(design: DeploymentDesign): DesignCurves {
  return design.variants.map((variant) => {
    const curves: VariantCurves = { label: variant.label, step: { t: [], r: [], y: [], u: [] }, sensitivity: { omega: [], magnitude: [] } };
    try {
      const trace = simulateLoop(variant.plant, design.controller, design.scenario);
      const at = downsampleIndices(trace.t.length, RECORD_CURVE_POINTS);
      curves.step = { t: pick(trace.t, at), r: pick(trace.r, at), y: pick(trace.y, at), u: pick(trace.u, at) };
      if (trace.status === "diverged") curves.reason = "the simulation diverged";
      if (variant.plant.kind !== "nonlinear") {
        const thin = thinFrequencyResponse(frequencyResponse(loopTransferFunction(variant.plant as LinearPlant, design.controller)));
        const every = Math.max(1, Math.ceil(thin.omega.length / RECORD_CURVE_POINTS));
        const keep = thin.omega.map((_, i) => i).filter((i) => i % every === 0 || i === thin.omega.length - 1);
        curves.sensitivity = { omega: pick(thin.omega, keep), magnitude: pick(thin.S, keep) };
      }
    } catch (error) {
      if (!(error instanceof RangeError || error instanceof TypeError)) throw error;
      curves.reason = error.message;
    }
    return curves;
  });
}
