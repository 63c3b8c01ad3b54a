import { hasRole, isFrozenDecision } from "@loopyard/core";
import type { DecisionPermissionsDto, DecisionState, Role } from "@loopyard/core";

/** Who asks, and what the workspace allows. */
export interface DecisionActor {
  userId: string;
  role: Role;
  /** The workspace lets a lead approve their own proposal. */
  allowSelfApproval: boolean;
}

/** The part of a decision the rules look at. */
export interface DecisionStanding {
  state: DecisionState;
  proposedBy: string;
}

/** The sentence of the four-eyes rule (common practice: the one who proposes does not approve). */
export const FOUR_EYES_SENTENCE =
  "You proposed this design, and a lead does not approve their own proposal (four-eyes rule): ask another lead to approve it, or an admin to allow self-approval in this workspace's decision settings.";

/** Open decisions (proposed or returned) take comments, and may be withdrawn. */
function isOpen(state: DecisionState): boolean {
  return state === "proposed" || state === "returned";
}

/**
 * What `actor` may do with a decision now — the rules the API enforces, for the page to show or
 * hide its buttons:
 * - approve: a lead (or admin) while it is proposed, not their own proposal unless the workspace allows it;
 * - return with a comment: a lead while it is proposed;
 * - comment: engineers and up while it is open (proposed or returned);
 * - withdraw: its proposer, a lead or an admin while it is open;
 * - revise: its proposer (engineer or up) while it is returned.
 * Approved and superseded decisions are frozen: nothing is allowed.
 */
export function decisionPermissions(decision: DecisionStanding, actor: DecisionActor): DecisionPermissionsDto {
  const lead = hasRole(actor.role, "lead");
  const engineer = hasRole(actor.role, "engineer");
  const own = decision.proposedBy === actor.userId;
  const proposed = decision.state === "proposed";
  const fourEyes = own && !actor.allowSelfApproval;
  return {
    canApprove: lead && proposed && !fourEyes,
    canReturn: lead && proposed,
    canComment: engineer && isOpen(decision.state),
    canWithdraw: engineer && isOpen(decision.state) && (own || lead),
    canRevise: engineer && own && decision.state === "returned",
    approveBlockedBecause: !lead ? null : !proposed ? stateSentence(decision.state, "approved") : fourEyes ? FOUR_EYES_SENTENCE : null,
  };
}

/** Why a decision in `state` cannot be `wanted` (approved, returned, revised, withdrawn, commented on). */
export function stateSentence(state: DecisionState, wanted: "approved" | "returned" | "revised" | "withdrawn" | "commented on"): string {
  if (isFrozenDecision(state)) {
    return `This decision is ${state} and therefore frozen: nothing in it can change. Propose a new design for the family instead.`;
  }
  if (state === "withdrawn") return `This proposal was withdrawn, so it can no longer be ${wanted}; propose the design again if it is still wanted.`;
  if (wanted === "revised") return `Only a returned proposal can be revised; this one is ${state}.`;
  if (wanted === "approved" || wanted === "returned") return `Only a proposed design can be ${wanted}; this one is ${state} and waits for its proposer to revise it.`;
  return `This proposal is ${state}; it cannot be ${wanted} now.`;
}
