// A candidate's response and |S|, |T| on a chosen variant of its family (?variant=k on …/response and
// …/frequency): the first variant by default, each variant's own plant (a separate revision, or the
// same revision with its parameters overridden), and a 400 naming the valid range for a variant the
// family does not have.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startTestServer, type TestServer } from "../support/test-server.js";
import { waitForSweep, workspaceWithTeam } from "./fixtures.js";

let server: TestServer;
let team: Awaited<ReturnType<typeof workspaceWithTeam>>;
const sweepsPath = () => `/api/workspaces/${team.slug}/sweeps`;

async function runSweep(input: Record<string, unknown>): Promise<string> {
  const created = await team.engineer.post(sweepsPath(), input);
  if (created.status !== 201) throw new Error(`starting the sweep answered ${created.status}: ${JSON.stringify(created.body)}`);
  const done = await waitForSweep(team.viewer, team.slug, created.body.id);
  expect(done.status).toBe("finished");
  return created.body.id as string;
}

beforeAll(async () => {
  server = await startTestServer();
  team = await workspaceWithTeam(server.url, "Variant responses");
});

afterAll(async () => {
  await server?.close();
});

describe("a candidate's response on a chosen variant", () => {
  let sweepId: string;

  beforeAll(async () => {
    // G_A = 1/(s + 1) and G_B = 2/(s + 1): one family, two revisions.
    const lagA = await team.engineer.post(`/api/workspaces/${team.slug}/plants`, { name: "Lag gain 1", unitsNote: "", model: { kind: "transfer-function", num: [1], den: [1, 1], delay: 0 } });
    const lagB = await team.engineer.post(`/api/workspaces/${team.slug}/plants`, { name: "Lag gain 2", unitsNote: "", model: { kind: "transfer-function", num: [2], den: [1, 1], delay: 0 } });
    expect(lagA.status).toBe(201);
    expect(lagB.status).toBe(201);
    sweepId = await runSweep({
      name: "P on two lags",
      plantRevisionId: lagA.body.revision.id,
      structure: "p",
      ranges: { kp: { min: 1, max: 3, count: 2 } },
      scenario: { horizon: 10, dt: 0.001 },
      criteria: ["ise", "effort"],
      family: { name: "Two lags", variants: [{ plantRevisionId: lagA.body.revision.id, label: "gain 1" }, { plantRevisionId: lagB.body.revision.id, label: "gain 2" }] },
    });
  });

  it("when ?variant=1 is asked, then the response is simulated on the second variant's plant", async () => {
    const path = `${sweepsPath()}/${sweepId}/candidates/0`;
    const first = await team.viewer.get(`${path}/response`);
    const second = await team.viewer.get(`${path}/response?variant=1`);
    const explicitFirst = await team.viewer.get(`${path}/response?variant=0`);
    expect(first.status).toBe(200);
    expect(second.status).toBe(200);
    expect(first.body.params).toEqual({ kp: 1 });
    // P control of K/(s + 1), setpoint step 1: y(∞) = kp·K/(1 + kp·K), reached with time constant 1/(1 + kp·K) s
    // (closed form; 10 s is 20 and 30 time constants): 1/2 on gain 1, 2/3 on gain 2.
    const last = (y: number[]) => y[y.length - 1] as number;
    expect(Math.abs(last(first.body.y) - 1 / 2)).toBeLessThan(1e-6);
    expect(Math.abs(last(second.body.y) - 2 / 3)).toBeLessThan(1e-6);
    // Without the parameter the first variant is used, as before.
    expect(explicitFirst.body.y).toEqual(first.body.y);
  });

  it("when ?variant=1 is asked of the frequency response, then |S| is the second variant's (closed form |S(jω)| = |jω + 1| / |jω + 1 + kp·K|)", async () => {
    const path = `${sweepsPath()}/${sweepId}/candidates/0/frequency`;
    for (const [query, gain] of [
      ["", 1],
      ["?variant=1", 2],
    ] as const) {
      const response = await team.viewer.get(`${path}${query}`);
      expect(response.status).toBe(200);
      const { omega, S } = response.body as { omega: number[]; S: number[] };
      for (const k of [0, Math.floor(omega.length / 2), omega.length - 1]) {
        const w = omega[k] as number;
        const exact = Math.hypot(1, w) / Math.hypot(1 + gain, w);
        expect(Math.abs((S[k] as number) - exact)).toBeLessThanOrEqual(1e-9 + 1e-6 * exact);
      }
    }
  });

  it("when a variant the family does not have, or not a whole number, is asked, then the API answers 400 naming the range", async () => {
    const path = `${sweepsPath()}/${sweepId}/candidates/0`;
    const beyond = await team.viewer.get(`${path}/response?variant=2`);
    expect(beyond.status).toBe(400);
    expect(beyond.body.error.message).toBe("This sweep has variants 0 to 1; there is no variant 2.");
    const negative = await team.viewer.get(`${path}/frequency?variant=-1`);
    expect(negative.status).toBe(400);
    expect(negative.body.error.message).toMatch(/^variant: /);
    const word = await team.viewer.get(`${path}/response?variant=second`);
    expect(word.status).toBe(400);
    expect(word.body.error.message).toMatch(/^variant: /);
  });
});

describe("a variant that overrides a nonlinear plant's parameters", () => {
  it("when ?variant=1 is asked, then the response uses the variant's parameter values", async () => {
    // dx/dt = (−x + K·u)/2 with K = 1, and K = 3 in the second variant (same revision, parameters overridden).
    const plant = await team.engineer.post(`/api/workspaces/${team.slug}/plants`, {
      name: "Lag with a gain parameter",
      unitsNote: "",
      model: { kind: "nonlinear", states: ["x"], parameters: { tau: 2, K: 1 }, derivatives: ["(-x + K*u) / tau"], output: "x", initial: [0] },
    });
    expect(plant.status).toBe(201);
    const rev = plant.body.revision.id;
    const sweepId = await runSweep({
      name: "P on a lag, two gains",
      plantRevisionId: rev,
      structure: "p",
      ranges: { kp: { min: 1, max: 2, count: 2 } },
      scenario: { horizon: 30, dt: 0.005 },
      criteria: ["ise", "effort"],
      family: { variants: [{ plantRevisionId: rev, label: "K = 1" }, { plantRevisionId: rev, label: "K = 3", parameters: { K: 3 } }] },
    });
    const path = `${sweepsPath()}/${sweepId}/candidates/0/response`;
    const first = await team.viewer.get(path);
    const second = await team.viewer.get(`${path}?variant=1`);
    expect(first.status).toBe(200);
    expect(second.status).toBe(200);
    // y(∞) = kp·K/(1 + kp·K) with kp = 1 (closed form; time constant 2/(1 + K) s, 30 s is 30 and 60 of them): 1/2 and 3/4.
    const last = (y: number[]) => y[y.length - 1] as number;
    expect(Math.abs(last(first.body.y) - 1 / 2)).toBeLessThan(1e-6);
    expect(Math.abs(last(second.body.y) - 3 / 4)).toBeLessThan(1e-6);
  });

  it("when a single-plant sweep is asked for variant 1, then the API answers 400 saying it has one variant", async () => {
    const plant = await team.engineer.post(`/api/workspaces/${team.slug}/plants`, { name: "Lone lag", unitsNote: "", model: { kind: "transfer-function", num: [1], den: [1, 1], delay: 0 } });
    const sweepId = await runSweep({
      name: "P on one lag",
      plantRevisionId: plant.body.revision.id,
      structure: "p",
      ranges: { kp: { min: 1, max: 2, count: 2 } },
      scenario: { horizon: 5, dt: 0.01 },
      criteria: ["ise"],
    });
    const response = await team.viewer.get(`${sweepsPath()}/${sweepId}/candidates/0/response?variant=1`);
    expect(response.status).toBe(400);
    expect(response.body.error.message).toBe("This sweep has one variant; use variant=0 or leave it out (got 1).");
  });
});
