import type { Plant, SweepPlan } from "@loopyard/core";
import { badRequest } from "../http/http-error.js";

/**
 * The plant of one variant of a sweep's plan (0 = the first, the only one without a family): its
 * revision's model with the variant's parameter overrides, exactly as the chunks evaluated it
 * (planSweep). A variant beyond the family is a 400 that names the valid range.
 */
export function sweepVariantPlant(plan: SweepPlan, variant = 0): Plant {
  const plant = plan.family[variant];
  if (!plant) {
    throw badRequest(
      plan.family.length === 1
        ? `This sweep has one variant; use variant=0 or leave it out (got ${variant}).`
        : `This sweep has variants 0 to ${plan.family.length - 1}; there is no variant ${variant}.`,
      "variant",
    );
  }
  return plant;
}
