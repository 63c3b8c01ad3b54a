// The set-up shared by `npm start` and `npm test`: npm dependencies, local PostgreSQL, database,
// build, migrations, demo seed and the auth secret. Each step prints one line.
import { randomBytes } from "node:crypto";
import { existsSync, mkdirSync, readFileSync, rmSync, statSync, writeFileSync } from "node:fs";
import { createServer } from "node:net";
import { join } from "node:path";
import { ensureDatabase, recreateDatabase, redact, withDatabase, databaseName } from "./database.mjs";
import { ensureCluster, findPgBinDir, installPostgres, localDatabaseUrl, pgPort, preparePostgresFolders, startCluster } from "./postgres.mjs";
import { AUTH_SECRET_FILE, DATA_DIR, REPO_ROOT, SERVER_CLI, rel } from "./paths.mjs";
import { StepError, runOrFail, say, step } from "./step.mjs";

const NPM = process.platform === "win32" ? "npm.cmd" : "npm";

/** npm ci when node_modules is missing or older than package-lock.json. */
export async function ensureDependencies() {
  const lock = join(REPO_ROOT, "package-lock.json");
  const marker = join(REPO_ROOT, "node_modules", ".package-lock.json");
  const stale = !existsSync(marker) || statSync(lock).mtimeMs > statSync(marker).mtimeMs;
  if (!stale) {
    say("npm dependencies … up to date");
    return;
  }
  await step("Installing npm dependencies (npm ci)", async () => {
    await runOrFail(NPM, ["ci", "--no-audit", "--no-fund"], {
      logName: "npm-ci",
      what: "npm ci",
      hint: "Check the network to the npm registry and that package-lock.json is committed, then run again.",
    });
  });
}

/** Finds or installs PostgreSQL, creates and starts the cluster in .data/pg; returns the server URL. */
export async function ensureLocalPostgres() {
  const port = pgPort();
  let binDir = findPgBinDir();
  if (binDir) {
    say(`PostgreSQL binaries … ${binDir}`);
  } else {
    binDir = await step("Installing PostgreSQL (apt-get install postgresql)", installPostgres);
  }
  await preparePostgresFolders();
  await step(`PostgreSQL cluster in ${rel(join(DATA_DIR, "pg"))}`, () => ensureCluster(binDir));
  await step("PostgreSQL server", () => startCluster(binDir, port));
  return { serverUrl: localDatabaseUrl("postgres", port), binDir, port };
}

/**
 * Returns { databaseUrl } ready for migrations.
 * - start: DATABASE_URL when set (skips the local cluster), else the local `loopyard` database (created if missing).
 * - test: a fresh `loopyard_test` database, dropped and re-created on every run: on the local cluster,
 *   or on the server of LOOPYARD_TEST_DATABASE_URL / DATABASE_URL (database name + "_test") when set.
 */
export async function ensureDatabaseFor(purpose) {
  const userUrl = process.env.DATABASE_URL;
  if (purpose === "start") {
    if (userUrl) {
      say(`Database … DATABASE_URL is set (${redact(userUrl)}); the local cluster is not used`);
      return { databaseUrl: userUrl, local: false };
    }
    const { serverUrl } = await ensureLocalPostgres();
    await step("Database", () => ensureDatabase(serverUrl, "loopyard"));
    return { databaseUrl: withDatabase(serverUrl, "loopyard"), local: true };
  }
  const explicitTestUrl = process.env.LOOPYARD_TEST_DATABASE_URL;
  if (explicitTestUrl || userUrl) {
    const testUrl = explicitTestUrl ?? withDatabase(userUrl, testName(databaseName(userUrl)));
    const name = databaseName(testUrl);
    say(`Test database … ${explicitTestUrl ? "LOOPYARD_TEST_DATABASE_URL" : "DATABASE_URL"} is set; using ${redact(testUrl)}`);
    await step(`Test database ${name}`, () => recreateDatabase(testUrl, name));
    return { databaseUrl: testUrl, local: false };
  }
  const { serverUrl } = await ensureLocalPostgres();
  await step("Test database", () => recreateDatabase(serverUrl, "loopyard_test"));
  return { databaseUrl: withDatabase(serverUrl, "loopyard_test"), local: true };
}

function testName(name) {
  return name.endsWith("_test") ? name : `${name}_test`;
}

/** LOOPYARD_AUTH_SECRET when set, else the one in .data/auth-secret (generated once). */
export function ensureAuthSecret() {
  if (process.env.LOOPYARD_AUTH_SECRET) {
    say("Auth secret … from LOOPYARD_AUTH_SECRET");
    return process.env.LOOPYARD_AUTH_SECRET;
  }
  mkdirSync(DATA_DIR, { recursive: true });
  if (existsSync(AUTH_SECRET_FILE)) {
    const secret = readFileSync(AUTH_SECRET_FILE, "utf8").trim();
    if (secret.length >= 32) {
      say(`Auth secret … ${rel(AUTH_SECRET_FILE)}`);
      return secret;
    }
  }
  const secret = randomBytes(32).toString("base64url");
  writeFileSync(AUTH_SECRET_FILE, `${secret}\n`, { mode: 0o600 });
  say(`Auth secret … generated into ${rel(AUTH_SECRET_FILE)}`);
  return secret;
}

/** turbo run build: core, then server and web. */
export async function buildAll() {
  await step("Building core, server and web (turbo run build)", async () => {
    await runOrFail(join(REPO_ROOT, "node_modules", ".bin", "turbo"), ["run", "build"], {
      logName: "build",
      env: { TURBO_TELEMETRY_DISABLED: "1", DO_NOT_TRACK: "1", TURBO_NO_UPDATE_NOTIFIER: "1" },
      what: "The build",
      errorsOnly: true,
      hint: "Fix the compile error shown above (npx turbo run build shows it in full), then run again.",
    });
    if (!existsSync(SERVER_CLI)) {
      throw new StepError(`The build finished but ${rel(SERVER_CLI)} is missing.`, "Check packages/server/tsconfig.build.json (outDir dist, src/cli.ts present).");
    }
  });
}

/** Runs one server CLI command (migrate, seed) against a database. */
export async function runServerCli(command, { databaseUrl, authSecret, label }) {
  return step(label, async () => {
    await runOrFail(process.execPath, [SERVER_CLI, command], {
      logName: `cli-${command}`,
      env: { DATABASE_URL: databaseUrl, LOOPYARD_AUTH_SECRET: authSecret },
      what: `node ${rel(SERVER_CLI)} ${command}`,
      hint:
        command === "migrate"
          ? "Check that the database is reachable (DATABASE_URL) and that drizzle/ holds the committed migrations."
          : "Check the seed's error above; seeding is idempotent, so run again once fixed.",
    });
  });
}

/** migrate, then seed the demo workspace. */
export async function migrateAndSeed(databaseUrl, authSecret) {
  await runServerCli("migrate", { databaseUrl, authSecret, label: "Migrations" });
  await runServerCli("seed", { databaseUrl, authSecret, label: "Demo seed" });
}


/** Default port of the local mail sink that `cli.js serve` starts when SMTP_URL is not set. */
export const DEFAULT_SMTP_SINK_PORT = 2525;

/** A TCP port on 127.0.0.1 that is free at the moment of asking. */
function freeLoopbackPort() {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.once("error", reject);
    server.listen(0, "127.0.0.1", () => {
      const address = server.address();
      server.close(() => resolve(typeof address === "object" && address ? address.port : 0));
    });
  });
}

/**
 * Where the app's mail goes, as environment for the server and a line for the banner: SMTP_URL
 * when set (a real server, no local sink), else the local sink that `cli.js serve` starts on
 * 127.0.0.1:LOOPYARD_SMTP_PORT, writing each message as an .eml file into .data/mail (npm start)
 * or .data/mail-test, emptied first (npm test, on a free port unless LOOPYARD_SMTP_PORT is set).
 */
export async function mailSettings(purpose) {
  if (process.env.SMTP_URL) {
    const shown = process.env.SMTP_URL.replace(/\/\/([^:/@]+):[^@]*@/, "//$1:***@");
    return { env: {}, line: `Mail goes to ${shown} (SMTP_URL); the Outbox page lists nothing.` };
  }
  const folder = process.env.LOOPYARD_MAIL_DIR || join(DATA_DIR, purpose === "test" ? "mail-test" : "mail");
  if (purpose === "test") rmSync(folder, { recursive: true, force: true });
  mkdirSync(folder, { recursive: true });
  const port = process.env.LOOPYARD_SMTP_PORT || String(purpose === "test" ? await freeLoopbackPort() : DEFAULT_SMTP_SINK_PORT);
  return {
    env: { LOOPYARD_SMTP_PORT: port, LOOPYARD_MAIL_DIR: folder },
    line: `Mail: local sink on smtp://127.0.0.1:${port}; the outbox is ${rel(folder)}/ (one .eml per message; admins: Outbox page).`,
  };
}
