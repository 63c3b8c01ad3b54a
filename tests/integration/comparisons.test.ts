/**
 * Comparisons over real HTTP on the test database: created by an engineer, run through the job
 * queues by the embedded worker, read by a viewer.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startTestServer, type TestServer } from "../support/test-server.js";
import { lagFamily, smallComparison, waitForComparison } from "./comparison-fixtures.js";
import { workspaceWithTeam } from "./fixtures.js";

let server: TestServer;
let team: Awaited<ReturnType<typeof workspaceWithTeam>>;
let revisions: string[];

beforeAll(async () => {
  server = await startTestServer();
  team = await workspaceWithTeam(server.url, "Compare");
  revisions = await lagFamily(team.engineer, team.slug, "Compare");
});

afterAll(async () => {
  await server?.close();
});

describe("comparisons", () => {
  it("when an engineer starts a comparison, then it finishes with a pick per contender, regret 0 on the diagonal and every pick within its constraint", async () => {
    const path = `/api/workspaces/${team.slug}/comparisons`;
    const created = await team.engineer.post(path, smallComparison("Four criteria", revisions, { budget: { prescan: 64, starts: 2, evaluations: 60, stability: true } }));
    expect(created.status).toBe(201);
    expect(created.body.contenders).toEqual(["iae", "itae", "ise", "J(r=0.05)"]);
    const done = await waitForComparison(team.viewer, team.slug, created.body.id);
    expect(done.status).toBe("finished");
    expect(done.progress.prescanDone).toBe(64);
    expect(done.progress.picksDone).toBe(4);

    const result = await team.viewer.get(`${path}/${created.body.id}/result`);
    expect(result.status).toBe(200);
    const { crossScore, picks } = result.body;
    expect(crossScore.rows).toEqual(["iae", "itae", "ise", "J(r=0.05)"]);
    // Regret is measured against the best pick of each column, so a contender's own pick has none (definition of regret).
    for (let k = 0; k < 4; k++) expect(crossScore.regrets[k][k]).toBe(0);
    const ms = crossScore.columns.indexOf("ms");
    for (const pick of picks) {
      expect(pick.found).toBe(true);
      for (const row of pick.perVariant) expect(row[ms]).toBeLessThanOrEqual(1.8);
    }
    // Kendall's τ of a criterion with itself is 1 (definition); the summary is sentences built from the numbers.
    for (let a = 0; a < result.body.agreement.columns.length; a++) expect(result.body.agreement.tau[a][a]).toBeCloseTo(1, 12);
    expect(result.body.summary.length).toBeGreaterThan(1);
    expect(result.body.summary[0]).toMatch(/^Of 64 pre-scan candidates, \d+ are stable on all 3 variants and \d+ of them meet Ms ≤ 1.8 on every variant\.$/);
    expect(result.body.perVariant).toHaveLength(4);
    // Stability: each of the 3 variants left out, and the one quadratic weight r halved and doubled.
    expect(result.body.stability.map((e: { label: string }) => e.label)).toEqual(["without gain 1", "without gain 1.4", "without gain 0.7", "J(r=0.05) with r = 0.025", "J(r=0.05) with r = 0.1"]);
    expect(result.body.variants).toEqual(["gain 1", "gain 1.4", "gain 0.7"]);
  }, 150_000);

  it("when finished comparisons share contenders, then the across page lines up each contender's regret on the chosen judge", async () => {
    const path = `/api/workspaces/${team.slug}/comparisons`;
    const across = await team.viewer.get(`${path}/across?judge=overshoot`);
    expect(across.status).toBe(200);
    const finished = (await team.viewer.get(path)).body.filter((c: { status: string }) => c.status === "finished");
    expect(across.body.comparisons.map((c: { id: string }) => c.id).sort()).toEqual(finished.map((c: { id: string }) => c.id).sort());
    expect(across.body.rows.map((r: { contender: string }) => r.contender)).toEqual(["iae", "itae", "ise", "J(r=0.05)"]);
    // Each cell is the stored cross-score's regret on overshoot for that contender's pick.
    const first = across.body.comparisons[0].id;
    const stored = (await team.viewer.get(`${path}/${first}/result`)).body.crossScore;
    const col = stored.columns.indexOf("overshoot");
    across.body.rows.forEach((row: { regrets: (number | null)[] }, i: number) => expect(row.regrets[0]).toBe(stored.regrets[i][col]));
    const unknown = await team.viewer.get(`${path}/across?judge=nope`);
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.message).toMatch(/no finished comparison scored “nope”/);
  });

  it("when the same comparison runs twice with one seed, then the picks are the same", async () => {
    const path = `/api/workspaces/${team.slug}/comparisons`;
    const params = [];
    for (const name of ["Seeded once", "Seeded twice"]) {
      const created = await team.engineer.post(path, smallComparison(name, revisions));
      expect(created.status).toBe(201);
      expect((await waitForComparison(team.viewer, team.slug, created.body.id)).status).toBe("finished");
      params.push((await team.viewer.get(`${path}/${created.body.id}/result`)).body.picks.map((p: { params: unknown }) => p.params));
    }
    expect(params[1]).toEqual(params[0]);
  }, 150_000);

  it("when the responses are asked for, then each pick is simulated on its worst variant, or all on the chosen one", async () => {
    const path = `/api/workspaces/${team.slug}/comparisons`;
    const [first] = (await team.viewer.get(path)).body.filter((c: { status: string }) => c.status === "finished");
    const worst = await team.viewer.get(`${path}/${first.id}/responses`);
    expect(worst.status).toBe(200);
    expect(worst.body.variant).toBeNull();
    expect(worst.body.picks).toHaveLength(4);
    for (const p of worst.body.picks) {
      expect(p.status).toBe("ok");
      expect(p.t.length).toBeGreaterThan(100);
      expect(p.t.at(-1)).toBeCloseTo(12, 6);
      expect(p.sensitivity.length).toBeGreaterThan(10);
      // Ms ≤ 1.8 holds on every variant, so the plotted |S| peak (kept in the thinned grid) does too.
      expect(Math.max(...p.sensitivity)).toBeLessThanOrEqual(1.8 + 1e-9);
    }
    const second = await team.viewer.get(`${path}/${first.id}/responses?variant=1`);
    expect(second.body.picks.map((p: { variant: number }) => p.variant)).toEqual([1, 1, 1, 1]);
    const outside = await team.viewer.get(`${path}/${first.id}/responses?variant=3`);
    expect(outside.status).toBe(400);
    expect(outside.body.error.message).toMatch(/variants 0 to 2/);
  });

  it("when a viewer starts a comparison or the input is bad, then the answer is a 4xx sentence and nothing is stored", async () => {
    const path = `/api/workspaces/${team.slug}/comparisons`;
    const before = (await team.viewer.get(path)).body.length;
    const refused = await team.viewer.post(path, smallComparison("Viewer's", revisions));
    expect(refused.status).toBe(403);
    expect(refused.body.error.message).toMatch(/Starting comparisons needs the engineer role/);
    const noContenders = await team.engineer.post(path, smallComparison("None", revisions, { contenders: [] }));
    expect(noContenders.status).toBe(400);
    expect(noContenders.body.error.field).toBe("contenders");
    const judgeTwice = await team.engineer.post(path, smallComparison("Twice", revisions, { judges: ["iae"] }));
    expect(judgeTwice.status).toBe(400);
    expect(judgeTwice.body.error.field).toBe("judges.0");
    const missing = await team.engineer.post(path, smallComparison("Missing", ["00000000-0000-4000-8000-000000000000"]));
    expect(missing.status).toBe(400);
    expect(missing.body.error.message).toMatch(/no such plant revision/);
    expect((await team.viewer.get(path)).body.length).toBe(before);
    const early = await team.viewer.get(`${path}/00000000-0000-4000-8000-000000000000/result`);
    expect(early.status).toBe(404);
  });

  it("when a running comparison is cancelled, then it stops as cancelled and has no result", async () => {
    const path = `/api/workspaces/${team.slug}/comparisons`;
    const created = await team.engineer.post(path, smallComparison("Cancelled", revisions, { budget: { prescan: 4096, starts: 2, evaluations: 60, stability: false } }));
    expect(created.status).toBe(201);
    const viewerCancel = await team.viewer.post(`${path}/${created.body.id}/cancel`, {});
    expect(viewerCancel.status).toBe(403);
    const cancelled = await team.engineer.post(`${path}/${created.body.id}/cancel`, {});
    expect(cancelled.status).toBe(200);
    expect(cancelled.body.status).toBe("cancelled");
    const again = await team.engineer.post(`${path}/${created.body.id}/cancel`, {});
    expect(again.status).toBe(409);
    const result = await team.viewer.get(`${path}/${created.body.id}/result`);
    expect(result.status).toBe(409);
    expect(result.body.error.message).toMatch(/cancelled/);
  });
});
