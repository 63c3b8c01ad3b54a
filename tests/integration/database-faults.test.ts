/**
 * Database faults: PostgreSQL stopped and started mid-sweep (the local cluster of the checkout, with
 * pg_ctl stop -m fast and start: every connection is cut with admin_shutdown, new ones are refused),
 * and the two ways a database says no without going away, each raised as PostgreSQL raises it
 * (SQLSTATE codes of the PostgreSQL 15 documentation, Appendix A):
 *
 * - connection limit: a role with CONNECTION LIMIT 0, so that every connection is refused with
 *   53300 too_many_connections, exactly as when max_connections is used up;
 * - disk full: a trigger that raises 53100 disk_full on one probe row, as PostgreSQL does when
 *   extending a file fails with ENOSPC (filling the real disk would harm everything else on it).
 *
 * Expected: 503 with a sentence and Retry-After, never a 500 and never a crash; after the restart
 * the server and the worker reconnect and the sweep finishes with every candidate exactly once.
 */
import { existsSync } from "node:fs";
import { fileURLToPath } from "node:url";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startTestServer, type TestServer } from "../support/test-server.js";
import { ApiClient, signedInClient } from "./api-client.js";
import { freePort, startServerProcess, startWorker, stopAll } from "./processes.js";
import { twoLagPlant, waitForSweep, workspaceWithTeam } from "./fixtures.js";

const REPO = fileURLToPath(new URL("../../", import.meta.url));
const databaseUrl = process.env.DATABASE_URL ?? "";
const localPort = Number(process.env.LOOPYARD_PG_PORT ?? 54329);
/** The restart test needs the checkout's own cluster (npm test's); with DATABASE_URL elsewhere it is skipped. */
const ownCluster = existsSync(`${REPO}.data/pg/PG_VERSION`) && new URL(databaseUrl || "postgres://x@h:1/x").port === String(localPort);

interface ClusterControl {
  findPgBinDir(): string;
  stopCluster(binDir: string): Promise<string>;
  startCluster(binDir: string, port: number): Promise<string>;
}

let server: TestServer;
let team: Awaited<ReturnType<typeof workspaceWithTeam>>;
let admin: pg.Client;

beforeAll(async () => {
  admin = new pg.Client({ connectionString: databaseUrl });
  await admin.connect();
});

afterAll(async () => {
  await admin?.end().catch(() => undefined);
});

describe("PostgreSQL stopped and started mid-sweep", () => {
  afterAll(stopAll);

  it.skipIf(!ownCluster)(
    "when the database stops while a sweep runs, then the server answers 503 with a sentence, and after the start the server and the worker go on and the sweep finishes with every candidate once",
    async () => {
      const control = (await import(`${REPO}scripts/lib/postgres.mjs`)) as ClusterControl;
      const binDir = control.findPgBinDir();
      // Real processes, as in production: a server with its embedded worker and one more worker.
      const port = await freePort();
      const serverProcess = await startServerProcess(port);
      const workerProcess = await startWorker();
      const url = `http://127.0.0.1:${port}`;
      const { client } = await signedInClient(url, "Restart");
      const workspace = await client.post("/api/workspaces", { name: "Restart bench" });
      const plant = await client.post(`/api/workspaces/${workspace.body.slug}/plants`, twoLagPlant("Restart plant"));
      // 60 × 50 PI grid: 3,000 candidates in 30 chunks, long enough to be caught mid-way.
      const created = await client.post(`/api/workspaces/${workspace.body.slug}/sweeps`, {
        name: "Through a restart",
        plantRevisionId: plant.body.revision.id,
        structure: "pi",
        ranges: { kp: { min: 0.2, max: 4, count: 60 }, ki: { min: 0.05, max: 2, count: 50 } },
        scenario: { kind: "setpoint-step", horizon: 20, dt: 0.01 },
        criteria: ["iae", "ise", "effort"],
      });
      expect(created.status).toBe(201);
      const sweepId: string = created.body.id;
      const path = `/api/workspaces/${workspace.body.slug}/sweeps/${sweepId}`;
      for (let done = 0; done === 0; ) {
        await new Promise((resolve) => setTimeout(resolve, 200));
        done = (await client.get(path)).body.done;
      }
      await admin.end();
      await control.stopCluster(binDir);
      try {
        // Past the session cache's few seconds, so that the request needs the database.
        await new Promise((resolve) => setTimeout(resolve, 6_000));
        const away = await client.get(path);
        expect(away.status).toBe(503);
        expect(away.body.error.message).toMatch(/database is not answering/);
        expect(Number(away.headers.get("retry-after"))).toBeGreaterThan(0);
        expect((await new ApiClient(url).get("/api/health")).status).toBe(200);
      } finally {
        await control.startCluster(binDir, localPort);
      }
      admin = new pg.Client({ connectionString: databaseUrl });
      await admin.connect();
      const finished = await waitForSweep(client, workspace.body.slug, sweepId, 240_000);
      expect(finished.status).toBe("finished");
      expect(finished.done).toBe(3_000);
      const { rows } = await admin.query("select count(*)::int as n, count(distinct index)::int as distinct_n from candidate where sweep_id = $1", [sweepId]);
      expect(rows[0]).toEqual({ n: 3_000, distinct_n: 3_000 });
      // Neither process died on the way.
      expect(serverProcess.child.exitCode, serverProcess.output().slice(-2_000)).toBeNull();
      expect(workerProcess.child.exitCode, workerProcess.output().slice(-2_000)).toBeNull();
    },
    360_000,
  );
});

describe("database refusals", () => {
  // Started after the restart test: an in-process server there would lose its connections too.
  beforeAll(async () => {
    server = await startTestServer({ embeddedWorker: false });
    team = await workspaceWithTeam(server.url, "Faults");
  }, 120_000);

  afterAll(async () => {
    await server?.close();
  });

  it("when the database refuses connections (too many connections), then 503 with a sentence and Retry-After", async () => {
    await admin.query("drop role if exists loopyard_limited");
    await admin.query("create role loopyard_limited login password 'limited' connection limit 0");
    const limitedUrl = new URL(databaseUrl);
    limitedUrl.username = "loopyard_limited";
    limitedUrl.password = "limited";
    const limited = await startTestServer({ databaseUrl: limitedUrl.toString(), embeddedWorker: false });
    try {
      const client = new ApiClient(limited.url);
      const response = await client.request("POST", "/api/auth/sign-in/email", { json: { email: "priya@halvard.example", password: "ember-demo-2026" } });
      expect(response.status).toBe(503);
      expect(response.body.error.message).toMatch(/database is not answering/);
      expect(Number(response.headers.get("retry-after"))).toBeGreaterThan(0);
      expect((await client.get("/api/health")).status).toBe(200);
    } finally {
      await limited.close();
      await admin.query("drop role if exists loopyard_limited");
    }
  });

  it("when the disk is full (53100), then saving a plant answers 503 with a sentence, and nothing is stored", async () => {
    await admin.query(`
      create or replace function loopyard_disk_full_probe() returns trigger language plpgsql as $$
      begin
        if new.name = 'Disk full probe' then
          raise exception 'could not extend file: No space left on device' using errcode = 'disk_full';
        end if;
        return new;
      end $$`);
    await admin.query("create trigger loopyard_disk_full_probe before insert on plant for each row execute function loopyard_disk_full_probe()");
    try {
      const response = await team.engineer.post(`/api/workspaces/${team.slug}/plants`, twoLagPlant("Disk full probe"));
      expect(response.status).toBe(503);
      expect(response.body.error.message).toMatch(/out of disk space/);
      const list = await team.viewer.get(`/api/workspaces/${team.slug}/plants`);
      expect(list.body.map((p: { name: string }) => p.name)).not.toContain("Disk full probe");
    } finally {
      await admin.query("drop trigger if exists loopyard_disk_full_probe on plant");
      await admin.query("drop function if exists loopyard_disk_full_probe()");
    }
  });
});
