import { useState } from "react";
import {
  STEP_MODEL_KINDS,
  stepTestSettingsSchema,
  type StepModelKind,
  type StepTestDto,
  type StepTestFitReport,
  type StepTestSettings,
} from "@loopyard/core";
import { isApiError } from "../../api/api-error.js";
import { Button } from "../../components/button.js";
import { ErrorNote } from "../../components/error-note.js";
import { Field, inputClass } from "../../components/field.js";
import { Section } from "../../components/section.js";
import { FitChart } from "./fit-chart.js";
import { FitTable } from "./fit-table.js";
import { identifiedUnitsNote } from "./fit-parameter-text.js";
import { StepTestPreview } from "./step-test-preview.js";

/** What the workbench saves: the settings, the chosen model and the plant's name and units note. */
export interface WorkbenchSave {
  settings: StepTestSettings;
  model: StepModelKind;
  name: string;
  unitsNote: string;
}

const TIME_UNITS = ["s", "ms", "min", "h"] as const;

/** Settings as typed: columns by number, units and trim window as text. */
interface SettingsText {
  time: number;
  input: number;
  output: number;
  timeUnit: StepTestSettings["units"]["time"];
  inputUnit: string;
  outputUnit: string;
  from: string;
  to: string;
  removeOffset: boolean;
}

/** Initial text of the settings: from stored settings (a refit) or from the file's suggested columns. */
export function initialSettingsText(overview: StepTestDto["overview"], settings?: StepTestSettings): SettingsText {
  const byName = (choice: string | number | undefined, fallback: number) => {
    if (typeof choice === "number") return choice;
    const found = overview.columns.find((c) => c.name === choice);
    return found ? found.index : fallback;
  };
  return {
    time: byName(settings?.columns.time, overview.suggested.time),
    input: byName(settings?.columns.input, overview.suggested.input),
    output: byName(settings?.columns.output, overview.suggested.output),
    timeUnit: settings?.units.time ?? "s",
    inputUnit: settings?.units.input ?? "",
    outputUnit: settings?.units.output ?? "",
    from: settings?.trim.from === undefined ? "" : String(settings.trim.from),
    to: settings?.trim.to === undefined ? "" : String(settings.trim.to),
    removeOffset: (settings?.offset ?? "initial") === "initial",
  };
}

/** The typed settings as the API's settings, checked with the shared schema; or the problems by field. */
export function readSettingsText(text: SettingsText, overview: StepTestDto["overview"]): { ok: true; settings: StepTestSettings } | { ok: false; errors: Record<string, string> } {
  const name = (index: number) => overview.columns.find((c) => c.index === index)?.name ?? index;
  const number = (value: string) => (value.trim() === "" ? undefined : Number(value.replace(/\u2212/g, "-")));
  const trim: { from?: number; to?: number } = {};
  const from = number(text.from);
  const to = number(text.to);
  if (from !== undefined) trim.from = from;
  if (to !== undefined) trim.to = to;
  const candidate = {
    columns: { time: overview.hasHeader ? name(text.time) : text.time, input: overview.hasHeader ? name(text.input) : text.input, output: overview.hasHeader ? name(text.output) : text.output },
    units: { time: text.timeUnit, input: text.inputUnit, output: text.outputUnit },
    trim,
    offset: text.removeOffset ? "initial" : "none",
  };
  const parsed = stepTestSettingsSchema.safeParse(candidate);
  if (parsed.success) return { ok: true, settings: parsed.data };
  const errors: Record<string, string> = {};
  for (const issue of parsed.error.issues) {
    const key = issue.path.join(".");
    errors[key] ??= issue.path.includes("trim") && issue.code === "invalid_type" ? "give a number of seconds, or leave it empty" : issue.message;
  }
  return { ok: false, errors };
}

/**
 * The step-test bench: choose columns, units and window; fit the three models; compare them on the
 * data with their residuals; save the chosen one. Used for a new plant and for a refit.
 */
export function StepTestWorkbench({
  stepTest,
  initial,
  initialModel = "fopdt",
  initialName,
  saveLabel,
  onFit,
  onSave,
  fitPending,
  savePending,
  saveError,
}: {
  stepTest: StepTestDto;
  initial?: StepTestSettings;
  initialModel?: StepModelKind;
  initialName: string;
  saveLabel: string;
  onFit: (settings: StepTestSettings) => Promise<StepTestFitReport>;
  onSave: (save: WorkbenchSave) => Promise<void>;
  fitPending: boolean;
  savePending: boolean;
  saveError: unknown;
}) {
  const { overview } = stepTest;
  const [text, setText] = useState<SettingsText>(() => initialSettingsText(overview, initial));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [fitError, setFitError] = useState<unknown>(null);
  const [report, setReport] = useState<{ settings: StepTestSettings; result: StepTestFitReport } | null>(null);
  const [chosen, setChosen] = useState<StepModelKind>(initialModel);
  const [name, setName] = useState(initialName);
  const [unitsNote, setUnitsNote] = useState<string | null>(null);
  const numeric = overview.columns.filter((c) => c.numeric);
  const set = (patch: Partial<SettingsText>) => {
    setText((t) => ({ ...t, ...patch }));
    setErrors({});
  };

  async function fit() {
    const read = readSettingsText(text, overview);
    if (!read.ok) {
      setErrors(read.errors);
      return;
    }
    setFitError(null);
    try {
      const result = await onFit(read.settings);
      setReport({ settings: read.settings, result });
      const best = STEP_MODEL_KINDS.filter((k) => result.fits[k]?.ok).sort((a, b) => ((result.fits[b] as { r2: number }).r2 ?? 0) - ((result.fits[a] as { r2: number }).r2 ?? 0));
      if (!result.fits[chosen]?.ok && best[0]) setChosen(best[0]);
    } catch (error) {
      setReport(null);
      if (isApiError(error) && error.field?.startsWith("settings.")) setErrors({ [error.field.slice("settings.".length)]: error.message });
      setFitError(error);
    }
  }

  const columnSelect = (role: "time" | "input" | "output", label: string) => (
    <Field label={label} htmlFor={`column-${role}`} name={`columns.${role}`} error={errors[`columns.${role}`]}>
      <select id={`column-${role}`} data-testid={`column-${role}`} className={inputClass} value={text[role]} onChange={(e) => set({ [role]: Number(e.target.value) } as Partial<SettingsText>)}>
        {numeric.map((c) => (
          <option key={c.index} value={c.index}>
            {c.index}. {c.name}
          </option>
        ))}
      </select>
    </Field>
  );

  const result = report?.result;
  const chosenFit = result?.fits[chosen];
  const defaultNote = result ? identifiedUnitsNote({ input: result.columns.input.name, output: result.columns.output.name }, result.units) : "";

  return (
    <div className="space-y-6" data-testid="step-test-workbench">
      <div className="grid grid-cols-1 gap-6 lg:grid-cols-5">
        <div className="lg:col-span-3">
          <StepTestPreview stepTest={stepTest} highlight={{ time: text.time, input: text.input, output: text.output }} />
        </div>
        <div className="lg:col-span-2">
          <Section title="Columns, units and window">
            <div className="grid grid-cols-3 gap-3">
              {columnSelect("time", "Time")}
              {columnSelect("input", "Input u")}
              {columnSelect("output", "Output y")}
              <Field label="Time unit" htmlFor="unit-time" name="units.time" error={errors["units.time"]}>
                <select id="unit-time" data-testid="unit-time" className={inputClass} value={text.timeUnit} onChange={(e) => set({ timeUnit: e.target.value as SettingsText["timeUnit"] })}>
                  {TIME_UNITS.map((u) => (
                    <option key={u} value={u}>
                      {u}
                    </option>
                  ))}
                </select>
              </Field>
              <Field label="Unit of u" htmlFor="unit-input" name="units.input" error={errors["units.input"]}>
                <input id="unit-input" data-testid="unit-input" className={inputClass} value={text.inputUnit} placeholder="%" onChange={(e) => set({ inputUnit: e.target.value })} />
              </Field>
              <Field label="Unit of y" htmlFor="unit-output" name="units.output" error={errors["units.output"]}>
                <input id="unit-output" data-testid="unit-output" className={inputClass} value={text.outputUnit} placeholder="°C" onChange={(e) => set({ outputUnit: e.target.value })} />
              </Field>
              <Field label="Keep from [s]" htmlFor="trim-from" name="trim.from" error={errors["trim.from"]} hint="empty: the first row">
                <input id="trim-from" data-testid="trim-from" inputMode="decimal" className={inputClass} value={text.from} onChange={(e) => set({ from: e.target.value })} />
              </Field>
              <Field label="Keep to [s]" htmlFor="trim-to" name="trim.to" error={errors["trim.to"]} hint="empty: the last row">
                <input id="trim-to" data-testid="trim-to" inputMode="decimal" className={inputClass} value={text.to} onChange={(e) => set({ to: e.target.value })} />
              </Field>
              <div className="flex items-end pb-1">
                <label className="flex items-center gap-2 text-sm">
                  <input type="checkbox" data-testid="remove-offset" checked={text.removeOffset} onChange={(e) => set({ removeOffset: e.target.checked })} />
                  Remove the level before the step
                </label>
              </div>
            </div>
            <div className="mt-4 flex items-center gap-3">
              <Button tone="primary" className="whitespace-nowrap" onClick={() => void fit()} disabled={fitPending} data-testid="fit-models">
                {fitPending ? "Fitting…" : report ? "Fit again" : "Fit the three models"}
              </Button>
              <span className="text-xs text-ink-soft">Least squares from a two-point start (28.3 % and 63.2 % times); intervals at 95 %.</span>
            </div>
          </Section>
        </div>
      </div>
      {fitError ? <ErrorNote error={fitError} title="Could not fit the step test" testId="fit-error" /> : null}
      {result ? (
        <>
          <Section title="Fits compared" aside={`${result.samples} samples · step of ${result.stepSize.toPrecision(4)} ${result.units.input || "u"} at t = ${result.stepTime.toPrecision(4)} s`} testId="fit-comparison">
            <FitTable report={result} chosen={chosen} onChoose={setChosen} />
          </Section>
          <Section title="Data, models and residuals">
            <FitChart
              t={result.series.t}
              measured={result.series.y}
              outputLabel={`${result.columns.output.name}${result.units.output ? ` [${result.units.output}]` : ""}`}
              fits={STEP_MODEL_KINDS.flatMap((kind) => {
                const f = result.fits[kind];
                return f?.ok ? [{ kind, fitted: f.fitted, residuals: f.residuals, chosen: kind === chosen }] : [];
              })}
            />
          </Section>
          <Section title={saveLabel}>
            <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
              <Field label="Plant name" htmlFor="plant-name" name="name">
                <input id="plant-name" data-testid="identified-name" className={inputClass} value={name} onChange={(e) => setName(e.target.value)} />
              </Field>
              <Field label="Units note" htmlFor="plant-units" name="unitsNote">
                <input id="plant-units" data-testid="identified-units" className={inputClass} value={unitsNote ?? defaultNote} onChange={(e) => setUnitsNote(e.target.value)} />
              </Field>
            </div>
            {saveError ? <div className="mt-3"><ErrorNote error={saveError} title="Could not save the plant" testId="save-error" /></div> : null}
            <div className="mt-4 flex items-center gap-3">
              <Button
                tone="primary"
                data-testid="save-identified"
                disabled={savePending || !chosenFit?.ok || name.trim() === ""}
                onClick={() => void onSave({ settings: report.settings, model: chosen, name: name.trim(), unitsNote: unitsNote ?? defaultNote })}
              >
                {savePending ? "Saving…" : `${saveLabel} (${chosen.toUpperCase()})`}
              </Button>
              <span className="text-xs text-ink-soft">The file, the columns, the settings and the fit are kept with the plant, so it can be refitted later.</span>
            </div>
          </Section>
        </>
      ) : null}
    </div>
  );
}
