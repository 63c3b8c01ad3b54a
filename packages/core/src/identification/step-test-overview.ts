import { cellNumber, MAX_STEP_TEST_ROWS, parseStepTestTable } from "./parse-step-test-table.js";
import { MIN_STEP_TEST_ROWS } from "./read-step-test.js";
import { StepTestFileError } from "./step-test-file-error.js";

/** Rows of the file shown as its preview. */
export const STEP_TEST_PREVIEW_ROWS = 8;

/** What an uploaded step-test file holds, before any column is chosen. */
export interface StepTestOverview {
  /** Every column: number from 1, name, whether every cell is a number, whether it strictly increases. */
  columns: { index: number; name: string; numeric: boolean; increasing: boolean }[];
  hasHeader: boolean;
  delimiter: "," | "\t" | ";";
  rowCount: number;
  /** The first data rows' cells as in the file, with their file lines. */
  preview: { line: number; cells: string[] }[];
  /** Columns guessed for time (the first increasing one), input (the numeric column with fewest distinct values) and output (the next numeric one). */
  suggested: { time: number; input: number; output: number };
}

/**
 * Looks at an uploaded step-test file (parseStepTestTable) and says what it holds, checking what
 * holds whatever columns are chosen later: at least MIN_STEP_TEST_ROWS and at most MAX_STEP_TEST_ROWS
 * data rows of equal width, at least three columns of numbers (a time, an input and an output) of
 * which one increases strictly (a time). Throws a StepTestFileError with one sentence naming the row
 * and column otherwise: the first cell that is not a number in the first column that is not all
 * numbers, or the first row where the leading numeric column stops increasing. Pure: no I/O.
 */
export function stepTestOverview(text: string, maxRows = MAX_STEP_TEST_ROWS): StepTestOverview {
  const table = parseStepTestTable(text, maxRows);
  const n = table.rows.length;
  if (table.names.length < 3) {
    throw new StepTestFileError(`The file has ${table.names.length} ${table.names.length === 1 ? "column" : "columns"}; a step test needs time, input and output columns.`);
  }
  if (n < MIN_STEP_TEST_ROWS) {
    throw new StepTestFileError(`The file has ${n} data ${n === 1 ? "row" : "rows"}; a step test needs at least ${MIN_STEP_TEST_ROWS}.`, n > 0 ? table.lines[n - 1] : undefined);
  }
  const values = table.names.map((_, j) => table.rows.map((row) => cellNumber(row[j], table.delimiter)));
  const firstBad = values.map((column) => column.findIndex((v) => !Number.isFinite(v)));
  const columns = table.names.map((name, j) => {
    const numeric = firstBad[j] < 0;
    let increasing = numeric;
    for (let k = 1; increasing && k < n; k++) if (!(values[j][k] > values[j][k - 1])) increasing = false;
    return { index: j + 1, name, numeric, increasing };
  });
  const numeric = columns.filter((c) => c.numeric);
  if (numeric.length < 3) {
    // The column that is "nearly" numeric: the one whose first bad cell comes latest (a text column fails at once).
    let j = -1;
    for (let i = 0; i < columns.length; i++) if (!columns[i].numeric && (j < 0 || firstBad[i] > firstBad[j])) j = i;
    const k = firstBad[j];
    const cell = table.rows[k][j];
    const what = cell === "" ? "is empty" : `holds "${cell.length > 24 ? `${cell.slice(0, 24)}…` : cell}", not a number`;
    throw new StepTestFileError(
      `Row ${table.lines[k]}, column ${j + 1} ("${table.names[j]}") ${what}; the file has ${numeric.length} ${numeric.length === 1 ? "column" : "columns"} of numbers and a step test needs three (time, input, output).`,
      table.lines[k],
      j + 1,
    );
  }
  const time = columns.find((c) => c.increasing);
  if (!time) {
    const j = numeric[0].index - 1;
    let k = 1;
    while (k < n && values[j][k] > values[j][k - 1]) k++;
    throw new StepTestFileError(
      `Row ${table.lines[k]}, column ${j + 1} ("${table.names[j]}"): time ${table.rows[k][j]} does not increase from ${table.rows[k - 1][j]} on row ${table.lines[k - 1]}, and no other column increases either; sort the rows by time.`,
      table.lines[k],
      j + 1,
    );
  }
  const rest = numeric.filter((c) => c.index !== time.index);
  const distinct = (c: { index: number }) => new Set(values[c.index - 1]).size;
  const input = rest.reduce((best, c) => (distinct(c) < distinct(best) ? c : best));
  const output = rest.find((c) => c.index !== input.index)!;
  return {
    columns,
    hasHeader: table.hasHeader,
    delimiter: table.delimiter as StepTestOverview["delimiter"],
    rowCount: n,
    preview: table.rows.slice(0, STEP_TEST_PREVIEW_ROWS).map((cells, k) => ({ line: table.lines[k], cells })),
    suggested: { time: time.index, input: input.index, output: output.index },
  };
}
