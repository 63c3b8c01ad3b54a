import { EXPRESSION_FUNCTION_NAMES } from "@loopyard/core";

/** What a nonlinear plant's formulas may contain (the whitelist of the expression compiler). */
export function ExpressionGrammarNote() {
  return (
    <div className="rounded-md border border-line-soft bg-paper px-3 py-2.5 text-xs text-ink-soft" data-testid="expression-grammar">
      <p className="mb-1 font-medium text-ink">What a formula may contain</p>
      <ul className="list-disc space-y-0.5 pl-4">
        <li>numbers such as 2, 0.5 or 1e-3</li>
        <li>the state names, the parameter names and the input <span className="font-mono text-ink">u</span></li>
        <li>
          <span className="font-mono text-ink">+ − * / ^</span> and brackets; write <span className="font-mono text-ink">2*h</span>, not{" "}
          <span className="font-mono text-ink">2h</span>
        </li>
        <li>
          the functions <span className="font-mono text-ink">{EXPRESSION_FUNCTION_NAMES.join(" ")}</span>
        </li>
      </ul>
      <p className="mt-1.5">Nothing else is accepted; a refused formula is named next to its field with the token at fault.</p>
    </div>
  );
}
