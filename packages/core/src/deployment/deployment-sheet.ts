import type { Controller } from "../controllers/controller.js";
import { deployablePid } from "./deployable-pid.js";
import type { DiscretePid } from "./discrete-pid.js";
import { discretizePid, type DiscretizePidOptions } from "./discretize-pid.js";
import { roundToFixedPoint, type FixedPointOptions, type FixedPointReport } from "./fixed-point.js";
import { pidForms, type PidForms } from "./pid-forms.js";

/** Options of deploymentSheet: the discretisation, and optionally a fixed-point format. */
export interface DeploymentSheetOptions extends DiscretizePidOptions {
  fixedPoint?: FixedPointOptions;
}

/** A controller in the forms firmware needs (the numerical part of a decision's deployment sheet). */
export interface DeploymentSheet {
  forms: PidForms;
  /** The difference equations with exact (double-precision) coefficients. */
  discrete: DiscretePid;
  /** The same with coefficients rounded to the chosen fixed-point format, and what rounding did. */
  fixedPoint: { discrete: DiscretePid; report: FixedPointReport } | null;
  /** Sentences the reader should heed (an alternating derivative filter, a fast tracking gain, saturated coefficients). */
  notes: string[];
}

/**
 * The deployment sheet of a PID-type controller (p, pi, pid, pid2dof): its parallel, ideal and
 * series forms (pidForms), its difference equations at the chosen sample time and method with
 * back-calculation anti-windup, output limits and rate limit (discretizePid), and optionally the
 * coefficients rounded to Q15 or Q31 (roundToFixedPoint). Notes flag, as sentences:
 * Tustin with h > 2·tf (ad < 0: the filtered derivative alternates in sign), a tracking gain
 * h/Tt ≥ 1 (the back-calculation overshoots within a sample; it is unstable from 2, Åström &
 * Hägglund 2006, §3.6), and every coefficient that saturated or rounded to zero.
 * Throws a RangeError naming the option for a bad controller or option.
 */
export function deploymentSheet(controller: Controller, options: DeploymentSheetOptions): DeploymentSheet {
  const pid = deployablePid(controller);
  const discrete = discretizePid(pid, options);
  const notes: string[] = [];
  const h = discrete.sampleTime;
  if (discrete.coefficients.ad < 0) {
    notes.push(`With Tustin at h = ${h} s > 2·tf = ${2 * pid.tf} s the derivative filter pole ad = ${discrete.coefficients.ad.toPrecision(4)} is negative and the D term alternates in sign; sample faster or use backward Euler.`);
  }
  if (discrete.coefficients.at >= 1) {
    notes.push(`The tracking gain h/Tt = ${discrete.coefficients.at.toPrecision(4)} is at least 1, so back-calculation overshoots within one sample${discrete.coefficients.at >= 2 ? " and is unstable" : ""}; raise Tt above h = ${h} s.`);
  }
  let fixedPoint: DeploymentSheet["fixedPoint"] = null;
  if (options.fixedPoint) {
    const rounded = roundToFixedPoint(discrete, options.fixedPoint);
    fixedPoint = { discrete: rounded.pid, report: rounded.report };
    const { saturated, underflowed } = rounded.report;
    if (saturated.length > 0) notes.push(`In ${rounded.report.format.toUpperCase()} the coefficients ${saturated.join(", ")} do not fit and were clipped to the largest stored value; choose a larger exponent.`);
    if (underflowed.length > 0) notes.push(`In ${rounded.report.format.toUpperCase()} the coefficients ${underflowed.join(", ")} round to zero; choose a smaller exponent or a longer word.`);
  }
  return { forms: pidForms(pid), discrete, fixedPoint, notes };
}
