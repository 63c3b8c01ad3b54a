import { AnswerCache, cachedAnswer, type CachedAnswer } from "../http/answer-cache.js";
import { forgetWorkspaceDirectories } from "../workspaces/workspace-directory-cache.js";

/** How long a workspace's serialised plant list is used without reading it again [ms] (bounds what another process's write may leave unseen). */
export const PLANT_LIST_TTL_MS = 5_000;

/** The serialised plant lists of workspaces (at most 16 MB together, 2 MB each), per process. */
const lists = new AnswerCache(16 * 1024 * 1024, 2 * 1024 * 1024, 1_000);
/** Raised by every write that changes a plant list (a plant, a revision, an author's name). */
let generation = 0;

/**
 * The JSON of a workspace's plant list with its ETag: kept for PLANT_LIST_TTL_MS, and forgotten at
 * once by every write of this process that changes a list (forgetPlantLists: a new plant or
 * revision, a changed user name). A list read while such a write happened is sent but not kept:
 * the generation taken before reading must still hold afterwards, so a list read from the state
 * before a commit cannot be kept after the commit's forgetPlantLists.
 */
export async function plantListAnswer(workspaceId: string, read: () => Promise<unknown>, now = Date.now()): Promise<CachedAnswer> {
  const kept = lists.get(workspaceId, now);
  if (kept) return kept;
  const before = generation;
  const answer = { ...cachedAnswer(JSON.stringify(await read()), "application/json; charset=utf-8"), expires: now + PLANT_LIST_TTL_MS };
  if (generation === before) lists.set(workspaceId, answer);
  return answer;
}

/**
 * Forgets every kept plant list (after a write that changes one, once it is committed), and the
 * workspaces' directories, which count the plants and name the same people.
 */
export function forgetPlantLists(): void {
  generation += 1;
  lists.clear();
  forgetWorkspaceDirectories();
}
