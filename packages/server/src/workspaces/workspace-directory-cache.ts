import type { Role, UserDto } from "@loopyard/core";

/** How long a workspace's directory is used without reading it again [ms] (bounds what another process's write may leave unseen). */
export const WORKSPACE_DIRECTORY_TTL_MS = 5_000;
const MOST_WORKSPACES = 1_000;

/** What the workspace home shows that changes only by this server's writes: the plant and member counts and the members. */
export interface WorkspaceDirectory {
  plants: number;
  members: { user: UserDto; role: Role }[];
}

const directories = new Map<string, { directory: WorkspaceDirectory; until: number }>();
/** Raised by every write that changes a directory (a plant, a membership, a user's name). */
let generation = 0;

/**
 * A workspace's directory, kept for WORKSPACE_DIRECTORY_TTL_MS and forgotten at once by every write
 * of this process that changes one (forgetWorkspaceDirectories, after the write is committed). A
 * directory read while such a write happened is used but not kept (the generation taken before
 * reading must still hold afterwards).
 */
export async function workspaceDirectory(workspaceId: string, read: () => Promise<WorkspaceDirectory>, now = Date.now()): Promise<WorkspaceDirectory> {
  const kept = directories.get(workspaceId);
  if (kept && kept.until > now) return kept.directory;
  const before = generation;
  const directory = await read();
  if (generation === before) {
    if (directories.size >= MOST_WORKSPACES) directories.delete(directories.keys().next().value as string);
    directories.set(workspaceId, { directory, until: now + WORKSPACE_DIRECTORY_TTL_MS });
  }
  return directory;
}

/** Forgets every kept directory (after a write that changes one, once it is committed). */
export function forgetWorkspaceDirectories(): void {
  generation += 1;
  directories.clear();
}
