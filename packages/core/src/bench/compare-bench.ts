// `npm run bench` (not a test): the comparison of criteria.
//   C1: Kendall τ_b between 8 criteria over 100,000 candidates (kendallTauMatrix: 28 pairs).
//   C2: a whole comparison in process on the worker pool (2 workers): a 5-variant family of
//       third-order lags K/(τs+1)³, PID with filter tf = kd/(10·kp), unit setpoint step, 30 s at
//       dt = 0.01 s, four contenders (IAE, ITAE, J(r=0.1), J(r=1)), five judges (overshoot,
//       settling time, peak |u|, TV(u), Ms), worst case, the default budget (256 pre-scan points,
//       3 starts × 120 evaluations per contender, stability on: 5 variants left out, 2 weights × 2).
// Prints the times, the evaluations spent per phase and the picks; the same seed gives the same picks.
import { availableParallelism, cpus, loadavg } from "node:os";
import { comparisonDefinitionSchema } from "../comparison/comparison-definition.js";
import { planComparison } from "../comparison/comparison-plan.js";
import { kendallTauMatrix } from "../comparison/kendall-tau.js";
import { runComparison, type ComparisonPhase } from "../comparison/run-comparison.js";
import { vectorsBatch } from "../comparison/sweep-adapter.js";
import { createSeededRandom } from "../batch/seeded-random.js";
import type { Plant } from "../plants/plant.js";
import { createEvaluationPool } from "../pool/evaluation-pool.js";

const TAU_CANDIDATES = 100_000;
const TAU_CRITERIA = 8;
const WORKERS = Number(process.env.LOOPYARD_BENCH_WORKERS ?? 2);

/** Eight correlated columns with ties (two are rounded to a coarse grid), like criteria over a sweep. */
function tauColumns(): Float64Array[] {
  const random = createSeededRandom(8);
  const base = Float64Array.from({ length: TAU_CANDIDATES }, () => random());
  return Array.from({ length: TAU_CRITERIA }, (_, c) =>
    Float64Array.from(base, (v) => {
      const value = (c % 2 === 0 ? v : -v) + 0.3 * c * random();
      return c >= 6 ? Math.round(value * 20) / 20 : value;
    }),
  );
}

function benchKendall(): void {
  const columns = tauColumns();
  kendallTauMatrix(columns.map((c) => c.subarray(0, 1000))); // warm-up
  const times: number[] = [];
  const cpuTimes: number[] = [];
  for (let rep = 0; rep < 3; rep++) {
    const start = performance.now();
    const cpu = process.cpuUsage();
    kendallTauMatrix(columns);
    const used = process.cpuUsage(cpu);
    times.push(performance.now() - start);
    cpuTimes.push((used.user + used.system) / 1000);
  }
  const median = (v: number[]) => [...v].sort((a, b) => a - b)[1] / 1000;
  console.log(
    `C1 Kendall τ_b, ${TAU_CRITERIA} criteria × ${TAU_CANDIDATES.toLocaleString("en-US")} candidates (28 pairs): ${median(times).toFixed(3)} s wall, ${median(cpuTimes).toFixed(3)} s CPU (medians of 3; target ≤ 1 s)`,
  );
}

const FAMILY: { name: string; plant: Plant }[] = [
  [1, 1],
  [0.8, 0.8],
  [1.2, 1.1],
  [1, 1.3],
  [1.3, 0.9],
].map(([k, tau], i) => ({
  name: `v${i + 1}`,
  plant: { kind: "transfer-function", num: [k], den: [tau ** 3, 3 * tau ** 2, 3 * tau, 1], delay: 0 },
}));

const DEFINITION = comparisonDefinitionSchema.parse({
  structure: "pid",
  ranges: { kp: { min: 0.2, max: 5, scale: "log" }, ki: { min: 0.05, max: 2, scale: "log" }, kd: { min: 0.05, max: 3, scale: "log" } },
  filter: { mode: "ratio", n: 10 },
  scenario: { kind: "setpoint-step", horizon: 30, dt: 0.01 },
  aggregate: { kind: "worst" },
  contenders: ["iae", "itae", { criterion: "quadratic", r: 0.1, label: "J(r=0.1)" }, { criterion: "quadratic", r: 1, label: "J(r=1)" }],
  judges: ["overshoot", "settlingTime", "upeak", "tv", "ms"],
  seed: 2026,
});

async function benchComparison(): Promise<void> {
  const plan = planComparison(DEFINITION, FAMILY);
  const pool = createEvaluationPool({ workers: WORKERS });
  try {
    // Warm-up: start the threads and load the engine in them before timing.
    await pool.evaluate(vectorsBatch(plan.setup, Float64Array.of(1, 0.3, 0.5, 1.2, 0.4, 0.6), ["iae"]), { chunkSize: 1 });
    const phases: Partial<Record<ComparisonPhase, { evaluations: number; end: number }>> = {};
    const start = performance.now();
    const cpuStart = process.cpuUsage();
    const analysis = await runComparison(
      plan,
      (request) => {
        const n = request.vectors.length / request.setup.structure.tunable.length;
        return pool.evaluate(vectorsBatch(request.setup, request.vectors, request.criteria), { chunkSize: Math.max(1, Math.ceil(n / WORKERS)) });
      },
      { onProgress: (phase, evaluations) => (phases[phase] = { evaluations, end: performance.now() }) },
    );
    const seconds = (performance.now() - start) / 1000;
    const cpu = process.cpuUsage(cpuStart);
    console.log(`C2 comparison, 5 variants, PID with filter, 30 s at dt 0.01 s, 4 contenders, 5 judges, worst case, pool of ${WORKERS}: ${seconds.toFixed(2)} s (target ≤ 10 s; CPU of all threads ${((cpu.user + cpu.system) / 1e6).toFixed(1)} s)`);
    let previous = { evaluations: 0, end: start };
    for (const phase of ["prescan", "refine", "stability"] as const) {
      const p = phases[phase];
      if (!p) continue;
      console.log(`  ${phase.padEnd(9)} ${(p.evaluations - previous.evaluations).toLocaleString("en-US").padStart(7)} candidate·variant evaluations in ${((p.end - previous.end) / 1000).toFixed(2)} s`);
      previous = p;
    }
    for (const pick of analysis.picks) {
      const params = Object.entries(pick.params).map(([k, v]) => `${k} ${v.toPrecision(4)}`).join(", ");
      const bound = pick.atBound.length > 0 ? ` (on the box: ${pick.atBound.map((b) => `${b.parameter} ${b.bound}`).join(", ")})` : "";
      console.log(`  pick of ${pick.contender.padEnd(9)} ${params}${bound}, ${pick.evaluations} evaluations${pick.converged ? "" : ", budget ran out"}`);
    }
    for (const sentence of analysis.summary) console.log(`  · ${sentence}`);
  } finally {
    await pool.close();
  }
}

async function main(): Promise<void> {
  console.log(`loopyard compare bench — Node ${process.version}, ${availableParallelism()} CPUs (${cpus()[0]?.model ?? "unknown"}), load average ${loadavg()[0].toFixed(1)}`);
  benchKendall();
  await benchComparison();
}

main().catch((error: unknown) => {
  console.error(error);
  process.exitCode = 1;
});
