import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startTestServer, type TestServer } from "../support/test-server.js";
import { ApiClient, freshUser } from "./api-client.js";

let server: TestServer;

beforeAll(async () => {
  server = await startTestServer();
});

afterAll(async () => {
  await server?.close();
});

describe("sessions", () => {
  it("when no one is signed in, then /api/health still answers ok", async () => {
    const response = await new ApiClient(server.url).get("/api/health");
    expect(response.status).toBe(200);
    expect(response.body).toEqual({ ok: true });
  });

  it("when no one is signed in, then every route family answers 401 with the sign-in sentence", async () => {
    const anonymous = new ApiClient(server.url);
    const someId = "00000000-0000-4000-8000-000000000000";
    const calls: [string, string, unknown?][] = [
      ["GET", "/api/me"],
      ["POST", "/api/workspaces", { name: "Anything" }],
      ["GET", "/api/workspaces/halvard-thermal"],
      ["POST", "/api/workspaces/halvard-thermal/members", { email: "jon@halvard.example", role: "admin" }],
      ["GET", "/api/workspaces/halvard-thermal/plants"],
      ["POST", "/api/workspaces/halvard-thermal/plants", {}],
      ["GET", `/api/workspaces/halvard-thermal/plants/${someId}`],
      ["POST", `/api/workspaces/halvard-thermal/plants/${someId}/revisions`, {}],
      ["GET", "/api/workspaces/halvard-thermal/sweeps"],
      ["POST", "/api/workspaces/halvard-thermal/sweeps", {}],
      ["GET", `/api/workspaces/halvard-thermal/sweeps/${someId}`],
      ["GET", `/api/workspaces/halvard-thermal/sweeps/${someId}/candidates`],
      ["GET", `/api/workspaces/halvard-thermal/sweeps/${someId}/front?x=iae&y=effort`],
      ["GET", `/api/workspaces/halvard-thermal/sweeps/${someId}/candidates/0/response`],
      ["GET", "/api/no-such-route"],
    ];
    for (const [method, path, json] of calls) {
      const response = await anonymous.request(method, path, json === undefined ? {} : { json });
      expect({ method, path, status: response.status, body: response.body }).toEqual({
        method,
        path,
        status: 401,
        body: { error: { message: "Sign in to continue." } },
      });
    }
  });

  it("when a user signs up, signs out and signs in again, then /api/me follows the session", async () => {
    const client = new ApiClient(server.url);
    const user = freshUser("Sign-in");

    const signUp = await client.signUp(user);
    expect(signUp.status).toBe(200);
    expect(client.signedIn).toBe(true);

    const me = await client.get("/api/me");
    expect(me.status).toBe(200);
    expect(me.body.user).toMatchObject({ name: user.name, email: user.email });
    expect(me.body.memberships).toEqual([]);

    expect((await client.signOut()).status).toBe(200);
    expect((await client.get("/api/me")).status).toBe(401);

    const wrong = await client.signIn(user.email, "not-the-password");
    expect(wrong.status).toBe(401);
    expect((await client.get("/api/me")).status).toBe(401);

    const signIn = await client.signIn(user.email, user.password);
    expect(signIn.status).toBe(200);
    const again = await client.get("/api/me");
    expect(again.status).toBe(200);
    expect(again.body.user.email).toBe(user.email);
  });

  it("when a session cookie is set, then it is httpOnly and SameSite=Lax", async () => {
    const client = new ApiClient(server.url);
    const response = (await client.signUp(freshUser("Cookie"))).signInResponse!;
    const sessionCookie = response.headers.getSetCookie().find((line) => line.includes("session_token"));
    expect(sessionCookie).toBeDefined();
    expect(sessionCookie).toMatch(/HttpOnly/i);
    expect(sessionCookie).toMatch(/SameSite=Lax/i);
  });

  it("when a sign-in comes from another origin, then it is refused (the public URL is the only trusted origin)", async () => {
    const response = await new ApiClient(server.url).request("POST", "/api/auth/sign-in/email", {
      json: { email: "priya@halvard.example", password: "ember-demo-2026" },
      headers: { origin: "http://elsewhere.example" },
    });
    expect(response.status).toBe(403);
    expect(response.headers.getSetCookie()).toEqual([]);
  });

  it("when the password is shorter than 10 characters, then sign-up is refused and no session starts", async () => {
    const client = new ApiClient(server.url);
    const response = await client.signUp({ ...freshUser("Short"), password: "nine-char" });
    expect(response.status).toBe(400);
    expect(client.signedIn).toBe(false);
  });

  it("when the demo engineer signs in, then /api/me lists the demo workspace with the engineer role", async () => {
    const client = new ApiClient(server.url);
    expect((await client.signIn("priya@halvard.example", "ember-demo-2026")).status).toBe(200);
    const me = await client.get("/api/me");
    expect(me.body.memberships).toContainEqual({
      workspace: expect.objectContaining({ slug: "halvard-thermal", name: "Halvard Thermoworks — Ember line" }),
      role: "engineer",
    });
  });
});
