import type { IdentifiedPlant } from "@loopyard/core";
import { STEP_MODEL_LABELS, formatR2, formatWithInterval, parameterSymbol, parameterUnit } from "./fit-parameter-text.js";

/** Where an identified plant came from: the file, the columns and units, the window, and the fit with its intervals. */
export function IdentificationView({ model }: { model: IdentifiedPlant }) {
  const { identification: id } = model;
  const { settings, fit, columns } = id;
  const units = settings.units;
  const window =
    settings.trim.from === undefined && settings.trim.to === undefined
      ? "the whole file"
      : `${settings.trim.from ?? "start"} s to ${settings.trim.to ?? "end"} s`;
  return (
    <div className="mt-5 rounded-md border border-line-soft bg-white p-3" data-testid="identification-view">
      <h3 className="mb-2 text-xs font-medium uppercase tracking-wide text-ink-soft">Identified from a step test</h3>
      <dl className="grid grid-cols-[max-content_1fr] gap-x-6 gap-y-1 text-sm">
        <dt className="text-ink-soft">File</dt>
        <dd className="font-mono text-[13px]">{id.fileName}</dd>
        <dt className="text-ink-soft">Columns</dt>
        <dd>
          t = {columns.time.name} [{units.time}], u = {columns.input.name}
          {units.input ? ` [${units.input}]` : ""}, y = {columns.output.name}
          {units.output ? ` [${units.output}]` : ""}
        </dd>
        <dt className="text-ink-soft">Window</dt>
        <dd>
          {window}, {fit.samples} samples; {settings.offset === "initial" ? "level before the step removed" : "output taken as a deviation already"}
        </dd>
        <dt className="text-ink-soft">Step</dt>
        <dd className="font-mono text-[13px]">
          Δu = {Number(fit.stepSize.toPrecision(4))} at t = {Number(fit.stepTime.toPrecision(4))} s from u₀ = {Number(fit.u0.toPrecision(4))}, y₀ = {Number(fit.y0.toPrecision(5))}
        </dd>
        <dt className="text-ink-soft">Fit</dt>
        <dd>
          {STEP_MODEL_LABELS[fit.model].label} · R² = <span className="font-mono">{formatR2(fit.r2)}</span>
        </dd>
        {Object.entries(fit.parameters).map(([name, value]) => (
          <div key={name} className="contents">
            <dt className="pl-3 font-mono text-[13px] text-ink-soft">{parameterSymbol(name)}</dt>
            <dd className="font-mono text-[13px]" data-testid={`identified-${name}`}>
              {formatWithInterval(value, fit.intervals[name])} <span className="text-ink-faint">{parameterUnit(name, fit.model, units)} · 95 %</span>
            </dd>
          </div>
        ))}
      </dl>
    </div>
  );
}
