import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "drizzle-orm";
import { createApp, DEMO_LOAD_SWEEP_NAME, DEMO_PASSWORD, DEMO_SWEEP_NAME, DEMO_USERS, DEMO_WORKSPACE, seedDemo } from "../../packages/server/src/index.js";
import { DEMO_DECISION_TITLE, DEMO_PROPOSAL_TITLE } from "../../packages/server/src/decisions/decision-demo.js";
import { DEMO_COMPARISON_NAME } from "../../packages/server/src/comparisons/comparison-demo.js";
import type { LoopyardApp } from "../../packages/server/src/index.js";
import { startTestServer, type TestServer } from "../support/test-server.js";
import { ApiClient } from "./api-client.js";

let server: TestServer;
let loopyard: LoopyardApp;

beforeAll(async () => {
  server = await startTestServer();
  loopyard = createApp({
    databaseUrl: process.env.DATABASE_URL as string,
    authSecret: "integration-seed-check-secret-0123456789abcdef",
    publicUrl: server.url,
    resumeSweeps: false,
  });
});

afterAll(async () => {
  await loopyard?.close();
  await server?.close();
});

describe("demo seed", () => {
  it("when the seed runs on a seeded database, then it changes nothing", async () => {
    const report = await seedDemo(loopyard.db, loopyard.auth, loopyard.jobs);
    expect(report).toEqual({ usersCreated: 0, workspaceCreated: false, membershipsAdded: 0, plantsCreated: 0, sweepsCreated: 0 });
  });

  it("when each demo user signs in with the demo password, then they hold their documented role", async () => {
    for (const demo of DEMO_USERS) {
      const client = new ApiClient(server.url);
      expect((await client.signIn(demo.email, DEMO_PASSWORD)).status).toBe(200);
      const home = await client.get(`/api/workspaces/${DEMO_WORKSPACE.slug}`);
      expect(home.status).toBe(200);
      expect(home.body.workspace.name).toBe(DEMO_WORKSPACE.name);
      expect(home.body.role).toBe(demo.role);
    }
  });

  it("when the demo library is read, then it holds the three Ember plates and a finished sweep on Ember 200", async () => {
    const jon = new ApiClient(server.url);
    await jon.signIn("jon@halvard.example", DEMO_PASSWORD);
    const plants = await jon.get(`/api/workspaces/${DEMO_WORKSPACE.slug}/plants`);
    expect(plants.body.map((p: { name: string }) => p.name)).toEqual(
      expect.arrayContaining(["Ember 200 plate", "Ember 400 plate", "Ember 800 plate"]),
    );
    const ember800 = plants.body.find((p: { name: string }) => p.name === "Ember 800 plate");
    expect(ember800.latestRevision.model).toEqual({ kind: "transfer-function", num: [1.5], den: [80, 24, 1], delay: 1 });

    const sweeps = await jon.get(`/api/workspaces/${DEMO_WORKSPACE.slug}/sweeps`);
    const demo = sweeps.body.find((s: { name: string }) => s.name === DEMO_SWEEP_NAME);
    expect(demo).toMatchObject({ status: "finished", total: 144, done: 144, plant: { name: "Ember 200 plate", revisionNumber: 1 } });
    const front = await jon.get(`/api/workspaces/${DEMO_WORKSPACE.slug}/sweeps/${demo.id}/front?x=iae&y=effort`);
    expect(front.status).toBe(200);
    expect(front.body.indices.length).toBeGreaterThan(1);
  });

  it("when the demo library is read, then it also holds a state-space and a nonlinear Ember plate with a finished PI load-step sweep", async () => {
    const jon = new ApiClient(server.url);
    await jon.signIn("jon@halvard.example", DEMO_PASSWORD);
    const plants = await jon.get(`/api/workspaces/${DEMO_WORKSPACE.slug}/plants`);
    const kinds = Object.fromEntries(plants.body.map((p: { name: string; kind: string }) => [p.name, p.kind]));
    expect(kinds).toMatchObject({ "Ember 600 plate (state-space)": "state-space", "Ember 800 plate (radiative)": "nonlinear" });

    const radiative = plants.body.find((p: { name: string }) => p.name === "Ember 800 plate (radiative)");
    const detail = await jon.get(`/api/workspaces/${DEMO_WORKSPACE.slug}/plants/${radiative.id}`);
    expect(detail.status).toBe(200);
    expect(detail.body.polesNote).not.toBeNull();
    // Linearisation at T = 0: d(dT/dt)/dT = −(h + 4·e·Ta³)/c = −(2 + 4·2e-9·293³)/400 (closed form).
    expect(detail.body.poles[0].re).toBeCloseTo(-(2 + 4 * 2e-9 * 293 ** 3) / 400, 6);
    // Full power heats the plate: the open-loop step rises and stays finite.
    const y = detail.body.step.y as number[];
    expect(y[y.length - 1]).toBeGreaterThan(100);

    const sweeps = await jon.get(`/api/workspaces/${DEMO_WORKSPACE.slug}/sweeps`);
    const load = sweeps.body.find((s: { name: string }) => s.name === DEMO_LOAD_SWEEP_NAME);
    expect(load).toMatchObject({ status: "finished", total: 64, done: 64, plant: { name: "Ember 600 plate (state-space)", kind: "state-space" } });
    const sweep = await jon.get(`/api/workspaces/${DEMO_WORKSPACE.slug}/sweeps/${load.id}`);
    expect(sweep.body.definition).toMatchObject({ structure: "pi", scenario: { kind: "load-step" } });
    expect(sweep.body.parameters).toEqual(["kp", "ki"]);
  });

  it("when Tomas (lead) opens the demo, then an approved Ember line decision stands and a proposal from the comparison waits for him, with two comments and their mails queued", async () => {
    const tomas = new ApiClient(server.url);
    await tomas.signIn("tomas@halvard.example", DEMO_PASSWORD);
    const base = `/api/workspaces/${DEMO_WORKSPACE.slug}/decisions`;
    const approved = (await tomas.get(`${base}?state=approved`)).body.find((d: { title: string }) => d.title === DEMO_DECISION_TITLE);
    expect(approved).toMatchObject({ state: "approved", supersededBy: null, proposedBy: { email: "priya@halvard.example" }, approvedBy: { email: "tomas@halvard.example" } });
    expect(approved.family.variants.map((v: { plantName: string }) => v.plantName)).toEqual(["Ember 200 plate", "Ember 400 plate", "Ember 800 plate"]);
    const waiting = await tomas.get(`${base}/waiting`);
    const proposal = waiting.body.toApprove.find((d: { title: string }) => d.title === DEMO_PROPOSAL_TITLE);
    expect(proposal).toMatchObject({ state: "proposed", source: { kind: "comparison-pick" }, commentCount: 2 });
    expect(proposal.family.key).toBe(approved.family.key);
    const detail = await tomas.get(`${base}/${proposal.id}`);
    expect(detail.body.comments.map((c: { author: { email: string } }) => c.author.email)).toEqual(["tomas@halvard.example", "priya@halvard.example"]);
    expect(detail.body.can).toMatchObject({ canApprove: true, canReturn: true });
    expect(detail.body.record.comparison.name).toBe(DEMO_COMPARISON_NAME);

    // The mails those steps caused, on the mail queue (a serving process sends them into the outbox).
    const jobs = await loopyard.db.execute(sql`select data from pgboss.job where name = 'mail-send'`);
    const mails = (jobs.rows as { data: { to: string[]; kind: string; link: string } }[]).map((r) => r.data).filter((m) => m.link.endsWith(`/decisions/${proposal.id}`) || m.link.endsWith(`/decisions/${approved.id}`));
    const summary = mails.map((m) => `${m.kind} → ${m.to.join(",")}`).sort();
    expect(summary).toEqual([
      "decision-approved → priya@halvard.example",
      "decision-commented → priya@halvard.example",
      "decision-commented → tomas@halvard.example",
      "proposal-submitted → tomas@halvard.example",
      "proposal-submitted → tomas@halvard.example",
    ]);
  });
});
