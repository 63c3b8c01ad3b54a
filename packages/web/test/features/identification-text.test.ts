import { describe, expect, it } from "vitest";
import { formatR2, formatWithInterval, identifiedUnitsNote, parameterSymbol, parameterUnit } from "../../src/features/identification/fit-parameter-text.js";
import { readSettingsText } from "../../src/features/identification/step-test-workbench.js";

const overview = {
  columns: [
    { index: 1, name: "time_s", numeric: true, increasing: true },
    { index: 2, name: "heater_pct", numeric: true, increasing: false },
    { index: 3, name: "plate_degC", numeric: true, increasing: false },
  ],
  hasHeader: true,
  delimiter: "," as const,
  rowCount: 401,
  preview: [],
  suggested: { time: 1, input: 2, output: 3 },
};

describe("fit parameter text", () => {
  it("a parameter reads as value [interval] with its unit: the gain in output per input unit, times in s", () => {
    expect(formatWithInterval(0.6, [0.59, 0.61])).toBe("0.6 [0.59, 0.61]");
    expect(formatWithInterval(-1.5, [Number.NaN, Number.NaN])).toBe("−1.5 [—]");
    expect(parameterUnit("k", "fopdt", { input: "%", output: "°C" })).toBe("°C/%");
    // IPDT: k·e^(−θs)/s, so k is a rate: output per input per second (dimensional analysis).
    expect(parameterUnit("k", "ipdt", { input: "%", output: "°C" })).toBe("°C/(%·s)");
    expect(parameterUnit("tau1", "sopdt", { input: "", output: "" })).toBe("s");
    expect(parameterSymbol("tau2")).toBe("τ₂");
    expect(formatR2(0.999987654)).toBe("0.999988");
    expect(identifiedUnitsNote({ input: "heater_pct", output: "plate_degC" }, { time: "s", input: "%", output: "°C" })).toBe("u: heater_pct [%]; y: plate_degC [°C]; t [s]");
  });

  it("readSettingsText picks columns by header name and refuses the same column twice at its field", () => {
    const base = { time: 1, input: 2, output: 3, timeUnit: "s" as const, inputUnit: "%", outputUnit: "°C", from: "", to: "", removeOffset: true };
    const read = readSettingsText(base, overview);
    expect(read.ok && read.settings.columns).toEqual({ time: "time_s", input: "heater_pct", output: "plate_degC" });
    const twice = readSettingsText({ ...base, output: 2 }, overview);
    expect(twice.ok).toBe(false);
    expect(!twice.ok && twice.errors["columns.output"]).toBe("choose a column other than the input column");
    const window = readSettingsText({ ...base, from: "50", to: "20" }, overview);
    expect(!window.ok && window.errors["trim.to"]).toBe("the window must end after it starts");
  });
});
