// A published tuning rule's controller of a sweep scored on every variant, for the record of a
// decision that proposes it. A compute task (compute-tasks.ts): a family of nonlinear plants must
// not hold the server's main thread.
import { aggregateScores } from "../aggregates/aggregate-scores.js";
import { STATUS_DIVERGED, STATUS_STABLE, STATUS_UNSTABLE } from "../batch/batch-status.js";
import type { PidController } from "../controllers/pid.js";
import type { CriterionId } from "../criteria/criterion-id.js";
import { evaluateCandidate } from "../evaluation/evaluate-candidate.js";
import type { Plant } from "../plants/plant.js";
import { planSweep } from "../sweeps/plan-sweep.js";
import type { SweepShape } from "../sweeps/sweep-input.js";
import { baselines, type BaselineRule, type BaselineVariant } from "../tuning/baselines.js";

export interface BaselineScoresInput {
  definition: SweepShape;
  models: Plant[];
  rule: BaselineRule;
  variant: BaselineVariant;
}

/** The baseline's controller and its scores over the sweep's criteria on every variant (NaN where a criterion does not apply). */
export interface BaselineScores {
  label: string;
  note: string;
  controller: PidController;
  criteria: CriterionId[];
  /** Per variant in family order: the verdict, and the scores (criteria order) when stable there. */
  variants: { status: "stable" | "unstable" | "diverged"; scores: number[] | null }[];
  /** The sweep's aggregate over the family (criteria order); null unless stable on every variant. */
  aggregate: number[] | null;
}

/**
 * Designs the rule on the sweep's first variant (core baselines, as the references beside the
 * front do: scoreFamilyBaselines) and scores its controller on every variant with the sweep's
 * scenario, criteria and criterion options (evaluateCandidate), then combines the variants with the
 * sweep's aggregate (aggregateScores). Throws a RangeError when the rule does not apply to the plant
 * (with the rule's reason) or the sweep has no such rule.
 */
export function baselineScores({ definition, models, rule, variant }: BaselineScoresInput): BaselineScores {
  const plan = planSweep(definition, models);
  const family = plan.family;
  const found = baselines(family[0] as Plant).find((b) => b.rule === rule && b.variant === variant);
  if (!found) throw new RangeError(`source.rule: there is no ${rule} ${variant.toUpperCase()} baseline`);
  if (!found.ok) throw new RangeError(`source.rule: ${found.label} does not apply to this plant (${found.reason})`);
  const criteria = [...plan.criteria];
  const nc = criteria.length;
  const scores = new Float64Array(family.length * nc);
  const codes = new Uint8Array(family.length);
  const variants = family.map((plant, f) => {
    const run = evaluateCandidate(plant, found.controller, plan.scenario, criteria, { ...plan.evaluation, poles: false });
    codes[f] = run.status === "stable" ? STATUS_STABLE : run.status === "unstable" ? STATUS_UNSTABLE : STATUS_DIVERGED;
    const row = run.scores ? criteria.map((c) => run.scores![c]) : null;
    criteria.forEach((_, c) => (scores[f * nc + c] = row ? (row[c] as number) : Number.NaN));
    return { status: run.status, scores: row };
  });
  const stable = variants.every((v) => v.status === "stable");
  const aggregate = stable ? Array.from(aggregateScores(scores, codes, 1, family.length, criteria, plan.aggregate)) : null;
  return { label: found.label, note: found.note, controller: { ...found.controller }, criteria, variants, aggregate };
}
