import { csvNumber, parameterColumn, withUnit } from "@loopyard/core";
import type { ControllerKind } from "@loopyard/core";
import { stringify } from "csv-stringify/sync";
import { getComparison, getComparisonResult } from "../comparisons/comparison-service.js";
import type { Database } from "../db/database.js";
import type { MemberAccess } from "../workspaces/require-member.js";
import { fileName } from "./candidates-csv.js";

/** What the CSV reads of a stored comparison analysis (core ComparisonAnalysis). */
interface StoredAnalysis {
  columns: { key: string; label: string; role: "contender" | "judge"; unit: string }[];
  picks: { contender: string; found: boolean; params: Record<string, number> }[];
  crossScore: { rows: string[]; values: number[][]; regrets: number[][] };
}

/**
 * GET …/comparisons/:comparisonId/cross-score.csv: one row per contender's pick, naming the pick,
 * whether one was found, its parameters with their units, then for every contender and judge its
 * value ("IAE [y·s]") and its regret against the best pick of the column ("IAE regret [%]"). A
 * handful of rows: written at once. 409 while the comparison has no result (getComparisonResult).
 */
export async function crossScoreCsv(db: Database, access: MemberAccess, comparisonId: string): Promise<{ file: string; text: string }> {
  const comparison = await getComparison(db, access, comparisonId);
  const analysis = (await getComparisonResult(db, access, comparisonId)) as StoredAnalysis;
  const kind = (comparison.definition as { structure?: ControllerKind }).structure ?? "pid";
  const names = [...new Set(analysis.picks.flatMap((p) => Object.keys(p.params)))];
  const header = [
    "pick of",
    "found",
    ...names.map((name) => parameterColumn(kind, name)),
    ...analysis.columns.flatMap((c) => [`${withUnit(c.label, c.unit)} (${c.role})`, `${c.label} regret [%]`]),
  ];
  const rows = analysis.picks.map((pick, p) => [
    analysis.columns.find((c) => c.key === pick.contender)?.label ?? pick.contender,
    pick.found ? "yes" : "no",
    ...names.map((name) => csvNumber(pick.params[name])),
    ...analysis.columns.flatMap((_, k) => [csvNumber(analysis.crossScore.values[p]?.[k]), csvNumber(analysis.crossScore.regrets[p]?.[k])]),
  ]);
  return { file: `${fileName(comparison.name)}-cross-score.csv`, text: stringify(rows, { header: true, columns: header }) };
}
