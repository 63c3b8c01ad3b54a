#!/usr/bin/env node
/**
 * Command-line entry of the Loopyard server:
 *
 *   node packages/server/dist/cli.js migrate   apply pending database migrations
 *   node packages/server/dist/cli.js seed      create the demo workspace (idempotent) and print its sign-ins
 *   node packages/server/dist/cli.js serve     serve the API and the built web app (with an embedded sweep worker)
 *   node packages/server/dist/cli.js worker    work on sweep chunks only (any host pointing at the same DATABASE_URL)
 *
 * Environment: DATABASE_URL, PORT, HOST, LOOPYARD_AUTH_SECRET, LOOPYARD_PUBLIC_URL, LOOPYARD_WEB_DIST,
 * LOOPYARD_MIGRATIONS_DIR, LOOPYARD_TRUSTED_ORIGINS (comma-separated extra origins, e.g. a Vite dev server),
 * LOOPYARD_EMBEDDED_WORKER (0: serve without a worker), LOOPYARD_WORKER_THREADS, LOOPYARD_CHUNK_EXPIRE_SECONDS,
 * LOOPYARD_MAX_CANDIDATES, LOOPYARD_MAX_CONCURRENT_SWEEPS; mail: SMTP_URL (a real server), else the local sink
 * that `serve` starts on 127.0.0.1:LOOPYARD_SMTP_PORT (default 2525) writing into LOOPYARD_MAIL_DIR
 * (default .data/mail), LOOPYARD_MAIL_FROM, LOOPYARD_MAIL_RETRY_DELAY_SECONDS.
 */
import type { Server } from "node:http";
import { createApp } from "./app.js";
import { installCrashGuard } from "./http/crash-guard.js";
import { configFromEnv, ConfigError, DEFAULT_DATABASE_URL, defaultMigrationsFolder } from "./config.js";
import { createAuth } from "./auth/auth.js";
import { createDatabase } from "./db/database.js";
import { runMigrations } from "./db/migrate.js";
import { DEMO_PASSWORD, DEMO_USERS, DEMO_WORKSPACE, seedDemo } from "./seed/demo-seed.js";
import { createSweepJobSystem } from "./jobs/sweep-job-system.js";
import { chunkExpireSecondsFromEnv, startJobQueue } from "./jobs/job-queue.js";
import { resumeSweepJobs } from "./sweeps/sweep-jobs.js";
import { startSweepWorker } from "./workers/sweep-worker.js";
import { createComparisonJobSystem } from "./comparisons/comparison-job-system.js";
import { seedDemoComparison } from "./comparisons/comparison-demo.js";
import { startMailSink, type MailSink } from "./mail/mail-sink.js";
import { createMailSystem } from "./mail/mail-system.js";
import { seedDemoDecisions } from "./decisions/decision-demo.js";
import { createDecisionMailer } from "./decisions/decision-mailer.js";

const USAGE = "Usage: node packages/server/dist/cli.js <migrate|seed|serve|worker>";

/** Connection string with the password hidden, for messages. */
function redact(url: string): string {
  return url.replace(/\/\/([^:/@]+):[^@]*@/, "//$1:***@");
}

async function migrateCommand(): Promise<void> {
  const databaseUrl = process.env.DATABASE_URL ?? DEFAULT_DATABASE_URL;
  const folder = defaultMigrationsFolder();
  await runMigrations(databaseUrl, folder);
  console.log(`Database ${redact(databaseUrl)} is up to date (migrations from ${folder}).`);
}

export function printDemoSignIns(publicUrl?: string): void {
  console.log(`Demo workspace: ${DEMO_WORKSPACE.name} (${DEMO_WORKSPACE.slug})${publicUrl ? ` at ${publicUrl}` : ""}`);
  console.log(`Demo sign-ins (password for all: ${DEMO_PASSWORD}):`);
  for (const user of DEMO_USERS) console.log(`  ${user.role.padEnd(8)} ${user.email.padEnd(24)} ${user.name}`);
}

async function seedCommand(): Promise<void> {
  const databaseUrl = process.env.DATABASE_URL ?? DEFAULT_DATABASE_URL;
  // Seeding creates no sessions anyone uses, so a throwaway secret is fine when none is given.
  const authSecret = process.env.LOOPYARD_AUTH_SECRET ?? "seed-only-secret-not-used-for-any-session-0000";
  const publicUrl = process.env.LOOPYARD_PUBLIC_URL ?? `http://127.0.0.1:${process.env.PORT ?? 4470}`;
  const database = createDatabase(databaseUrl, { max: 6 });
  // The demo sweeps run as jobs like any other; this process works them (and what else is pending) until they are done.
  const jobs = createSweepJobSystem(database.db, databaseUrl, { embeddedWorker: true, resume: false });
  try {
    const auth = createAuth(database.db, { authSecret, publicUrl });
    const report = await seedDemo(database.db, auth, jobs);
    // The demo comparison runs through the comparison queues, like any other.
    const comparisonCreated = await seedDemoComparison(database.db, databaseUrl);
    // The demo decisions go through the decision services; their mails are queued here and sent by `serve` (its sink keeps them in the outbox).
    const mail = createMailSystem(database.db, databaseUrl, null);
    let decisionsCreated = false;
    try {
      decisionsCreated = await seedDemoDecisions(database.db, createDecisionMailer(database.db, mail, publicUrl, null));
    } finally {
      await mail.close();
    }
    const changed = report.usersCreated + report.membershipsAdded + report.plantsCreated + Number(report.workspaceCreated) + report.sweepsCreated + Number(comparisonCreated) + Number(decisionsCreated);
    console.log(
      changed === 0
        ? "Demo data already present; nothing changed."
        : `Demo data seeded: ${report.usersCreated} users, ${report.membershipsAdded} memberships, ${report.plantsCreated} plants, ${report.sweepsCreated} sweeps, ${Number(comparisonCreated)} comparison, ${decisionsCreated ? "2 decisions" : "no decisions"}.`,
    );
    printDemoSignIns();
  } finally {
    await jobs.close();
    await database.close();
  }
}

async function serveCommand(): Promise<void> {
  installCrashGuard();
  const config = configFromEnv();
  // The local mail sink lives in the serving process when no SMTP_URL is given.
  let sink: MailSink | null = null;
  if (config.mail?.sink) {
    const { host, port, folder } = config.mail.sink;
    try {
      sink = await startMailSink({ host, port, folder });
      console.log(`Mail sink on smtp://${host}:${sink.port}; outbox folder ${folder}`);
    } catch (error) {
      const code = (error as { code?: string }).code;
      if (code !== "EADDRINUSE") throw error;
      console.warn(
        `Port ${port} is taken, so this server starts no mail sink; mail goes to whatever listens on ${host}:${port}. Set LOOPYARD_SMTP_PORT to a free port, or SMTP_URL to a real server.`,
      );
    }
  }
  const loopyard = createApp(config);
  const server: Server = await new Promise((resolve, reject) => {
    const listening = loopyard.app.listen(config.port, config.host, (error?: Error) => (error ? reject(error) : resolve(listening)));
  });
  const address = server.address();
  const port = typeof address === "object" && address ? address.port : config.port;
  console.log(`Loopyard is serving on http://${config.host}:${port} (open ${config.publicUrl})`);

  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`${signal} received; stopping after the current sweep chunk…`);
    server.close();
    server.closeAllConnections();
    loopyard
      .close()
      .then(() => sink?.close())
      .then(() => process.exit(0))
      .catch((error: unknown) => {
        console.error("Stopping failed:", error);
        process.exit(1);
      });
  };
  process.on("SIGINT", () => stop("SIGINT"));
  process.on("SIGTERM", () => stop("SIGTERM"));
}

/**
 * A worker process: pg-boss on DATABASE_URL, a piscina pool of LOOPYARD_WORKER_THREADS threads
 * (default: every core), enqueues what unfinished sweeps still need, then works chunks until
 * SIGINT/SIGTERM (running chunks finish first).
 */
async function workerCommand(): Promise<void> {
  installCrashGuard();
  const databaseUrl = process.env.DATABASE_URL ?? DEFAULT_DATABASE_URL;
  const threadsText = process.env.LOOPYARD_WORKER_THREADS;
  const threads = threadsText === undefined || threadsText === "" ? undefined : Number(threadsText);
  if (threads !== undefined && (!Number.isInteger(threads) || threads < 0)) {
    throw new ConfigError(`LOOPYARD_WORKER_THREADS must be a whole number ≥ 0; got "${threadsText}".`);
  }
  const database = createDatabase(databaseUrl, { max: 6 });
  const boss = await startJobQueue(databaseUrl, { expireSeconds: chunkExpireSecondsFromEnv() });
  const worker = await startSweepWorker(database.db, boss, threads === undefined ? {} : { threads });
  await resumeSweepJobs(database.db, boss);
  // Comparisons: their own queues and pool, resumed likewise.
  const comparisons = createComparisonJobSystem(database.db, databaseUrl, threads === undefined ? {} : { workerThreads: threads });
  await comparisons.ready;
  console.log(`Loopyard worker ${worker.id} is working sweep chunks with ${worker.threads} threads on ${redact(databaseUrl)}.`);
  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`${signal} received; finishing the running chunks…`);
    (async () => {
      await comparisons.close();
      await worker.close();
      await boss.stop({ graceful: true, timeout: 10_000, wait: true });
      await database.close();
    })()
      .then(() => process.exit(0))
      .catch((error: unknown) => {
        console.error("Stopping failed:", error);
        process.exit(1);
      });
  };
  process.on("SIGINT", () => stop("SIGINT"));
  process.on("SIGTERM", () => stop("SIGTERM"));
}

async function main(command: string | undefined): Promise<void> {
  switch (command) {
    case "migrate":
      return migrateCommand();
    case "seed":
      return seedCommand();
    case "serve":
      return serveCommand();
    case "worker":
      return workerCommand();
    default:
      console.error(USAGE);
      process.exitCode = 2;
  }
}

/** The first `code` found on an error or along its `cause` chain (drizzle wraps driver errors). */
function errorCode(error: unknown): string | undefined {
  for (let current = error, depth = 0; current && typeof current === "object" && depth < 5; depth += 1) {
    const { code, cause } = current as { code?: unknown; cause?: unknown };
    if (typeof code === "string") return code;
    current = cause;
  }
  return undefined;
}

/** A sentence that says what failed and how to fix it, for the errors people meet most. */
function explain(error: unknown): string | null {
  const database = redact(process.env.DATABASE_URL ?? DEFAULT_DATABASE_URL);
  if (error instanceof ConfigError) return `Configuration problem: ${error.message}`;
  switch (errorCode(error)) {
    case "ECONNREFUSED":
      return `Could not reach PostgreSQL at ${database}. Start the local cluster with npm start, or set DATABASE_URL to a running server.`;
    case "28P01":
      return `PostgreSQL refused the user name or password in DATABASE_URL (${database}).`;
    case "3D000":
      return `The database in DATABASE_URL (${database}) does not exist; create it (createdb) or let npm start create it.`;
    case "42P01":
      return `The database ${database} has no Loopyard tables yet; run: node packages/server/dist/cli.js migrate`;
    case "EADDRINUSE":
      return `Port ${process.env.PORT ?? 4470} is already in use; stop the other process or set PORT to a free port.`;
    default:
      return null;
  }
}

main(process.argv[2]).catch((error: unknown) => {
  const sentence = explain(error);
  if (sentence) console.error(sentence);
  else console.error(`loopyard ${process.argv[2] ?? ""} failed:`, error);
  process.exitCode = 1;
});
