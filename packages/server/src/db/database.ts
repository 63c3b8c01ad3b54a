import pg from "pg";
import { drizzle, type NodePgDatabase, type NodePgQueryResultHKT } from "drizzle-orm/node-postgres";
import type { PgDatabase } from "drizzle-orm/pg-core";
import * as schema from "./schema.js";

/** The pooled database of the app. */
export type RootDatabase = NodePgDatabase<typeof schema>;

/** What repositories take: the pooled database or a transaction opened on it. */
export type Database = PgDatabase<NodePgQueryResultHKT, typeof schema>;

/** A Drizzle database over its own connection pool; `close()` ends the pool. */
export interface DatabaseHandle {
  db: RootDatabase;
  pool: pg.Pool;
  close(): Promise<void>;
}

/** Opens a pool to `databaseUrl` (nothing connects until the first query). */
export function createDatabase(databaseUrl: string, options: { max?: number } = {}): DatabaseHandle {
  const pool = new pg.Pool({ connectionString: databaseUrl, max: options.max ?? 10 });
  // An idle client losing its connection must not crash the process; the pool replaces it.
  pool.on("error", (error) => console.error(`[loopyard] idle database connection failed: ${error.message}`));
  const db = drizzle(pool, { schema });
  let closed = false;
  return {
    db,
    pool,
    async close() {
      if (closed) return;
      closed = true;
      await pool.end();
    },
  };
}
