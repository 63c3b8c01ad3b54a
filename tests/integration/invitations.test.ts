/**
 * Members and invitations over real HTTP, with the local mail sink: an admin invites by address, the
 * mail is parsed (mailparser) and its link's token accepted by the invited account; used, revoked,
 * expired and mismatched tokens are refused with sentences; the last admin stays; every change is in
 * the append-only audit trail. Password reset and the address check run better-auth's own flows
 * through the same mail path. Expectations are the (13) and common practice for single-use
 * invitation links (OWASP Forgot Password Cheat Sheet: random single-use tokens, stored hashed,
 * expiring; the same answer whether or not an account exists).
 */
import { mkdtemp, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startMailSink, type MailSink } from "../../packages/server/src/index.js";
import { secretOf, waitForMail } from "../support/mail-inbox.js";
import { startTestServer, type TestServer } from "../support/test-server.js";
import { ApiClient, freshUser, signedInClient } from "./api-client.js";
import { addMemberInDatabase, twoLagPlant, workspaceWithTeam } from "./fixtures.js";

let server: TestServer;
let sink: MailSink;
let folder: string;
let db: pg.Client;
let team: Awaited<ReturnType<typeof workspaceWithTeam>>;
const seen = new Set<string>();

const base = () => `/api/workspaces/${team.slug}`;

/** Invites a fresh address as `role` and returns the address and the token of the mailed link. */
async function invite(role: string, email = freshUser("Invitee").email) {
  const response = await team.admin.post(`${base()}/invitations`, { email, role });
  expect(response.status, JSON.stringify(response.body)).toBe(201);
  const mail = await waitForMail(folder, email, "invitation", seen);
  return { email, id: response.body.id as string, token: secretOf(mail.link), mail };
}

/** Signs up and in as `email` (a fresh password), as someone following the link would. */
async function accountFor(email: string, label = "Invitee") {
  const client = new ApiClient(server.url);
  const user = { ...freshUser(label), email };
  const response = await client.signUp(user);
  expect(response.status).toBe(200);
  expect(response.signInResponse?.status).toBe(200);
  return { client, user };
}

function expectSentence(body: any, pattern: RegExp): void {
  expect(typeof body?.error?.message).toBe("string");
  expect(body.error.message).toMatch(pattern);
}

beforeAll(async () => {
  folder = await mkdtemp(path.join(tmpdir(), "loopyard-invitations-"));
  sink = await startMailSink({ port: 0, folder });
  server = await startTestServer({
    embeddedWorker: false,
    mail: { smtpUrl: sink.url, from: "Loopyard <loopyard@localhost>", sink: { host: sink.host, port: sink.port, folder }, retry: { retryLimit: 2, retryDelaySeconds: 1 } },
  });
  db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  team = await workspaceWithTeam(server.url, "Invitations");
}, 120_000);

afterAll(async () => {
  await server?.close();
  await sink?.close();
  await db?.end();
  if (folder) await rm(folder, { recursive: true, force: true });
});

describe("invitation flow", () => {
  it("when an admin invites an address as engineer, then the mail's link lets that account join as an engineer, once", async () => {
    const { email, token, mail } = await invite("engineer");
    // The mail names the workspace and the role; its link opens the invitation page with the token after "#".
    expect(mail.subject).toContain(team.name);
    expect(mail.text).toContain("engineer");
    expect(new URL(mail.link).pathname).toBe("/invitation");
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    // Only the token's SHA-256 is stored (never the token).
    const stored = await db.query("select token_hash from invitation where email = $1", [email]);
    expect(stored.rows[0].token_hash).toMatch(/^[0-9a-f]{64}$/);
    expect(stored.rows[0].token_hash).not.toContain(token);

    const pending = await team.admin.get(`${base()}/invitations`);
    expect(pending.body.map((i: { email: string }) => i.email)).toContain(email);

    const invitee = await accountFor(email);
    // Nobody is added without accepting: signed up, not yet a member.
    expect((await invitee.client.get(base())).status).toBe(404);
    const preview = await invitee.client.post("/api/invitations/preview", { token });
    expect(preview.status).toBe(200);
    expect(preview.body).toMatchObject({ workspace: { slug: team.slug, name: team.name }, role: "engineer", email });

    const accepted = await invitee.client.post("/api/invitations/accept", { token });
    expect(accepted.status, JSON.stringify(accepted.body)).toBe(200);
    expect(accepted.body).toMatchObject({ workspace: { slug: team.slug }, role: "engineer" });
    const home = await invitee.client.get(base());
    expect(home.status).toBe(200);
    expect(home.body.role).toBe("engineer");
    // The role applies: an engineer may add a plant.
    expect((await invitee.client.post(`${base()}/plants`, twoLagPlant("Invitee plant"))).status).toBe(201);
    // Accepting proves the mailbox: the address counts as checked.
    expect((await invitee.client.get("/api/me")).body.emailVerified).toBe(true);
    // No longer pending.
    expect((await team.admin.get(`${base()}/invitations`)).body.map((i: { email: string }) => i.email)).not.toContain(email);

    // The link works once.
    const reused = await invitee.client.post("/api/invitations/accept", { token });
    expect(reused.status).toBe(410);
    expectSentence(reused.body, /already accepted.*works once/);
  });

  it("when an invitation has expired (expiry set in the past), then accepting is refused with a sentence and a re-send mails a new working link", async () => {
    const { email, id, token } = await invite("viewer");
    await db.query("update invitation set expires_at = now() - interval '1 minute' where id = $1", [id]);
    const invitee = await accountFor(email);
    const expired = await invitee.client.post("/api/invitations/accept", { token });
    expect(expired.status).toBe(410);
    expectSentence(expired.body, /expired on .* UTC \(invitations work for 7 days\); ask one of its admins to re-send it/);
    expect((await team.admin.get(`${base()}/invitations`)).body.find((i: { id: string }) => i.id === id)?.expired).toBe(true);

    const resent = await team.admin.post(`${base()}/invitations/${id}/resend`);
    expect(resent.status).toBe(200);
    expect(resent.body.sendCount).toBe(2);
    expect(resent.body.expired).toBe(false);
    // 7 days from now, within a minute (INVITATION_LIFETIME_DAYS).
    expect(Math.abs(Date.parse(resent.body.expiresAt) - Date.now() - 7 * 24 * 3600 * 1000)).toBeLessThan(60_000);
    const fresh = secretOf((await waitForMail(folder, email, "invitation", seen)).link);
    expect(fresh).not.toBe(token);
    // The older link stops working when the invitation is re-sent.
    const old = await invitee.client.post("/api/invitations/accept", { token });
    expect(old.status).toBe(404);
    expectSentence(old.body, /not valid.*newest invitation mail/);
    expect((await invitee.client.post("/api/invitations/accept", { token: fresh })).status).toBe(200);
  });

  it("when an admin revokes an invitation, then its link is refused with a sentence and nobody is added", async () => {
    const { email, id, token } = await invite("lead");
    expect((await team.admin.post(`${base()}/invitations/${id}/revoke`)).status).toBe(204);
    const invitee = await accountFor(email);
    const refused = await invitee.client.post("/api/invitations/accept", { token });
    expect(refused.status).toBe(410);
    expectSentence(refused.body, /revoked this invitation/);
    expect((await invitee.client.get(base())).status).toBe(404);
    // A revoked invitation can be neither re-sent nor revoked again.
    const again = await team.admin.post(`${base()}/invitations/${id}/resend`);
    expect(again.status).toBe(409);
    expectSentence(again.body, /was revoked/);
  });

  it("when someone signed in with another address opens the link, then accepting and declining are refused naming both addresses", async () => {
    const { email, token } = await invite("engineer");
    const other = await signedInClient(server.url, "Wrong account");
    for (const action of ["preview", "accept", "decline"]) {
      const refused = await other.client.post(`/api/invitations/${action}`, { token });
      expect(refused.status).toBe(403);
      expect(refused.body.error.message).toContain(email);
      expect(refused.body.error.message).toContain(other.user.email);
      // Nothing about the workspace reaches the wrong account.
      expect(refused.body.error.message).not.toContain(team.name);
    }
    expect((await other.client.get(base())).status).toBe(404);
    // The invitation is still pending for the right account.
    const invitee = await accountFor(email);
    expect((await invitee.client.post("/api/invitations/accept", { token })).status).toBe(200);
  });

  it("when the invitee declines, then nobody is added and the link is used up", async () => {
    const { email, token } = await invite("viewer");
    const invitee = await accountFor(email);
    expect((await invitee.client.post("/api/invitations/decline", { token })).status).toBe(204);
    expect((await invitee.client.get(base())).status).toBe(404);
    const reused = await invitee.client.post("/api/invitations/accept", { token });
    expect(reused.status).toBe(410);
    expectSentence(reused.body, /declined/);
  });

  it("when a token is malformed or unknown, then 400 or 404 with a sentence", async () => {
    const malformed = await team.viewer.post("/api/invitations/accept", { token: "short" });
    expect(malformed.status).toBe(400);
    expect(malformed.body.error.field).toBe("token");
    const unknown = await team.viewer.post("/api/invitations/accept", { token: "B".repeat(43) });
    expect(unknown.status).toBe(404);
    expectSentence(unknown.body, /not valid/);
  });

  it("when an address is invited twice or is a member already, then 409 naming the field", async () => {
    const { email } = await invite("viewer");
    const twice = await team.admin.post(`${base()}/invitations`, { email, role: "engineer" });
    expect(twice.status).toBe(409);
    expect(twice.body.error.field).toBe("email");
    expectSentence(twice.body, /already has a pending invitation/);
    const member = await team.admin.post(`${base()}/invitations`, { email: team.credentials.viewer.email.toUpperCase(), role: "engineer" });
    expect(member.status).toBe(409);
    expectSentence(member.body, /already a viewer/);
  });

  it("when anyone uses the old add-by-address route, then 410 pointing to invitations", async () => {
    const gone = await team.admin.post(`${base()}/members`, { email: freshUser("Old route").email, role: "viewer" });
    expect(gone.status).toBe(410);
    expectSentence(gone.body, /invite people instead.*\/invitations/);
  });
});

describe("members and the last admin", () => {
  it("when the only admin demotes or removes themselves, then 409 with a sentence; with a second admin, both work", async () => {
    const me = (await team.admin.get("/api/me")).body.user;
    const demote = await team.admin.request("PATCH", `${base()}/members/${me.id}`, { json: { role: "lead" } });
    expect(demote.status).toBe(409);
    expectSentence(demote.body, /last admin .* make another member an admin first/);
    const remove = await team.admin.request("DELETE", `${base()}/members/${me.id}`);
    expect(remove.status).toBe(409);
    expectSentence(remove.body, /last admin .* cannot be removed/);

    const second = await signedInClient(server.url, "Second admin");
    await addMemberInDatabase(team.slug, second.user.email, "engineer");
    const secondId = (await second.client.get("/api/me")).body.user.id;
    // Only admins change roles.
    const byEngineer = await team.engineer.request("PATCH", `${base()}/members/${secondId}`, { json: { role: "admin" } });
    expect(byEngineer.status).toBe(403);
    expectSentence(byEngineer.body, /Changing roles needs the admin role/);

    const promoted = await team.admin.request("PATCH", `${base()}/members/${secondId}`, { json: { role: "admin" } });
    expect(promoted.status).toBe(200);
    expect(promoted.body.role).toBe("admin");
    const list = await team.viewer.get(`${base()}/members`);
    expect(list.body.adminCount).toBe(2);

    // Now the second admin may demote the first, and is then the last one.
    expect((await second.client.request("PATCH", `${base()}/members/${me.id}`, { json: { role: "lead" } })).status).toBe(200);
    expect((await second.client.request("DELETE", `${base()}/members/${secondId}`)).status).toBe(409);
    // …and removes the first (now a lead), who then no longer sees the workspace.
    expect((await second.client.request("DELETE", `${base()}/members/${me.id}`)).status).toBe(204);
    expect((await team.admin.get(base())).status).toBe(404);
    team.admin = second.client;
  });

  it("when membership changes happened, then the audit trail lists each one, newest first, and refuses changes in the database", async () => {
    const trail = await team.admin.get(`${base()}/audit`);
    expect(trail.status).toBe(200);
    const actions = new Set(trail.body.map((e: { action: string }) => e.action));
    for (const action of ["invitation-sent", "invitation-resent", "invitation-revoked", "invitation-accepted", "invitation-declined", "role-changed", "member-removed"]) {
      expect(actions.has(action), action).toBe(true);
    }
    const ids = trail.body.map((e: { id: number }) => e.id);
    expect(ids).toEqual([...ids].sort((a, b) => b - a));
    const removal = trail.body.find((e: { action: string }) => e.action === "member-removed");
    expect(removal).toMatchObject({ previousRole: "lead", subject: { email: team.credentials.admin.email } });
    // Viewers do not read the trail.
    expect((await team.viewer.get(`${base()}/audit`)).status).toBe(403);
    // Append-only in PostgreSQL itself (the trigger of db/audit-trail-guard.ts).
    await expect(db.query("update workspace_audit_event set action = 'role-changed' where id = $1", [ids[0]])).rejects.toThrow(/append-only/);
    await expect(db.query("delete from workspace_audit_event where id = $1", [ids[0]])).rejects.toThrow(/append-only/);
  });
});

describe("password reset and address check (better-auth's flows, through the mail queue)", () => {
  it("when someone asks for a reset, then the mailed link sets a new password once and ends the old sessions", async () => {
    const { client, user } = await signedInClient(server.url, "Forgetful");
    const asked = await new ApiClient(server.url).post("/api/auth/request-password-reset", { email: user.email, redirectTo: "/reset-password" });
    expect(asked.status).toBe(200);
    // An address without an account gets the very same answer (no enumeration).
    const unknown = await new ApiClient(server.url).post("/api/auth/request-password-reset", { email: freshUser("Nobody").email, redirectTo: "/reset-password" });
    expect({ status: unknown.status, body: unknown.body }).toEqual({ status: asked.status, body: asked.body });

    const mail = await waitForMail(folder, user.email, "password-reset", seen);
    expect(new URL(mail.link).pathname).toBe("/reset-password");
    const token = secretOf(mail.link);
    // better-auth stores the reset token hashed (verification.storeIdentifier "hashed").
    const plain = await db.query("select count(*)::int as n from verification where identifier like $1", [`%${token}%`]);
    expect(plain.rows[0].n).toBe(0);

    const reset = await new ApiClient(server.url).post("/api/auth/reset-password", { newPassword: "ember-plates-glow-again", token });
    expect(reset.status, JSON.stringify(reset.body)).toBe(200);
    expect((await client.get("/api/me")).status).toBe(401);
    expect((await new ApiClient(server.url).signIn(user.email, user.password)).status).toBe(401);
    expect((await new ApiClient(server.url).signIn(user.email, "ember-plates-glow-again")).status).toBe(200);
    const again = await new ApiClient(server.url).post("/api/auth/reset-password", { newPassword: "another-ember-plate-pass", token });
    expect(again.status).toBe(400);
  });

  it("when someone signs up, then an address-check mail arrives whose link marks the address checked; a taken address answers the same and mails its owner", async () => {
    const client = new ApiClient(server.url);
    const user = freshUser("Checker");
    const signedUp = await client.signUp(user);
    expect(signedUp.status).toBe(200);
    expect((await client.get("/api/me")).body.emailVerified).toBe(false);
    const mail = await waitForMail(folder, user.email, "email-verification", seen);
    expect(new URL(mail.link).pathname).toBe("/verify-email");
    const verified = await client.get(`/api/auth/verify-email?token=${encodeURIComponent(secretOf(mail.link))}`);
    expect(verified.status).toBe(200);
    expect((await client.get("/api/me")).body.emailVerified).toBe(true);

    const again = await new ApiClient(server.url).post("/api/auth/sign-up/email", { ...user, name: "Someone Else", password: "a-different-long-pass" });
    expect(again.status).toBe(200);
    expect(Object.keys(again.body).sort()).toEqual(Object.keys(signedUp.body).sort());
    const notice = await waitForMail(folder, user.email, "email-verification", seen);
    expect(notice.subject).toMatch(/tried to sign up with your address/);
  });
});
