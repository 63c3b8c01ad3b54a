// Computations whose cost users control run off the server's main thread, under a work budget and
// a time limit, and a plant's preview is stored once (issue 11, item 1). Reference for the stiff
// model: an explicit Runge–Kutta method is stable only for h·|λ| within its stability region
// (about 3.3 for Dormand–Prince 5(4); E. Hairer and G. Wanner, Solving Ordinary Differential
// Equations II, 2nd ed., 1996, §IV.2), so a pole at −10⁷ forces steps of about 3·10⁻⁷ s over a
// horizon of seconds set by the slow pole at −1: some 10⁸ right-hand-side evaluations.
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startTestServer, type TestServer } from "../support/test-server.js";
import { twoLagPlant, workspaceWithTeam } from "./fixtures.js";

let server: TestServer;
let team: Awaited<ReturnType<typeof workspaceWithTeam>>;
let db: pg.Client;

beforeAll(async () => {
  server = await startTestServer();
  team = await workspaceWithTeam(server.url, "Offload");
  db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
});

afterAll(async () => {
  await db?.end();
  await server?.close();
});

const plantsPath = () => `/api/workspaces/${team.slug}/plants`;

/** dx/dt = z − x, dz/dt = g·(u − z) + 200 terms that add nothing: poles −1 and −g, with g = 10⁷. */
function stiffPlant(name: string) {
  const noOps = " + 0".repeat(200);
  return {
    name,
    unitsNote: "",
    model: {
      kind: "nonlinear",
      states: ["x", "z"],
      parameters: { g: 1e7 },
      derivatives: ["z - x", `g*(u - z)${noOps}`],
      output: "x",
      initial: [0, 0],
    },
  };
}

/** Times GET /api/health from this process every 50 ms until `done` settles; returns the slowest answer [ms]. */
async function slowestHealthWhile(done: Promise<unknown>): Promise<{ slowest: number; answers: number }> {
  let finished = false;
  void done.finally(() => {
    finished = true;
  });
  let slowest = 0;
  let answers = 0;
  while (!finished) {
    const start = performance.now();
    const response = await fetch(`${server.url}/api/health`);
    await response.arrayBuffer();
    slowest = Math.max(slowest, performance.now() - start);
    if (response.status === 200) answers++;
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
  return { slowest, answers };
}

describe("a stiff plant", () => {
  it("when an engineer creates a plant too stiff for the explicit solver, then the answer is 422 with a sentence and /api/health keeps answering within 200 ms meanwhile", async () => {
    await (await fetch(`${server.url}/api/health`)).arrayBuffer(); // the client's first connection, not the server's answer
    const creating = team.engineer.post(plantsPath(), stiffPlant("Stiff ember coil"));
    const health = await slowestHealthWhile(creating);
    const response = await creating;
    expect(response.status).toBe(422);
    expect(response.body.error.message).toMatch(/^The open-loop step of this plant is more work than the lab allows for one request \(/);
    expect(response.body.error.message).toMatch(/rescale its gains or time constants/);
    // The main thread stayed free: health answered while the step was being computed (common practice: 200 ms).
    expect(health.answers).toBeGreaterThan(0);
    expect(health.slowest).toBeLessThan(200);
    const list = await team.viewer.get(plantsPath());
    expect(list.body.map((p: { name: string }) => p.name)).not.toContain("Stiff ember coil");
  });
});

describe("stored previews", () => {
  it("when a plant is created, then its poles and step are stored with the revision and a view reads them instead of computing them again", async () => {
    const created = await team.engineer.post(plantsPath(), twoLagPlant("Stored preview plate"));
    expect(created.status).toBe(201);
    const revisionId: string = created.body.revision.id;
    const row = await db.query("SELECT preview FROM plant_revision WHERE id = $1", [revisionId]);
    const stored = row.rows[0].preview;
    expect(stored.step).toEqual(created.body.step);
    expect(stored.poles).toEqual(created.body.poles);
    // Mark the stored step: a view that recomputed it would answer the model's step, not the mark.
    const marked = { ...stored, step: { t: [0, 1], y: [0, 12345] } };
    await db.query("UPDATE plant_revision SET preview = $2 WHERE id = $1", [revisionId, marked]);
    const viewed = await team.viewer.get(`${plantsPath()}/${created.body.plant.id}`);
    expect(viewed.status).toBe(200);
    expect(viewed.body.step).toEqual({ t: [0, 1], y: [0, 12345] });
  });

  it("when a revision stored without a preview is viewed, then its preview is computed once and stored", async () => {
    const created = await team.engineer.post(plantsPath(), twoLagPlant("Older revision plate"));
    const revisionId: string = created.body.revision.id;
    await db.query("UPDATE plant_revision SET preview = NULL WHERE id = $1", [revisionId]);
    const viewed = await team.viewer.get(`${plantsPath()}/${created.body.plant.id}`);
    expect(viewed.status).toBe(200);
    // G(s) = 1/((s+1)(s+2)): y(t) = 1/2 − e^(−t) + e^(−2t)/2 (closed form, partial fractions).
    const { t, y } = viewed.body.step as { t: number[]; y: number[] };
    for (let i = 0; i < t.length; i += 50) expect(y[i]).toBeCloseTo(0.5 - Math.exp(-t[i]!) + Math.exp(-2 * t[i]!) / 2, 9);
    const row = await db.query("SELECT preview FROM plant_revision WHERE id = $1", [revisionId]);
    expect(row.rows[0].preview.step).toEqual(viewed.body.step);
  });
});

describe("sizes validated before anything is allocated", () => {
  it("when a state-feedback sweep names k[999999999], then the answer is 400 with a sentence, quickly, and the server keeps answering", async () => {
    const plant = await team.engineer.post(plantsPath(), twoLagPlant("Gain index plate"));
    const start = performance.now();
    const response = await team.engineer.post(`/api/workspaces/${team.slug}/sweeps`, {
      name: "Huge gain index",
      plantRevisionId: plant.body.revision.id,
      structure: "state-feedback",
      ranges: { "k[999999999]": { min: 0, max: 1, count: 2 } },
      fixed: { n: 1 },
      scenario: { horizon: 10, dt: 0.01 },
      criteria: ["iae"],
    });
    const elapsed = performance.now() - start;
    expect(response.status).toBe(400);
    expect(response.body.error.message).toMatch(/state feedback takes at most \d+ gains k\[0\]…k\[\d+\], one per plant state; "k\[999999999\]" is beyond them/);
    // Refused from the name alone (no list of a billion names): far below a second (common practice).
    expect(elapsed).toBeLessThan(1000);
    const health = await fetch(`${server.url}/api/health`);
    expect(health.status).toBe(200);
  });
});
