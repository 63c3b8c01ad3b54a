// The references drawn beside a sweep's front, computed from its definition alone: the bound curve
// and the published tuning rules' baselines. A compute task (compute-tasks.ts), so that a family of
// nonlinear plants cannot hold the server's main thread.
import type { Aggregate } from "../aggregates/aggregate-scores.js";
import type { BaselineDto, ReferencesDto, ScoreValue } from "../api/dto.js";
import type { CriterionId } from "../criteria/criterion-id.js";
import { familyBoundCurve } from "../evaluation/family-bound-curve.js";
import { scoreFamilyBaselines } from "../evaluation/score-family-baselines.js";
import type { Plant } from "../plants/plant.js";
import { planSweep, type SweepPlan } from "../sweeps/plan-sweep.js";
import type { SweepShape } from "../sweeps/sweep-input.js";

export interface SweepReferencesInput {
  definition: SweepShape;
  models: Plant[];
  /** The variants' labels, in family order. */
  labels: string[];
  criteria: CriterionId[];
}

/**
 * The bound curve on the (ISE, effort) plane for the sweep's aggregate over its family (core
 * familyBoundCurve: the variants' LQR bounds combined per the aggregate, over the scenario's horizon,
 * or infinite when the criterion options ask for the infinite horizon) and every published tuning
 * rule (core scoreFamilyBaselines: designed on the first variant, scored on every variant with the
 * sweep's scenario, criteria and criterion options, aggregated like the candidates).
 */
export function sweepReferences({ definition, models, labels, criteria }: SweepReferencesInput): ReferencesDto {
  const setup = planSweep(definition, models);
  const family = [...setup.family];
  const aggregate = setup.aggregate;
  const baselinesNote =
    family.length > 1
      ? `Tuning rules designed on the first variant (${labels[0]}), each scored on all ${family.length} variants and combined like the candidates (${aggregateWords(aggregate)}).`
      : undefined;
  return { bound: boundOf(family, labels, setup, aggregate), ...baselinesOf(family, setup, criteria, aggregate), ...(baselinesNote ? { baselinesNote } : {}) };
}

/** A refusal of core (a RangeError or TypeError) as a sentence; anything else is rethrown. */
function refusal(error: unknown): string {
  if (error instanceof RangeError || error instanceof TypeError) return error.message;
  throw error;
}

/** A score as it goes out in JSON: finite as is, ±Infinity as "inf"/"-inf", NaN as null. */
function scoreValue(value: number): ScoreValue {
  if (Number.isFinite(value)) return value;
  if (value === Number.POSITIVE_INFINITY) return "inf";
  if (value === Number.NEGATIVE_INFINITY) return "-inf";
  return null;
}

function aggregateWords(aggregate: Aggregate): string {
  return aggregate.kind === "worst" ? "worst case" : aggregate.kind === "mean" ? "mean" : `${aggregate.p}th percentile`;
}

function boundOf(family: Plant[], labels: string[], setup: SweepPlan, aggregate: Aggregate): ReferencesDto["bound"] {
  if (family.every((plant) => plant.kind === "nonlinear")) {
    return { ok: false, reason: family.length > 1 ? "The bound needs linear plants; every variant is nonlinear." : "The bound needs a linear plant; this plant is nonlinear.", points: [] };
  }
  const horizon = setup.evaluation.criterion?.horizon === "infinite" ? "infinite" : setup.scenario.horizon;
  try {
    const curve = familyBoundCurve(family, setup.scenario, aggregate, { horizon, labels });
    if (!curve.ok) return { ok: false, reason: `No bound for this ${family.length > 1 ? "family" : "plant"}: ${curve.reason}.`, points: [] };
    return { ok: true, points: curve.points.map(({ ratio, ise, effort }) => ({ ratio, ise, effort })), note: curve.note };
  } catch (error) {
    return { ok: false, reason: `No bound for this sweep: ${refusal(error)}.`, points: [] };
  }
}

function baselinesOf(family: Plant[], plan: SweepPlan, criteria: CriterionId[], aggregate: Aggregate): Pick<ReferencesDto, "baselines" | "skipped"> {
  let scored: ReturnType<typeof scoreFamilyBaselines>;
  try {
    scored = scoreFamilyBaselines(family, plan.scenario, criteria, aggregate, { evaluation: plan.evaluation });
  } catch (error) {
    const reason = refusal(error);
    return { baselines: [], skipped: [{ rule: "all", variant: "", label: "Tuning rules", reason }] };
  }
  const baselines: BaselineDto[] = [];
  const skipped: ReferencesDto["skipped"] = [];
  for (const b of scored) {
    if (!b.ok || b.evaluation === null) {
      skipped.push({ rule: b.rule, variant: b.variant, label: b.label, reason: b.ok ? "not evaluated" : b.reason });
      continue;
    }
    const { kp, ki, kd, tf } = b.controller;
    const scores = b.evaluation.scores;
    baselines.push({
      rule: b.rule,
      variant: b.variant,
      label: b.label,
      note: b.note,
      params: { kp, ki, kd, tf },
      status: b.evaluation.status,
      scores: criteria.map((c) => (scores ? scoreValue(scores[c] as number) : null)),
    });
  }
  return { baselines, skipped };
}
