import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startTestServer, type TestServer } from "../support/test-server.js";
import { ApiClient, freshUser, signedInClient } from "./api-client.js";
import { twoLagPlant, workspaceWithTeam } from "./fixtures.js";

let server: TestServer;
let team: Awaited<ReturnType<typeof workspaceWithTeam>>;

beforeAll(async () => {
  server = await startTestServer();
  team = await workspaceWithTeam(server.url, "Errors");
});

afterAll(async () => {
  await server?.close();
});

describe("request errors", () => {
  it("when the body is malformed JSON, then the answer is 400 saying so", async () => {
    const response = await team.engineer.request("POST", `/api/workspaces/${team.slug}/plants`, { rawBody: '{"name": "Half' });
    expect(response.status).toBe(400);
    expect(response.body).toEqual({ error: { message: "The request body is not valid JSON." } });
  });

  it("when the body is larger than 256 kB, then the answer is 413 with a sentence", async () => {
    const huge = JSON.stringify({ ...twoLagPlant("Huge"), unitsNote: "x".repeat(300_000) });
    const response = await team.engineer.request("POST", `/api/workspaces/${team.slug}/plants`, { rawBody: huge });
    expect(response.status).toBe(413);
    expect(response.body.error.message).toMatch(/larger than/);
  });

  it("when the body is not sent as JSON, then the answer is 415 asking for JSON", async () => {
    const response = await team.engineer.request("POST", `/api/workspaces/${team.slug}/plants`, {
      rawBody: "name=x",
      headers: { "content-type": "application/x-www-form-urlencoded" },
    });
    expect(response.status).toBe(415);
    expect(response.body.error.message).toMatch(/JSON/);
  });

  it("when a signed-in user calls an unknown API path, then the answer is a 404 JSON error", async () => {
    const response = await team.viewer.get("/api/no-such-thing");
    expect(response.status).toBe(404);
    expect(response.body.error.message).toMatch(/no API endpoint/);
  });

  it("when any response is sent, then it carries no x-powered-by and the basic security headers", async () => {
    const response = await new ApiClient(server.url).get("/api/health");
    expect(response.headers.get("x-powered-by")).toBeNull();
    expect(response.headers.get("x-content-type-options")).toBe("nosniff");
    expect(response.headers.get("x-frame-options")).toBe("DENY");
    expect(response.headers.get("cache-control")).toBe("no-store");
  });
});

describe("workspaces and members", () => {
  it("when a user creates a workspace, then they are its admin and its home shows them", async () => {
    const { client, user } = await signedInClient(server.url, "Founder");
    const created = await client.post("/api/workspaces", { name: "Ember pilot line" });
    expect(created.status).toBe(201);
    expect(created.body.slug).toMatch(/^ember-pilot-line(-[0-9a-f]{6})?$/);
    const home = await client.get(`/api/workspaces/${created.body.slug}`);
    expect(home.status).toBe(200);
    expect(home.body.role).toBe("admin");
    expect(home.body.counts).toEqual({ plants: 0, sweeps: 0, members: 1 });
    expect(home.body.members).toEqual([{ user: expect.objectContaining({ email: user.email }), role: "admin" }]);
  });

  it("when the workspace name is missing, then the answer is 400 naming name", async () => {
    const response = await team.admin.post("/api/workspaces", {});
    expect(response.status).toBe(400);
    expect(response.body.error.field).toBe("name");
  });

  it("when an admin adds a member by address, then 410 pointing to invitations; a member invited again or a bad role say which", async () => {
    const gone = await team.admin.post(`/api/workspaces/${team.slug}/members`, { email: freshUser("Nobody").email, role: "viewer" });
    expect(gone.status).toBe(410);
    expect(gone.body.error.message).toMatch(/invite people instead/);

    const me = await team.engineer.get("/api/me");
    const twice = await team.admin.post(`/api/workspaces/${team.slug}/invitations`, { email: me.body.user.email, role: "lead" });
    expect(twice.status).toBe(409);
    expect(twice.body.error.field).toBe("email");

    const badRole = await team.admin.post(`/api/workspaces/${team.slug}/invitations`, { email: me.body.user.email, role: "owner" });
    expect(badRole.status).toBe(400);
    expect(badRole.body.error.field).toBe("role");

    const badEmail = await team.admin.post(`/api/workspaces/${team.slug}/invitations`, { email: "not an address", role: "viewer" });
    expect(badEmail.status).toBe(400);
    expect(badEmail.body.error.field).toBe("email");
  });

  it("when a viewer opens the workspace home, then it shows the role and the team", async () => {
    const home = await team.viewer.get(`/api/workspaces/${team.slug}`);
    expect(home.status).toBe(200);
    expect(home.body.role).toBe("viewer");
    expect(home.body.members.map((m: { role: string }) => m.role).sort()).toEqual(["admin", "engineer", "viewer"]);
  });
});
