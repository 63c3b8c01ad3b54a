import { familyOfSweep, type FamilyBearing } from "@loopyard/core";

/**
 * The key that tells one family of plant variants from another, for superseding and for the
 * ?family= filter: core's familyOfSweep, so a study on any revision of a family saved in the
 * library belongs to that family, and an ad-hoc family is told apart by its variant set
 * (revisions and parameter values, order-free). The only place decisions define a family's identity.
 */
export function decisionFamilyKey(definition: FamilyBearing): string {
  return familyOfSweep(definition).key;
}
