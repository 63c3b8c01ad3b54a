import type { Aggregate } from "../aggregates/aggregate-scores.js";
import type { Controller } from "../controllers/controller.js";
import type { CriterionOptions } from "../criteria/criterion-definition.js";
import type { CriterionId } from "../criteria/criterion-id.js";
import type { Plant } from "../plants/plant.js";
import type { Scenario } from "../simulation/scenario.js";
import type { DiscretizationMethod } from "./discrete-pid.js";
import type { FixedPointFormat } from "./fixed-point.js";

/** One variant of the family a design is deployed on: its plant (variant overrides applied) and where it came from. */
export interface DeploymentVariant {
  label: string;
  plant: Plant;
  revision?: { plantId: string; plantName: string; revisionId: string; revisionNumber: number } | null;
}

/**
 * A design to deploy: the family's plants, the controller (a sweep candidate, a comparison pick,
 * a baseline or a decision's), the scenario it was judged under and the criteria it was scored on.
 */
export interface DeploymentDesign {
  variants: DeploymentVariant[];
  controller: Controller;
  scenario: Scenario;
  criteria: CriterionId[];
  criterionOptions?: CriterionOptions;
  /** How the variants' scores are combined; worst case when absent. */
  aggregate?: Aggregate;
}

/** What the reader of a sheet chooses: the sample time, the discretisation and optionally a fixed-point format. */
export interface DeploymentSheetRequest {
  /** Sample time h [s], > 0. */
  sampleTime: number;
  method: DiscretizationMethod;
  format?: FixedPointFormat | null;
}

/**
 * A sheet that cannot be made for this design and request, as data: `field` names the request's
 * or design's field ("sampleTime", "controller", …) and `reason` is a sentence saying what to
 * change; `kind` tells the server the answer: "invalid" (a value that is never right: 400) or
 * "unsuitable" (right in general, not for this design: 422).
 */
export class DeploymentSheetError extends RangeError {
  readonly field: string;
  readonly reason: string;
  readonly kind: "invalid" | "unsuitable";
  constructor(field: string, reason: string, kind: "invalid" | "unsuitable") {
    super(reason);
    this.name = "DeploymentSheetError";
    this.field = field;
    this.reason = reason;
    this.kind = kind;
  }
}

/** The caution every deployment sheet and decision record carries. */
export const DEPLOYMENT_CAUTION =
  "A simulated design is not a validated one: commission this controller on the real machine with its safety interlocks in place, and defer to your team's safety practice and the local codes that apply.";
