import type { IdentificationProvenance } from "../plants/identified.js";
import { downsampleIndices, pick } from "../traces/downsample-trace.js";
import { fitStepModel, type StepModelFit } from "./fit-step-model.js";
import { prepareStepTest } from "./prepare-step-test.js";
import { readStepTest, type StepTestColumnInfo } from "./read-step-test.js";
import type { IdentifiedTransferFunction, StepModelKind } from "./step-model.js";
import type { StepTestSettings } from "./step-test-settings.js";

/** Most points of each plotted series of a fit report (the fit itself uses every kept sample). */
export const FIT_PLOT_POINTS = 1500;

/**
 * One model fitted to a step test, as the API sends it: the fit's figures (StepModelFit) without
 * its full-length curves and step, with the curves at the plotted samples (`series.t`) instead.
 */
export type StepFitResult = Pick<StepModelFit, "ok" | "kind" | "parameters" | "intervals" | "standardErrors" | "start" | "r2" | "sse" | "dof" | "model"> & {
  /** Initial output level the model starts from [output unit]. */
  y0: number;
  /** The model's output and the residual y − ŷ at the plotted samples (`series.t`), in the output's unit. */
  fitted: number[];
  residuals: number[];
};

/** A step test read, prepared and fitted with every requested model. */
export interface StepTestFitReport {
  columns: { time: StepTestColumnInfo; input: StepTestColumnInfo; output: StepTestColumnInfo };
  units: { time: string; input: string; output: string };
  /** Samples kept by the trim window (all of them are fitted). */
  samples: number;
  /** The step found: time [s], size [input unit], the input and output levels before it. */
  stepTime: number;
  stepSize: number;
  u0: number;
  y0: number;
  /** The measured signals at the plotted samples (at most FIT_PLOT_POINTS, evenly strided). */
  series: { t: number[]; u: number[]; y: number[] };
  fits: Partial<Record<StepModelKind, StepFitResult | { ok: false; kind: StepModelKind; reason: string }>>;
}

/**
 * Reads a step-test file with the chosen columns and units (readStepTest), trims it and removes the
 * initial offset (prepareStepTest), fits each requested model (fitStepModel) on every kept sample,
 * and thins the measured, fitted and residual series for plotting (downsampleIndices). Levels are
 * given back in the file's units (y = y_dev + y0). Throws a StepTestFileError (one sentence naming
 * the row and column) for a bad file or choice; a model that cannot be fitted is `{ ok: false, reason }`.
 */
export function fitStepTest(text: string, settings: StepTestSettings, models: readonly StepModelKind[]): StepTestFitReport {
  const test = readStepTest(text, { columns: settings.columns, timeUnit: settings.units.time, inputUnit: settings.units.input, outputUnit: settings.units.output });
  const trim: { from?: number; to?: number } = {};
  if (settings.trim.from !== undefined) trim.from = settings.trim.from;
  if (settings.trim.to !== undefined) trim.to = settings.trim.to;
  const prepared = prepareStepTest(test, { trim, offset: settings.offset });
  const n = prepared.t.length;
  const indices = downsampleIndices(n, FIT_PLOT_POINTS);
  const first = prepared.lines[0];
  let offsetIndex = 0;
  while (test.lines[offsetIndex] !== first) offsetIndex++;
  const u = test.u.subarray(offsetIndex, offsetIndex + n);
  const level = prepared.y0;
  const fits: StepTestFitReport["fits"] = {};
  for (const kind of models) {
    const fit = fitStepModel(prepared, kind);
    if (!fit.ok) {
      fits[kind] = { ok: false, kind, reason: fit.reason };
      continue;
    }
    fits[kind] = {
      ok: true,
      kind,
      parameters: fit.parameters,
      intervals: fit.intervals,
      standardErrors: fit.standardErrors,
      start: fit.start,
      r2: fit.r2,
      sse: fit.sse,
      dof: fit.dof,
      model: fit.model,
      y0: fit.y0,
      fitted: indices.map((k) => fit.fitted[k] + level),
      residuals: pick(fit.residuals, indices),
    };
  }
  return {
    columns: test.columns,
    units: test.units,
    samples: n,
    stepTime: prepared.stepTime,
    stepSize: prepared.stepSize,
    u0: prepared.u0,
    y0: prepared.y0,
    series: { t: pick(prepared.t, indices), u: pick(u, indices), y: indices.map((k) => prepared.y[k] + level) },
    fits,
  };
}

/**
 * The provenance an identified plant keeps of one fit of a report (see IdentifiedPlant), or null
 * when that model was not fitted.
 */
export function identificationProvenance(stepTestId: string, fileName: string, settings: StepTestSettings, report: StepTestFitReport, kind: StepModelKind): IdentificationProvenance | null {
  const fit = report.fits[kind];
  if (!fit || !fit.ok) return null;
  return {
    stepTestId,
    fileName,
    settings,
    columns: report.columns,
    fit: {
      model: kind,
      parameters: fit.parameters,
      intervals: fit.intervals,
      r2: fit.r2,
      sse: fit.sse,
      dof: fit.dof,
      samples: report.samples,
      stepTime: report.stepTime,
      stepSize: report.stepSize,
      u0: report.u0,
      y0: fit.y0,
    },
  };
}
