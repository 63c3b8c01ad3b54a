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
  variantScores: candidate.variantScores,
  error: candidate.error,
};

/** One evaluated candidate as the runner stores it: scores as numbers (NaN, ±Infinity kept). */
export interface CandidateRow {
  index: number;
  params: number[];
  status: CandidateDto["status"];
  /** In the order of the sweep's criteria; null unless stable. */
  scores: number[] | null;
  /** With more than one variant: F × C per-variant scores, variant-major (NaN where not stable). */
  variantScores?: number[] | null;
  error?: string | null;
}

interface StoredRow {
  index: number;
  params: number[];
  status: CandidateDto["status"];
  scores: number[] | null;
  variantScores: number[] | null;
  error: string | null;
}

/** A stored row as CandidateDto; `criteria` = C, to cut variant_scores into one array per variant. */
function toDto(row: StoredRow, criteria: number): CandidateDto {
  const dto: CandidateDto = { index: row.index, params: row.params, status: row.status, scores: row.scores ? row.scores.map(toScoreValue) : null };
  if (row.variantScores && criteria > 0) {
    const variants: (ReturnType<typeof toScoreValue>[] | null)[] = [];
    for (let at = 0; at < row.variantScores.length; at += criteria) {
      const values = row.variantScores.slice(at, at + criteria);
      variants.push(values.every((v) => Number.isNaN(v)) ? null : values.map(toScoreValue));
    }
    dto.variantScores = variants;
  }
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

/** Every stored candidate of the sweep by index (C = criteria count, to shape per-variant scores). */
export async function listCandidates(db: Database, sweepId: string, criteria = 0): Promise<CandidateDto[]> {
  const rows = await db.select(candidateColumns).from(candidate).where(eq(candidate.sweepId, sweepId)).orderBy(asc(candidate.index));
  return rows.map((row) => toDto(row, criteria));
}

/**
 * A deterministic sample of the sweep's candidates: every `stride`-th index (index mod stride = 0),
 * plus the candidates whose indices are in `extra` (e.g. the front), by index.
 */
export async function listCandidateSample(db: Database, sweepId: string, stride: number, extra: readonly number[], criteria = 0): Promise<CandidateDto[]> {
  const rows = await db
    .select(candidateColumns)
    .from(candidate)
    .where(
      and(
        eq(candidate.sweepId, sweepId),
        extra.length > 0
          ? sql`(${candidate.index} % ${stride} = 0 or ${candidate.index} = any(${`{${extra.join(",")}}`}::int[]))`
          : sql`${candidate.index} % ${stride} = 0`,
      ),
    )
    .orderBy(asc(candidate.index));
  return rows.map((row) => toDto(row, criteria));
}

/** Index and aggregate scores of every stable candidate (the input of fronts). */
export async function listStableScores(db: Database, sweepId: string): Promise<{ index: number; scores: number[] }[]> {
  const rows = await db
    .select({ index: candidate.index, scores: candidate.scores })
    .from(candidate)
    .where(and(eq(candidate.sweepId, sweepId), eq(candidate.status, "stable")))
    .orderBy(asc(candidate.index));
  return rows.filter((r): r is { index: number; scores: number[] } => r.scores !== null);
}

export async function findCandidate(db: Database, sweepId: string, index: number, criteria = 0): Promise<CandidateDto | null> {
  const rows = await db
    .select(candidateColumns)
    .from(candidate)
    .where(and(eq(candidate.sweepId, sweepId), eq(candidate.index, index)))
    .limit(1);
  return rows[0] ? toDto(rows[0], criteria) : null;
}

/** The stored candidates with the given indices, in the order of `indices` (missing ones left out). */
export async function findCandidates(db: Database, sweepId: string, indices: readonly number[], criteria = 0): Promise<CandidateDto[]> {
  if (indices.length === 0) return [];
  const rows = await db
    .select(candidateColumns)
    .from(candidate)
    .where(and(eq(candidate.sweepId, sweepId), sql`${candidate.index} = any(${`{${indices.join(",")}}`}::int[])`));
  const byIndex = new Map(rows.map((row) => [row.index, toDto(row, criteria)]));
  return indices.map((i) => byIndex.get(i)).filter((c): c is CandidateDto => c !== undefined);
}
