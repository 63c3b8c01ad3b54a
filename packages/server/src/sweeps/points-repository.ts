import { sql, type SQL } from "drizzle-orm";
import type { Database } from "../db/database.js";

/** Columns of the stable candidates with finite scores on two criteria (see pointColumns). */
export interface PointColumns {
  indices: number[];
  xs: number[];
  ys: number[];
  /** One column per requested parameter position. */
  params: number[][];
}

/** The same columns as PostgreSQL's text of arrays ('{1.5,2}'; '{}' when there are no points). */
export interface PointColumnsText {
  indices: string;
  xs: string;
  ys: string;
  params: string[];
}

/** A finite float8 in SQL: NaN sorts above 'Infinity' in PostgreSQL, so this leaves out NaN and ±Infinity. */
const finite = (value: SQL) => sql`(${value} > '-Infinity'::float8 and ${value} < 'Infinity'::float8)`;

/** PostgreSQL's text form of a float8[] or int[] without NULLs ('{1.5,2}') as numbers; null (no rows) as []. */
function parseArrayText(text: string | null): number[] {
  if (text === null || text === "{}") return [];
  return text.slice(1, -1).split(",").map(Number);
}

/**
 * For the stable candidates of a sweep with finite aggregate scores at positions `xAt` and `yAt`
 * (0-based, criteria order), by index: the index, those two scores and the parameters at
 * `paramAt` (0-based, SweepDetailDto.parameters order). Only those columns are read, each
 * aggregated into one array in SQL. With `stride`: the indices ≡ 0 mod stride plus `extra`.
 */
export async function pointColumns(
  db: Database,
  sweepId: string,
  options: { xAt: number; yAt: number; paramAt: readonly number[]; stride?: number; extra?: readonly number[] },
): Promise<PointColumns> {
  const text = await pointColumnsText(db, sweepId, options);
  return {
    indices: parseArrayText(text.indices),
    xs: parseArrayText(text.xs),
    ys: parseArrayText(text.ys),
    params: text.params.map(parseArrayText),
  };
}

/**
 * pointColumns as PostgreSQL's text of the arrays, no number parsed. With `digits` (1–15), floats are
 * printed with that many significant digits (extra_float_digits = digits − 15 for this transaction:
 * PostgreSQL then prints like C's %.{digits}g, e.g. 1.23457e-07, which is also valid JSON).
 */
export async function pointColumnsText(
  db: Database,
  sweepId: string,
  options: { xAt: number; yAt: number; paramAt: readonly number[]; stride?: number; extra?: readonly number[]; digits?: number },
): Promise<PointColumnsText> {
  const subscript = (position: number) => {
    if (!Number.isInteger(position) || position < 0) throw new RangeError(`bad array position ${position}`);
    return sql.raw(String(position + 1));
  };
  const x = sql`scores[${subscript(options.xAt)}]`;
  const y = sql`scores[${subscript(options.yAt)}]`;
  const stride = options.stride ?? 1;
  const extra = options.extra ?? [];
  const sample =
    stride === 1
      ? sql``
      : extra.length > 0
        ? sql` and (index % ${stride} = 0 or index = any(${`{${extra.join(",")}}`}::int[]))`
        : sql` and index % ${stride} = 0`;
  const paramSelect = options.paramAt.map((at, k) => sql`, params[${subscript(at)}] as ${sql.raw(`p${k}`)}`);
  const paramColumns = options.paramAt.map((_, k) => sql`, array_agg(${sql.raw(`p${k}`)})::text as ${sql.raw(`p${k}`)}`);
  // One sort in the subquery (rows come by index from the (sweep_id, index) key), then every column aggregated in that order.
  const query = sql`select array_agg(index)::text as indices, array_agg(x)::text as xs, array_agg(y)::text as ys${sql.join(paramColumns, sql``)}
        from (
          select index, ${x} as x, ${y} as y${sql.join(paramSelect, sql``)}
          from candidate
          where sweep_id = ${sweepId} and status = 'stable' and scores is not null and ${finite(x)} and ${finite(y)}${sample}
          order by index
        ) as point`;
  const digits = options.digits;
  const result =
    digits === undefined
      ? await db.execute<Record<string, string | null>>(query)
      : await db.transaction(async (tx) => {
          if (!Number.isInteger(digits) || digits < 1 || digits > 15) throw new RangeError(`digits must be 1 to 15, not ${digits}`);
          await tx.execute(sql.raw(`set local extra_float_digits = ${digits - 15}`));
          return tx.execute<Record<string, string | null>>(query);
        });
  const row = result.rows[0] ?? {};
  const text = (value: string | null | undefined) => value ?? "{}";
  return {
    indices: text(row.indices),
    xs: text(row.xs),
    ys: text(row.ys),
    params: options.paramAt.map((_, k) => text(row[`p${k}`])),
  };
}

/** For each of `criteria` aggregate score positions: whether any stable candidate has a finite score there. */
export async function finiteCriteria(db: Database, sweepId: string, criteria: number): Promise<boolean[]> {
  if (criteria === 0) return [];
  const columns = Array.from({ length: criteria }, (_, i) => sql`coalesce(bool_or(${finite(sql`scores[${sql.raw(String(i + 1))}]`)}), false) as ${sql.raw(`c${i}`)}`);
  const result = await db.execute<Record<string, boolean>>(
    sql`select ${sql.join(columns, sql`, `)} from candidate where sweep_id = ${sweepId} and status = 'stable' and scores is not null`,
  );
  const row = result.rows[0] ?? {};
  return Array.from({ length: criteria }, (_, i) => row[`c${i}`] === true);
}
