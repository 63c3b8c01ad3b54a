import { describe, expect, it } from "vitest";
import { gridCandidates } from "../../src/sweeps/grid-candidates.js";
import {
  sweepCandidateCount,
  sweepCandidates,
  sweepInputSchema,
  sweepParameterNames,
  sweepStructure,
  type SweepInput,
} from "../../src/sweeps/sweep-input.js";

const REVISION = "5f0c6b0e-8a4e-4b43-9d4c-1f1f2b0a9c11";
const scenario = { horizon: 30, dt: 0.01 };

function paths(input: SweepInput): string[] {
  const result = sweepInputSchema.safeParse(input);
  return result.success ? [] : result.error.issues.map((i) => i.path.join("."));
}

describe("sweepInputSchema v2", () => {
  it("sweepInputSchema parses a version-1 definition to the same PID sweep with the ratio filter (common practice)", () => {
    const v1 = {
      name: "v1",
      plantRevisionId: REVISION,
      structure: "pid" as const,
      ranges: { kp: { min: 0.5, max: 2, count: 3 }, ki: { min: 0, max: 0.4, count: 2 }, kd: { min: 0, max: 1, count: 2 } },
      filter: { mode: "ratio" as const, n: 10 },
      scenario: { kind: "setpoint-step" as const, horizon: 30, dt: 0.01 },
      criteria: ["iae", "ise", "itae", "effort"] as const,
    };
    const parsed = sweepInputSchema.parse(v1);
    expect(parsed.filter).toEqual({ mode: "ratio", n: 10 });
    expect(sweepInputSchema.parse({ ...v1, filter: undefined, structure: undefined }).filter).toEqual({ mode: "ratio", n: 10 });
    expect(sweepStructure(parsed)).toEqual({ kind: "pid", tunable: ["kp", "ki", "kd"], fixed: {}, filter: { mode: "ratio", n: 10 } });
    expect(sweepParameterNames(parsed)).toEqual(["kp", "ki", "kd", "tf"]);
    // Same order and values as the version-1 grid (kp slowest, kd fastest).
    const { names, values } = sweepCandidates(parsed);
    expect(names).toEqual(["kp", "ki", "kd"]);
    const pids = gridCandidates(parsed.ranges as never, { mode: "ratio", n: 10 });
    expect(values.length).toBe(pids.length * 3);
    pids.forEach((pid, i) => {
      expect(values[i * 3]).toBeCloseTo(pid.kp, 12);
      expect(values[i * 3 + 1]).toBeCloseTo(pid.ki, 12);
      expect(values[i * 3 + 2]).toBeCloseTo(pid.kd, 12);
    });
    expect(sweepCandidateCount(parsed)).toBe(12);
  });

  it("sweepInputSchema takes a PI sweep with a fixed ki, a load step and criterion options", () => {
    const parsed = sweepInputSchema.parse({
      name: "pi",
      plantRevisionId: REVISION,
      structure: "pi",
      ranges: { kp: { min: 0.5, max: 3, count: 4 } },
      fixed: { ki: 0.2 },
      scenario: { kind: "load-step", horizon: 60, dt: 0.05, load: { size: 0.3, time: 5 } },
      criteria: ["iae", "settlingTime"],
      criterionOptions: { settlingBand: 0.05 },
    });
    expect(parsed.filter).toBeUndefined();
    expect(sweepStructure(parsed)).toEqual({ kind: "pi", tunable: ["kp"], fixed: { ki: 0.2 } });
    expect(sweepParameterNames(parsed)).toEqual(["kp", "ki"]);
  });

  it("sweepInputSchema orders the tunable names as the structure does, not as the ranges are written", () => {
    const parsed = sweepInputSchema.parse({
      name: "lead-lag",
      plantRevisionId: REVISION,
      structure: "lead-lag",
      ranges: { tLag: { min: 0.5, max: 1, count: 2 }, k: { min: 1, max: 2, count: 3 } },
      fixed: { tLead: 4 },
      sampleTime: 0.1,
      scenario,
    });
    const structure = sweepStructure(parsed);
    expect(structure.tunable).toEqual(["k", "tLag"]);
    expect(structure.fixed).toEqual({ tLead: 4, sampleTime: 0.1 });
    expect(sweepParameterNames(parsed)).toEqual(["k", "tLead", "tLag", "sampleTime"]);
    const { values } = sweepCandidates(parsed);
    // Row-major, k slowest: (1, 0.5), (1, 1), (1.5, 0.5), …
    expect(Array.from(values.slice(0, 6))).toEqual([1, 0.5, 1, 1, 1.5, 0.5]);
  });

  it("sweepInputSchema names an unknown parameter, a missing one and one given twice", () => {
    const base = { name: "s", plantRevisionId: REVISION, structure: "pi" as const, scenario };
    expect(paths({ ...base, ranges: { kp: { min: 1, max: 2, count: 2 }, kx: { min: 0, max: 1, count: 2 } }, fixed: { ki: 1 } })).toContain("ranges.kx");
    expect(paths({ ...base, ranges: { kp: { min: 1, max: 2, count: 2 } } })).toContain("ranges.ki");
    expect(paths({ ...base, ranges: { kp: { min: 1, max: 2, count: 2 }, ki: { min: 0, max: 1, count: 2 } }, fixed: { ki: 1 } })).toContain("fixed.ki");
    expect(paths({ ...base, ranges: {} })).toContain("ranges");
  });

  it("sweepInputSchema keeps gains ≥ 0 and lead–lag times > 0, but lets state-feedback gains go negative", () => {
    const base = { name: "s", plantRevisionId: REVISION, scenario };
    expect(paths({ ...base, structure: "p", ranges: { kp: { min: -1, max: 1, count: 3 } } })).toContain("ranges.kp.min");
    expect(paths({ ...base, structure: "lead-lag", ranges: { k: { min: 1, max: 2, count: 2 } }, fixed: { tLead: 0, tLag: 1 } })).toContain("fixed.tLead");
    const sf = sweepInputSchema.safeParse({
      ...base,
      structure: "state-feedback",
      ranges: { "k[0]": { min: -2, max: 2, count: 5 }, "k[1]": { min: -1, max: 1, count: 3 } },
      fixed: { n: 1 },
    });
    expect(sf.success).toBe(true);
    if (sf.success) expect(sweepParameterNames(sf.data)).toEqual(["k[0]", "k[1]", "n"]);
    expect(paths({ ...base, structure: "state-feedback", ranges: { "k[0]": { min: 1, max: 2, count: 2 }, "k[2]": { min: 1, max: 2, count: 2 } }, fixed: { n: 1 } })).toContain(
      "ranges.k[1]",
    );
  });

  it("sweepInputSchema refuses a sample time below the time step, a filter on PI and grids above the cap", () => {
    const base = { name: "s", plantRevisionId: REVISION, scenario };
    expect(paths({ ...base, structure: "p", ranges: { kp: { min: 1, max: 2, count: 2 } }, sampleTime: 0.001 })).toContain("sampleTime");
    expect(paths({ ...base, structure: "pi", ranges: { kp: { min: 1, max: 2, count: 2 } }, fixed: { ki: 1 }, filter: { mode: "ratio", n: 5 } })).toContain("filter");
    expect(
      // 1001 × 1000 = 1,001,000 candidates: one more thousand than MAX_SWEEP_CANDIDATES (1,000,000).
      paths({ ...base, structure: "pi", ranges: { kp: { min: 1, max: 2, count: 1001 }, ki: { min: 1, max: 2, count: 1000 } } }),
    ).toContain("ranges");
  });
});

describe("sweepInputSchema criterionOptions.weight", () => {
  const base = {
    name: "weighted",
    plantRevisionId: "6f1c3a52-0d5e-4a43-9b7e-1f2a3b4c5d6e",
    ranges: { kp: { min: 1, max: 2, count: 2 }, ki: { min: 0, max: 1, count: 2 }, kd: { min: 0, max: 0, count: 1 } },
    scenario: { horizon: 10, dt: 0.01 },
    criteria: ["iae", "wsNorm"],
  };

  it("refuses wsNorm without a weight, naming criterionOptions.weight", () => {
    const r = sweepInputSchema.safeParse(base);
    expect(r.success).toBe(false);
    expect(r.error?.issues.map((i) => i.path.join("."))).toContain("criterionOptions.weight");
  });

  it("turns the performance preset into W(s) = (s/M + ωB)/(s + ωB·A) (Skogestad & Postlethwaite 2005, eq. 2.105)", () => {
    const r = sweepInputSchema.safeParse({ ...base, criterionOptions: { weight: { preset: "performance", M: 2, omegaB: 0.5, A: 1e-4 } } });
    expect(r.success).toBe(true);
    // (s/2 + 0.5)/(s + 0.5·1e-4): num [1/M, ωB], den [1, ωB·A]
    const w = r.data?.criterionOptions?.weight;
    expect(w?.num[0]).toBeCloseTo(0.5, 12);
    expect(w?.num[1]).toBeCloseTo(0.5, 12);
    expect(w?.den[0]).toBeCloseTo(1, 12);
    expect(w?.den[1]).toBeCloseTo(5e-5, 15);
  });
});

describe("sweepInputSchema v3", () => {
  const base = { name: "s", plantRevisionId: REVISION, scenario, structure: "pi" as const };
  const ranges = { kp: { min: 0.1, max: 10, scale: "log" as const }, ki: { min: 0.1, max: 1 } };

  it("sweepInputSchema defaults the design to a grid and the aggregate to the worst case (stored v2 definitions keep their meaning)", () => {
    const parsed = sweepInputSchema.parse({ ...base, ranges: { kp: { min: 1, max: 2, count: 3 }, ki: { min: 1, max: 2, count: 2 } } });
    expect(parsed.design).toEqual({ kind: "grid" });
    expect(parsed.aggregate).toEqual({ kind: "worst" });
    expect(sweepCandidateCount(parsed)).toBe(6);
  });

  it("sweepCandidates draws a Latin hypercube of the design's count on a log axis within the bounds, the same for the same seed", () => {
    const input = sweepInputSchema.parse({ ...base, ranges, design: { kind: "latin-hypercube", count: 50, seed: 7 } });
    expect(sweepCandidateCount(input)).toBe(50);
    const a = sweepCandidates(input).values;
    const b = sweepCandidates(input).values;
    expect(a.length).toBe(100);
    expect(Array.from(a)).toEqual(Array.from(b));
    for (let i = 0; i < 50; i++) {
      expect(a[2 * i]).toBeGreaterThanOrEqual(0.1);
      expect(a[2 * i]).toBeLessThanOrEqual(10);
    }
  });

  it("sweepInputSchema refuses a log scale from 0, a family whose first variant is another revision, and a search criterion not scored", () => {
    expect(paths({ ...base, ranges: { kp: { min: 0, max: 1, scale: "log" }, ki: { min: 1, max: 2 } } })).toContain("ranges.kp.min");
    const other = "5b0e7e7e-8a4c-4d8e-9b1e-1f0c2d3e4f50";
    expect(paths({ ...base, ranges, family: { variants: [{ plantRevisionId: other }] } })).toContain("plantRevisionId");
    expect(
      paths({ ...base, ranges, criteria: ["iae"], design: { kind: "search", method: "nelder-mead", criterion: "ise", starts: 2, iterations: 10, seed: 1 } }),
    ).toContain("design.criterion");
    expect(paths({ ...base, ranges, design: { kind: "random", count: 2_000_000, seed: 1 } })).toContain("design.count");
  });
});
