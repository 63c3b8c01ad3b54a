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

type PointQuery = { xAt: number; yAt: number; paramAt: readonly number[]; stride?: number; extra?: readonly number[] };

/**
 * The stable candidates with finite scores at `xAt` and `yAt`, by index, as a subquery with columns
 * index, x, y, p0, p1, … (the parameters at `paramAt`); with `stride`, the indices ≡ 0 mod stride plus `extra`.
 */
function pointRows(sweepId: string, options: PointQuery): SQL {
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
  // One sort here (rows come by index from the (sweep_id, index) key); the aggregates above keep this order.
  return sql`(
          select index, ${x} as x, ${y} as y${sql.join(paramSelect, sql``)}
          from candidate
          where sweep_id = ${sweepId} and status = 'stable' and scores is not null and ${finite(x)} and ${finite(y)}${sample}
          order by index
        ) as point`;
}

/**
 * pointColumns as PostgreSQL's text of the arrays, no number parsed. With `digits` (1–15), floats are
 * printed with that many significant digits (extra_float_digits = digits − 15 for this transaction:
 * PostgreSQL then prints like C's %.{digits}g, e.g. 1.23457e-07, which is also valid JSON).
 */
export async function pointColumnsText(db: Database, sweepId: string, options: PointQuery & { digits?: number }): Promise<PointColumnsText> {
  const paramColumns = options.paramAt.map((_, k) => sql`, array_agg(${sql.raw(`p${k}`)})::text as ${sql.raw(`p${k}`)}`);
  const query = sql`select array_agg(index)::text as indices, array_agg(x)::text as xs, array_agg(y)::text as ys${sql.join(paramColumns, sql``)}
        from ${pointRows(sweepId, options)}`;
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

/** A little-endian float64 column as a Float64Array (a view when the bytes are 8-byte aligned, else a copy). */
export function float64Column(bytes: Buffer): Float64Array {
  const count = bytes.length / 8;
  if (bytes.byteOffset % 8 === 0) return new Float64Array(bytes.buffer, bytes.byteOffset, count);
  const column = new Float64Array(count);
  new Uint8Array(column.buffer).set(bytes);
  return column;
}

/** A little-endian int32 column as an Int32Array (a view when 4-byte aligned, else a copy). */
export function int32Column(bytes: Buffer): Int32Array {
  const count = bytes.length / 4;
  if (bytes.byteOffset % 4 === 0) return new Int32Array(bytes.buffer, bytes.byteOffset, count);
  const column = new Int32Array(count);
  new Uint8Array(column.buffer).set(bytes);
  return column;
}

/** The same columns as raw little-endian bytes: int32 indices, float64 scores and parameters (exact, nothing printed). */
export interface PointColumnsBytes {
  count: number;
  indices: Buffer;
  xs: Buffer;
  ys: Buffer;
  params: Buffer[];
}

/**
 * pointColumns as bytes: PostgreSQL writes each value in its binary send format (int4send, float8send:
 * big-endian) and concatenates a column into one bytea; here each is turned little-endian in place.
 * No number is printed or parsed on either side, which for 10⁵ points is most of the time a text answer costs.
 */
export async function pointColumnsBytes(db: Database, sweepId: string, options: PointQuery): Promise<PointColumnsBytes> {
  const bytes = (column: SQL, name: string) => sql`, coalesce(string_agg(${column}, ''::bytea), ''::bytea) as ${sql.raw(name)}`;
  const paramColumns = options.paramAt.map((_, k) => bytes(sql`float8send(${sql.raw(`p${k}`)})`, `p${k}`));
  const result = await db.execute<Record<string, Buffer | number>>(
    sql`select count(*)::int as count${bytes(sql`int4send(index)`, "indices")}${bytes(sql`float8send(x)`, "xs")}${bytes(sql`float8send(y)`, "ys")}${sql.join(paramColumns, sql``)}
        from ${pointRows(sweepId, options)}`,
  );
  const row = result.rows[0] ?? {};
  const column = (name: string, width: 4 | 8) => {
    const value = row[name];
    const buffer = Buffer.isBuffer(value) ? value : Buffer.alloc(0);
    return width === 4 ? buffer.swap32() : buffer.swap64();
  };
  return {
    count: Number(row.count ?? 0),
    indices: column("indices", 4),
    xs: column("xs", 8),
    ys: column("ys", 8),
    params: options.paramAt.map((_, k) => column(`p${k}`, 8)),
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
