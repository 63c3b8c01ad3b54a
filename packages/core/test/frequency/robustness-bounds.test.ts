import { describe, expect, it } from "vitest";
import { gainMargin } from "../../src/criteria/gain-margin.js";
import { ms } from "../../src/criteria/ms.js";
import { phaseMargin } from "../../src/criteria/phase-margin.js";
import type { Controller } from "../../src/controllers/controller.js";
import type { Plant } from "../../src/plants/plant.js";
import { isLoopStable } from "../../src/evaluation/evaluate-candidate.js";
import { loopTransferFunction } from "../../src/simulation/loop-transfer-function.js";
import { seededRandom } from "../support/seeded-random.js";

/** A random stable plant of order 1–4 (real poles and a complex pair), gain, maybe a dead time, and a PID. */
function randomLoop(random: () => number): { plant: Plant; controller: Controller } {
  const order = 1 + Math.floor(random() * 4);
  let den = [1];
  for (let k = 0; k < order; k++) {
    const tau = 10 ** (2 * random() - 1); // 0.1 … 10 s
    den = multiply(den, [tau, 1]);
  }
  if (random() < 0.3) {
    const wn = 10 ** (2 * random() - 1);
    const zeta = 0.05 + 0.9 * random();
    den = multiply(den, [1 / (wn * wn), (2 * zeta) / wn, 1]);
  }
  const gain = 0.2 + 3 * random();
  const delay = random() < 0.5 ? 2 * random() : 0;
  const kp = 0.05 + 3 * random();
  const ki = random() < 0.2 ? 0 : 2 * random();
  const kd = random() < 0.3 ? 0 : 2 * random();
  return {
    plant: { kind: "transfer-function", num: [gain], den, delay },
    controller: { kind: "pid", kp, ki, kd, tf: kd > 0 ? kd / (10 * kp) : 0 },
  };
}

function multiply(p: number[], q: number[]): number[] {
  const r = new Array<number>(p.length + q.length - 1).fill(0);
  for (let i = 0; i < p.length; i++) for (let j = 0; j < q.length; j++) r[i + j] += p[i] * q[j];
  return r;
}

describe("gain and phase margins against the maximum sensitivity", () => {
  it("GM ≥ Ms/(Ms − 1) and PM ≥ 2·arcsin(1/(2Ms)) on 240 random stable loops (seeded)", () => {
    // K. J. Åström and T. Hägglund, Advanced PID Control, ISA, 2006, §4.2 (eq. 4.10): the Nyquist curve
    // stays outside the circle of radius 1/Ms around −1, so at a phase crossover L = −1/GM gives
    // 1 − 1/GM ≥ 1/Ms, and at a gain crossover |1 + L| = 2 sin(PM/2) ≥ 1/Ms. When the critical phase
    // crossover lies outside the unit circle (a conditionally stable loop, GM < 1), the same circle
    // gives 1/GM − 1 ≥ 1/Ms, i.e. GM ≤ Ms/(Ms + 1); a negative PM (possible with several crossovers)
    // still has |PM| ≥ 2·arcsin(1/(2Ms)).
    const random = seededRandom(20260);
    let checked = 0;
    let attempts = 0;
    let conditional = 0;
    const relative = 1e-9;
    while (checked < 240 && attempts < 5000) {
      attempts++;
      const { plant, controller } = randomLoop(random);
      if (plant.kind === "nonlinear" || !isLoopStable(plant, controller)) continue;
      const loop = loopTransferFunction(plant, controller);
      const sensitivity = ms(loop);
      const gm = gainMargin(loop);
      const pm = phaseMargin(loop);
      expect(sensitivity).toBeGreaterThanOrEqual(1); // Bode: |S| ≥ 1 somewhere (strictly proper loop, limit 1)
      if (gm >= 1) expect(gm).toBeGreaterThanOrEqual((sensitivity / (sensitivity - 1)) * (1 - relative));
      else {
        conditional++;
        expect(gm).toBeLessThanOrEqual((sensitivity / (sensitivity + 1)) * (1 + relative));
      }
      const bound = (2 * Math.asin(1 / (2 * sensitivity)) * 180) / Math.PI;
      if (pm !== Infinity) expect(Math.abs(pm)).toBeGreaterThanOrEqual(bound * (1 - relative));
      checked++;
    }
    expect(checked).toBe(240);
    expect(conditional).toBeLessThan(checked / 4);
  });
});
