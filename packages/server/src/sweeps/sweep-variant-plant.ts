import type { Plant, SweepDetailDto } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { badRequest, notFound } from "../http/http-error.js";
import { findRevisionInWorkspace } from "../plants/plant-repository.js";
import { definitionVariants, SweepDefinitionError, variantPlant } from "./sweep-evaluation.js";

/**
 * The plant of one variant of a sweep (0 = the first, the only one without a family): its revision's
 * model with the variant's parameter overrides, exactly as the runner evaluated it
 * (loadEvaluationContext). A variant beyond the family is a 400 that names the valid range.
 */
export async function sweepVariantPlant(db: Database, workspaceId: string, sweep: SweepDetailDto, variant = 0): Promise<Plant> {
  const variants = definitionVariants(sweep.definition);
  const chosen = variants[variant];
  if (!chosen) {
    throw badRequest(
      variants.length === 1
        ? `This sweep has one variant; use variant=0 or leave it out (got ${variant}).`
        : `This sweep has variants 0 to ${variants.length - 1}; there is no variant ${variant}.`,
      "variant",
    );
  }
  const revision = await findRevisionInWorkspace(db, workspaceId, chosen.plantRevisionId);
  if (!revision) throw notFound("A plant revision of this sweep no longer exists.");
  try {
    return variantPlant(revision.model, chosen.parameters);
  } catch (error) {
    if (error instanceof SweepDefinitionError) throw badRequest(`This variant cannot be rebuilt: ${error.message}.`, "variant");
    throw error;
  }
}
