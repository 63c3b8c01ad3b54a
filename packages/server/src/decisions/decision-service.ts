import { DECISION_RECORD_FORMAT, DECISION_RECORD_VERSION, hasRole, SAFETY_CAUTION } from "@loopyard/core";
import type {
  DecisionDetailDto,
  DecisionEventDto,
  DecisionListItemDto,
  DecisionProposal,
  DecisionRecord,
  DecisionSettingsDto,
  DecisionSource,
  DecisionState,
  DecisionWaitingDto,
  WorkspaceDto,
} from "@loopyard/core";
import type { Compute } from "../compute/compute.js";
import type { Database } from "../db/database.js";
import { HttpError, notFound } from "../http/http-error.js";
import type { MemberAccess } from "../workspaces/require-member.js";
import { resolveSource } from "./decision-content.js";
import type { DecisionNotice } from "./decision-notice.js";
import { decisionPermissions, FOUR_EYES_SENTENCE, stateSentence, type DecisionActor } from "./decision-permissions.js";
import {
  appendEvent,
  findDecision,
  findDecisionSettings,
  insertDecision,
  listDecisionRows,
  listEvents,
  lockApprovedOfFamily,
  lockDecision,
  moveDecision,
  reviseDecision as storeRevision,
  storeDecisionSettings,
  touchDecision,
  type DecisionEventRow,
  type DecisionRow,
  type DecisionValues,
} from "./decision-repository.js";

export const DECISION_NOT_FOUND = "There is no such decision in this workspace.";

/** What the decision services need: the database, the compute pool (a baseline's scores) and where notices go (mail). */
export interface DecisionDeps {
  db: Database;
  compute: Compute;
  /** Called after a proposal, revision, approval, return or comment is stored; must not throw or block. */
  notify(notice: DecisionNotice): void;
}

// ---------------------------------------------------------------- reading

async function findRow(db: Database, access: MemberAccess, decisionId: string): Promise<DecisionRow> {
  const row = await findDecision(db, access.workspace.id, decisionId);
  if (!row) throw notFound(DECISION_NOT_FOUND);
  return row;
}

function familyName(row: DecisionRow): string {
  return row.content.family.name ?? row.content.family.variants.map((v) => v.label).join(", ");
}

export function listItem(row: DecisionRow): DecisionListItemDto {
  const { family, structure } = row.content;
  return {
    id: row.id,
    title: row.title,
    state: row.state,
    source: row.source,
    sourceLabel: row.content.sourceLabel,
    family: {
      key: row.familyKey,
      name: familyName(row),
      variants: family.variants.map((v) => ({ label: v.label, plantId: v.plantId, plantName: v.plantName, revisionId: v.revisionId, revisionNumber: v.revisionNumber })),
    },
    structure: structure.kind,
    parameters: structure.parameters,
    proposedBy: row.proposedBy,
    proposedAt: row.proposedAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    approvedBy: row.approvedBy,
    approvedAt: row.approvedAt ? row.approvedAt.toISOString() : null,
    supersededBy: row.supersededBy,
    commentCount: row.commentCount,
  };
}

/** The decision record, version 1 (see decisionRecordSchema): the stored content with the decision's own fields. */
export function decisionRecord(row: DecisionRow, workspace: WorkspaceDto, exportedAt: Date = new Date()): DecisionRecord {
  return {
    format: DECISION_RECORD_FORMAT,
    version: DECISION_RECORD_VERSION,
    id: row.id,
    title: row.title,
    rationale: row.rationale,
    state: row.state,
    workspace: { slug: workspace.slug, name: workspace.name },
    source: row.source,
    ...row.content,
    proposedBy: row.proposedBy,
    proposedAt: row.proposedAt.toISOString(),
    approvedBy: row.approvedBy,
    approvedAt: row.approvedAt ? row.approvedAt.toISOString() : null,
    supersededBy: row.supersededBy,
    supersededAt: row.supersededAt ? row.supersededAt.toISOString() : null,
    exportedAt: exportedAt.toISOString(),
    caution: SAFETY_CAUTION,
  };
}

/** One audit-trail entry as the API shows it. */
export function eventDto(event: DecisionEventRow): DecisionEventDto {
  const details = event.details ?? {};
  return {
    id: event.id,
    kind: event.kind,
    actor: event.actor,
    at: event.at.toISOString(),
    fromState: event.fromState,
    toState: event.toState,
    comment: event.comment,
    ...(typeof details.supersededBy === "string" ? { supersededBy: details.supersededBy } : {}),
    ...(typeof details.supersedes === "string" ? { supersedes: details.supersedes } : {}),
    ...(details.revised && typeof details.revised === "object" ? { revised: details.revised as DecisionEventDto["revised"] } : {}),
  };
}

async function actorOf(db: Database, access: MemberAccess): Promise<DecisionActor> {
  const settings = await findDecisionSettings(db, access.workspace.id);
  return { userId: access.user.id, role: access.role, allowSelfApproval: settings.allowSelfApproval };
}

export async function listDecisions(deps: DecisionDeps, access: MemberAccess, query: { state?: DecisionState | undefined; family?: string | undefined }): Promise<DecisionListItemDto[]> {
  const rows = await listDecisionRows(deps.db, access.workspace.id, {
    ...(query.state ? { state: query.state } : {}),
    ...(query.family ? { familyKey: query.family } : {}),
  });
  return rows.map(listItem);
}

export async function getDecision(deps: DecisionDeps, access: MemberAccess, decisionId: string): Promise<DecisionDetailDto> {
  const row = await findRow(deps.db, access, decisionId);
  const events = await listEvents(deps.db, row.id);
  return {
    ...listItem(row),
    rationale: row.rationale,
    record: decisionRecord(row, access.workspace),
    supersedes: row.supersedes,
    events: events.map(eventDto),
    comments: events
      .filter((e) => e.comment !== null)
      .map((e) => ({ id: e.id, author: e.actor, at: e.at.toISOString(), text: e.comment as string, kind: e.kind === "returned" ? "return" : "comment" })),
    can: decisionPermissions({ state: row.state, proposedBy: row.proposedBy.id }, await actorOf(deps.db, access)),
  };
}

export async function getDecisionRecord(deps: DecisionDeps, access: MemberAccess, decisionId: string): Promise<DecisionRecord> {
  return decisionRecord(await findRow(deps.db, access, decisionId), access.workspace);
}

/**
 * What waits for the signed-in person: for a lead (or admin), the proposals they may approve (not
 * their own unless the workspace allows it); for anyone, their own proposals that were returned.
 */
export async function waitingDecisions(deps: DecisionDeps, access: MemberAccess): Promise<DecisionWaitingDto> {
  const actor = await actorOf(deps.db, access);
  const toApprove = hasRole(access.role, "lead") ? (await listDecisionRows(deps.db, access.workspace.id, { state: "proposed" })).filter((row) => decisionPermissions({ state: row.state, proposedBy: row.proposedBy.id }, actor).canApprove) : [];
  const returnedToMe = await listDecisionRows(deps.db, access.workspace.id, { state: "returned", proposedBy: access.user.id });
  return { toApprove: toApprove.map(listItem), returnedToMe: returnedToMe.map(listItem) };
}

// ---------------------------------------------------------------- changing

function valuesOf(body: DecisionProposal, resolved: Awaited<ReturnType<typeof resolveSource>>): DecisionValues {
  return { title: body.title, rationale: body.rationale, source: body.source, ...resolved };
}

function notice(kind: DecisionNotice["kind"], row: Pick<DecisionRow, "id" | "title" | "rationale" | "proposedBy"> & { familyName: string }, access: MemberAccess, comment?: string): DecisionNotice {
  return {
    kind,
    workspace: access.workspace,
    decisionId: row.id,
    title: row.title,
    rationale: row.rationale,
    familyName: row.familyName,
    proposer: row.proposedBy,
    actor: access.user,
    ...(comment !== undefined ? { comment } : {}),
  };
}

/** An engineer (or more) proposes a design: its record is built from the stored study and kept with the proposal. */
export async function proposeDecision(deps: DecisionDeps, access: MemberAccess, body: DecisionProposal): Promise<DecisionDetailDto> {
  const resolved = await resolveSource(deps.db, deps.compute, access.workspace.id, body.source);
  const id = await deps.db.transaction(async (tx) => {
    const created = await insertDecision(tx, access.workspace.id, access.user.id, valuesOf(body, resolved));
    await appendEvent(tx, { decisionId: created, kind: "proposed", actorId: access.user.id, fromState: null, toState: "proposed" });
    return created;
  });
  const detail = await getDecision(deps, access, id);
  deps.notify(notice("proposed", { ...detail, proposedBy: detail.proposedBy, familyName: detail.family.name }, access));
  return detail;
}

/** The 409 for a change to a decision in a state that does not allow it. */
function refuseState(state: DecisionState, wanted: Parameters<typeof stateSentence>[1]): HttpError {
  return new HttpError(409, stateSentence(state, wanted));
}

/**
 * The proposer revises a returned proposal: new title, rationale and source (the record is built
 * again), and it is proposed again. Frozen or not returned: 409; someone else: 403.
 */
export async function reviseDecision(deps: DecisionDeps, access: MemberAccess, decisionId: string, body: DecisionProposal): Promise<DecisionDetailDto> {
  const row = await findRow(deps.db, access, decisionId);
  if (row.state !== "returned") throw refuseState(row.state, "revised");
  if (row.proposedBy.id !== access.user.id) {
    throw new HttpError(403, `Only ${row.proposedBy.name}, who proposed it, can revise this proposal; comment in its thread instead.`);
  }
  const resolved = await resolveSource(deps.db, deps.compute, access.workspace.id, body.source);
  await deps.db.transaction(async (tx) => {
    if (!(await storeRevision(tx, row.id, "returned", valuesOf(body, resolved)))) throw refuseState((await lockDecision(tx, row.id)) ?? row.state, "revised");
    const revised: Record<string, unknown> = {};
    if (body.title !== row.title) revised.title = body.title;
    if (JSON.stringify(body.source) !== JSON.stringify(row.source)) revised.source = body.source satisfies DecisionSource;
    if (body.rationale !== row.rationale) revised.rationale = true;
    await appendEvent(tx, { decisionId: row.id, kind: "revised", actorId: access.user.id, fromState: "returned", toState: "proposed", details: { revised } });
  });
  const detail = await getDecision(deps, access, row.id);
  deps.notify(notice("proposed", { ...detail, familyName: detail.family.name }, access));
  return detail;
}

/**
 * A lead approves a proposal: it becomes the family's decision, frozen, and the family's previous
 * approved decision is superseded (both in one transaction, with their audit entries). Not
 * proposed: 409; their own proposal without the workspace's leave: 403 (four-eyes rule).
 */
export async function approveDecision(deps: DecisionDeps, access: MemberAccess, decisionId: string): Promise<DecisionDetailDto> {
  const row = await findRow(deps.db, access, decisionId);
  if (row.state !== "proposed") throw refuseState(row.state, "approved");
  const actor = await actorOf(deps.db, access);
  if (!decisionPermissions({ state: row.state, proposedBy: row.proposedBy.id }, actor).canApprove) throw new HttpError(403, FOUR_EYES_SENTENCE);
  await deps.db.transaction(async (tx) => {
    const state = await lockDecision(tx, row.id);
    if (state !== "proposed") throw refuseState(state ?? row.state, "approved");
    const previous = await lockApprovedOfFamily(tx, access.workspace.id, row.familyKey);
    const now = new Date();
    if (previous) {
      await moveDecision(tx, previous.id, "approved", "superseded", { supersededBy: row.id, supersededAt: now });
      await appendEvent(tx, { decisionId: previous.id, kind: "superseded", actorId: access.user.id, fromState: "approved", toState: "superseded", details: { supersededBy: row.id }, at: now });
    }
    await moveDecision(tx, row.id, "proposed", "approved", { approvedBy: access.user.id, approvedAt: now, supersedes: previous?.id ?? null });
    await appendEvent(tx, { decisionId: row.id, kind: "approved", actorId: access.user.id, fromState: "proposed", toState: "approved", details: previous ? { supersedes: previous.id } : null, at: now });
  });
  deps.notify(notice("approved", { ...row, familyName: familyName(row) }, access));
  return getDecision(deps, access, row.id);
}

/** A lead returns a proposal to its proposer with a comment (in the thread and the audit trail). Not proposed: 409. */
export async function returnDecision(deps: DecisionDeps, access: MemberAccess, decisionId: string, comment: string): Promise<DecisionDetailDto> {
  const row = await findRow(deps.db, access, decisionId);
  if (row.state !== "proposed") throw refuseState(row.state, "returned");
  await deps.db.transaction(async (tx) => {
    if (!(await moveDecision(tx, row.id, "proposed", "returned"))) throw refuseState((await lockDecision(tx, row.id)) ?? row.state, "returned");
    await appendEvent(tx, { decisionId: row.id, kind: "returned", actorId: access.user.id, fromState: "proposed", toState: "returned", comment });
  });
  deps.notify(notice("returned", { ...row, familyName: familyName(row) }, access, comment));
  return getDecision(deps, access, row.id);
}

/** A comment in an open proposal's thread (engineers and up). Frozen or withdrawn: 409. */
export async function commentOnDecision(deps: DecisionDeps, access: MemberAccess, decisionId: string, comment: string): Promise<DecisionDetailDto> {
  const row = await findRow(deps.db, access, decisionId);
  if (row.state !== "proposed" && row.state !== "returned") throw refuseState(row.state, "commented on");
  await deps.db.transaction(async (tx) => {
    const state = await lockDecision(tx, row.id);
    if (state !== "proposed" && state !== "returned") throw refuseState(state ?? row.state, "commented on");
    await appendEvent(tx, { decisionId: row.id, kind: "commented", actorId: access.user.id, comment });
    await touchDecision(tx, row.id);
  });
  deps.notify(notice("commented", { ...row, familyName: familyName(row) }, access, comment));
  return getDecision(deps, access, row.id);
}

/** Its proposer, a lead or an admin withdraws an open proposal. Frozen or withdrawn: 409; another engineer: 403. */
export async function withdrawDecision(deps: DecisionDeps, access: MemberAccess, decisionId: string): Promise<DecisionDetailDto> {
  const row = await findRow(deps.db, access, decisionId);
  if (row.state !== "proposed" && row.state !== "returned") throw refuseState(row.state, "withdrawn");
  if (row.proposedBy.id !== access.user.id && !hasRole(access.role, "lead")) {
    throw new HttpError(403, `Only ${row.proposedBy.name}, who proposed it, a lead or an admin can withdraw this proposal; you are an ${access.role}.`);
  }
  await deps.db.transaction(async (tx) => {
    if (!(await moveDecision(tx, row.id, row.state, "withdrawn"))) throw refuseState((await lockDecision(tx, row.id)) ?? row.state, "withdrawn");
    await appendEvent(tx, { decisionId: row.id, kind: "withdrawn", actorId: access.user.id, fromState: row.state, toState: "withdrawn" });
  });
  return getDecision(deps, access, row.id);
}

// ---------------------------------------------------------------- settings

export async function getDecisionSettings(db: Database, access: MemberAccess): Promise<DecisionSettingsDto> {
  const settings = await findDecisionSettings(db, access.workspace.id);
  return { allowSelfApproval: settings.allowSelfApproval, updatedAt: settings.updatedAt ? settings.updatedAt.toISOString() : null, updatedBy: settings.updatedBy };
}

/** An admin allows (or forbids again) a lead to approve their own proposal. */
export async function updateDecisionSettings(db: Database, access: MemberAccess, input: { allowSelfApproval: boolean }): Promise<DecisionSettingsDto> {
  await storeDecisionSettings(db, access.workspace.id, access.user.id, input.allowSelfApproval);
  return getDecisionSettings(db, access);
}

