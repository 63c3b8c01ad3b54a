// The deployment sheet of a sweep candidate over real HTTP (GET …/sweeps/:id/candidates/:index/sheet):
// the coefficients of the closed forms, every variant re-simulated, and a sentence for every sample
// time it refuses (400 for a value that is never valid, 422 for one this design cannot take).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startTestServer, type TestServer } from "../support/test-server.js";
import { waitForSweep, workspaceWithTeam } from "./fixtures.js";

let server: TestServer;
let team: Awaited<ReturnType<typeof workspaceWithTeam>>;
let sheetPath: (index: number) => string;

beforeAll(async () => {
  server = await startTestServer();
  team = await workspaceWithTeam(server.url, "Deployment sheet");
  // G_A = 1/(s + 1) and G_B = 2/(s + 1): one family, two revisions; P control with kp ∈ {1, 3}.
  const lagA = await team.engineer.post(`/api/workspaces/${team.slug}/plants`, { name: "Lag gain 1", unitsNote: "", model: { kind: "transfer-function", num: [1], den: [1, 1], delay: 0 } });
  const lagB = await team.engineer.post(`/api/workspaces/${team.slug}/plants`, { name: "Lag gain 2", unitsNote: "", model: { kind: "transfer-function", num: [2], den: [1, 1], delay: 0 } });
  expect(lagA.status, JSON.stringify(lagA.body)).toBe(201);
  expect(lagB.status, JSON.stringify(lagB.body)).toBe(201);
  const created = await team.engineer.post(`/api/workspaces/${team.slug}/sweeps`, {
    name: "PI on two lags",
    plantRevisionId: lagA.body.revision.id,
    structure: "pi",
    ranges: { kp: { min: 1, max: 3, count: 2 }, ki: { min: 0.5, max: 0.5, count: 1 } },
    scenario: { horizon: 10, dt: 0.001 },
    criteria: ["iae", "overshoot", "ms"],
    family: { name: "Two lags", variants: [{ plantRevisionId: lagA.body.revision.id, label: "gain 1" }, { plantRevisionId: lagB.body.revision.id, label: "gain 2" }] },
  });
  expect(created.status, JSON.stringify(created.body)).toBe(201);
  const done = await waitForSweep(team.viewer, team.slug, created.body.id);
  expect(done.status).toBe("finished");
  sheetPath = (index) => `/api/workspaces/${team.slug}/sweeps/${created.body.id}/candidates/${index}/sheet`;
}, 120_000);

afterAll(async () => {
  await server?.close();
});

describe("GET …/candidates/:index/sheet", () => {
  it("when a viewer asks for Tustin at 100 Hz in Q15, then the coefficients are the closed forms and every variant is re-simulated", async () => {
    const response = await team.viewer.get(`${sheetPath(0)}?sampleTime=0.01&method=tustin&format=q15`);
    expect(response.status, JSON.stringify(response.body)).toBe(200);
    const sheet = response.body;
    expect(sheet.version).toBe(1);
    expect(sheet.controller).toMatchObject({ kind: "pi", parameters: { kp: 1, ki: 0.5 } });
    // Tustin of kp + ki/s (Åström & Wittenmark 1997, §8.2; derived in discretize-pid.ts): pr = py = kp, bi1 = bi0 = ki·h/2.
    const value = (name: string) => sheet.discrete.coefficients.find((c: { name: string }) => c.name === name).value;
    expect(value("py")).toBe(1);
    expect(Math.abs(value("bi1") - 0.5 * 0.005)).toBeLessThan(1e-17);
    expect(Math.abs(value("bi0") - 0.5 * 0.005)).toBeLessThan(1e-17);
    // Ideal form K = kp, Ti = kp/ki = 2 s; a PI's series form is the same (Åström & Hägglund 2006, §3.2).
    expect(sheet.forms.ideal).toMatchObject({ exists: true, gain: 1, integralTime: 2 });
    expect(sheet.forms.series).toMatchObject({ exists: true, gain: 1, integralTime: 2, derivativeTime: 0 });
    expect(sheet.fixedPoint.format).toBe("q15");
    expect(sheet.variants.map((v: { label: string }) => v.label)).toEqual(["gain 1", "gain 2"]);
    expect(sheet.variants[1].revision.plantName).toBe("Lag gain 2");
    for (const v of sheet.variants) {
      expect(v.sampled.status).toBe("ok");
      expect(v.rounded.status).toBe("ok");
      // IAE of the sampled loop within 5 % of the continuous one at h = 0.01 s (a tenth of the loop's time constant or less).
      expect(Math.abs(v.sampled.scores[0] - v.continuous.scores[0])).toBeLessThan(0.05 * v.continuous.scores[0]);
    }
    expect(sheet.caution).toMatch(/real machine/);
    expect(sheet.discrete.equations.join("\n")).toContain("Ī[k+1]");
  });

  it("when the sample time is missing, not a number, zero or negative, then 400 with a sentence naming sampleTime", async () => {
    for (const query of ["", "?sampleTime=", "?sampleTime=abc", "?sampleTime=0", "?sampleTime=-0.01", "?sampleTime=NaN", "?sampleTime=Infinity"]) {
      const response = await team.viewer.get(`${sheetPath(0)}${query}`);
      expect(response.status, query).toBe(400);
      expect(response.body.error.field).toBe("sampleTime");
      expect(response.body.error.message, query).toMatch(/sample time/);
    }
    const method = await team.viewer.get(`${sheetPath(0)}?sampleTime=0.01&method=euler`);
    expect(method.status).toBe(400);
    expect(method.body.error.message).toMatch(/tustin or backward-euler/);
  });

  it("when the sample time is too coarse for the horizon or takes too many samples, then 422 saying which sample time to choose", async () => {
    const coarse = await team.viewer.get(`${sheetPath(0)}?sampleTime=2`);
    expect(coarse.status).toBe(422);
    expect(coarse.body.error.message).toBe("A sample time of 2 s is too coarse for the scenario's 10 s horizon: choose at most 1 s, so the re-simulated loop is seen to settle.");
    const fine = await team.viewer.get(`${sheetPath(0)}?sampleTime=0.0000001`);
    expect(fine.status).toBe(422);
    expect(fine.body.error.message).toMatch(/more than the 200,000 allowed; choose h ≥ 0\.00005 s\.$/);
  });

  it("when the sampled loop is unstable at the sample time, then 422 with a shorter sample time at which it is stable", async () => {
    // kp = 3 on K/(s + 1) with ZOH at h (Åström & Wittenmark 1997, §2.3): the P part alone has the pole
    // λ = a − 3K(1 − a), a = e^(−h); at h = 0.8 s, a = 0.449: λ = −1.20 on gain 1 (K = 1), −2.86 on gain 2 —
    // unstable on both, and the first variant is named. At h = 0.2 s, a = 0.819: λ = 0.275 and −0.267.
    const response = await team.viewer.get(`${sheetPath(1)}?sampleTime=0.8&method=backward-euler`);
    expect(response.status, JSON.stringify(response.body)).toBe(422);
    expect(response.body.error.message).toMatch(/^At h = 0\.8 s \(backward Euler\) the sampled loop is unstable on gain 1 \(a closed-loop pole at \|z\| = [\d.]+\): sample faster; it is stable on every variant at h = 0\.2 s\.$/);
  });
});
