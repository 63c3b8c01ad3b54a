import { describe, expect, it } from "vitest";
import { suggestHorizon } from "../../src/plants/suggest-horizon.js";

describe("suggestHorizon", () => {
  it("suggestHorizon gives five slowest time constants plus the dead time, rounded up", () => {
    // Common practice: 5τ covers the 1 % band. τ = 8 s ⇒ 40 s; τ = 20 s, θ = 1 s ⇒ 101 s → 150 s.
    expect(suggestHorizon({ kind: "transfer-function", num: [1], den: [16, 10, 1], delay: 0 })).toBe(40);
    expect(suggestHorizon({ kind: "transfer-function", num: [1.5], den: [80, 24, 1], delay: 1 })).toBe(150);
  });

  it("suggestHorizon falls back on pole magnitudes for an integrating plant", () => {
    // 1/(s(s + 0.5)): the stable pole −0.5 gives 5·2 = 10 s; 1/s² has only poles at 0 ⇒ 10 s.
    expect(suggestHorizon({ kind: "transfer-function", num: [1], den: [1, 0.5, 0], delay: 0 })).toBe(10);
    expect(suggestHorizon({ kind: "transfer-function", num: [1], den: [1, 0, 0], delay: 2 })).toBe(15);
  });
});
