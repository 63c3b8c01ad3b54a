import type { CriterionDefinition } from "./criterion-definition.js";
import type { CriterionId } from "./criterion-id.js";
import { effortCriterion } from "./effort.js";
import { iaeCriterion } from "./iae.js";
import { iseCriterion } from "./ise.js";
import { itaeCriterion } from "./itae.js";

/**
 * Every criterion by id. To add one: put its id in CRITERION_IDS (criterion-id.ts), write
 * `criteria/<id>.ts` exporting the function and its CriterionDefinition, and list it here;
 * the type Record<CriterionId, …> makes the compiler ask for the entry.
 */
export const CRITERIA: Readonly<Record<CriterionId, CriterionDefinition>> = {
  iae: iaeCriterion,
  ise: iseCriterion,
  itae: itaeCriterion,
  effort: effortCriterion,
};
