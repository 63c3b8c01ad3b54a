#!/usr/bin/env node
// npm start: sets Loopyard up on this machine (idempotent) and serves API and web app from one process.
import { spawn } from "node:child_process";
import { existsSync } from "node:fs";
import { join } from "node:path";
import { DEMO_PASSWORD, DEMO_USERS, DEMO_WORKSPACE } from "./lib/demo.mjs";
import { httpPort, isHealthy } from "./lib/http.mjs";
import { REPO_ROOT, SERVER_CLI, WEB_DIST_DIR, rel } from "./lib/paths.mjs";
import { portAnswers } from "./lib/postgres.mjs";
import { buildAll, ensureAuthSecret, ensureDatabaseFor, ensureDependencies, mailSettings, migrateAndSeed } from "./lib/preflight.mjs";
import { StepError, failAndExit, say } from "./lib/step.mjs";

const HEALTH_TIMEOUT_MS = 60_000;
const HEALTH_POLL_MS = 250;

async function main() {
  const port = httpPort();
  const host = process.env.HOST || "127.0.0.1";
  const shownHost = host === "0.0.0.0" || host === "::" ? "127.0.0.1" : host;
  const url = `http://${shownHost}:${port}`;

  await assertPortFree(port, shownHost, url);
  await ensureDependencies();
  const { databaseUrl } = await ensureDatabaseFor("start");
  await buildAll();
  const authSecret = ensureAuthSecret();
  await migrateAndSeed(databaseUrl, authSecret);
  const mail = await mailSettings("start");

  await assertPortFree(port, shownHost, url); // once more: something may have taken it during the set-up
  if (!existsSync(join(WEB_DIST_DIR, "index.html"))) {
    say(`note: ${rel(WEB_DIST_DIR)}/index.html is missing, so only the API will be served`);
  }

  say(`Starting the server (node ${rel(SERVER_CLI)} serve) …`);
  const server = spawn(process.execPath, [SERVER_CLI, "serve"], {
    cwd: REPO_ROOT,
    stdio: "inherit",
    env: {
      ...process.env,
      DATABASE_URL: databaseUrl,
      LOOPYARD_AUTH_SECRET: authSecret,
      PORT: String(port),
      HOST: host,
      LOOPYARD_PUBLIC_URL: process.env.LOOPYARD_PUBLIC_URL || url,
      LOOPYARD_WEB_DIST: process.env.LOOPYARD_WEB_DIST || WEB_DIST_DIR,
      ...mail.env,
    },
  });
  let exited = false;
  const exitedPromise = new Promise((resolve) => {
    server.on("exit", (code, signal) => {
      exited = true;
      resolve({ code, signal });
    });
  });
  for (const signal of ["SIGINT", "SIGTERM", "SIGHUP"]) {
    process.on(signal, () => {
      if (!exited) server.kill(signal);
    });
  }

  const deadline = Date.now() + HEALTH_TIMEOUT_MS;
  while (!exited && !(await isHealthy(url))) {
    if (Date.now() > deadline) {
      server.kill("SIGTERM");
      throw new StepError(
        `The server did not answer GET ${url}/api/health within ${HEALTH_TIMEOUT_MS / 1000} s.`,
        "Read the server's output above; check DATABASE_URL and that nothing else holds the port.",
      );
    }
    await new Promise((resolve) => setTimeout(resolve, HEALTH_POLL_MS));
  }
  if (exited) {
    const { code, signal } = await exitedPromise;
    throw new StepError(
      `The server stopped before it was ready (${signal ? `signal ${signal}` : `exit code ${code}`}).`,
      "Read the server's output above for the cause, fix it and run npm start again.",
    );
  }

  printWelcome(url, mail.line);
  const { code, signal } = await exitedPromise;
  process.exit(signal ? 0 : (code ?? 0));
}

/** Fails early, before any set-up, when the app's port is already taken. */
async function assertPortFree(port, host, url) {
  if (!(await portAnswers(port, host))) return;
  const what = (await isHealthy(url)) ? "A Loopyard server already answers" : "Another program already listens";
  throw new StepError(`${what} on ${url}.`, `Stop it (Ctrl+C in its terminal), or serve on another port: PORT=${port + 1} npm start.`);
}

function printWelcome(url, mailLine) {
  const width = Math.max(...DEMO_USERS.map((u) => u.email.length));
  const lines = [
    "",
    `Loopyard is running at ${url}`,
    `Demo workspace: ${DEMO_WORKSPACE.name} (${DEMO_WORKSPACE.slug})`,
    `Demo sign-ins, all with the password ${DEMO_PASSWORD}:`,
    ...DEMO_USERS.map((u) => `  ${u.email.padEnd(width)}  ${u.role.padEnd(8)}  ${u.name}`),
    mailLine,
    "Stop the server with Ctrl+C; stop the database with npm run db:stop.",
    "",
  ];
  process.stdout.write(lines.join("\n") + "\n");
}

main().catch(failAndExit);
