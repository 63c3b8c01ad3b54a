/**
 * Comparisons as jobs with real worker and server processes (cli.js worker / serve) on the test
 * database: a worker killed with SIGKILL, the server killed and started again, a job that failed
 * for good while no worker could report it.
 */
import { afterAll, afterEach, describe, expect, it } from "vitest";
import pg from "pg";
import { startTestServer, type TestServer } from "../support/test-server.js";
import type { ApiClient } from "./api-client.js";
import { lagFamily, smallComparison, waitForComparison } from "./comparison-fixtures.js";
import { workspaceWithTeam } from "./fixtures.js";
import { freePort, startServerProcess, startWorker, stopAll } from "./processes.js";

const servers: TestServer[] = [];
afterEach(async () => {
  await stopAll();
});
afterAll(async () => {
  await stopAll();
  for (const server of servers) await server.close();
});

/** A comparison whose pre-scan (1024 points on three variants, 16 chunks of 64) takes seconds, so that it can be interrupted. */
function longComparison(name: string, revisions: string[]) {
  return smallComparison(name, revisions, {
    scenario: { kind: "setpoint-step", horizon: 12, dt: 0.005 },
    budget: { prescan: 1024, starts: 2, evaluations: 60, stability: false },
  });
}

async function waitUntil(client: ApiClient, slug: string, id: string, until: (c: any) => boolean, timeoutMs: number) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const response = await client.get(`/api/workspaces/${slug}/comparisons/${id}`);
    expect(response.status).toBe(200);
    if (until(response.body)) return response.body;
    if (Date.now() > deadline) throw new Error(`comparison ${id}: condition not met, ${JSON.stringify(response.body.progress)} (${response.body.status})`);
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}

/** Stored pre-scan chunks and picks of a comparison: how many, and whether any is doubled or missing. */
async function storedPieces(id: string) {
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  const chunks = await db.query("select count(*)::int as n, sum(\"end\" - start)::int as points from comparison_chunk where comparison_id = $1 and status = 'done'", [id]);
  const picks = await db.query("select count(*)::int as n from comparison_pick where comparison_id = $1 and status = 'done'", [id]);
  await db.end();
  return { chunks: chunks.rows[0].n as number, points: chunks.rows[0].points as number, picks: picks.rows[0].n as number };
}

describe("a worker killed mid-comparison", () => {
  it("when a worker is killed with SIGKILL during the pre-scan, then the other finishes the comparison with every chunk and pick stored once", async () => {
    const server = await startTestServer({ embeddedWorker: false });
    servers.push(server);
    const team = await workspaceWithTeam(server.url, "Compare kill");
    const revisions = await lagFamily(team.engineer, team.slug, "Kill");
    const [victim, survivor] = await Promise.all([startWorker(), startWorker()]);
    const created = await team.engineer.post(`/api/workspaces/${team.slug}/comparisons`, longComparison("Survives a kill", revisions));
    expect(created.status).toBe(201);
    const id: string = created.body.id;
    await waitUntil(team.viewer, team.slug, id, (c) => c.progress.chunksDone >= 1, 60_000);
    await victim.stop("SIGKILL");
    // The victim's active chunk expires (LOOPYARD_CHUNK_EXPIRE_SECONDS = 4 s) and returns to the queue.
    const done = await waitForComparison(team.viewer, team.slug, id, 120_000);
    expect(done.status).toBe("finished");
    expect(done.progress.failures).toEqual([]);
    expect(await storedPieces(id)).toEqual({ chunks: 16, points: 1024, picks: 4 });
    const result = await team.viewer.get(`/api/workspaces/${team.slug}/comparisons/${id}/result`);
    expect(result.body.picks.every((p: { found: boolean }) => p.found)).toBe(true);
    await survivor.stop();
  }, 150_000);
});

describe("the server killed mid-comparison", () => {
  it("when the server process is killed with SIGKILL and started again, then the comparison resumes and finishes", async () => {
    const port = await freePort();
    const url = `http://127.0.0.1:${port}`;
    let serverProcess = await startServerProcess(port);
    const team = await workspaceWithTeam(url, "Compare restart");
    const revisions = await lagFamily(team.engineer, team.slug, "Restart");
    const created = await team.engineer.post(`/api/workspaces/${team.slug}/comparisons`, longComparison("Survives a restart", revisions));
    expect(created.status).toBe(201);
    const id: string = created.body.id;
    const before = await waitUntil(team.viewer, team.slug, id, (c) => c.progress.chunksDone >= 1, 60_000);
    await serverProcess.stop("SIGKILL");
    // Mid-comparison, not finished: the answer reads the comparison's row and its chunk counts in two
    // queries, so a chunk stored between them can show as done while the row still says queued.
    expect(["queued", "running"]).toContain(before.status);
    expect(before.progress.picksDone).toBe(0);

    serverProcess = await startServerProcess(port);
    // Sessions live in PostgreSQL and the secret is the same, so the viewer's cookie still works.
    const done = await waitForComparison(team.viewer, team.slug, id, 120_000);
    expect(done.status).toBe("finished");
    expect(await storedPieces(id)).toEqual({ chunks: 16, points: 1024, picks: 4 });
    await serverProcess.stop();
  }, 150_000);
});

describe("a comparison job that failed while no worker could report it", () => {
  it("when a chunk's job has failed for good but its chunk is still pending, then a starting worker marks it failed and the comparison fails with a sentence", async () => {
    const server = await startTestServer({ embeddedWorker: false });
    servers.push(server);
    const team = await workspaceWithTeam(server.url, "Compare orphan");
    const revisions = await lagFamily(team.engineer, team.slug, "Orphan");
    const created = await team.engineer.post(`/api/workspaces/${team.slug}/comparisons`, smallComparison("Orphaned chunk", revisions));
    expect(created.status).toBe(201);
    const id: string = created.body.id;
    // What pg-boss leaves when a worker is killed during a job's last attempt: the job failed, the piece pending.
    const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
    await db.connect();
    const changed = await db.query(
      "update pgboss.job set state = 'failed' where name = 'comparison-prescan' and data->>'comparisonId' = $1 and data->>'chunk' = '1'",
      [id],
    );
    await db.end();
    expect(changed.rowCount).toBe(1);
    const worker = await startWorker();
    const done = await waitForComparison(team.viewer, team.slug, id, 60_000);
    expect(done.status).toBe("failed");
    expect(done.error).toMatch(/pre-scan failed after its last retry/);
    expect(done.progress.failures).toEqual([{ what: "pre-scan chunk 1", error: expect.stringMatching(/its job failed after its last retry/) }]);
    await worker.stop();
  });
});
