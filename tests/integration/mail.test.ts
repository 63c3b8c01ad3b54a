/**
 * Mail over the real path: a sweep ends in the embedded worker → a pg-boss mail job → nodemailer
 * over SMTP → the local sink's .eml file, read back with mailparser; the author's settings; the
 * outbox; and an SMTP server that is down (the request succeeds, the job retries until it is up).
 * References: RFC 5322 (message format), RFC 2045–2049 (MIME parts) as mailparser reads them;
 * the expected subjects and texts are our templates' (packages/server/src/mail/templates).
 */
import { mkdtemp, readdir, readFile, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { simpleParser, type ParsedMail } from "mailparser";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startMailSink, type MailConfig, type MailSink } from "../../packages/server/src/index.js";
import { startTestServer, type TestServer } from "../support/test-server.js";
import { smallComparison, waitForComparison } from "./comparison-fixtures.js";
import { twoLagPlant, waitForSweep, workspaceWithTeam } from "./fixtures.js";
import { freePort } from "./processes.js";

/** Retry delay of the test's mail queue [s]: pg-boss waits 1–2 s before the first retry, 2–4 s before the second. */
const RETRY_DELAY_SECONDS = 1;

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

function mailConfig(smtpUrl: string, folder: string, port: number): MailConfig {
  return { smtpUrl, from: "Loopyard <loopyard@localhost>", sink: { host: "127.0.0.1", port, folder }, retry: { retryLimit: 8, retryDelaySeconds: RETRY_DELAY_SECONDS } };
}

/** Every .eml in the folder, parsed with mailparser (independently of the app's outbox reader). */
async function receivedMail(folder: string): Promise<ParsedMail[]> {
  let names: string[] = [];
  try {
    names = (await readdir(folder)).filter((name) => name.endsWith(".eml"));
  } catch {
    return [];
  }
  return Promise.all(names.map(async (name) => simpleParser(await readFile(path.join(folder, name)))));
}

function recipients(mail: ParsedMail): string[] {
  const groups = mail.to === undefined ? [] : Array.isArray(mail.to) ? mail.to : [mail.to];
  return groups.flatMap((g) => g.value.map((a) => a.address ?? ""));
}

async function waitForMail(folder: string, match: (mail: ParsedMail) => boolean, timeoutMs = 30_000): Promise<ParsedMail> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const found = (await receivedMail(folder)).find(match);
    if (found) return found;
    if (Date.now() > deadline) throw new Error(`no matching mail arrived in ${folder} within ${timeoutMs} ms`);
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
}

let db: pg.Pool;

/** The mail jobs whose data mentions `text` (a sweep's id is in its link). */
async function mailJobs(text: string): Promise<{ state: string; retry_count: number }[]> {
  const result = await db.query<{ state: string; retry_count: number }>(
    `select state::text, retry_count from pgboss.job where name = 'mail-send' and data::text like $1`,
    [`%${text}%`],
  );
  return result.rows;
}

async function waitFor<T>(what: string, probe: () => Promise<T | null | undefined | false>, timeoutMs = 30_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await probe();
    if (value) return value;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
}

/**
 * Drops the mail jobs that other test files queued and nobody sent (their servers have no mail
 * configuration): in a full run they number hundreds, and this file's sender would work through
 * them all before its own. Test database only.
 */
async function dropStrayMailJobs(): Promise<void> {
  await db.query(`delete from pgboss.job where name = 'mail-send' and state in ('created', 'retry') and coalesce(data->>'workspaceSlug', '') <> 'halvard-thermal'`);
}

beforeAll(async () => {
  db = new pg.Pool({ connectionString: process.env.DATABASE_URL, max: 2 });
  await dropStrayMailJobs();
});

afterAll(async () => {
  await db?.end();
});

describe("mail through the local sink", () => {
  let folder: string;
  let sink: MailSink;
  let server: TestServer;
  let team: Awaited<ReturnType<typeof workspaceWithTeam>>;
  let revisionId: string;

  beforeAll(async () => {
    folder = await mkdtemp(path.join(tmpdir(), "loopyard-mail-"));
    sink = await startMailSink({ port: 0, folder });
    server = await startTestServer({ mail: mailConfig(sink.url, folder, sink.port), limits: { maxCandidates: 1_000, maxConcurrentSweeps: 5 } });
    team = await workspaceWithTeam(server.url, "Mail");
    const plant = await team.engineer.post(`/api/workspaces/${team.slug}/plants`, twoLagPlant("Mail plant"));
    revisionId = plant.body.revision.id;
  }, 60_000);

  afterAll(async () => {
    await server?.close();
    await sink?.close();
    if (folder) await rm(folder, { recursive: true, force: true });
  });

  it("when an engineer's sweep finishes, then the sink receives one mail to them with subject, text and HTML parts and a link to the sweep", async () => {
    const name = `Mail sweep ${Date.now()}`;
    const created = await team.engineer.post(`/api/workspaces/${team.slug}/sweeps`, tinySweep(name, revisionId));
    expect(created.status).toBe(201);
    const sweepId: string = created.body.id;
    const finished = await waitForSweep(team.viewer, team.slug, sweepId);
    expect(finished.status).toBe("finished");

    const mail = await waitForMail(folder, (m) => m.subject === `Sweep finished: ${name}`);
    const engineerEmail = team.credentials.engineer.email;
    expect(recipients(mail)).toEqual([engineerEmail]);
    expect(mail.headers.get("x-loopyard-kind")).toBe("sweep-finished");
    const link = `${server.url}/w/${team.slug}/sweeps/${sweepId}`;
    expect(mail.headers.get("x-loopyard-link")).toBe(link);
    expect(mail.text).toContain(`Your sweep “${name}” in ${team.name} has finished.`);
    expect(mail.text).toContain(`Open the sweep: ${link}`);
    expect(mail.text).toContain("Candidates: 4");
    expect(mail.html).toContain(`href="${link}"`);
    // The link works: its page path /w/:slug/sweeps/:id is the app's sweep page, whose data is the
    // API's /api/workspaces/:slug/sweeps/:id (same slug and id) — the author can open it.
    const page = new URL(link);
    expect(page.origin).toBe(server.url);
    const [, , slug, , id] = page.pathname.split("/");
    const opened = await team.engineer.get(`/api/workspaces/${slug}/sweeps/${id}`);
    expect(opened.status).toBe(200);
    expect(opened.body.name).toBe(name);
    // Once: one message for this sweep, even though every chunk job of it checked.
    expect((await receivedMail(folder)).filter((m) => m.subject === `Sweep finished: ${name}`)).toHaveLength(1);

    // The admin's outbox lists it and opens it; a viewer may not read the outbox.
    const outbox = await team.admin.get(`/api/workspaces/${team.slug}/outbox`);
    expect(outbox.status).toBe(200);
    expect(outbox.body.localSink).toBe(true);
    const listed = outbox.body.messages.find((m: { subject: string }) => m.subject === `Sweep finished: ${name}`);
    expect(listed).toMatchObject({ to: [engineerEmail], kind: "sweep-finished", link });
    const opening = await team.admin.get(`/api/workspaces/${team.slug}/outbox/${listed.id}`);
    expect(opening.status).toBe(200);
    expect(opening.body.text).toContain(link);
    expect(opening.body.html).toContain(`href="${link}"`);
    expect((await team.viewer.get(`/api/workspaces/${team.slug}/outbox`)).status).toBe(403);
    expect((await team.admin.get(`/api/workspaces/${team.slug}/outbox/20260101T000000000Z-00000000`)).status).toBe(404);
  });

  it("when the engineer turns sweep-finished off, then their next finished sweep sends no mail", async () => {
    const settings = await team.engineer.request("PUT", "/api/me/notifications", { json: { settings: [{ kind: "sweep-finished", enabled: false }] } });
    expect(settings.status, JSON.stringify(settings.body)).toBe(200);
    expect(settings.body.settings.find((s: { kind: string }) => s.kind === "sweep-finished")).toMatchObject({ enabled: false, locked: false });
    expect((await team.engineer.get("/api/me/notifications")).body.settings.find((s: { kind: string }) => s.kind === "password-reset")).toMatchObject({ enabled: true, locked: true });

    const name = `Quiet sweep ${Date.now()}`;
    const created = await team.engineer.post(`/api/workspaces/${team.slug}/sweeps`, tinySweep(name, revisionId));
    expect(created.status).toBe(201);
    const sweepId: string = created.body.id;
    await waitForSweep(team.viewer, team.slug, sweepId);
    // The end was noticed (the notice row is claimed by the worker right after the last chunk) …
    await waitFor("the sweep's end notice", async () => (await db.query("select 1 from run_mail_notice where run_id = $1", [sweepId])).rowCount === 1);
    // … and no mail job was queued for it, and none arrived.
    expect(await mailJobs(sweepId)).toEqual([]);
    expect((await receivedMail(folder)).filter((m) => m.subject?.includes(name))).toEqual([]);

    // Turned back on, the kind is sent again (the setting, not something else, held it back).
    const on = await team.engineer.request("PUT", "/api/me/notifications", { json: { settings: [{ kind: "sweep-finished", enabled: true }] } });
    expect(on.status).toBe(200);
    const again = await team.engineer.post(`/api/workspaces/${team.slug}/sweeps`, tinySweep(`${name} again`, revisionId));
    await waitForSweep(team.viewer, team.slug, again.body.id);
    await waitForMail(folder, (m) => m.subject === `Sweep finished: ${name} again`);
  });

  it("when a comparison finishes, then its author gets a comparison-finished mail linking to the comparison's page", async () => {
    const name = `Mail comparison ${Date.now()}`;
    const created = await team.engineer.post(
      `/api/workspaces/${team.slug}/comparisons`,
      smallComparison(name, [revisionId], {
        structure: "pi",
        ranges: { kp: { min: 0.2, max: 5, scale: "log" }, ki: { min: 0.1, max: 2, scale: "log" } },
        filter: undefined,
        scenario: { kind: "setpoint-step", horizon: 5, dt: 0.01 },
        contenders: ["iae", "ise"],
        judges: ["overshoot"],
        constraints: {},
        budget: { prescan: 16, starts: 1, evaluations: 20, stability: false },
      }),
    );
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const comparisonId: string = created.body.id;
    await waitForComparison(team.viewer, team.slug, comparisonId);
    const mail = await waitForMail(folder, (m) => m.subject === `Comparison finished: ${name}`);
    expect(recipients(mail)).toEqual([team.credentials.engineer.email]);
    const link = `${server.url}/w/${team.slug}/comparisons/${comparisonId}`;
    expect(mail.text).toContain(`Open the comparison: ${link}`);
    expect(mail.text).toContain("Contenders: 2");
    expect(mail.html).toContain(`href="${link}"`);
  }, 150_000);

  it("PUT /api/me/notifications refuses to turn off an account kind, and an unknown kind, naming the field", async () => {
    const account = await team.engineer.request("PUT", "/api/me/notifications", { json: { settings: [{ kind: "password-reset", enabled: false }] } });
    expect(account.status).toBe(400);
    expect(account.body.error).toMatchObject({ field: "settings.0.kind" });
    expect(account.body.error.message).toContain("cannot be turned off");
    const unknown = await team.engineer.request("PUT", "/api/me/notifications", { json: { settings: [{ kind: "weekly-digest", enabled: false }] } });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.field).toBe("settings.0.kind");
  });
});

describe("mail when the SMTP server is down", () => {
  let folder: string;
  let server: TestServer;
  let sink: MailSink | null = null;

  afterAll(async () => {
    await server?.close();
    await sink?.close();
    if (folder) await rm(folder, { recursive: true, force: true });
  });

  it("then the request that causes mail still succeeds, the send job retries, and the mail arrives once the server is up", async () => {
    await dropStrayMailJobs();
    folder = await mkdtemp(path.join(tmpdir(), "loopyard-mail-down-"));
    const port = await freePort(); // nothing listens here yet
    server = await startTestServer({ mail: mailConfig(`smtp://127.0.0.1:${port}`, folder, port) });
    const team = await workspaceWithTeam(server.url, "Mail down");
    const plant = await team.engineer.post(`/api/workspaces/${team.slug}/plants`, twoLagPlant("Mail down plant"));
    const name = `Unsent sweep ${Date.now()}`;
    const created = await team.engineer.post(`/api/workspaces/${team.slug}/sweeps`, tinySweep(name, plant.body.revision.id));
    expect(created.status).toBe(201);
    const sweepId: string = created.body.id;
    expect((await waitForSweep(team.viewer, team.slug, sweepId)).status).toBe("finished");

    // The job failed at least once against the closed port and waits for its next try.
    const retrying = await waitFor("a failed first attempt", async () => (await mailJobs(sweepId)).find((j) => j.retry_count >= 1));
    expect(["retry", "created", "active"]).toContain(retrying.state);
    // The app answers as ever meanwhile.
    expect((await team.engineer.get(`/api/workspaces/${team.slug}/sweeps/${sweepId}`)).status).toBe(200);

    sink = await startMailSink({ port, folder });
    const mail = await waitForMail(folder, (m) => m.subject === `Sweep finished: ${name}`, 45_000);
    expect(recipients(mail)).toEqual([team.credentials.engineer.email]);
    const [job] = await waitFor("the job to complete", async () => {
      const jobs = await mailJobs(sweepId);
      return jobs.every((j) => j.state === "completed") && jobs.length === 1 ? jobs : null;
    });
    expect(job!.retry_count).toBeGreaterThanOrEqual(1);
  }, 120_000);
});
