// `npm run bench` (not a test): throughput of the batch engine on 1 and 2 worker threads.
//   B1: 1/(s+1)³ with a PID (tf = kd/(10·kp)), unit setpoint step, horizon 30 s, dt 0.01 s,
//       IAE, ISE, ITAE, effort; 20 000 candidates drawn from a fixed seed.
//   B2: the same design and scenario on a nonlinear plant typed as expressions: a tank with
//       Torricelli outflow, A·h' = u − a·√h, y = h, around the operating point h = 1 (u = a),
//       actuator limited to 0 ≤ u ≤ 3 (back-calculation anti-windup by default).
//   B3: a damped pendulum with torque input, m·l²·θ'' = u − m·g·l·sin θ − b·θ', under a filtered PID
//       (kp ∈ [3, 10], ki ∈ [1, 6], kd ∈ [0.5, 2], tf = 0.1 s), unit setpoint step, horizon 20 s,
//       dt 0.01 s, on the joint Runge–Kutta loop; also the largest relative error of IAE over 40
//       candidates against odex at rtol 1e-10 on the closed loop written out by hand.
// Prints candidates/s on 1 and 2 workers (plus in-process, one thread, for reference), whether the
// results agree byte for byte across worker counts, and the peak memory of the process. When gcc is
// on the path, B1 is also given as a ratio to the C floor /work/shared/bench/b1-floor.c (or
// $LOOPYARD_B1_FLOOR_C) compiled with gcc -O2 and run in the same session.
import { execFileSync } from "node:child_process";
import { existsSync, mkdtempSync } from "node:fs";
import { createRequire } from "node:module";
import { availableParallelism, cpus, tmpdir } from "node:os";
import { join } from "node:path";
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

/** B3: pendulum parameters [kg, m, m/s², N·m·s], its PID box and scenario. */
const PENDULUM = { m: 1, l: 0.5, g: 9.81, b: 0.2 };
const PENDULUM_PLANT: Plant = {
  kind: "nonlinear",
  states: ["th", "w"],
  parameters: PENDULUM,
  derivatives: ["w", "(u - m*g*l*sin(th) - b*w)/(m*l^2)"],
  output: "th",
  initial: [0, 0],
};
const PENDULUM_SPACE: ParameterSpace = [
  { name: "kp", min: 3, max: 10 },
  { name: "ki", min: 1, max: 6 },
  { name: "kd", min: 0.5, max: 2 },
];
const PENDULUM_TF = 0.1;
const PENDULUM_STRUCTURE: Structure = { kind: "pid", tunable: ["kp", "ki", "kd"], fixed: { tf: PENDULUM_TF } };
const PENDULUM_SCENARIO: Scenario = { kind: "setpoint-step", horizon: 20, dt: 0.01 };
/** Candidates whose IAE is checked against odex (each reference takes a fraction of a second). */
const B3_REFERENCE_COUNT = 40;

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

/**
 * IAE of the pendulum loop by odex (Gragg–Bulirsch–Stoer; E. Hairer and G. Wanner's ODEX) at rtol
 * 1e-10, ∫|e| carried as an extra state: the closed loop written out by hand (states θ, ω, x_i, x_d;
 * u = ki·x_i − (kd/tf²)·x_d + (kp + kd/tf)·e), independent of the engine.
 */
function pendulumIae(kp: number, ki: number, kd: number, tf: number, horizon: number): number {
  const { m, l, g, b } = PENDULUM;
  const odex = createRequire(import.meta.url)("odex") as {
    Solver: new (n: number) => { absoluteTolerance: number; relativeTolerance: number; solve(f: (t: number, y: number[]) => number[], t0: number, y0: number[], t1: number): { y: number[] } };
  };
  const solver = new odex.Solver(5);
  solver.absoluteTolerance = 1e-12;
  solver.relativeTolerance = 1e-10;
  const f = (_t: number, z: number[]): number[] => {
    const e = 1 - z[0];
    const u = ki * z[2] - (kd / (tf * tf)) * z[3] + (kp + kd / tf) * e;
    return [z[1], (u - m * g * l * Math.sin(z[0]) - b * z[1]) / (m * l * l), e, -z[3] / tf + e, Math.abs(e)];
  };
  return solver.solve(f, 0, [0, 0, 0, 0, 0], horizon).y[4];
}

/** B3: rate of the pendulum batch in process (one thread) and the worst relative IAE error against odex. */
function runPendulum(count: number): void {
  const candidates = seededRandomDesign(PENDULUM_SPACE, count, SEED);
  evaluateBatch([PENDULUM_PLANT], PENDULUM_STRUCTURE, candidates.subarray(0, 3 * 200).slice(), PENDULUM_SCENARIO, CRITERIA);
  const start = performance.now();
  const result = evaluateBatch([PENDULUM_PLANT], PENDULUM_STRUCTURE, candidates, PENDULUM_SCENARIO, CRITERIA);
  const rate = count / ((performance.now() - start) / 1000);
  sampleMemory();
  let worst = 0;
  let checked = 0;
  for (let i = 0; i < count && checked < B3_REFERENCE_COUNT; i++) {
    if (result.status[i] !== 0) continue;
    const [kp, ki, kd] = candidates.subarray(3 * i, 3 * i + 3);
    const reference = pendulumIae(kp, ki, kd, PENDULUM_TF, PENDULUM_SCENARIO.horizon);
    worst = Math.max(worst, Math.abs(result.scores[i * CRITERIA.length] - reference) / reference);
    checked++;
  }
  const stable = result.status.reduce((n, s) => n + (s === 0 ? 1 : 0), 0);
  console.log(`B3 pendulum m·l²·θ'' = u − m·g·l·sin θ − b·θ', filtered PID (tf 0.1 s), horizon 20 s, dt 0.01 s: ${count} candidates (${stable} stable)`);
  console.log(`  in process, 1 thread : ${Math.round(rate).toLocaleString("en-US")} candidates/s`);
  console.log(`  IAE against odex (rtol 1e-10), ${checked} candidates: largest relative error ${worst.toExponential(2)}`);
}

/** Candidates/s of the C floor of B1 compiled with gcc -O2, or null when gcc or the source is missing. */
function cFloorRate(): number | null {
  const source = process.env.LOOPYARD_B1_FLOOR_C ?? "/work/shared/bench/b1-floor.c";
  if (!existsSync(source)) return null;
  try {
    const binary = join(mkdtempSync(join(tmpdir(), "loopyard-bench-")), "b1-floor");
    execFileSync("gcc", ["-O2", "-o", binary, source, "-lm"], { stdio: "ignore" });
    const out = execFileSync(binary, { encoding: "utf8" });
    const match = /([0-9.]+) candidates\/s/.exec(out);
    return match ? Number(match[1]) : null;
  } catch {
    return null;
  }
}

async function run(label: string, plant: Plant, count: number): Promise<number> {
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
  return inProcess;
}

async function main(): Promise<void> {
  console.log(`loopyard bench — Node ${process.version}, ${availableParallelism()} CPUs (${cpus()[0]?.model ?? "unknown"})`);
  const b1 = await run("B1 1/(s+1)^3, PID, horizon 30 s, dt 0.01 s, IAE ISE ITAE effort", CUBIC, CANDIDATES);
  const floor = cFloorRate();
  if (floor !== null) {
    console.log(`  C floor (b1-floor.c, gcc -O2, this session): ${Math.round(floor).toLocaleString("en-US")} candidates/s; B1 in process = ${(b1 / floor).toFixed(2)}× of it (15,000/s ≈ 0.8×)`);
  }
  await run("B2 tank A·h' = u − a·√h (0 ≤ u ≤ 3), PID, same scenario and criteria", TANK, Number(process.env.LOOPYARD_BENCH_B2_CANDIDATES ?? CANDIDATES));
  runPendulum(Number(process.env.LOOPYARD_BENCH_B3_CANDIDATES ?? 5000));
  const maxRssMb = process.resourceUsage().maxRSS / 1024;
  console.log(`peak memory: maxRSS ${maxRssMb.toFixed(0)} MB (resourceUsage), sampled RSS ${(peakRss / 2 ** 20).toFixed(0)} MB, sampled heap ${(peakHeap / 2 ** 20).toFixed(0)} MB (main thread)`);
}

main().catch((error: unknown) => {
  console.error(error);
  process.exitCode = 1;
});
