import type { StepTestDto } from "@loopyard/core";
import { Section } from "../../components/section.js";

const ROLE_NAMES = { time: "t", input: "u", output: "y" } as const;

/** The uploaded file's first rows with the chosen time, input and output columns marked. */
export function StepTestPreview({ stepTest, highlight }: { stepTest: StepTestDto; highlight: { time: number; input: number; output: number } }) {
  const { overview } = stepTest;
  const roleOf = (index: number) => (Object.keys(highlight) as (keyof typeof highlight)[]).find((role) => highlight[role] === index);
  return (
    <Section title={stepTest.fileName} aside={`${overview.rowCount.toLocaleString("en-GB")} rows · ${overview.columns.length} columns · ${(stepTest.sizeBytes / 1024).toFixed(1)} kB`} testId="step-test-preview">
      <div className="overflow-x-auto">
        <table className="w-full text-sm">
          <thead>
            <tr className="border-b border-line text-xs text-ink-soft">
              <th className="px-2 py-1 text-right font-medium">row</th>
              {overview.columns.map((c) => {
                const role = roleOf(c.index);
                return (
                  <th key={c.index} className={`px-2 py-1 text-right font-medium ${role ? "text-moss" : ""}`}>
                    {c.name}
                    {role ? <span className="ml-1 rounded bg-moss-wash px-1 font-mono">{ROLE_NAMES[role]}</span> : null}
                    {c.numeric ? null : <span className="ml-1 text-ink-faint">(text)</span>}
                  </th>
                );
              })}
            </tr>
          </thead>
          <tbody className="divide-y divide-line-soft font-mono text-[13px]">
            {overview.preview.map((row) => (
              <tr key={row.line}>
                <td className="px-2 py-0.5 text-right text-ink-faint">{row.line}</td>
                {row.cells.map((cell, j) => (
                  <td key={j} className={`px-2 py-0.5 text-right tabular ${roleOf(j + 1) ? "" : "text-ink-faint"}`}>
                    {cell}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="mt-2 text-xs text-ink-soft">The first {overview.preview.length} rows. The input column is the one holding the step; Loopyard finds the step where the input has moved half-way to its new level.</p>
    </Section>
  );
}
