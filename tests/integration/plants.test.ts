import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startTestServer, type TestServer } from "../support/test-server.js";
import { ApiClient } from "./api-client.js";
import { twoLagPlant, workspaceWithTeam } from "./fixtures.js";

let server: TestServer;
let team: Awaited<ReturnType<typeof workspaceWithTeam>>;

beforeAll(async () => {
  server = await startTestServer();
  team = await workspaceWithTeam(server.url, "Plants");
});

afterAll(async () => {
  await server?.close();
});

const plantsPath = () => `/api/workspaces/${team.slug}/plants`;

describe("plant library roles", () => {
  it("when a viewer creates a plant, then the answer is 403 with a sentence naming the engineer role", async () => {
    const response = await team.viewer.post(plantsPath(), twoLagPlant("Refused plant"));
    expect(response.status).toBe(403);
    expect(response.body.error.message).toBe(
      `Creating plants needs the engineer role or higher in ${team.name}; you are a viewer.`,
    );
  });

  it("when a viewer sends an invalid plant, then the role is refused before the fields are judged", async () => {
    const response = await team.viewer.post(plantsPath(), { name: "" });
    expect(response.status).toBe(403);
  });

  it("when a viewer reads the library, then the list is served", async () => {
    const response = await team.viewer.get(plantsPath());
    expect(response.status).toBe(200);
    expect(Array.isArray(response.body)).toBe(true);
  });

  it("when the demo viewer creates a plant in the demo workspace, then the answer is 403", async () => {
    const jon = new ApiClient(server.url);
    expect((await jon.signIn("jon@halvard.example", "ember-demo-2026")).status).toBe(200);
    const response = await jon.post("/api/workspaces/halvard-thermal/plants", twoLagPlant("Refused demo plant"));
    expect(response.status).toBe(403);
    expect(response.body.error.message).toBe(
      "Creating plants needs the engineer role or higher in Halvard Thermoworks — Ember line; you are a viewer.",
    );
  });

  it("when a user outside the workspace reads it, then the answer is the 404 of a workspace that does not exist, naming nothing", async () => {
    const outsider = await workspaceWithTeam(server.url, "Outsider");
    const refused = await outsider.engineer.get(plantsPath());
    const missing = await outsider.engineer.get("/api/workspaces/no-such-workspace-anywhere/plants");
    expect(refused.status).toBe(404);
    expect(missing.status).toBe(404);
    expect(refused.body.error.message).not.toContain(team.name);
    expect(refused.body.error.message.replace(team.slug, "SLUG")).toBe(missing.body.error.message.replace("no-such-workspace-anywhere", "SLUG"));
  });

  it("when an engineer invites someone, then the answer is 403 naming the admin role", async () => {
    const response = await team.engineer.post(`/api/workspaces/${team.slug}/invitations`, { email: "jon@halvard.example", role: "viewer" });
    expect(response.status).toBe(403);
    expect(response.body.error.message).toBe(`Inviting people needs the admin role in ${team.name}; you are an engineer.`);
  });
});

describe("plant creation", () => {
  it("when an engineer creates 1/((s+1)(s+2)), then the answer is 201 with poles −1 and −2", async () => {
    const response = await team.engineer.post(plantsPath(), twoLagPlant("Two lags"));
    expect(response.status).toBe(201);
    const detail = response.body;
    expect(detail.revision.number).toBe(1);
    expect(detail.revision.model).toEqual({ kind: "transfer-function", num: [1], den: [1, 3, 2], delay: 0 });
    // Closed form: s² + 3s + 2 = (s + 1)(s + 2), so the poles are −1 and −2, both real.
    const poles = [...detail.poles].sort((a: { re: number }, b: { re: number }) => a.re - b.re);
    expect(poles).toHaveLength(2);
    expect(poles[0].re).toBeCloseTo(-2, 9);
    expect(poles[1].re).toBeCloseTo(-1, 9);
    expect(Math.abs(poles[0].im)).toBeLessThan(1e-9);
    expect(Math.abs(poles[1].im)).toBeLessThan(1e-9);
    // Closed form: Y(s) = 1/(s(s+1)(s+2)) = (1/2)/s − 1/(s+1) + (1/2)/(s+2),
    // so y(t) = 1/2 − e^(−t) + e^(−2t)/2 at every sample (atol 1e-6).
    const { t, y } = detail.step as { t: number[]; y: number[] };
    expect(t.length).toBeGreaterThan(10);
    expect(t.length).toBeLessThanOrEqual(2000);
    expect(y).toHaveLength(t.length);
    const worst = Math.max(...t.map((tk, k) => Math.abs((y[k] as number) - (0.5 - Math.exp(-tk) + 0.5 * Math.exp(-2 * tk)))));
    expect(worst).toBeLessThan(1e-6);

    const listed = await team.viewer.get(plantsPath());
    expect(listed.body.map((p: { id: string }) => p.id)).toContain(detail.plant.id);
  });

  const badInputs: { label: string; model: Record<string, unknown>; field: string; message?: string }[] = [
    {
      label: "a leading zero in the denominator",
      model: { num: [1], den: [0, 1, 2] },
      field: "model.den",
      message: "model.den: the leading denominator coefficient must be non-zero",
    },
    { label: "an improper plant", model: { num: [1, 0, 0], den: [1, 1] }, field: "model.num" },
    { label: "order above 10", model: { num: [1], den: Array.from({ length: 12 }, () => 1) }, field: "model.den" },
    { label: "a negative dead time", model: { num: [1], den: [1, 1], delay: -0.5 }, field: "model.delay" },
    { label: "a missing coefficient (null)", model: { num: [1, null], den: [1, 1, 1] }, field: "model.num.1" },
  ];

  for (const bad of badInputs) {
    it(`when an engineer sends ${bad.label}, then the answer is 400 naming ${bad.field}`, async () => {
      const response = await team.engineer.post(plantsPath(), {
        name: "Bad plant",
        unitsNote: "",
        model: { kind: "transfer-function", delay: 0, ...bad.model },
      });
      expect(response.status).toBe(400);
      expect(response.body.error.field).toBe(bad.field);
      expect(response.body.error.message.startsWith(`${bad.field}: `)).toBe(true);
      if (bad.message) expect(response.body.error.message).toBe(bad.message);
    });
  }

  it("when a coefficient overflows to infinity (1e999 in the JSON), then the answer is 400 naming that coefficient", async () => {
    const response = await team.engineer.request("POST", plantsPath(), {
      rawBody: '{"name":"Overflow","unitsNote":"","model":{"kind":"transfer-function","num":[1e999],"den":[1,1],"delay":0}}',
    });
    expect(response.status).toBe(400);
    expect(response.body.error.field).toBe("model.num.0");
  });

  it("when the name is blank, then the answer is 400 naming name", async () => {
    const response = await team.engineer.post(plantsPath(), { ...twoLagPlant("x"), name: "   " });
    expect(response.status).toBe(400);
    expect(response.body.error.field).toBe("name");
  });
});

describe("plant revisions", () => {
  it("when an engineer saves a new revision, then the old revision reads exactly as before", async () => {
    const created = await team.engineer.post(plantsPath(), twoLagPlant("Revised lags"));
    const plantId: string = created.body.plant.id;
    const original = created.body.revision;

    const revised = await team.engineer.post(`${plantsPath()}/${plantId}/revisions`, {
      name: "Revised lags, slower",
      unitsNote: "second measurement",
      note: "refitted from the second step test",
      model: { kind: "transfer-function", num: [2], den: [1, 5, 6], delay: 0.5 },
    });
    expect(revised.status).toBe(201);
    expect(revised.body.revision.number).toBe(2);
    expect(revised.body.revision.id).not.toBe(original.id);
    expect(revised.body.plant.revisionCount).toBe(2);
    expect(revised.body.plant.name).toBe("Revised lags, slower");

    const first = await team.viewer.get(`${plantsPath()}/${plantId}?revision=1`);
    expect(first.status).toBe(200);
    expect(first.body.revision).toEqual(original);

    const latest = await team.viewer.get(`${plantsPath()}/${plantId}`);
    expect(latest.body.revision.number).toBe(2);
    expect(latest.body.revisions.map((r: { number: number }) => r.number)).toEqual([1, 2]);
  });

  it("when a viewer saves a revision, then the answer is 403 naming the engineer role", async () => {
    const created = await team.engineer.post(plantsPath(), twoLagPlant("Viewer cannot revise"));
    const response = await team.viewer.post(`${plantsPath()}/${created.body.plant.id}/revisions`, twoLagPlant("x"));
    expect(response.status).toBe(403);
    expect(response.body.error.message).toBe(`Editing plants needs the engineer role or higher in ${team.name}; you are a viewer.`);
  });

  it("when a revision or plant does not exist, then the answer is 404 (and 400 for a malformed revision number)", async () => {
    const created = await team.engineer.post(plantsPath(), twoLagPlant("One revision only"));
    const plantId: string = created.body.plant.id;
    expect((await team.viewer.get(`${plantsPath()}/${plantId}?revision=7`)).status).toBe(404);
    expect((await team.viewer.get(`${plantsPath()}/00000000-0000-4000-8000-000000000000`)).status).toBe(404);
    expect((await team.viewer.get(`${plantsPath()}/not-a-uuid`)).status).toBe(404);
    const malformed = await team.viewer.get(`${plantsPath()}/${plantId}?revision=two`);
    expect(malformed.status).toBe(400);
    expect(malformed.body.error.field).toBe("revision");
  });
});
