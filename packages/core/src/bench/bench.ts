// `npm run bench` (not a test): throughput of the batch engine on 1 and 2 worker threads.
//   B1: 1/(s+1)³ with a PID (tf = kd/(10·kp)), unit setpoint step, horizon 30 s, dt 0.01 s,
//       IAE, ISE, ITAE, effort; 20 000 candidates drawn from a fixed seed.
//   B2: the same design and scenario on a nonlinear plant typed as expressions: a tank with
//       Torricelli outflow, A·h' = u − a·√h, y = h, around the operating point h = 1 (u = a),
//       actuator limited to 0 ≤ u ≤ 3 (back-calculation anti-windup by default).
// Prints candidates/s on 1 and 2 workers (plus in-process, one thread, for reference), whether the
// results agree byte for byte across worker counts, and the peak memory of the process.
import { availableParallelism, cpus } from "node:os";
import { seededRandomDesign } from "../batch/random-design.js";
import { evaluateBatch, type BatchResult } from "../batch/evaluate-batch.js";
import type { ParameterSpace } from "../batch/parameter-space.js";
import type { Structure } from "../batch/structure.js";
import type { CriterionId } from "../criteria/criterion-id.js";
import type { Plant } from "../plants/plant.js";
import type { Scenario } from "../simulation/scenario.js";
import { createEvaluationPool } from "../pool/evaluation-pool.js";

/** Seed of the candidate design (fixed, so every run evaluates the same candidates). */
const SEED = 20_000;
const CANDIDATES = Number(process.env.LOOPYARD_BENCH_CANDIDATES ?? 20_000);
const SPACE: ParameterSpace = [
  { name: "kp", min: 0.2, max: 3 },
  { name: "ki", min: 0.05, max: 1.5 },
  { name: "kd", min: 0, max: 2 },
];
const STRUCTURE: Structure = { kind: "pid", tunable: ["kp", "ki", "kd"], fixed: {}, filter: { mode: "ratio", n: 10 } };
const SCENARIO: Scenario = { kind: "setpoint-step", horizon: 30, dt: 0.01 };
const CRITERIA: CriterionId[] = ["iae", "ise", "itae", "effort"];
const CUBIC: Plant = { kind: "transfer-function", num: [1], den: [1, 3, 3, 1], delay: 0 };
const TANK: Plant = {
  kind: "nonlinear",
  states: ["h"],
  parameters: { area: 1, a: 0.5 },
  derivatives: ["(u - a*sqrt(abs(h)))/area"],
  output: "h",
  initial: [1],
  operatingInput: 0.5,
  actuator: { min: 0, max: 3 },
};

/** Peak memory, sampled: resident set and heap of this process (worker threads share it). */
let peakRss = 0;
let peakHeap = 0;
function sampleMemory(): void {
  const m = process.memoryUsage();
  peakRss = Math.max(peakRss, m.rss);
  peakHeap = Math.max(peakHeap, m.heapUsed);
}

function bytesOf(r: BatchResult): Buffer {
  return Buffer.concat([Buffer.from(r.status.buffer, r.status.byteOffset, r.status.byteLength), Buffer.from(r.scores.buffer, r.scores.byteOffset, r.scores.byteLength)]);
}

async function timePool(workers: number, family: Plant[], candidates: Float64Array): Promise<{ rate: number; result: BatchResult }> {
  const pool = createEvaluationPool({ workers });
  try {
    // Warm-up: start the threads and let the JIT compile the hot path before timing.
    await pool.evaluate({ family, structure: STRUCTURE, candidates: candidates.subarray(0, 3 * 1000 * workers).slice(), scenario: SCENARIO, criteria: CRITERIA });
    const timer = setInterval(sampleMemory, 50);
    const start = performance.now();
    const result = await pool.evaluate({ family, structure: STRUCTURE, candidates, scenario: SCENARIO, criteria: CRITERIA });
    const seconds = (performance.now() - start) / 1000;
    clearInterval(timer);
    sampleMemory();
    return { rate: candidates.length / 3 / seconds, result };
  } finally {
    await pool.close();
  }
}

function timeInProcess(family: Plant[], candidates: Float64Array): number {
  evaluateBatch(family, STRUCTURE, candidates.subarray(0, 3 * 1000).slice(), SCENARIO, CRITERIA);
  const start = performance.now();
  evaluateBatch(family, STRUCTURE, candidates, SCENARIO, CRITERIA);
  sampleMemory();
  return candidates.length / 3 / ((performance.now() - start) / 1000);
}

async function run(label: string, plant: Plant, count: number): Promise<void> {
  const candidates = seededRandomDesign(SPACE, count, SEED);
  const inProcess = timeInProcess([plant], candidates);
  const one = await timePool(1, [plant], candidates);
  const two = await timePool(2, [plant], candidates);
  const stable = one.result.status.reduce((n, s) => n + (s === 0 ? 1 : 0), 0);
  console.log(`${label}: ${count} candidates (${stable} stable)`);
  console.log(`  in process, 1 thread : ${Math.round(inProcess).toLocaleString("en-US")} candidates/s`);
  console.log(`  pool, 1 worker       : ${Math.round(one.rate).toLocaleString("en-US")} candidates/s`);
  console.log(`  pool, 2 workers      : ${Math.round(two.rate).toLocaleString("en-US")} candidates/s (×${(two.rate / one.rate).toFixed(2)})`);
  console.log(`  1 and 2 workers give the same bytes: ${bytesOf(one.result).equals(bytesOf(two.result)) ? "yes" : "NO"}`);
}

async function main(): Promise<void> {
  console.log(`loopyard bench — Node ${process.version}, ${availableParallelism()} CPUs (${cpus()[0]?.model ?? "unknown"})`);
  await run("B1 1/(s+1)^3, PID, horizon 30 s, dt 0.01 s, IAE ISE ITAE effort", CUBIC, CANDIDATES);
  await run("B2 tank A·h' = u − a·√h (0 ≤ u ≤ 3), PID, same scenario and criteria", TANK, Number(process.env.LOOPYARD_BENCH_B2_CANDIDATES ?? CANDIDATES));
  const maxRssMb = process.resourceUsage().maxRSS / 1024;
  console.log(`peak memory: maxRSS ${maxRssMb.toFixed(0)} MB (resourceUsage), sampled RSS ${(peakRss / 2 ** 20).toFixed(0)} MB, sampled heap ${(peakHeap / 2 ** 20).toFixed(0)} MB (main thread)`);
}

main().catch((error: unknown) => {
  console.error(error);
  process.exitCode = 1;
});
