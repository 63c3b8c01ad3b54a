import { candidateCsvHeader } from "@loopyard/core";
import type { Aggregate } from "@loopyard/core";
import { stringify } from "csv-stringify/sync";
import type { Response } from "express";
import type pg from "pg";
import { to as copyTo } from "pg-copy-streams";
import type { Database } from "../db/database.js";
import { getSweep } from "../sweeps/sweep-service.js";
import type { MemberAccess } from "../workspaces/require-member.js";
import { sendCsvStream } from "./send-csv-stream.js";

function aggregateWords(aggregate: Aggregate | undefined): string {
  if (!aggregate || aggregate.kind === "worst") return "worst case";
  return aggregate.kind === "mean" ? "mean" : `${aggregate.p}th percentile`;
}

/**
 * One double of an array column as CSV text: PostgreSQL's float8 output (shortest text that reads
 * back as the same double, extra_float_digits = 1, the default since PostgreSQL 12), "inf"/"-inf"
 * for ±Infinity, and NULL (an empty cell) for NaN or a missing element.
 */
function cell(column: string, at: number): string {
  const v = `${column}[${at}]`;
  return `CASE WHEN ${v} = 'Infinity'::float8 THEN 'inf' WHEN ${v} = '-Infinity'::float8 THEN '-inf' WHEN ${v} = 'NaN'::float8 THEN NULL ELSE ${v}::text END`;
}

/**
 * GET …/sweeps/:sweepId/candidates.csv: every stored candidate of a sweep, by index. PostgreSQL
 * writes the rows as CSV itself (COPY … TO STDOUT through pg-copy-streams) and the server passes
 * the bytes on with back-pressure, so it holds a few socket buffers whatever the sweep's size and
 * parses nothing. Columns: candidateCsvHeader (parameters and criteria with their units, written
 * with csv-stringify); numbers as PostgreSQL prints float8 (they read back as the same doubles),
 * "inf"/"-inf", empty where a criterion does not apply or the candidate is not stable.
 */
export async function streamCandidatesCsv(db: Database, pool: pg.Pool, access: MemberAccess, sweepId: string, res: Response): Promise<void> {
  const sweep = await getSweep(db, access, sweepId);
  const labels = sweep.family.map((v) => v.label);
  const header = candidateCsvHeader(sweep.definition.structure, sweep.parameters, sweep.criteria, aggregateWords(sweep.definition.aggregate), labels);
  const nc = sweep.criteria.length;
  const columns = ["index", "status::text"];
  for (let i = 1; i <= sweep.parameters.length; i++) columns.push(cell("params", i));
  for (let i = 1; i <= nc; i++) columns.push(cell("scores", i));
  if (labels.length > 1) for (let i = 1; i <= labels.length * nc; i++) columns.push(cell("variant_scores", i));
  columns.push("error");
  await sendCsvStream(pool, res, `${fileName(sweep.name)}-candidates.csv`, stringify([header]), (client) =>
    // COPY takes no bind parameters: the id is a checked uuid, quoted by the client's escapeLiteral.
    client.query(copyTo(`COPY (SELECT ${columns.join(", ")} FROM candidate WHERE sweep_id = ${client.escapeLiteral(sweepId)} ORDER BY index) TO STDOUT WITH (FORMAT csv)`)),
  );
}

/** A name as a file name: letters, digits and dashes. */
export function fileName(name: string): string {
  const slug = name.normalize("NFKD").replace(/[^A-Za-z0-9]+/g, "-").replace(/^-+|-+$/g, "").toLowerCase();
  return slug.slice(0, 60) || "export";
}
