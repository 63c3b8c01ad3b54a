#!/usr/bin/env node
// npm run db:restore FILE: pg_restore of a backup made by npm run db:backup into DATABASE_URL (default:
// the local cluster's loopyard), replacing its contents in one transaction. Stop the app first.
import { restoreDatabase, targetDatabase } from "./lib/backup.mjs";
import { failAndExit, step } from "./lib/step.mjs";

step("Restoring the database", async () => {
  const { url, binDir } = await targetDatabase();
  return restoreDatabase(url, binDir, process.argv[2]);
}).catch(failAndExit);
