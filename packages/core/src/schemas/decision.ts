/**
 * Proposals and decisions: the bodies the API accepts, the DTOs it answers with, and the decision
 * record — a documented, versioned JSON format of our own (`loopyard.decision-record`, version 1)
 * that holds everything a decision rests on: the family's plant revisions with their models, the
 * controller structure and parameters, the scenario, the evaluation options, every criterion per
 * variant, the comparison it came from, who proposed and approved it when, and the safety caution.
 *
 * States of a decision (one name each, see the GLOSSARY):
 *   proposed  → approved (a lead; not the proposer unless the workspace allows it)
 *             → returned (a lead, with a comment) → proposed again when the proposer revises it
 *             → withdrawn (the proposer, a lead or an admin; from proposed or returned)
 *   approved  → superseded (when a later decision of the same family is approved)
 * approved and superseded are frozen: nothing in them changes any more.
 */
import { z } from "zod";
import type { UserDto } from "../api/dto.js";
import { CONTROLLER_KINDS, controllerSchema, type Controller, type ControllerKind } from "../controllers/controller.js";
import { CRITERION_IDS } from "../criteria/criterion-id.js";
import { MAX_TITLE_LENGTH } from "../limits.js";
import { plantModelSchema } from "../plants/plant.js";
import { criterionOptionsSchema, sweepAggregateSchema, sweepScenarioSchema } from "../sweeps/sweep-input.js";
import { textField } from "./text.js";

// ---------------------------------------------------------------- states

export const DECISION_STATES = ["proposed", "returned", "approved", "superseded", "withdrawn"] as const;
export type DecisionState = (typeof DECISION_STATES)[number];
export const decisionStateSchema = z.enum(DECISION_STATES, { error: `state must be one of ${DECISION_STATES.join(", ")}` });

/** States in which nothing of a decision may change (edits answer 409). */
export const FROZEN_DECISION_STATES: readonly DecisionState[] = ["approved", "superseded"];

export function isFrozenDecision(state: DecisionState): boolean {
  return FROZEN_DECISION_STATES.includes(state);
}

/** The safety caution every record, sheet and results page carries. */
export const SAFETY_CAUTION =
  "Simulated designs are not validated designs. Validate on the real system with its safety interlocks in place, and follow your organisation's safety practice and local codes.";

// ---------------------------------------------------------------- request bodies

/** Longest rationale and comment (characters, after trimming). */
export const MAX_RATIONALE_LENGTH = 4_000;
export const MAX_COMMENT_LENGTH = 4_000;
/** Largest candidate index a source may name (PostgreSQL integer). */
const MAX_CANDIDATE_INDEX = 2 ** 31 - 1;

const uuid = (what: string) => z.uuid({ error: `${what} must be the id of one in this workspace` });

export const BASELINE_RULE_IDS = ["ziegler-nichols", "simc", "amigo", "lambda", "imc"] as const;
export const BASELINE_VARIANT_IDS = ["p", "pi", "pid"] as const;

/**
 * What a proposal puts forward:
 * - `sweep-candidate`: candidate `candidateIndex` of a finished sweep (a row of the front table or a clicked point);
 * - `comparison-pick`: the pick of contender `contender` (its column key, e.g. "iae" or "J(r=0.1)") of a finished comparison;
 * - `baseline`: a published tuning rule's controller (rule and its p/pi/pid variant) as scored beside a sweep's front.
 */
export const decisionSourceSchema = z.discriminatedUnion(
  "kind",
  [
    z.strictObject({
      kind: z.literal("sweep-candidate"),
      sweepId: uuid("sweepId"),
      candidateIndex: z
        .number({ error: "candidateIndex must be a number" })
        .int("candidateIndex must be a whole number")
        .min(0, "candidateIndex counts from 0")
        .max(MAX_CANDIDATE_INDEX, `candidateIndex must be at most ${MAX_CANDIDATE_INDEX}`),
    }),
    z.strictObject({
      kind: z.literal("comparison-pick"),
      comparisonId: uuid("comparisonId"),
      contender: z.string({ error: "contender must be the column key of a contender, e.g. \"iae\"" }).min(1, "name the contender").max(60, "keep the contender under 60 characters"),
    }),
    z.strictObject({
      kind: z.literal("baseline"),
      sweepId: uuid("sweepId"),
      rule: z.enum(BASELINE_RULE_IDS, { error: `rule must be one of ${BASELINE_RULE_IDS.join(", ")}` }),
      variant: z.enum(BASELINE_VARIANT_IDS, { error: 'variant must be "p", "pi" or "pid"' }),
    }),
  ],
  { error: 'source must be {kind:"sweep-candidate", sweepId, candidateIndex}, {kind:"comparison-pick", comparisonId, contender} or {kind:"baseline", sweepId, rule, variant}' },
);
export type DecisionSource = z.infer<typeof decisionSourceSchema>;

/** POST /api/workspaces/:slug/decisions — propose; PUT …/decisions/:id — revise a returned proposal (the same body). */
export const decisionProposalSchema = z.strictObject({
  title: textField({ label: "title", min: 1, required: "give the proposal a title", max: MAX_TITLE_LENGTH }),
  rationale: textField({ label: "rationale", min: 1, required: "say why this design should be chosen (the rationale)", max: MAX_RATIONALE_LENGTH }),
  source: decisionSourceSchema,
});
export type DecisionProposalInput = z.input<typeof decisionProposalSchema>;
export type DecisionProposal = z.output<typeof decisionProposalSchema>;

/** POST …/decisions/:id/return — what must change before the proposal can be approved. */
export const decisionReturnSchema = z.strictObject({
  comment: textField({ label: "comment", min: 1, required: "say what should change before it can be approved", max: MAX_COMMENT_LENGTH }),
});
export type DecisionReturn = z.output<typeof decisionReturnSchema>;

/** POST …/decisions/:id/comments — one comment of the thread. */
export const decisionCommentSchema = z.strictObject({
  comment: textField({ label: "comment", min: 1, required: "write a comment", max: MAX_COMMENT_LENGTH }),
});
export type DecisionCommentInput = z.output<typeof decisionCommentSchema>;

/** PUT /api/workspaces/:slug/decision-settings (admins). */
export const decisionSettingsSchema = z.strictObject({
  allowSelfApproval: z.boolean({ error: "allowSelfApproval must be true or false" }),
});
export type DecisionSettingsInput = z.output<typeof decisionSettingsSchema>;

/** GET /api/workspaces/:slug/decisions?state=…&family=… */
export const decisionListQuerySchema = z.object({
  state: decisionStateSchema.optional(),
  family: z.string({ error: "give one family key" }).max(2_000, "the family key is too long; copy it from a decision").optional(),
});

// ---------------------------------------------------------------- the decision record (JSON export, version 1)

export const DECISION_RECORD_FORMAT = "loopyard.decision-record";
export const DECISION_RECORD_VERSION = 1;

/** A score in JSON: finite; "inf"/"-inf" for an infinite value; null where the criterion does not apply (NaN). */
const scoreValueSchema = z.union([z.number().finite(), z.literal("inf"), z.literal("-inf"), z.null()]);
const personSchema = z.strictObject({ id: z.string(), name: z.string(), email: z.string() });
const timeSchema = z.iso.datetime({ offset: true, error: "give an ISO 8601 time" });

const recordVariantSchema = z.strictObject({
  /** The variant's label in the family (the plant's name unless the study labelled it). */
  label: z.string(),
  plantId: z.uuid(),
  plantName: z.string(),
  revisionId: z.uuid(),
  revisionNumber: z.number().int().min(1),
  /** The revision's own name and units note. */
  revisionName: z.string(),
  unitsNote: z.string(),
  model: plantModelSchema,
  /** A nonlinear plant's parameter overrides for this variant. */
  parameters: z.record(z.string(), z.number().finite()).optional(),
});

const recordScoresSchema = z.strictObject({
  /** One entry per variant (family order); `scores` aligned with the record's `criteria`, null when not stable there. */
  variants: z.array(
    z.strictObject({
      label: z.string(),
      status: z.enum(["stable", "unstable", "diverged"]),
      scores: z.array(scoreValueSchema).nullable(),
    }),
  ),
  /** The aggregate over the family (evaluation.aggregate), aligned with `criteria`; null unless stable on every variant. */
  aggregate: z.array(scoreValueSchema).nullable(),
});

const recordComparisonSchema = z.strictObject({
  id: z.uuid(),
  name: z.string(),
  /** The contender whose pick this is. */
  contender: z.string(),
  contenders: z.array(z.string()),
  judges: z.array(z.string()),
  /** Limits held on every variant, as the comparison defined them. */
  constraints: z.record(z.string(), z.union([z.strictObject({ max: z.number() }), z.strictObject({ min: z.number() })])),
  /** Column keys of the cross-score (contenders, then judges). */
  columns: z.array(z.string()),
  /** The pick's aggregate on every column, and its regret [%] against the best pick of the column. */
  values: z.array(scoreValueSchema),
  regrets: z.array(scoreValueSchema),
  /** The pick on every column per variant: perVariant[f][k]. */
  perVariant: z.array(z.array(scoreValueSchema)),
  /** Parameters on a bound of the comparison's box (there the box, not the criterion, chose them). */
  atBound: z.array(z.strictObject({ parameter: z.string(), bound: z.enum(["min", "max"]) })),
});

/**
 * The decision record, version 1 (`GET …/decisions/:id/record.json`). Documented field by field
 * below; numbers are SI (seconds, radians per second); scores as in ScoreValue. A reader refuses a
 * record whose `format` or `version` it does not know (readDecisionRecord).
 */
export const decisionRecordSchema = z.strictObject({
  format: z.literal(DECISION_RECORD_FORMAT, { error: `format must be "${DECISION_RECORD_FORMAT}"` }),
  version: z.literal(DECISION_RECORD_VERSION, { error: `version: this reader knows version ${DECISION_RECORD_VERSION} of ${DECISION_RECORD_FORMAT} only` }),
  /** The decision's id, title, rationale and state when the record was written. */
  id: z.uuid(),
  title: z.string(),
  rationale: z.string(),
  state: decisionStateSchema,
  workspace: z.strictObject({ slug: z.string(), name: z.string() }),
  /** What was proposed, and in words ("candidate 12 of sweep “Ember PID grid”"). */
  source: decisionSourceSchema,
  sourceLabel: z.string(),
  /** The sweep the design came from (candidate or baseline), or null for a comparison pick. */
  sweep: z.strictObject({ id: z.uuid(), name: z.string() }).nullable(),
  /** The comparison the pick came from, or null. */
  comparison: recordComparisonSchema.nullable(),
  /** The family: its key (how decisions of one family are told apart) and its plant revisions with their models. */
  family: z.strictObject({ key: z.string(), name: z.string().nullable(), variants: z.array(recordVariantSchema).min(1) }),
  /**
   * The controller: its kind, every parameter by name (the study's parameter order), which of them
   * were tuned, and the controller itself as core simulates it (sample time and anti-windup included).
   */
  structure: z.strictObject({
    kind: z.enum(CONTROLLER_KINDS),
    parameters: z.record(z.string(), z.number().finite()),
    tuned: z.array(z.string()),
    // Core's controller check; its output typed as core's Controller (the schema builds its fields from the parameter table).
    controller: controllerSchema as unknown as z.ZodType<Controller>,
  }),
  scenario: sweepScenarioSchema,
  evaluation: z.strictObject({ aggregate: sweepAggregateSchema, criterionOptions: criterionOptionsSchema.optional() }),
  /** The criteria scored, in the order of every score array. */
  criteria: z.array(z.enum(CRITERION_IDS)),
  scores: recordScoresSchema,
  proposedBy: personSchema,
  proposedAt: timeSchema,
  approvedBy: personSchema.nullable(),
  approvedAt: timeSchema.nullable(),
  /** The later decision of the family that replaced this one, when superseded. */
  supersededBy: z.uuid().nullable(),
  supersededAt: timeSchema.nullable(),
  /** When this record was written. */
  exportedAt: timeSchema,
  caution: z.string(),
});
export type DecisionRecord = z.output<typeof decisionRecordSchema>;
export type DecisionRecordVariant = z.output<typeof recordVariantSchema>;
export type DecisionRecordComparison = z.output<typeof recordComparisonSchema>;
/** What the server snapshots when a proposal is made or revised: the record without the decision's own fields. */
export type DecisionContent = Pick<DecisionRecord, "sourceLabel" | "sweep" | "comparison" | "family" | "structure" | "scenario" | "evaluation" | "criteria" | "scores">;

/** A record refused by readDecisionRecord: the field at fault (dotted) and a sentence. */
export interface DecisionRecordIssue {
  field: string;
  message: string;
}

/**
 * Reads a decision record: the format and version first (a later version is refused with a
 * sentence naming `version`, before any other field is looked at), then every field.
 */
export function readDecisionRecord(value: unknown): { ok: true; record: DecisionRecord } | { ok: false; issue: DecisionRecordIssue } {
  if (typeof value !== "object" || value === null || Array.isArray(value)) return { ok: false, issue: { field: "", message: "a decision record is a JSON object" } };
  const { format, version } = value as { format?: unknown; version?: unknown };
  if (format !== DECISION_RECORD_FORMAT) {
    return { ok: false, issue: { field: "format", message: `format: expected "${DECISION_RECORD_FORMAT}", got ${JSON.stringify(format ?? null)}` } };
  }
  if (version !== DECISION_RECORD_VERSION) {
    return {
      ok: false,
      issue: { field: "version", message: `version: this is version ${JSON.stringify(version ?? null)} of ${DECISION_RECORD_FORMAT}; this Loopyard reads version ${DECISION_RECORD_VERSION} only` },
    };
  }
  const parsed = decisionRecordSchema.safeParse(value);
  if (parsed.success) return { ok: true, record: parsed.data };
  const first = parsed.error.issues[0]!;
  const field = first.path.map(String).join(".");
  return { ok: false, issue: { field, message: field ? `${field}: ${first.message}` : first.message } };
}

// ---------------------------------------------------------------- DTOs

/** One plant variant of a decision's family, without its model (lists). */
export interface DecisionVariantDto {
  label: string;
  plantId: string;
  plantName: string;
  revisionId: string;
  revisionNumber: number;
}

export interface DecisionFamilyDto {
  /** Opaque key of the family (pass it as ?family= to list its decisions). */
  key: string;
  /** A name for people: the study's family name, or the variants' labels joined. */
  name: string;
  variants: DecisionVariantDto[];
}

/** One row of GET /api/workspaces/:slug/decisions. */
export interface DecisionListItemDto {
  id: string;
  title: string;
  state: DecisionState;
  source: DecisionSource;
  /** The source in words, e.g. "candidate 12 of sweep “Ember PID grid”". */
  sourceLabel: string;
  family: DecisionFamilyDto;
  structure: ControllerKind;
  /** Every controller parameter by name. */
  parameters: Record<string, number>;
  proposedBy: UserDto;
  proposedAt: string;
  /** Last change of state, revision or comment. */
  updatedAt: string;
  approvedBy: UserDto | null;
  approvedAt: string | null;
  /** The decision that superseded this one, when superseded. */
  supersededBy: string | null;
  /** Comments in the thread (returns included). */
  commentCount: number;
}

export type DecisionEventKind = "proposed" | "revised" | "returned" | "commented" | "approved" | "superseded" | "withdrawn";

/** One entry of a decision's audit trail (append-only, oldest first). */
export interface DecisionEventDto {
  id: number;
  kind: DecisionEventKind;
  actor: UserDto;
  at: string;
  /** The states before and after, for a state change; both null for a comment. */
  fromState: DecisionState | null;
  toState: DecisionState | null;
  /** The comment of a "returned" or "commented" entry. */
  comment: string | null;
  /** "superseded": the decision that replaced this one; "approved": the one it replaced; "revised": what changed. */
  supersededBy?: string;
  supersedes?: string;
  revised?: { title?: string; source?: DecisionSource; rationale?: boolean };
}

/** One comment of the thread: comments and the comments of returns, oldest first. */
export interface DecisionCommentDto {
  id: number;
  author: UserDto;
  at: string;
  text: string;
  /** "return": the comment a lead returned the proposal with. */
  kind: "comment" | "return";
}

/** What the signed-in person may do with this decision now (the API enforces the same). */
export interface DecisionPermissionsDto {
  canApprove: boolean;
  canReturn: boolean;
  canComment: boolean;
  canWithdraw: boolean;
  canRevise: boolean;
  /** Why a lead may not approve it (four-eyes rule, frozen, …); null when they may or are not a lead. */
  approveBlockedBecause: string | null;
}

/** GET /api/workspaces/:slug/decisions/:id */
export interface DecisionDetailDto extends DecisionListItemDto {
  rationale: string;
  /** The decision record as GET …/record.json gives it (scores per variant, revisions, controller, scenario …). */
  record: DecisionRecord;
  /** The earlier approved decision of the family that this one superseded, when approved. */
  supersedes: string | null;
  events: DecisionEventDto[];
  comments: DecisionCommentDto[];
  can: DecisionPermissionsDto;
}

/** GET /api/workspaces/:slug/decisions/waiting — what waits for the signed-in person. */
export interface DecisionWaitingDto {
  /** Leads and admins: proposals they may approve (not their own unless the workspace allows it). */
  toApprove: DecisionListItemDto[];
  /** Proposers: their proposals returned to them. */
  returnedToMe: DecisionListItemDto[];
}

/** GET|PUT /api/workspaces/:slug/decision-settings */
export interface DecisionSettingsDto {
  /** Whether a lead may approve their own proposal (four-eyes rule off). Default false. */
  allowSelfApproval: boolean;
  updatedAt: string | null;
  updatedBy: UserDto | null;
}
