import { describe, expect, it } from "vitest";
import type { Plant } from "../../src/plants/plant.js";
import { ultimatePoint } from "../../src/tuning/ultimate-point.js";
import { expectClose } from "../support/expect-close.js";

const tf = (num: number[], den: number[], delay = 0): Plant => ({ kind: "transfer-function", num, den, delay });

function point(plant: Plant) {
  const result = ultimatePoint(plant);
  if (!result.ok) throw new Error(result.reason);
  return result.point;
}

/** Root of ω + atan ω = π by Newton's method (independent of the bracketing search). */
function delayLagCrossover(): number {
  let w = 2;
  for (let i = 0; i < 50; i++) w -= (w + Math.atan(w) - Math.PI) / (1 + 1 / (1 + w * w));
  return w;
}

describe("ultimatePoint", () => {
  it("ultimatePoint of 1/(s+1)³ is Ku = 8, Pu = 2π/√3", () => {
    // Closed form: arg G = −3·atan ω = −π ⇒ ω180 = tan(π/3) = √3; |G| = (1 + 3)^(−3/2) = 1/8 ⇒ Ku = 8.
    const p = point(tf([1], [1, 3, 3, 1]));
    expectClose(p.omega180, Math.sqrt(3), 1e-9);
    expectClose(p.ku, 8, 1e-8);
    expectClose(p.pu, (2 * Math.PI) / Math.sqrt(3), 1e-9);
  });

  it("ultimatePoint of 1/(s+1)ⁿ, n = 3…8, is ω180 = tan(π/n), Ku = cos(π/n)^(−n)", () => {
    // Closed form: −n·atan ω = −π ⇒ ω180 = tan(π/n); |G| = (1 + tan²(π/n))^(−n/2) = cosⁿ(π/n) ⇒ Ku = cos(π/n)^(−n).
    const poly = (n: number): number[] => {
      let p = [1];
      for (let i = 0; i < n; i++) p = [...p, 0].map((c, j) => c + (j > 0 ? p[j - 1] : 0));
      return p;
    };
    for (let n = 3; n <= 8; n++) {
      const p = point(tf([1], poly(n)));
      expectClose(p.omega180, Math.tan(Math.PI / n), 1e-9, 1e-9);
      expectClose(p.ku, Math.cos(Math.PI / n) ** -n, 1e-9, 1e-9);
    }
  });

  it("ultimatePoint of e^(−s)/(s+1) solves ω + atan ω = π: ω180 ≈ 2.0288, Ku = √(1 + ω²) ≈ 2.2618", () => {
    // Closed form: arg G = −atan ω − ω = −π ⇔ ω = π − atan ω (equivalently ω = −tan ω … = tan(π − ω));
    // |G| = 1/√(1 + ω²) ⇒ Ku = √(1 + ω180²).
    const w = delayLagCrossover();
    expectClose(w, 2.0288, 1e-4);
    const p = point(tf([1], [1, 1], 1));
    expectClose(p.omega180, w, 1e-10);
    expectClose(p.ku, Math.sqrt(1 + w * w), 1e-9);
    expectClose(p.ku, 2.2618, 1e-4);
    expectClose(p.pu, (2 * Math.PI) / w, 1e-9);
  });

  it("ultimatePoint of the integrating plant e^(−s)/s is ω180 = π/2, Ku = π/2", () => {
    // Closed form: arg G = −π/2 − ω = −π ⇒ ω180 = π/2; |G| = 1/ω ⇒ Ku = π/2, Pu = 4 s.
    const p = point(tf([1], [1, 0], 1));
    expectClose(p.omega180, Math.PI / 2, 1e-10);
    expectClose(p.ku, Math.PI / 2, 1e-10);
    expectClose(p.pu, 4, 1e-9);
  });

  it("ultimatePoint of −1/(s+1)³ gives Ku = −8 (negative-gain plants need negative controller gain)", () => {
    const p = point(tf([-1], [1, 3, 3, 1]));
    expectClose(p.ku, -8, 1e-8);
    expectClose(p.omega180, Math.sqrt(3), 1e-9);
  });

  it("ultimatePoint of a state-space plant equals that of its transfer function", () => {
    // Three lags in series, each 1/(s + 1): the same 1/(s+1)³, Ku = 8 (closed form above).
    const plant: Plant = { kind: "state-space", A: [[-1, 0, 0], [1, -1, 0], [0, 1, -1]], B: [[1], [0], [0]], C: [[0, 0, 1]], D: [[0]] };
    expectClose(point(plant).ku, 8, 1e-6);
  });

  it("ultimatePoint reports none when the phase never reaches −180° and for unstable plants", () => {
    // 1/((8s+1)(2s+1)): phase > −180° at every finite ω (two lags); any gain is stable (Routh, closed form).
    const lag2 = ultimatePoint(tf([1], [16, 10, 1]));
    expect(lag2.ok).toBe(false);
    if (!lag2.ok) expect(lag2.reason).toMatch(/never reaches −180°/);
    const unstable = ultimatePoint(tf([1], [1, -1]));
    expect(unstable.ok).toBe(false);
  });
});
