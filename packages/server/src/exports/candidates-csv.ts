import { Transform } from "node:stream";
import { candidateCsvHeader, csvNumber } from "@loopyard/core";
import type { Aggregate } from "@loopyard/core";
import { stringify } from "csv-stringify";
import type { Response } from "express";
import type pg from "pg";
import QueryStream from "pg-query-stream";
import type { Database } from "../db/database.js";
import { getSweep } from "../sweeps/sweep-service.js";
import type { MemberAccess } from "../workspaces/require-member.js";
import { sendCsvStream } from "./send-csv-stream.js";

/** Rows PostgreSQL hands over per round trip: memory stays at one batch whatever the sweep's size. */
export const CANDIDATE_CSV_BATCH = 1_000;

interface CandidateCsvRow {
  index: number;
  status: string;
  params: number[];
  scores: number[] | null;
  variant_scores: number[] | null;
  error: string | null;
}

function aggregateWords(aggregate: Aggregate | undefined): string {
  if (!aggregate || aggregate.kind === "worst") return "worst case";
  return aggregate.kind === "mean" ? "mean" : `${aggregate.p}th percentile`;
}

/**
 * GET …/sweeps/:sweepId/candidates.csv: every stored candidate of a sweep, by index, streamed from
 * PostgreSQL through a cursor (pg-query-stream, CANDIDATE_CSV_BATCH rows at a time) and csv-stringify
 * into the response with back-pressure, so the server holds one batch, not the sweep. Columns:
 * candidateCsvHeader (parameters and criteria with their units); numbers as the shortest text that
 * reads back as the same double, "inf"/"-inf", empty where a criterion does not apply or the
 * candidate is not stable.
 */
export async function streamCandidatesCsv(db: Database, pool: pg.Pool, access: MemberAccess, sweepId: string, res: Response): Promise<void> {
  const sweep = await getSweep(db, access, sweepId);
  const labels = sweep.family.map((v) => v.label);
  const header = candidateCsvHeader(sweep.definition.structure, sweep.parameters, sweep.criteria, aggregateWords(sweep.definition.aggregate), labels);
  const nc = sweep.criteria.length;
  const multi = labels.length > 1;
  const toRecord = new Transform({
    writableObjectMode: true,
    readableObjectMode: true,
    transform(row: CandidateCsvRow, _encoding, done) {
      const record: string[] = [String(row.index), row.status];
      for (const value of row.params) record.push(csvNumber(value));
      for (let c = 0; c < nc; c++) record.push(csvNumber(row.scores?.[c]));
      if (multi) for (let k = 0; k < labels.length * nc; k++) record.push(csvNumber(row.variant_scores?.[k]));
      record.push(row.error ?? "");
      done(null, record);
    },
  });
  const query = new QueryStream(
    "SELECT index, status, params, scores, variant_scores, error FROM candidate WHERE sweep_id = $1 ORDER BY index",
    [sweepId],
    { batchSize: CANDIDATE_CSV_BATCH },
  );
  await sendCsvStream(pool, res, `${fileName(sweep.name)}-candidates.csv`, (client) => [client.query(query), toRecord, stringify({ header: true, columns: header })]);
}

/** A name as a file name: letters, digits and dashes. */
export function fileName(name: string): string {
  const slug = name.normalize("NFKD").replace(/[^A-Za-z0-9]+/g, "-").replace(/^-+|-+$/g, "").toLowerCase();
  return slug.slice(0, 60) || "export";
}

