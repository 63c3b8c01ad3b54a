import { useState, type FormEvent } from "react";
import { Button } from "../../components/button.js";
import { Field, inputClass } from "../../components/field.js";
import type { SheetSettings } from "./sheet-settings.js";

/** Sample time, method and fixed-point format of a sheet; the sheet is recomputed on "Show sheet". */
export function SheetControls({ settings, onChange, busy }: { settings: SheetSettings; onChange: (next: SheetSettings) => void; busy: boolean }) {
  const [sampleTime, setSampleTime] = useState(String(settings.sampleTime));
  const [method, setMethod] = useState(settings.method);
  const [format, setFormat] = useState<string>(settings.format ?? "none");
  const submit = (event: FormEvent) => {
    event.preventDefault();
    onChange({ sampleTime: Number(sampleTime), method, format: format === "q15" || format === "q31" ? format : null });
  };
  const hz = Number(sampleTime) > 0 ? 1 / Number(sampleTime) : Number.NaN;
  return (
    <form onSubmit={submit} className="flex flex-wrap items-end gap-4 rounded-lg border border-line bg-sheet px-4 py-3" data-testid="sheet-controls">
      <Field label="Sample time h [s]" htmlFor="sheet-sample-time" name="sampleTime" hint={Number.isFinite(hz) ? `${Number(hz.toPrecision(4))} Hz` : "a number of seconds > 0"} className="w-44">
        <input id="sheet-sample-time" className={`${inputClass} font-mono`} inputMode="decimal" value={sampleTime} onChange={(e) => setSampleTime(e.target.value)} />
      </Field>
      <Field label="Discretisation" htmlFor="sheet-method" name="method" className="w-48">
        <select id="sheet-method" className={inputClass} value={method} onChange={(e) => setMethod(e.target.value === "backward-euler" ? "backward-euler" : "tustin")}>
          <option value="tustin">Tustin (bilinear)</option>
          <option value="backward-euler">Backward Euler</option>
        </select>
      </Field>
      <Field label="Fixed point" htmlFor="sheet-format" name="format" className="w-44">
        <select id="sheet-format" className={inputClass} value={format} onChange={(e) => setFormat(e.target.value)}>
          <option value="none">none (double)</option>
          <option value="q15">Q15 (16-bit)</option>
          <option value="q31">Q31 (32-bit)</option>
        </select>
      </Field>
      <Button type="submit" tone="primary" disabled={busy} data-testid="sheet-apply">
        {busy ? "Computing…" : "Show sheet"}
      </Button>
    </form>
  );
}
