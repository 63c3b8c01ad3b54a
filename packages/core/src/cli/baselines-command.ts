import type { CriterionId } from "../criteria/criterion-id.js";
import type { Plant } from "../plants/plant.js";
import type { Scenario } from "../simulation/scenario.js";
import { scoreBaselines, type ScoredBaseline } from "../tuning/score-baselines.js";
import { baselinesSpecSchema } from "./baselines-spec.js";
import { toCliJson } from "./json-output.js";
import { readSpec } from "./read-spec.js";
import { asInputError, validateSpec } from "./validate-spec.js";

/** One line of `loopyard baselines` output: a rule that applies, with its scores, or one that does not. */
export type BaselineOutput =
  | {
      rule: string;
      variant: string;
      label: string;
      applies: true;
      model: Record<string, unknown>;
      controller: { kp: number; ki: number; kd: number; tf: number };
      ideal: { K: number; Ti: number; Td: number };
      series?: { Kc: number; tauI: number; tauD: number };
      tuning: Record<string, number>;
      note: string;
      status: string;
      criteria: Record<string, number> | null;
    }
  | { rule: string; variant: string; label: string; applies: false; reason: string };

/**
 * `loopyard baselines FILE|-`: reads a baselines spec, computes every published tuning rule for the
 * plant (baselines) and scores each like a candidate (scoreBaselines), and returns the JSON text
 * `{ "baselines": [...] }` (Infinity as "inf", NaN as null). Throws a CliInputError for a bad
 * file, bad JSON or a bad spec.
 */
export async function baselinesCommand(source: string): Promise<string> {
  const spec = validateSpec(baselinesSpecSchema, await readSpec(source), "baselines spec");
  let scored: ScoredBaseline[];
  try {
    scored = scoreBaselines(spec.plant as Plant, spec.scenario as Scenario, spec.criteria as readonly CriterionId[], {
      ...spec.options,
      evaluation: { poles: false },
    });
  } catch (error) {
    asInputError(error);
  }
  const baselines = scored.map((b): BaselineOutput => {
    if (!b.ok) return { rule: b.rule, variant: b.variant, label: b.label, applies: false, reason: b.reason };
    const { kp, ki, kd, tf } = b.controller;
    const evaluation = b.evaluation!;
    return {
      rule: b.rule,
      variant: b.variant,
      label: b.label,
      applies: true,
      model: { ...b.model },
      controller: { kp, ki, kd, tf },
      ideal: { ...b.ideal },
      ...(b.series === undefined ? {} : { series: { ...b.series } }),
      tuning: { ...b.tuning },
      note: b.note,
      status: evaluation.status,
      criteria: evaluation.scores === null ? null : Object.fromEntries(spec.criteria.map((id) => [id, (evaluation.scores as Record<string, number>)[id]])),
    };
  });
  return toCliJson({ baselines });
}
