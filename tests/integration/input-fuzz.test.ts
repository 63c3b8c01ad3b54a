/**
 * Property-based fuzzing (fast-check) of every input the API parses, over real HTTP: each
 * state-changing route of the route table (so a new route is fuzzed the day it is added), the
 * sign-in endpoints, the query strings and the path parameters get arbitrary JSON, valid bodies with
 * one field replaced by anything (strings of every Unicode class, huge and tiny numbers, deep
 * nesting), and arbitrary path segments. Properties: never a 500, never an answer slower than 2 s,
 * /api/health answering within 200 ms throughout, no code executed (a sentinel on globalThis, which
 * the in-process server shares, stays unset). Common practice (property-based testing after Claessen
 * & Hughes, ICFP 2000); the time budgets are issue 11's.
 */
import { randomUUID } from "node:crypto";
import fc from "fast-check";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createApp, routeTable, type RouteEntry } from "../../packages/server/src/index.js";
import { startTestServer, type TestServer } from "../support/test-server.js";
import { ApiClient, freshUser, signedInClient } from "./api-client.js";
import { smallComparison } from "./comparison-fixtures.js";
import { twoLagPlant, waitForSweep, workspaceWithTeam } from "./fixtures.js";

const ANSWER_BUDGET_MS = 2_000;
const HEALTH_BUDGET_MS = 200;
const SENTINEL = "__loopyardFuzzRan";
/** Runs per route: enough to hit each field a few times, few enough to keep the suite fast. */
const RUNS = 25;

let server: TestServer;
let team: Awaited<ReturnType<typeof workspaceWithTeam>>;
let ids: { plantId: string; revisionId: string; sweepId: string; comparisonId: string; decisionId: string };
let healthWorst = 0;
let healthWorstDuring = "";
let phase = "set-up";
let healthTimer: NodeJS.Timeout | undefined;

const ROUTES: RouteEntry[] = (() => {
  const app = createApp({ databaseUrl: process.env.DATABASE_URL!, authSecret: "route-table-only-".padEnd(40, "x"), publicUrl: "http://127.0.0.1:1", embeddedWorker: false, resumeSweeps: false });
  void app.close();
  return routeTable(app.app).filter((route) => route.path.startsWith("/api/") && !route.path.startsWith("/api/auth/"));
})();

/** A valid body per state-changing route (the route matrix holds the same list). */
function validBody(route: RouteEntry): Record<string, unknown> | undefined {
  switch (`${route.method} ${route.path}`) {
    case "POST /api/workspaces":
      return { name: "Fuzz workspace" };
    case "POST /api/workspaces/:slug/plants":
    case "POST /api/workspaces/:slug/plants/:plantId/revisions":
      return twoLagPlant("Fuzz plant");
    case "POST /api/workspaces/:slug/sweeps":
      return {
        name: "Fuzz sweep",
        plantRevisionId: ids.revisionId,
        structure: "pi",
        ranges: { kp: { min: 0.5, max: 2, count: 2 }, ki: { min: 0.2, max: 1, count: 2 } },
        scenario: { kind: "setpoint-step", horizon: 5, dt: 0.01 },
        criteria: ["iae", "effort"],
      };
    case "POST /api/workspaces/:slug/comparisons":
      return smallComparison("Fuzz comparison", [ids.revisionId], {
        structure: "pi",
        ranges: { kp: { min: 0.2, max: 5, scale: "log" }, ki: { min: 0.1, max: 2, scale: "log" } },
        filter: undefined,
        scenario: { kind: "setpoint-step", horizon: 5, dt: 0.01 },
        contenders: ["iae", "ise"],
        judges: ["overshoot"],
        constraints: {},
        budget: { prescan: 16, starts: 1, evaluations: 20, stability: false },
      });
    case "POST /api/workspaces/:slug/members":
      return { email: "jon@halvard.example", role: "viewer" };
    case "POST /api/workspaces/:slug/decisions":
    case "PUT /api/workspaces/:slug/decisions/:decisionId":
      return { title: "Fuzz proposal", rationale: "The first candidate of the fuzz sweep.", source: { kind: "sweep-candidate", sweepId: ids.sweepId, candidateIndex: 0 } };
    case "POST /api/workspaces/:slug/decisions/:decisionId/return":
    case "POST /api/workspaces/:slug/decisions/:decisionId/comments":
      return { comment: "Fuzz comment." };
    case "PUT /api/workspaces/:slug/decision-settings":
      return { allowSelfApproval: false };
    case "POST /api/workspaces/:slug/decisions/:decisionId/approve":
    case "POST /api/workspaces/:slug/decisions/:decisionId/withdraw":
      return {};
    case "POST /api/workspaces/:slug/sweeps/:sweepId/cancel":
    case "POST /api/workspaces/:slug/comparisons/:comparisonId/cancel":
    case "DELETE /api/me/sessions/:sessionId":
      return {};
    default:
      throw new Error(`No valid body for ${route.method} ${route.path}: add one to the fuzzer.`);
  }
}

/** Anything JSON can hold, biased to what breaks parsers and databases. */
const hostileValue: fc.Arbitrary<unknown> = fc.oneof(
  fc.string({ unit: "binary", maxLength: 300 }),
  fc.string({ unit: "grapheme", maxLength: 100 }),
  fc.constantFrom("\u0000", "\ud800", "\u202e", "%00", "'; DROP TABLE plant; --", `globalThis.${SENTINEL}=1`, "k[999999]", "x".repeat(20_000)),
  fc.double(),
  fc.constantFrom(1e308, -1e308, 5e-324, 2 ** 31, 2 ** 53 + 1, -0, 0),
  fc.integer(),
  fc.boolean(),
  fc.constant(null),
  fc.jsonValue({ maxDepth: 8 }),
  fc.integer({ min: 30, max: 2_000 }).map((depth) => JSON.parse(`${"[".repeat(depth)}${"]".repeat(depth)}`)),
);

/** Every path to a leaf of a JSON value. */
function leafPaths(value: unknown, path: (string | number)[] = []): (string | number)[][] {
  if (Array.isArray(value)) return value.length === 0 ? [path] : value.flatMap((item, i) => leafPaths(item, [...path, i]));
  if (value && typeof value === "object") {
    const entries = Object.entries(value);
    return entries.length === 0 ? [path] : entries.flatMap(([key, item]) => leafPaths(item, [...path, key]));
  }
  return [path];
}

/** `body` with the value at `path` replaced (a deep copy). */
function replaced(body: unknown, path: (string | number)[], value: unknown): unknown {
  if (path.length === 0) return value;
  const copy: any = Array.isArray(body) ? [...body] : { ...(body as object) };
  const [head, ...rest] = path;
  copy[head as string] = replaced(copy[head as string], rest, value);
  return copy;
}

/** A valid body with one leaf (or one new field) replaced by a hostile value, or arbitrary JSON. */
function bodies(valid: Record<string, unknown>): fc.Arbitrary<unknown> {
  const paths = leafPaths(valid);
  return fc.oneof(
    fc.tuple(fc.constantFrom(...paths), hostileValue).map(([path, value]) => replaced(valid, path, value)),
    fc.tuple(fc.string({ maxLength: 20 }), hostileValue).map(([key, value]) => ({ ...valid, [key]: value })),
    fc.jsonValue({ maxDepth: 6 }),
  );
}

/** Times one request; fails on a 5xx or a slow answer. */
async function probe(client: ApiClient, method: string, path: string, body?: unknown): Promise<void> {
  const started = performance.now();
  const response = await client.request(method, path, body === undefined ? {} : { rawBody: JSON.stringify(body) });
  const took = performance.now() - started;
  expect(response.status, `${method} ${path} ${JSON.stringify(body)?.slice(0, 300)} → ${JSON.stringify(response.body)}`).toBeLessThan(500);
  expect(took, `${method} ${path} took ${took.toFixed(0)} ms`).toBeLessThan(ANSWER_BUDGET_MS);
  expect((globalThis as Record<string, unknown>)[SENTINEL]).toBeUndefined();
}

/** encodeURIComponent, or a percent-encoded lone surrogate when the text holds one (it cannot be encoded). */
function encode(text: string): string {
  try {
    return encodeURIComponent(text);
  } catch {
    return "%ED%A0%80";
  }
}

function fill(path: string): string {
  return path.replace(":slug", team.slug).replace(":plantId", ids.plantId).replace(":sweepId", ids.sweepId).replace(":comparisonId", ids.comparisonId).replace(":decisionId", ids.decisionId).replace(":index", "0").replace(":sessionId", randomUUID());
}

beforeAll(async () => {
  server = await startTestServer({ limits: { maxCandidates: 1_000, maxConcurrentSweeps: 3 } });
  team = await workspaceWithTeam(server.url, "Fuzz");
  const plant = await team.engineer.post(`/api/workspaces/${team.slug}/plants`, twoLagPlant("Fuzz base"));
  ids = { plantId: plant.body.plant.id, revisionId: plant.body.revision.id, sweepId: "", comparisonId: "", decisionId: "" };
  const sweep = await team.engineer.post(`/api/workspaces/${team.slug}/sweeps`, validBody({ method: "POST", path: "/api/workspaces/:slug/sweeps", role: "engineer" }));
  ids.sweepId = sweep.body.id;
  const comparison = await team.engineer.post(`/api/workspaces/${team.slug}/comparisons`, validBody({ method: "POST", path: "/api/workspaces/:slug/comparisons", role: "engineer" }));
  ids.comparisonId = comparison.body.id;
  await waitForSweep(team.viewer, team.slug, ids.sweepId);
  const decision = await team.engineer.post(`/api/workspaces/${team.slug}/decisions`, validBody({ method: "POST", path: "/api/workspaces/:slug/decisions", role: "engineer" }));
  ids.decisionId = decision.body.id;
  // /api/health polled all along: its worst time is checked at the end.
  const health = new ApiClient(server.url);
  healthTimer = setInterval(() => {
    const started = performance.now();
    void health.get("/api/health").then(() => {
      const took = performance.now() - started;
      if (took > healthWorst) [healthWorst, healthWorstDuring] = [took, phase];
    });
  }, 100);
}, 120_000);

afterAll(async () => {
  if (healthTimer) clearInterval(healthTimer);
  await server?.close();
});

describe("fuzzing every input over HTTP", () => {
  for (const route of ROUTES.filter((r) => r.method !== "GET")) {
    it(`${route.method} ${route.path}: hostile bodies → never a 5xx, never over 2 s`, async () => {
      phase = `${route.method} ${route.path}`;
      // An admin passes every role check, so the body is what gets tested.
      await fc.assert(
        fc.asyncProperty(bodies(validBody(route)!), (body) => probe(team.admin, route.method, fill(route.path), body)),
        { numRuns: RUNS, seed: 1_100 },
      );
    }, 120_000);
  }

  for (const path of ["/api/auth/sign-up/email", "/api/auth/sign-in/email", "/api/auth/update-user"]) {
    it(`POST ${path}: hostile bodies → never a 5xx, never over 2 s`, async () => {
      phase = `POST ${path}`;
      const user = freshUser("Fuzz auth");
      const { client } = await signedInClient(server.url, "Fuzz auth user");
      await fc.assert(
        fc.asyncProperty(bodies({ name: user.name, email: user.email, password: user.password }), (body) =>
          probe(path.endsWith("update-user") ? client : new ApiClient(server.url), "POST", path, body),
        ),
        // Fewer runs: each sign-up or sign-in hashes a password (scrypt), about 0.1 s of CPU.
        { numRuns: 10, seed: 1_101 },
      );
    }, 180_000);
  }

  it("GET routes: hostile query strings and path segments → never a 5xx, never over 2 s", async () => {
    phase = "GET routes";
    const getRoutes = ROUTES.filter((r) => r.method === "GET");
    const segment = fc.oneof(fc.string({ unit: "binary", maxLength: 60 }), fc.constantFrom("2147483648", "-1", "1e400", "%", "..", "%2e%2e", randomUUID()));
    await fc.assert(
      fc.asyncProperty(
        fc.constantFrom(...getRoutes),
        fc.constantFrom(":slug", ":plantId", ":sweepId", ":comparisonId", ":decisionId", ":index", "?"),
        segment,
        segment,
        async (route, where, value, query) => {
          const encoded = encode(value);
          const path = where === "?" ? `${fill(route.path)}?x=${encode(query)}&y=${encoded}&criteria=${encoded}&revision=${encoded}&sampleTime=${encode(query)}&method=${encoded}&format=${encoded}` : fill(route.path.replace(where, encoded));
          await probe(team.viewer, "GET", path);
        },
      ),
      { numRuns: 150, seed: 1_102 },
    );
  });

  it("throughout, /api/health answered within 200 ms", () => {
    expect(healthWorst).toBeGreaterThan(0);
    expect(healthWorst, `worst during ${healthWorstDuring}`).toBeLessThan(HEALTH_BUDGET_MS);
  });
});
