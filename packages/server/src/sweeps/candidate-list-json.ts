import { sql } from "drizzle-orm";
import type { Database } from "../db/database.js";

/**
 * Sweeps up to this many candidates list per-variant scores with every candidate; larger ones leave
 * them out of the list (GET …/candidates/:index has them), so that a 10⁵-candidate list stays a
 * few tens of MB.
 */
export const LIST_VARIANT_SCORES_UP_TO = 20_000;

/**
 * A PostgreSQL float8[] in text form ('{1.5,NaN,Infinity}') as a JSON array of ScoreValue
 * ('[1.5,null,"inf"]'). PostgreSQL prints float8 in its shortest exact form (extra_float_digits ≥ 1,
 * the default since PostgreSQL 12), which is valid JSON and reads back to the same double.
 */
export function floatArrayTextToJson(text: string): string {
  if (text === "{}") return "[]";
  return `[${text
    .slice(1, -1)
    .split(",")
    .map(tokenToJson)
    .join(",")}]`;
}

function tokenToJson(token: string): string {
  if (token === "NaN") return "null";
  if (token === "Infinity") return '"inf"';
  if (token === "-Infinity") return '"-inf"';
  return token;
}

/** A flat F × C float8[] text as one JSON array per variant (null where every value is NaN: not stable there). */
export function variantScoresTextToJson(text: string, criteria: number): string {
  const tokens = text.slice(1, -1).split(",");
  const groups: string[] = [];
  for (let at = 0; at + criteria <= tokens.length; at += criteria) {
    const group = tokens.slice(at, at + criteria);
    groups.push(group.every((t) => t === "NaN") ? "null" : `[${group.map(tokenToJson).join(",")}]`);
  }
  return `[${groups.join(",")}]`;
}

/**
 * The candidates of a sweep as the JSON text of CandidateDto[] by index, written straight from
 * PostgreSQL's text form of the arrays (no number is parsed): all of them, or with `stride` the
 * indices ≡ 0 mod stride plus `extra`. Per-variant scores when `withVariants`.
 */
export async function candidateListJson(
  db: Database,
  sweepId: string,
  options: { criteria: number; withVariants: boolean; stride?: number; extra?: readonly number[] },
): Promise<{ json: string; count: number }> {
  const stride = options.stride ?? 1;
  const extra = options.extra ?? [];
  const filter =
    stride === 1
      ? sql``
      : extra.length > 0
        ? sql` and (index % ${stride} = 0 or index = any(${`{${extra.join(",")}}`}::int[]))`
        : sql` and index % ${stride} = 0`;
  const result = await db.execute<{ index: number; params: string; status: string; scores: string | null; variants: string | null; error: string | null }>(
    sql`select index, params::text as params, status::text as status, scores::text as scores,
          ${options.withVariants ? sql`variant_scores::text` : sql`null::text`} as variants, error
        from candidate where sweep_id = ${sweepId}${filter} order by index`,
  );
  const parts: string[] = [];
  for (const row of result.rows) {
    let item = `{"index":${row.index},"params":${floatArrayTextToJson(row.params)},"status":"${row.status}","scores":${row.scores === null ? "null" : floatArrayTextToJson(row.scores)}`;
    if (row.variants !== null) item += `,"variantScores":${variantScoresTextToJson(row.variants, options.criteria)}`;
    if (row.error !== null) item += `,"error":${JSON.stringify(row.error)}`;
    parts.push(`${item}}`);
  }
  return { json: `[${parts.join(",")}]`, count: result.rows.length };
}

/** Index and aggregate scores of every stable candidate (the input of fronts), parsed from text. */
export async function stableScoresFast(db: Database, sweepId: string): Promise<{ index: number; scores: number[] }[]> {
  const result = await db.execute<{ index: number; scores: string }>(
    sql`select index, scores::text as scores from candidate where sweep_id = ${sweepId} and status = 'stable' and scores is not null order by index`,
  );
  return result.rows.map((row) => ({
    index: row.index,
    scores: row.scores
      .slice(1, -1)
      .split(",")
      .map((t) => (t === "NaN" ? Number.NaN : t === "Infinity" ? Number.POSITIVE_INFINITY : t === "-Infinity" ? Number.NEGATIVE_INFINITY : Number(t))),
  }));
}
