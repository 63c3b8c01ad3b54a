// Backup and restore of a Loopyard database with Debian's pg_dump and pg_restore (custom format:
// compressed, every schema — the app's tables, drizzle's migration journal and pg-boss's queue).
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { DATA_DIR, rel } from "./paths.mjs";
import { findPgBinDir, localDatabaseUrl, pgPort, startCluster } from "./postgres.mjs";
import { redact } from "./database.mjs";
import { StepError, runOrFail } from "./step.mjs";

export const BACKUP_DIR = join(DATA_DIR, "backups");

/** The database to back up or restore: DATABASE_URL, else the local cluster's `loopyard` (started if stopped). */
export async function targetDatabase() {
  if (process.env.DATABASE_URL) return { url: process.env.DATABASE_URL, binDir: findPgBinDir() };
  const binDir = findPgBinDir();
  if (!binDir) throw new StepError("PostgreSQL's programs (pg_dump, pg_restore) are not installed.", "Run npm start once (it installs Debian's postgresql), or apt-get install -y postgresql.");
  await startCluster(binDir, pgPort());
  return { url: localDatabaseUrl("loopyard"), binDir };
}

/** A new backup file's path: .data/backups/loopyard-YYYYMMDD-HHMMSS.dump (UTC). */
export function newBackupPath(now = new Date()) {
  const stamp = now.toISOString().replace(/[-:]/g, "").replace("T", "-").slice(0, 15);
  return join(BACKUP_DIR, `loopyard-${stamp}.dump`);
}

/** pg_dump --format=custom of `url` into `file`; returns a note with the file and its size. */
export async function backupDatabase(url, binDir, file) {
  mkdirSync(BACKUP_DIR, { recursive: true });
  await runOrFail(join(binDir, "pg_dump"), ["--format=custom", "--no-owner", "--no-privileges", `--file=${file}`, `--dbname=${url}`], {
    logName: "db-backup",
    what: `Backing up ${redact(url)} (pg_dump)`,
    hint: "Check that the database is running and DATABASE_URL is right; pg_dump must be of the server's major version or newer.",
  });
  return `${rel(file)} (${(statSync(file).size / 1024).toFixed(0)} kB) from ${redact(url)}`;
}

/**
 * Restores `file` into `url`, replacing what is there, in one transaction: pg_restore writes the
 * backup as SQL, which psql runs with --single-transaction after dropping the database's own
 * schemas (DROP SCHEMA … CASCADE; pg_restore --clean cannot drop pg-boss's partitioned tables).
 * A restore that fails leaves the database as it was.
 */
export async function restoreDatabase(url, binDir, fileArgument) {
  if (!fileArgument) {
    throw new StepError("Say which backup to restore.", `Run npm run db:restore FILE, e.g. npm run db:restore ${rel(join(BACKUP_DIR, "loopyard-20261205-120000.dump"))}.`);
  }
  const file = resolve(process.env.INIT_CWD ?? process.cwd(), fileArgument);
  if (!existsSync(file)) throw new StepError(`There is no backup file ${file}.`, `List the backups with: ls ${rel(BACKUP_DIR)}`);
  const work = mkdtempSync(join(tmpdir(), "loopyard-restore-"));
  try {
    const restoreSql = join(work, "restore.sql");
    await runOrFail(join(binDir, "pg_restore"), ["--no-owner", "--no-privileges", `--file=${restoreSql}`, file], {
      logName: "db-restore",
      what: `Reading ${rel(file)} (pg_restore)`,
      hint: "Is it a file written by npm run db:backup? pg_restore must be of the dump's major version or newer.",
    });
    const schemas = await runOrFail(join(binDir, "psql"), ["-At", "-v", "ON_ERROR_STOP=1", `--dbname=${url}`, "-c", SCHEMAS_QUERY], {
      logName: "db-restore-schemas",
      what: `Listing the schemas of ${redact(url)} (psql)`,
      hint: "Check that the database is running and DATABASE_URL is right.",
    });
    const drops = schemas.output
      .split("\n")
      .map((line) => line.trim())
      .filter((name) => /^[a-z_][a-z0-9_]*$/.test(name))
      .map((name) => `DROP SCHEMA IF EXISTS "${name}" CASCADE;`);
    const script = join(work, "replace.sql");
    writeFileSync(script, `${drops.join("\n")}\nCREATE SCHEMA IF NOT EXISTS public;\n${readFileSync(restoreSql, "utf8")}`);
    await runOrFail(join(binDir, "psql"), ["-q", "--single-transaction", "-v", "ON_ERROR_STOP=1", `--dbname=${url}`, `--file=${script}`], {
      logName: "db-restore",
      what: `Restoring ${rel(file)} into ${redact(url)} (psql)`,
      hint: "Stop the app (and any worker) first so that nothing holds locks on the tables, then run the restore again; the database was left as it was.",
    });
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
  return `${rel(file)} restored into ${redact(url)}`;
}

/** The database's own schemas (not PostgreSQL's). */
const SCHEMAS_QUERY = "select nspname from pg_namespace where nspname not like 'pg\\_%' and nspname <> 'information_schema' order by 1";
