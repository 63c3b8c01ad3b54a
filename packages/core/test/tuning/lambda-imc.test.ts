import { describe, expect, it } from "vitest";
import { imcPid, lambdaPi } from "../../src/tuning/lambda-imc.js";
import { expectClose } from "../support/expect-close.js";

describe("lambdaPi", () => {
  it("lambdaPi on k = 1, τ = 1, θ = 0.2 gives Kc = τ/(k(λ + θ)), Ti = τ", () => {
    // Lambda tuning (Dahlin 1968; Åström & Hägglund 2006, §6.5 from memory): Kc = τ/(k(λ + θ)), Ti = τ.
    // Default λ = max(τ, θ) = 1: Kc = 1/1.2 = 0.8333…; with λ = 0.2: Kc = 1/0.4 = 2.5.
    const t = lambdaPi({ k: 1, tau: 1, theta: 0.2 });
    expect(t.lambda).toBe(1);
    expectClose(t.ideal.K, 1 / 1.2, 1e-12);
    expectClose(t.ideal.Ti, 1, 1e-12);
    expectClose(lambdaPi({ k: 1, tau: 1, theta: 0.2 }, 0.2).ideal.K, 2.5, 1e-12);
    expectClose(lambdaPi({ k: 2, tau: 1, theta: 0.2 }, 0.2).ideal.K, 1.25, 1e-12);
  });
});

describe("imcPid", () => {
  it("imcPid on k = 1, τ = 1, θ = 0.2 gives Kc = (2τ+θ)/(k(2λ+θ)), Ti = τ + θ/2, Td = τθ/(2τ+θ)", () => {
    // Rivera, Morari & Skogestad 1986, Table I (first-order Padé): with λ = 1:
    // Kc = 2.2/2.2 = 1, Ti = 1.1, Td = 0.2/2.2 = 0.0909…; with λ = 0.2: Kc = 2.2/0.6 = 3.6667.
    const t = imcPid({ k: 1, tau: 1, theta: 0.2 });
    expectClose(t.ideal.K, 1, 1e-12);
    expectClose(t.ideal.Ti, 1.1, 1e-12);
    expectClose(t.ideal.Td, 0.2 / 2.2, 1e-12);
    expectClose(imcPid({ k: 1, tau: 1, theta: 0.2 }, 0.2).ideal.K, 2.2 / 0.6, 1e-12);
  });

  it("imcPid equals the IMC controller (τs+1)(θs/2+1)/(k(λ+θ/2)s) it is derived from (closed form)", () => {
    // c(s) = q/(1 − g̃q) with g̃ = k(1 − θs/2)/((τs+1)(1 + θs/2)), q = (τs+1)(1+θs/2)/(k(λs+1)):
    // numerator coefficients of c(s)·s: [τθ/2, τ + θ/2, 1]/(k(λ + θ/2)) must equal K·[Ti·Td, Ti, 1]/Ti.
    const m = { k: 1.5, tau: 4, theta: 0.6 };
    const lambda = 0.9;
    const { K, Ti, Td } = imcPid(m, lambda).ideal;
    const scale = m.k * (lambda + m.theta / 2);
    expectClose(K * Td, (m.tau * m.theta) / 2 / scale, 1e-12);
    expectClose(K, (m.tau + m.theta / 2) / scale, 1e-12);
    expectClose(K / Ti, 1 / scale, 1e-12);
  });

  it("imcPid and lambdaPi reject a non-positive λ naming it", () => {
    expect(() => imcPid({ k: 1, tau: 1, theta: 0.2 }, 0)).toThrow(/lambda/);
    expect(() => lambdaPi({ k: 1, tau: 0, theta: 0.2 })).toThrow(/model\.tau/);
  });
});
