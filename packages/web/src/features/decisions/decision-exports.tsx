import { useState } from "react";
import { decisionPath } from "../../api/use-decisions.js";
import { buttonClass } from "../../components/button.js";
import { inputClass } from "../../components/field.js";
import { sheetHref } from "./decision-text.js";

/** Links to the decision's record (PDF, JSON) and its deployment sheet at a sample time and discretisation the reader picks. */
export function DecisionExports({ slug, id }: { slug: string; id: string }) {
  const base = `/api${decisionPath(slug, id)}`;
  const [sampleTime, setSampleTime] = useState("0.001");
  const [method, setMethod] = useState<"tustin" | "backward-euler">("tustin");
  const [format, setFormat] = useState<"" | "q15" | "q31">("");
  const href = sheetHref(base, sampleTime, method, format);
  return (
    <div className="space-y-4 text-sm" data-testid="decision-exports">
      <div className="flex flex-wrap gap-2">
        <a href={`${base}/record.pdf`} className={buttonClass("quiet")} data-testid="record-pdf" target="_blank" rel="noopener">
          Record as PDF
        </a>
        <a href={`${base}/record.json`} className={buttonClass("quiet")} data-testid="record-json" download>
          Record as JSON
        </a>
      </div>
      <div>
        <div className="mb-1 text-xs font-medium text-ink-soft">Deployment sheet (for the firmware team)</div>
        <div className="flex flex-wrap items-end gap-2">
          <label className="text-xs text-ink-soft">
            <span className="mb-1 block">sample time [s]</span>
            <input value={sampleTime} onChange={(e) => setSampleTime(e.target.value)} inputMode="decimal" className={`${inputClass} w-28 font-mono`} data-testid="sheet-sample-time" />
          </label>
          <label className="text-xs text-ink-soft">
            <span className="mb-1 block">discretisation</span>
            <select value={method} onChange={(e) => setMethod(e.target.value as "tustin" | "backward-euler")} className={`${inputClass} w-auto`} data-testid="sheet-method">
              <option value="tustin">Tustin</option>
              <option value="backward-euler">backward Euler</option>
            </select>
          </label>
          <label className="text-xs text-ink-soft">
            <span className="mb-1 block">fixed point</span>
            <select value={format} onChange={(e) => setFormat(e.target.value as "" | "q15" | "q31")} className={`${inputClass} w-auto`} data-testid="sheet-format">
              <option value="">none</option>
              <option value="q15">Q15</option>
              <option value="q31">Q31</option>
            </select>
          </label>
          {href ? (
            <a href={href} className={buttonClass("quiet")} target="_blank" rel="noopener" data-testid="sheet-link">
              Open the sheet
            </a>
          ) : (
            <span className="pb-1.5 text-xs text-rust">Give the sample time in seconds, a number above 0.</span>
          )}
        </div>
      </div>
    </div>
  );
}
