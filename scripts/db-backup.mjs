#!/usr/bin/env node
// npm run db:backup [FILE]: pg_dump of DATABASE_URL (default: the local cluster's loopyard) into FILE
// or .data/backups/loopyard-YYYYMMDD-HHMMSS.dump. Restore with npm run db:restore FILE.
import { resolve } from "node:path";
import { backupDatabase, newBackupPath, targetDatabase } from "./lib/backup.mjs";
import { failAndExit, step } from "./lib/step.mjs";

const file = process.argv[2] ? resolve(process.env.INIT_CWD ?? process.cwd(), process.argv[2]) : newBackupPath();
step("Backing up the database", async () => {
  const { url, binDir } = await targetDatabase();
  return backupDatabase(url, binDir, file);
}).catch(failAndExit);
