import type { DeploymentSheetDto } from "@loopyard/core";
import { CautionNote } from "../../components/caution-note.js";
import { formatNumber } from "../../components/format-number.js";
import { Section } from "../../components/section.js";
import { criterionChangeRows, scoreNumber } from "./sheet-settings.js";

/** A coefficient in full (17 significant digits read back as the same double), for copying into firmware. */
function exact(value: number | null): string {
  if (value === null) return "none";
  return Number(value.toPrecision(17)).toString().replace(/-/g, "−");
}

function Mono({ children }: { children: React.ReactNode }) {
  return <span className="font-mono text-[13px] tabular">{children}</span>;
}

function Change({ value }: { value: number | null }) {
  if (value === null) return <td className="px-3 py-1.5" />;
  const tone = !Number.isFinite(value) ? "text-ink-faint" : Math.abs(value) >= 5 ? "text-rust" : Math.abs(value) >= 1 ? "text-ink" : "text-ink-soft";
  return (
    <td className={`px-3 py-1.5 text-right font-mono text-[13px] tabular ${tone}`}>
      {Number.isFinite(value) ? `${value > 0 ? "+" : ""}${formatNumber(value, 3)} %` : "—"}
    </td>
  );
}

const th = "px-3 py-1.5 text-left text-xs font-medium text-ink-soft";
const thRight = "px-3 py-1.5 text-right text-xs font-medium text-ink-soft";

/**
 * A deployment sheet as the firmware team reads it: the controller's forms, the difference
 * equations with every coefficient in full, the fixed-point coefficients, what sampling and
 * rounding do to every criterion on every variant, the notes and the safety caution. Takes the
 * sheet DTO only, so a sweep candidate's page and a decision's page show the same sheet.
 */
export function DeploymentSheetView({ sheet }: { sheet: DeploymentSheetDto }) {
  const { forms, discrete, fixedPoint } = sheet;
  const rows = criterionChangeRows(sheet);
  const method = discrete.method === "tustin" ? "Tustin" : "backward Euler";
  return (
    <div className="space-y-6" data-testid="deployment-sheet">
      {sheet.notes.length > 0 ? (
        <ul className="space-y-1 rounded-md border border-l-4 border-line border-l-amber bg-sheet px-4 py-3 text-sm" data-testid="sheet-notes">
          {sheet.notes.map((note) => (
            <li key={note}>{note}</li>
          ))}
        </ul>
      ) : null}

      <div className="grid gap-6 lg:grid-cols-3">
        <Section title="Parallel form" aside="kp + ki/s + kd·s/(tf·s + 1)" testId="form-parallel">
          <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
            {(["kp", "ki", "kd", "tf"] as const).map((name) => (
              <div key={name} className="contents">
                <dt className="text-ink-soft">{name}</dt>
                <dd className="text-right">
                  <Mono>{exact(forms.parallel[name])}</Mono>
                </dd>
              </div>
            ))}
            <dt className="text-ink-soft">b (on P)</dt>
            <dd className="text-right">
              <Mono>{exact(forms.weights.b)}</Mono>
            </dd>
            <dt className="text-ink-soft">c (on D)</dt>
            <dd className="text-right">
              <Mono>{exact(forms.weights.c)}</Mono>
            </dd>
          </dl>
        </Section>
        <Section title="Ideal form" aside="K·(1 + 1/(Ti·s) + Td·s/((Td/N)·s + 1))" testId="form-ideal">
          {forms.ideal.exists ? (
            <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
              <dt className="text-ink-soft">K</dt>
              <dd className="text-right"><Mono>{exact(forms.ideal.gain)}</Mono></dd>
              <dt className="text-ink-soft">Ti [s]</dt>
              <dd className="text-right"><Mono>{forms.ideal.integralTime === null ? "no integral action" : exact(forms.ideal.integralTime)}</Mono></dd>
              <dt className="text-ink-soft">Td [s]</dt>
              <dd className="text-right"><Mono>{exact(forms.ideal.derivativeTime)}</Mono></dd>
              <dt className="text-ink-soft">N</dt>
              <dd className="text-right"><Mono>{forms.ideal.filterDivisor === null ? "no filter" : exact(forms.ideal.filterDivisor)}</Mono></dd>
            </dl>
          ) : (
            <p className="text-sm text-ink-soft">No ideal form: {forms.ideal.reason}.</p>
          )}
        </Section>
        <Section title="Series form" aside="K′·(1 + 1/(Ti′·s))·(1 + Td′·s)/(1 + Tf·s)" testId="form-series">
          {forms.series.exists ? (
            <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
              <dt className="text-ink-soft">K′</dt>
              <dd className="text-right"><Mono>{exact(forms.series.gain)}</Mono></dd>
              <dt className="text-ink-soft">Ti′ [s]</dt>
              <dd className="text-right"><Mono>{forms.series.integralTime === null ? "no integral action" : exact(forms.series.integralTime)}</Mono></dd>
              <dt className="text-ink-soft">Td′ [s]</dt>
              <dd className="text-right"><Mono>{exact(forms.series.derivativeTime)}</Mono></dd>
              <dt className="text-ink-soft">Tf [s]</dt>
              <dd className="text-right"><Mono>{exact(forms.series.filterTime)}</Mono></dd>
            </dl>
          ) : (
            <p className="text-sm text-ink-soft">No series form: {forms.series.reason}.</p>
          )}
        </Section>
      </div>

      <Section title={`Difference equations — ${method}, h = ${formatNumber(discrete.sampleTime)} s`} aside="evaluate in this order every sample" testId="sheet-equations">
        <pre className="overflow-x-auto rounded-md bg-paper px-4 py-3 font-mono text-[13px] leading-6" data-testid="sheet-equation-text">
          {discrete.equations.join("\n")}
        </pre>
        <div className="mt-4 grid gap-6 lg:grid-cols-2">
          <div className="overflow-x-auto">
            <table className="w-full text-sm" data-testid="sheet-coefficients">
              <thead>
                <tr className="border-b border-line">
                  <th className={th}>coefficient</th>
                  <th className={thRight}>value</th>
                  <th className={th}>multiplies</th>
                </tr>
              </thead>
              <tbody>
                {discrete.coefficients.map((c) => (
                  <tr key={c.name} className="border-b border-line-soft">
                    <td className="px-3 py-1.5 font-mono text-[13px]">{c.name}</td>
                    <td className="px-3 py-1.5 text-right font-mono text-[13px] tabular">{exact(c.value)}</td>
                    <td className="px-3 py-1.5 text-xs text-ink-soft">{c.meaning}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <dl className="grid h-fit grid-cols-[auto_1fr] gap-x-4 gap-y-1.5 text-sm" data-testid="sheet-limits">
            <dt className="text-ink-soft">output limits [u]</dt>
            <dd className="text-right"><Mono>{discrete.limits.min === null && discrete.limits.max === null ? "none" : `${exact(discrete.limits.min)} … ${exact(discrete.limits.max)}`}</Mono></dd>
            <dt className="text-ink-soft">rate limit [u/s]</dt>
            <dd className="text-right"><Mono>{discrete.limits.rate === null ? "none" : `${exact(discrete.limits.rate)} (${exact(discrete.limits.step)} per sample)`}</Mono></dd>
            <dt className="text-ink-soft">anti-windup</dt>
            <dd className="text-right"><Mono>{discrete.trackingTime === null ? "off (no integral action or turned off)" : `back-calculation, Tt = ${exact(discrete.trackingTime)} s`}</Mono></dd>
          </dl>
        </div>
      </Section>

      {fixedPoint ? (
        <Section title={`Coefficients in ${fixedPoint.format.toUpperCase()}`} aside={`value = mantissa · 2^(exponent − ${fixedPoint.fractionalBits})`} testId="sheet-fixed-point">
          <div className="overflow-x-auto">
            <table className="w-full text-sm">
              <thead>
                <tr className="border-b border-line">
                  <th className={th}>coefficient</th>
                  <th className={thRight}>mantissa</th>
                  <th className={thRight}>exponent</th>
                  <th className={thRight}>stored value</th>
                  <th className={thRight}>rounding error</th>
                  <th className={th}></th>
                </tr>
              </thead>
              <tbody>
                {fixedPoint.coefficients.map((c) => (
                  <tr key={c.name} className="border-b border-line-soft">
                    <td className="px-3 py-1.5 font-mono text-[13px]">{c.name}</td>
                    <td className="px-3 py-1.5 text-right font-mono text-[13px] tabular">{c.mantissa}</td>
                    <td className="px-3 py-1.5 text-right font-mono text-[13px] tabular">{c.exponent}</td>
                    <td className="px-3 py-1.5 text-right font-mono text-[13px] tabular">{exact(c.rounded)}</td>
                    <td className="px-3 py-1.5 text-right font-mono text-[13px] tabular">{formatNumber(c.error, 3)}</td>
                    <td className="px-3 py-1.5 text-xs text-rust">{c.saturated ? "clipped" : c.underflow ? "rounds to zero" : ""}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </Section>
      ) : null}

      <Section title="What sampling and rounding change" aside="sampled vs continuous; rounded vs sampled" testId="sheet-changes">
        <div className="overflow-x-auto">
          <table className="w-full text-sm" data-testid="sheet-change-table">
            <thead>
              <tr className="border-b border-line">
                <th className={th}>variant</th>
                <th className={th}>criterion</th>
                <th className={thRight}>continuous</th>
                <th className={thRight}>sampled</th>
                <th className={thRight}>change</th>
                {fixedPoint ? <th className={thRight}>{fixedPoint.format.toUpperCase()}</th> : null}
                {fixedPoint ? <th className={thRight}>change</th> : null}
              </tr>
            </thead>
            <tbody>
              {rows.map((r) => (
                <tr key={`${r.variant}-${r.criterion}`} className={`border-b border-line-soft ${r.variant === "family" ? "bg-paper" : ""}`}>
                  <td className="px-3 py-1.5">{r.variant}</td>
                  <td className="px-3 py-1.5">
                    {r.criterion} <span className="text-xs text-ink-faint">[{r.unit || "–"}]</span>
                  </td>
                  <td className="px-3 py-1.5 text-right font-mono text-[13px] tabular">{formatNumber(r.continuous)}</td>
                  <td className="px-3 py-1.5 text-right font-mono text-[13px] tabular">{formatNumber(r.sampled)}</td>
                  <Change value={r.samplingChange} />
                  {fixedPoint ? <td className="px-3 py-1.5 text-right font-mono text-[13px] tabular">{formatNumber(r.rounded)}</td> : null}
                  {fixedPoint ? <Change value={r.roundingChange} /> : null}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <p className="mt-2 text-xs text-ink-faint">
          Frequency-domain criteria are not recomputed for the sampled loop (—). The sampled loop is simulated with the difference equations above, the plant held between samples.
        </p>
      </Section>

      <Section title="Margins and revisions" aside="continuous loop" testId="sheet-margins">
        <div className="overflow-x-auto">
          <table className="w-full text-sm">
            <thead>
              <tr className="border-b border-line">
                <th className={th}>variant</th>
                <th className={th}>plant revision</th>
                <th className={thRight}>gain margin</th>
                <th className={thRight}>phase margin [°]</th>
                <th className={thRight}>Ms</th>
                <th className={thRight}>sampled |z| max</th>
              </tr>
            </thead>
            <tbody>
              {sheet.variants.map((v) => (
                <tr key={v.label} className="border-b border-line-soft">
                  <td className="px-3 py-1.5">{v.label}</td>
                  <td className="px-3 py-1.5 text-ink-soft">{v.revision ? `${v.revision.plantName}, revision ${v.revision.revisionNumber}` : "—"}</td>
                  <td className="px-3 py-1.5 text-right font-mono text-[13px] tabular">{formatNumber(scoreNumber(v.margins.gainMargin))}</td>
                  <td className="px-3 py-1.5 text-right font-mono text-[13px] tabular">{formatNumber(scoreNumber(v.margins.phaseMargin))}</td>
                  <td className="px-3 py-1.5 text-right font-mono text-[13px] tabular">{formatNumber(scoreNumber(v.margins.ms))}</td>
                  <td className="px-3 py-1.5 text-right font-mono text-[13px] tabular">{v.sampledPoleRadius === null ? "stable (by polynomial)" : formatNumber(v.sampledPoleRadius)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <p className="mt-2 text-xs text-ink-faint">
          Scenario: {sheet.scenario.kind}, {formatNumber(sheet.scenario.horizon)} s at dt = {formatNumber(sheet.scenario.dt)} s.
        </p>
      </Section>

      <CautionNote testId="sheet-caution">{sheet.caution}</CautionNote>
    </div>
  );
}
