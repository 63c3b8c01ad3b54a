// Global setup of the browser project: serves the BUILT app (API + web dist) with the server CLI on a
// free port against the test database that `npm test` prepared, and provides its URL as "appUrl".
// Tests read it with `inject("appUrl")`.
import { spawn } from "node:child_process";
import type { ChildProcess } from "node:child_process";
import { createWriteStream, existsSync, mkdirSync, readFileSync } from "node:fs";
import { createServer } from "node:net";
import { fileURLToPath } from "node:url";
import type {} from "vitest";
import type { TestProject } from "vitest/node";
import { dropQueuedMail } from "./mail-inbox.js";

declare module "vitest" {
  export interface ProvidedContext {
    /** Base URL of the app served for browser tests, e.g. http://127.0.0.1:41234 */
    appUrl: string;
  }
}

const repo = (path: string) => fileURLToPath(new URL(`../../${path}`, import.meta.url));
const SERVER_CLI = repo("packages/server/dist/cli.js");
const WEB_DIST = repo("packages/web/dist");
const LOG_FILE = repo(".data/logs/browser-server.log");
const READY_TIMEOUT_MS = 60_000;
const STOP_TIMEOUT_MS = 10_000;

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.once("error", reject);
    server.listen(0, "127.0.0.1", () => {
      const address = server.address();
      const port = typeof address === "object" && address ? address.port : 0;
      server.close(() => resolve(port));
    });
  });
}

async function healthy(url: string): Promise<boolean> {
  try {
    const response = await fetch(`${url}/api/health`, { signal: AbortSignal.timeout(2_000) });
    return response.ok;
  } catch {
    return false;
  }
}

function logTail(): string {
  try {
    return readFileSync(LOG_FILE, "utf8").trimEnd().split("\n").slice(-20).join("\n");
  } catch {
    return "(no server output)";
  }
}

function stop(child: ChildProcess): Promise<void> {
  if (child.exitCode !== null || child.signalCode !== null) return Promise.resolve();
  return new Promise((resolve) => {
    const timer = setTimeout(() => child.kill("SIGKILL"), STOP_TIMEOUT_MS);
    child.once("exit", () => {
      clearTimeout(timer);
      resolve();
    });
    child.kill("SIGTERM");
  });
}

export default async function setup(project: TestProject): Promise<() => Promise<void>> {
  const databaseUrl = process.env.DATABASE_URL;
  const authSecret = process.env.LOOPYARD_AUTH_SECRET;
  if (!databaseUrl || !authSecret) {
    throw new Error("Browser tests need DATABASE_URL and LOOPYARD_AUTH_SECRET: run them through `npm test` (it prepares the test database).");
  }
  if (!existsSync(SERVER_CLI) || !existsSync(`${WEB_DIST}/index.html`)) {
    throw new Error(`Browser tests need the built app (${SERVER_CLI} and ${WEB_DIST}/index.html): run \`npx turbo run build\` or \`npm test\`.`);
  }

  // Mail the integration pass queued without sending it would go first (one message a second); the
  // browser tests' server starts with an empty mail queue.
  await dropQueuedMail(databaseUrl);
  const port = await freePort();
  const url = `http://127.0.0.1:${port}`;
  mkdirSync(repo(".data/logs"), { recursive: true });
  const log = createWriteStream(LOG_FILE);
  const child = spawn(process.execPath, [SERVER_CLI, "serve"], {
    cwd: repo(""),
    stdio: ["ignore", "pipe", "pipe"],
    env: {
      ...process.env,
      DATABASE_URL: databaseUrl,
      LOOPYARD_AUTH_SECRET: authSecret,
      PORT: String(port),
      HOST: "127.0.0.1",
      LOOPYARD_PUBLIC_URL: url,
      LOOPYARD_WEB_DIST: WEB_DIST,
      // Every browser test signs in from 127.0.0.1; the shipped limit is tested in tests/integration/rate-limits.test.ts.
      LOOPYARD_AUTH_ATTEMPTS_PER_MINUTE: "1000",
    },
  });
  child.stdout?.pipe(log);
  child.stderr?.pipe(log);

  const deadline = Date.now() + READY_TIMEOUT_MS;
  while (!(await healthy(url))) {
    if (child.exitCode !== null || child.signalCode !== null) {
      throw new Error(`The app server for browser tests exited early (code ${child.exitCode}). Its output:\n${logTail()}`);
    }
    if (Date.now() > deadline) {
      await stop(child);
      throw new Error(`The app server for browser tests did not answer ${url}/api/health within ${READY_TIMEOUT_MS / 1000} s. Its output:\n${logTail()}`);
    }
    await new Promise((resolve) => setTimeout(resolve, 200));
  }

  project.provide("appUrl", url);
  return async () => {
    await stop(child);
    log.end();
  };
}
