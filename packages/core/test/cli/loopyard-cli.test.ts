import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { ensureDist } from "../support/ensure-dist.js";
import { expectOneSentence, runLoopyard as loopyard } from "../support/run-loopyard.js";

// These tests spawn the built CLI (node packages/core/dist/cli/main.js), building dist first when
// it is missing or stale.
beforeAll(() => ensureDist(), 200_000);

const dir = mkdtempSync(join(tmpdir(), "loopyard-cli-"));
function specFile(name: string, spec: unknown): string {
  const path = join(dir, name);
  writeFileSync(path, typeof spec === "string" ? spec : JSON.stringify(spec));
  return path;
}

const TAU = 2;
const K = 3;
const FIRST_ORDER_P = {
  plant: { kind: "transfer-function", num: [1], den: [TAU, 1], delay: 0 },
  controller: { kind: "p", kp: K },
  scenario: { kind: "setpoint-step", horizon: 20, dt: 0.001 },
  criteria: ["iae", "ise"],
};

describe("loopyard evaluate", () => {
  it("loopyard evaluate on a first-order P loop prints the closed-form IAE and ISE", async () => {
    // Closed form: G = 1/(τs + 1) under u = K·e, unit setpoint step from rest:
    //   y(t) = K/(1+K)·(1 − e^(−t/τ')),  τ' = τ/(1+K),  so  e(t) = a + b·e^(−t/τ'),  a = 1/(1+K), b = K/(1+K) > 0.
    // e > 0, hence IAE(T) = ∫₀ᵀ e dt = a·T + b·τ'·(1 − e^(−T/τ')); for T → ∞ the transient part tends to
    // b·τ' = K·τ/(1+K)² while a·T grows without bound (the P loop keeps its offset a).
    //   ISE(T) = a²T + 2ab·τ'(1 − e^(−T/τ')) + b²·τ'/2·(1 − e^(−2T/τ')).
    // The trapezoidal rule on dt = 1e-3 errs by about dt²/12·|e'(0)| = 1.25e-7.
    const { code, stdout, stderr } = await loopyard(["evaluate", specFile("p.json", FIRST_ORDER_P)]);
    expect(stderr).toBe("");
    expect(code).toBe(0);
    const out = JSON.parse(stdout) as { status: string; poles: { re: number; im: number }[]; criteria: Record<string, number> };
    const T = 20;
    const tauCl = TAU / (1 + K);
    const a = 1 / (1 + K);
    const b = K / (1 + K);
    const iae = a * T + b * tauCl * (1 - Math.exp(-T / tauCl));
    const ise = a * a * T + 2 * a * b * tauCl * (1 - Math.exp(-T / tauCl)) + ((b * b * tauCl) / 2) * (1 - Math.exp((-2 * T) / tauCl));
    expect(out.status).toBe("stable");
    expect(Object.keys(out.criteria)).toEqual(["iae", "ise"]);
    expect(Math.abs(out.criteria.iae - iae)).toBeLessThan(1e-6);
    expect(Math.abs(out.criteria.ise - ise)).toBeLessThan(1e-6);
    // The transient part of the IAE, b·τ' = Kτ/(1+K)² = 0.375, is what remains after removing a·T.
    expect(out.criteria.iae - a * T).toBeCloseTo((K * TAU) / (1 + K) ** 2, 6);
    // Closed-loop pole s = −(1+K)/τ = −2.
    expect(out.poles).toHaveLength(1);
    expect(out.poles[0].re).toBeCloseTo(-(1 + K) / TAU, 10);
  });

  it("loopyard evaluate - reads the spec from standard input and prints Infinity as \"inf\"", async () => {
    // Closed-loop time constant τ' = 0.5 s: the 2 % band is reached at τ'·ln(50) ≈ 1.96 s (closed
    // form of e(t) above), after the 1 s horizon, so the settling time is not reached: Infinity.
    const spec = { ...FIRST_ORDER_P, scenario: { kind: "setpoint-step", horizon: 1, dt: 0.001 }, criteria: ["settlingTime"] };
    const { code, stdout } = await loopyard(["evaluate", "-"], JSON.stringify(spec));
    expect(code).toBe(0);
    expect(JSON.parse(stdout).criteria).toEqual({ settlingTime: "inf" });
  });

  it("loopyard evaluate on an unstable loop prints status unstable and null criteria", async () => {
    // 1/(s+1)³ under P control is unstable for K > 8 (Routh: a2·a1 > a0 ⇔ 9 > 1 + K).
    const spec = { ...FIRST_ORDER_P, plant: { kind: "transfer-function", num: [1], den: [1, 3, 3, 1], delay: 0 }, controller: { kind: "p", kp: 9 } };
    const { code, stdout } = await loopyard(["evaluate", specFile("unstable.json", spec)]);
    expect(code).toBe(0);
    const out = JSON.parse(stdout);
    expect(out.status).toBe("unstable");
    expect(out.criteria).toBeNull();
    expect(out.poles.some((p: { re: number }) => p.re > 0)).toBe(true);
  });

  it("when the plant's leading denominator coefficient is zero, then exit 2 with one sentence naming plant.den", async () => {
    const spec = { ...FIRST_ORDER_P, plant: { kind: "transfer-function", num: [1], den: [0, 1], delay: 0 } };
    const { code, stdout, stderr } = await loopyard(["evaluate", specFile("den.json", spec)]);
    expect(code).toBe(2);
    expect(stdout).toBe("");
    expectOneSentence(stderr, "plant.den: ");
  });

  it("when a key is misspelt or a criterion unknown, then exit 2 naming the field", async () => {
    const { plant, ...rest } = FIRST_ORDER_P;
    let run = await loopyard(["evaluate", specFile("typo.json", { ...rest, plnat: plant })]);
    expect(run.code).toBe(2);
    expectOneSentence(run.stderr, "plnat: unknown field");
    run = await loopyard(["evaluate", specFile("crit.json", { ...FIRST_ORDER_P, criteria: ["iae", "speed"] })]);
    expect(run.code).toBe(2);
    expectOneSentence(run.stderr, "criteria[1]: ");
  });

  it("when the file is missing, then exit 2 with one sentence", async () => {
    const { code, stderr } = await loopyard(["evaluate", join(dir, "nowhere.json")]);
    expect(code).toBe(2);
    expectOneSentence(stderr, "nowhere.json: no such file");
  });

  it("when the file is not valid JSON, then exit 2 with one sentence giving the line", async () => {
    const { code, stderr } = await loopyard(["evaluate", specFile("bad.json", '{\n  "plant": { "kind": "transfer-function", },\n}')]);
    expect(code).toBe(2);
    expectOneSentence(stderr, "bad.json: not valid JSON");
    expect(stderr).toContain("line 2");
  });

  it("when the command is unknown, then exit 2 with one sentence", async () => {
    const { code, stderr } = await loopyard(["evalute", "x.json"]);
    expect(code).toBe(2);
    expectOneSentence(stderr, "evalute: unknown command");
  });
});

const SWEEP = {
  family: {
    variants: [
      { label: "Ember 200", plant: { kind: "transfer-function", num: [1], den: [16, 10, 1], delay: 0 } },
      { label: "Ember 800", plant: { kind: "transfer-function", num: [1.5], den: [80, 24, 1], delay: 1 } },
    ],
  },
  structure: "pi",
  ranges: { kp: { min: 0.5, max: 4, count: 4, scale: "log" }, ki: { min: 0.05, max: 0.6, count: 3 } },
  design: { kind: "grid" },
  scenario: { kind: "setpoint-step", horizon: 40, dt: 0.05 },
  criteria: ["iae", "effort", "settlingTime"],
};

describe("loopyard sweep", () => {
  it("loopyard sweep writes one CSV row per candidate and variant, the same bytes on 1 and 2 workers", async () => {
    // Reference: the worker-count invariance of the pool (each row depends only on its candidate).
    const file = specFile("sweep.json", SWEEP);
    const one = await loopyard(["sweep", file, "--workers", "1"]);
    const two = await loopyard(["sweep", file, "--workers=2"]);
    expect(one.code).toBe(0);
    expect(two.code).toBe(0);
    expect(two.stdout).toBe(one.stdout);
    const lines = one.stdout.trimEnd().split("\n");
    expect(lines[0]).toBe("index,variant,kp,ki,status,iae,effort,settlingTime");
    expect(lines).toHaveLength(1 + 12 * 2);
    expect(lines[1].startsWith("0,Ember 200,0.5,0.05,")).toBe(true);
    expect(lines[2].startsWith("0,Ember 800,0.5,0.05,")).toBe(true);
    // Not a TTY: plain progress lines on stderr, no carriage returns.
    expect(one.stderr).toContain("loopyard sweep: 12 candidates in");
    expect(one.stderr).not.toContain("\r");
  });

  it("loopyard sweep --format jsonl writes one JSON object per line", async () => {
    const spec = { ...SWEEP, design: { kind: "latin-hypercube", count: 5, seed: 1 } };
    const { code, stdout } = await loopyard(["sweep", specFile("lhs.json", spec), "--format", "jsonl", "--workers", "2"]);
    expect(code).toBe(0);
    const rows = stdout.trimEnd().split("\n").map((l) => JSON.parse(l));
    expect(rows).toHaveLength(10);
    expect(rows[0]).toMatchObject({ index: 0, variant: "Ember 200", status: expect.any(String) });
    expect(Object.keys(rows[0].params)).toEqual(["kp", "ki"]);
  });

  it("when a tunable parameter does not belong to the structure, then exit 2 naming it", async () => {
    const spec = { ...SWEEP, ranges: { kp: { min: 0.5, max: 4, count: 2 }, kd: { min: 0, max: 1, count: 2 } }, fixed: { ki: 0.1 } };
    const { code, stderr } = await loopyard(["sweep", specFile("kd.json", spec)]);
    expect(code).toBe(2);
    expectOneSentence(stderr, 'ranges.kd: "kd" is not a parameter of pi; use kp, ki, sampleTime');
  });

  it("loopyard sweep runs a search design generation by generation within its budget, improving on its first simplexes", async () => {
    // Budget: starts × iterations = 2 × 15 = 30 evaluations (searchBudget). Nelder–Mead only moves to
    // better vertices, so the best IAE found is at most the best of the first simplexes (Nelder & Mead 1965).
    const spec = {
      ...SWEEP,
      family: { variants: [SWEEP.family.variants[0]] },
      ranges: { kp: { min: 0.5, max: 8 }, ki: { min: 0.05, max: 1 } },
      design: { kind: "search", method: "nelder-mead", criterion: "iae", starts: 2, iterations: 15, seed: 3 },
      criteria: ["iae", "effort"],
    };
    const { code, stdout } = await loopyard(["sweep", specFile("search.json", spec), "--workers", "1"]);
    expect(code).toBe(0);
    const rows = stdout.trimEnd().split("\n").slice(1).map((line) => line.split(","));
    expect(rows.length).toBeLessThanOrEqual(30);
    expect(rows.map((r) => Number(r[0]))).toEqual(rows.map((_, i) => i));
    const iae = (r: string[]) => (r[4] === "stable" ? Number(r[5]) : Infinity);
    const firstSimplexes = Math.min(...rows.slice(0, 6).map(iae));
    expect(Math.min(...rows.map(iae))).toBeLessThanOrEqual(firstSimplexes);
  });

  it("when --workers is not a whole number, then exit 2 naming the option", async () => {
    const { code, stderr } = await loopyard(["sweep", specFile("w.json", SWEEP), "--workers", "two"]);
    expect(code).toBe(2);
    expectOneSentence(stderr, "--workers: ");
  });
});
