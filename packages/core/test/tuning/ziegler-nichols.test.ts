import { describe, expect, it } from "vitest";
import { ultimatePoint } from "../../src/tuning/ultimate-point.js";
import { zieglerNichols } from "../../src/tuning/ziegler-nichols.js";
import { expectClose } from "../support/expect-close.js";

describe("zieglerNichols", () => {
  it("zieglerNichols PID on 1/(s+1)³ gives kp = 4.8, Ti = π/√3, Td = π/(4√3)", () => {
    // Ziegler & Nichols 1942 (ultimate-sensitivity table): K = 0.6·Ku, Ti = Pu/2, Td = Pu/8.
    // Ku = 8, Pu = 2π/√3 (closed form, see ultimate-point.test.ts) ⇒ K = 4.8, Ti = π/√3 ≈ 1.8138, Td = π/(4√3) ≈ 0.4534.
    // Parallel: ki = K/Ti = 4.8·√3/π ≈ 2.6463, kd = K·Td = 1.2π/√3 ≈ 2.1766, tf = Td/10.
    const result = ultimatePoint({ kind: "transfer-function", num: [1], den: [1, 3, 3, 1], delay: 0 });
    if (!result.ok) throw new Error(result.reason);
    const { controller, ideal } = zieglerNichols(result.point, "pid");
    expectClose(ideal.K, 4.8, 1e-8);
    expectClose(ideal.Ti, Math.PI / Math.sqrt(3), 1e-9);
    expectClose(ideal.Td, Math.PI / (4 * Math.sqrt(3)), 1e-9);
    expectClose(controller.kp, 4.8, 1e-8);
    expectClose(controller.ki, (4.8 * Math.sqrt(3)) / Math.PI, 1e-8);
    expectClose(controller.kd, (1.2 * Math.PI) / Math.sqrt(3), 1e-8);
    expectClose(controller.tf, Math.PI / (40 * Math.sqrt(3)), 1e-9);
  });

  it("zieglerNichols P and PI follow K = 0.5·Ku and K = 0.45·Ku, Ti = Pu/1.2", () => {
    // Ziegler & Nichols 1942: P K = 0.5Ku; PI K = 0.45Ku, Ti = Pu/1.2 (= 0.833·Pu). With Ku = 10, Pu = 6:
    // P: kp = 5; PI: kp = 4.5, Ti = 5, ki = 0.9.
    const point = { ku: 10, pu: 6, omega180: (2 * Math.PI) / 6 };
    const p = zieglerNichols(point, "p");
    expect(p.controller).toEqual({ kind: "pid", kp: expect.closeTo(5, 12), ki: 0, kd: 0, tf: 0 });
    expect(p.ideal.Ti).toBe(Infinity);
    const pi = zieglerNichols(point, "pi");
    expectClose(pi.controller.kp, 4.5, 1e-12);
    expectClose(pi.ideal.Ti, 5, 1e-12);
    expectClose(pi.controller.ki, 0.9, 1e-12);
    expect(pi.controller.kd).toBe(0);
  });

  it("zieglerNichols uses the given derivative filter divisor and rejects a bad point", () => {
    // tf = Td/N: Pu = 8 ⇒ Td = 1; N = 4 ⇒ tf = 0.25.
    expectClose(zieglerNichols({ ku: 1, pu: 8, omega180: Math.PI / 4 }, "pid", 4).controller.tf, 0.25, 1e-12);
    expect(() => zieglerNichols({ ku: 1, pu: -1, omega180: 1 }, "pi")).toThrow(/point\.pu/);
  });
});
