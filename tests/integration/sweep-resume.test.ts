import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startTestServer, type TestServer } from "../support/test-server.js";
import { ApiClient } from "./api-client.js";
import { twoLagPlant, workspaceWithTeam } from "./fixtures.js";

const servers: TestServer[] = [];

afterAll(async () => {
  for (const server of servers) await server.close();
});

async function sweepState(client: ApiClient, path: string) {
  const response = await client.get(path);
  expect(response.status).toBe(200);
  return response.body as { status: string; done: number; total: number };
}

describe("sweep resume", () => {
  let first: TestServer;

  beforeAll(async () => {
    first = await startTestServer();
    servers.push(first);
  });

  it("when the server stops mid-sweep and a new one starts, then the sweep resumes and stores every candidate exactly once", async () => {
    const team = await workspaceWithTeam(first.url, "Resume");
    const plant = await team.engineer.post(`/api/workspaces/${team.slug}/plants`, twoLagPlant("Resume bench"));
    // 10 × 10 × 10 candidates at 60 001 samples each, with criteria that need the whole trace (tv, settling
    // time; core's scores-only path covers only IAE, ISE, ITAE and effort): long enough (seconds) to stop it part-way.
    const created = await team.engineer.post(`/api/workspaces/${team.slug}/sweeps`, {
      name: "Long grid",
      plantRevisionId: plant.body.revision.id,
      ranges: { kp: { min: 0.5, max: 5, count: 10 }, ki: { min: 0.1, max: 2, count: 10 }, kd: { min: 0, max: 1, count: 10 } },
      filter: { mode: "ratio", n: 10 },
      scenario: { horizon: 120, dt: 0.002 },
      criteria: ["iae", "effort", "tv", "settlingTime"],
    });
    expect(created.status).toBe(201);
    const path = `/api/workspaces/${team.slug}/sweeps/${created.body.id}`;

    let state = await sweepState(team.viewer, path);
    while (state.done === 0) {
      await new Promise((resolve) => setTimeout(resolve, 20));
      state = await sweepState(team.viewer, path);
    }
    await first.close();
    servers.splice(servers.indexOf(first), 1);

    const second = await startTestServer({ resumeSweeps: true });
    servers.push(second);
    // Each test server signs cookies with its own secret when none is given, so sign in again there.
    const viewer = new ApiClient(second.url);
    expect((await viewer.signIn(team.credentials.viewer.email, team.credentials.viewer.password)).status).toBe(200);

    const afterStop = await sweepState(viewer, path);
    expect(afterStop.status).toBe("running");
    expect(afterStop.done).toBeGreaterThan(0);
    expect(afterStop.done).toBeLessThan(1000);

    const deadline = Date.now() + 50_000;
    let finished = afterStop;
    while (finished.status !== "finished" && finished.status !== "failed" && Date.now() < deadline) {
      await new Promise((resolve) => setTimeout(resolve, 200));
      finished = await sweepState(viewer, path);
    }
    expect(finished.status).toBe("finished");
    expect(finished.done).toBe(1000);
    const list = await viewer.get(`${path}/candidates`);
    const indices = (list.body.candidates as { index: number }[]).map((c) => c.index);
    expect(indices).toEqual(Array.from({ length: 1000 }, (_, i) => i));
  });
});
