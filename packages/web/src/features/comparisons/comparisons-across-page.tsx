import { Link, useSearchParams } from "react-router";
import { useComparisonsAcross } from "../../api/use-comparisons.js";
import { CautionNote } from "../../components/caution-note.js";
import { EmptyState } from "../../components/empty-state.js";
import { ErrorNote } from "../../components/error-note.js";
import { inputClass } from "../../components/field.js";
import { Loading } from "../../components/loading.js";
import { PageHeader } from "../../components/page-header.js";
import { Section } from "../../components/section.js";
import { useWorkspaceRole } from "../workspace/use-workspace-role.js";
import { formatFigure } from "./format-value.js";
import { RegretLegend } from "./regret-legend.js";
import { RegretCell } from "./regret-cell.js";

/**
 * /w/:slug/comparisons/across — finished comparisons side by side (one per family or product line):
 * contenders × comparisons, each cell the regret of that contender's pick on a judge the user
 * picks; a contender that is near best everywhere is one to standardise on.
 */
export function ComparisonsAcrossPage() {
  const { slug } = useWorkspaceRole();
  const [params, setParams] = useSearchParams();
  const judge = params.get("judge") ?? "";
  const across = useComparisonsAcross(slug, judge);
  const back = { to: `/w/${slug}/comparisons`, label: "Compare criteria" };
  return (
    <div data-testid="comparisons-across-page" className="space-y-5">
      <PageHeader
        title="Criteria across families"
        subtitle="Which criterion is consistently good for our kind of plants? Every finished comparison as a column; each contender's regret on the chosen figure."
        back={back}
      />
      {across.isPending ? (
        <Loading label="Lining up the comparisons…" />
      ) : across.isError ? (
        <ErrorNote error={across.error} title="Could not line up the comparisons" />
      ) : across.data.comparisons.length === 0 ? (
        <EmptyState title="No finished comparison yet">Run a comparison on each family of your product line; they will line up here by the criteria they share.</EmptyState>
      ) : (
        <Section
          title="Regret by contender and comparison"
          aside={
            <label className="flex items-center gap-2">
              judged on
              <select className={`${inputClass} w-44 py-1`} value={across.data.judge} onChange={(e) => setParams({ judge: e.target.value })} data-testid="across-judge">
                {across.data.columns.map((key) => (
                  <option key={key} value={key}>
                    {key}
                  </option>
                ))}
              </select>
            </label>
          }
        >
          <div className="overflow-x-auto">
            <table className="w-full text-sm" data-testid="across-table">
              <thead>
                <tr className="text-left text-xs text-ink-soft">
                  <th className="px-2 py-1.5 font-medium">Contender</th>
                  {across.data.comparisons.map((c) => (
                    <th key={c.id} className="px-2 py-1.5 font-medium">
                      <Link to={`/w/${slug}/comparisons/${c.id}`} className="text-ink hover:text-moss">
                        {c.name}
                      </Link>
                      <span className="block text-[11px] font-normal">{c.family} · {c.aggregate}</span>
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {across.data.rows.map((row) => (
                  <tr key={row.contender}>
                    <td className="px-2 py-1 font-medium">{row.contender}</td>
                    {row.regrets.map((regret, i) => (
                      <td key={across.data.comparisons[i]?.id ?? i} className="p-0.5">
                        {row.values[i] === null && regret === null ? (
                          <span className="px-2 text-xs text-ink-faint">not in this comparison</span>
                        ) : (
                          <RegretCell value={row.values[i] ?? Number.NaN} regret={regret ?? Number.NaN} best={regret === 0} own={false} />
                        )}
                      </td>
                    ))}
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <div className="mt-3">
            <RegretLegend />
          </div>
          <p className="mt-2 text-xs text-ink-soft">Values are each comparison's aggregate over its family ({formatFigure(across.data.comparisons.length)} comparison{across.data.comparisons.length === 1 ? "" : "s"}); regrets compare picks within one comparison only.</p>
        </Section>
      )}
      <CautionNote />
    </div>
  );
}
