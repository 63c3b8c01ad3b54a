import { describe, expect, it } from "vitest";
import { runComputeTask } from "../../src/pool/compute-tasks.js";
import type { Plant } from "../../src/plants/plant.js";

const TWO_LAGS: Plant = { kind: "transfer-function", num: [1], den: [1, 3, 2], delay: 0 };

/** dx/dt = z − x, dz/dt = 10⁷·(u − z): poles −1 and −10⁷, stiff for an explicit solver. */
const STIFF: Plant = { kind: "nonlinear", states: ["x", "z"], parameters: { g: 1e7 }, derivatives: ["z - x", "g*(u - z)"], output: "x", initial: [0, 0] };

describe("runComputeTask", () => {
  it("plantPreview gives the poles and the closed-form step of 1/((s+1)(s+2))", () => {
    const outcome = runComputeTask({ task: "plantPreview", input: { model: TWO_LAGS, samples: 600 }, budget: { evaluations: 1 } });
    expect(outcome.ok).toBe(true);
    if (!outcome.ok) return;
    const poles = outcome.value.poles.map((p) => p.re).sort((a, b) => a - b);
    expect(poles[0]).toBeCloseTo(-2, 10);
    expect(poles[1]).toBeCloseTo(-1, 10);
    // y(t) = 1/2 − e^(−t) + e^(−2t)/2 (partial fractions, closed form).
    const { t, y } = outcome.value.step;
    for (let i = 0; i < t.length; i += 37) expect(y[i]).toBeCloseTo(0.5 - Math.exp(-t[i]!) + Math.exp(-2 * t[i]!) / 2, 10);
  });

  it("when a stiff plant's step passes the budget, then plantPreview answers kind budget with the sentence", () => {
    const outcome = runComputeTask({ task: "plantPreview", input: { model: STIFF, samples: 600 }, budget: { evaluations: 50_000 } });
    expect(outcome).toEqual({ ok: false, kind: "budget", reason: "it needs more than 50,000 right-hand-side evaluations" });
  });

  it("when a nonlinear expression is refused, then the failure names its field and the compiler's error", () => {
    const bad: Plant = { kind: "nonlinear", states: ["x"], parameters: {}, derivatives: ["-x + q"], output: "x", initial: [0] };
    const outcome = runComputeTask({ task: "plantPreview", input: { model: bad, samples: 600 }, budget: { evaluations: 1000 } });
    expect(outcome.ok).toBe(false);
    if (outcome.ok) return;
    expect(outcome.kind).toBe("refused");
    expect(outcome.field).toBe("derivatives.0");
    expect(outcome.reason).toMatch(/unknown name "q"/);
  });
});
