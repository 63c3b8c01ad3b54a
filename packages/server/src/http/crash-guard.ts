import { databaseFailure } from "./database-failure.js";
import { logger } from "./logger.js";

/**
 * Keeps a server or worker process alive through a database restart. When PostgreSQL stops, the
 * driver reports the cut connections as 'error' events and rejected promises that nobody awaits
 * any more (a pooled client between two queries, a job library's bookkeeping); Node's default is
 * to end the process on them. Those that are database-connection failures are logged as warnings
 * (the pools reconnect when the database is back, expired chunks return to the queue); anything
 * else is logged as fatal and ends the process with code 1, as before.
 */
export function installCrashGuard(): void {
  const handle = (kind: string) => (error: unknown) => {
    if (databaseFailure(error)?.error.status === 503) {
      logger.warn({ err: error, kind }, "database connection lost; carrying on until it is back");
      return;
    }
    logger.fatal({ err: error, kind }, "unexpected error; stopping");
    // The log is written asynchronously: let it reach stdout first (at most 1 s).
    setTimeout(() => process.exit(1), 1_000).unref();
    logger.flush(() => process.exit(1));
  };
  process.on("uncaughtException", handle("uncaught exception"));
  process.on("unhandledRejection", handle("unhandled rejection"));
}
