import { describe, expect, it } from "vitest";
import { prepareStepTest } from "../../src/identification/prepare-step-test.js";
import { readStepTest } from "../../src/identification/read-step-test.js";
import { StepTestFileError } from "../../src/identification/step-test-file-error.js";
import { expectClose } from "../support/expect-close.js";

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

const rows = (n: number, step = 4) =>
  Array.from({ length: n }, (_, k) => `${k * 0.5},${k >= step ? 30 : 20},${k >= step ? 50 + (k - step) : 50}`).join("\n");

describe("readStepTest", () => {
  it("readStepTest picks columns by header name or number and converts the time unit to seconds", () => {
    const text = `note,t_ms,temperature,power\n${Array.from({ length: 12 }, (_, k) => `a,${k * 250},${40 + k},${k >= 3 ? 8 : 2}`).join("\n")}\n`;
    const test = readStepTest(text, { columns: { time: "t_ms", input: 4, output: "Temperature" }, timeUnit: "ms", inputUnit: "%", outputUnit: "°C" });
    expect(test.columns.time).toEqual({ index: 2, name: "t_ms" });
    expect(test.columns.input).toEqual({ index: 4, name: "power" });
    expect(test.columns.output).toEqual({ index: 3, name: "temperature" });
    // 250 ms steps ⇒ t = 0.25·k s (unit table: 1 ms = 1e-3 s).
    expectClose(test.t[3], 0.75, 1e-15);
    expect(test.u[3]).toBe(8);
    expect(test.units).toEqual({ time: "ms", input: "%", output: "°C" });
    // The file's lines: the header is line 1, the first data row line 2.
    expect(test.lines[0]).toBe(2);
  });

  it("readStepTest reads a TSV and a semicolon file with decimal commas", () => {
    const tsv = `time\tu\ty\n${rows(12).replaceAll(",", "\t")}`;
    expect(readStepTest(tsv).t.length).toBe(12);
    const semicolon = `time;u;y\n${Array.from({ length: 12 }, (_, k) => `${k},5;${k > 3 ? 2 : 1};${k}`).join("\n")}`;
    const test = readStepTest(semicolon);
    expectClose(test.t[2], 2.5, 1e-15);
  });

  it("readStepTest names the row and column of a cell that is not a number", () => {
    const lines = rows(12).split("\n");
    lines[6] = "3,30,hot";
    const error = fileError(() => readStepTest(`time,power,temperature\n${lines.join("\n")}`));
    // Data row 7 is file line 8 (after the header).
    expect(error.row).toBe(8);
    expect(error.column).toBe(3);
    expect(error.message).toMatch(/^Row 8, column 3 \("temperature"\) holds "hot", not a number; .*\.$/);
  });

  it("readStepTest names an empty cell, a short row, a time that does not increase and an unknown column", () => {
    const lines = rows(12).split("\n");
    const withEmpty = [...lines];
    withEmpty[2] = "1,,50";
    expect(fileError(() => readStepTest(`time,power,temperature\n${withEmpty.join("\n")}`)).message).toMatch(/^Row 4, column 2 \("power"\) is empty/);
    const short = [...lines];
    short[9] = "4.5,30";
    const e2 = fileError(() => readStepTest(`time,power,temperature\n${short.join("\n")}`));
    expect(e2.row).toBe(11);
    expect(e2.message).toMatch(/has 2 cells where the header has 3/);
    const back = [...lines];
    back[5] = "1.5,30,51";
    const e3 = fileError(() => readStepTest(`time,power,temperature\n${back.join("\n")}`));
    expect([e3.row, e3.column]).toEqual([7, 1]);
    expect(e3.message).toMatch(/does not increase/);
    expect(fileError(() => readStepTest(`time,power,temperature\n${rows(12)}`, { columns: { output: "flow" } })).message).toMatch(/"flow" is not in the file/);
  });

  it("readStepTest refuses an empty file and a file with too few rows or columns", () => {
    expect(fileError(() => readStepTest("\n\n")).message).toMatch(/empty/);
    expect(fileError(() => readStepTest(rows(5))).message).toMatch(/5 data rows; a step test needs at least 10/);
    expect(fileError(() => readStepTest("1,2\n3,4\n")).message).toMatch(/2 columns/);
  });
});

describe("prepareStepTest", () => {
  it("prepareStepTest finds the step and removes the initial offset", () => {
    const test = prepareStepTest(readStepTest(`time,power,temperature\n${rows(14, 4)}`));
    // Step from 20 to 30 at the 5th sample (t = 2 s); y0 = 50 from the four samples before it.
    expect(test.stepIndex).toBe(4);
    expect(test.stepTime).toBe(2);
    expect(test.stepSize).toBe(10);
    expect(test.u0).toBe(20);
    expect(test.y0).toBe(50);
    expect(test.y[5]).toBe(1);
  });

  it("prepareStepTest trims to a window in seconds", () => {
    const test = prepareStepTest(readStepTest(`time,power,temperature\n${rows(30, 12)}`), { trim: { from: 2, to: 12 } });
    expect(test.t[0]).toBe(2);
    expect(test.t[test.t.length - 1]).toBe(12);
    expect(test.stepTime).toBe(6);
    expect(test.lines[0]).toBe(6);
  });

  it("prepareStepTest names the row where the input leaves its new level, and refuses an input without a step", () => {
    const lines = rows(16, 4).split("\n");
    lines[12] = "6,20,58";
    const error = fileError(() => prepareStepTest(readStepTest(`time,power,temperature\n${lines.join("\n")}`)));
    expect([error.row, error.column]).toEqual([14, 2]);
    expect(error.message).toMatch(/^Row 14, column 2 \("power"\): the input leaves its new level/);
    const flat = Array.from({ length: 12 }, (_, k) => `${k},20,${k}`).join("\n");
    expect(fileError(() => prepareStepTest(readStepTest(`time,power,temperature\n${flat}`))).message).toMatch(/ends where it starts/);
  });
});
