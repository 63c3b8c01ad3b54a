import { describe, expect, it } from "vitest";
import { deploymentSheet } from "../../src/deployment/deployment-sheet.js";
import { differenceEquations } from "../../src/deployment/difference-equations.js";
import { DISCRETE_PID_COEFFICIENTS } from "../../src/deployment/discrete-pid.js";

const controller = { kind: "pid2dof", kp: 2.2, ki: 0.9, kd: 0.8, tf: 0.08, b: 0.7, c: 0 } as const;

describe("deploymentSheet", () => {
  it("deploymentSheet at 1 kHz gives all three forms, the difference equations and no notes", () => {
    const sheet = deploymentSheet(controller, { sampleTime: 0.001, method: "tustin", limits: { min: 0, max: 100, rate: 50 } });
    expect(sheet.forms.ideal.exists).toBe(true);
    expect(sheet.forms.series.exists).toBe(true);
    expect(sheet.forms.weights).toEqual({ b: 0.7, c: 0 });
    expect(sheet.fixedPoint).toBeNull();
    expect(sheet.notes).toEqual([]);
    // The tracking time defaults to √(Ti·Td) (Åström & Hägglund 2006, §3.5): Ti = kp/ki, Td = kd/kp.
    expect(sheet.discrete.trackingTime).toBeCloseTo(Math.sqrt((2.2 / 0.9) * (0.8 / 2.2)), 14);
  });

  it("deploymentSheet notes an alternating Tustin filter (h > 2tf) and a tracking gain h/Tt ≥ 1", () => {
    // h = 0.2 s > 2·tf = 0.16 s ⇒ ad = (2tf − h)/(2tf + h) < 0; Tt = 0.15 s < h ⇒ h/Tt ≈ 1.33.
    const sheet = deploymentSheet(controller, { sampleTime: 0.2, method: "tustin", trackingTime: 0.15 });
    expect(sheet.discrete.coefficients.ad).toBeLessThan(0);
    expect(sheet.notes).toHaveLength(2);
    expect(sheet.notes[0]).toMatch(/alternates in sign/);
    expect(sheet.notes[1]).toMatch(/h\/Tt = 1.333 is at least 1/);
  });

  it("differenceEquations writes every coefficient so that it reads back as the same double", () => {
    const sheet = deploymentSheet(controller, { sampleTime: 0.001, method: "backward-euler", limits: { min: 0, max: 100, rate: 50 } });
    const text = differenceEquations(sheet.discrete).join("\n");
    for (const name of DISCRETE_PID_COEFFICIENTS) {
      const value = sheet.discrete.coefficients[name];
      // Round trip (ECMAScript Number::toString with 17 significant digits is exact for doubles).
      expect(text).toContain(Number(value.toPrecision(17)).toString());
      expect(Number(Number(value.toPrecision(17)).toString())).toBe(value);
    }
    expect(text).toMatch(/u\[k\] = min\(max\(v\[k\], 0\), 100\)/);
    expect(text).toMatch(/u\[k−1\] − 0\.05\)/);
  });
});
