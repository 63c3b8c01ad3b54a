import { aliasedTable, and, asc, count, desc, eq, inArray, or, sql } from "drizzle-orm";
import type { DecisionContent, DecisionEventKind, DecisionSource, DecisionState, Plant, UserDto } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { decision, decisionEvent, decisionRevision, decisionSetting, plant, plantRevision, user } from "../db/schema.js";
import { userDtoColumns } from "../users/user-repository.js";

/** One row of the decision table as the services read it, with the proposer and approver. */
export interface DecisionRow {
  id: string;
  workspaceId: string;
  title: string;
  rationale: string;
  state: DecisionState;
  source: DecisionSource;
  content: DecisionContent;
  familyKey: string;
  sweepId: string | null;
  comparisonId: string | null;
  proposedBy: UserDto;
  proposedAt: Date;
  updatedAt: Date;
  approvedBy: UserDto | null;
  approvedAt: Date | null;
  supersedes: string | null;
  supersededBy: string | null;
  supersededAt: Date | null;
  commentCount: number;
}

/** One entry of the audit trail. */
export interface DecisionEventRow {
  id: number;
  kind: DecisionEventKind;
  actor: UserDto;
  at: Date;
  fromState: DecisionState | null;
  toState: DecisionState | null;
  comment: string | null;
  details: Record<string, unknown> | null;
}

/** A plant revision with its plant's name, as a record holds it. */
export interface RecordRevision {
  id: string;
  plantId: string;
  plantName: string;
  number: number;
  name: string;
  unitsNote: string;
  model: Plant;
}

const approver = aliasedTable(user, "approver");

const commentCount = sql<number>`(select count(*)::int from ${decisionEvent} where ${decisionEvent.decisionId} = ${decision.id} and ${decisionEvent.comment} is not null)`;

const rowColumns = {
  id: decision.id,
  workspaceId: decision.workspaceId,
  title: decision.title,
  rationale: decision.rationale,
  state: decision.state,
  source: decision.source,
  content: decision.content,
  familyKey: decision.familyKey,
  sweepId: decision.sweepId,
  comparisonId: decision.comparisonId,
  proposedBy: userDtoColumns,
  proposedAt: decision.proposedAt,
  updatedAt: decision.updatedAt,
  approvedById: decision.approvedBy,
  approverName: approver.name,
  approverEmail: approver.email,
  approvedAt: decision.approvedAt,
  supersedes: decision.supersedes,
  supersededBy: decision.supersededBy,
  supersededAt: decision.supersededAt,
  commentCount,
};

type RawRow = {
  [K in keyof typeof rowColumns]: unknown;
};

function toRow(raw: RawRow): DecisionRow {
  const approvedById = raw.approvedById as string | null;
  return {
    id: raw.id as string,
    workspaceId: raw.workspaceId as string,
    title: raw.title as string,
    rationale: raw.rationale as string,
    state: raw.state as DecisionState,
    source: raw.source as DecisionSource,
    content: raw.content as DecisionContent,
    familyKey: raw.familyKey as string,
    sweepId: raw.sweepId as string | null,
    comparisonId: raw.comparisonId as string | null,
    proposedBy: raw.proposedBy as UserDto,
    proposedAt: raw.proposedAt as Date,
    updatedAt: raw.updatedAt as Date,
    approvedBy: approvedById ? { id: approvedById, name: raw.approverName as string, email: raw.approverEmail as string } : null,
    approvedAt: raw.approvedAt as Date | null,
    supersedes: raw.supersedes as string | null,
    supersededBy: raw.supersededBy as string | null,
    supersededAt: raw.supersededAt as Date | null,
    commentCount: Number(raw.commentCount),
  };
}

function rowQuery(db: Database) {
  return db
    .select(rowColumns)
    .from(decision)
    .innerJoin(user, eq(user.id, decision.proposedBy))
    .leftJoin(approver, eq(approver.id, decision.approvedBy));
}

export async function findDecision(db: Database, workspaceId: string, decisionId: string): Promise<DecisionRow | null> {
  const rows = await rowQuery(db)
    .where(and(eq(decision.workspaceId, workspaceId), eq(decision.id, decisionId)))
    .limit(1);
  return rows[0] ? toRow(rows[0] as RawRow) : null;
}

/** Decisions of a workspace, last changed first, optionally of one state and one family. */
export async function listDecisionRows(db: Database, workspaceId: string, filter: { state?: DecisionState; familyKey?: string; proposedBy?: string } = {}): Promise<DecisionRow[]> {
  const conditions = [eq(decision.workspaceId, workspaceId)];
  if (filter.state) conditions.push(eq(decision.state, filter.state));
  if (filter.familyKey) conditions.push(eq(decision.familyKey, filter.familyKey));
  if (filter.proposedBy) conditions.push(eq(decision.proposedBy, filter.proposedBy));
  const rows = await rowQuery(db)
    .where(and(...conditions))
    .orderBy(desc(decision.updatedAt), desc(decision.id));
  return rows.map((row) => toRow(row as RawRow));
}

/** The audit trail of a decision, oldest first. */
export async function listEvents(db: Database, decisionId: string): Promise<DecisionEventRow[]> {
  const rows = await db
    .select({
      id: decisionEvent.id,
      kind: decisionEvent.kind,
      actor: userDtoColumns,
      at: decisionEvent.at,
      fromState: decisionEvent.fromState,
      toState: decisionEvent.toState,
      comment: decisionEvent.comment,
      details: decisionEvent.details,
    })
    .from(decisionEvent)
    .innerJoin(user, eq(user.id, decisionEvent.actorId))
    .where(eq(decisionEvent.decisionId, decisionId))
    .orderBy(asc(decisionEvent.id));
  return rows.map((row) => ({ ...row, details: (row.details ?? null) as Record<string, unknown> | null }));
}

/** Appends one entry to a decision's audit trail. */
export async function appendEvent(
  db: Database,
  event: { decisionId: string; kind: DecisionEventKind; actorId: string; fromState?: DecisionState | null; toState?: DecisionState | null; comment?: string | null; details?: Record<string, unknown> | null; at?: Date },
): Promise<void> {
  await db.insert(decisionEvent).values({
    decisionId: event.decisionId,
    kind: event.kind,
    actorId: event.actorId,
    fromState: event.fromState ?? null,
    toState: event.toState ?? null,
    comment: event.comment ?? null,
    details: event.details ?? null,
    ...(event.at ? { at: event.at } : {}),
  });
}

/** What a proposal stores: the body, the resolved content and what it pins. */
export interface DecisionValues {
  title: string;
  rationale: string;
  source: DecisionSource;
  content: DecisionContent;
  familyKey: string;
  sweepId: string | null;
  comparisonId: string | null;
  revisionIds: readonly string[];
}

/** Inserts a proposal with its pinned revisions (in the caller's transaction); returns its id. */
export async function insertDecision(db: Database, workspaceId: string, proposedBy: string, values: DecisionValues, at?: Date): Promise<string> {
  const [row] = await db
    .insert(decision)
    .values({
      workspaceId,
      title: values.title,
      rationale: values.rationale,
      source: values.source,
      content: values.content,
      familyKey: values.familyKey,
      sweepId: values.sweepId,
      comparisonId: values.comparisonId,
      proposedBy,
      state: "proposed",
      ...(at ? { proposedAt: at, updatedAt: at } : {}),
    })
    .returning({ id: decision.id });
  if (!row) throw new Error("insert into decision returned no row");
  await db.insert(decisionRevision).values(values.revisionIds.map((plantRevisionId) => ({ decisionId: row.id, plantRevisionId })));
  return row.id;
}

/** Replaces a returned proposal's body, content and pins and makes it proposed again, if it still is `from`. */
export async function reviseDecision(db: Database, decisionId: string, from: DecisionState, values: DecisionValues): Promise<boolean> {
  const rows = await db
    .update(decision)
    .set({
      title: values.title,
      rationale: values.rationale,
      source: values.source,
      content: values.content,
      familyKey: values.familyKey,
      sweepId: values.sweepId,
      comparisonId: values.comparisonId,
      state: "proposed",
      updatedAt: sql`now()`,
    })
    .where(and(eq(decision.id, decisionId), eq(decision.state, from)))
    .returning({ id: decision.id });
  if (rows.length === 0) return false;
  await db.delete(decisionRevision).where(eq(decisionRevision.decisionId, decisionId));
  await db.insert(decisionRevision).values(values.revisionIds.map((plantRevisionId) => ({ decisionId, plantRevisionId })));
  return true;
}

/** Moves a decision from one state to another (and sets the given fields), if it still is in `from`; false when it was not. */
export async function moveDecision(
  db: Database,
  decisionId: string,
  from: DecisionState,
  to: DecisionState,
  fields: Partial<{ approvedBy: string; approvedAt: Date; supersedes: string | null; supersededBy: string; supersededAt: Date }> = {},
): Promise<boolean> {
  const rows = await db
    .update(decision)
    .set({ state: to, updatedAt: sql`now()`, ...fields })
    .where(and(eq(decision.id, decisionId), eq(decision.state, from)))
    .returning({ id: decision.id });
  return rows.length > 0;
}

/** Marks a decision as changed now (a comment), without changing its state. */
export async function touchDecision(db: Database, decisionId: string): Promise<void> {
  await db.update(decision).set({ updatedAt: sql`now()` }).where(eq(decision.id, decisionId));
}

/** Locks a decision's row for the rest of the transaction and returns its state. */
export async function lockDecision(db: Database, decisionId: string): Promise<DecisionState | null> {
  const rows = await db.select({ state: decision.state }).from(decision).where(eq(decision.id, decisionId)).for("update");
  return rows[0]?.state ?? null;
}

/** The approved decision of a family (locked for the rest of the transaction), or null. */
export async function lockApprovedOfFamily(db: Database, workspaceId: string, familyKey: string): Promise<{ id: string; title: string } | null> {
  const rows = await db
    .select({ id: decision.id, title: decision.title })
    .from(decision)
    .where(and(eq(decision.workspaceId, workspaceId), eq(decision.familyKey, familyKey), eq(decision.state, "approved")))
    .for("update");
  return rows[0] ?? null;
}

/** Titles of decisions by id (for sentences and links). */
export async function decisionTitles(db: Database, ids: readonly string[]): Promise<Map<string, string>> {
  if (ids.length === 0) return new Map();
  const rows = await db.select({ id: decision.id, title: decision.title }).from(decision).where(inArray(decision.id, [...ids]));
  return new Map(rows.map((r) => [r.id, r.title]));
}

/** The workspace's decision settings (defaults when none are stored). */
export async function findDecisionSettings(db: Database, workspaceId: string): Promise<{ allowSelfApproval: boolean; updatedAt: Date | null; updatedBy: UserDto | null }> {
  const rows = await db
    .select({ allowSelfApproval: decisionSetting.allowSelfApproval, updatedAt: decisionSetting.updatedAt, updatedBy: userDtoColumns })
    .from(decisionSetting)
    .leftJoin(user, eq(user.id, decisionSetting.updatedBy))
    .where(eq(decisionSetting.workspaceId, workspaceId))
    .limit(1);
  const row = rows[0];
  if (!row) return { allowSelfApproval: false, updatedAt: null, updatedBy: null };
  return { allowSelfApproval: row.allowSelfApproval, updatedAt: row.updatedAt, updatedBy: row.updatedBy?.id ? (row.updatedBy as UserDto) : null };
}

export async function storeDecisionSettings(db: Database, workspaceId: string, userId: string, allowSelfApproval: boolean): Promise<void> {
  await db
    .insert(decisionSetting)
    .values({ workspaceId, allowSelfApproval, updatedBy: userId })
    .onConflictDoUpdate({ target: decisionSetting.workspaceId, set: { allowSelfApproval, updatedBy: userId, updatedAt: sql`now()` } });
}

/**
 * The first decision that rests on any of these plant revisions, this sweep or this comparison
 * (approved and superseded first), or null: what refuses their deletion.
 */
export async function findPinningDecision(db: Database, pins: { revisionIds?: readonly string[]; sweepId?: string; comparisonId?: string }): Promise<{ id: string; title: string; state: DecisionState } | null> {
  const conditions = [];
  if (pins.sweepId) conditions.push(eq(decision.sweepId, pins.sweepId));
  if (pins.comparisonId) conditions.push(eq(decision.comparisonId, pins.comparisonId));
  if (pins.revisionIds && pins.revisionIds.length > 0) {
    conditions.push(inArray(decision.id, db.select({ id: decisionRevision.decisionId }).from(decisionRevision).where(inArray(decisionRevision.plantRevisionId, [...pins.revisionIds]))));
  }
  if (conditions.length === 0) return null;
  const rows = await db
    .select({ id: decision.id, title: decision.title, state: decision.state })
    .from(decision)
    .where(or(...conditions))
    .orderBy(sql`case ${decision.state} when 'approved' then 0 when 'superseded' then 1 else 2 end`, asc(decision.proposedAt))
    .limit(1);
  return rows[0] ?? null;
}

/** The family's revisions with their plants' names, by revision id. */
export async function findRevisionsForRecord(db: Database, revisionIds: readonly string[]): Promise<Map<string, RecordRevision>> {
  const ids = [...new Set(revisionIds)];
  if (ids.length === 0) return new Map();
  const rows = await db
    .select({
      id: plantRevision.id,
      plantId: plantRevision.plantId,
      plantName: plant.name,
      number: plantRevision.number,
      name: plantRevision.name,
      unitsNote: plantRevision.unitsNote,
      model: plantRevision.model,
    })
    .from(plantRevision)
    .innerJoin(plant, eq(plant.id, plantRevision.plantId))
    .where(inArray(plantRevision.id, ids));
  return new Map(rows.map((r) => [r.id, { ...r, model: r.model as Plant }]));
}

/** How many decisions of a workspace are in each state (for the workspace home). */
export async function countDecisionsByState(db: Database, workspaceId: string): Promise<Record<DecisionState, number>> {
  const rows = await db.select({ state: decision.state, n: count() }).from(decision).where(eq(decision.workspaceId, workspaceId)).groupBy(decision.state);
  const out: Record<DecisionState, number> = { proposed: 0, returned: 0, approved: 0, superseded: 0, withdrawn: 0 };
  for (const row of rows) out[row.state] = Number(row.n);
  return out;
}

