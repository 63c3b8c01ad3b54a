import { migrate } from "drizzle-orm/node-postgres/migrator";
import { defaultMigrationsFolder } from "../config.js";
import { installAuditTrailGuard } from "./audit-trail-guard.js";
import { createDatabase } from "./database.js";

/**
 * Applies every pending drizzle-kit migration in `migrationsFolder` (default: the repository's
 * drizzle/ folder, or LOOPYARD_MIGRATIONS_DIR). Safe to run again: applied migrations are skipped.
 */
export async function runMigrations(databaseUrl: string, migrationsFolder = defaultMigrationsFolder()): Promise<void> {
  const handle = createDatabase(databaseUrl, { max: 1 });
  try {
    await migrate(handle.db, { migrationsFolder });
    await installAuditTrailGuard(handle.db);
  } finally {
    await handle.close();
  }
}
