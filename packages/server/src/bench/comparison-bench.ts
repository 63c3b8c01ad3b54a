// `npm run bench` (not a test), end to end: one comparison through the queues. The B1 plant
// 1/(s+1)³ as a family of 5 variants (gain 1, 1.2, 0.8; time constants 1.2 s and 0.8 s), a PID with
// derivative filter (tf = kd/(10·kp)) over kp ∈ [0.2, 10], ki ∈ [0.05, 5] (log axes), kd ∈ [0, 5],
// a unit setpoint step over 30 s at dt = 0.01 s, worst case over the family; four contenders (IAE,
// ITAE, ISE and J with r = 0.1) judged on overshoot, settling time, peak |u| and Ms with Ms ≤ 2,
// the default budget (256 pre-scan points, 3 starts of at most 120 evaluations per contender, the
// stability check). Started over HTTP on a scratch database (created and dropped here on
// DATABASE_URL's server) and run by the embedded worker (pg-boss, a piscina pool of every core,
// PostgreSQL). Prints the time from the POST to the finished comparison and its phases.
import { randomBytes } from "node:crypto";
import { createServer } from "node:http";
import type { AddressInfo } from "node:net";
import { availableParallelism, cpus, loadavg } from "node:os";
import pg from "pg";
import { createApp } from "../app.js";
import { DEFAULT_DATABASE_URL, defaultMigrationsFolder } from "../config.js";
import { runMigrations } from "../db/migrate.js";

/** The target for this comparison, POST to finished [s]. */
const TARGET_SECONDS = 10;
const RUNS = Number(process.env.LOOPYARD_BENCH_COMPARISON_RUNS ?? 2);

const VARIANTS = [
  { label: "B1 nominal", model: { kind: "transfer-function", num: [1], den: [1, 3, 3, 1], delay: 0 } },
  { label: "gain 1.2", model: { kind: "transfer-function", num: [1.2], den: [1, 3, 3, 1], delay: 0 } },
  { label: "gain 0.8", model: { kind: "transfer-function", num: [0.8], den: [1, 3, 3, 1], delay: 0 } },
  // (1.2s + 1)³ and (0.8s + 1)³ expanded.
  { label: "tau 1.2 s", model: { kind: "transfer-function", num: [1], den: [1.728, 4.32, 3.6, 1], delay: 0 } },
  { label: "tau 0.8 s", model: { kind: "transfer-function", num: [1], den: [0.512, 1.92, 2.4, 1], delay: 0 } },
] as const;

function comparisonInput(name: string, revisions: readonly string[]) {
  return {
    name,
    family: { name: "B1 family", variants: revisions.map((plantRevisionId, i) => ({ plantRevisionId, label: VARIANTS[i]?.label })) },
    structure: "pid",
    ranges: { kp: { min: 0.2, max: 10, scale: "log" }, ki: { min: 0.05, max: 5, scale: "log" }, kd: { min: 0, max: 5 } },
    filter: { mode: "ratio", n: 10 },
    scenario: { kind: "setpoint-step", horizon: 30, dt: 0.01 },
    aggregate: { kind: "worst" },
    contenders: ["iae", "itae", "ise", { criterion: "quadratic", q: 1, r: 0.1, label: "J(r=0.1)" }],
    judges: ["overshoot", "settlingTime", "upeak", "ms"],
    constraints: { ms: { max: 2 } },
  };
}

const fmt = (n: number, digits = 1) => n.toLocaleString("en-US", { maximumFractionDigits: digits, minimumFractionDigits: digits });

function client(base: string) {
  const cookies = new Map<string, string>();
  return async (method: string, path: string, json?: unknown): Promise<{ status: number; body: any }> => {
    const headers: Record<string, string> = { origin: base };
    if (cookies.size) headers.cookie = [...cookies].map(([k, v]) => `${k}=${v}`).join("; ");
    if (json !== undefined) headers["content-type"] = "application/json";
    const response = await fetch(base + path, { method, headers, body: json === undefined ? undefined : JSON.stringify(json) });
    for (const line of response.headers.getSetCookie()) {
      const [pair = ""] = line.split(";");
      const at = pair.indexOf("=");
      cookies.set(pair.slice(0, at).trim(), pair.slice(at + 1).trim());
    }
    const text = await response.text();
    return { status: response.status, body: text ? JSON.parse(text) : null };
  };
}

async function main(): Promise<void> {
  const serverUrl = process.env.DATABASE_URL ?? DEFAULT_DATABASE_URL;
  const scratch = `loopyard_bench_cmp_${process.pid}`;
  const admin = new URL(serverUrl);
  admin.pathname = "/postgres";
  const maintenance = new pg.Client({ connectionString: admin.toString() });
  await maintenance.connect();
  await maintenance.query(`drop database if exists "${scratch}" with (force)`);
  await maintenance.query(`create database "${scratch}"`);
  const databaseUrl = new URL(serverUrl);
  databaseUrl.pathname = `/${scratch}`;
  console.log(`loopyard comparison bench — Node ${process.version}, ${availableParallelism()} CPUs (${cpus()[0]?.model ?? "unknown"}), scratch database ${scratch}`);
  let app: ReturnType<typeof createApp> | null = null;
  const http = createServer();
  const db = new pg.Client({ connectionString: databaseUrl.toString() });
  try {
    await runMigrations(databaseUrl.toString(), defaultMigrationsFolder());
    await new Promise<void>((resolve) => http.listen(0, "127.0.0.1", () => resolve()));
    const base = `http://127.0.0.1:${(http.address() as AddressInfo).port}`;
    app = createApp({ databaseUrl: databaseUrl.toString(), authSecret: randomBytes(32).toString("hex"), publicUrl: base, webDist: null });
    http.on("request", app.app);
    await app.jobs.ready;
    await app.comparisonJobs.ready;
    await db.connect();
    const call = client(base);
    if ((await call("POST", "/api/auth/sign-up/email", { name: "Bench Runner", email: "bench@halvard.example", password: "ember-bench-2026" })).status !== 200) throw new Error("sign-up failed");
    // Sign-up answers alike for new and taken addresses and signs nobody in: sign in next.
    if ((await call("POST", "/api/auth/sign-in/email", { email: "bench@halvard.example", password: "ember-bench-2026" })).status !== 200) throw new Error("sign-in failed");
    const slug: string = (await call("POST", "/api/workspaces", { name: "Halvard Thermoworks — comparison bench" })).body.slug;
    const revisions: string[] = [];
    for (const v of VARIANTS) {
      const plant = await call("POST", `/api/workspaces/${slug}/plants`, { name: v.label, unitsNote: "", model: v.model });
      if (plant.status !== 201) throw new Error(`creating ${v.label} answered ${plant.status}`);
      revisions.push(plant.body.revision.id);
    }
    for (let run = 1; run <= RUNS; run++) {
      const started = performance.now();
      // CPU of this whole process, worker threads included: what the run costs whatever else the machine does.
      const cpu = process.cpuUsage();
      const created = await call("POST", `/api/workspaces/${slug}/comparisons`, comparisonInput(`B1 family, four contenders, run ${run}`, revisions));
      if (created.status !== 201) throw new Error(`starting the comparison answered ${created.status}: ${JSON.stringify(created.body)}`);
      const id: string = created.body.id;
      let status: string = created.body.status;
      while (status === "queued" || status === "running") {
        await new Promise((resolve) => setTimeout(resolve, 50));
        status = (await call("GET", `/api/workspaces/${slug}/comparisons/${id}`)).body.status;
      }
      const seconds = (performance.now() - started) / 1000;
      const used = process.cpuUsage(cpu);
      const cpuSeconds = (used.user + used.system) / 1e6;
      if (status !== "finished") throw new Error(`the comparison stopped as ${status}`);
      // Phases from the stored completion times, relative to the comparison's creation.
      const phases = await db.query(
        `select extract(epoch from (select max(finished_at) from comparison_chunk where comparison_id = $1) - c.created_at) as prescan,
                extract(epoch from (select max(finished_at) from comparison_pick where comparison_id = $1) - c.created_at) as picks,
                extract(epoch from c.finished_at - c.created_at) as finished,
                (select count(*) from comparison_chunk where comparison_id = $1) as chunks,
                jsonb_array_length(c.result->'stability') as variations
         from comparison c where c.id = $1`,
        [id],
      );
      const p = phases.rows[0];
      console.log(
        `comparison run ${run}: ${fmt(seconds, 2)} s POST to finished (target ≤ ${TARGET_SECONDS} s: ${seconds <= TARGET_SECONDS ? "met" : "NOT met"}); ` +
          `pre-scan done at ${fmt(Number(p.prescan), 2)} s (256 points × 5 variants in ${p.chunks} chunks), picks at ${fmt(Number(p.picks), 2)} s, ` +
          `analysis with ${p.variations} stability variations at ${fmt(Number(p.finished), 2)} s; ${fmt(cpuSeconds, 2)} s of CPU in this process (${fmt(cpuSeconds / availableParallelism(), 2)} s per core), load average ${loadavg()[0]?.toFixed(1)} at the end`,
      );
    }
  } finally {
    await db.end().catch(() => undefined);
    if (app) await app.close();
    http.close();
    await maintenance.query(`drop database if exists "${scratch}" with (force)`);
    await maintenance.end();
  }
}

main().catch((error: unknown) => {
  console.error("comparison bench failed:", error);
  process.exitCode = 1;
});
