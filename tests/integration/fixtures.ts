import pg from "pg";
import type { Role } from "@loopyard/core";
import { ApiClient, signedInClient } from "./api-client.js";

/**
 * Test set-up only: makes the user with `email` a member of the workspace `slug` straight in the
 * database. The app itself adds people only when they accept a mailed invitation (that flow is
 * tested in invitations.test.ts); the other test files need a team in a moment.
 */
export async function addMemberInDatabase(slug: string, email: string, role: Role): Promise<void> {
  const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await client.connect();
  try {
    const result = await client.query(
      `insert into membership (workspace_id, user_id, role)
       select w.id, u.id, $3::member_role from workspace w, "user" u where w.slug = $1 and u.email = $2
       on conflict do nothing`,
      [slug, email.toLowerCase(), role],
    );
    if (result.rowCount !== 1) throw new Error(`adding ${email} to ${slug} as ${role} inserted ${result.rowCount} rows`);
  } finally {
    await client.end();
  }
}

/** A plant input for G(s) = 1/((s+1)(s+2)) = 1/(s² + 3s + 2). */
export function twoLagPlant(name: string) {
  return { name, unitsNote: "u: heater power fraction; y: temperature rise", model: { kind: "transfer-function", num: [1], den: [1, 3, 2], delay: 0 } };
}

/** A family of the library over one plant revision (two labelled variants of the same revision), as POST …/families takes it. */
export function twoVariantFamily(name: string, plantRevisionId: string, note?: string) {
  const body: Record<string, unknown> = {
    name,
    description: "two labels of one plant revision",
    definition: { entries: [{ plantRevisionId, label: "bench A" }, { plantRevisionId, label: "bench B" }] },
  };
  if (note !== undefined) body.note = note;
  return body;
}

/** A library file (docs/library-file.md, version 1) with one first-order plant. */
export function tinyLibraryFile() {
  return {
    format: "loopyard.library",
    version: 1,
    plants: [
      { key: "p1", name: "Imported lag", revisions: [{ number: 1, name: "Imported lag", unitsNote: "", note: null, model: { kind: "transfer-function", num: [1], den: [2, 1], delay: 0 } }] },
    ],
    families: [],
  };
}

/**
 * A new workspace whose creator is its admin, with one engineer and one viewer (added in the database).
 * Every test file builds its own so runs never depend on one another.
 */
export async function workspaceWithTeam(baseUrl: string, label: string) {
  const admin = await signedInClient(baseUrl, `${label} admin`);
  const engineer = await signedInClient(baseUrl, `${label} engineer`);
  const viewer = await signedInClient(baseUrl, `${label} viewer`);
  const created = await admin.client.post("/api/workspaces", { name: `Ember test bench ${label} ${admin.user.email}` });
  if (created.status !== 201) throw new Error(`creating a workspace failed: ${created.status} ${JSON.stringify(created.body)}`);
  const slug: string = created.body.slug;
  for (const [member, role] of [
    [engineer, "engineer"],
    [viewer, "viewer"],
  ] as const) {
    await addMemberInDatabase(slug, member.user.email, role);
  }
  return {
    slug,
    name: created.body.name as string,
    admin: admin.client,
    engineer: engineer.client,
    viewer: viewer.client,
    /** Emails and passwords, to sign in again (e.g. on another server). */
    credentials: { admin: admin.user, engineer: engineer.user, viewer: viewer.user },
    anonymous: new ApiClient(baseUrl),
  };
}

/** Polls a sweep until it is finished or failed (or the timeout passes); returns its SweepDetailDto. */
export async function waitForSweep(client: ApiClient, slug: string, sweepId: string, timeoutMs = 45_000) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const response = await client.get(`/api/workspaces/${slug}/sweeps/${sweepId}`);
    if (response.status !== 200) throw new Error(`reading sweep ${sweepId} answered ${response.status}`);
    if (response.body.status === "finished" || response.body.status === "failed") return response.body;
    if (Date.now() > deadline) throw new Error(`sweep ${sweepId} still ${response.body.status} (${response.body.done}/${response.body.total})`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}
