import { STEP_MODEL_KINDS, type StepModelKind, type StepTestFitReport } from "@loopyard/core";
import { STEP_MODEL_LABELS, formatR2, formatWithInterval, parameterSymbol, parameterUnit } from "./fit-parameter-text.js";

/** The three fits side by side: parameters with their 95 % intervals, R², and the choice of the one to save. */
export function FitTable({ report, chosen, onChoose }: { report: StepTestFitReport; chosen: StepModelKind; onChoose: (kind: StepModelKind) => void }) {
  return (
    <table className="w-full text-sm" data-testid="fit-table">
      <thead>
        <tr className="border-b border-line text-xs text-ink-soft">
          <th className="px-2 py-1.5 text-left font-medium">Save</th>
          <th className="px-2 py-1.5 text-left font-medium">Model</th>
          <th className="px-2 py-1.5 text-left font-medium">Parameters, value [95 % interval]</th>
          <th className="px-2 py-1.5 text-right font-medium">R²</th>
        </tr>
      </thead>
      <tbody className="divide-y divide-line-soft">
        {STEP_MODEL_KINDS.map((kind) => {
          const fit = report.fits[kind];
          if (!fit) return null;
          return (
            <tr key={kind} data-testid={`fit-row-${kind}`} className={kind === chosen ? "bg-moss-wash" : ""}>
              <td className="px-2 py-2 align-top">
                <input type="radio" name="chosen-fit" aria-label={`save the ${kind.toUpperCase()} fit`} data-testid={`choose-${kind}`} checked={kind === chosen} disabled={!fit.ok} onChange={() => onChoose(kind)} />
              </td>
              <td className="px-2 py-2 align-top">
                <div className="font-medium">{STEP_MODEL_LABELS[kind].label}</div>
                <div className="font-mono text-xs text-ink-soft">{STEP_MODEL_LABELS[kind].formula}</div>
              </td>
              <td className="px-2 py-2 align-top">
                {fit.ok ? (
                  <ul className="space-y-0.5 font-mono text-[13px]">
                    {Object.entries(fit.parameters).map(([name, value]) => (
                      <li key={name} data-testid={`fit-${kind}-${name}`}>
                        {parameterSymbol(name)} = {formatWithInterval(value, fit.intervals[name])} <span className="text-ink-faint">{parameterUnit(name, kind, report.units)}</span>
                      </li>
                    ))}
                  </ul>
                ) : (
                  <span className="text-rust">Not fitted: {fit.reason}.</span>
                )}
              </td>
              <td className="px-2 py-2 text-right align-top font-mono text-[13px] tabular" data-testid={`fit-${kind}-r2`}>
                {fit.ok ? formatR2(fit.r2) : "—"}
              </td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}
