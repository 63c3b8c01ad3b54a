// The computations whose cost users control, as named tasks of the compute pool: each runs under a
// work budget (core withWorkBudget: right-hand-side evaluations) and answers a ComputeOutcome, a
// plain object that crosses a worker thread's message port. Pure functions: also callable in process.
import { DeclaredNameError } from "../expressions/declared-name-error.js";
import { ExpressionError } from "../expressions/expression-error.js";
import { frequencyResponse } from "../frequency/frequency-response.js";
import type { SensitivityWeight } from "../frequency/sensitivity-weight.js";
import { thinFrequencyResponse, type ThinFrequencyResponse } from "../frequency/thin-frequency-response.js";
import type { Complex } from "../linear-algebra/complex.js";
import { nonlinearPlantModel } from "../plants/nonlinear-plant-model.js";
import { openLoopStep } from "../plants/open-loop-step.js";
import type { LinearPlant, Plant } from "../plants/plant.js";
import { plantPoles } from "../plants/plant-poles.js";
import { suggestHorizon } from "../plants/suggest-horizon.js";
import { IllPosedLoopError } from "../simulation/ill-posed-loop-error.js";
import { loopTransferFunction } from "../simulation/loop-transfer-function.js";
import { simulateLoop } from "../simulation/simulate-loop.js";
import { withWorkBudget, type WorkBudget } from "../simulation/work-budget.js";
import { planSweep } from "../sweeps/plan-sweep.js";
import { SweepPlanError } from "../sweeps/sweep-plan-error.js";
import type { SweepShape } from "../sweeps/sweep-input.js";
import { downsampleIndices, pick } from "../traces/downsample-trace.js";
import type { ReferencesDto } from "../api/dto.js";
import { sweepReferences, type SweepReferencesInput } from "./sweep-references-task.js";
import type { DeploymentSheetDto } from "../api/deployment-sheet-dto.js";
import { buildDeploymentSheet } from "../deployment/build-deployment-sheet.js";
import { designCurves, type DesignCurves } from "../deployment/design-curves.js";
import { DeploymentSheetError, type DeploymentDesign, type DeploymentSheetRequest } from "../deployment/deployment-design.js";
import { baselineScores, type BaselineScores, type BaselineScoresInput } from "./baseline-scores-task.js";

/**
 * Why a task gave no value: "budget" (its work budget ran out), "time" (its time limit passed; set
 * by the pool), "refused" (core refused the input; `field` names it when known: an expression's
 * dotted path, a sweep definition's field), "ill-posed" (the loop 1 + C·G vanishes at high frequency).
 */
export type ComputeFailure = { ok: false; kind: "budget" | "time" | "refused" | "ill-posed"; reason: string; field?: string; error?: string };

export type ComputeOutcome<T> = { ok: true; value: T } | ComputeFailure;

/** A plant's preview: poles (of the linearisation for a nonlinear plant) and open-loop step, downsampled. */
export interface PlantPreview {
  poles: Complex[];
  step: { t: number[]; y: number[] };
}

/** One candidate of a stored sweep: its definition, its variants' models, its parameters, the variant shown. */
export interface CandidateTaskInput {
  definition: SweepShape;
  models: Plant[];
  params: number[];
  variant: number;
}

export interface ComputeTasks {
  /** Compiles a plant, finds its poles and its open-loop step over the suggested horizon in `samples` steps. */
  plantPreview: { input: { model: Plant; samples: number }; output: PlantPreview };
  /** A candidate's closed-loop response r, y, u on one variant with the sweep's scenario, downsampled. */
  candidateResponse: { input: CandidateTaskInput; output: { t: number[]; r: number[]; y: number[]; u: number[] } };
  /** |S|, |T| (and 1/|W|) of a candidate's loop on one linear variant, thinned. */
  candidateFrequency: { input: CandidateTaskInput & { weight?: SensitivityWeight }; output: ThinFrequencyResponse };
  /** A sweep's bound curve and tuning-rule baselines (sweep-references-task.ts). */
  sweepReferences: { input: SweepReferencesInput; output: ReferencesDto };
  /** A design's deployment sheet at the reader's sample time, method and format (buildDeploymentSheet). */
  deploymentSheet: { input: { design: DeploymentDesign; request: DeploymentSheetRequest }; output: DeploymentSheetDto };
  /** A design's step response and |S(jω)| on every variant, for the decision record's plots (designCurves). */
  designCurves: { input: { design: DeploymentDesign }; output: DesignCurves };
  /** A tuning rule's controller of a sweep scored on every variant (baseline-scores-task.ts), for a decision's record. */
  baselineScores: { input: BaselineScoresInput; output: BaselineScores };
}

export type ComputeTaskName = keyof ComputeTasks;

/** The message a compute worker receives. */
export interface ComputeRequest<K extends ComputeTaskName = ComputeTaskName> {
  task: K;
  input: ComputeTasks[K]["input"];
  budget: WorkBudget;
}

const TASKS: { [K in ComputeTaskName]: (input: ComputeTasks[K]["input"]) => ComputeTasks[K]["output"] } = {
  plantPreview({ model, samples }) {
    if (model.kind === "nonlinear") nonlinearPlantModel(model);
    const horizon = suggestHorizon(model);
    const poles = plantPoles(model);
    const { t, y } = openLoopStep(model, horizon, horizon / samples);
    const indices = downsampleIndices(t.length);
    return { poles: poles.map(({ re, im }) => ({ re, im })), step: { t: pick(t, indices), y: pick(y, indices) } };
  },
  candidateResponse(input) {
    const { plant, controller, plan } = candidateLoop(input);
    const trace = simulateLoop(plant, controller, plan.scenario);
    const indices = downsampleIndices(trace.t.length);
    return { t: pick(trace.t, indices), r: pick(trace.r, indices), y: pick(trace.y, indices), u: pick(trace.u, indices) };
  },
  candidateFrequency(input) {
    const { plant, controller } = candidateLoop(input);
    if (plant.kind === "nonlinear") throw new RangeError("the frequency response needs a linear plant");
    const response = frequencyResponse(loopTransferFunction(plant as LinearPlant, controller), input.weight ? { weight: input.weight } : {});
    return thinFrequencyResponse(response);
  },
  sweepReferences,
  deploymentSheet: ({ design, request }) => buildDeploymentSheet(design, request),
  designCurves: ({ design }) => designCurves(design),
  baselineScores,
};

function candidateLoop({ definition, models, params, variant }: CandidateTaskInput) {
  const plan = planSweep(definition, models);
  const plant = plan.family[variant];
  if (!plant) throw new RangeError(`variant ${variant} is not in the sweep's family of ${plan.family.length}`);
  return { plan, plant, controller: plan.controllerFromParameters(params) };
}

/**
 * Runs one named task under its budget. Core's refusals (RangeError, TypeError, the expression
 * compiler's errors, SweepPlanError) and IllPosedLoopError become a ComputeFailure with their
 * sentence; anything else is a bug and is rethrown.
 */
export function runComputeTask<K extends ComputeTaskName>(request: ComputeRequest<K>): ComputeOutcome<ComputeTasks[K]["output"]> {
  const task = TASKS[request.task] as ((input: ComputeTasks[K]["input"]) => ComputeTasks[K]["output"]) | undefined;
  if (!task) throw new RangeError(`there is no compute task "${String(request.task)}"`);
  try {
    const done = withWorkBudget(request.budget, () => task(request.input));
    return done.ok ? { ok: true, value: done.value } : { ok: false, kind: "budget", reason: done.reason };
  } catch (error) {
    if (error instanceof IllPosedLoopError) return { ok: false, kind: "ill-posed", reason: error.message };
    if (error instanceof ExpressionError || error instanceof DeclaredNameError || error instanceof SweepPlanError || error instanceof DeploymentSheetError) {
      const field = (error as { field?: string }).field;
      const invalid = error instanceof DeploymentSheetError && error.kind === "invalid";
      return { ok: false, kind: "refused", reason: error.message, error: invalid ? "DeploymentSheetInvalid" : error.name, ...(field ? { field } : {}) };
    }
    if (error instanceof RangeError || error instanceof TypeError) return { ok: false, kind: "refused", reason: error.message, error: error.name };
    throw error;
  }
}
