import type { Plant } from "@loopyard/core";
import { coefficientList, formatCoefficient } from "./format-transfer-function.js";
import { MatrixView, formatEntry } from "./matrix-view.js";
import { TransferFunctionView } from "./transfer-function-view.js";
import { IdentificationView } from "../identification/identification-view.js";

type ModelOf<K extends Plant["kind"]> = Extract<Plant, { kind: K }>;

/** The model of a revision as its kind reads best: G(s), the four matrices, or the formulas. */
export function PlantModelView({ model }: { model: Plant }) {
  switch (model.kind) {
    case "transfer-function":
      return <TransferFunctionModel model={model} />;
    case "state-space":
      return <StateSpaceModel model={model} />;
    case "nonlinear":
      return <NonlinearModel model={model} />;
    case "identified":
      return (
        <>
          <TransferFunctionModel model={model} />
          <IdentificationView model={model} />
        </>
      );
  }
}

function TransferFunctionModel({ model }: { model: ModelOf<"transfer-function"> | ModelOf<"identified"> }) {
  return (
    <>
      <div className="overflow-x-auto py-2">
        <TransferFunctionView num={model.num} den={model.den} delay={model.delay} size="large" />
      </div>
      <dl className="mt-4 grid grid-cols-[max-content_1fr] gap-x-6 gap-y-1.5 text-sm">
        <dt className="text-ink-soft">Numerator</dt>
        <dd className="font-mono text-[13px]" data-testid="coefficients-num">{coefficientList(model.num)}</dd>
        <dt className="text-ink-soft">Denominator</dt>
        <dd className="font-mono text-[13px]" data-testid="coefficients-den">{coefficientList(model.den)}</dd>
        <dt className="text-ink-soft">Dead time θ</dt>
        <dd className="font-mono text-[13px]">{formatCoefficient(model.delay)} s</dd>
      </dl>
    </>
  );
}

function StateSpaceModel({ model }: { model: ModelOf<"state-space"> }) {
  return (
    <div data-testid="state-space-model">
      <p className="mb-3 font-mono text-sm text-ink-soft">
        x′ = A x + B u, y = C x + D u, x(0) = 0 · order <span className="text-ink" data-testid="state-space-order">n = {model.A.length}</span>
      </p>
      <div className="flex flex-wrap items-center gap-x-8 gap-y-4 overflow-x-auto py-1">
        <MatrixView name="A" rows={model.A} testId="matrix-A" />
        <MatrixView name="B" rows={model.B} testId="matrix-B" />
        <MatrixView name="C" rows={model.C} testId="matrix-C" />
        <MatrixView name="D" rows={model.D} testId="matrix-D" />
      </div>
    </div>
  );
}

function NonlinearModel({ model }: { model: ModelOf<"nonlinear"> }) {
  const parameters = Object.entries(model.parameters);
  return (
    <div className="space-y-4" data-testid="nonlinear-model">
      <div className="space-y-1 overflow-x-auto rounded-md border border-line-soft bg-white px-3 py-2.5 font-mono text-[13px]" data-testid="nonlinear-equations">
        {model.states.map((name, i) => (
          <div key={name} className="whitespace-nowrap">
            <span className="text-ink-soft">d{name}/dt =</span> {model.derivatives[i]}
          </div>
        ))}
        <div className="whitespace-nowrap">
          <span className="text-ink-soft">y =</span> {model.output}
        </div>
      </div>
      <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
        <div>
          <h3 className="mb-1 text-xs font-medium text-ink-soft">Parameters</h3>
          {parameters.length === 0 ? (
            <p className="text-sm text-ink-faint">None.</p>
          ) : (
            <div className="overflow-x-auto">
              <table className="w-full text-sm" data-testid="parameter-table">
                <tbody className="divide-y divide-line-soft">
                  {parameters.map(([name, value]) => (
                    <tr key={name}>
                      <td className="py-1 pr-3 font-mono text-[13px]">{name}</td>
                      <td className="py-1 text-right font-mono text-[13px] tabular">{formatEntry(value)}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          )}
        </div>
        <div>
          <h3 className="mb-1 text-xs font-medium text-ink-soft">Operating point</h3>
          <div className="overflow-x-auto">
            <table className="w-full text-sm" data-testid="operating-point">
              <tbody className="divide-y divide-line-soft">
                {model.states.map((name, i) => (
                  <tr key={name}>
                    <td className="py-1 pr-3 font-mono text-[13px]">{name}(0)</td>
                    <td className="py-1 text-right font-mono text-[13px] tabular">{formatEntry(model.initial[i])}</td>
                  </tr>
                ))}
                <tr>
                  <td className="py-1 pr-3 font-mono text-[13px]">u₀</td>
                  <td className="py-1 text-right font-mono text-[13px] tabular">{formatEntry(model.operatingInput ?? 0)}</td>
                </tr>
              </tbody>
            </table>
          </div>
        </div>
      </div>
    </div>
  );
}
