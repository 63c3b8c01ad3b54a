import { and, asc, count, eq, sql } from "drizzle-orm";
import type { CandidateDto } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { candidate, sweep } from "../db/schema.js";
import { toScoreValue } from "./score-value.js";

const candidateColumns = {
  index: candidate.index,
  params: candidate.params,
  status: candidate.status,
  scores: candidate.scores,
  error: candidate.error,
};

/** One evaluated candidate as the runner stores it: scores as numbers (NaN, ±Infinity kept). */
export interface CandidateRow {
  index: number;
  params: number[];
  status: CandidateDto["status"];
  /** In the order of the sweep's criteria; null unless stable. */
  scores: number[] | null;
  error?: string | null;
}

function toDto(row: { index: number; params: number[]; status: CandidateDto["status"]; scores: number[] | null; error: string | null }): CandidateDto {
  const dto: CandidateDto = { index: row.index, params: row.params, status: row.status, scores: row.scores ? row.scores.map(toScoreValue) : null };
  if (row.error !== null) dto.error = row.error;
  return dto;
}

/** How many candidates of the sweep are stored (they are stored as a prefix of the grid). */
export async function countCandidates(db: Database, sweepId: string): Promise<number> {
  const [row] = await db.select({ n: count() }).from(candidate).where(eq(candidate.sweepId, sweepId));
  return row?.n ?? 0;
}

/**
 * Stores one chunk of evaluated candidates and the sweep's progress in one transaction.
 * Inserting a candidate that is already stored changes nothing, so a resumed run is idempotent;
 * `done` is recounted from the table so that it always equals what is stored.
 */
export async function insertCandidateChunk(db: Database, sweepId: string, rows: readonly CandidateRow[]): Promise<void> {
  if (rows.length === 0) return;
  await db.transaction(async (tx) => {
    await tx
      .insert(candidate)
      .values(
        rows.map((row) => ({ sweepId, index: row.index, params: row.params, status: row.status, scores: row.scores, error: row.error ?? null })),
      )
      .onConflictDoNothing({ target: [candidate.sweepId, candidate.index] });
    await tx
      .update(sweep)
      .set({
        done: sql`(select count(*) from ${candidate} where ${candidate.sweepId} = ${sweepId})`,
        updatedAt: new Date(),
      })
      .where(eq(sweep.id, sweepId));
  });
}

/** Every stored candidate of the sweep by index. */
export async function listCandidates(db: Database, sweepId: string): Promise<CandidateDto[]> {
  const rows = await db.select(candidateColumns).from(candidate).where(eq(candidate.sweepId, sweepId)).orderBy(asc(candidate.index));
  return rows.map(toDto);
}

export async function findCandidate(db: Database, sweepId: string, index: number): Promise<CandidateDto | null> {
  const rows = await db
    .select(candidateColumns)
    .from(candidate)
    .where(and(eq(candidate.sweepId, sweepId), eq(candidate.index, index)))
    .limit(1);
  return rows[0] ? toDto(rows[0]) : null;
}
