// The workspace and member schemas live in core, shared with the web app's pages.
export { SLUG_PATTERN, workspaceInputSchema } from "@loopyard/core";
export type { WorkspaceInput } from "@loopyard/core";
