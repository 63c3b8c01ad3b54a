/**
 * Every route of the app × every kind of caller, generated from the app's own route table
 * (routeTable walks Express's router stack), so that a route added tomorrow is in this matrix
 * the day it is added. Expected answers (common practice, after the OWASP Authorization Cheat
 * Sheet: deny by default, do not reveal what exists to those who may not see it):
 *
 * - anonymous → 401 on every route but /api/health;
 * - signed in but not a member → 404 on every workspace route, as for a workspace that does not exist;
 * - a member of another workspace using this workspace's ids in their own workspace → 404 on every
 *   route that names a plant or sweep, and never a byte of this workspace's data;
 * - a member below the route's role → 403; at or above it → 2xx for reads, an answer past the role
 *   check (not 401/403/404) for changes;
 * - never a 500.
 */
import { randomUUID } from "node:crypto";
import { ROLES, type Role } from "@loopyard/core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { routeTable, type RouteEntry } from "../../packages/server/src/index.js";
import { createApp } from "../../packages/server/src/index.js";
import { startTestServer, type TestServer } from "../support/test-server.js";
import { ApiClient, signedInClient } from "./api-client.js";
import { smallComparison, waitForComparison } from "./comparison-fixtures.js";
import { twoLagPlant, waitForSweep, workspaceWithTeam } from "./fixtures.js";

let server: TestServer;
let team: Awaited<ReturnType<typeof workspaceWithTeam>>;
let lead: ApiClient;
let nonMember: ApiClient;
let other: Awaited<ReturnType<typeof workspaceWithTeam>>;
let ids: { plantId: string; revisionId: string; sweepId: string; comparisonId: string; decisionId: string; plantName: string; sweepName: string; comparisonName: string; decisionTitle: string };

/** A 2 × 2 PI grid on the two-lag plant, 5 s at 10 ms: four candidates, done in a moment. */
function tinySweep(name: string, plantRevisionId: string) {
  return {
    name,
    plantRevisionId,
    structure: "pi",
    ranges: { kp: { min: 0.5, max: 2, count: 2 }, ki: { min: 0.2, max: 1, count: 2 } },
    scenario: { kind: "setpoint-step", horizon: 5, dt: 0.01 },
    criteria: ["iae", "effort"],
  };
}

/** A one-variant comparison of IAE against ISE for a PI on the two-lag plant, with the smallest budget: done in a moment. */
function tinyComparison(name: string, plantRevisionId: string) {
  return smallComparison(name, [plantRevisionId], {
    structure: "pi",
    ranges: { kp: { min: 0.2, max: 5, scale: "log" }, ki: { min: 0.1, max: 2, scale: "log" } },
    filter: undefined,
    scenario: { kind: "setpoint-step", horizon: 5, dt: 0.01 },
    contenders: ["iae", "ise"],
    judges: ["overshoot"],
    constraints: {},
    budget: { prescan: 16, starts: 1, evaluations: 20, stability: false },
  });
}

/** A proposal of the tiny sweep's first candidate (stable on the two-lag plant). */
function tinyProposal(title: string) {
  return { title, rationale: "The matrix's proposal: the first candidate of the tiny sweep.", source: { kind: "sweep-candidate", sweepId: ids.sweepId, candidateIndex: 0 } };
}

/** The API routes under test: all but better-auth's own (tested in auth and hostile-request tests). */
function apiRoutes(): RouteEntry[] {
  const app = createApp({
    databaseUrl: process.env.DATABASE_URL!,
    authSecret: "route-table-only-".padEnd(40, "x"),
    publicUrl: "http://127.0.0.1:1",
    embeddedWorker: false,
    resumeSweeps: false,
  });
  void app.close();
  return routeTable(app.app).filter((route) => route.path.startsWith("/api/") && !route.path.startsWith("/api/auth/"));
}

const ROUTES = apiRoutes();

/** A body for each state-changing route; a new one fails the matrix until it has one here. */
async function sampleBody(route: RouteEntry, revisionId: string): Promise<unknown> {
  switch (`${route.method} ${route.path}`) {
    case "POST /api/workspaces":
      return { name: `Matrix workspace ${randomUUID().slice(0, 8)}` };
    case "POST /api/workspaces/:slug/plants":
    case "POST /api/workspaces/:slug/plants/:plantId/revisions":
      return twoLagPlant("Matrix plant");
    case "POST /api/workspaces/:slug/sweeps":
      return tinySweep("Matrix sweep", revisionId);
    case "POST /api/workspaces/:slug/comparisons":
      return tinyComparison("Matrix comparison", revisionId);
    case "POST /api/workspaces/:slug/decisions":
    case "PUT /api/workspaces/:slug/decisions/:decisionId":
      return tinyProposal("Matrix proposal");
    case "POST /api/workspaces/:slug/decisions/:decisionId/return":
    case "POST /api/workspaces/:slug/decisions/:decisionId/comments":
      return { comment: "Matrix comment: check the margins on the second plate." };
    case "PUT /api/workspaces/:slug/decision-settings":
      return { allowSelfApproval: false };
    case "POST /api/workspaces/:slug/decisions/:decisionId/approve":
    case "POST /api/workspaces/:slug/decisions/:decisionId/withdraw":
    case "POST /api/workspaces/:slug/sweeps/:sweepId/cancel":
    case "POST /api/workspaces/:slug/comparisons/:comparisonId/cancel":
    case "DELETE /api/me/sessions/:sessionId":
      return undefined;
    case "POST /api/workspaces/:slug/members": {
      const { user } = await signedInClient(server.url, "Matrix joiner");
      return { email: user.email, role: "viewer" };
    }
    default:
      throw new Error(`No sample body for ${route.method} ${route.path}: add one to the route matrix.`);
  }
}

/** The route's path with this workspace's ids (or another slug, for the other workspace's member). */
function fill(path: string, slug: string): string {
  return path
    .replace(":slug", slug)
    .replace(":plantId", ids.plantId)
    .replace(":sweepId", ids.sweepId)
    .replace(":comparisonId", ids.comparisonId)
    .replace(":decisionId", ids.decisionId)
    .replace(":index", "0")
    .replace(":sessionId", randomUUID());
}

/** A query string for each GET route that needs one to answer 2xx (the rest answer without). */
function sampleQuery(route: RouteEntry): string {
  switch (`${route.method} ${route.path}`) {
    case "GET /api/workspaces/:slug/sweeps/:sweepId/candidates/:index/sheet":
    case "GET /api/workspaces/:slug/decisions/:decisionId/sheet":
      return "?sampleTime=0.01&method=tustin&format=q15";
    default:
      return "";
  }
}

async function call(client: ApiClient, route: RouteEntry, slug: string) {
  const body = route.method === "GET" ? undefined : await sampleBody(route, ids.revisionId);
  return client.request(route.method, fill(route.path, slug) + sampleQuery(route), body === undefined ? {} : { json: body });
}

/** Nothing of this workspace in an answer: its name, its plant's and sweep's names and ids (the slug is the caller's own typing). */
function expectNoLeak(body: unknown): void {
  const text = JSON.stringify(body ?? "");
  for (const secret of [team.name, ids.plantId, ids.revisionId, ids.sweepId, ids.comparisonId, ids.decisionId, ids.plantName, ids.sweepName, ids.comparisonName, ids.decisionTitle]) {
    expect(text).not.toContain(secret);
  }
}

beforeAll(async () => {
  server = await startTestServer({ limits: { maxCandidates: 1_000, maxConcurrentSweeps: 20 } });
  team = await workspaceWithTeam(server.url, "Matrix");
  const leadUser = await signedInClient(server.url, "Matrix lead");
  lead = leadUser.client;
  await team.admin.post(`/api/workspaces/${team.slug}/members`, { email: leadUser.user.email, role: "lead" });
  nonMember = (await signedInClient(server.url, "Matrix outsider")).client;
  other = await workspaceWithTeam(server.url, "Matrix other");
  const plantName = `Matrix secret plant ${randomUUID().slice(0, 8)}`;
  const plant = await team.engineer.post(`/api/workspaces/${team.slug}/plants`, twoLagPlant(plantName));
  const sweepName = `Matrix secret sweep ${randomUUID().slice(0, 8)}`;
  const sweep = await team.engineer.post(`/api/workspaces/${team.slug}/sweeps`, tinySweep(sweepName, plant.body.revision.id));
  expect(sweep.status).toBe(201);
  await waitForSweep(team.viewer, team.slug, sweep.body.id);
  const comparisonName = `Matrix secret comparison ${randomUUID().slice(0, 8)}`;
  const comparison = await team.engineer.post(`/api/workspaces/${team.slug}/comparisons`, tinyComparison(comparisonName, plant.body.revision.id));
  expect(comparison.status, JSON.stringify(comparison.body)).toBe(201);
  await waitForComparison(team.viewer, team.slug, comparison.body.id);
  ids = { plantId: plant.body.plant.id, revisionId: plant.body.revision.id, sweepId: sweep.body.id, comparisonId: comparison.body.id, decisionId: "", plantName, sweepName, comparisonName, decisionTitle: "" };
  // The engineer proposes, so that the lead's and the admin's approval pass the four-eyes rule.
  ids.decisionTitle = `Matrix secret proposal ${randomUUID().slice(0, 8)}`;
  const decision = await team.engineer.post(`/api/workspaces/${team.slug}/decisions`, tinyProposal(ids.decisionTitle));
  expect(decision.status, JSON.stringify(decision.body)).toBe(201);
  ids.decisionId = decision.body.id;
}, 120_000);

afterAll(async () => {
  await server?.close();
});

describe("route × role matrix", () => {
  it("the route table lists the API's routes, and every workspace route carries a role check", () => {
    expect(ROUTES.length).toBeGreaterThanOrEqual(18);
    for (const route of ROUTES) {
      if (route.path.includes(":slug")) expect({ route: `${route.method} ${route.path}`, role: route.role }).not.toEqual({ route: `${route.method} ${route.path}`, role: null });
    }
  });

  for (const route of ROUTES) {
    const name = `${route.method} ${route.path}`;
    const inWorkspace = route.path.includes(":slug");

    it(`${name}: anonymous → 401 (health alone answers)`, async () => {
      const response = await call(new ApiClient(server.url), route, "halvard-thermal");
      if (route.path === "/api/health") expect(response.status).toBe(200);
      else expect({ status: response.status, body: response.body }).toEqual({ status: 401, body: { error: { message: "Sign in to continue." } } });
    });

    if (!inWorkspace) {
      if (route.path === "/api/health") continue;
      it(`${name}: any signed-in user → an answer for themselves, never a 500`, async () => {
        for (const client of [team.viewer, nonMember]) {
          const response = await call(client, route, team.slug);
          expect(response.status, JSON.stringify(response.body)).toBeLessThan(500);
          expect(response.status).not.toBe(401);
        }
      });
      continue;
    }

    it(`${name}: signed-in non-member → 404 as for no such workspace, naming nothing`, async () => {
      const response = await call(nonMember, route, team.slug);
      expect(response.status).toBe(404);
      expectNoLeak(response.body);
    });

    it(`${name}: member of another workspace with this workspace's ids → 404 or their own data only`, async () => {
      const response = await call(other.admin, route, other.slug);
      expect(response.status, JSON.stringify(response.body)).toBeLessThan(500);
      if (/:plantId|:sweepId|:comparisonId|:decisionId/.test(route.path)) expect(response.status).toBe(404);
      if (route.method === "POST" && /\/(sweeps|comparisons)$/.test(route.path)) expect(response.status).toBeGreaterThanOrEqual(400);
      expectNoLeak(response.body);
    });

    for (const role of ROLES) {
      const needed = route.role as Role;
      const allowed = ROLES.indexOf(role) >= ROLES.indexOf(needed);
      it(`${name}: ${role} → ${allowed ? (route.method === "GET" ? "2xx" : "past the role check") : "403"}`, async () => {
        const client = { viewer: team.viewer, engineer: team.engineer, lead, admin: team.admin }[role];
        const response = await call(client, route, team.slug);
        expect(response.status, JSON.stringify(response.body)).toBeLessThan(500);
        if (!allowed) {
          expect(response.status).toBe(403);
          expect(response.body.error.message).toContain(`needs the ${needed} role`);
        } else if (route.method === "GET") {
          expect(response.status, JSON.stringify(response.body)).toBeGreaterThanOrEqual(200);
          expect(response.status).toBeLessThan(300);
        } else {
          expect([401, 403, 404]).not.toContain(response.status);
        }
      });
    }
  }
});
