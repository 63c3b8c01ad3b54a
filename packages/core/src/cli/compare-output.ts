import type { ComparisonAnalysis } from "../comparison/analyse-comparison.js";

/** Values keyed by column key. */
type ByColumn = Record<string, number>;

/**
 * The JSON document `loopyard compare` prints (numbers through toCliJson: ∞ as "inf", NaN as null):
 * - picks: [{ contender (its id or label), found, reason?, params, atBound: [{ parameter, bound }],
 *   scores: { <id or label>: aggregate for every contender and judge }, perVariant: [{ variant,
 *   status, scores }], worstVariant: { <column>: variant name }, adoptedFrom?, evaluations, converged }];
 * - crossScore: { columns, rows: [{ contender, values: {…}, regrets: {… in %} }], best: { <column>: contender } };
 * - agreement: { columns, tau (matrix, column order), candidates, reading };
 * - prescan: { candidates, stable, feasible }; stability: [{ label, variation, picks: [{ contender,
 *   params, moves, maxMove, regretShift }] }]; summary: [sentences].
 */
export function comparisonOutput(analysis: ComparisonAnalysis): unknown {
  const keys = analysis.columns.map((c) => c.key);
  const byColumn = (values: readonly number[]): ByColumn => Object.fromEntries(keys.map((k, i) => [k, values[i]]));
  return {
    picks: analysis.picks.map((pick, p) => ({
      contender: pick.contender,
      found: pick.found,
      ...(pick.reason === undefined ? {} : { reason: pick.reason }),
      params: pick.params,
      atBound: pick.atBound,
      scores: byColumn(pick.aggregates),
      perVariant: pick.found
        ? analysis.variants.map((variant, f) => ({ variant, status: pick.status[f], scores: byColumn(pick.perVariant[f]) }))
        : [],
      worstVariant: pick.found
        ? Object.fromEntries(keys.map((k, i) => [k, analysis.perVariant[p].worst[i] >= 0 ? analysis.variants[analysis.perVariant[p].worst[i]] : null]))
        : {},
      ...(pick.adoptedFrom === undefined ? {} : { adoptedFrom: pick.adoptedFrom }),
      evaluations: pick.evaluations,
      converged: pick.converged,
    })),
    crossScore: {
      columns: analysis.columns.map((c) => ({ key: c.key, label: c.label, role: c.role, better: c.better, unit: c.unit })),
      rows: analysis.crossScore.rows.map((contender, p) => ({
        contender,
        values: byColumn(analysis.crossScore.values[p]),
        regrets: byColumn(analysis.crossScore.regrets[p]),
      })),
      best: Object.fromEntries(keys.map((k, i) => [k, analysis.crossScore.best[i] >= 0 ? analysis.crossScore.rows[analysis.crossScore.best[i]] : null])),
    },
    agreement: analysis.agreement,
    prescan: analysis.prescan,
    stability: analysis.stability.map((entry) => ({
      label: entry.label,
      variation: entry.variation,
      picks: entry.picks.map((p) => ({ contender: p.contender, found: p.found, params: p.params, moves: p.moves, maxMove: p.maxMove, regretShift: p.regretShift })),
    })),
    summary: analysis.summary,
  };
}
