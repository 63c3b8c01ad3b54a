import Papa from "papaparse";
import { StepTestFileError } from "./step-test-file-error.js";

/** Most data rows a step-test file may hold (a 10 MB file of three numeric columns holds fewer). */
export const MAX_STEP_TEST_ROWS = 500_000;

/** The cells of a delimited text file, before any column is chosen or converted. */
export interface StepTestTable {
  /** Column names from the header line, or "column 1", "column 2", … when the file has none. */
  names: string[];
  /** True when the first non-empty line was a header (some cell not a number). */
  hasHeader: boolean;
  /** The data rows' cells, trimmed, in file order; empty lines dropped. */
  rows: string[][];
  /** The file line (1-based, header counted) of each data row. */
  lines: number[];
  /** The delimiter found: ",", "\t" or ";". */
  delimiter: string;
}

/** Delimiters tried, in order: comma (CSV), tab (TSV), semicolon (spreadsheet exports with a decimal comma). */
const DELIMITERS = [",", "\t", ";"];

/**
 * Splits the text of a CSV or TSV file into cells (papaparse, delimiter guessed among comma, tab
 * and semicolon; quoted fields allowed). The first non-empty line is a header when any of its
 * cells is not a number. Every data row must have as many cells as the first row.
 * Throws a StepTestFileError (one sentence naming the row) for an empty file, a quoting error, a
 * row with a different number of cells, or more than `maxRows` data rows. Pure: no I/O.
 */
export function parseStepTestTable(text: string, maxRows = MAX_STEP_TEST_ROWS): StepTestTable {
  if (typeof text !== "string") throw new TypeError("text must be the file's contents as a string");
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  const parsed = Papa.parse<string[]>(body, { delimiter: "", delimitersToGuess: DELIMITERS, skipEmptyLines: false, header: false, dynamicTyping: false });
  const quoteError = parsed.errors.find((e) => e.type === "Quotes");
  if (quoteError) {
    const line = (quoteError.row ?? 0) + 1;
    throw new StepTestFileError(`Row ${line}: ${quoteError.message.replace(/\.$/, "")}; close every quoted field.`, line);
  }
  const delimiter = DELIMITERS.includes(parsed.meta.delimiter) ? parsed.meta.delimiter : ",";
  const rows: string[][] = [];
  const lines: number[] = [];
  let header: string[] | null = null;
  let width = 0;
  for (let i = 0; i < parsed.data.length; i++) {
    const cells = parsed.data[i].map((c) => c.trim());
    if (cells.every((c) => c === "")) continue;
    const line = i + 1;
    if (width === 0) {
      width = cells.length;
      if (cells.some((c) => !isNumberCell(c, delimiter))) {
        header = cells;
        continue;
      }
    }
    if (cells.length !== width) {
      throw new StepTestFileError(`Row ${line} has ${cells.length} ${cells.length === 1 ? "cell" : "cells"} where the ${header ? "header" : "first row"} has ${width}; give every row the same columns.`, line);
    }
    if (rows.length >= maxRows) throw new StepTestFileError(`Row ${line}: the file has more than ${maxRows} data rows; thin it or cut it to the step.`, line);
    rows.push(cells);
    lines.push(line);
  }
  if (width === 0) throw new StepTestFileError("The file is empty; give a CSV or TSV with time, input and output columns.");
  const names = header ? header.map((name, j) => (name === "" ? `column ${j + 1}` : name)) : Array.from({ length: width }, (_, j) => `column ${j + 1}`);
  return { names, hasHeader: header !== null, rows, lines, delimiter };
}

/**
 * The number a cell holds, or NaN. A decimal comma is accepted when the delimiter is not a
 * comma ("1,5" in a semicolon- or tab-separated file).
 */
export function cellNumber(cell: string, delimiter: string): number {
  if (cell === "") return NaN;
  const text = delimiter !== "," && /^[+-]?\d*,\d+([eE][+-]?\d+)?$/.test(cell) ? cell.replace(",", ".") : cell;
  if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(text)) return NaN;
  return Number(text);
}

function isNumberCell(cell: string, delimiter: string): boolean {
  return Number.isFinite(cellNumber(cell, delimiter));
}
