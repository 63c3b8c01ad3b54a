/**
 * Database schema of Loopyard (PostgreSQL, Drizzle).
 *
 * The first four tables are the ones better-auth's Drizzle adapter reads and writes
 * (columns exactly as its schema generator emits them for provider "pg"); the rest are ours.
 * Migrations in /drizzle are generated from this file by drizzle-kit; never edit them by hand.
 *
 * This file imports only drizzle-orm so that drizzle-kit can load it on its own.
 */
import { sql } from "drizzle-orm";
import {
  boolean,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  text,
  timestamp,
  unique,
  uniqueIndex,
  uuid,
} from "drizzle-orm/pg-core";

// ---------------------------------------------------------------- better-auth tables

export const user = pgTable("user", {
  id: text("id").primaryKey(),
  name: text("name").notNull(),
  email: text("email").notNull().unique(),
  emailVerified: boolean("email_verified").default(false).notNull(),
  image: text("image"),
  createdAt: timestamp("created_at").defaultNow().notNull(),
  updatedAt: timestamp("updated_at")
    .defaultNow()
    .$onUpdate(() => new Date())
    .notNull(),
});

export const session = pgTable(
  "session",
  {
    id: text("id").primaryKey(),
    expiresAt: timestamp("expires_at").notNull(),
    token: text("token").notNull().unique(),
    createdAt: timestamp("created_at").defaultNow().notNull(),
    updatedAt: timestamp("updated_at")
      .$onUpdate(() => new Date())
      .notNull(),
    ipAddress: text("ip_address"),
    userAgent: text("user_agent"),
    userId: text("user_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
  },
  (table) => [index("session_userId_idx").on(table.userId)],
);

export const account = pgTable(
  "account",
  {
    id: text("id").primaryKey(),
    accountId: text("account_id").notNull(),
    providerId: text("provider_id").notNull(),
    userId: text("user_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    accessToken: text("access_token"),
    refreshToken: text("refresh_token"),
    idToken: text("id_token"),
    accessTokenExpiresAt: timestamp("access_token_expires_at"),
    refreshTokenExpiresAt: timestamp("refresh_token_expires_at"),
    scope: text("scope"),
    password: text("password"),
    createdAt: timestamp("created_at").defaultNow().notNull(),
    updatedAt: timestamp("updated_at")
      .$onUpdate(() => new Date())
      .notNull(),
  },
  (table) => [index("account_userId_idx").on(table.userId)],
);

export const verification = pgTable(
  "verification",
  {
    id: text("id").primaryKey(),
    identifier: text("identifier").notNull(),
    value: text("value").notNull(),
    expiresAt: timestamp("expires_at").notNull(),
    createdAt: timestamp("created_at").defaultNow().notNull(),
    updatedAt: timestamp("updated_at")
      .defaultNow()
      .$onUpdate(() => new Date())
      .notNull(),
  },
  (table) => [index("verification_identifier_idx").on(table.identifier)],
);

// ---------------------------------------------------------------- Loopyard tables

/** Roles of a member, least to most rights; mirrors ROLES in @loopyard/core. */
export const roleEnum = pgEnum("member_role", ["viewer", "engineer", "lead", "admin"]);

export const sweepStatusEnum = pgEnum("sweep_status", ["queued", "running", "finished", "failed", "cancelled"]);

/** State of one chunk of a sweep run as a pg-boss job. */
export const sweepChunkStatusEnum = pgEnum("sweep_chunk_status", ["pending", "done", "failed"]);

/** Mirrors CandidateStatus in @loopyard/core. */
export const candidateStatusEnum = pgEnum("candidate_status", ["stable", "unstable", "diverged"]);

export const workspace = pgTable("workspace", {
  id: uuid("id").primaryKey().defaultRandom(),
  slug: text("slug").notNull().unique(),
  name: text("name").notNull(),
  createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
});

export const membership = pgTable(
  "membership",
  {
    workspaceId: uuid("workspace_id")
      .notNull()
      .references(() => workspace.id, { onDelete: "cascade" }),
    userId: text("user_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    role: roleEnum("role").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
  },
  (table) => [
    unique("membership_workspace_user_unique").on(table.workspaceId, table.userId),
    index("membership_user_idx").on(table.userId),
  ],
);

export const plant = pgTable(
  "plant",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    workspaceId: uuid("workspace_id")
      .notNull()
      .references(() => workspace.id, { onDelete: "cascade" }),
    /** Name of the latest revision, kept here for listing and sorting. */
    name: text("name").notNull(),
    kind: text("kind").notNull(),
    createdBy: text("created_by")
      .notNull()
      .references(() => user.id),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).defaultNow().notNull(),
  },
  (table) => [index("plant_workspace_idx").on(table.workspaceId)],
);

/** An immutable version of a plant: rows are inserted, never updated or deleted by the app. */
export const plantRevision = pgTable(
  "plant_revision",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    plantId: uuid("plant_id")
      .notNull()
      .references(() => plant.id, { onDelete: "cascade" }),
    number: integer("number").notNull(),
    name: text("name").notNull(),
    unitsNote: text("units_note").notNull().default(""),
    model: jsonb("model").notNull(),
    /**
     * The revision's poles and open-loop step as its page shows them ({ version, poles, step }),
     * computed once off the main thread when the revision is created (null for revisions stored
     * before; filled in on their first view). Derived from `model` alone.
     */
    preview: jsonb("preview"),
    createdBy: text("created_by")
      .notNull()
      .references(() => user.id),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
  },
  (table) => [unique("plant_revision_plant_number_unique").on(table.plantId, table.number)],
);

export const sweep = pgTable(
  "sweep",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    workspaceId: uuid("workspace_id")
      .notNull()
      .references(() => workspace.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    plantRevisionId: uuid("plant_revision_id")
      .notNull()
      .references(() => plantRevision.id),
    structure: text("structure").notNull(),
    definition: jsonb("definition").notNull(),
    status: sweepStatusEnum("status").notNull().default("queued"),
    total: integer("total").notNull(),
    done: integer("done").notNull().default(0),
    error: text("error"),
    createdBy: text("created_by")
      .notNull()
      .references(() => user.id),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).defaultNow().notNull(),
    finishedAt: timestamp("finished_at", { withTimezone: true }),
    /**
     * The ReferencesDto drawn beside the front (bound curve and scored tuning-rule baselines): it
     * follows from the definition alone, so it is computed once, after the sweep is created or on
     * the first request, and read from here afterwards. Null until then.
     */
    storedReferences: jsonb("stored_references"),
  },
  (table) => [
    index("sweep_workspace_created_idx").on(table.workspaceId, table.createdAt),
    index("sweep_unfinished_idx")
      .on(table.status)
      .where(sql`${table.status} in ('queued', 'running')`),
  ],
);

/**
 * One parameter vector of a sweep (in the order of sweepParameterNames) with its scores (in the
 * order of the sweep's criteria). scores: the AGGREGATE over the family, null unless stable on
 * every variant; inside, 'NaN' marks a criterion that does not apply and 'Infinity' one never
 * reached (PostgreSQL double precision keeps both). variant_scores: with more than one variant,
 * the per-variant scores flattened variant-major (F × C, NaN where a variant is not stable); null
 * for a single variant (then scores are its scores). error: why a candidate marked diverged could
 * not be evaluated, when that was the reason.
 */
export const candidate = pgTable(
  "candidate",
  {
    sweepId: uuid("sweep_id")
      .notNull()
      .references(() => sweep.id, { onDelete: "cascade" }),
    index: integer("index").notNull(),
    params: doublePrecision("params").array().notNull(),
    status: candidateStatusEnum("status").notNull(),
    scores: doublePrecision("scores").array(),
    variantScores: doublePrecision("variant_scores").array(),
    error: text("error"),
  },
  (table) => [primaryKey({ columns: [table.sweepId, table.index] })],
);

/**
 * One chunk of a sweep: the contiguous candidate indices [start, end), one pg-boss job. Created
 * when the sweep starts. A chunk becomes done in the same transaction that stores its candidates;
 * failed after its last retry, with the error. worker_id: the worker that finished it.
 */
export const sweepChunk = pgTable(
  "sweep_chunk",
  {
    sweepId: uuid("sweep_id")
      .notNull()
      .references(() => sweep.id, { onDelete: "cascade" }),
    chunk: integer("chunk").notNull(),
    start: integer("start").notNull(),
    end: integer("end").notNull(),
    status: sweepChunkStatusEnum("status").notNull().default("pending"),
    attempts: integer("attempts").notNull().default(0),
    error: text("error"),
    workerId: text("worker_id"),
    finishedAt: timestamp("finished_at", { withTimezone: true }),
  },
  (table) => [primaryKey({ columns: [table.sweepId, table.chunk] }), index("sweep_chunk_finished_idx").on(table.sweepId, table.finishedAt)],
);

/** A worker process (embedded in a server or started with `cli.js worker`), alive while its heartbeat is fresh. */
export const worker = pgTable("worker", {
  id: text("id").primaryKey(),
  host: text("host").notNull(),
  pid: integer("pid").notNull(),
  threads: integer("threads").notNull(),
  startedAt: timestamp("started_at", { withTimezone: true }).defaultNow().notNull(),
  heartbeatAt: timestamp("heartbeat_at", { withTimezone: true }).defaultNow().notNull(),
});

// ---------------------------------------------------------------- comparisons (criteria against each other)

/** Status of a comparison; the same states as a sweep's. */
export const comparisonStatusEnum = pgEnum("comparison_status", ["queued", "running", "finished", "failed", "cancelled"]);

/** State of one piece of a comparison's work (a pre-scan chunk or a contender's refinement), one pg-boss job each. */
export const comparisonTaskStatusEnum = pgEnum("comparison_task_status", ["pending", "done", "failed"]);

/**
 * A comparison: contending criteria pitted against each other on one family, structure, box and
 * scenario. definition: the ComparisonInput as submitted (family by plant revisions), frozen when it
 * starts. It runs as jobs: the pre-scan in chunks (comparison_chunk), then one refinement per
 * contender (comparison_pick), then one analysis whose result (cross-score, per variant, agreement,
 * stability, summary) is stored in `result`. prescan_total: candidates of the pre-scan;
 * contenders: how many picks.
 */
export const comparison = pgTable(
  "comparison",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    workspaceId: uuid("workspace_id")
      .notNull()
      .references(() => workspace.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    definition: jsonb("definition").notNull(),
    status: comparisonStatusEnum("status").notNull().default("queued"),
    prescanTotal: integer("prescan_total").notNull(),
    contenders: integer("contenders").notNull(),
    result: jsonb("result"),
    error: text("error"),
    createdBy: text("created_by")
      .notNull()
      .references(() => user.id),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).defaultNow().notNull(),
    finishedAt: timestamp("finished_at", { withTimezone: true }),
  },
  (table) => [
    index("comparison_workspace_created_idx").on(table.workspaceId, table.createdAt),
    index("comparison_unfinished_idx")
      .on(table.status)
      .where(sql`${table.status} in ('queued', 'running')`),
  ],
);

/**
 * One chunk of a comparison's pre-scan: design points [start, end), one pg-boss job. `data` holds
 * the chunk's evaluated points as core returns them (JSON; non-finite numbers as strings), stored
 * in the same transaction that marks the chunk done.
 */
export const comparisonChunk = pgTable(
  "comparison_chunk",
  {
    comparisonId: uuid("comparison_id")
      .notNull()
      .references(() => comparison.id, { onDelete: "cascade" }),
    chunk: integer("chunk").notNull(),
    start: integer("start").notNull(),
    end: integer("end").notNull(),
    status: comparisonTaskStatusEnum("status").notNull().default("pending"),
    attempts: integer("attempts").notNull().default(0),
    data: jsonb("data"),
    error: text("error"),
    workerId: text("worker_id"),
    finishedAt: timestamp("finished_at", { withTimezone: true }),
  },
  (table) => [primaryKey({ columns: [table.comparisonId, table.chunk] })],
);

/**
 * The pick of one contender (by its index in the definition's contenders): the local refinement
 * from the pre-scan's best points, one pg-boss job, stored with its completion in one transaction.
 */
export const comparisonPick = pgTable(
  "comparison_pick",
  {
    comparisonId: uuid("comparison_id")
      .notNull()
      .references(() => comparison.id, { onDelete: "cascade" }),
    contender: integer("contender").notNull(),
    status: comparisonTaskStatusEnum("status").notNull().default("pending"),
    attempts: integer("attempts").notNull().default(0),
    data: jsonb("data"),
    error: text("error"),
    workerId: text("worker_id"),
    finishedAt: timestamp("finished_at", { withTimezone: true }),
  },
  (table) => [primaryKey({ columns: [table.comparisonId, table.contender] })],
);

// ---------------------------------------------------------------- decisions (proposals, approvals, audit trail)

/** Mirrors DECISION_STATES in @loopyard/core. */
export const decisionStateEnum = pgEnum("decision_state", ["proposed", "returned", "approved", "superseded", "withdrawn"]);

/** Mirrors DecisionEventKind in @loopyard/core. */
export const decisionEventKindEnum = pgEnum("decision_event_kind", ["proposed", "revised", "returned", "commented", "approved", "superseded", "withdrawn"]);

/**
 * A proposal and, once a lead approved it, a decision. source: the DecisionSource as proposed
 * (sweep candidate, comparison pick or baseline); content: the DecisionContent snapshot taken when
 * it was proposed or last revised (family revisions with models, controller, scenario, evaluation
 * options, every criterion per variant, the comparison's row). family_key: decisionFamilyKey of its
 * family; approving supersedes the family's approved decision. The sweep or comparison it came from
 * is referenced without cascade (checked at the end of the statement, so a whole workspace can still go), so neither can be deleted while a decision points at it; approved
 * and superseded rows are frozen (the service refuses every change with 409).
 */
export const decision = pgTable(
  "decision",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    workspaceId: uuid("workspace_id")
      .notNull()
      .references(() => workspace.id, { onDelete: "cascade" }),
    title: text("title").notNull(),
    rationale: text("rationale").notNull(),
    state: decisionStateEnum("state").notNull().default("proposed"),
    source: jsonb("source").notNull(),
    content: jsonb("content").notNull(),
    familyKey: text("family_key").notNull(),
    sweepId: uuid("sweep_id").references(() => sweep.id),
    comparisonId: uuid("comparison_id").references(() => comparison.id),
    proposedBy: text("proposed_by")
      .notNull()
      .references(() => user.id),
    proposedAt: timestamp("proposed_at", { withTimezone: true }).defaultNow().notNull(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).defaultNow().notNull(),
    approvedBy: text("approved_by").references(() => user.id),
    approvedAt: timestamp("approved_at", { withTimezone: true }),
    supersedes: uuid("supersedes"),
    supersededBy: uuid("superseded_by"),
    supersededAt: timestamp("superseded_at", { withTimezone: true }),
  },
  (table) => [
    index("decision_workspace_updated_idx").on(table.workspaceId, table.updatedAt),
    index("decision_family_idx").on(table.workspaceId, table.familyKey, table.state),
    // At most one approved decision per family: a second approval must supersede the first.
    uniqueIndex("decision_one_approved_per_family").on(table.workspaceId, table.familyKey).where(sql`${table.state} = 'approved'`),
  ],
);

/** The plant revisions a decision rests on (its family), so that none of them can be deleted while it stands. */
export const decisionRevision = pgTable(
  "decision_revision",
  {
    decisionId: uuid("decision_id")
      .notNull()
      .references(() => decision.id, { onDelete: "cascade" }),
    plantRevisionId: uuid("plant_revision_id")
      .notNull()
      .references(() => plantRevision.id),
  },
  (table) => [primaryKey({ columns: [table.decisionId, table.plantRevisionId] }), index("decision_revision_revision_idx").on(table.plantRevisionId)],
);

/**
 * The audit trail of a decision: every state change and comment with who and when, inserted and
 * never updated or deleted by the app. from_state/to_state: null for a comment. details: what a
 * revision changed, or the decision that superseded / was superseded.
 */
export const decisionEvent = pgTable(
  "decision_event",
  {
    id: integer("id").primaryKey().generatedAlwaysAsIdentity(),
    decisionId: uuid("decision_id")
      .notNull()
      .references(() => decision.id, { onDelete: "cascade" }),
    kind: decisionEventKindEnum("kind").notNull(),
    actorId: text("actor_id")
      .notNull()
      .references(() => user.id),
    at: timestamp("at", { withTimezone: true }).defaultNow().notNull(),
    fromState: decisionStateEnum("from_state"),
    toState: decisionStateEnum("to_state"),
    comment: text("comment"),
    details: jsonb("details"),
  },
  (table) => [index("decision_event_decision_idx").on(table.decisionId, table.id)],
);

/** Per-workspace rules of decisions, changed by admins; a workspace without a row has the defaults. */
export const decisionSetting = pgTable("decision_setting", {
  workspaceId: uuid("workspace_id")
    .primaryKey()
    .references(() => workspace.id, { onDelete: "cascade" }),
  /** Whether a lead may approve their own proposal (the four-eyes rule off). */
  allowSelfApproval: boolean("allow_self_approval").notNull().default(false),
  updatedBy: text("updated_by").references(() => user.id),
  updatedAt: timestamp("updated_at", { withTimezone: true }).defaultNow().notNull(),
});

export const authSchema = { user, session, account, verification };

// ---------------------------------------------------------------- mail: notification settings

/**
 * One person's choice for one kind of mail (core MAIL_KINDS). No row means the kind is on; account
 * kinds (invitation, password reset, address check) are always sent whatever is stored here.
 */
export const notificationSetting = pgTable(
  "notification_setting",
  {
    userId: text("user_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    kind: text("kind").notNull(),
    enabled: boolean("enabled").notNull(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [primaryKey({ columns: [table.userId, table.kind] })],
);
