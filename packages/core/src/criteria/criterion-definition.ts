import type { SensitivityWeight } from "../frequency/sensitivity-weight.js";
import type { LoopTrace } from "../simulation/loop-trace.js";
import type { LoopTransferFunction } from "../stability/evaluate-loop.js";
import type { CriterionId } from "./criterion-id.js";

/**
 * Where a criterion is computed: "time" criteria read a simulated LoopTrace; "frequency" criteria
 * (Ms, Mt, margins, crossover, bandwidth, ‖W·S‖∞) read the loop transfer function L(s) through
 * `computeLoop` and apply to linear plants only.
 */
export type CriterionKind = "time" | "frequency";

/**
 * Options some criteria take; the others ignore them.
 * - `q`, `r`: weights of the quadratic criterion J = ∫(q·e² + r·(u − u∞)²)dt, finite, ≥ 0, default 1.
 * - `settlingBand`: half-width of the settling band as a fraction of the output change, in (0, 1),
 *   default 0.02 (the 2 % band).
 * - `horizon`: "simulated" (default) integrates ise, effort and quadratic over the scenario's
 *   horizon on its time grid; "infinite" takes them from exactQuadraticCosts (a Lyapunov equation,
 *   no time grid, t → ∞) for loops that qualify — linear, delay-free, no actuator limits, a
 *   continuous controller, a noise-free setpoint step at t = 0 without load — and makes them NaN
 *   ("does not apply") for every other loop. Other criteria ignore it.
 */
export interface CriterionOptions {
  q?: number;
  r?: number;
  settlingBand?: number;
  horizon?: "simulated" | "infinite";
  /** Sensitivity weight W(s) = num/den of `wsNorm` (proper; see performanceWeight for the common preset). */
  weight?: SensitivityWeight;
}

/** One scalar figure of a loop, as listed in the CRITERIA registry. */
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
   * Which way is better: "smaller" (the default when absent; every time criterion) or "larger"
   * (gain and phase margin, crossover frequency, bandwidth). A front that minimises should negate
   * "larger" criteria.
   */
  better?: "smaller" | "larger";
  /**
   * The criterion's value for a trace; smaller is better for every time criterion. NaN when the
   * criterion does not apply (a step-response figure without a setpoint change, a diverged trace,
   * a loop without steady state where u∞ or y∞ is needed); Infinity for a rise or settling time
   * not reached within the horizon. Throws a RangeError for a bad option.
   */
  compute(trace: LoopTrace, options?: CriterionOptions): number;
  /**
   * Frequency criteria only: the value for the loop transfer function L(s) of a stable linear loop
   * (loopTransferFunction). Their `compute(trace)` returns NaN, since a trace does not determine L.
   */
  computeLoop?(loop: LoopTransferFunction, options?: CriterionOptions): number;
}
