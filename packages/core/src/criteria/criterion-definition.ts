import type { LoopTrace } from "../simulation/loop-trace.js";
import type { CriterionId } from "./criterion-id.js";

/**
 * Where a criterion is computed: "time" criteria read a simulated LoopTrace. Frequency-domain
 * criteria (Ms, margins, …) will add their own kind.
 */
export type CriterionKind = "time";

/**
 * Options some criteria take; the others ignore them.
 * - `q`, `r`: weights of the quadratic criterion J = ∫(q·e² + r·(u − u∞)²)dt, finite, ≥ 0, default 1.
 * - `settlingBand`: half-width of the settling band as a fraction of the output change, in (0, 1),
 *   default 0.02 (the 2 % band).
 */
export interface CriterionOptions {
  q?: number;
  r?: number;
  settlingBand?: number;
}

/** One scalar figure of a simulated loop, as listed in the CRITERIA registry. */
export interface CriterionDefinition {
  id: CriterionId;
  kind: CriterionKind;
  /** Short label for tables and axes, e.g. "IAE". */
  label: string;
  /** Unit in terms of the plant's output y, input u and seconds, e.g. "y·s"; "%" for percentages. */
  unit: string;
  /** One sentence: the formula in words. */
  description: string;
  /**
   * The criterion's value for a trace; smaller is better for every criterion here. NaN when the
   * criterion does not apply (a step-response figure without a setpoint change, a diverged trace,
   * a loop without steady state where u∞ or y∞ is needed); Infinity for a rise or settling time
   * not reached within the horizon. Throws a RangeError for a bad option.
   */
  compute(trace: LoopTrace, options?: CriterionOptions): number;
}
