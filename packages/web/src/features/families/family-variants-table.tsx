import { Link } from "react-router";
import type { FamilyRevisionDto } from "@loopyard/core";

/** The variants a family revision expands to: label, plant and revision, parameter values. */
export function FamilyVariantsTable({ slug, variants, testId = "family-variants-table" }: { slug: string; variants: FamilyRevisionDto["variants"]; testId?: string }) {
  return (
    <table className="w-full text-sm" data-testid={testId}>
      <thead>
        <tr className="text-left text-xs text-ink-soft">
          <th className="py-1 pr-3 font-medium">#</th>
          <th className="py-1 pr-3 font-medium">Label</th>
          <th className="py-1 pr-3 font-medium">Plant</th>
          <th className="py-1 font-medium">Parameter values</th>
        </tr>
      </thead>
      <tbody>
        {variants.map((v, i) => (
          <tr key={`${v.plantRevisionId}-${i}`} className="border-t border-line-soft" data-testid="family-variant-row">
            <td className="py-1.5 pr-3 font-mono text-xs text-ink-faint">{i + 1}</td>
            <td className="py-1.5 pr-3">{v.label ?? <span className="text-ink-faint">{v.plantName}</span>}</td>
            <td className="py-1.5 pr-3 text-xs">
              <Link to={`/w/${slug}/plants/${v.plantId}?revision=${v.revisionNumber}`} className="hover:text-moss">
                {v.plantName}
              </Link>{" "}
              <span className="font-mono text-ink-soft">rev {v.revisionNumber}</span>
            </td>
            <td className="py-1.5 font-mono text-xs">
              {v.parameters && Object.keys(v.parameters).length > 0 ? (
                Object.entries(v.parameters)
                  .sort(([a], [b]) => (a < b ? -1 : 1))
                  .map(([name, value]) => `${name} = ${Number(value.toPrecision(6))}`)
                  .join(", ")
              ) : (
                <span className="text-ink-faint">as the revision</span>
              )}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
