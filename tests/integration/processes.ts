/**
 * Real processes for the job tests: `node packages/server/dist/cli.js worker|serve` on the test
 * database, started with child_process and always stopped by the test that started them.
 */
import { spawn, type ChildProcess } from "node:child_process";
import { createServer } from "node:net";
import { fileURLToPath } from "node:url";

const CLI = fileURLToPath(new URL("../../packages/server/dist/cli.js", import.meta.url));
/** Chunk expiry of the spawned processes [s]: a killed worker's chunk returns to the queue this soon. */
export const TEST_CHUNK_EXPIRE_SECONDS = 4;

export interface Spawned {
  child: ChildProcess;
  output: () => string;
  /** SIGTERM (or the given signal), then wait for the exit (SIGKILL after 10 s). */
  stop(signal?: NodeJS.Signals): Promise<void>;
}

const running = new Set<Spawned>();

/** Stops every process still running (afterAll / afterEach). */
export async function stopAll(): Promise<void> {
  await Promise.all([...running].map((p) => p.stop("SIGKILL")));
}

function start(command: string, env: Record<string, string>, readyText: string, timeoutMs = 20_000): Promise<Spawned> {
  const child = spawn(process.execPath, [CLI, command], {
    env: { ...process.env, LOOPYARD_CHUNK_EXPIRE_SECONDS: String(TEST_CHUNK_EXPIRE_SECONDS), ...env },
    stdio: ["ignore", "pipe", "pipe"],
  });
  let log = "";
  child.stdout?.on("data", (data: Buffer) => (log += data.toString()));
  child.stderr?.on("data", (data: Buffer) => (log += data.toString()));
  const exited = new Promise<void>((resolve) => child.once("exit", () => resolve()));
  const spawned: Spawned = {
    child,
    output: () => log,
    async stop(signal = "SIGTERM") {
      running.delete(spawned);
      if (child.exitCode === null && child.signalCode === null) {
        child.kill(signal);
        const timer = setTimeout(() => child.kill("SIGKILL"), 10_000);
        await exited;
        clearTimeout(timer);
      }
    },
  };
  running.add(spawned);
  return new Promise((resolve, reject) => {
    const deadline = setTimeout(() => {
      void spawned.stop("SIGKILL");
      reject(new Error(`${command} did not start within ${timeoutMs} ms:\n${log}`));
    }, timeoutMs);
    const check = () => {
      if (log.includes(readyText)) {
        clearTimeout(deadline);
        child.stdout?.off("data", check);
        resolve(spawned);
      }
    };
    child.stdout?.on("data", check);
    child.once("exit", (code) => {
      clearTimeout(deadline);
      if (!log.includes(readyText)) reject(new Error(`${command} exited with ${code}:\n${log}`));
    });
  });
}

/** A worker process (one pool thread unless told otherwise). */
export function startWorker(threads = 1): Promise<Spawned> {
  return start("worker", { LOOPYARD_WORKER_THREADS: String(threads) }, "is working sweep chunks");
}

/** A server process on `port` with its embedded worker (API only). */
export function startServerProcess(port: number, threads = 1): Promise<Spawned> {
  return start(
    "serve",
    {
      PORT: String(port),
      HOST: "127.0.0.1",
      LOOPYARD_WEB_DIST: "",
      LOOPYARD_WORKER_THREADS: String(threads),
      LOOPYARD_AUTH_SECRET: process.env.LOOPYARD_AUTH_SECRET ?? "integration-test-secret-0123456789abcdef",
      LOOPYARD_PUBLIC_URL: `http://127.0.0.1:${port}`,
      // Tests sign up several users from 127.0.0.1; the shipped limits are tested in rate-limits.test.ts.
      LOOPYARD_AUTH_ATTEMPTS_PER_MINUTE: "1000",
    },
    "Loopyard is serving",
  );
}

/** A TCP port free at the moment of asking. */
export function freePort(): Promise<number> {
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
