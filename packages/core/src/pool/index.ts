// @loopyard/core/pool — the Node-only entry (worker threads). The main entry stays browser-safe.
export { chunkSizeFor, createEvaluationPool, DEFAULT_CHUNK_SIZE, MAX_WORKERS } from "./evaluation-pool.js";
export type { EvaluationPool, EvaluationPoolConfig, PoolBatch, PoolRunOptions } from "./evaluation-pool.js";
export { createComputePool } from "./compute-pool.js";
export type { ComputeLimits, ComputePool, ComputePoolConfig } from "./compute-pool.js";
export { runComputeTask } from "./compute-tasks.js";
export type { CandidateTaskInput, ComputeFailure, ComputeOutcome, ComputeRequest, ComputeTaskName, ComputeTasks, PlantPreview } from "./compute-tasks.js";
export type { SweepReferencesInput } from "./sweep-references-task.js";
export type { BaselineScores, BaselineScoresInput } from "./baseline-scores-task.js";
