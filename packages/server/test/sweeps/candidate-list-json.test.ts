import { describe, expect, it } from "vitest";
import { floatArrayTextToJson, variantScoresTextToJson } from "../../src/sweeps/candidate-list-json.js";

describe("floatArrayTextToJson", () => {
  it("turns PostgreSQL float8[] text into ScoreValue JSON: NaN → null, ±Infinity → inf/-inf strings, numbers as printed (PostgreSQL docs, float output)", () => {
    expect(JSON.parse(floatArrayTextToJson("{1.5,NaN,Infinity,-Infinity,1e-05,-2.25e+20}"))).toEqual([1.5, null, "inf", "-inf", 1e-5, -2.25e20]);
    expect(floatArrayTextToJson("{}")).toBe("[]");
  });

  it("reads back the same double as the shortest round-trip text (ECMA-262 Number::toString)", () => {
    const values = [0.1, 1 / 3, Math.PI * 1e-9, 123456.789e10];
    expect(JSON.parse(floatArrayTextToJson(`{${values.map(String).join(",")}}`))).toEqual(values);
  });
});

describe("variantScoresTextToJson", () => {
  it("cuts a flat F × C array into one array per variant, null for a variant with no value (not stable there)", () => {
    expect(JSON.parse(variantScoresTextToJson("{1,2,NaN,NaN,3,Infinity}", 2))).toEqual([[1, 2], null, [3, "inf"]]);
  });
});
