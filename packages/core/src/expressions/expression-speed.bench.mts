// Micro-benchmark (not a test): compiled expressions against hand-written JavaScript.
// Run from the repository root:  npx tsx packages/core/src/expressions/expression-speed.bench.mts
// Each measurement runs in its own process (clean JIT state, monomorphic call sites);
// prints nanoseconds per call (best of ROUNDS) and the ratio compiled / hand-written.
import { spawnSync } from "node:child_process";
import { fileURLToPath } from "node:url";
import { compileExpression } from "./compile-expression.js";
import { compileSystem } from "./compile-system.js";

const CALLS = 20_000_000;
const ROUNDS = 5;

type Scalar = (x: Float64Array, p: Float64Array, u: number, t: number) => number;
type System = (t: number, x: Float64Array, p: Float64Array, u: number, dx: Float64Array) => void;

function tankCompiled(): Scalar {
  return compileExpression("(-a*sqrt(h) + b*u)/A", { states: ["h"], parameters: ["a", "b", "A"] });
}
function tankByHand(): Scalar {
  return (x, p, u) => (-p[0] * Math.sqrt(x[0]) + p[1] * u) / p[2];
}
function cascadeCompiled(): System {
  return compileSystem({
    states: ["h1", "h2"],
    parameters: ["a1", "a2", "b", "A1", "A2"],
    derivatives: ["(-a1*sqrt(h1) + b*u)/A1", "(a1*sqrt(h1) - a2*sqrt(h2))/A2"],
    output: "h2",
  }).derivatives;
}
function cascadeByHand(): System {
  return (_t, x, p, u, dx) => {
    const d0 = (-p[0] * Math.sqrt(x[0]) + p[2] * u) / p[3];
    const d1 = (p[0] * Math.sqrt(x[0]) - p[1] * Math.sqrt(x[1])) / p[4];
    dx[0] = d0;
    dx[1] = d1;
  };
}

function timeScalar(f: Scalar): number {
  const x = new Float64Array(1);
  const p = Float64Array.of(0.5, 2, 10);
  let sink = 0;
  const start = process.hrtime.bigint();
  for (let i = 0; i < CALLS; i += 1) {
    x[0] = 1 + (i & 1023) * 0.001;
    sink += f(x, p, (i & 7) * 0.125, 0);
  }
  const ns = Number(process.hrtime.bigint() - start) / CALLS;
  if (!Number.isFinite(sink)) throw new Error("non-finite result");
  return ns;
}

function timeSystem(f: System): number {
  const x = new Float64Array(2);
  const dx = new Float64Array(2);
  const p = Float64Array.of(0.5, 0.25, 2, 10, 5);
  let sink = 0;
  const start = process.hrtime.bigint();
  for (let i = 0; i < CALLS; i += 1) {
    x[0] = 1 + (i & 1023) * 0.001;
    x[1] = 2 - (i & 511) * 0.001;
    f(0, x, p, (i & 7) * 0.125, dx);
    sink += dx[0] + dx[1];
  }
  const ns = Number(process.hrtime.bigint() - start) / CALLS;
  if (!Number.isFinite(sink)) throw new Error("non-finite result");
  return ns;
}

const MEASUREMENTS: Record<string, () => number> = {
  "tank-compiled": () => timeScalar(tankCompiled()),
  "tank-hand": () => timeScalar(tankByHand()),
  "cascade-compiled": () => timeSystem(cascadeCompiled()),
  "cascade-hand": () => timeSystem(cascadeByHand()),
};

const which = process.argv[2];
if (which !== undefined) {
  const measure = MEASUREMENTS[which];
  let best = Infinity;
  for (let r = 0; r < ROUNDS; r += 1) best = Math.min(best, measure());
  console.log(best.toFixed(3));
} else {
  const self = fileURLToPath(import.meta.url);
  const run = (name: string): number => {
    const child = spawnSync(process.execPath, [...process.execArgv, self, name], { encoding: "utf8" });
    if (child.status !== 0) throw new Error(`${name} failed: ${child.stderr}`);
    return Number(child.stdout.trim());
  };
  console.log(`node ${process.version}, ${CALLS} calls per round, best of ${ROUNDS}, one process per measurement`);
  for (const [label, key] of [["tank derivative (scalar)", "tank"], ["two-tank system (in place)", "cascade"]] as const) {
    const compiled = run(`${key}-compiled`);
    const byHand = run(`${key}-hand`);
    console.log(`${label.padEnd(28)} compiled ${compiled.toFixed(2)} ns/call   hand-written ${byHand.toFixed(2)} ns/call   ratio ${(compiled / byHand).toFixed(2)}`);
  }
}
