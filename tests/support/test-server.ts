/**
 * Boots the Loopyard API in-process on a free port against process.env.DATABASE_URL
 * (a migrated, seeded database: `npm test` prepares loopyard_test), for integration tests over real HTTP.
 */
import { randomBytes } from "node:crypto";
import { createServer } from "node:http";
import type { AddressInfo } from "node:net";
import { createApp, type MailConfig, type RateLimits } from "../../packages/server/src/index.js";

export interface TestServer {
  /** Base URL, e.g. http://127.0.0.1:39123 (no trailing slash). */
  url: string;
  close(): Promise<void>;
}

export interface TestServerOptions {
  /** Resume sweeps other processes left unfinished (default false, so each file only runs its own sweeps). */
  resumeSweeps?: boolean;
  /** Run the embedded sweep worker (default true); off when a test wants only external worker processes. */
  embeddedWorker?: boolean;
  /** Threads of the embedded worker's pool (default: every core). */
  workerThreads?: number;
  /** Per-workspace sweep limits (default 1,000,000 candidates, 3 concurrent sweeps). */
  limits?: { maxCandidates: number; maxConcurrentSweeps: number };
  /**
   * Limits of the sign-in endpoints. Default: TEST_RATE_LIMITS, far above what a test file's
   * sign-ups from one address need (the limits themselves are tested with DEFAULT_RATE_LIMITS).
   */
  rateLimits?: RateLimits;
  /** Another database URL (default process.env.DATABASE_URL), e.g. as a role the test restricts. */
  databaseUrl?: string;
  /** Chunk job expiry [s] (default 120). */
  chunkExpireSeconds?: number;
  /** How this server sends mail (e.g. to a test's own sink); default none: mail is queued, not sent. */
  mail?: MailConfig;
}

/** Every limit on, at 10,000 requests a minute: tests sign up many users from 127.0.0.1. */
export const TEST_RATE_LIMITS: RateLimits = {
  authPerIp: { windowSeconds: 60, max: 10_000 },
  failedSignInsPerAccount: { windowSeconds: 60, max: 10_000 },
  betterAuth: { windowSeconds: 60, max: 10_000 },
  betterAuthCredentials: { windowSeconds: 60, max: 10_000 },
};

export async function startTestServer(options: TestServerOptions = {}): Promise<TestServer> {
  const databaseUrl = options.databaseUrl ?? process.env.DATABASE_URL;
  if (!databaseUrl) {
    throw new Error("DATABASE_URL is not set; run the suite with `npm test`, or point DATABASE_URL at a migrated and seeded database.");
  }
  const server = createServer();
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(0, "127.0.0.1", () => resolve());
  });
  const { port } = server.address() as AddressInfo;
  const url = `http://127.0.0.1:${port}`;
  // The public URL (the trusted origin of better-auth) is only known once the port is.
  const loopyard = createApp({
    databaseUrl,
    authSecret: process.env.LOOPYARD_AUTH_SECRET ?? randomBytes(32).toString("hex"),
    publicUrl: url,
    webDist: null,
    resumeSweeps: options.resumeSweeps ?? false,
    embeddedWorker: options.embeddedWorker ?? true,
    ...(options.workerThreads === undefined ? {} : { workerThreads: options.workerThreads }),
    ...(options.limits === undefined ? {} : { limits: options.limits }),
    rateLimits: options.rateLimits ?? TEST_RATE_LIMITS,
    ...(options.chunkExpireSeconds === undefined ? {} : { chunkExpireSeconds: options.chunkExpireSeconds }),
    ...(options.mail === undefined ? {} : { mail: options.mail }),
    // One line per 5xx only; a passing run stays quiet.
    requestLogLevel: "warn",
  });
  // A database the test made unreachable keeps the job queues from starting; the API still answers.
  if (options.databaseUrl === undefined) {
    await loopyard.jobs.ready;
    await loopyard.comparisonJobs.ready;
  }
  server.on("request", loopyard.app);
  return {
    url,
    async close() {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await loopyard.close();
    },
  };
}
