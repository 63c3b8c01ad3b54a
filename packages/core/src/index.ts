// Public surface of @loopyard/core. Every export is named here; types are kept apart.

// Contracts: schemas and constants shared with server and web.
export { MAX_PLANT_ORDER, transferFunctionSchema } from "./plants/transfer-function.js";
export { plantModelSchema } from "./plants/plant.js";
export { plantInputSchema } from "./schemas/plant-input.js";
export { SLUG_PATTERN, memberInputSchema, workspaceInputSchema, workspaceNameSchema } from "./schemas/workspace-input.js";
export { textField, hasForbiddenControl, isWellFormedText } from "./schemas/text.js";
export type { TextFieldConfig } from "./schemas/text.js";
export { CRITERION_IDS } from "./criteria/criterion-id.js";
export {
  DEFAULT_MAX_CONCURRENT_SWEEPS,
  MAX_FAMILY_VARIANTS,
  MAX_TITLE_LENGTH,
  MAX_SEARCH_GENERATIONS,
  MAX_SEARCH_ITERATIONS,
  MAX_SEARCH_POPULATION,
  MAX_SEARCH_STARTS,
  MAX_SIMULATION_SAMPLES,
  MAX_STATE_FEEDBACK_GAINS,
  MAX_SWEEP_CANDIDATES,
  MAX_SWEEP_PARAMETERS,
  MIN_PASSWORD_LENGTH,
} from "./limits.js";
export { DEFAULT_DERIVATIVE_FILTER, derivativeFilterSchema } from "./controllers/derivative-filter.js";
export {
  CONTROLLER_PARAMETERS,
  REFERENCE_GAIN_PARAMETER,
  SAMPLE_TIME_PARAMETER,
  STATE_GAIN_PARAMETER,
  controllerParameter,
  satisfiesSign,
} from "./controllers/controller-parameters.js";

// The sweep contract: one definition schema, one plan, one chunk evaluation (web, server, CLI, comparisons).
export { planSweep, plantStateCount, variantPlant, controllerParameterValue } from "./sweeps/plan-sweep.js";
export { evaluateSweepChunk, evaluateSweepChunkWith } from "./sweeps/evaluate-sweep-chunk.js";
export { SweepPlanError } from "./sweeps/sweep-plan-error.js";
export { dottedField, firstSweepIssue, sweepIssues } from "./sweeps/sweep-issue.js";
export { searchBudget } from "./sweeps/search-budget.js";
export { searchObjectiveMatrix } from "./search/search-objectives.js";
export { createSweepSearch, runSweepSearch } from "./sweeps/sweep-search.js";
export { MAX_FREQUENCY_POINTS, PLOT_TAIL_GAIN, thinFrequencyResponse } from "./frequency/thin-frequency-response.js";
export { MAX_TRACE_POINTS, downsampleIndices, pick } from "./traces/downsample-trace.js";
export {
  DEFAULT_SWEEP_CRITERIA,
  checkSweepDefinition,
  sweepDefinitionFields,
  withDefaultFilter,
  parameterRangeSchema,
  sweepInputSchema,
  sweepScenarioSchema,
  criterionOptionsSchema,
  parameterSign,
  sweepStructure,
  sweepParameterNames,
  sweepCandidateCount,
  sweepCandidates,
  sweepSpace,
  sweepDesignSchema,
  sweepAggregateSchema,
  sweepFamilySchema,
  UnsupportedDesignError,
} from "./sweeps/sweep-input.js";
export { ROLES, hasRole, canCancelSweep } from "./api/roles.js";
export { POINTS_BINARY_TYPE, decodePointsBinary, encodePointsBinary, pointsBinaryLayout } from "./api/points-binary.js";
export type { PointsBinaryColumns, PointsHeader } from "./api/points-binary.js";
// Comparisons over the API: the submitted input (family by plant revisions) and the DTOs.
export { comparisonInputSchema } from "./api/comparison-input.js";
export type { ComparisonInput } from "./api/comparison-input.js";
export type * from "./api/comparison-dto.js";
// Proposals and decisions: request bodies, DTOs and the versioned decision record.
export {
  BASELINE_RULE_IDS,
  BASELINE_VARIANT_IDS,
  DECISION_RECORD_FORMAT,
  DECISION_RECORD_VERSION,
  DECISION_STATES,
  FROZEN_DECISION_STATES,
  MAX_COMMENT_LENGTH,
  MAX_RATIONALE_LENGTH,
  SAFETY_CAUTION,
  decisionCommentSchema,
  decisionListQuerySchema,
  decisionProposalSchema,
  decisionRecordSchema,
  decisionReturnSchema,
  decisionSettingsSchema,
  decisionSourceSchema,
  decisionStateSchema,
  isFrozenDecision,
  readDecisionRecord,
} from "./schemas/decision.js";
export type {
  DecisionCommentDto,
  DecisionCommentInput,
  DecisionContent,
  DecisionDetailDto,
  DecisionEventDto,
  DecisionEventKind,
  DecisionFamilyDto,
  DecisionListItemDto,
  DecisionPermissionsDto,
  DecisionProposal,
  DecisionProposalInput,
  DecisionRecord,
  DecisionRecordComparison,
  DecisionRecordIssue,
  DecisionRecordVariant,
  DecisionReturn,
  DecisionSettingsDto,
  DecisionSettingsInput,
  DecisionSource,
  DecisionState,
  DecisionVariantDto,
  DecisionWaitingDto,
} from "./schemas/decision.js";
// Mail: the kinds of message, notification settings and the outbox over the API.
export {
  ACCOUNT_MAIL_KINDS,
  MAIL_KINDS,
  MAIL_KIND_LABELS,
  SECRET_MAIL_KINDS,
  isAccountMailKind,
  isMailKind,
  notificationSettingsInputSchema,
} from "./api/mail-kinds.js";
export type {
  AccountMailKind,
  MailKind,
  NotificationSettingDto,
  NotificationSettingsDto,
  NotificationSettingsInput,
  OutboxDto,
  OutboxMessageDto,
  OutboxMessageSummaryDto,
} from "./api/mail-kinds.js";

// Linear algebra.
export { polynomialRoots } from "./linear-algebra/polynomial-roots.js";
export { polynomialAdd } from "./linear-algebra/polynomial-add.js";
export { polynomialMultiply } from "./linear-algebra/polynomial-multiply.js";
export { polynomialEvaluate } from "./linear-algebra/polynomial-evaluate.js";
export { trimLeadingZeros } from "./linear-algebra/polynomial-trim.js";
export { balanceMatrix } from "./linear-algebra/balance-matrix.js";
export { expm } from "./linear-algebra/expm.js";
export { discretizeZoh } from "./linear-algebra/discretize-zoh.js";

// Plants.
export { normalizeTransferFunction } from "./plants/normalize-transfer-function.js";
export { transferFunctionToStateSpace } from "./plants/transfer-function-to-state-space.js";
export { plantPoles } from "./plants/plant-poles.js";
export { openLoopStep } from "./plants/open-loop-step.js";
export { suggestHorizon } from "./plants/suggest-horizon.js";
export { DELAY_PADE_ORDER, padeDelay } from "./plants/pade-delay.js";

// Controllers.
export { assertValidPid } from "./controllers/assert-valid-pid.js";
export { pidStateSpace } from "./controllers/pid-state-space.js";
export { pidTransferFunction } from "./controllers/pid-transfer-function.js";
export { pidFromIdealForm, pidToIdealForm } from "./controllers/pid-ideal-form.js";

// Simulation.
export { timeGrid } from "./simulation/time-grid.js";
export {
  closedLoopCharacteristicPolynomial,
  characteristicPolynomial,
} from "./simulation/closed-loop-characteristic-polynomial.js";
export { closedLoopPoles } from "./simulation/closed-loop-poles.js";
export { STABILITY_TOLERANCE, isStable } from "./simulation/is-stable.js";
export { steadyStateInput, steadyStateOutput } from "./simulation/steady-state-input.js";
export { IllPosedLoopError, WELL_POSEDNESS_TOLERANCE, isWellPosedLoop } from "./simulation/ill-posed-loop-error.js";
export { simulateLoop } from "./simulation/simulate-loop.js";
export { evaluateCandidate } from "./evaluation/evaluate-candidate.js";

// Criteria.
export { iae, iaeCriterion } from "./criteria/iae.js";
export { ise, iseCriterion } from "./criteria/ise.js";
export { itae, itaeCriterion } from "./criteria/itae.js";
export { effort, effortCriterion } from "./criteria/effort.js";
export { itse, itseCriterion } from "./criteria/itse.js";
export { QUADRATIC_DEFAULT_Q, QUADRATIC_DEFAULT_R, quadratic, quadraticCriterion } from "./criteria/quadratic.js";
export { rawEffort, rawEffortCriterion } from "./criteria/raw-effort.js";
export { tv, tvCriterion } from "./criteria/tv.js";
export { upeak, upeakCriterion } from "./criteria/upeak.js";
export { overshoot, overshootCriterion } from "./criteria/overshoot.js";
export { undershoot, undershootCriterion } from "./criteria/undershoot.js";
export { RISE_HIGH_FRACTION, RISE_LOW_FRACTION, riseTime, riseTimeCriterion } from "./criteria/rise-time.js";
export { DEFAULT_SETTLING_BAND, settlingTime, settlingTimeCriterion } from "./criteria/settling-time.js";
export { steadyStateError, steadyStateErrorCriterion } from "./criteria/steady-state-error.js";
export { loadRecoveryTime, loadRecoveryTimeCriterion } from "./criteria/load-recovery-time.js";
export { stepReference } from "./criteria/step-reference.js";
export { ms, msCriterion } from "./criteria/ms.js";
export { mt, mtCriterion } from "./criteria/mt.js";
export { gainMargin, gainMarginCriterion } from "./criteria/gain-margin.js";
export { phaseMargin, phaseMarginCriterion } from "./criteria/phase-margin.js";
export { crossoverFrequency, crossoverFrequencyCriterion } from "./criteria/crossover-frequency.js";
export { bandwidth, bandwidthCriterion } from "./criteria/bandwidth.js";
export { wsNorm, wsNormCriterion } from "./criteria/ws-norm.js";
export { CRITERIA } from "./criteria/registry.js";
export { criterionSense, orientForMinimisation } from "./criteria/criterion-sense.js";

// Frequency domain: L, S, T on an adaptive grid; peaks, crossovers, bandwidth, weights.
export {
  BANDWIDTH_LEVEL,
  PHASE_CROSSOVER_MIN_GAIN,
  POINTS_PER_DECADE,
  frequencyResponse,
  sensitivityTail,
} from "./frequency/frequency-response.js";
export { loopFrequencyResponse } from "./frequency/frequency-response-cache.js";
export { frequencySpan } from "./frequency/frequency-span.js";
export { weightedSensitivityPeak } from "./frequency/weighted-sensitivity-peak.js";
export { assertValidWeight } from "./frequency/sensitivity-weight.js";
export { performanceWeight } from "./frequency/performance-weight.js";
export { sensitivityWeightSchema } from "./frequency/sensitivity-weight-schema.js";

// Expressions (nonlinear plants typed as text).
export { compileExpression } from "./expressions/compile-expression.js";
export { compileSystem } from "./expressions/compile-system.js";
export { checkExpression, EXPRESSION_LIMITS } from "./expressions/check-expression.js";
export { ExpressionError, isExpressionError } from "./expressions/expression-error.js";
export { DeclaredNameError, isDeclaredNameError } from "./expressions/declared-name-error.js";
export { createNameScope, DEFAULT_INPUT_NAME, MAX_NAME_LENGTH } from "./expressions/name-scope.js";
export { EXPRESSION_FUNCTIONS, EXPRESSION_FUNCTION_NAMES, isExpressionFunctionName } from "./expressions/expression-functions.js";

// Stability: Routh–Hurwitz for rational loops, Nyquist for loops with dead time.
export { ROUTH_EPSILON, ROUTH_ZERO_TOLERANCE, routhHurwitz } from "./stability/routh-hurwitz.js";
export { isHurwitz } from "./stability/is-hurwitz.js";
export { evaluateLoop } from "./stability/evaluate-loop.js";
export { assertValidLoop } from "./stability/assert-valid-loop.js";
export { nyquistStability } from "./stability/nyquist-stability.js";

// Sweeps and fronts.
export { gridCandidates } from "./sweeps/grid-candidates.js";
export { paretoFront } from "./fronts/pareto-front.js";
export { nonDominatedSort } from "./fronts/non-dominated-sort.js";
export { AGGREGATE_KINDS, aggregateScores, percentileType7 } from "./aggregates/aggregate-scores.js";
export { NM_ALPHA, NM_GAMMA, NM_RHO, NM_SIGMA, NelderMeadSimplex, nelderMead } from "./search/nelder-mead.js";
export { createNelderMeadSearch, multiStartNelderMead } from "./search/nelder-mead-search.js";
export { crowdingDistance } from "./search/crowding-distance.js";
export { CROSSOVER_PROBABILITY, POLYNOMIAL_ETA_M, SBX_ETA_C, polynomialMutation, sbxCrossover } from "./search/variation-operators.js";
export { createNsga2Search } from "./search/nsga2-search.js";

// Batch evaluation: structures, designs, evaluateBatch (the worker pool is the separate Node-only entry "@loopyard/core/pool").
export {
  OPTIONAL_STRUCTURE_PARAMETERS,
  STRUCTURE_PARAMETERS,
  StructureError,
  assertValidStructure,
  controllerFromVector,
  stateFeedbackNames,
  structureParameterNames,
} from "./batch/structure.js";
export { assertValidSpace, axisValue } from "./batch/parameter-space.js";
export { createSeededRandom } from "./batch/seeded-random.js";
export { DEFAULT_MAX_CANDIDATES, gridDesign } from "./batch/grid-design.js";
export { latinHypercube, latinHypercubeUnit } from "./batch/latin-hypercube.js";
export { seededRandomDesign } from "./batch/random-design.js";
export { SOBOL_BITS, SOBOL_MAX_DIMENSION, SOBOL_MAX_POINTS, sobolDesign, sobolDirections, sobolUnit } from "./batch/sobol-design.js";
export { JOE_KUO_DIRECTION_ROWS } from "./batch/sobol-direction-numbers.js";
export { BATCH_STATUSES, STATUS_DIVERGED, STATUS_INVALID, STATUS_STABLE, STATUS_UNSTABLE, batchStatusName } from "./batch/batch-status.js";
export { evaluateBatch } from "./batch/evaluate-batch.js";


// Engine: plant kinds, controller structures, scenarios, loop simulation.
export { actuatorLimitsSchema, hasActuatorLimits } from "./plants/actuator-limits.js";
export { stateSpaceSchema } from "./plants/state-space.js";
export { MAX_NONLINEAR_STATES, nonlinearSchema } from "./plants/nonlinear.js";
export { linearPlantModel } from "./plants/linear-plant-model.js";
export { nonlinearPlantModel, linearizeNonlinearPlant } from "./plants/nonlinear-plant-model.js";
export { stateSpaceToTransferFunction } from "./plants/state-space-to-transfer-function.js";
export { CONTROLLER_KINDS, CONTROLLER_RULES, antiWindupSchema, controllerSchema } from "./controllers/controller.js";
export { controllerRealization, antiWindupTrackingTime, assertValidController } from "./controllers/controller-realization.js";
export { controllerTransferFunction } from "./controllers/controller-transfer-function.js";
export { discretizeZohInputs } from "./linear-algebra/discretize-zoh-inputs.js";
export { solveLinear } from "./linear-algebra/solve-linear.js";
export { resolveScenario } from "./simulation/resolve-scenario.js";
export { gaussianNoise } from "./simulation/gaussian-noise.js";
export { DormandPrince, DEFAULT_TOLERANCE } from "./simulation/dormand-prince.js";
export { WorkBudgetError, withWorkBudget } from "./simulation/work-budget.js";
export type { Budgeted, WorkBudget } from "./simulation/work-budget.js";
export { continuousClosedLoop, closedLoopSteadyState, LOOP_INPUTS } from "./simulation/continuous-closed-loop.js";
export { runExactLoop, scoreExactSetpointLoop, FAST_CRITERIA } from "./simulation/exact-loop.js";
export { runGridLoop } from "./simulation/grid-loop.js";
export { runJointLoop } from "./simulation/joint-loop.js";
export { DIVERGENCE_FACTOR, divergenceBound } from "./simulation/loop-bound.js";
export { loopTransferFunction } from "./simulation/loop-transfer-function.js";
export { isContinuousLoopStable, isLoopStable, loopVerdict } from "./evaluation/evaluate-candidate.js";
export type { LoopVerdict } from "./evaluation/evaluate-candidate.js";
export { isSchurStable } from "./stability/schur-cohn.js";
export { sampledLoopStability, splitDelay } from "./stability/sampled-loop-stability.js";
export type { SampledLoop, SampledLoopVerdict } from "./stability/sampled-loop-stability.js";
export { isEquilibrium, linearizedLoopStability } from "./stability/linearized-loop-stability.js";


// Optimal control: Lyapunov and Riccati solvers, exact quadratic costs, the LQR bound and its curve.
export { MAX_LYAPUNOV_ORDER, solveLyapunov } from "./optimal/solve-lyapunov.js";
export { CARE_RESIDUAL_LIMIT, solveCare } from "./optimal/solve-care.js";
export { solveRde } from "./optimal/solve-rde.js";
export { exactQuadraticCosts } from "./optimal/exact-quadratic-costs.js";
export { lqrBound } from "./optimal/lqr-bound.js";
export { DEFAULT_BOUND_RATIOS, boundCurve } from "./optimal/bound-curve.js";

// Baselines: published tuning rules from the plant model (tuning/).
export { CANCELLATION_TOLERANCE, plantFactors } from "./tuning/plant-factors.js";
export { REAL_ROOT_TOLERANCE, ROOT_CLUSTER_TOLERANCE, halfRule, halfRuleFopdt, halfRuleSopdt } from "./tuning/fopdt-half-rule.js";
export { PHASE_SEARCH_POINTS_PER_DECADE, ultimatePoint } from "./tuning/ultimate-point.js";
export { DEFAULT_FILTER_DIVISOR, tunedFromIdeal } from "./tuning/tuned-pid.js";
export {
  ZN_P_GAIN,
  ZN_PI_GAIN,
  ZN_PI_INTEGRAL_DIVISOR,
  ZN_PID_GAIN,
  ZN_PID_INTEGRAL_DIVISOR,
  ZN_PID_DERIVATIVE_DIVISOR,
  zieglerNichols,
} from "./tuning/ziegler-nichols.js";
export { SIMC_INTEGRAL_FACTOR, SIMC_DELAY_FREE_TAU_C_FRACTION, seriesToIdeal, simcDefaultTauC, simcPi, simcPid } from "./tuning/simc.js";
export { amigoPi, amigoPid } from "./tuning/amigo.js";
export { defaultLambda, imcPid, lambdaPi } from "./tuning/lambda-imc.js";
export { BASELINE_RULES, baselines } from "./tuning/baselines.js";
export { scoreBaselines } from "./tuning/score-baselines.js";
export { scoreFamilyBaselines } from "./evaluation/score-family-baselines.js";
export { familyBoundCurve } from "./evaluation/family-bound-curve.js";
export type { FamilyBoundCurve } from "./evaluation/family-bound-curve.js";

export type { TransferFunctionPlant } from "./plants/transfer-function.js";
export type { Plant, PlantKind } from "./plants/plant.js";
export type { PlantInput, PlantInputParsed } from "./schemas/plant-input.js";
export type { MemberInput, WorkspaceInput } from "./schemas/workspace-input.js";
export type { PidController } from "./controllers/pid.js";
export type { CriterionId } from "./criteria/criterion-id.js";
export type { DerivativeFilter } from "./controllers/derivative-filter.js";
export type { ControllerParameter, FixedParameterKind, ParameterSign } from "./controllers/controller-parameters.js";
export type { SweepPlan } from "./sweeps/plan-sweep.js";
export type { SweepBatch, SweepBatchEvaluator, SweepChunk, SweepRow, SweepRowStatus, SweepSelection } from "./sweeps/evaluate-sweep-chunk.js";
export type { SweepIssue } from "./sweeps/sweep-issue.js";
export type { SearchBudgetDesign } from "./sweeps/search-budget.js";
export type { SweepSearch } from "./sweeps/sweep-search.js";
export type { ThinFrequencyResponse } from "./frequency/thin-frequency-response.js";
export type {
  ParameterRange,
  SweepShape,
  SweepInput,
  SweepInputParsed,
  SweepDesign,
  SweepAggregate,
  SweepFamily,
} from "./sweeps/sweep-input.js";
export type { Role } from "./api/roles.js";
export type { Complex } from "./linear-algebra/complex.js";
export type * from "./api/dto.js";
export type { SisoStateSpace, DiscreteSisoStateSpace } from "./linear-algebra/siso-state-space.js";
export type { NormalizedTransferFunction } from "./plants/normalize-transfer-function.js";
export type { IdealPidParameters } from "./controllers/pid-ideal-form.js";
export type { LoopTrace } from "./simulation/loop-trace.js";
export type { Scenario, ScenarioKind, SetpointStepScenario, LoadStep, MeasurementNoise } from "./simulation/scenario.js";
export type { CandidateEvaluation } from "./evaluation/evaluate-candidate.js";
export type { CriterionDefinition, CriterionKind, CriterionOptions } from "./criteria/criterion-definition.js";
export type { QuadraticWeights } from "./criteria/quadratic.js";
export type { CompiledExpression } from "./expressions/compile-expression.js";
export type { CompiledSystem, ExpressionSystemConfig } from "./expressions/compile-system.js";
export type { CheckedExpression, CheckedNode, UnaryOperator, BinaryOperator } from "./expressions/check-expression.js";
export type { NameRole } from "./expressions/declared-name-error.js";
export type { ExpressionNames, NameScope, NameBinding } from "./expressions/name-scope.js";
export type { ExpressionFunction, ExpressionFunctionName } from "./expressions/expression-functions.js";
export type { Structure } from "./batch/structure.js";
export type { ParameterAxis, ParameterScale, ParameterSpace } from "./batch/parameter-space.js";
export type { BatchStatus } from "./batch/batch-status.js";
export type { BatchOptions, BatchResult, EvaluationOptions } from "./batch/evaluate-batch.js";
export type { SobolOptions } from "./batch/sobol-design.js";
export type { Aggregate } from "./aggregates/aggregate-scores.js";
export type { NelderMeadResult, SimplexOptions } from "./search/nelder-mead.js";
export type { MultiStartResult, NelderMeadSearch, NelderMeadSearchOptions } from "./search/nelder-mead-search.js";
export type { Nsga2Front, Nsga2Options, Nsga2Search } from "./search/nsga2-search.js";
export type { SobolDirectionRow } from "./batch/sobol-direction-numbers.js";
export type { RouthHurwitzResult, RouthSpecialCase } from "./stability/routh-hurwitz.js";
export type { LoopTransferFunction } from "./stability/evaluate-loop.js";
export type { NyquistVerdict } from "./stability/nyquist-stability.js";
export type { ActuatorLimits } from "./plants/actuator-limits.js";
export type { StateSpacePlant } from "./plants/state-space.js";
export type { NonlinearPlant } from "./plants/nonlinear.js";
export type { LinearPlant } from "./plants/plant.js";
export type { LinearPlantModel } from "./plants/linear-plant-model.js";
export type { NonlinearPlantModel } from "./plants/nonlinear-plant-model.js";
export type {
  AntiWindup,
  Controller,
  ControllerCommon,
  ControllerKind,
  PController,
  PiController,
  PidControllerSpec,
  Pid2dofController,
  LeadLagController,
  StateFeedbackController,
} from "./controllers/controller.js";
export type { ControllerRealization } from "./controllers/controller-realization.js";
export type { ResolvedScenario } from "./simulation/resolve-scenario.js";
export type { DormandPrinceTolerance } from "./simulation/dormand-prince.js";
export type { ContinuousClosedLoop } from "./simulation/continuous-closed-loop.js";
export type { GridLoopConfig, GridPlant } from "./simulation/grid-loop.js";
export type { JointLoopConfig } from "./simulation/joint-loop.js";
export type { EvaluateCandidateOptions } from "./evaluation/evaluate-candidate.js";
export type { ComplexSamples, FrequencyResponse, FrequencyResponseOptions } from "./frequency/frequency-response.js";
export type { FrequencyPeak } from "./frequency/grid-peak.js";
export type { FrequencySpan } from "./frequency/frequency-span.js";
export type { SensitivityWeight } from "./frequency/sensitivity-weight.js";
export type { PerformanceWeightConfig } from "./frequency/performance-weight.js";
export type { LyapunovSolution } from "./optimal/solve-lyapunov.js";
export type { CareResult, CareSolution } from "./optimal/solve-care.js";
export type { RdeResult } from "./optimal/solve-rde.js";
export type { ExactCostScenario, ExactQuadraticCosts } from "./optimal/exact-quadratic-costs.js";
export type { LqrBound, LqrBoundOptions } from "./optimal/lqr-bound.js";
export type { BoundCurve, BoundCurvePoint } from "./optimal/bound-curve.js";
export type { PlantFactors } from "./tuning/plant-factors.js";
export type { FopdtModel, SopdtModel, HalfRuleFit } from "./tuning/fopdt-half-rule.js";
export type { UltimatePoint } from "./tuning/ultimate-point.js";
export type { IdealGains, TunedPid } from "./tuning/tuned-pid.js";
export type { ZieglerNicholsVariant } from "./tuning/ziegler-nichols.js";
export type { SeriesGains, SimcTuning } from "./tuning/simc.js";
export type { LambdaTuning } from "./tuning/lambda-imc.js";
export type { Baseline, BaselineModel, BaselineOptions, BaselineRule, BaselineVariant } from "./tuning/baselines.js";
export type { ScoredBaseline, ScoreBaselinesOptions } from "./tuning/score-baselines.js";

// Comparison of criteria (comparison/): contenders' picks, cross-score, agreement, stability, summary.
export {
  DEFAULT_COMPARISON_BUDGET,
  MAX_COMPARISON_PARAMETERS,
  MAX_CONTENDERS,
  MAX_PRESCAN,
  MIN_PRESCAN,
  comparisonBudgetSchema,
  comparisonDefinitionSchema,
  comparisonSpecSchema,
  constraintSchema,
  contenderKey,
  contenderSchema,
  definitionIssue,
  quadraticContenderSchema,
} from "./comparison/comparison-definition.js";
export { baseCriteriaOf, planComparison, refinementCriteria } from "./comparison/comparison-plan.js";
export { aggregateRows, comparisonRows, isFeasible, meetsConstraint } from "./comparison/comparison-rows.js";
export { assemblePrescan, evaluatePrescanChunk, prescanChunk, prescanVectors } from "./comparison/prescan.js";
export { AT_BOUND_TOLERANCE, missingPick, scorePick } from "./comparison/comparison-pick.js";
export {
  REFINE_F_TOLERANCE,
  REFINE_MAX_STEP,
  REFINE_MIN_STEP,
  REFINE_X_TOLERANCE,
  createPickRefinement,
  pickStarts,
  refinePick,
  runPickRefinement,
} from "./comparison/pick-refinement.js";
export { reconcilePicks } from "./comparison/reconcile-picks.js";
export { crossScore, regretPercent } from "./comparison/cross-score.js";
export {
  WEIGHT_FACTORS,
  checkStability,
  createStabilityRefinements,
  rescorePick,
  stabilityEntry,
  stabilityVariations,
  variationLabel,
  variationPlan,
} from "./comparison/comparison-stability.js";
export { comparisonAgreement } from "./comparison/comparison-agreement.js";
export { kendallTau, kendallTauMatrix } from "./comparison/kendall-tau.js";
export { ACTIVE_CONSTRAINT_FRACTION, comparisonSummary } from "./comparison/comparison-summary.js";
export { analyseComparison } from "./comparison/analyse-comparison.js";
export { DEFAULT_PRESCAN_CHUNK, evaluateInProcess, runComparison } from "./comparison/run-comparison.js";
export {
  checkComparisonSweepFields,
  comparisonAggregateSchema,
  comparisonFamilySchema,
  comparisonSetup,
  comparisonSweepFields,
  designVectors,
  evaluateVectors,
  familyVariants,
  vectorsBatch,
  withComparisonDefaults,
} from "./comparison/sweep-adapter.js";
export type {
  ComparisonBudget,
  ComparisonDefinition,
  ComparisonDefinitionInput,
  ComparisonSpec,
  Contender,
  QuadraticContender,
} from "./comparison/comparison-definition.js";
export type { ComparisonColumn, ComparisonConstraint, ComparisonPlan } from "./comparison/comparison-plan.js";
export type { ComparisonRows } from "./comparison/comparison-rows.js";
export type { PrescanChunk, PrescanResult } from "./comparison/prescan.js";
export type { ComparisonPick, PickBound } from "./comparison/comparison-pick.js";
export type { PickRefinement, PickRefinementOptions, RefinementRequest } from "./comparison/pick-refinement.js";
export type { CrossScore } from "./comparison/cross-score.js";
export type { StabilityEntry, StabilityPick, StabilityVariation } from "./comparison/comparison-stability.js";
export type { Agreement } from "./comparison/comparison-agreement.js";
export type { PrescanCounts } from "./comparison/comparison-summary.js";
export type { ComparisonAnalysis, PickVariants } from "./comparison/analyse-comparison.js";
export type { ComparisonEvaluator, ComparisonPhase, RunComparisonOptions } from "./comparison/run-comparison.js";
export type { ComparisonFamilySpec, ComparisonSetup, ComparisonSweepFields, ComparisonVariant } from "./comparison/sweep-adapter.js";
// Step-test identification (identification/): read a CSV/TSV step test, fit FOPDT, SOPDT or IPDT.
export { StepTestFileError, isStepTestFileError } from "./identification/step-test-file-error.js";
export { MAX_STEP_TEST_ROWS, parseStepTestTable, cellNumber } from "./identification/parse-step-test-table.js";
export { MIN_STEP_TEST_ROWS, TIME_UNITS, readStepTest } from "./identification/read-step-test.js";
export { prepareStepTest } from "./identification/prepare-step-test.js";
export { SMITH_HIGH_FRACTION, SMITH_LOW_FRACTION, SMITH_TAU_FACTOR, twoPointEstimate } from "./identification/two-point-estimate.js";
export { rampEstimate } from "./identification/ramp-estimate.js";
export { FOPDT, IPDT, SOPDT, STEP_MODELS, STEP_MODEL_KINDS } from "./identification/step-model.js";
export { studentTQuantile } from "./identification/student-t-quantile.js";
export { CONFIDENCE_LEVEL, MAX_SEARCH_SAMPLES, fitStepModel } from "./identification/fit-step-model.js";
export { identifyStepTest } from "./identification/identify-step-test.js";
export type { StepTestTable } from "./identification/parse-step-test-table.js";
export type { StepTest, StepTestColumn, StepTestColumnInfo, StepTestReadOptions, TimeUnit } from "./identification/read-step-test.js";
export type { PreparedStepTest, StepTestPrepareOptions } from "./identification/prepare-step-test.js";
export type { TwoPointEstimate } from "./identification/two-point-estimate.js";
export type { RampEstimate } from "./identification/ramp-estimate.js";
export type { IdentifiedTransferFunction, StepModel, StepModelKind } from "./identification/step-model.js";
export type { StepModelFit } from "./identification/fit-step-model.js";
export type { Identification, IdentifyOptions } from "./identification/identify-step-test.js";

// Deployment sheet numerics (deployment/): PID forms, difference equations, fixed point, sampled loop.
export { continuousController, deployablePid } from "./deployment/deployable-pid.js";
export { pidForms } from "./deployment/pid-forms.js";
export { DISCRETE_PID_COEFFICIENTS, DISCRETIZATION_METHODS } from "./deployment/discrete-pid.js";
export { discretizePid } from "./deployment/discretize-pid.js";
export { DISCRETE_PID_MEMORY, advanceDiscretePid, initialDiscretePidState, packDiscretePidState, stepDiscretePid } from "./deployment/step-discrete-pid.js";
export { FIXED_POINT_FORMATS, roundToFixedPoint } from "./deployment/fixed-point.js";
export { simulateSampledLoop } from "./deployment/simulate-sampled-loop.js";
export { deploymentSheet } from "./deployment/deployment-sheet.js";
export { differenceEquations } from "./deployment/difference-equations.js";
export { sampledCriteria } from "./deployment/sampled-criteria.js";
export { discretePidRealization } from "./deployment/discrete-pid-realization.js";
export { DEPLOYMENT_CAUTION, DeploymentSheetError } from "./deployment/deployment-design.js";
export { buildDeploymentSheet, MAX_SAMPLE_TIME_FRACTION } from "./deployment/build-deployment-sheet.js";
export { discreteControllerLoopStability } from "./stability/sampled-loop-stability.js";
export type { DeploymentDesign, DeploymentSheetRequest, DeploymentVariant } from "./deployment/deployment-design.js";
export type { DiscreteStateSpaceController } from "./stability/sampled-loop-stability.js";
export type * from "./api/deployment-sheet-dto.js";
export { designCurves, RECORD_CURVE_POINTS } from "./deployment/design-curves.js";
export { recordDesign } from "./deployment/record-design.js";
export type { DesignCurves, VariantCurves } from "./deployment/design-curves.js";
export { candidateCsvHeader, criterionColumn, csvNumber, parameterColumn, withUnit } from "./api/csv-columns.js";
export type { DeployablePid } from "./deployment/deployable-pid.js";
export type { PidForm, PidForms, SeriesPidParameters } from "./deployment/pid-forms.js";
export type { DiscretePid, DiscretePidCoefficients, DiscretizationMethod } from "./deployment/discrete-pid.js";
export type { DiscretizePidOptions } from "./deployment/discretize-pid.js";
export type { DiscretePidState, DiscretePidStep } from "./deployment/step-discrete-pid.js";
export type { FixedPointCoefficient, FixedPointFormat, FixedPointOptions, FixedPointReport, FixedPointScaling } from "./deployment/fixed-point.js";
export type { DeploymentSheet, DeploymentSheetOptions } from "./deployment/deployment-sheet.js";
export type { SampledCriteria, SampledScores } from "./deployment/sampled-criteria.js";
