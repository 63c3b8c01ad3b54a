import type { Agreement } from "./comparison-agreement.js";
import type { ComparisonPick } from "./comparison-pick.js";
import type { ComparisonPlan } from "./comparison-plan.js";
import type { StabilityEntry } from "./comparison-stability.js";
import type { CrossScore } from "./cross-score.js";
import { aggregatePhrase, columnPhrase, formatNumber, formatValue, listPhrase } from "./summary-format.js";

/** Columns that stand for the price a pick pays in actuator use, in the order the summary prefers them. */
const COST_CRITERIA = ["effort", "upeak", "tv", "rawEffort"] as const;
/** A constraint "holds a pick" when the pick's value on some variant is within this fraction of the limit. */
export const ACTIVE_CONSTRAINT_FRACTION = 0.01;

/** Counts of the pre-scan for the summary. */
export interface PrescanCounts {
  candidates: number;
  stable: number;
  feasible: number;
}

/**
 * The plain-language summary of a comparison, one sentence per string, every number read from the
 * cross-score, the picks, the pre-scan counts, the agreement and the stability entries (nothing is
 * estimated or invented): the pre-scan's yield; contenders without a pick; for each judge, the pick
 * best on it and what that pick costs in actuator use against the pick best on that
 * (effort, peak |u|, TV(u) or raw effort, the first present); the smallest and largest mean regret
 * over the judges; picks on a bound of the box; constraints that hold a pick; picks taken over from
 * another contender; the agreement's reading; how far picks move under the stability variations.
 */
export function comparisonSummary(
  plan: ComparisonPlan,
  picks: readonly ComparisonPick[],
  cross: CrossScore,
  agreement: Agreement,
  stability: readonly StabilityEntry[],
  counts: PrescanCounts,
): string[] {
  const out: string[] = [];
  const name = (p: number) => `${plan.columns[p].label}'s pick`;
  const F = plan.variants.length;
  const onAll = F === 1 ? "on the plant" : `on all ${F} variants`;
  const limits = listPhrase(plan.constraints.map((c) => c.label));
  out.push(
    `Of ${counts.candidates} pre-scan candidates, ${counts.stable} are stable ${onAll}` +
      (plan.constraints.length > 0 ? ` and ${counts.feasible} of them meet ${limits} on every variant.` : "."),
  );
  picks.forEach((pick, p) => {
    if (!pick.found) out.push(`${plan.columns[p].label} has no pick: ${pick.reason ?? "no candidate qualified"}.`);
  });
  const found = picks.map((p, i) => (p.found ? i : -1)).filter((i) => i >= 0);
  const aggregate = aggregatePhrase(plan.aggregate);
  const costColumn = COST_CRITERIA.map((id) => plan.columns.findIndex((c) => c.key === id)).find((k) => k >= 0) ?? -1;
  const judges = plan.columns.map((c, k) => (c.role === "judge" ? k : -1)).filter((k) => k >= 0);
  for (const j of judges) {
    const b = cross.best[j];
    if (b < 0) continue;
    const column = plan.columns[j];
    const value = formatValue(column, cross.values[b][j]);
    if (found.length < 2) {
      out.push(`${name(b)} has a ${aggregate} ${columnPhrase(column)} of ${value}.`);
      continue;
    }
    let sentence = `${name(b)} has the ${column.better === "larger" ? "highest" : "lowest"} ${aggregate} ${columnPhrase(column)}, ${value}`;
    if (costColumn >= 0 && costColumn !== j && cross.best[costColumn] >= 0) {
      const regret = cross.regrets[b][costColumn];
      const cheapest = cross.best[costColumn];
      const costName = columnPhrase(plan.columns[costColumn]);
      if (cheapest === b || regret === 0) sentence += `, with the least ${costName} of all picks too`;
      else if (Number.isFinite(regret)) sentence += `, at ${formatNumber(regret, 2)} % more ${costName} than ${name(cheapest)}`;
    }
    out.push(`${sentence}.`);
  }
  if (judges.length > 0 && found.length >= 2) {
    const means = found.map((p) => {
      const regrets = judges.map((j) => cross.regrets[p][j]).filter((r) => Number.isFinite(r));
      return { p, mean: regrets.length === judges.length ? regrets.reduce((a, b) => a + b, 0) / regrets.length : Infinity };
    });
    const ranked = means.filter((m) => Number.isFinite(m.mean)).sort((a, b) => a.mean - b.mean || a.p - b.p);
    if (ranked.length >= 2) {
      const first = ranked[0];
      const last = ranked[ranked.length - 1];
      const over = judges.length === 1 ? `On the judge ${columnPhrase(plan.columns[judges[0]])}` : `Over the ${judges.length} judges`;
      out.push(
        `${over}, ${name(first.p)} has the smallest mean regret (${formatNumber(first.mean, 2)} %) and ${name(last.p)} the largest (${formatNumber(last.mean, 2)} %).`,
      );
    }
  }
  picks.forEach((pick, p) => {
    if (!pick.found) return;
    for (const side of ["max", "min"] as const) {
      const names = pick.atBound.filter((b) => b.bound === side).map((b) => b.parameter);
      if (names.length > 0) {
        out.push(`${name(p)} sits on the ${side === "max" ? "upper" : "lower"} bound of ${listPhrase(names)}: the box, not the criterion, chose ${names.length > 1 ? "them" : "it"}.`);
      }
    }
    for (const constraint of plan.constraints) {
      const c = pick.base.criteria.indexOf(constraint.criterion);
      const near = pick.base.scores
        .map((row, f) => ({ f, v: row[c] }))
        .filter(({ v }) => Math.abs(v - constraint.limit) <= ACTIVE_CONSTRAINT_FRACTION * Math.max(Math.abs(constraint.limit), Number.MIN_VALUE));
      if (near.length > 0) {
        const where = F === 1 ? "" : ` on ${listPhrase(near.map(({ f }) => plan.variants[f]))}`;
        out.push(`${name(p)} is held by ${constraint.label} (${formatNumber(near[0].v, 3)}${where}).`);
      }
    }
    if (pick.adoptedFrom !== undefined) {
      const from = plan.columns.find((c) => c.key === pick.adoptedFrom)?.label ?? pick.adoptedFrom;
      out.push(`${name(p)} is ${from}'s pick: it scores better on ${plan.columns[p].label} than anything ${plan.columns[p].label}'s own refinement reached.`);
    }
  });
  out.push(agreement.reading);
  const leaveOut = stability.filter((e) => e.variation.kind === "leave-out");
  if (leaveOut.length > 0) {
    const moves = found.map((p) => {
      let worst = 0;
      let label = "";
      for (const entry of leaveOut) {
        const m = entry.picks[p]?.maxMove ?? NaN;
        if (Number.isFinite(m) && m >= worst) {
          worst = m;
          label = entry.label;
        }
      }
      return `${plan.columns[p].label} ${formatNumber(worst, 2)} %${label ? ` (${label})` : ""}`;
    });
    if (moves.length > 0) out.push(`Leaving one variant out moves each pick's parameters by at most: ${listPhrase(moves)}.`);
  }
  for (let k = 0; k < plan.contenders; k++) {
    const entries = stability.filter((e) => e.variation.kind === "weight" && e.variation.contender === k);
    if (entries.length === 0 || !picks[k].found) continue;
    const worst = Math.max(...entries.map((e) => e.picks[k]?.maxMove ?? NaN).filter((m) => Number.isFinite(m)));
    const shift = Math.max(...entries.map((e) => e.picks[k]?.regretShift ?? NaN).filter((m) => Number.isFinite(m)));
    if (Number.isFinite(worst)) {
      out.push(`Halving or doubling r moves ${name(k)} by up to ${formatNumber(worst, 2)} % and shifts its regrets by up to ${formatNumber(shift, 2)} points.`);
    }
  }
  return out;
}
