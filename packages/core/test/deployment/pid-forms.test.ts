import { describe, expect, it } from "vitest";
import { deployablePid } from "../../src/deployment/deployable-pid.js";
import { pidForms } from "../../src/deployment/pid-forms.js";
import { expectClose } from "../support/expect-close.js";

/** C(jω) of the parallel form kp + ki/s + kd·s/(tf·s + 1), as [re, im]. */
function parallelAt(kp: number, ki: number, kd: number, tf: number, w: number): [number, number] {
  // ki/(jω) = −j·ki/ω;  kd·jω/(1 + jω·tf) = kd·jω(1 − jω·tf)/(1 + ω²tf²)
  const den = 1 + w * w * tf * tf;
  return [kp + (kd * w * w * tf) / den, -ki / w + (kd * w) / den];
}

/** C(jω) of the series form K'(1 + 1/(Ti' s))(1 + Td' s)/(1 + Tf s), as [re, im]. */
function seriesAt(K: number, Ti: number, Td: number, Tf: number, w: number): [number, number] {
  const mul = (a: [number, number], b: [number, number]): [number, number] => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
  const integral: [number, number] = [1, Number.isFinite(Ti) ? -1 / (Ti * w) : 0];
  const lead: [number, number] = [1, Td * w];
  const lagDen = 1 + Tf * Tf * w * w;
  const lag: [number, number] = [1 / lagDen, (-Tf * w) / lagDen];
  const c = mul(mul(integral, lead), lag);
  return [K * c[0], K * c[1]];
}

describe("pidForms", () => {
  it("pidForms gives the ideal form K = kp, Ti = kp/ki, Td = kd/kp, N = Td/tf", () => {
    // Åström & Hägglund 2006, §3.2, eq. 3.8: K(1 + 1/(Ti s) + Td s/(1 + Td s/N)).
    const forms = pidForms(deployablePid({ kind: "pid2dof", kp: 2, ki: 0.5, kd: 0.8, tf: 0.1, b: 0.7, c: 0 }));
    if (!forms.ideal.exists) throw new Error(forms.ideal.reason);
    expect(forms.ideal.gain).toBe(2);
    expect(forms.ideal.integralTime).toBe(4);
    expect(forms.ideal.derivativeTime).toBe(0.4);
    expectClose(forms.ideal.filterDivisor, 4, 1e-14);
    expect(forms.weights).toEqual({ b: 0.7, c: 0 });
  });

  it("pidForms matches the textbook series conversion without a filter when Ti ≥ 4Td", () => {
    // Åström & Hägglund 2006, §3.2: K' = K/2·(1 + √(1 − 4Td/Ti)), Ti' = Ti/2·(1 + √(1 − 4Td/Ti)),
    // Td' = Ti/2·(1 − √(1 − 4Td/Ti)); and back: K = K'(1 + Td'/Ti'), Ti = Ti' + Td', Td = Ti'Td'/(Ti' + Td').
    const K = 3;
    const Ti = 10;
    const Td = 1.5;
    const forms = pidForms({ kp: K, ki: K / Ti, kd: K * Td, tf: 0, b: 1, c: 1 });
    if (!forms.series.exists) throw new Error(forms.series.reason);
    const root = Math.sqrt(1 - (4 * Td) / Ti);
    expectClose(forms.series.gain, (K / 2) * (1 + root), 0, 1e-14);
    expectClose(forms.series.integralTime, (Ti / 2) * (1 + root), 0, 1e-14);
    expectClose(forms.series.derivativeTime, (Ti / 2) * (1 - root), 0, 1e-14);
    const s = forms.series;
    expectClose(s.gain * (1 + s.derivativeTime / s.integralTime), K, 0, 1e-14);
    expectClose(s.integralTime + s.derivativeTime, Ti, 0, 1e-14);
    expectClose((s.integralTime * s.derivativeTime) / (s.integralTime + s.derivativeTime), Td, 0, 1e-14);
  });

  it("pidForms gives a series form with filter equal to the parallel form at every frequency", () => {
    // Both forms have the denominator s(tf s + 1); equal numerators ⇒ equal C(jω) (derivation in pid-forms.ts).
    const [kp, ki, kd, tf] = [1.8, 0.3, 0.9, 0.08];
    const forms = pidForms({ kp, ki, kd, tf, b: 1, c: 1 });
    if (!forms.series.exists) throw new Error(forms.series.reason);
    const { gain, integralTime, derivativeTime, filterTime } = forms.series;
    expect(integralTime).toBeGreaterThanOrEqual(derivativeTime);
    for (const w of [0.01, 0.3, 1, 7, 100]) {
      const p = parallelAt(kp, ki, kd, tf, w);
      const q = seriesAt(gain, integralTime, derivativeTime, filterTime, w);
      expectClose(q[0], p[0], 1e-12, 1e-12);
      expectClose(q[1], p[1], 1e-12, 1e-12);
    }
  });

  it("pidForms reports no series form when Ti < 4Td, and exactly one at the boundary Ti = 4Td", () => {
    // Boundary (Åström & Hägglund 2006, §3.2): √(1 − 4Td/Ti) = 0 ⇒ K' = K/2, Ti' = Td' = Ti/2.
    const none = pidForms({ kp: 1, ki: 1 / 2, kd: 1, tf: 0, b: 1, c: 1 }); // Ti = 2, Td = 1
    expect(none.series.exists).toBe(false);
    if (!none.series.exists) expect(none.series.reason).toMatch(/Ti < 4·Td/);
    const edge = pidForms({ kp: 2, ki: 2 / 8, kd: 2 * 2, tf: 0, b: 1, c: 1 }); // Ti = 8, Td = 2
    if (!edge.series.exists) throw new Error(edge.series.reason);
    expectClose(edge.series.gain, 1, 1e-12);
    expectClose(edge.series.integralTime, 4, 1e-12);
    expectClose(edge.series.derivativeTime, 4, 1e-12);
  });

  it("pidForms handles PI, PD and P and refuses structures that are not PIDs", () => {
    // PI: series = parallel (Td' = 0, K' = kp, Ti' = kp/ki); PD: K'(1 + Td' s)/(1 + tf s), Td' = (kp·tf + kd)/kp.
    const pi = pidForms(deployablePid({ kind: "pi", kp: 2, ki: 0.5 }));
    if (!pi.series.exists) throw new Error("no series PI");
    expect([pi.series.gain, pi.series.integralTime, pi.series.derivativeTime]).toEqual([2, 4, 0]);
    const pd = pidForms({ kp: 2, ki: 0, kd: 1, tf: 0.1, b: 1, c: 1 });
    if (!pd.series.exists) throw new Error("no series PD");
    expect(pd.series.integralTime).toBe(Infinity);
    expectClose(pd.series.derivativeTime, 0.6, 1e-15);
    expect(pidForms({ kp: 0, ki: 1, kd: 0, tf: 0, b: 1, c: 1 }).ideal.exists).toBe(false);
    expect(() => deployablePid({ kind: "lead-lag", k: 1, tLead: 1, tLag: 0.1 })).toThrow(RangeError);
  });
});
