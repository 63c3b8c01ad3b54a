/**
 * npm run bench:load — the API under load (autocannon), not a test. On a scratch database seeded
 * with the demo workspace, the server runs as `npm start` runs it (`cli.js serve`, its embedded
 * worker, request logs on) in its own process; autocannon signs in as the demo engineer and holds
 * 50 connections for 20 s on each of the workspace home, the plant list, a finished sweep's front
 * and its points (in the binary form the sweep page asks for), then on all four in turn while a
 * 50,000-candidate sweep runs. Prints one table with the targets of issue 11:
 * idle ≥ 1,000 requests/s on the plant list and ≥ 600 on the others, p99 < 250 ms;
 * with a sweep running p99 < 600 ms and no error.
 */
import { execFileSync, spawn, type ChildProcess } from "node:child_process";
import { readFileSync } from "node:fs";
import { randomBytes } from "node:crypto";
import { createServer } from "node:net";
import { availableParallelism, cpus } from "node:os";
import { join } from "node:path";
import autocannon from "autocannon";
import pg from "pg";
import { POINTS_BINARY_TYPE } from "@loopyard/core";
import { DEFAULT_DATABASE_URL, REPO_ROOT } from "../config.js";

const CONNECTIONS = Number(process.env.LOOPYARD_LOAD_CONNECTIONS ?? 50);
const DURATION_S = Number(process.env.LOOPYARD_LOAD_SECONDS ?? 20);
const RUNNING_SWEEP_CANDIDATES = 50_000;
const CLI = join(REPO_ROOT, "packages", "server", "dist", "cli.js");
const ENGINEER = { email: "priya@halvard.example", password: "ember-demo-2026" };

/** Clock ticks per second of /proc/<pid>/stat's CPU times (getconf CLK_TCK; 100 on Linux). */
const CLOCK_TICKS = (() => {
  try {
    return Number(execFileSync("getconf", ["CLK_TCK"], { encoding: "utf8" }).trim()) || 100;
  } catch {
    return 100;
  }
})();

/** CPU time the process has used so far [ms] (user + system, /proc/<pid>/stat fields 14 and 15). */
function cpuMs(pid: number): number {
  const fields = readFileSync(`/proc/${pid}/stat`, "utf8").split(") ")[1]!.split(" ");
  return ((Number(fields[11]) + Number(fields[12])) * 1000) / CLOCK_TICKS;
}

interface Row {
  what: string;
  /** Server CPU per answered request [ms]: what one request costs, whatever else the machine runs. */
  cpuPerRequest: number;
  requestsPerSecond: number;
  p50: number;
  p99: number;
  errors: number;
  non2xx: number;
  target: string;
  met: boolean;
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.once("error", reject);
    server.listen(0, "127.0.0.1", () => {
      const address = server.address();
      server.close(() => resolve(typeof address === "object" && address ? address.port : 0));
    });
  });
}

function run(args: string[], env: NodeJS.ProcessEnv, until?: string): Promise<ChildProcess> {
  return new Promise((resolve, reject) => {
    // LOOPYARD_LOAD_PROFILE=DIR writes a CPU profile of the server (node --cpu-prof) into DIR.
    const profile = args[0] === "serve" && process.env.LOOPYARD_LOAD_PROFILE ? ["--cpu-prof", "--cpu-prof-dir", process.env.LOOPYARD_LOAD_PROFILE] : [];
    const child = spawn(process.execPath, [...profile, CLI, ...args], { env, stdio: ["ignore", "pipe", "pipe"] });
    let log = "";
    const onData = (data: Buffer) => {
      log += data.toString();
      if (until && log.includes(until)) {
        // From here on the server's request log goes nowhere (as to a log collector), unread.
        child.stdout?.off("data", onData);
        child.stdout?.resume();
        resolve(child);
      }
    };
    child.stdout?.on("data", onData);
    child.stderr?.on("data", (data: Buffer) => (log += data.toString()));
    child.once("exit", (code) => (code === 0 && !until ? resolve(child) : reject(new Error(`cli ${args.join(" ")} exited with ${code}:\n${log.slice(-3000)}`))));
  });
}

/** Signs in over HTTP and returns the Cookie header. */
async function signIn(base: string): Promise<string> {
  const response = await fetch(`${base}/api/auth/sign-in/email`, {
    method: "POST",
    headers: { origin: base, "content-type": "application/json" },
    body: JSON.stringify(ENGINEER),
  });
  if (response.status !== 200) throw new Error(`sign-in answered ${response.status}: ${await response.text()}`);
  return response.headers
    .getSetCookie()
    .map((line) => line.split(";")[0])
    .join("; ");
}

async function load(base: string, headers: Record<string, string>, requests: { path: string; headers?: Record<string, string> }[]): Promise<autocannon.Result> {
  return autocannon({
    url: base,
    connections: CONNECTIONS,
    duration: DURATION_S,
    headers,
    requests: requests.map((r) => ({ method: "GET", path: r.path, ...(r.headers ? { headers: { ...headers, ...r.headers } } : {}) })),
  });
}

function row(what: string, result: autocannon.Result, cpu: number, minRate: number, maxP99: number): Row {
  const requestsPerSecond = result.requests.average;
  const p99 = result.latency.p99;
  const met = requestsPerSecond >= minRate && p99 < maxP99 && result.errors === 0 && result.non2xx === 0;
  const target = `${minRate > 0 ? `≥ ${minRate} req/s, ` : ""}p99 < ${maxP99} ms, no error`;
  return { what, cpuPerRequest: cpu / Math.max(1, result.requests.total), requestsPerSecond, p50: result.latency.p50, p99, errors: result.errors, non2xx: result.non2xx, target, met };
}

async function main(): Promise<void> {
  const serverUrl = process.env.DATABASE_URL ?? DEFAULT_DATABASE_URL;
  const scratch = `loopyard_load_${process.pid}`;
  const maintenanceUrl = new URL(serverUrl);
  maintenanceUrl.pathname = "/postgres";
  const maintenance = new pg.Client({ connectionString: maintenanceUrl.toString() });
  await maintenance.connect();
  await maintenance.query(`drop database if exists "${scratch}" with (force)`);
  await maintenance.query(`create database "${scratch}"`);
  const databaseUrl = new URL(serverUrl);
  databaseUrl.pathname = `/${scratch}`;
  const port = await freePort();
  const base = `http://127.0.0.1:${port}`;
  const env = {
    ...process.env,
    DATABASE_URL: databaseUrl.toString(),
    PORT: String(port),
    HOST: "127.0.0.1",
    LOOPYARD_PUBLIC_URL: base,
    LOOPYARD_AUTH_SECRET: randomBytes(32).toString("hex"),
    LOOPYARD_MAX_CANDIDATES: String(RUNNING_SWEEP_CANDIDATES),
  };
  console.log(`loopyard load bench — Node ${process.version}, ${availableParallelism()} CPUs (${cpus()[0]?.model ?? "unknown"}), scratch database ${scratch}`);
  console.log(`${CONNECTIONS} connections, ${DURATION_S} s per row; the server is cli.js serve with its embedded worker, as npm start runs it`);
  let server: ChildProcess | null = null;
  try {
    await run(["migrate"], env);
    await run(["seed"], env);
    server = await run(["serve"], env, "Loopyard is serving");
    if (server.pid === undefined) throw new Error("the server process has no pid");
    const cookie = await signIn(base);
    const headers = { cookie, origin: base, accept: "application/json" };
    const slug = "halvard-thermal";
    const sweeps = (await (await fetch(`${base}/api/workspaces/${slug}/sweeps`, { headers })).json()) as { id: string; status: string; total: number }[];
    const finished = sweeps.filter((s) => s.status === "finished").sort((a, b) => b.total - a.total)[0];
    if (!finished) throw new Error("the demo seed left no finished sweep");
    const sweepPath = `/api/workspaces/${slug}/sweeps/${finished.id}`;
    const targets = [
      { what: "workspace home", path: `/api/workspaces/${slug}`, minRate: 600 },
      { what: "plant list", path: `/api/workspaces/${slug}/plants`, minRate: 1_000 },
      { what: `front (${finished.total} candidates)`, path: `${sweepPath}/front?x=iae&y=effort`, minRate: 600 },
      { what: `points, binary (${finished.total} candidates)`, path: `${sweepPath}/points?x=iae&y=effort`, headers: { accept: POINTS_BINARY_TYPE }, minRate: 600 },
    ];
    // Warm-up: the server's start (pool threads loading the engine, JIT) is not what is measured.
    await new Promise((resolve) => setTimeout(resolve, 5_000));
    for (const target of targets) {
      await autocannon({ url: base, connections: 10, duration: 3, headers: { ...headers, ...target.headers }, requests: [{ method: "GET", path: target.path }] });
    }
    const rows: Row[] = [];
    for (const target of targets) {
      const before = cpuMs(server.pid!);
      const result = await load(base, headers, [{ path: target.path, ...(target.headers ? { headers: target.headers } : {}) }]);
      rows.push(row(`idle: ${target.what}`, result, cpuMs(server.pid!) - before, target.minRate, 250));
    }

    // The same four in turn while a 50,000-candidate sweep runs on the embedded worker.
    const plants = (await (await fetch(`${base}/api/workspaces/${slug}/plants`, { headers })).json()) as { latestRevision: { id: string; model: { kind: string } } }[];
    const linear = plants.find((p) => p.latestRevision.model.kind === "transfer-function");
    if (!linear) throw new Error("the demo seed has no transfer-function plant");
    const started = await fetch(`${base}/api/workspaces/${slug}/sweeps`, {
      method: "POST",
      headers: { ...headers, "content-type": "application/json" },
      body: JSON.stringify({
        name: "Load bench: 50,000 PID candidates",
        plantRevisionId: linear.latestRevision.id,
        structure: "pid",
        ranges: { kp: { min: 0.2, max: 5 }, ki: { min: 0.01, max: 1 }, kd: { min: 0, max: 5 } },
        design: { kind: "random", count: RUNNING_SWEEP_CANDIDATES, seed: 11 },
        scenario: { kind: "setpoint-step", horizon: 200, dt: 0.05 },
        criteria: ["iae", "ise", "effort"],
      }),
    });
    if (started.status !== 201) throw new Error(`starting the sweep answered ${started.status}: ${await started.text()}`);
    const running = (await started.json()) as { id: string };
    await new Promise((resolve) => setTimeout(resolve, 3_000));
    const before = cpuMs(server.pid!);
    const mixed = await load(base, headers, targets.map((t) => ({ path: t.path, ...(t.headers ? { headers: t.headers } : {}) })));
    rows.push(row("sweep running: the four in turn (CPU includes the sweep's threads)", mixed, cpuMs(server.pid!) - before, 0, 600));
    const progress = (await (await fetch(`${base}/api/workspaces/${slug}/sweeps/${running.id}`, { headers })).json()) as { done: number; total: number; status: string };
    console.log(`the running sweep was at ${progress.done} of ${progress.total} candidates (${progress.status}) when the mixed run ended`);

    const load1 = readFileSync("/proc/loadavg", "utf8").split(" ")[0];
    console.log("");
    console.log(`load average at the end: ${load1} on ${availableParallelism()} CPUs (other programs compete for the cores when it is above 2)`);
    console.log("| what | requests/s | p50 ms | p99 ms | errors | non-2xx | server CPU ms/request | requests/s per full core | target | met |");
    console.log("|---|---|---|---|---|---|---|---|---|---|");
    for (const r of rows) {
      const capacity = Math.round(1000 / Math.max(r.cpuPerRequest, 1e-6)).toLocaleString("en-US");
      console.log(
        `| ${r.what} | ${Math.round(r.requestsPerSecond).toLocaleString("en-US")} | ${r.p50} | ${r.p99} | ${r.errors} | ${r.non2xx} | ${r.cpuPerRequest.toFixed(2)} | ${capacity} | ${r.target} | ${r.met ? "yes" : "NO"} |`,
      );
    }
  } finally {
    server?.kill("SIGTERM");
    await new Promise((resolve) => setTimeout(resolve, 5_000));
    server?.kill("SIGKILL");
    await maintenance.query(`drop database if exists "${scratch}" with (force)`).catch(() => undefined);
    await maintenance.end();
  }
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
