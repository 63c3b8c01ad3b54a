import type { ComputeLimits, ComputeTaskName } from "@loopyard/core/pool";

/**
 * Work budget and time limit of each compute task a request may start. The budgets count
 * right-hand-side evaluations of the nonlinear integrator (linear plants use none: their cost is
 * bounded by the schemas' sizes). An ordinary nonlinear plant's step over 600 samples needs a few
 * thousand to tens of thousands of evaluations; the budgets leave an order of magnitude above that
 * and stop a stiff model long before it could hold a thread for minutes.
 */
export const COMPUTE_LIMITS: Record<ComputeTaskName, ComputeLimits> = {
  plantPreview: { budget: { evaluations: 1_000_000 }, timeLimitMs: 8_000 },
  candidateResponse: { budget: { evaluations: 2_000_000 }, timeLimitMs: 10_000 },
  // The frequency response integrates nothing; its adaptive grid is bounded by the time limit.
  candidateFrequency: { budget: { evaluations: 1_000 }, timeLimitMs: 10_000 },
  // Every tuning rule scored on every variant: several closed-loop simulations per variant.
  sweepReferences: { budget: { evaluations: 20_000_000 }, timeLimitMs: 30_000 },
  // A deployment sheet: per variant one continuous evaluation and two sampled re-simulations
  // (linear plants: bounded by MAX_SIMULATION_SAMPLES per run), plus the stability verdicts.
  deploymentSheet: { budget: { evaluations: 4_000_000 }, timeLimitMs: 20_000 },
  // A design's curves for a printed record: one closed-loop simulation and one frequency response per variant.
  designCurves: { budget: { evaluations: 4_000_000 }, timeLimitMs: 15_000 },
  // One tuning rule scored on every variant: one closed-loop simulation per variant.
  baselineScores: { budget: { evaluations: 4_000_000 }, timeLimitMs: 15_000 },
};

/** Worker threads of the web server's compute pool (the sweep worker has its own pool). */
export const COMPUTE_THREADS = 2;
