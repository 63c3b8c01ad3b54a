import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startTestServer, type TestServer } from "../support/test-server.js";
import { workspaceWithTeam } from "./fixtures.js";

let server: TestServer;
let team: Awaited<ReturnType<typeof workspaceWithTeam>>;

beforeAll(async () => {
  server = await startTestServer();
  team = await workspaceWithTeam(server.url, "Plant kinds");
});

afterAll(async () => {
  await server?.close();
});

const plantsPath = () => `/api/workspaces/${team.slug}/plants`;

type Pole = { re: number; im: number };
const byRe = (poles: Pole[]) => [...poles].sort((a, b) => a.re - b.re);

/** Largest |y_k − f(t_k)| over a step response. */
function worstError(step: { t: number[]; y: number[] }, f: (t: number) => number): number {
  return Math.max(...step.t.map((tk, k) => Math.abs((step.y[k] as number) - f(tk))));
}

describe("state-space and nonlinear plants", () => {
  it("when an engineer creates a state-space plant in companion form, then the answer is 201 with poles −1, −2 and the closed-form step", async () => {
    // A = [[0, 1], [−2, −3]], B = [0; 1], C = [1 0]: G(s) = 1/(s² + 3s + 2) (companion form, closed form),
    // eigenvalues of A are −1 and −2.
    const response = await team.engineer.post(plantsPath(), {
      name: "Two lags as states",
      unitsNote: "",
      model: { kind: "state-space", A: [[0, 1], [-2, -3]], B: [[0], [1]], C: [[1, 0]], D: [[0]] },
    });
    expect(response.status).toBe(201);
    expect(response.body.plant.kind).toBe("state-space");
    expect(response.body.polesNote).toBeNull();
    const poles = byRe(response.body.poles);
    expect(poles).toHaveLength(2);
    expect(poles[0]?.re).toBeCloseTo(-2, 9);
    expect(poles[1]?.re).toBeCloseTo(-1, 9);
    // Y(s) = 1/(s(s+1)(s+2)) ⇒ y(t) = 1/2 − e^(−t) + e^(−2t)/2 (partial fractions, closed form), atol 1e-6.
    expect(worstError(response.body.step, (t) => 0.5 - Math.exp(-t) + 0.5 * Math.exp(-2 * t))).toBeLessThan(1e-6);
  });

  it("when an engineer creates a nonlinear plant typed as expressions, then the answer is 201 with the linearised pole and the step from the operating point", async () => {
    // dx/dt = (−x + k·u)/τ with τ = 2, k = 3: linear, so its linearisation is exact; pole −1/τ = −0.5,
    // and a unit step of u gives y(t) = k(1 − e^(−t/τ)) (closed form). Tolerance 1e-4 for the adaptive integrator.
    const response = await team.engineer.post(plantsPath(), {
      name: "First-order lag as expressions",
      unitsNote: "",
      model: {
        kind: "nonlinear",
        states: ["x"],
        parameters: { tau: 2, k: 3 },
        derivatives: ["(-x + k*u) / tau"],
        output: "x",
        initial: [0],
      },
    });
    expect(response.status).toBe(201);
    expect(response.body.plant.kind).toBe("nonlinear");
    expect(response.body.polesNote).toMatch(/linearisation at the operating point/);
    expect(response.body.poles).toHaveLength(1);
    expect(response.body.poles[0].re).toBeCloseTo(-0.5, 5);
    expect(Math.abs(response.body.poles[0].im)).toBeLessThan(1e-9);
    expect(worstError(response.body.step, (t) => 3 * (1 - Math.exp(-t / 2)))).toBeLessThan(1e-4);
  });

  it("when a nonlinear plant's derivative reaches for constructor, then the answer is 400 naming model.derivatives.0", async () => {
    const response = await team.engineer.post(plantsPath(), {
      name: "Escape attempt",
      unitsNote: "",
      model: { kind: "nonlinear", states: ["x"], parameters: {}, derivatives: ["x.constructor"], output: "x", initial: [0] },
    });
    expect(response.status).toBe(400);
    expect(response.body.error.field).toBe("model.derivatives.0");
    expect(response.body.error.message).toMatch(/^model\.derivatives\.0: /);
    expect(response.body.error.message).toMatch(/constructor/);
    const listed = await team.viewer.get(plantsPath());
    expect(listed.body.map((p: { name: string }) => p.name)).not.toContain("Escape attempt");
  });

  it("when a nonlinear plant's output names an undeclared parameter, then the answer is 400 naming model.output", async () => {
    const response = await team.engineer.post(plantsPath(), {
      name: "Unknown name",
      unitsNote: "",
      model: { kind: "nonlinear", states: ["x"], parameters: {}, derivatives: ["-x + u"], output: "gain*x", initial: [0] },
    });
    expect(response.status).toBe(400);
    expect(response.body.error.field).toBe("model.output");
    expect(response.body.error.message).toMatch(/gain/);
  });

  it("when a state-space plant's B has the wrong shape, then the answer is 400 naming model.B", async () => {
    const response = await team.engineer.post(plantsPath(), {
      name: "Wrong B",
      unitsNote: "",
      model: { kind: "state-space", A: [[0, 1], [-2, -3]], B: [[1]], C: [[1, 0]], D: [[0]] },
    });
    expect(response.status).toBe(400);
    expect(response.body.error.field).toBe("model.B");
  });
});
