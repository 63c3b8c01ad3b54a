import type { CriterionId } from "@loopyard/core";

/** Query keys, one tree per workspace so that invalidating a workspace refreshes all of it. */
export const queryKeys = {
  me: ["me"] as const,
  notifications: ["me", "notifications"] as const,
  workspace: (slug: string) => ["workspace", slug] as const,
  plants: (slug: string) => ["workspace", slug, "plants"] as const,
  plant: (slug: string, plantId: string, revision?: number) =>
    ["workspace", slug, "plants", plantId, revision ?? "latest"] as const,
  families: (slug: string) => ["workspace", slug, "families"] as const,
  family: (slug: string, familyId: string, revision?: number) => ["workspace", slug, "families", familyId, revision ?? "latest"] as const,
  familyDiff: (slug: string, familyId: string, from: number, to: number) => ["workspace", slug, "families", familyId, "diff", from, to] as const,
  stepTest: (slug: string, id: string) => ["workspace", slug, "step-tests", id] as const,
  sweeps: (slug: string) => ["workspace", slug, "sweeps"] as const,
  sweep: (slug: string, sweepId: string) => ["workspace", slug, "sweeps", sweepId] as const,
  candidate: (slug: string, sweepId: string, index: number) => ["workspace", slug, "sweeps", sweepId, "candidate", index] as const,
  points: (slug: string, sweepId: string, x: CriterionId, y: CriterionId) =>
    ["workspace", slug, "sweeps", sweepId, "points", x, y] as const,
  front: (slug: string, sweepId: string, x: CriterionId, y: CriterionId) =>
    ["workspace", slug, "sweeps", sweepId, "front", x, y] as const,
  response: (slug: string, sweepId: string, index: number, variant = 0) =>
    ["workspace", slug, "sweeps", sweepId, "response", index, variant] as const,
  sheet: (slug: string, sweepId: string, index: number, sampleTime: number, method: string, format: string) =>
    ["workspace", slug, "sweeps", sweepId, "sheet", index, sampleTime, method, format] as const,
  // Members, invitations and the audit trail.
  members: (slug: string) => ["workspace", slug, "members"] as const,
  invitations: (slug: string) => ["workspace", slug, "invitations"] as const,
  audit: (slug: string) => ["workspace", slug, "audit"] as const,
  // Comparisons of criteria.
  comparisons: (slug: string) => ["workspace", slug, "comparisons"] as const,
  comparison: (slug: string, id: string) => ["workspace", slug, "comparisons", id] as const,
  comparisonResult: (slug: string, id: string) => ["workspace", slug, "comparisons", id, "result"] as const,
  comparisonResponses: (slug: string, id: string, variant: number | null) => ["workspace", slug, "comparisons", id, "responses", variant ?? "worst"] as const,
  comparisonsAcross: (slug: string, judge: string) => ["workspace", slug, "comparisons", "across", judge] as const,
  // Mail: the workspace's outbox (admins).
  outbox: (slug: string) => ["workspace", slug, "outbox"] as const,
  outboxMessage: (slug: string, id: string) => ["workspace", slug, "outbox", id] as const,
  // Proposals and decisions.
  decisions: (slug: string) => ["workspace", slug, "decisions"] as const,
  decisionList: (slug: string, state: string, family: string) => ["workspace", slug, "decisions", "list", state, family] as const,
  decisionsWaiting: (slug: string) => ["workspace", slug, "decisions", "waiting"] as const,
  decision: (slug: string, id: string) => ["workspace", slug, "decisions", "one", id] as const,
};
