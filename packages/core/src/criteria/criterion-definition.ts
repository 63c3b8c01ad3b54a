import type { LoopTrace } from "../simulation/loop-trace.js";
import type { CriterionId } from "./criterion-id.js";

/** One scalar figure of a simulated loop, as listed in the CRITERIA registry. */
export interface CriterionDefinition {
  id: CriterionId;
  /** Short label for tables and axes, e.g. "IAE". */
  label: string;
  /** Unit in terms of the plant's output y, input u and seconds, e.g. "y·s". */
  unit: string;
  /** One sentence: the formula in words. */
  description: string;
  /** The criterion's value for a trace; smaller is better for every criterion here. */
  compute(trace: LoopTrace): number;
}
