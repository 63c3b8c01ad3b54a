/**
 * The answers the server keeps in memory (issue 11, load): the plant list and the workspace home's
 * directory (forgotten at once by a write), the membership memo (never remembers an absence), and
 * the front and points of finished sweeps (kept for good, sent with an ETag and as 304). Each test
 * reads first, so that the answer is kept, then writes, and reads again at once: the write must show.
 * ETag and 304 semantics: RFC 9110 §8.8.3 and §13.1.2 (If-None-Match), §15.4.5 (304 Not Modified).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startTestServer, type TestServer } from "../support/test-server.js";
import { ApiClient, signedInClient } from "./api-client.js";
import { addMemberInDatabase, twoLagPlant, waitForSweep, workspaceWithTeam } from "./fixtures.js";

/**
 * Headers of a browser revalidating what it keeps. Node's fetch, given If-None-Match, would add
 * `Cache-Control: no-cache` (Fetch standard, HTTP-network-or-cache fetch: a conditional request
 * turns the cache mode to no-store), which asks for a full answer (Express's `fresh` gives none then);
 * a browser revalidating its cache sends max-age=0 instead.
 */
const revalidate = (etag: string, extra: Record<string, string> = {}) => ({ headers: { "if-none-match": etag, "cache-control": "max-age=0", ...extra } });

let server: TestServer;
let team: Awaited<ReturnType<typeof workspaceWithTeam>>;

beforeAll(async () => {
  server = await startTestServer();
  team = await workspaceWithTeam(server.url, "Caches");
});

afterAll(async () => {
  await server?.close();
});

const plantsPath = () => `/api/workspaces/${team.slug}/plants`;
const homePath = () => `/api/workspaces/${team.slug}`;

function gridInput(name: string, plantRevisionId: string) {
  return {
    name,
    plantRevisionId,
    structure: "pid",
    ranges: { kp: { min: 0.5, max: 4, count: 3 }, ki: { min: 0.1, max: 2, count: 2 }, kd: { min: 0, max: 1, count: 2 } },
    filter: { mode: "ratio", n: 10 },
    scenario: { kind: "setpoint-step", horizon: 20, dt: 0.01 },
    criteria: ["iae", "ise", "effort"],
  };
}

describe("the plant list, kept per workspace", () => {
  it("when a plant is created after the list was read, then the next read lists it at once, with a new ETag", async () => {
    const before = await team.viewer.get(plantsPath());
    expect(before.status).toBe(200);
    const etag = before.headers.get("etag");
    expect(etag).toMatch(/^"[A-Za-z0-9_-]{22}"$/);
    expect(before.headers.get("cache-control")).toBe("private, no-cache");
    const created = await team.engineer.post(plantsPath(), twoLagPlant("Kept list plant"));
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const after = await team.viewer.get(plantsPath());
    expect(after.body.map((p: { name: string }) => p.name)).toContain("Kept list plant");
    expect(after.body).toHaveLength(before.body.length + 1);
    expect(after.headers.get("etag")).not.toBe(etag);
  });

  it("when a plant gets a new revision, then the next read shows it as the latest at once", async () => {
    const created = await team.engineer.post(plantsPath(), twoLagPlant("Revised plant"));
    await team.viewer.get(plantsPath());
    const revised = await team.engineer.post(`${plantsPath()}/${created.body.plant.id}/revisions`, { ...twoLagPlant("Revised plant, second"), note: "A second revision, to be listed at once." });
    expect(revised.status).toBe(201);
    const list = await team.viewer.get(plantsPath());
    const entry = list.body.find((p: { id: string }) => p.id === created.body.plant.id);
    expect(entry.revisionCount).toBe(2);
    expect(entry.latestRevision.number).toBe(2);
    expect(entry.name).toBe("Revised plant, second");
  });

  it("when the list is asked again with its ETag in If-None-Match, then 304 without a body; with an old tag, 200", async () => {
    const first = await team.viewer.get(plantsPath());
    const etag = first.headers.get("etag") as string;
    const again = await team.viewer.request("GET", plantsPath(), revalidate(etag));
    expect(again.status).toBe(304);
    expect(again.body).toBeNull();
    const stale = await team.viewer.request("GET", plantsPath(), revalidate('"an-old-tag-of-22-chars"'));
    expect(stale.status).toBe(200);
    expect(stale.body).toEqual(first.body);
  });

  it("when a revision's author renames themselves, then the list names them by the new name at once", async () => {
    await team.engineer.post(plantsPath(), twoLagPlant("Authored plant"));
    await team.viewer.get(plantsPath());
    expect((await team.engineer.post("/api/auth/update-user", { name: "Renamed Engineer" })).status).toBe(200);
    const list = await team.viewer.get(plantsPath());
    const entry = list.body.find((p: { name: string }) => p.name === "Authored plant");
    expect(entry.latestRevision.createdBy.name).toBe("Renamed Engineer");
    const home = await team.viewer.get(homePath());
    expect(home.body.members.map((m: { user: { name: string } }) => m.user.name)).toContain("Renamed Engineer");
  });

  it("when someone outside the workspace asks for a kept list, then 404 as ever (the list is kept behind the membership check)", async () => {
    await team.viewer.get(plantsPath());
    const outsider = await signedInClient(server.url, "Cache outsider");
    expect((await outsider.client.get(plantsPath())).status).toBe(404);
    expect((await new ApiClient(server.url).get(plantsPath())).status).toBe(401);
  });
});

describe("the workspace home and the membership memo", () => {
  it("when a plant or a sweep is added or a member removed after the home was read, then its counts and members show it at once", async () => {
    // A member to remove through the API (members join by invitation only; the database stands in for an accepted one).
    const leaver = await signedInClient(server.url, "Cache leaver");
    await addMemberInDatabase(team.slug, leaver.user.email, "viewer");
    const leaverId: string = (await leaver.client.get("/api/me")).body.user.id;
    expect((await leaver.client.get(homePath())).status).toBe(200);
    const before = (await team.viewer.get(homePath())).body;
    const plant = await team.engineer.post(plantsPath(), twoLagPlant("Counted plant"));
    const afterPlant = (await team.viewer.get(homePath())).body;
    expect(afterPlant.counts.plants).toBe(before.counts.plants + 1);
    const sweep = await team.engineer.post(`${homePath()}/sweeps`, gridInput("Counted sweep", plant.body.revision.id));
    expect(sweep.status).toBe(201);
    const afterSweep = (await team.viewer.get(homePath())).body;
    expect(afterSweep.counts.sweeps).toBe(before.counts.sweeps + 1);
    expect(afterSweep.recentSweeps[0].id).toBe(sweep.body.id);
    expect((await team.admin.request("DELETE", `${homePath()}/members/${leaverId}`)).status).toBeLessThan(300);
    const afterMember = (await team.viewer.get(homePath())).body;
    expect(afterMember.counts.members).toBe(before.counts.members - 1);
    expect(afterMember.members.map((m: { user: { email: string } }) => m.user.email)).not.toContain(leaver.user.email);
    // And the removed member's very next request is refused: the membership memo forgot them.
    expect((await leaver.client.get(homePath())).status).toBe(404);
    await waitForSweep(team.viewer, team.slug, sweep.body.id);
  });

  it("when someone refused as a non-member is added, then their very next request is served (an absence is never remembered)", async () => {
    const joiner = await signedInClient(server.url, "Cache joiner");
    expect((await joiner.client.get(homePath())).status).toBe(404);
    await addMemberInDatabase(team.slug, joiner.user.email, "engineer");
    const home = await joiner.client.get(homePath());
    expect(home.status).toBe(200);
    expect(home.body.role).toBe("engineer");
    expect((await joiner.client.post(plantsPath(), twoLagPlant("Joiner's plant"))).status).toBe(201);
  });

  it("when a viewer is refused a write, then the remembered role still refuses it with the sentence naming the role", async () => {
    await team.viewer.get(homePath());
    const refused = await team.viewer.post(plantsPath(), twoLagPlant("Refused by memo"));
    expect(refused.status).toBe(403);
    expect(refused.body.error.message).toBe(`Creating plants needs the engineer role or higher in ${team.name}; you are a viewer.`);
  });
});

describe("a finished sweep's front and points, kept for good", () => {
  let sweepPath: string;
  let other: Awaited<ReturnType<typeof workspaceWithTeam>>;

  beforeAll(async () => {
    const plant = await team.engineer.post(plantsPath(), twoLagPlant("Front cache plant"));
    const created = await team.engineer.post(`${homePath()}/sweeps`, gridInput("Front cache sweep", plant.body.revision.id));
    expect(created.status).toBe(201);
    sweepPath = `${homePath()}/sweeps/${created.body.id}`;
    const finished = await waitForSweep(team.viewer, team.slug, created.body.id);
    expect(finished.status).toBe("finished");
    other = await workspaceWithTeam(server.url, "Caches other");
  });

  it("when the front is read twice, then the same bytes and ETag come back, and the ETag in If-None-Match gets 304", async () => {
    const first = await team.viewer.get(`${sweepPath}/front?x=iae&y=effort`);
    expect(first.status).toBe(200);
    expect(first.body.candidates.length).toBeGreaterThan(0);
    const etag = first.headers.get("etag") as string;
    expect(etag).toMatch(/^"[A-Za-z0-9_-]{22}"$/);
    const second = await team.engineer.get(`${sweepPath}/front?x=iae&y=effort`);
    expect(second.body).toEqual(first.body);
    expect(second.headers.get("etag")).toBe(etag);
    const revalidated = await team.viewer.request("GET", `${sweepPath}/front?x=iae&y=effort`, revalidate(etag));
    expect(revalidated.status).toBe(304);
    // Other axes are another answer with another tag.
    const other = await team.viewer.get(`${sweepPath}/front?x=ise&y=effort`);
    expect(other.status).toBe(200);
    expect(other.headers.get("etag")).not.toBe(etag);
  });

  it("when the points are read as binary and as JSON, then each has its own ETag and each revalidates to 304", async () => {
    const binary = await team.viewer.getBytes(`${sweepPath}/points?x=iae&y=effort`, "application/x-loopyard-points");
    const json = await team.viewer.get(`${sweepPath}/points?x=iae&y=effort`);
    expect(binary.status).toBe(200);
    expect(json.status).toBe(200);
    expect(binary.headers.get("content-type")).toContain("application/x-loopyard-points");
    expect(binary.headers.get("vary")).toContain("Accept");
    expect(binary.headers.get("etag")).not.toBe(json.headers.get("etag"));
    const again = await team.viewer.request("GET", `${sweepPath}/points?x=iae&y=effort`, revalidate(binary.headers.get("etag") as string, { accept: "application/x-loopyard-points" }));
    expect(again.status).toBe(304);
    const bytesAgain = await team.viewer.getBytes(`${sweepPath}/points?x=iae&y=effort`, "application/x-loopyard-points");
    expect(Buffer.from(bytesAgain.bytes).equals(Buffer.from(binary.bytes))).toBe(true);
  });

  it("when a member of another workspace asks for the kept front with this sweep's id, then 404 (answers are kept per workspace)", async () => {
    await team.viewer.get(`${sweepPath}/front?x=iae&y=effort`);
    const sweepId = sweepPath.split("/").pop();
    const foreign = await other.admin.get(`/api/workspaces/${other.slug}/sweeps/${sweepId}/front?x=iae&y=effort`);
    expect(foreign.status).toBe(404);
    const outsider = await other.admin.get(`${sweepPath}/front?x=iae&y=effort`);
    expect(outsider.status).toBe(404);
  });

  it("when an axis is not a criterion of the sweep, then 400 as before (refusals are not kept)", async () => {
    const refused = await team.viewer.get(`${sweepPath}/front?x=itae&y=effort`);
    expect(refused.status).toBe(400);
    expect((await team.viewer.get(`${sweepPath}/front?x=itae&y=effort`)).status).toBe(400);
  });
});
