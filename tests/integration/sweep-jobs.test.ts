/**
 * Sweeps as pg-boss jobs with real worker and server processes (cli.js worker / serve) on the test
 * database: shared work, SIGKILL of a worker and of the server, cancel, limits, diverging variants.
 */
import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { aggregateScores, batchStatusName, evaluateBatch, sweepCandidates, sweepStructure } from "@loopyard/core";
import type { CandidateDto, Plant, ScoreValue, SweepDetailDto, SweepInputParsed } from "@loopyard/core";
import pg from "pg";
import { startTestServer, type TestServer } from "../support/test-server.js";
import { ApiClient } from "./api-client.js";
import { workspaceWithTeam } from "./fixtures.js";
import { freePort, startServerProcess, startWorker, stopAll } from "./processes.js";

/** G_A = 1/((s+1)(s+2)) and G_B = 1/((2s+1)(s+2)): two variants of one family. */
const PLANT_A = { kind: "transfer-function", num: [1], den: [1, 3, 2], delay: 0 } as const;
const PLANT_B = { kind: "transfer-function", num: [1], den: [2, 5, 2], delay: 0 } as const;

const servers: TestServer[] = [];
afterEach(async () => {
  await stopAll();
});
afterAll(async () => {
  await stopAll();
  for (const server of servers) await server.close();
});

type Team = Awaited<ReturnType<typeof workspaceWithTeam>>;

async function familyTeam(url: string, label: string) {
  const team = await workspaceWithTeam(url, label);
  const a = await team.engineer.post(`/api/workspaces/${team.slug}/plants`, { name: "Ember bench A", unitsNote: "", model: PLANT_A });
  const b = await team.engineer.post(`/api/workspaces/${team.slug}/plants`, { name: "Ember bench B", unitsNote: "", model: PLANT_B });
  expect(a.status).toBe(201);
  expect(b.status).toBe(201);
  return { team, revisions: [a.body.revision.id as string, b.body.revision.id as string] };
}

/**
 * A PID family sweep of `count` Latin-hypercube candidates on both variants, with criteria that need
 * the whole trace (tv, settling time), so that each chunk of 100 candidates takes a fraction of a second.
 */
function familySweep(name: string, revisions: string[], count: number) {
  return {
    name,
    plantRevisionId: revisions[0],
    structure: "pid",
    ranges: { kp: { min: 0.5, max: 5 }, ki: { min: 0.1, max: 2, scale: "log" }, kd: { min: 0, max: 1 } },
    filter: { mode: "ratio", n: 10 },
    design: { kind: "latin-hypercube", count, seed: 11 },
    aggregate: { kind: "worst" },
    scenario: { horizon: 30, dt: 0.005 },
    criteria: ["iae", "effort", "tv", "settlingTime"],
    family: { name: "Bench pair", variants: revisions.map((id, i) => ({ plantRevisionId: id, label: i === 0 ? "nominal" : "slow" })) },
  };
}

async function detail(client: ApiClient, slug: string, id: string): Promise<SweepDetailDto> {
  const response = await client.get(`/api/workspaces/${slug}/sweeps/${id}`);
  expect(response.status).toBe(200);
  return response.body;
}

async function waitUntil(client: ApiClient, slug: string, id: string, done: (s: SweepDetailDto) => boolean, timeoutMs: number): Promise<SweepDetailDto> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const sweep = await detail(client, slug, id);
    if (done(sweep)) return sweep;
    if (Date.now() > deadline) throw new Error(`sweep ${id} is ${sweep.status} at ${sweep.done}/${sweep.total} after ${timeoutMs} ms`);
    await new Promise((resolve) => setTimeout(resolve, 150));
  }
}

const finished = (s: SweepDetailDto) => s.status !== "queued" && s.status !== "running";

async function candidatesOf(client: ApiClient, slug: string, id: string): Promise<CandidateDto[]> {
  const response = await client.get(`/api/workspaces/${slug}/sweeps/${id}/candidates`);
  expect(response.status).toBe(200);
  return response.body.candidates;
}

/** Rows and distinct indices of a sweep straight from PostgreSQL. */
async function storedCounts(sweepId: string): Promise<{ rows: number; distinct: number }> {
  const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await client.connect();
  try {
    const result = await client.query("select count(*)::int as rows, count(distinct index)::int as distinct from candidate where sweep_id = $1", [sweepId]);
    return { rows: result.rows[0].rows, distinct: result.rows[0].distinct };
  } finally {
    await client.end();
  }
}

function scoreValue(value: number): ScoreValue {
  if (Number.isFinite(value)) return value;
  if (value === Infinity) return "inf";
  if (value === -Infinity) return "-inf";
  return null;
}

/** What one process computes in process (core evaluateBatch + aggregateScores), candidate by candidate. */
function singleProcessRun(definition: SweepInputParsed, family: Plant[]): { status: string; scores: ScoreValue[] | null; params0: number }[] {
  const { values } = sweepCandidates(definition);
  const structure = sweepStructure(definition);
  const d = structure.tunable.length;
  const n = values.length / d;
  const nc = definition.criteria.length;
  const result = evaluateBatch(family, structure, values, definition.scenario as never, definition.criteria, {});
  const aggregate = aggregateScores(result.scores, result.status, n, family.length, definition.criteria, definition.aggregate);
  return Array.from({ length: n }, (_, i) => {
    const names = family.map((_, f) => batchStatusName(result.status[i * family.length + f] as number));
    const status = names.includes("unstable") ? "unstable" : names.some((s) => s !== "stable") ? "diverged" : "stable";
    return {
      status,
      scores: status === "stable" ? Array.from(aggregate.subarray(i * nc, (i + 1) * nc), scoreValue) : null,
      params0: values[i * d] as number,
    };
  });
}

describe("sweeps as jobs on worker processes", () => {
  let server: TestServer;
  let team: Team;
  let revisions: string[];

  beforeAll(async () => {
    server = await startTestServer({ embeddedWorker: false });
    servers.push(server);
    ({ team, revisions } = await familyTeam(server.url, "Jobs"));
  });

  it("when two worker processes share one sweep, then both finish chunks and the stored results equal a single-process run candidate for candidate", async () => {
    const [first, second] = await Promise.all([startWorker(), startWorker()]);
    const created = await team.engineer.post(`/api/workspaces/${team.slug}/sweeps`, familySweep("Shared", revisions, 1200));
    expect(created.status).toBe(201);
    const sweep = await waitUntil(team.viewer, team.slug, created.body.id, finished, 90_000);
    expect(sweep.status).toBe("finished");
    expect(sweep.done).toBe(1200);
    expect(sweep.family.map((v) => v.label)).toEqual(["nominal", "slow"]);
    expect(sweep.progress).toMatchObject({ chunksTotal: 12, chunksDone: 12, chunksFailed: 0, failures: [] });

    // Both processes finished chunks (worker_id of sweep_chunk).
    const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
    await db.connect();
    const workers = await db.query("select count(distinct worker_id)::int as n from sweep_chunk where sweep_id = $1", [sweep.id]);
    await db.end();
    expect(workers.rows[0].n).toBe(2);

    const stored = await candidatesOf(team.viewer, team.slug, sweep.id);
    const expected = singleProcessRun(sweep.definition, [PLANT_A, PLANT_B] as unknown as Plant[]);
    expect(stored.map((c) => c.index)).toEqual(expected.map((_, i) => i));
    // Same numerics in a piscina thread and in process: equal to the last bit (evaluateBatch's contract).
    stored.forEach((c, i) => {
      expect(c.status).toBe(expected[i]?.status);
      expect(c.scores).toEqual(expected[i]?.scores);
      expect(c.params[0]).toBe(expected[i]?.params0);
      expect(c.variantScores).toHaveLength(2);
    });
    // Worst case over the family (common practice): the aggregate IAE is the larger of the two variants'.
    const stable = stored.find((c) => c.status === "stable" && c.variantScores?.every((v) => v !== null));
    const iaes = stable?.variantScores?.map((v) => v?.[0] as number) ?? [];
    expect(stable?.scores?.[0]).toBe(Math.max(...iaes));

    // A k-objective front: no rank-0 candidate is dominated by any other stable candidate (brute force).
    const front = await team.viewer.get(`/api/workspaces/${team.slug}/sweeps/${sweep.id}/front?criteria=iae,effort,tv`);
    expect(front.status).toBe(200);
    expect(front.body.criteria).toEqual(["iae", "effort", "tv"]);
    const byIndex = new Map(stored.map((c) => [c.index, c.scores?.slice(0, 3) as number[]]));
    const finite = stored.filter((c) => c.status === "stable" && c.scores?.slice(0, 3).every((v) => typeof v === "number"));
    expect(front.body.ranks.indices).toHaveLength(finite.length);
    for (const index of front.body.indices as number[]) {
      const p = byIndex.get(index) as number[];
      const dominated = finite.some((q) => {
        const s = q.scores as number[];
        return s[0]! <= p[0]! && s[1]! <= p[1]! && s[2]! <= p[2]! && (s[0]! < p[0]! || s[1]! < p[1]! || s[2]! < p[2]!);
      });
      expect(dominated).toBe(false);
    }
    await Promise.all([first.stop(), second.stop()]);
  });

  it("when a worker is killed with SIGKILL mid-sweep, then the other finishes it with no candidate missing and none doubled", async () => {
    const [victim, survivor] = await Promise.all([startWorker(), startWorker()]);
    const created = await team.engineer.post(`/api/workspaces/${team.slug}/sweeps`, familySweep("Survives a kill", revisions, 1600));
    expect(created.status).toBe(201);
    const id: string = created.body.id;
    await waitUntil(team.viewer, team.slug, id, (s) => s.progress.chunksDone >= 2, 60_000);
    await victim.stop("SIGKILL");
    // The victim's active chunk expires (LOOPYARD_CHUNK_EXPIRE_SECONDS) and returns to the queue.
    const sweep = await waitUntil(team.viewer, team.slug, id, finished, 90_000);
    expect(sweep.status).toBe("finished");
    expect(sweep.done).toBe(1600);
    expect(sweep.progress.chunksFailed).toBe(0);
    expect(await storedCounts(id)).toEqual({ rows: 1600, distinct: 1600 });
    const indices = (await candidatesOf(team.viewer, team.slug, id)).map((c) => c.index);
    expect(indices).toEqual(Array.from({ length: 1600 }, (_, i) => i));
    await survivor.stop();
  });
});

describe("a chunk that keeps failing", () => {
  it("when a chunk's evaluation throws on every attempt, then it is retried, then reported failed with its error while the sweep finishes", async () => {
    const server = await startTestServer({ embeddedWorker: false });
    servers.push(server);
    const { team, revisions } = await familyTeam(server.url, "Failing");
    const created = await team.engineer.post(`/api/workspaces/${team.slug}/sweeps`, familySweep("One bad chunk", revisions, 200));
    expect(created.status).toBe(201);
    const id: string = created.body.id;
    // Corrupt the job of chunk 1 (candidates 100–199): an end past the design's 200 candidates makes
    // evaluateRange throw on every attempt.
    const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
    await db.connect();
    const changed = await db.query(
      "update pgboss.job set data = jsonb_set(data, '{end}', '250') where name = 'sweep-chunk' and data->>'sweepId' = $1 and data->>'chunk' = '1'",
      [id],
    );
    await db.end();
    expect(changed.rowCount).toBe(1);
    const worker = await startWorker();
    const sweep = await waitUntil(team.viewer, team.slug, id, finished, 60_000);
    expect(sweep.status).toBe("finished");
    expect(sweep.done).toBe(100);
    expect(sweep.progress.chunksFailed).toBe(1);
    expect(sweep.progress.failures).toHaveLength(1);
    expect(sweep.progress.failures[0]?.chunk).toBe(1);
    expect(sweep.progress.failures[0]?.error).toMatch(/chunk \[100, 250\) lies outside the sweep's 200 candidates/);
    const attempts = new pg.Client({ connectionString: process.env.DATABASE_URL });
    await attempts.connect();
    const row = await attempts.query("select attempts, status from sweep_chunk where sweep_id = $1 and chunk = 1", [id]);
    await attempts.end();
    // First attempt plus CHUNK_RETRY_LIMIT (3) retries.
    expect(row.rows[0]).toEqual({ attempts: 4, status: "failed" });
    await worker.stop();
  });
});

describe("a chunk job that failed while no worker could report it", () => {
  it("when a chunk's job has failed for good but its chunk is still pending, then a starting worker reports the chunk failed and the sweep finishes", async () => {
    const server = await startTestServer({ embeddedWorker: false });
    servers.push(server);
    const { team, revisions } = await familyTeam(server.url, "Orphaned");
    const created = await team.engineer.post(`/api/workspaces/${team.slug}/sweeps`, familySweep("Orphaned chunk", revisions, 200));
    expect(created.status).toBe(201);
    const id: string = created.body.id;
    // What pg-boss leaves when a worker is killed during the chunk's last attempt: the job failed, the chunk pending.
    const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
    await db.connect();
    const changed = await db.query(
      "update pgboss.job set state = 'failed', output = '{\"message\":\"job expired\"}'::jsonb where name = 'sweep-chunk' and data->>'sweepId' = $1 and data->>'chunk' = '1'",
      [id],
    );
    await db.end();
    expect(changed.rowCount).toBe(1);
    const worker = await startWorker();
    const sweep = await waitUntil(team.viewer, team.slug, id, finished, 30_000);
    expect(sweep).toMatchObject({ status: "finished", done: 100 });
    expect(sweep.progress.failures).toHaveLength(1);
    expect(sweep.progress.failures[0]?.error).toMatch(/failed after its last retry.*job expired/);
    await worker.stop();
  });
});

describe("the server killed mid-sweep", () => {
  it("when the server process is killed with SIGKILL and started again, then the sweep resumes and completes", async () => {
    const port = await freePort();
    const url = `http://127.0.0.1:${port}`;
    let serverProcess = await startServerProcess(port);
    const { team, revisions } = await familyTeam(url, "Restart");
    const created = await team.engineer.post(`/api/workspaces/${team.slug}/sweeps`, familySweep("Survives a restart", revisions, 1200));
    expect(created.status).toBe(201);
    const id: string = created.body.id;
    const before = await waitUntil(team.viewer, team.slug, id, (s) => s.done > 0, 60_000);
    await serverProcess.stop("SIGKILL");
    expect(before.done).toBeLessThan(1200);

    serverProcess = await startServerProcess(port);
    // Sessions live in PostgreSQL and the secret is the same, so the viewer's cookie still works.
    const sweep = await waitUntil(team.viewer, team.slug, id, finished, 90_000);
    expect(sweep.status).toBe("finished");
    expect(sweep.done).toBe(1200);
    expect(await storedCounts(id)).toEqual({ rows: 1200, distinct: 1200 });
    await serverProcess.stop();
  });
});

describe("cancel, limits and diverging variants (embedded worker)", () => {
  let server: TestServer;
  let team: Team;
  let revisions: string[];

  beforeAll(async () => {
    server = await startTestServer({ workerThreads: 1, limits: { maxCandidates: 5000, maxConcurrentSweeps: 2 } });
    servers.push(server);
    ({ team, revisions } = await familyTeam(server.url, "Control"));
  });

  it("when an engineer cancels a running sweep, then it is cancelled, no new chunk finishes after a short grace, and a viewer may not cancel", async () => {
    const created = await team.engineer.post(`/api/workspaces/${team.slug}/sweeps`, familySweep("To be cancelled", revisions, 3000));
    expect(created.status).toBe(201);
    const path = `/api/workspaces/${team.slug}/sweeps/${created.body.id}`;
    await waitUntil(team.viewer, team.slug, created.body.id, (s) => s.done > 0, 60_000);

    const refused = await team.viewer.post(`${path}/cancel`, {});
    expect(refused.status).toBe(403);
    expect(refused.body.error.message).toMatch(/engineer role/);

    const cancelled = await team.engineer.post(`${path}/cancel`, {});
    expect(cancelled.status).toBe(200);
    expect(cancelled.body.status).toBe("cancelled");
    // Grace: the chunk running at the moment of cancelling may still finish (its results are kept).
    await new Promise((resolve) => setTimeout(resolve, 2500));
    const settled = await detail(team.viewer, team.slug, created.body.id);
    await new Promise((resolve) => setTimeout(resolve, 2500));
    const later = await detail(team.viewer, team.slug, created.body.id);
    expect(later.status).toBe("cancelled");
    expect(later.done).toBe(settled.done);
    expect(later.done).toBeLessThan(3000);
    expect(later.progress.etaSeconds).toBeNull();

    const again = await team.engineer.post(`${path}/cancel`, {});
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(/already cancelled/);
  });

  it("when a sweep is over the workspace's candidate limit or one sweep too many runs, then the answer is 422 or 409 with a sentence saying the limit", async () => {
    const tooMany = await team.engineer.post(`/api/workspaces/${team.slug}/sweeps`, familySweep("Too large", revisions, 6000));
    expect(tooMany.status).toBe(422);
    expect(tooMany.body.error.message).toMatch(/6000 candidates, more than the 5000/);

    const running: string[] = [];
    for (const name of ["Long one", "Long two"]) {
      const created = await team.engineer.post(`/api/workspaces/${team.slug}/sweeps`, familySweep(name, revisions, 5000));
      expect(created.status).toBe(201);
      running.push(created.body.id);
    }
    const third = await team.engineer.post(`/api/workspaces/${team.slug}/sweeps`, familySweep("One too many", revisions, 100));
    expect(third.status).toBe(409);
    expect(third.body.error.message).toMatch(/already runs 2 sweeps, the most allowed at once/);
    for (const id of running) expect((await team.engineer.post(`/api/workspaces/${team.slug}/sweeps/${id}/cancel`, {})).status).toBe(200);
  });

  it("when a search design runs as jobs, then multi-start Nelder–Mead improves on its starting simplexes and NSGA-II stores every generation", async () => {
    const base = {
      plantRevisionId: revisions[0],
      structure: "pi",
      ranges: { kp: { min: 0.5, max: 10, scale: "log" }, ki: { min: 0.1, max: 5, scale: "log" } },
      scenario: { horizon: 20, dt: 0.01 },
      criteria: ["iae", "effort"],
    };
    const nm = await team.engineer.post(`/api/workspaces/${team.slug}/sweeps`, {
      ...base,
      name: "Simplex search on IAE",
      design: { kind: "search", method: "nelder-mead", criterion: "iae", starts: 3, iterations: 30, seed: 5 },
    });
    expect(nm.status).toBe(201);
    const nmSweep = await waitUntil(team.viewer, team.slug, nm.body.id, finished, 60_000);
    expect(nmSweep.status).toBe("finished");
    // The budget is starts × iterations evaluations; the total becomes what was stored.
    expect(nmSweep.total).toBe(nmSweep.done);
    expect(nmSweep.done).toBeGreaterThan(9);
    expect(nmSweep.done).toBeLessThanOrEqual(90);
    const nmCandidates = await candidatesOf(team.viewer, team.slug, nm.body.id);
    const iae = (c: CandidateDto) => (c.status === "stable" && typeof c.scores?.[0] === "number" ? c.scores[0] : Infinity);
    // The first ask holds the 3 starting simplexes (d + 1 = 3 vertices each); Nelder–Mead keeps the best vertex
    // of each simplex or a better one (Lagarias et al. 1998), so the search's best is at most the starts' best.
    const startBest = Math.min(...nmCandidates.slice(0, 9).map(iae));
    const best = Math.min(...nmCandidates.map(iae));
    expect(best).toBeLessThan(startBest);

    const ga = await team.engineer.post(`/api/workspaces/${team.slug}/sweeps`, {
      ...base,
      name: "Evolving front",
      design: { kind: "search", method: "nsga2", population: 8, generations: 3, seed: 9 },
    });
    expect(ga.status).toBe(201);
    expect(ga.body.total).toBe(32);
    const gaSweep = await waitUntil(team.viewer, team.slug, ga.body.id, finished, 60_000);
    expect(gaSweep).toMatchObject({ status: "finished", done: 32, total: 32 });
    const front = await team.viewer.get(`/api/workspaces/${team.slug}/sweeps/${ga.body.id}/front?x=iae&y=effort`);
    expect(front.status).toBe(200);
    expect(front.body.indices.length).toBeGreaterThan(0);
  });

  it("when some candidates diverge on one variant of a nonlinear family, then those candidates are diverged and the sweep finishes without failed chunks", async () => {
    const plant = await team.engineer.post(`/api/workspaces/${team.slug}/plants`, {
      name: "Runaway reaction",
      unitsNote: "",
      model: { kind: "nonlinear", states: ["x"], parameters: { a: 0.5, b: 0.1 }, derivatives: ["a*x + b*x^2 + u"], output: "x", initial: [0] },
    });
    expect(plant.status).toBe(201);
    const rev = plant.body.revision.id;
    const created = await team.engineer.post(`/api/workspaces/${team.slug}/sweeps`, {
      name: "P on two runaways",
      plantRevisionId: rev,
      structure: "p",
      ranges: { kp: { min: 0.25, max: 3.25, count: 5 } },
      scenario: { horizon: 30, dt: 0.01 },
      criteria: ["iae", "effort"],
      family: { variants: [{ plantRevisionId: rev, label: "b = 0.1" }, { plantRevisionId: rev, label: "b = 0.05", parameters: { b: 0.05 } }] },
    });
    expect(created.status).toBe(201);
    const sweep = await waitUntil(team.viewer, team.slug, created.body.id, finished, 60_000);
    expect(sweep.status).toBe("finished");
    expect(sweep.progress.chunksFailed).toBe(0);
    expect(sweep.divergedCount).toBe(1);
    expect(sweep.unstableCount).toBe(1);
    // Under u = kp(1 − x): dx/dt = b·x² + (0.5 − kp)·x + kp has no equilibrium (finite escape from x = 0) when
    // (0.5 − kp)² − 4·b·kp < 0 and, for kp < 0.5, no positive one. b = 0.1: kp = 0.25 and 1 escape; b = 0.05:
    // kp = 0.25 escapes, kp = 1 settles at the smaller root (0.5 − √0.05)/0.1 ≈ 2.76 (closed form: sign of the quadratic).
    // kp = 0.25 is judged before simulating: linearised at x = 0 the loop is x' = (0.5 − kp)x, a pole at +0.25 on both
    // variants, so it is unstable (local verdict; Khalil 2002, Thm 4.7).
    const candidates = await candidatesOf(team.viewer, team.slug, sweep.id);
    expect(candidates.map((c) => c.status)).toEqual(["unstable", "diverged", "stable", "stable", "stable"]);
    expect(candidates[1]?.scores).toBeNull();
    expect(candidates[1]?.variantScores?.[0]).toBeNull();
    expect(candidates[1]?.variantScores?.[1]?.every((v) => typeof v === "number")).toBe(true);
  });
});
