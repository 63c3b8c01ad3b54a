// Micro-benchmark (not a test): compiled expressions against hand-written JavaScript.
// Run from the repository root:  npx tsx packages/core/src/expressions/expression-speed.bench.mts
// Prints nanoseconds per call and the ratio compiled / hand-written for each case.
import { compileExpression } from "./compile-expression.js";
import { compileSystem } from "./compile-system.js";

const CALLS = 20_000_000;
const ROUNDS = 5;

const tank = compileExpression("(-a*sqrt(h) + b*u)/A", { states: ["h"], parameters: ["a", "b", "A"] });
const tankByHand = (x: Float64Array, p: Float64Array, u: number, _t: number): number =>
  (-p[0] * Math.sqrt(x[0]) + p[1] * u) / p[2];

const cascade = compileSystem({
  states: ["h1", "h2"],
  parameters: ["a1", "a2", "b", "A1", "A2"],
  derivatives: ["(-a1*sqrt(h1) + b*u)/A1", "(a1*sqrt(h1) - a2*sqrt(h2))/A2"],
  output: "h2",
});
const cascadeByHand = (_t: number, x: Float64Array, p: Float64Array, u: number, dx: Float64Array): void => {
  const d0 = (-p[0] * Math.sqrt(x[0]) + p[2] * u) / p[3];
  const d1 = (p[0] * Math.sqrt(x[0]) - p[1] * Math.sqrt(x[1])) / p[4];
  dx[0] = d0;
  dx[1] = d1;
};

function timeScalar(f: (x: Float64Array, p: Float64Array, u: number, t: number) => number): { ns: number; sink: number } {
  const x = new Float64Array(1);
  const p = Float64Array.of(0.5, 2, 10);
  let sink = 0;
  const start = process.hrtime.bigint();
  for (let i = 0; i < CALLS; i += 1) {
    x[0] = 1 + (i & 1023) * 0.001;
    sink += f(x, p, (i & 7) * 0.125, 0);
  }
  return { ns: Number(process.hrtime.bigint() - start) / CALLS, sink };
}

function timeSystem(f: (t: number, x: Float64Array, p: Float64Array, u: number, dx: Float64Array) => void): { ns: number; sink: number } {
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
  return { ns: Number(process.hrtime.bigint() - start) / CALLS, sink };
}

function best(run: () => { ns: number; sink: number }): number {
  let fastest = Infinity;
  for (let r = 0; r < ROUNDS; r += 1) {
    const { ns, sink } = run();
    if (!Number.isFinite(sink)) throw new Error("non-finite sink");
    fastest = Math.min(fastest, ns);
  }
  return fastest;
}

const rows: Array<[string, number, number]> = [
  ["tank derivative (scalar)", best(() => timeScalar(tank)), best(() => timeScalar(tankByHand))],
  ["two-tank system (in place)", best(() => timeSystem(cascade.derivatives)), best(() => timeSystem(cascadeByHand))],
];
console.log(`node ${process.version}, ${CALLS} calls, best of ${ROUNDS}`);
for (const [name, compiled, byHand] of rows) {
  console.log(`${name.padEnd(28)} compiled ${compiled.toFixed(2)} ns/call   hand-written ${byHand.toFixed(2)} ns/call   ratio ${(compiled / byHand).toFixed(2)}`);
}
