import type { UserDto, WorkspaceDto } from "@loopyard/core";

/**
 * What happened to a decision, for the people it concerns (decision-mailer.ts turns it into mail):
 * "proposed" (also after a revision) → the workspace's leads; "approved", "returned", "commented" →
 * the proposer (and, for a comment, the others in the thread).
 */
export interface DecisionNotice {
  kind: "proposed" | "approved" | "returned" | "commented";
  workspace: WorkspaceDto;
  decisionId: string;
  title: string;
  rationale: string;
  familyName: string;
  proposer: UserDto;
  /** Who proposed, approved, returned or commented. */
  actor: UserDto;
  /** The comment of a return or a comment. */
  comment?: string;
}

/** The app's page of a decision (the web app's route /w/:slug/decisions/:id). */
export function decisionPagePath(slug: string, decisionId: string): string {
  return `/w/${encodeURIComponent(slug)}/decisions/${decisionId}`;
}
