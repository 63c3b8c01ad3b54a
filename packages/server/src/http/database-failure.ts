import { HttpError } from "./http-error.js";

/** Seconds a client is asked to wait before trying again when the database is away. */
export const DATABASE_RETRY_AFTER_SECONDS = 5;

/** SQLSTATE classes and codes (PostgreSQL 15 documentation, Appendix A, "PostgreSQL Error Codes"). */
const UNAVAILABLE_CODES = new Set([
  "53300", // too_many_connections
  "53400", // configuration_limit_exceeded
  "57P01", // admin_shutdown
  "57P02", // crash_shutdown
  "57P03", // cannot_connect_now
]);
const DISK_FULL = "53100";
const OUT_OF_MEMORY = "53200";
/** Socket errors of node-postgres when the server is down or went away. */
const SOCKET_CODES = new Set(["ECONNREFUSED", "ECONNRESET", "EPIPE", "ETIMEDOUT", "EHOSTUNREACH", "ENOTFOUND"]);
/** node-postgres reports a dropped connection and a pool wait that timed out by message only. */
const DROPPED = /Connection terminated|timeout exceeded when trying to connect|Client has encountered a connection error|Connection terminated unexpectedly/i;

/** The error and its causes (Drizzle wraps the driver's error as `cause`), at most 5 deep. */
function causes(error: unknown): unknown[] {
  const chain: unknown[] = [];
  let current = error;
  for (let i = 0; i < 5 && typeof current === "object" && current !== null; i += 1) {
    chain.push(current);
    current = (current as { cause?: unknown }).cause;
  }
  return chain;
}

function codeOf(error: unknown): string | undefined {
  const code = (error as { code?: unknown }).code;
  return typeof code === "string" ? code : undefined;
}

/**
 * The answer to a database failure, or null when `error` is not one: 503 with a sentence and a
 * Retry-After when the database is away, full or out of connections (the request may work later),
 * 400 for a value the database could not store that a check upstream should have caught.
 */
export function databaseFailure(error: unknown): { error: HttpError; retryAfter?: number } | null {
  for (const item of causes(error)) {
    const code = codeOf(item);
    const message = item instanceof Error ? item.message : "";
    if (code === DISK_FULL) {
      return { error: new HttpError(503, "The database has run out of disk space, so nothing can be saved now; tell your admin (reading still works)."), retryAfter: 60 };
    }
    if (code === OUT_OF_MEMORY) {
      return { error: new HttpError(503, "The database ran out of memory for this request; try again in a minute."), retryAfter: 60 };
    }
    if ((code !== undefined && (UNAVAILABLE_CODES.has(code) || code.startsWith("08") || SOCKET_CODES.has(code))) || DROPPED.test(message)) {
      return {
        error: new HttpError(503, `The database is not answering right now (too many connections, or it is restarting); try again in ${DATABASE_RETRY_AFTER_SECONDS} seconds.`),
        retryAfter: DATABASE_RETRY_AFTER_SECONDS,
      };
    }
    // foreign_key_violation on a decision's reference: a delete of what a decision rests on (assertNotPinnedByDecision says which first).
    const constraint = (item as { constraint?: unknown }).constraint;
    if (code === "23503" && typeof constraint === "string" && constraint.startsWith("decision")) {
      return { error: new HttpError(409, "A recorded decision rests on this, so it cannot be deleted; decisions keep their revisions, sweeps and comparisons as they were.") };
    }
    // unique_violation of "one approved decision per family": two leads approved two proposals of one family at the same moment.
    if (code === "23505" && constraint === "decision_one_approved_per_family") {
      return { error: new HttpError(409, "Another decision of this family was approved at the same moment; reload the decision to see which one stands.") };
    }
    if (code === "22021" || code === "22P05" || code === "22P02" || code === "22003" || code === "54000") {
      return { error: new HttpError(400, "A value in the request cannot be stored (a character, number or size out of range); correct it and try again.") };
    }
  }
  return null;
}
