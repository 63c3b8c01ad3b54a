import type { CriterionDefinition } from "./criterion-definition.js";
import type { CriterionId } from "./criterion-id.js";
import { bandwidthCriterion } from "./bandwidth.js";
import { crossoverFrequencyCriterion } from "./crossover-frequency.js";
import { effortCriterion } from "./effort.js";
import { gainMarginCriterion } from "./gain-margin.js";
import { iaeCriterion } from "./iae.js";
import { iseCriterion } from "./ise.js";
import { loadRecoveryTimeCriterion } from "./load-recovery-time.js";
import { itaeCriterion } from "./itae.js";
import { itseCriterion } from "./itse.js";
import { msCriterion } from "./ms.js";
import { mtCriterion } from "./mt.js";
import { overshootCriterion } from "./overshoot.js";
import { phaseMarginCriterion } from "./phase-margin.js";
import { quadraticCriterion } from "./quadratic.js";
import { rawEffortCriterion } from "./raw-effort.js";
import { riseTimeCriterion } from "./rise-time.js";
import { settlingTimeCriterion } from "./settling-time.js";
import { steadyStateErrorCriterion } from "./steady-state-error.js";
import { tvCriterion } from "./tv.js";
import { undershootCriterion } from "./undershoot.js";
import { upeakCriterion } from "./upeak.js";
import { wsNormCriterion } from "./ws-norm.js";

/**
 * Every criterion by id. To add one: put its id in CRITERION_IDS (criterion-id.ts), write
 * `criteria/<id>.ts` exporting the function and its CriterionDefinition, and list it here;
 * the type Record<CriterionId, …> makes the compiler ask for the entry.
 * `CRITERIA[id].compute(trace)` uses the default options; pass `{ q, r, settlingBand }` to change them.
 * Frequency criteria (kind "frequency") are computed by `computeLoop(loop, { weight })` instead.
 */
export const CRITERIA: Readonly<Record<CriterionId, CriterionDefinition>> = {
  iae: iaeCriterion,
  ise: iseCriterion,
  itae: itaeCriterion,
  itse: itseCriterion,
  quadratic: quadraticCriterion,
  effort: effortCriterion,
  rawEffort: rawEffortCriterion,
  tv: tvCriterion,
  upeak: upeakCriterion,
  overshoot: overshootCriterion,
  undershoot: undershootCriterion,
  riseTime: riseTimeCriterion,
  settlingTime: settlingTimeCriterion,
  steadyStateError: steadyStateErrorCriterion,
  loadRecoveryTime: loadRecoveryTimeCriterion,
  ms: msCriterion,
  mt: mtCriterion,
  gainMargin: gainMarginCriterion,
  phaseMargin: phaseMarginCriterion,
  crossoverFrequency: crossoverFrequencyCriterion,
  bandwidth: bandwidthCriterion,
  wsNorm: wsNormCriterion,
};
