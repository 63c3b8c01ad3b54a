import { STATUS_STABLE } from "../batch/batch-status.js";
import type { ComparisonPlan } from "./comparison-plan.js";
import { aggregateRows, oriented } from "./comparison-rows.js";
import { kendallTauMatrix } from "./kendall-tau.js";
import type { PrescanResult } from "./prescan.js";
import { columnPhrase, formatNumber } from "./summary-format.js";

/**
 * The agreement of a comparison's criteria: Kendall's τ_b between every pair of columns
 * (contenders and judges) over the pre-scan's candidates that are stable on every variant, each
 * column's aggregate oriented so that smaller is better — τ near 1: the two order designs alike;
 * near −1: what one prefers, the other rejects (e.g. ISE against effort). Constraints do not
 * filter the candidates: agreement is about how criteria order designs, met limits or not.
 */
export interface Agreement {
  columns: string[];
  /** tau[a][b], symmetric; NaN where fewer than two candidates have both values or one is constant. */
  tau: number[][];
  /** Pre-scan candidates stable on every variant (those ranked). */
  candidates: number;
  /** One line: the most and least alike pairs. */
  reading: string;
}

/** The agreement matrix of a comparison over its pre-scan (kendallTauMatrix, Knight 1966). */
export function comparisonAgreement(plan: ComparisonPlan, prescan: PrescanResult): Agreement {
  const nk = prescan.columns.length;
  const aggregates = aggregateRows(plan, prescan, false);
  const stable: number[] = [];
  for (let i = 0; i < prescan.n; i++) {
    let held = true;
    for (let f = 0; f < prescan.variants && held; f++) held = prescan.status[i * prescan.variants + f] === STATUS_STABLE;
    if (held) stable.push(i);
  }
  const columns = prescan.columns.map((key) => plan.columns.find((c) => c.key === key)!);
  const samples = columns.map((column, k) => Float64Array.from(stable, (i) => oriented(column, aggregates[i * nk + k])));
  const matrix = kendallTauMatrix(samples);
  const tau = columns.map((_, a) => Array.from(matrix.subarray(a * nk, (a + 1) * nk)));
  return { columns: [...prescan.columns], tau, candidates: stable.length, reading: agreementReading(columns.map(columnPhrase), tau, stable.length) };
}

function agreementReading(names: string[], tau: number[][], candidates: number): string {
  let most: [number, number] | null = null;
  let least: [number, number] | null = null;
  for (let a = 0; a < names.length; a++) {
    for (let b = a + 1; b < names.length; b++) {
      const t = tau[a][b];
      if (Number.isNaN(t)) continue;
      if (most === null || t > tau[most[0]][most[1]]) most = [a, b];
      if (least === null || t < tau[least[0]][least[1]]) least = [a, b];
    }
  }
  if (most === null || least === null) return `Too few stable pre-scan candidates (${candidates}) or too few criteria to rank criteria against each other.`;
  const pair = ([a, b]: [number, number]) => `${names[a]} and ${names[b]}`;
  const t = ([a, b]: [number, number]) => `τ = ${formatNumber(tau[a][b], 2)}`;
  if (most[0] === least[0] && most[1] === least[1]) return `Over ${candidates} stable pre-scan candidates, ${pair(most)} rank designs with ${t(most)}.`;
  return `Over ${candidates} stable pre-scan candidates, ${pair(most)} order designs most alike (${t(most)}); ${pair(least)} least (${t(least)}).`;
}
