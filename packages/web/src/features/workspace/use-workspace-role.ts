import { useParams } from "react-router";
import { hasRole, type Role } from "@loopyard/core";
import { useWorkspace } from "../../api/use-workspace.js";

/**
 * The open workspace (from the :slug of the route) and what the caller may do in it.
 * Only a hint for the UI: the server checks the role on every request.
 */
export function useWorkspaceRole() {
  const { slug = "" } = useParams();
  const workspace = useWorkspace(slug);
  const role: Role | undefined = workspace.data?.role;
  return {
    slug,
    workspace,
    role,
    /** True when the caller may create plants, revisions and sweeps (engineer or higher). */
    canEdit: role !== undefined && hasRole(role, "engineer"),
  };
}

/** The sentence shown where an action needs a higher role, e.g. "Creating plants needs the engineer role or higher in …; you are a viewer." */
export function roleSentence(action: string, needed: Role, workspaceName: string | undefined, role: Role | undefined): string {
  const where = workspaceName ? ` in ${workspaceName}` : "";
  const level = needed === "admin" ? "the admin role" : `the ${needed} role or higher`;
  return `${action} needs ${level}${where}; you are ${role ? `${/^[aeiou]/.test(role) ? "an" : "a"} ${role}` : "not a member"}.`;
}
