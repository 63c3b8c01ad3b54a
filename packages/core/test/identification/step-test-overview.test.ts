import { describe, expect, it } from "vitest";
import { StepTestFileError } from "../../src/identification/step-test-file-error.js";
import { stepTestOverview } from "../../src/identification/step-test-overview.js";
import { stepCsv } from "./step-data.js";

/** The StepTestFileError `run` throws (fails the test when it throws nothing or something else). */
function fileError(run: () => unknown): StepTestFileError {
  try {
    run();
  } catch (error) {
    if (error instanceof StepTestFileError) return error;
    throw error;
  }
  throw new Error("expected a StepTestFileError");
}

// FOPDT step, Δy = 2·4·(1 − e^(−(s−1)/5)) (closed form, Seborg et al. 2016, §5.2): any smooth response will do here.
const response = (s: number) => (s > 1 ? 8 * (1 - Math.exp(-(s - 1) / 5)) : 0);
const good = stepCsv({ h: 0.5, horizon: 30, stepTime: 3, u0: 10, du: 4, y0: 21, response });

describe("stepTestOverview", () => {
  it("stepTestOverview lists the columns, counts the rows and suggests time, input and output", () => {
    // A note column before the numbers: the suggestion skips it; the input is the column with two values.
    const lines = good.trim().split("\n");
    const text = [`note,${lines[0]}`, ...lines.slice(1).map((l) => `x,${l}`)].join("\n");
    const overview = stepTestOverview(text);
    expect(overview.columns.map((c) => [c.name, c.numeric, c.increasing])).toEqual([
      ["note", false, false],
      ["time", true, true],
      ["power", true, false],
      ["temperature", true, false],
    ]);
    expect(overview.rowCount).toBe(61);
    expect(overview.suggested).toEqual({ time: 2, input: 3, output: 4 });
    expect(overview.preview[0]).toEqual({ line: 2, cells: ["x", "0", "10", "21"] });
    expect(overview.delimiter).toBe(",");
  });

  it("stepTestOverview names the row and column of the cell that leaves fewer than three columns of numbers", () => {
    const lines = good.split("\n");
    lines[6] = "2.5,14,warm";
    const error = fileError(() => stepTestOverview(lines.join("\n")));
    expect(error.row).toBe(7);
    expect(error.column).toBe(3);
    expect(error.message).toMatch(/^Row 7, column 3 \("temperature"\) holds "warm", not a number; .*\.$/);
  });

  it("stepTestOverview names the row where time stops increasing when no column increases", () => {
    const lines = good.split("\n");
    lines[9] = lines[9].replace(/^4/, "3.5");
    const error = fileError(() => stepTestOverview(lines.join("\n")));
    expect(error.row).toBe(10);
    expect(error.column).toBe(1);
    expect(error.message).toMatch(/^Row 10, column 1 \("time"\): time 3\.5 does not increase from 3.5 on row 9/);
  });

  it("stepTestOverview refuses too few rows and too few columns with a sentence", () => {
    const short = good.split("\n").slice(0, 6).join("\n");
    const few = fileError(() => stepTestOverview(short));
    expect(few.message).toBe("The file has 5 data rows; a step test needs at least 10.");
    expect(few.row).toBe(6);
    const narrow = fileError(() => stepTestOverview("t,y\n1,2\n2,3\n"));
    expect(narrow.message).toMatch(/^The file has 2 columns; /);
  });
});
