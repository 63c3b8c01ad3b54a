import { describe, expect, it } from "vitest";
import { padeDelay } from "../../src/plants/pade-delay.js";
import { polynomialEvaluate } from "../../src/linear-algebra/polynomial-evaluate.js";
import { expectClose } from "../support/expect-close.js";

describe("padeDelay", () => {
  it("padeDelay(θ, 1) and padeDelay(θ, 2) are the textbook approximants", () => {
    // Baker & Graves-Morris 1996, §1.2: [1/1] = (1 − θs/2)/(1 + θs/2);
    // [2/2] = (1 − θs/2 + θ²s²/12)/(1 + θs/2 + θ²s²/12); here divided to a monic denominator.
    const theta = 2;
    const p1 = padeDelay(theta, 1);
    expectClose(p1.den[0], 1, 1e-15);
    expectClose(p1.den[1], 2 / theta, 1e-15);
    expectClose(p1.num[0], -1, 1e-15);
    expectClose(p1.num[1], 2 / theta, 1e-15);
    const p2 = padeDelay(theta, 2);
    const scale = (theta * theta) / 12;
    [scale, theta / 2, 1].forEach((c, i) => expectClose(p2.den[i], c / scale, 1e-14));
    [scale, -theta / 2, 1].forEach((c, i) => expectClose(p2.num[i], c / scale, 1e-14));
  });

  it("padeDelay(θ, 6) matches e^(−θs) on the real axis near 0", () => {
    // Padé [m/m] error is O((θs)^(2m+1)); at θs = 0.5 and m = 6 it is below 1e-12.
    const theta = 1;
    const { num, den } = padeDelay(theta, 6);
    for (const s of [0.1, 0.25, 0.5]) expectClose(polynomialEvaluate(num, s) / polynomialEvaluate(den, s), Math.exp(-theta * s), 1e-12);
  });

  it("padeDelay names theta and order on bad input", () => {
    expect(() => padeDelay(-1)).toThrow(/theta/);
    expect(() => padeDelay(1, 1.5)).toThrow(/order/);
    expect(padeDelay(0)).toEqual({ num: [1], den: [1] });
  });
});
