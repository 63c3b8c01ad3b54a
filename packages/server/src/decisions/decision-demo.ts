import type { ComparisonAnalysis, UserDto } from "@loopyard/core";
import { DEMO_COMPARISON_NAME } from "../comparisons/comparison-demo.js";
import { findComparisonIdByName, loadResult } from "../comparisons/comparison-repository.js";
import type { Compute } from "../compute/compute.js";
import type { Database } from "../db/database.js";
import { findUserByEmail } from "../users/user-repository.js";
import type { MemberAccess } from "../workspaces/require-member.js";
import { findWorkspaceBySlug } from "../workspaces/workspace-repository.js";
import { DEMO_WORKSPACE } from "../seed/demo-seed.js";
import type { DecisionNotice } from "./decision-notice.js";
import { listDecisionRows } from "./decision-repository.js";
import { approveDecision, commentOnDecision, proposeDecision, type DecisionDeps } from "./decision-service.js";

export const DEMO_DECISION_TITLE = "Ember line: tune the PID by ITAE";
export const DEMO_PROPOSAL_TITLE = "Ember line: move to J(r=0.1) for gentler heating";

/** The contenders whose picks the demo decides on, in order of preference (the first found pick is used). */
const APPROVED_CONTENDERS = ["itae", "iae", "ise"] as const;
const PROPOSED_CONTENDERS = ["J(r=0.1)", "J(r=1)", "ise"] as const;

/** The seed computes nothing: comparison picks carry their scores (a baseline would need the pool). */
const NO_COMPUTE: Compute = {
  run: async () => ({ ok: false, kind: "refused", reason: "the demo seed proposes stored comparison picks only" }),
  close: async () => undefined,
};

/**
 * The demo's decisions on the Ember line (the demo comparison's family), through the same services
 * as the API: Priya proposed the comparison's ITAE pick and Tomas approved it (the family's
 * decision, superseded by nothing); then Priya proposed the J(r=0.1) pick to replace it, which waits
 * for Tomas, with two comments in its thread. Every step sends its notices through `notify` (the
 * mail queue: the proposal mails to the lead, the approval mail to Priya, the comment mails), and
 * this waits until they are queued. Idempotent: a workspace that holds either title keeps what it
 * has. Returns whether it created them. Needs the demo workspace and the finished demo comparison.
 */
export async function seedDemoDecisions(db: Database, notify: (notice: DecisionNotice) => Promise<unknown>): Promise<boolean> {
  const workspace = await findWorkspaceBySlug(db, DEMO_WORKSPACE.slug);
  const priya = await findUserByEmail(db, "priya@halvard.example");
  const tomas = await findUserByEmail(db, "tomas@halvard.example");
  if (!workspace || !priya || !tomas) throw new Error("seed the demo workspace before its decisions");
  const existing = await listDecisionRows(db, workspace.id);
  if (existing.some((d) => d.title === DEMO_DECISION_TITLE || d.title === DEMO_PROPOSAL_TITLE)) return false;
  const comparisonId = await findComparisonIdByName(db, workspace.id, DEMO_COMPARISON_NAME);
  const result = comparisonId ? await loadResult<ComparisonAnalysis>(db, comparisonId) : null;
  if (!comparisonId || !result) throw new Error("the demo comparison must have finished before the demo decisions are seeded");
  const found = new Set(result.picks.filter((p) => p.found).map((p) => p.contender));
  const approvedContender = APPROVED_CONTENDERS.find((c) => found.has(c));
  const proposedContender = PROPOSED_CONTENDERS.find((c) => found.has(c) && c !== approvedContender);
  if (!approvedContender || !proposedContender) throw new Error(`the demo comparison found too few picks (${[...found].join(", ") || "none"}) to seed its decisions`);

  const pending: Promise<unknown>[] = [];
  const deps: DecisionDeps = { db, compute: NO_COMPUTE, notify: (notice) => void pending.push(notify(notice)) };
  const as = (user: UserDto, role: MemberAccess["role"]): MemberAccess => ({ workspace, role, user });
  const source = (contender: string) => ({ kind: "comparison-pick" as const, comparisonId, contender });

  const decision = await proposeDecision(deps, as(priya, "engineer"), {
    title: DEMO_DECISION_TITLE,
    rationale: `The ${approvedContender.toUpperCase()} pick of “${DEMO_COMPARISON_NAME}”: one filtered PID for the 200, 400 and 800 plates, judged on the worst plate, within Ms ≤ 1.8 and peak |u| ≤ 10 on every plate (the comparison's constraints).`,
    source: source(approvedContender),
  });
  await approveDecision(deps, as(tomas, "lead"), decision.id);

  const proposal = await proposeDecision(deps, as(priya, "engineer"), {
    title: DEMO_PROPOSAL_TITLE,
    rationale: `The ${proposedContender} pick of the same comparison weighs control effort against tracking, so the plates heat with less actuator activity; it meets the same constraints on every plate. Proposed to replace “${DEMO_DECISION_TITLE}”.`,
    source: source(proposedContender),
  });
  await commentOnDecision(deps, as(tomas, "lead"), proposal.id, "How much slower is it on the 800 plate than the ITAE decision? Please point me at the settling times per plate before I approve.");
  await commentOnDecision(deps, as(priya, "engineer"), proposal.id, "The record lists every criterion on each plate, settling time included; the comparison's per-variant table shows both picks side by side.");
  await Promise.all(pending);
  return true;
}
