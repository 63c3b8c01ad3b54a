import type { PlantFormValues } from "./plant-form-values.js";
import { parseCoefficients } from "./coefficient-text.js";
import { ExpressionGrammarNote } from "./expression-grammar-note.js";
import { parseMatrix } from "./matrix-text.js";
import { MatrixView } from "./matrix-view.js";
import { TransferFunctionView } from "./transfer-function-view.js";
import { stateSpaceProblems, transferFunctionProblems } from "./plant-preview-checks.js";

/** The problems the preview found, in the same words the form's check will use. */
function PreviewProblems({ problems }: { problems: readonly string[] }) {
  return (
    <ul role="alert" className="space-y-0.5 text-sm text-rust" data-testid="plant-preview-problems">
      {problems.map((p) => (
        <li key={p}>{p}</li>
      ))}
    </ul>
  );
}

/** The plant as typed so far, for the kind chosen, beside the form. */
export function PlantPreview({ model, stateNames }: { model: PlantFormValues["model"] | undefined; stateNames: readonly string[] }) {
  const kind = model?.kind ?? "transfer-function";
  return (
    <div className="space-y-4">
      <div className="rounded-lg border border-line bg-sheet p-4">
        <div className="mb-3 text-xs font-medium uppercase tracking-wide text-ink-soft">Preview</div>
        {kind === "transfer-function" ? <TransferFunctionPreview num={model?.num ?? ""} den={model?.den ?? ""} delay={model?.delay ?? ""} /> : null}
        {kind === "state-space" ? <StateSpacePreview model={model} /> : null}
        {kind === "nonlinear" ? <NonlinearPreview model={model} stateNames={stateNames} /> : null}
      </div>
      {kind === "nonlinear" ? <ExpressionGrammarNote /> : null}
    </div>
  );
}

function TransferFunctionPreview({ num, den, delay }: { num: string; den: string; delay: string }) {
  const n = parseCoefficients(num);
  const d = parseCoefficients(den);
  const theta = Number(delay.trim() === "" ? 0 : delay);
  return (
    <>
      {!n.ok || !d.ok ? (
        <p className="font-mono text-sm text-ink-faint" data-testid="plant-preview">
          G(s) = … <span className="font-sans">— type both coefficient lists to see the plant</span>
        </p>
      ) : transferFunctionProblems(n.values, d.values, Number.isFinite(theta) && theta > 0 ? theta : 0).length > 0 ? (
        <div data-testid="plant-preview">
          <p className="mb-1 font-mono text-sm text-ink-faint">G(s) cannot be drawn:</p>
          <PreviewProblems problems={transferFunctionProblems(n.values, d.values, Number.isFinite(theta) && theta > 0 ? theta : 0)} />
        </div>
      ) : (
        <div data-testid="plant-preview" className="overflow-x-auto">
          <TransferFunctionView num={n.values} den={d.values} delay={Number.isFinite(theta) && theta > 0 ? theta : 0} testId="plant-preview-tf" />
        </div>
      )}
      <p className="mt-4 text-xs text-ink-faint">
        Input u to output y. Loopyard checks that the plant is proper (numerator degree ≤ denominator degree), of order at most 10, with a non-zero
        leading denominator coefficient.
      </p>
    </>
  );
}

function StateSpacePreview({ model }: { model: PlantFormValues["model"] | undefined }) {
  const matrices = (["A", "B", "C", "D"] as const).map((name) => ({ name, parsed: parseMatrix(model?.[name] ?? "", name) }));
  const a = matrices[0].parsed;
  return (
    <div data-testid="plant-preview">
      <p className="mb-3 text-sm text-ink-soft">
        {a.ok ? (
          <>
            Order <span className="font-mono text-ink">n = {a.rows.length}</span>
          </>
        ) : (
          "Type A to see the order."
        )}
      </p>
      <div className="flex flex-wrap gap-x-6 gap-y-3 overflow-x-auto">
        {matrices.map(({ name, parsed }) =>
          parsed.ok ? (
            <MatrixView key={name} name={name} rows={parsed.rows} />
          ) : (
            <span key={name} className="font-mono text-sm text-ink-faint">
              {name} = …
            </span>
          ),
        )}
      </div>
      {matrices.every((m) => m.parsed.ok) ? (
        <div className="mt-3">
          <PreviewProblems problems={stateSpaceProblems(...(matrices.map((m) => (m.parsed.ok ? m.parsed.rows : [])) as [number[][], number[][], number[][], number[][]]))} />
        </div>
      ) : null}
      <p className="mt-4 text-xs text-ink-faint">A is n × n, B is n × 1, C is 1 × n, D is 1 × 1; order at most 10. The state starts at zero.</p>
    </div>
  );
}

function NonlinearPreview({ model, stateNames }: { model: PlantFormValues["model"] | undefined; stateNames: readonly string[] }) {
  if (stateNames.length === 0) {
    return (
      <p className="text-sm text-ink-faint" data-testid="plant-preview">
        Name the states to see the equations.
      </p>
    );
  }
  return (
    <div data-testid="plant-preview" className="space-y-1 overflow-x-auto font-mono text-[13px]">
      {stateNames.map((name, i) => (
        <div key={`${i}-${name}`} className="whitespace-nowrap">
          <span className="text-ink-soft">d{name}/dt =</span> {model?.derivatives?.[i]?.trim() || <span className="text-ink-faint">…</span>}
        </div>
      ))}
      <div className="whitespace-nowrap">
        <span className="text-ink-soft">y =</span> {model?.output?.trim() || <span className="text-ink-faint">…</span>}
      </div>
    </div>
  );
}
