/**
 * The demo comparison seeded by `npm test` (cli.js seed on loopyard_test): finished through the
 * comparison queues, readable by the demo viewer.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD, DEMO_WORKSPACE } from "../../packages/server/src/index.js";
import { DEMO_COMPARISON_NAME } from "../../packages/server/src/comparisons/comparison-demo.js";
import { startTestServer, type TestServer } from "../support/test-server.js";
import { ApiClient } from "./api-client.js";

let server: TestServer;
let jon: ApiClient;

beforeAll(async () => {
  server = await startTestServer();
  jon = new ApiClient(server.url);
  expect((await jon.signIn("jon@halvard.example", DEMO_PASSWORD)).status).toBe(200);
});
afterAll(async () => {
  await server?.close();
});

describe("the demo comparison", () => {
  it("when the viewer opens the Ember line's comparison, then it is finished with five contenders judged on eight figures and a summary", async () => {
    const list = await jon.get(`/api/workspaces/${DEMO_WORKSPACE.slug}/comparisons`);
    expect(list.status).toBe(200);
    const demo = list.body.find((c: { name: string }) => c.name === DEMO_COMPARISON_NAME);
    expect(demo).toBeDefined();
    expect(demo.status).toBe("finished");
    expect(demo.contenders).toEqual(["iae", "itae", "ise", "J(r=0.1)", "J(r=1)"]);
    expect(demo.judges).toHaveLength(8);
    expect(demo.family.map((v: { label: string }) => v.label)).toEqual(["Ember 200", "Ember 400", "Ember 800"]);
    const result = await jon.get(`/api/workspaces/${DEMO_WORKSPACE.slug}/comparisons/${demo.id}/result`);
    expect(result.status).toBe(200);
    expect(result.body.picks.filter((p: { found: boolean }) => p.found)).toHaveLength(5);
    // Every pick keeps both limits on every plate (the constraints of the demo).
    const ms = result.body.columns.findIndex((c: { key: string }) => c.key === "ms");
    const upeak = result.body.columns.findIndex((c: { key: string }) => c.key === "upeak");
    for (const pick of result.body.picks) {
      for (const row of pick.perVariant) {
        expect(row[ms]).toBeLessThanOrEqual(1.8);
        expect(row[upeak]).toBeLessThanOrEqual(10);
      }
    }
    expect(result.body.summary.length).toBeGreaterThanOrEqual(5);
    expect(result.body.stability.length).toBe(3 + 4);
  });
});
