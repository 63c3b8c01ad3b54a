import { and, asc, count, eq, sql } from "drizzle-orm";
import type { CandidateDto } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { candidate, sweep } from "../db/schema.js";

const candidateColumns = { index: candidate.index, params: candidate.params, status: candidate.status, scores: candidate.scores };

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
export async function insertCandidateChunk(db: Database, sweepId: string, rows: readonly CandidateDto[]): Promise<void> {
  if (rows.length === 0) return;
  await db.transaction(async (tx) => {
    await tx
      .insert(candidate)
      .values(rows.map((row) => ({ sweepId, index: row.index, params: row.params, status: row.status, scores: row.scores })))
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
  return db.select(candidateColumns).from(candidate).where(eq(candidate.sweepId, sweepId)).orderBy(asc(candidate.index));
}

export async function findCandidate(db: Database, sweepId: string, index: number): Promise<CandidateDto | null> {
  const rows = await db
    .select(candidateColumns)
    .from(candidate)
    .where(and(eq(candidate.sweepId, sweepId), eq(candidate.index, index)))
    .limit(1);
  return rows[0] ?? null;
}
