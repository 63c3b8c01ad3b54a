import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { POINTS_BINARY_TYPE, decodePointsBinary } from "@loopyard/core";
import { startTestServer, type TestServer } from "../support/test-server.js";
import type { ApiClient } from "./api-client.js";
import { twoLagPlant, workspaceWithTeam } from "./fixtures.js";

let server: TestServer;
let team: Awaited<ReturnType<typeof workspaceWithTeam>>;
let revisionId: string;

const sweepsPath = () => `/api/workspaces/${team.slug}/sweeps`;

/** A 3 × 3 × 2 PID grid on the two-lag plant, 20 s horizon at 10 ms (2001 samples). */
function gridInput(name: string, plantRevisionId: string) {
  return {
    name,
    plantRevisionId,
    structure: "pid",
    ranges: {
      kp: { min: 0.5, max: 4, count: 3 },
      ki: { min: 0.1, max: 2, count: 3 },
      kd: { min: 0, max: 1, count: 2 },
    },
    filter: { mode: "ratio", n: 10 },
    scenario: { kind: "setpoint-step", horizon: 20, dt: 0.01 },
    criteria: ["iae", "ise", "itae", "effort"],
  };
}

async function waitForSweep(client: ApiClient, sweepId: string, timeoutMs = 30_000) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const response = await client.get(`${sweepsPath()}/${sweepId}`);
    expect(response.status).toBe(200);
    if (response.body.status === "finished" || response.body.status === "failed") return response.body;
    if (Date.now() > deadline) throw new Error(`sweep ${sweepId} still ${response.body.status} (${response.body.done}/${response.body.total})`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

/** Positions of the points no other point dominates (minimising both), by brute force over all pairs. */
function nonDominated(points: readonly { index: number; x: number; y: number }[]): number[] {
  return points
    .filter((p) => !points.some((q) => q.x <= p.x && q.y <= p.y && (q.x < p.x || q.y < p.y)))
    .map((p) => p.index);
}

beforeAll(async () => {
  server = await startTestServer();
  team = await workspaceWithTeam(server.url, "Sweeps");
  const plant = await team.engineer.post(`/api/workspaces/${team.slug}/plants`, twoLagPlant("Sweep bench"));
  revisionId = plant.body.revision.id;
});

afterAll(async () => {
  await server?.close();
});

describe("a 3 × 3 × 2 sweep", () => {
  let sweepId: string;
  let finished: any;

  beforeAll(async () => {
    const created = await team.engineer.post(sweepsPath(), gridInput("Grid 3×3×2", revisionId));
    expect(created.status).toBe(201);
    expect(created.body.total).toBe(18);
    expect(["queued", "running", "finished"]).toContain(created.body.status);
    sweepId = created.body.id;
    finished = await waitForSweep(team.viewer, sweepId);
  });

  it("when it has run, then it is finished with 18 of 18 candidates stored", async () => {
    expect(finished.status).toBe("finished");
    expect(finished.error).toBeNull();
    expect(finished.done).toBe(18);
    expect(finished.finishedAt).not.toBeNull();
    expect(finished.parameters).toEqual(["kp", "ki", "kd", "tf"]);
    expect(finished.criteria).toEqual(["iae", "ise", "itae", "effort"]);
    expect(finished.plant).toMatchObject({ revisionId, revisionNumber: 1, name: "Sweep bench" });

    const list = await team.viewer.get(`${sweepsPath()}/${sweepId}/candidates`);
    expect(list.status).toBe(200);
    const candidates = list.body.candidates as { index: number; params: number[]; status: string; scores: number[] | null }[];
    expect(candidates.map((c) => c.index)).toEqual(Array.from({ length: 18 }, (_, i) => i));
    // Grid order: kp slowest, kd fastest; tf = kd/(n·kp) with n = 10 (0 when kd = 0).
    expect(candidates[0]?.params).toEqual([0.5, 0.1, 0, 0]);
    const last = candidates[17]?.params ?? [];
    expect(last.slice(0, 3)).toEqual([4, 2, 1]);
    expect(last[3]).toBeCloseTo(1 / (10 * 4), 12);
    // Every candidate is stable. For the PI ones (kd = 0) this is a closed form: s³ + 3s² + (2 + kp)s + ki
    // is stable iff 3(2 + kp) > ki (Routh–Hurwitz), true for kp ≥ 0.5, ki ≤ 2; for kd = 1 it rests on core's pole test.
    for (const candidate of candidates) {
      expect(candidate.status).toBe("stable");
      expect(candidate.scores).toHaveLength(4);
      for (const score of candidate.scores ?? []) expect(Number.isFinite(score) && score >= 0).toBe(true);
    }

    const listed = await team.viewer.get(sweepsPath());
    expect(listed.body[0].id).toBe(sweepId);
  });

  it("when the front of IAE against effort is asked, then its indices are exactly the non-dominated candidates, by IAE ascending", async () => {
    const front = await team.viewer.get(`${sweepsPath()}/${sweepId}/front?x=iae&y=effort`);
    expect(front.status).toBe(200);
    expect(front.body.x).toBe("iae");
    expect(front.body.y).toBe("effort");
    const list = await team.viewer.get(`${sweepsPath()}/${sweepId}/candidates`);
    const points = (list.body.candidates as { index: number; scores: number[] }[]).map((c) => ({
      index: c.index,
      x: c.scores[0] as number,
      y: c.scores[3] as number,
    }));
    const expected = nonDominated(points);
    expect(expected.length).toBeGreaterThan(0);
    expect([...front.body.indices].sort((a: number, b: number) => a - b)).toEqual([...expected].sort((a, b) => a - b));
    const xs = (front.body.indices as number[]).map((i) => points[i]?.x as number);
    expect(xs).toEqual([...xs].sort((a, b) => a - b));
  });

  it("when the front names a criterion that does not exist, then the answer is 400 naming the parameter", async () => {
    const response = await team.viewer.get(`${sweepsPath()}/${sweepId}/front?x=overshoot&y=effort`);
    expect(response.status).toBe(400);
    expect(response.body.error.field).toBe("x");
    expect(response.body.error.message).toMatch(/^x: /);
    const otherAxis = await team.viewer.get(`${sweepsPath()}/${sweepId}/front?x=iae&y=nonsense`);
    expect(otherAxis.status).toBe(400);
    expect(otherAxis.body.error.field).toBe("y");
  });

  it("when the points of IAE against effort are asked, then they equal the candidate list's stable scores and swept parameters to 6 significant digits", async () => {
    const response = await team.viewer.get(`${sweepsPath()}/${sweepId}/points?x=iae&y=effort`);
    expect(response.status).toBe(200);
    const points = response.body as { x: string; y: string; total: number; sampled: boolean; indices: number[]; xs: number[]; ys: number[]; params: number[][]; plottable: string[] };
    expect(points).toMatchObject({ x: "iae", y: "effort", total: 18, sampled: false });
    const list = await team.viewer.get(`${sweepsPath()}/${sweepId}/candidates`);
    const stable = (list.body.candidates as { index: number; params: number[]; status: string; scores: unknown[] | null }[]).filter(
      (c) => c.status === "stable" && typeof c.scores?.[0] === "number" && typeof c.scores?.[3] === "number",
    );
    expect(stable.length).toBeGreaterThan(0);
    expect(points.indices).toEqual(stable.map((c) => c.index));
    // Rounding tolerance (closed form): a value rounded to 6 significant digits is within half a unit of its 6th digit, |v̂ − v| ≤ 5·10⁻⁶·|v|.
    const close = (rounded: number, exact: number) => expect(Math.abs(rounded - exact)).toBeLessThanOrEqual(5e-6 * Math.abs(exact));
    stable.forEach((c, i) => {
      close(points.xs[i] as number, c.scores?.[0] as number);
      close(points.ys[i] as number, c.scores?.[3] as number);
      // Swept kp, ki, kd are the first three of parameters (kp, ki, kd, tf).
      [0, 1, 2].forEach((k) => close(points.params[k]?.[i] as number, c.params[k] as number));
    });
    expect(points.params).toHaveLength(finished.swept.length);
    expect(points.plottable).toEqual(["iae", "ise", "itae", "effort"]);

    // The front of the same axes lists its candidates in full, in the order of its indices.
    const front = await team.viewer.get(`${sweepsPath()}/${sweepId}/front?x=iae&y=effort`);
    expect((front.body.candidates as { index: number }[]).map((c) => c.index)).toEqual(front.body.indices);
  });

  it("when the points are asked in binary, then they hold the same points with the stored scores exactly, and a bad axis still gets a JSON 400", async () => {
    const path = `${sweepsPath()}/${sweepId}/points?x=iae&y=effort`;
    const binary = await team.viewer.getBytes(path, POINTS_BINARY_TYPE);
    expect(binary.status).toBe(200);
    expect(binary.headers.get("content-type")).toContain(POINTS_BINARY_TYPE);
    const { header, columns } = decodePointsBinary(binary.bytes);
    const json = (await team.viewer.get(path)).body;
    expect(header).toEqual({ x: "iae", y: "effort", total: 18, sampled: false, plottable: json.plottable, count: json.indices.length, paramCount: json.params.length });
    expect([...columns.indices]).toEqual(json.indices);
    // Exact: the stored doubles themselves (float8send), not printed digits.
    const list = await team.viewer.get(`${sweepsPath()}/${sweepId}/candidates`);
    const byIndex = new Map((list.body.candidates as { index: number; params: number[]; scores: number[] }[]).map((c) => [c.index, c]));
    [...columns.indices].forEach((index, i) => {
      const stored = byIndex.get(index);
      expect(columns.xs[i]).toBe(stored?.scores[0]);
      expect(columns.ys[i]).toBe(stored?.scores[3]);
      [0, 1, 2].forEach((k) => expect(columns.params[k]?.[i]).toBe(stored?.params[k]));
    });
    const refused = await team.viewer.getBytes(`${sweepsPath()}/${sweepId}/points?x=overshoot&y=effort`, POINTS_BINARY_TYPE);
    expect(refused.status).toBe(400);
    expect(JSON.parse(new TextDecoder().decode(refused.bytes)).error.field).toBe("x");
  });

  it("when the points name a criterion the sweep did not score, then the answer is 400 naming the parameter", async () => {
    const response = await team.viewer.get(`${sweepsPath()}/${sweepId}/points?x=overshoot&y=effort`);
    expect(response.status).toBe(400);
    expect(response.body.error.field).toBe("x");
    const otherAxis = await team.viewer.get(`${sweepsPath()}/${sweepId}/points?x=iae&y=nonsense`);
    expect(otherAxis.status).toBe(400);
    expect(otherAxis.body.error.field).toBe("y");
  });

  it("when a candidate's response is asked, then a unit setpoint step is simulated and thinned to at most 2000 points", async () => {
    const response = await team.viewer.get(`${sweepsPath()}/${sweepId}/candidates/4/response`);
    expect(response.status).toBe(200);
    const { t, r, y, u } = response.body as { t: number[]; r: number[]; y: number[]; u: number[] };
    // 20 s at 10 ms is 2001 samples: one more than the limit, so the trace must be thinned.
    expect(t.length).toBeLessThanOrEqual(2000);
    expect(t.length).toBeGreaterThan(500);
    expect([r.length, y.length, u.length]).toEqual([t.length, t.length, t.length]);
    expect(t[0]).toBe(0);
    expect(t[t.length - 1]).toBeCloseTo(20, 9);
    expect(r[r.length - 1]).toBe(1);
    expect(response.body.params).toMatchObject({ kp: 0.5, ki: 2, kd: 0 });
    // With integral action the error of a stable loop tends to 0 (final-value theorem, closed form);
    // by 20 s this loop is within a few per cent of the setpoint.
    expect(Math.abs((y[y.length - 1] as number) - 1)).toBeLessThan(0.05);
    expect((await team.viewer.get(`${sweepsPath()}/${sweepId}/candidates/18/response`)).status).toBe(404);
  });
});

describe("sweep roles and input", () => {
  it("when a viewer starts a sweep, then the answer is 403 naming the engineer role", async () => {
    const response = await team.viewer.post(sweepsPath(), gridInput("Refused", revisionId));
    expect(response.status).toBe(403);
    expect(response.body.error.message).toBe(`Starting sweeps needs the engineer role or higher in ${team.name}; you are a viewer.`);
  });

  it("when the revision belongs to another workspace, then the answer is 400 naming plantRevisionId", async () => {
    const other = await workspaceWithTeam(server.url, "Other");
    const plant = await other.engineer.post(`/api/workspaces/${other.slug}/plants`, twoLagPlant("Elsewhere"));
    const response = await team.engineer.post(sweepsPath(), gridInput("Cross-workspace", plant.body.revision.id));
    expect(response.status).toBe(400);
    expect(response.body.error.field).toBe("plantRevisionId");
  });

  it("when the grid is larger than allowed, then the answer is 400 naming ranges", async () => {
    const input = gridInput("Too big", revisionId);
    // 1000 × 1000 × kd's count (≥ 2) is over MAX_SWEEP_CANDIDATES (1,000,000).
    input.ranges.kp.count = 1000;
    input.ranges.ki.count = 1000;
    const response = await team.engineer.post(sweepsPath(), input);
    expect(response.status).toBe(400);
    expect(response.body.error.field).toBe("ranges");
  });

  it("when a range has min above max, then the answer is 400 naming that range's max", async () => {
    const input = gridInput("Upside down", revisionId);
    input.ranges.ki = { min: 2, max: 1, count: 3 };
    const response = await team.engineer.post(sweepsPath(), input);
    expect(response.status).toBe(400);
    expect(response.body.error.field).toBe("ranges.ki.max");
  });

  it("when a proportional gain crosses the Routh–Hurwitz limit, then that candidate is unstable, unscored and off the front", async () => {
    // 1/(s+1)³ under P control: s³ + 3s² + 3s + 1 + kp is stable iff 3·3 > 1 + kp, i.e. kp < 8 (Routh–Hurwitz, closed form).
    const plant = await team.engineer.post(`/api/workspaces/${team.slug}/plants`, {
      name: "Three equal lags",
      unitsNote: "",
      model: { kind: "transfer-function", num: [1], den: [1, 3, 3, 1], delay: 0 },
    });
    const created = await team.engineer.post(sweepsPath(), {
      name: "P gains across the limit",
      plantRevisionId: plant.body.revision.id,
      ranges: { kp: { min: 2, max: 12, count: 3 }, ki: { min: 0, max: 0, count: 1 }, kd: { min: 0, max: 0, count: 1 } },
      filter: { mode: "fixed", tf: 0 },
      scenario: { horizon: 30, dt: 0.01 },
      criteria: ["iae", "effort"],
    });
    expect(created.status).toBe(201);
    const sweepPath = `${sweepsPath()}/${created.body.id}`;
    const finished = await waitForSweep(team.viewer, created.body.id);
    expect(finished.status).toBe("finished");
    expect(finished.unstableCount).toBe(1);
    const list = await team.viewer.get(`${sweepPath}/candidates`);
    const candidates = list.body.candidates as { params: number[]; status: string; scores: number[] | null }[];
    // kp = 2, 7, 12: the first two lie below the limit 8, the third above it.
    expect(candidates.map((c) => [c.params[0], c.status])).toEqual([
      [2, "stable"],
      [7, "stable"],
      [12, "unstable"],
    ]);
    expect(candidates[2]?.scores).toBeNull();
    const front = await team.viewer.get(`${sweepPath}/front?x=iae&y=effort`);
    expect(front.status).toBe(200);
    expect(front.body.indices).not.toContain(2);
    expect(front.body.indices.length).toBeGreaterThan(0);
    // This sweep scored only IAE and effort, so ISE is refused on the axis that asks for it.
    const unscored = await team.viewer.get(`${sweepPath}/front?x=iae&y=ise`);
    expect(unscored.status).toBe(400);
    expect(unscored.body.error.field).toBe("y");
  });
});
