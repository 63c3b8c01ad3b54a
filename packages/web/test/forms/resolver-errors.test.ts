import { describe, expect, it } from "vitest";
import { toResolverErrors } from "../../src/forms/resolver-errors.js";

describe("toResolverErrors", () => {
  it("toResolverErrors nests dotted fields the way react-hook-form reads them", () => {
    expect(toResolverErrors({ "model.num": "bad numerator", name: "give the plant a name" })).toEqual({
      model: { num: { type: "validate", message: "bad numerator" } },
      name: { type: "validate", message: "give the plant a name" },
    });
  });

  it("toResolverErrors keeps a child's problem when its parent has one too, in either order", () => {
    const childFirst = toResolverErrors({ "ranges.kd.max": "max must exceed min", ranges: "too many candidates" }) as Record<string, any>;
    const parentFirst = toResolverErrors({ ranges: "too many candidates", "ranges.kd.max": "max must exceed min" }) as Record<string, any>;
    for (const errors of [childFirst, parentFirst]) {
      expect(errors.ranges.message).toBe("too many candidates");
      expect(errors.ranges.kd.max.message).toBe("max must exceed min");
    }
  });

  it("toResolverErrors sends the form-level problem to root", () => {
    expect(toResolverErrors({ "": "owner: unknown field" })).toEqual({ root: { type: "validate", message: "owner: unknown field" } });
  });
});
