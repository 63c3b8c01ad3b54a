// The workspace and member schemas live in core, shared with the web app's pages.
export { memberInputSchema, SLUG_PATTERN, workspaceInputSchema } from "@loopyard/core";
export type { MemberInput, WorkspaceInput } from "@loopyard/core";
