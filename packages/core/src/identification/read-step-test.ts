import { cellNumber, MAX_STEP_TEST_ROWS, parseStepTestTable, type StepTestTable } from "./parse-step-test-table.js";
import { StepTestFileError } from "./step-test-file-error.js";

/** A column of the file: its header name, or its number counted from 1 (a string of digits counts as a number when no header has that name). */
export type StepTestColumn = string | number;

import { TIME_UNITS, type TimeUnit } from "./time-units.js";

export { TIME_UNITS, type TimeUnit };

/** Fewest data rows a step test may have (a few before the step and enough after it to fit). */
export const MIN_STEP_TEST_ROWS = 10;

/** How to read a step-test file. */
export interface StepTestReadOptions {
  /** Columns; defaults: time = 1, input = 2, output = 3. */
  columns?: { time?: StepTestColumn; input?: StepTestColumn; output?: StepTestColumn };
  /** Unit of the time column (default "s"); times are converted to seconds. */
  timeUnit?: TimeUnit;
  /** Labels of the input and output units (e.g. "%", "°C"), carried into the fit; not converted. */
  inputUnit?: string;
  outputUnit?: string;
  /** Most data rows accepted (default MAX_STEP_TEST_ROWS). */
  maxRows?: number;
}

/** One chosen column: its number (1-based) and name. */
export interface StepTestColumnInfo {
  index: number;
  name: string;
}

/** The measured signals of a step test, in file order. */
export interface StepTest {
  /** Time [s], strictly increasing. */
  t: Float64Array;
  /** Input u [inputUnit] and output y [outputUnit], as measured. */
  u: Float64Array;
  y: Float64Array;
  /** File line (1-based) of each sample, for sentences about a sample. */
  lines: Int32Array;
  columns: { time: StepTestColumnInfo; input: StepTestColumnInfo; output: StepTestColumnInfo };
  units: { time: TimeUnit; input: string; output: string };
}

/**
 * Reads a step test from the text of a CSV or TSV file (parseStepTestTable), picks the time,
 * input and output columns by name or number, converts each chosen cell to a number and the
 * times to seconds (t [s] = t_file · TIME_UNITS[timeUnit]). Pure: takes the text, no I/O.
 * Throws a StepTestFileError with one sentence naming the row and column for a cell that is not
 * a number, a time that does not increase, an unknown column, or too few rows.
 */
export function readStepTest(text: string, options: StepTestReadOptions = {}): StepTest {
  const table = parseStepTestTable(text, options.maxRows ?? MAX_STEP_TEST_ROWS);
  const timeUnit = options.timeUnit ?? "s";
  if (!(timeUnit in TIME_UNITS)) throw new RangeError(`timeUnit must be one of ${Object.keys(TIME_UNITS).join(", ")}, got "${String(timeUnit)}"`);
  if (table.names.length < 3) {
    throw new StepTestFileError(`The file has ${table.names.length} ${table.names.length === 1 ? "column" : "columns"}; a step test needs time, input and output columns.`);
  }
  const time = resolveColumn(table, options.columns?.time ?? 1, "time");
  const input = resolveColumn(table, options.columns?.input ?? 2, "input");
  const output = resolveColumn(table, options.columns?.output ?? 3, "output");
  if (time.index === input.index || time.index === output.index || input.index === output.index) {
    throw new StepTestFileError(`The time, input and output columns must differ; got columns ${time.index}, ${input.index} and ${output.index}.`);
  }
  const n = table.rows.length;
  if (n < MIN_STEP_TEST_ROWS) {
    throw new StepTestFileError(`The file has ${n} data ${n === 1 ? "row" : "rows"}; a step test needs at least ${MIN_STEP_TEST_ROWS}.`, table.lines[n - 1]);
  }
  const scale = TIME_UNITS[timeUnit];
  const t = numbers(table, time, scale);
  const u = numbers(table, input, 1);
  const y = numbers(table, output, 1);
  for (let k = 1; k < n; k++) {
    if (!(t[k] > t[k - 1])) {
      throw new StepTestFileError(
        `Row ${table.lines[k]}, column ${time.index} ("${time.name}"): time ${table.rows[k][time.index - 1]} does not increase from ${table.rows[k - 1][time.index - 1]} on row ${table.lines[k - 1]}; sort the rows by time.`,
        table.lines[k],
        time.index,
      );
    }
  }
  return {
    t,
    u,
    y,
    lines: Int32Array.from(table.lines),
    columns: { time, input, output },
    units: { time: timeUnit, input: options.inputUnit ?? "", output: options.outputUnit ?? "" },
  };
}

/** The column a choice names: a header name (exact, then ignoring case), or a number from 1. */
function resolveColumn(table: StepTestTable, choice: StepTestColumn, role: string): StepTestColumnInfo {
  const count = table.names.length;
  if (typeof choice === "string") {
    const name = choice.trim();
    let j = table.names.indexOf(name);
    if (j < 0) j = table.names.findIndex((candidate) => candidate.toLowerCase() === name.toLowerCase());
    if (j >= 0) return { index: j + 1, name: table.names[j] };
    if (/^\d+$/.test(name)) return resolveColumn(table, Number(name), role);
    const known = table.hasHeader ? `the header names ${table.names.map((c) => `"${c}"`).join(", ")}` : "the file has no header, so give a column number";
    throw new StepTestFileError(`The ${role} column "${name}" is not in the file; ${known}.`);
  }
  if (!Number.isInteger(choice) || choice < 1 || choice > count) {
    throw new StepTestFileError(`The ${role} column ${String(choice)} does not exist; give a number from 1 to ${count} or a header name.`);
  }
  return { index: choice, name: table.names[choice - 1] };
}

function numbers(table: StepTestTable, column: StepTestColumnInfo, scale: number): Float64Array {
  const out = new Float64Array(table.rows.length);
  const j = column.index - 1;
  for (let k = 0; k < out.length; k++) {
    const cell = table.rows[k][j];
    const v = cellNumber(cell, table.delimiter);
    if (!Number.isFinite(v)) {
      const what = cell === "" ? "is empty" : `holds "${cell.length > 24 ? `${cell.slice(0, 24)}…` : cell}", not a number`;
      throw new StepTestFileError(`Row ${table.lines[k]}, column ${column.index} ("${column.name}") ${what}; give a number in every chosen cell.`, table.lines[k], column.index);
    }
    out[k] = v * scale;
  }
  return out;
}
