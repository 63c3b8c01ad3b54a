import type { Database } from "../db/database.js";
import { HttpError } from "../http/http-error.js";
import { findPinningDecision } from "./decision-repository.js";

/**
 * Refuses to delete what a decision rests on: a plant revision of its family (a plant: all its
 * revisions), the sweep or the comparison it came from. Any delete route calls this first; the 409
 * names the decision. (The database refuses such a delete too: decision and decision_revision
 * reference them without cascade.)
 *
 * @param what the thing to be deleted, as the subject of a sentence: "This plant", "This sweep".
 */
export async function assertNotPinnedByDecision(db: Database, pins: { revisionIds?: readonly string[]; sweepId?: string; comparisonId?: string }, what: string): Promise<void> {
  const pinning = await findPinningDecision(db, pins);
  if (!pinning) return;
  throw new HttpError(
    409,
    `${what} cannot be deleted: the decision “${pinning.title}” (${pinning.state}) rests on it, and a decision's revisions, sweeps and comparisons stay as they were.`,
  );
}
