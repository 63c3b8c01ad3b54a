import type { ComparisonAcrossDto, ComparisonAnalysis } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { badRequest } from "../http/http-error.js";
import type { MemberAccess } from "../workspaces/require-member.js";
import { storedInput } from "./comparison-engine.js";
import { listFinishedResults } from "./comparison-repository.js";

/** A finite number for JSON, else null (NaN: not scored; ±∞: regret against a best of 0). */
function finiteOrNull(value: number | undefined): number | null {
  return value !== undefined && Number.isFinite(value) ? value : null;
}

/**
 * The finished comparisons of a workspace side by side: one column per comparison (oldest first),
 * one row per contender any of them had (those shared by the most comparisons first, then by first
 * appearance), each cell that contender's pick's regret [%] and value on `judge` — a column key
 * (criterion id or quadratic label) — read from the stored cross-scores, nothing recomputed.
 * Without `judge`: the first judge of the newest comparison (else its first column).
 */
export async function getComparisonsAcross(db: Database, access: MemberAccess, judge: string | undefined): Promise<ComparisonAcrossDto> {
  const finished = await listFinishedResults<ComparisonAnalysis>(db, access.workspace.id);
  const columns: string[] = [];
  for (const c of finished) for (const column of c.result.columns ?? []) if (!columns.includes(column.key)) columns.push(column.key);
  const newest = finished.at(-1)?.result;
  const chosen = judge && judge !== "" ? judge : (newest?.columns.find((c) => c.role === "judge")?.key ?? newest?.columns[0]?.key ?? "");
  if (judge && judge !== "" && finished.length > 0 && !columns.includes(judge)) {
    throw badRequest(`judge: no finished comparison scored “${judge}”; choose one of ${columns.join(", ")}`, "judge");
  }
  const contenders: { key: string; count: number; first: number }[] = [];
  finished.forEach((c, i) => {
    for (const key of c.result.crossScore.rows) {
      const known = contenders.find((r) => r.key === key);
      if (known) known.count += 1;
      else contenders.push({ key, count: 1, first: i });
    }
  });
  contenders.sort((a, b) => b.count - a.count || a.first - b.first);
  return {
    judge: chosen,
    columns,
    comparisons: finished.map((c) => {
      const input = storedInput(c.definition);
      const variants = c.result.variants ?? [];
      const aggregate = input.aggregate?.kind === "percentile" ? `${input.aggregate.p}th percentile` : input.aggregate?.kind === "mean" ? "mean" : "worst case";
      return {
        id: c.id,
        name: c.name,
        family: input.family?.name && input.family.name !== "" ? input.family.name : `${variants.length} variant${variants.length === 1 ? "" : "s"}: ${variants.join(", ")}`,
        aggregate,
        finishedAt: c.finishedAt ? c.finishedAt.toISOString() : null,
      };
    }),
    rows: contenders.map(({ key }) => {
      const cells = finished.map((c) => {
        const row = c.result.crossScore.rows.indexOf(key);
        const col = c.result.crossScore.columns.indexOf(chosen);
        if (row < 0 || col < 0) return { regret: null, value: null };
        return { regret: finiteOrNull(c.result.crossScore.regrets[row]?.[col]), value: finiteOrNull(c.result.crossScore.values[row]?.[col]) };
      });
      return { contender: key, regrets: cells.map((c) => c.regret), values: cells.map((c) => c.value) };
    }),
  };
}
