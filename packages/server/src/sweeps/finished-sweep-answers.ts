import { AnswerCache, type CachedAnswer } from "../http/answer-cache.js";

/** Most bytes of finished sweeps' answers kept in memory, all together. */
export const FINISHED_ANSWERS_MAX_BYTES = 64 * 1024 * 1024;
/** Largest single answer kept (a 10⁵-candidate cloud is about 4 MB). */
export const FINISHED_ANSWER_MAX_BYTES = 16 * 1024 * 1024;

/**
 * Serialised answers about finished sweeps (front, points), per process. A finished sweep never
 * changes again — no status leads out of "finished", and every candidate was stored before it
 * finished — so its answers are computed once, kept (least recently used first out, bounded in
 * bytes) and sent again with their ETag, or as 304 when the browser has them already. Keys start
 * with the workspace's id, so an answer is found only through a membership of the sweep's own workspace.
 */
const answers = new AnswerCache(FINISHED_ANSWERS_MAX_BYTES, FINISHED_ANSWER_MAX_BYTES);
/** Answers being computed, so that fifty simultaneous first requests compute one. */
const pending = new Map<string, Promise<{ answer: CachedAnswer; finished: boolean }>>();

/** The key of one answer about one sweep: workspace, sweep, and what was asked (exactly). */
export function finishedSweepKey(workspaceId: string, sweepId: string, what: string, query: readonly unknown[]): string {
  return `${workspaceId}/${sweepId}/${what}${JSON.stringify(query)}`;
}

/**
 * The answer under `key`: kept, or computed by `produce` (which tells whether the sweep was
 * finished when it read it; only then is the answer kept). `kept` says whether the answer may be
 * sent with an ETag for revalidation.
 */
export async function finishedSweepAnswer(
  key: string,
  produce: () => Promise<{ answer: CachedAnswer; finished: boolean }>,
): Promise<{ answer: CachedAnswer; finished: boolean }> {
  const kept = answers.get(key);
  if (kept) return { answer: kept, finished: true };
  let computing = pending.get(key);
  if (!computing) {
    computing = produce().then(
      (result) => {
        pending.delete(key);
        if (result.finished) answers.set(key, result.answer);
        return result;
      },
      (error: unknown) => {
        pending.delete(key);
        throw error;
      },
    );
    pending.set(key, computing);
  }
  return computing;
}

/** What is kept, for tests: bytes and entries. */
export function finishedAnswersHeld(): { bytes: number; entries: number } {
  return { bytes: answers.size, entries: answers.count };
}
