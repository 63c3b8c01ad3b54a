// `npm run bench` (not a test), end to end: the B1 plant 1/(s+1)³ as a family of 5 variants (gain and
// time-constant variations, separate transfer functions) × 100 000 seeded random PID candidates,
// started over HTTP and run through pg-boss, the embedded worker's piscina pool and PostgreSQL, on a
// scratch database created and dropped here (on DATABASE_URL's server). Prints the total time,
// candidate·variants per second, the ratio to the bare engine rate measured in the same run
// (evaluateBatch in process and on the same pool size), the time to load the front and the
// candidate list, the time for the sweep's page to load and draw its front in headless chromium
// (front-page-timing.ts; skipped when chromium or the built web app is missing), and the bytes stored
// per candidate (pg_total_relation_size).
import { randomBytes } from "node:crypto";
import { existsSync } from "node:fs";
import { createServer } from "node:http";
import type { AddressInfo } from "node:net";
import { availableParallelism, cpus } from "node:os";
import { join as joinPath, resolve as resolvePath } from "node:path";
import pg from "pg";
import { DEFAULT_MAX_CONCURRENT_SWEEPS, MAX_SWEEP_CANDIDATES, POINTS_BINARY_TYPE, evaluateBatch, seededRandomDesign, sweepInputSchema, sweepStructure } from "@loopyard/core";
import type { Plant, Scenario, SweepDetailDto } from "@loopyard/core";
import { createEvaluationPool } from "@loopyard/core/pool";
import { createApp } from "../app.js";
import { DEFAULT_DATABASE_URL, REPO_ROOT, defaultMigrationsFolder } from "../config.js";
import { runMigrations } from "../db/migrate.js";
import { timeFrontPage } from "./front-page-timing.js";

const CANDIDATES = Number(process.env.LOOPYARD_BENCH_SWEEP_CANDIDATES ?? 100_000);
const SEED = 20_000;
/** Candidates of the bare pool measurement (as many as the engine benchmark, 20 000). */
const BARE_CANDIDATES = 20_000;
/** B1 and four variations: gain ±20 %, time constants ±20 % (each its own transfer function). */
const VARIANTS: { label: string; model: Plant }[] = [
  { label: "B1 nominal 1/(s+1)^3", model: { kind: "transfer-function", num: [1], den: [1, 3, 3, 1], delay: 0 } },
  { label: "gain 1.2", model: { kind: "transfer-function", num: [1.2], den: [1, 3, 3, 1], delay: 0 } },
  { label: "gain 0.8", model: { kind: "transfer-function", num: [0.8], den: [1, 3, 3, 1], delay: 0 } },
  // (1.2s+1)^3 = 1.728s³ + 4.32s² + 3.6s + 1; (0.8s+1)^3 = 0.512s³ + 1.92s² + 2.4s + 1.
  { label: "tau 1.2 s", model: { kind: "transfer-function", num: [1], den: [1.728, 4.32, 3.6, 1], delay: 0 } },
  { label: "tau 0.8 s", model: { kind: "transfer-function", num: [1], den: [0.512, 1.92, 2.4, 1], delay: 0 } },
];
const RANGES = { kp: { min: 0.2, max: 3 }, ki: { min: 0.05, max: 1.5 }, kd: { min: 0, max: 2 } };
const SCENARIO = { horizon: 30, dt: 0.01 };
const CRITERIA = ["iae", "ise", "itae", "effort"] as const;

/** The target for the sweep page: load and draw the front in under 2 s. */
const PAGE_TARGET_MS = 2000;
const WEB_DIST = process.env.LOOPYARD_WEB_DIST ? resolvePath(process.env.LOOPYARD_WEB_DIST) : joinPath(REPO_ROOT, "packages", "web", "dist");
const BENCH_EMAIL = "bench@halvard.example";
const BENCH_PASSWORD = "ember-bench-2026";
/** LOOPYARD_BENCH_KEEP=1 keeps the scratch database (to profile the page on it afterwards); drop it by hand. */
const KEEP_DATABASE = process.env.LOOPYARD_BENCH_KEEP === "1";

const fmt = (n: number, digits = 0) => n.toLocaleString("en-US", { maximumFractionDigits: digits, minimumFractionDigits: digits });

/** fetch with a cookie jar and the app's Origin, enough for better-auth and the API. */
function client(base: string) {
  const cookies = new Map<string, string>();
  return async (method: string, path: string, json?: unknown, accept?: string): Promise<{ status: number; body: any; bytes: number }> => {
    const headers: Record<string, string> = { origin: base };
    if (cookies.size) headers.cookie = [...cookies].map(([k, v]) => `${k}=${v}`).join("; ");
    if (json !== undefined) headers["content-type"] = "application/json";
    if (accept !== undefined) headers.accept = accept;
    const response = await fetch(base + path, { method, headers, body: json === undefined ? undefined : JSON.stringify(json) });
    for (const line of response.headers.getSetCookie()) {
      const [pair = ""] = line.split(";");
      const at = pair.indexOf("=");
      cookies.set(pair.slice(0, at).trim(), pair.slice(at + 1).trim());
    }
    if (accept !== undefined && accept !== "application/json") {
      const raw = await response.arrayBuffer();
      return { status: response.status, body: null, bytes: raw.byteLength };
    }
    const text = await response.text();
    return { status: response.status, body: text ? JSON.parse(text) : null, bytes: text.length };
  };
}

async function bareEngineRates(): Promise<{ inProcess: number; pool: number; threads: number }> {
  const definition = sweepInputSchema.parse({
    name: "bench",
    plantRevisionId: "00000000-0000-4000-8000-000000000000",
    structure: "pid",
    ranges: RANGES,
    scenario: SCENARIO,
    criteria: [...CRITERIA],
  });
  const structure = sweepStructure(definition);
  const family = VARIANTS.map((v) => v.model);
  const scenario = definition.scenario as Scenario;
  const sample = seededRandomDesign(structure.tunable.map((name) => ({ name, ...RANGES[name as keyof typeof RANGES] })), BARE_CANDIDATES, SEED);
  evaluateBatch(family, structure, sample.subarray(0, 300), scenario, [...CRITERIA]);
  let start = performance.now();
  evaluateBatch(family, structure, sample.subarray(0, 3 * 1000), scenario, [...CRITERIA]);
  const inProcess = (1000 * family.length) / ((performance.now() - start) / 1000);
  const threads = availableParallelism();
  const pool = createEvaluationPool({ workers: threads });
  try {
    await pool.evaluate({ family, structure, candidates: sample.slice(0, 3 * 1000), scenario, criteria: [...CRITERIA] });
    start = performance.now();
    await pool.evaluate({ family, structure, candidates: sample, scenario, criteria: [...CRITERIA] });
    return { inProcess, pool: (BARE_CANDIDATES * family.length) / ((performance.now() - start) / 1000), threads };
  } finally {
    await pool.close();
  }
}

async function main(): Promise<void> {
  const serverUrl = process.env.DATABASE_URL ?? DEFAULT_DATABASE_URL;
  const scratch = `loopyard_bench_${process.pid}`;
  const admin = new URL(serverUrl);
  admin.pathname = "/postgres";
  const maintenance = new pg.Client({ connectionString: admin.toString() });
  await maintenance.connect();
  await maintenance.query(`drop database if exists "${scratch}" with (force)`);
  await maintenance.query(`create database "${scratch}"`);
  const databaseUrl = new URL(serverUrl);
  databaseUrl.pathname = `/${scratch}`;
  console.log(`loopyard sweep bench — Node ${process.version}, ${availableParallelism()} CPUs (${cpus()[0]?.model ?? "unknown"}), scratch database ${scratch}`);
  let app: ReturnType<typeof createApp> | null = null;
  const http = createServer();
  try {
    await runMigrations(databaseUrl.toString(), defaultMigrationsFolder());
    const bare = await bareEngineRates();
    console.log(`bare engine (same run): in process ${fmt(bare.inProcess)} candidate·variants/s; pool of ${bare.threads} threads ${fmt(bare.pool)} candidate·variants/s`);

    await new Promise<void>((resolve) => http.listen(0, "127.0.0.1", () => resolve()));
    const base = `http://127.0.0.1:${(http.address() as AddressInfo).port}`;
    app = createApp({
      databaseUrl: databaseUrl.toString(),
      authSecret: randomBytes(32).toString("hex"),
      publicUrl: base,
      // The built web app, so the sweep's page can be timed in chromium at the end.
      webDist: existsSync(joinPath(WEB_DIST, "index.html")) ? WEB_DIST : null,
      limits: { maxCandidates: MAX_SWEEP_CANDIDATES, maxConcurrentSweeps: DEFAULT_MAX_CONCURRENT_SWEEPS },
    });
    http.on("request", app.app);
    await app.jobs.ready;
    const call = client(base);
    const signUp = await call("POST", "/api/auth/sign-up/email", { name: "Bench Runner", email: BENCH_EMAIL, password: BENCH_PASSWORD });
    if (signUp.status !== 200) throw new Error(`sign-up answered ${signUp.status}`);
    // Sign-up starts no session (a taken address must answer like a fresh one); sign in next.
    const signIn = await call("POST", "/api/auth/sign-in/email", { email: BENCH_EMAIL, password: BENCH_PASSWORD });
    if (signIn.status !== 200) throw new Error(`sign-in answered ${signIn.status}`);
    const workspace = await call("POST", "/api/workspaces", { name: "Halvard Thermoworks — bench" });
    const slug: string = workspace.body.slug;
    const revisions: string[] = [];
    for (const v of VARIANTS) {
      const plant = await call("POST", `/api/workspaces/${slug}/plants`, { name: v.label, unitsNote: "", model: v.model });
      if (plant.status !== 201) throw new Error(`creating ${v.label} answered ${plant.status}: ${JSON.stringify(plant.body)}`);
      revisions.push(plant.body.revision.id);
    }
    const started = performance.now();
    const created = await call("POST", `/api/workspaces/${slug}/sweeps`, {
      name: "B1 family × 100k",
      plantRevisionId: revisions[0],
      structure: "pid",
      ranges: RANGES,
      filter: { mode: "ratio", n: 10 },
      design: { kind: "random", count: CANDIDATES, seed: SEED },
      aggregate: { kind: "worst" },
      scenario: SCENARIO,
      criteria: [...CRITERIA],
      family: { name: "B1 family", variants: revisions.map((id, i) => ({ plantRevisionId: id, label: VARIANTS[i]?.label })) },
    });
    if (created.status !== 201) throw new Error(`starting the sweep answered ${created.status}: ${JSON.stringify(created.body)}`);
    const path = `/api/workspaces/${slug}/sweeps/${created.body.id}`;
    let sweep: SweepDetailDto = created.body;
    let lastPrint = 0;
    while (sweep.status === "queued" || sweep.status === "running") {
      // A browser page polls about this often.
      await new Promise((resolve) => setTimeout(resolve, 1000));
      sweep = (await call("GET", path)).body;
      if (performance.now() - lastPrint > 10_000) {
        lastPrint = performance.now();
        const p = sweep.progress;
        console.log(`  ${fmt(sweep.done)}/${fmt(sweep.total)}  rate ${p.ratePerSecond ? fmt(p.ratePerSecond) : "–"} candidates/s  ETA ${p.etaSeconds ? fmt(p.etaSeconds) : "–"} s  chunks ${p.chunksDone}/${p.chunksTotal}`);
      }
    }
    const seconds = (performance.now() - started) / 1000;
    const rate = (sweep.done * VARIANTS.length) / seconds;
    console.log(`sweep ${sweep.status}: ${fmt(sweep.done)} candidates × ${VARIANTS.length} variants in ${fmt(seconds, 1)} s, chunks failed ${sweep.progress.chunksFailed}`);
    console.log(`end to end: ${fmt(rate)} candidate·variants/s = ${fmt((100 * rate) / bare.pool, 0)} % of the bare pool rate, ${fmt((100 * rate) / bare.inProcess, 0)} % of one in-process thread`);

    let t = performance.now();
    const front = await call("GET", `${path}/front?x=iae&y=effort`);
    const frontMs = performance.now() - t;
    t = performance.now();
    const list = await call("GET", `${path}/candidates`);
    const listMs = performance.now() - t;
    console.log(`front endpoint: ${fmt(frontMs)} ms (${front.body.indices.length} on the front); candidate list: ${fmt(listMs)} ms (${fmt(list.body.candidates.length)} candidates, sampled ${list.body.sampled})`);
    t = performance.now();
    const cloud = await call("GET", `${path}/points?x=iae&y=effort`);
    const pointsMs = performance.now() - t;
    t = performance.now();
    const binary = await call("GET", `${path}/points?x=iae&y=effort`, undefined, POINTS_BINARY_TYPE);
    const binaryMs = performance.now() - t;
    console.log(
      `points endpoint: ${fmt(pointsMs)} ms as JSON (${fmt(cloud.body.indices.length)} points, ${fmt(JSON.stringify(cloud.body).length / 2 ** 20, 1)} MB, sampled ${cloud.body.sampled}); ` +
        `${fmt(binaryMs)} ms in binary as the page asks (${fmt(binary.bytes / 2 ** 20, 1)} MB, exact)`,
    );

    if (!existsSync(joinPath(WEB_DIST, "index.html"))) {
      console.log(`front page: skipped the page timing (no built web app at ${WEB_DIST}; build it with npx vite build in packages/web)`);
    } else {
      const page = await timeFrontPage({ base, email: BENCH_EMAIL, password: BENCH_PASSWORD, sweepPath: `/w/${slug}/sweeps/${created.body.id}` });
      if ("skipped" in page) {
        console.log(`front page: skipped the page timing (${page.skipped})`);
      } else {
        const list = (values: number[]) => values.map((ms) => fmt(ms)).join(", ");
        console.log(
          `front page: ${fmt(page.drawMs)} ms to load and draw, median of ${page.coldDrawMs.length} first visits (${list(page.coldDrawMs)} ms; ` +
            `${fmt(page.points)} points, ${page.webgl ? "scattergl" : "svg scatter"}; ${page.frontSize} on the front) — ` +
            `${page.drawMs < PAGE_TARGET_MS ? "under" : "NOT under"} the ${fmt(PAGE_TARGET_MS / 1000)} s target; reloaded with plotly cached: ${fmt(page.warmDrawMs)} ms`,
        );
        console.log(
          `front page painted (the frame holding the chart produced; software WebGL rasterises the cloud then): ${list(page.coldPaintMs)} ms on the first visits, ` +
            `${fmt(page.warmPaintMs)} ms reloaded`,
        );
      }
    }

    const db = new pg.Client({ connectionString: databaseUrl.toString() });
    await db.connect();
    const size = await db.query(
      "select pg_total_relation_size('candidate')::bigint as bytes, (select count(*) from candidate)::bigint as n, pg_total_relation_size('sweep_chunk')::bigint as chunk_bytes",
    );
    await db.end();
    const bytes = Number(size.rows[0].bytes);
    const n = Number(size.rows[0].n);
    console.log(
      `storage: candidate table ${fmt(bytes / 2 ** 20, 1)} MB for ${fmt(n)} candidates = ${fmt(bytes / n)} bytes per candidate (params, status, 4 aggregate scores, 5×4 per-variant scores, index); sweep_chunk ${fmt(Number(size.rows[0].chunk_bytes) / 1024)} kB`,
    );
  } finally {
    if (app) await app.close();
    http.close();
    const open = await maintenance.query("select application_name, state from pg_stat_activity where datname = $1", [scratch]);
    if (open.rows.length > 0) console.log(`(${open.rows.length} connections still open at the end: ${JSON.stringify(open.rows)})`);
    if (KEEP_DATABASE) console.log(`kept the scratch database ${scratch} (LOOPYARD_BENCH_KEEP=1); sign in as ${BENCH_EMAIL} / ${BENCH_PASSWORD}`);
    else await maintenance.query(`drop database if exists "${scratch}" with (force)`);
    await maintenance.end();
  }
}

main().catch((error: unknown) => {
  console.error("sweep bench failed:", error);
  process.exitCode = 1;
});
