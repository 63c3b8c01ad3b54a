// Quick B1 speed measurement (not a test): 1/(s+1)^3, PID with tf = kd/(10·kp), unit setpoint step,
// horizon 30 s, dt 0.01, criteria IAE, ISE, ITAE, effort, candidates from a fixed seed, one core.
// Run after building core: node packages/core/scripts/measure-b1.mjs [count]
import { evaluateCandidate } from "../dist/index.js";

const count = Number(process.argv[2] ?? 20000);
let state = 12345;
const rand = () => {
  state = (state + 0x6d2b79f5) >>> 0;
  let t = state;
  t = Math.imul(t ^ (t >>> 15), t | 1);
  t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
  return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
};
const plant = { kind: "transfer-function", num: [1], den: [1, 3, 3, 1], delay: 0 };
const scenario = { kind: "setpoint-step", horizon: 30, dt: 0.01 };
const criteria = ["iae", "ise", "itae", "effort"];
const candidates = [];
for (let i = 0; i < count; i++) {
  const kp = 0.1 + 3 * rand();
  const ki = 0.05 + 1.5 * rand();
  const kd = 2 * rand();
  candidates.push({ kind: "pid", kp, ki, kd, tf: kd / (10 * kp) });
}
for (let i = 0; i < 500; i++) evaluateCandidate(plant, candidates[i], scenario, criteria, { poles: false });
const start = process.hrtime.bigint();
let stable = 0;
for (const c of candidates) if (evaluateCandidate(plant, c, scenario, criteria, { poles: false }).status === "stable") stable++;
const seconds = Number(process.hrtime.bigint() - start) / 1e9;
console.log(`${count} candidates (${stable} stable) in ${seconds.toFixed(3)} s: ${(count / seconds).toFixed(0)} candidates/s`);
