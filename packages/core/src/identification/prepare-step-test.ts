import { MIN_STEP_TEST_ROWS, type StepTest } from "./read-step-test.js";
import { StepTestFileError } from "./step-test-file-error.js";

/** How to cut and level a step test before fitting. */
export interface StepTestPrepareOptions {
  /** Keep only samples with from ≤ t ≤ to [s] (after the time-unit conversion); default: all. */
  trim?: { from?: number; to?: number };
  /**
   * "initial" (default): subtract the initial levels u0 and y0, the means of the samples before
   * the input step; "none": the output is taken as a deviation already (y0 = 0).
   */
  offset?: "initial" | "none";
}

/** A step test cut to its window, with the step found and the initial offset removed. */
export interface PreparedStepTest {
  /** Time [s] as in the file (trimmed). */
  t: Float64Array;
  /** Output deviation y − y0 [outputUnit]. */
  y: Float64Array;
  /** Time of the first sample at the input's new level [s]: the model's step time. */
  stepTime: number;
  /** Input step Δu = u1 − u0 [inputUnit], u1 the mean of the samples from the step on. */
  stepSize: number;
  /** Initial input and output levels (means before the step; y0 = 0 with offset "none"). */
  u0: number;
  y0: number;
  /** Index of the first sample at the new input level. */
  stepIndex: number;
  /** The offset option used: with "initial" the fit also estimates a correction of y0. */
  offset: "initial" | "none";
  /** File lines (1-based) of the kept samples. */
  lines: Int32Array;
}

/** Fraction of the input's total change that marks the step (half-way: robust to input noise). */
const STEP_THRESHOLD = 0.5;

/**
 * Cuts a step test to the trim window, finds the input step and removes the initial offset:
 *
 *   step index s = first k with |u_k − u_first| > ½·|u_last − u_first|,
 *   u0 = mean(u_0 … u_{s−1}),   u1 = mean(u_s … u_{N−1}),   Δu = u1 − u0,
 *   y_dev = y − y0,   y0 = mean(y_0 … y_{s−1})   (offset "initial").
 *
 * The model is then driven by an ideal step of size Δu at the step time t_s (the first sample at
 * the new level; a step between two samples is thus placed up to one sample late, which the fit
 * absorbs into the dead time). Common practice in step-response identification
 * (Seborg, Edgar, Mellichamp & Doyle, Process Dynamics and Control, 4th ed., 2016, §7.2).
 * Throws a StepTestFileError (one sentence naming the row and column) when too few samples remain,
 * the input does not step, steps at the first sample, or leaves its new level again.
 */
export function prepareStepTest(test: StepTest, options: StepTestPrepareOptions = {}): PreparedStepTest {
  const from = options.trim?.from ?? -Infinity;
  const to = options.trim?.to ?? Infinity;
  if (Number.isNaN(from) || Number.isNaN(to) || !(to > from)) throw new RangeError(`trim must have from < to, got from = ${from}, to = ${to}`);
  const offset = options.offset ?? "initial";
  if (offset !== "initial" && offset !== "none") throw new RangeError(`offset must be "initial" or "none", got "${String(offset)}"`);
  let first = 0;
  while (first < test.t.length && test.t[first] < from) first++;
  let end = first;
  while (end < test.t.length && test.t[end] <= to) end++;
  const count = end - first;
  const uCol = test.columns.input;
  if (count < MIN_STEP_TEST_ROWS) {
    throw new StepTestFileError(`The trim window keeps ${count} ${count === 1 ? "sample" : "samples"}; keep at least ${MIN_STEP_TEST_ROWS}.`);
  }
  const t = test.t.slice(first, end);
  const u = test.u.subarray(first, end);
  const yRaw = test.y.subarray(first, end);
  const lines = test.lines.slice(first, end);
  const uFirst = u[0];
  const change = u[count - 1] - uFirst;
  if (change === 0) {
    throw new StepTestFileError(`Column ${uCol.index} ("${uCol.name}") ends where it starts (rows ${lines[0]} and ${lines[count - 1]}); choose the column of the stepped input or widen the trim window.`, lines[0], uCol.index);
  }
  let s = 0;
  while (s < count && !(Math.abs(u[s] - uFirst) > STEP_THRESHOLD * Math.abs(change))) s++;
  if (s === 0 || s >= count) {
    throw new StepTestFileError(`Column ${uCol.index} ("${uCol.name}") steps at row ${lines[0]}, the first kept sample; keep samples before the step so the initial level is known.`, lines[0], uCol.index);
  }
  const u0 = mean(u, 0, s);
  const u1 = mean(u, s, count);
  const stepSize = u1 - u0;
  for (let k = s; k < count; k++) {
    if (Math.abs(u[k] - u1) > STEP_THRESHOLD * Math.abs(stepSize)) {
      throw new StepTestFileError(
        `Row ${lines[k]}, column ${uCol.index} ("${uCol.name}"): the input leaves its new level ${format(u1)} after the step at row ${lines[s]}; a step test needs one step, so trim before row ${lines[k]}.`,
        lines[k],
        uCol.index,
      );
    }
  }
  const y0 = offset === "initial" ? mean(yRaw, 0, s) : 0;
  const y = new Float64Array(count);
  for (let k = 0; k < count; k++) y[k] = yRaw[k] - y0;
  return { t, y, stepTime: t[s], stepSize, u0, y0, stepIndex: s, offset, lines };
}

function mean(v: Float64Array, from: number, to: number): number {
  let sum = 0;
  for (let k = from; k < to; k++) sum += v[k];
  return sum / (to - from);
}

function format(v: number): string {
  return Number(v.toPrecision(6)).toString();
}
