import { describe, expect, it } from "vitest";
import { plantInputSchema } from "@loopyard/core";
import { zodToHttpError } from "../../src/http/validation.js";

describe("zodToHttpError", () => {
  it("zodToHttpError gives a 400 whose field is the dotted path and whose message starts with it", () => {
    const result = plantInputSchema.safeParse({ name: "P", model: { kind: "transfer-function", num: [1], den: [0, 1], delay: 0 } });
    expect(result.success).toBe(false);
    if (result.success) return;
    const error = zodToHttpError(result.error);
    expect(error.status).toBe(400);
    expect(error.field).toBe("model.den");
    expect(error.message).toBe("model.den: the leading denominator coefficient must be non-zero");
    expect(error.toBody().issues).toEqual([{ field: "model.den", message: error.message }]);
  });
});
