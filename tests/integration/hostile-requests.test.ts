/**
 * The hostile requests of issue 11, each as a named test: every one answered with a 4xx and a
 * sentence, never a 500, never stored. Expected statuses follow RFC 9110 (400 malformed request,
 * 403 refused, 404 no such resource, 413 content too large, 415 unsupported media type) and
 * RFC 6585 (429 too many requests, with Retry-After).
 */
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startTestServer, type TestServer } from "../support/test-server.js";
import { ApiClient, freshUser, signedInClient } from "./api-client.js";
import { addMemberInDatabase, twoLagPlant, workspaceWithTeam } from "./fixtures.js";

let server: TestServer;
let team: Awaited<ReturnType<typeof workspaceWithTeam>>;
let lead: ApiClient;
let revisionId: string;

/** A sweep big enough to stay queued (this server runs no worker). */
function queuedSweep(name: string) {
  return {
    name,
    plantRevisionId: revisionId,
    structure: "pi",
    ranges: { kp: { min: 0.5, max: 2, count: 30 }, ki: { min: 0.2, max: 1, count: 30 } },
    scenario: { kind: "setpoint-step", horizon: 5, dt: 0.01 },
    criteria: ["iae", "effort"],
  };
}

/** Sends raw bytes with the team engineer's cookie and the app's origin. */
async function raw(path: string, init: { method?: string; headers?: Record<string, string>; body?: BodyInit }, client: ApiClient = team.engineer) {
  const cookie = await cookieOf(client);
  const response = await fetch(`${server.url}${path}`, {
    method: init.method ?? "POST",
    headers: { origin: server.url, cookie, ...init.headers },
    body: init.body,
    redirect: "manual",
  });
  const text = await response.text();
  let body: any = text;
  try {
    body = JSON.parse(text);
  } catch {
    // keep the text
  }
  return { status: response.status, body, headers: response.headers };
}

/** The Cookie header of clients signed in with signedIn(). */
const cookieJar = new Map<ApiClient, string>();

async function cookieOf(client: ApiClient): Promise<string> {
  return cookieJar.get(client) ?? "";
}

/** Signs in a fresh client and remembers its cookie for raw requests. */
async function signedIn(email: string, password: string): Promise<ApiClient> {
  const client = new ApiClient(server.url);
  const response = await client.signIn(email, password);
  expect(response.status).toBe(200);
  const cookie = response.headers
    .getSetCookie()
    .map((line) => line.split(";")[0])
    .join("; ");
  cookieJar.set(client, cookie);
  return client;
}

function expectSentence(body: any): void {
  expect(typeof body?.error?.message).toBe("string");
  expect(body.error.message.length).toBeGreaterThan(10);
}

beforeAll(async () => {
  server = await startTestServer({ embeddedWorker: false, limits: { maxCandidates: 10_000, maxConcurrentSweeps: 20 } });
  team = await workspaceWithTeam(server.url, "Hostile");
  team.engineer = await signedIn(team.credentials.engineer.email, team.credentials.engineer.password);
  const leadUser = await signedInClient(server.url, "Hostile lead");
  lead = leadUser.client;
  await addMemberInDatabase(team.slug, leadUser.user.email, "lead");
  const plant = await team.engineer.post(`/api/workspaces/${team.slug}/plants`, twoLagPlant("Hostile plant"));
  expect(plant.status).toBe(201);
  revisionId = plant.body.revision.id;
}, 120_000);

afterAll(async () => {
  await server?.close();
});

describe("sizes taken from input, checked before anything is built from them (issue 11, item 1)", () => {
  const plants = () => `/api/workspaces/${team.slug}/plants`;

  it("when a sweep's ‖W·S‖∞ weight has 20,000 denominator coefficients, then 400 naming the weight, with a sentence", async () => {
    const response = await team.engineer.post(`/api/workspaces/${team.slug}/sweeps`, {
      ...queuedSweep("Huge weight"),
      criteria: ["iae", "wsNorm"],
      criterionOptions: { weight: { num: [1], den: Array(20_000).fill(1) } },
    });
    expect(response.status).toBe(400);
    expect(response.body.error.field).toMatch(/^criterionOptions\.weight/);
    expect(response.body.error.message).toMatch(/at most 11 coefficients/);
  });

  it("when a state-space plant's B has 5,000 rows, then 400 naming B", async () => {
    const response = await team.engineer.post(plants(), {
      name: "Tall B",
      unitsNote: "",
      model: { kind: "state-space", A: [[-1]], B: Array(5_000).fill([1]), C: [[1]], D: [[0]] },
    });
    expect(response.status).toBe(400);
    expect(response.body.error.field).toMatch(/B$/);
    expectSentence(response.body);
  });

  it("when a nonlinear plant names 5,000 parameters or 5,000 derivatives, then 400 naming the field", async () => {
    const base = { kind: "nonlinear", states: ["h"], parameters: { a: 1 }, derivatives: ["-a*h + u"], output: "h", initial: [0] };
    const parameters = Object.fromEntries(Array.from({ length: 5_000 }, (_, i) => [`p${i}`, i]));
    const many = await team.engineer.post(plants(), { name: "Many parameters", unitsNote: "", model: { ...base, parameters } });
    expect(many.status).toBe(400);
    expect(many.body.error.field).toMatch(/parameters$/);
    const derivatives = await team.engineer.post(plants(), { name: "Many derivatives", unitsNote: "", model: { ...base, derivatives: Array(5_000).fill("u") } });
    expect(derivatives.status).toBe(400);
    expect(derivatives.body.error.field).toMatch(/derivatives$/);
  });
});

describe("bad text in names, labels and units notes", () => {
  const plants = () => `/api/workspaces/${team.slug}/plants`;

  it("when a plant name holds a NUL character, then 400 naming the field", async () => {
    const response = await team.engineer.post(plants(), twoLagPlant("Ember\u0000200"));
    expect(response.status).toBe(400);
    expect(response.body.error.field).toBe("name");
    expectSentence(response.body);
  });

  it("when a units note holds a NUL character, then 400 naming unitsNote", async () => {
    const response = await team.engineer.post(plants(), { ...twoLagPlant("Ember NUL note"), unitsNote: "u: W\u0000" });
    expect(response.status).toBe(400);
    expect(response.body.error.field).toBe("unitsNote");
  });

  it("when a workspace name holds a NUL character, then 400 naming name", async () => {
    const response = await team.engineer.post("/api/workspaces", { name: "Ember\u0000line" });
    expect(response.status).toBe(400);
    expect(response.body.error.field).toBe("name");
  });

  it("when a sweep name or a family label holds a NUL character, then 400 naming the field", async () => {
    const named = await team.engineer.post(`/api/workspaces/${team.slug}/sweeps`, queuedSweep("Sweep\u0000"));
    expect(named.status).toBe(400);
    expect(named.body.error.field).toBe("name");
    const labelled = await team.engineer.post(`/api/workspaces/${team.slug}/sweeps`, {
      ...queuedSweep("Labelled"),
      family: { name: "Family", variants: [{ plantRevisionId: revisionId, label: "plate\u0000" }] },
    });
    expect(labelled.status).toBe(400);
    expect(labelled.body.error.field).toBe("family.variants.0.label");
  });

  it("when a plant name holds a control character (BEL), then 400 saying which characters are allowed", async () => {
    const response = await team.engineer.post(plants(), twoLagPlant("Ember\u0007bell"));
    expect(response.status).toBe(400);
    expect(response.body.error.message).toMatch(/control characters.*tab and newline/);
  });

  it("when a units note holds tabs and newlines, then it is stored as typed", async () => {
    const response = await team.engineer.post(plants(), { ...twoLagPlant("Ember tabbed"), unitsNote: "u:\theater [W]\ny:\tplate [°C]" });
    expect(response.status).toBe(201);
    expect(response.body.plant.unitsNote ?? response.body.revision.unitsNote).toBe("u:\theater [W]\ny:\tplate [°C]");
  });

  it("when a name is typed decomposed (e + U+0301), then it is stored in NFC (U+00E9) — Unicode UAX #15", async () => {
    const response = await team.engineer.post(plants(), twoLagPlant("Ember cafe\u0301 plate"));
    expect(response.status).toBe(201);
    expect(response.body.plant.name).toBe("Ember caf\u00e9 plate");
  });

  it("when a sweep name holds a lone surrogate, then 400 (jsonb cannot store it)", async () => {
    const body = JSON.stringify(queuedSweep("PLACEHOLDER")).replace("PLACEHOLDER", "Sweep \\ud800 broken");
    const response = await team.engineer.request("POST", `/api/workspaces/${team.slug}/sweeps`, { rawBody: body });
    expect(response.status).toBe(400);
    expect(response.body.error.field).toBe("name");
    expect(response.body.error.message).toMatch(/surrogate/);
  });

  it("when a plant name holds a lone surrogate, then 400", async () => {
    const body = JSON.stringify(twoLagPlant("PLACEHOLDER")).replace("PLACEHOLDER", "Plate \\udc00");
    const response = await team.engineer.request("POST", plants(), { rawBody: body });
    expect(response.status).toBe(400);
  });
});

describe("bad addresses", () => {
  it("when a candidate index is above 2³¹, then 404 (not integer out of range)", async () => {
    const sweepId = randomUUID();
    for (const index of ["2147483648", "99999999999999999999", "1e3", "-1"]) {
      const response = await team.viewer.get(`/api/workspaces/${team.slug}/sweeps/${sweepId}/candidates/${index}`);
      expect({ index, status: response.status }).toEqual({ index, status: 404 });
      expectSentence(response.body);
    }
  });

  it("when a path holds a malformed percent-encoding, then 400", async () => {
    const response = await team.viewer.get(`/api/workspaces/%E0%A4%A/plants`);
    expect(response.status).toBe(400);
    expect(response.body.error.message).toMatch(/percent-escape/);
  });

  it("when a path holds %00, then 400", async () => {
    const response = await team.viewer.get(`/api/workspaces/${team.slug}%00/plants`);
    expect(response.status).toBe(400);
    expect(response.body.error.message).toMatch(/control character/);
  });

  it("when a page address holds a malformed percent-encoding, then 400 too", async () => {
    const response = await new ApiClient(server.url).get(`/w/%ED%A0%80`);
    expect(response.status).toBe(400);
  });
});

describe("bad bodies", () => {
  it("when a body says Content-Encoding: gzip but is not compressed, then 400 saying so", async () => {
    const response = await raw(`/api/workspaces/${team.slug}/plants`, {
      headers: { "content-type": "application/json", "content-encoding": "gzip" },
      body: JSON.stringify(twoLagPlant("Fake gzip")),
    });
    expect(response.status).toBe(400);
    expect(response.body.error.message).toMatch(/compressed/);
  });

  it("when a body says Content-Encoding: br but is not compressed, then 400 saying so", async () => {
    const response = await raw(`/api/workspaces/${team.slug}/plants`, {
      headers: { "content-type": "application/json", "content-encoding": "br" },
      body: JSON.stringify(twoLagPlant("Fake br")),
    });
    expect(response.status).toBe(400);
    expect(response.body.error.message).toMatch(/compressed/);
  });

  it("when 10,000 nested arrays are posted to /api/auth/update-user, then 413 (over the 8 kB auth limit), and 1,000 nested 400", async () => {
    const nested = (depth: number) => `{"name":${"[".repeat(depth)}${"]".repeat(depth)}}`;
    const huge = await raw("/api/auth/update-user", { headers: { "content-type": "application/json" }, body: nested(10_000) });
    expect(huge.status).toBe(413);
    expectSentence(huge.body);
    const deep = await raw("/api/auth/update-user", { headers: { "content-type": "application/json" }, body: nested(1_000) });
    expect(deep.status).toBe(400);
    expect(deep.body.error.message).toMatch(/nested deeper/);
  });

  it("when 10,000 nested arrays are posted to the API, then 400 with a sentence", async () => {
    const nested = `{"name":"x","model":${"[".repeat(10_000)}${"]".repeat(10_000)}}`;
    const response = await raw(`/api/workspaces/${team.slug}/plants`, { headers: { "content-type": "application/json" }, body: nested });
    expect(response.status).toBe(400);
    expect(response.body.error.message).toMatch(/nested deeper/);
  });
});

describe("auth endpoints", () => {
  it("when a sign-in body is 1 MB, then 413 before it is parsed", async () => {
    const response = await new ApiClient(server.url).request("POST", "/api/auth/sign-in/email", {
      rawBody: JSON.stringify({ email: "x@loopyard-tests.example", password: "p".repeat(1_000_000) }),
    });
    expect(response.status).toBe(413);
    expectSentence(response.body);
  });

  it("when a 5 MB user name is sent to sign-up, then 413, and a 200-character name 400", async () => {
    const huge = await new ApiClient(server.url).signUp({ ...freshUser("Huge name"), name: "N".repeat(5_000_000) });
    expect(huge.status).toBe(413);
    const long = await new ApiClient(server.url).signUp({ ...freshUser("Long name"), name: "N".repeat(200) });
    expect(long.status).toBe(400);
    expect(long.body.error.field).toBe("name");
  });

  it("when a signed-in user renames themselves to 200 characters or with a NUL, then 400 and the name stays", async () => {
    const { client, user } = await signedInClient(server.url, "Renamer");
    expect((await client.post("/api/auth/update-user", { name: "R".repeat(200) })).status).toBe(400);
    expect((await client.post("/api/auth/update-user", { name: "Re\u0000named" })).status).toBe(400);
    expect((await client.get("/api/me")).body.user.name).toBe(user.name);
  });

  it("when someone signs up with a taken address, then the answer looks like a fresh sign-up (no enumeration)", async () => {
    const taken = await new ApiClient(server.url).request("POST", "/api/auth/sign-up/email", {
      json: { name: "Someone Else", email: "priya@halvard.example", password: "another-long-secret" },
    });
    const fresh = await new ApiClient(server.url).request("POST", "/api/auth/sign-up/email", { json: { ...freshUser("Fresh"), name: "Someone Else" } });
    expect(taken.status).toBe(200);
    expect(fresh.status).toBe(200);
    expect(Object.keys(taken.body).sort()).toEqual(Object.keys(fresh.body).sort());
    expect(Object.keys(taken.body.user).sort()).toEqual(Object.keys(fresh.body.user).sort());
    expect(taken.body.token).toBeNull();
    expect(fresh.body.token).toBeNull();
    expect(taken.headers.getSetCookie()).toEqual([]);
    expect(fresh.headers.getSetCookie()).toEqual([]);
    // And Priya's account is untouched: her password still works.
    expect((await new ApiClient(server.url).signIn("priya@halvard.example", "ember-demo-2026")).status).toBe(200);
  });

  it("when a common password of 10+ characters is chosen, then sign-up is refused naming the list (NIST SP 800-63B 5.1.1.2)", async () => {
    for (const password of ["qwertyuiop", "1234567890", "Password123"]) {
      const response = await new ApiClient(server.url).signUp({ ...freshUser("Common"), password });
      expect({ password, status: response.status }).toEqual({ password, status: 400 });
      expect(response.body.error.message).toMatch(/most common passwords/);
    }
  });
});

describe("sessions", () => {
  it("when a user is signed in twice, then they list both sessions and revoke the other, which is signed out at once", async () => {
    const { client: first, user } = await signedInClient(server.url, "Two browsers");
    const second = new ApiClient(server.url);
    expect((await second.signIn(user.email, user.password)).status).toBe(200);
    expect((await second.get("/api/me")).status).toBe(200);
    const listed = await first.get("/api/me/sessions");
    expect(listed.status).toBe(200);
    expect(listed.body).toHaveLength(2);
    expect(listed.body.filter((s: { current: boolean }) => s.current)).toHaveLength(1);
    expect(JSON.stringify(listed.body)).not.toMatch(/token/i);
    const other = listed.body.find((s: { current: boolean }) => !s.current);
    expect((await first.request("DELETE", `/api/me/sessions/${other.id}`)).status).toBe(204);
    expect((await second.get("/api/me")).status).toBe(401);
    expect((await first.get("/api/me")).status).toBe(200);
  });

  it("when a user revokes a session that is not theirs, then 404 and it lives on", async () => {
    const { client: owner } = await signedInClient(server.url, "Session owner");
    const { client: stranger } = await signedInClient(server.url, "Session stranger");
    const [session] = (await owner.get("/api/me/sessions")).body;
    expect((await stranger.request("DELETE", `/api/me/sessions/${session.id}`)).status).toBe(404);
    expect((await owner.get("/api/me")).status).toBe(200);
  });

  it("when a user signs out, then the session cache does not keep them signed in", async () => {
    const { client } = await signedInClient(server.url, "Sign-out cache");
    expect((await client.get("/api/me")).status).toBe(200);
    expect((await client.signOut()).status).toBe(200);
    expect((await client.get("/api/me")).status).toBe(401);
  });
});

describe("cross-site requests", () => {
  let sweepId: string;

  beforeAll(async () => {
    const created = await team.engineer.post(`/api/workspaces/${team.slug}/sweeps`, queuedSweep("Cross-site target"));
    expect(created.status).toBe(201);
    sweepId = created.body.id;
  });

  it("when a form on another port of the same host posts cancel, then 403 (Origin checked)", async () => {
    const other = server.url.replace(/:(\d+)$/, (_m, port) => `:${Number(port) + 1}`);
    const response = await raw(`/api/workspaces/${team.slug}/sweeps/${sweepId}/cancel`, {
      headers: { origin: other, "sec-fetch-site": "same-site", "content-type": "application/x-www-form-urlencoded" },
      body: "",
    });
    expect(response.status).toBe(403);
    expect(response.body.error.message).toMatch(/another site|another origin/);
    expect((await team.viewer.get(`/api/workspaces/${team.slug}/sweeps/${sweepId}`)).body.status).toBe("queued");
  });

  it("when a signed-in change names no origin at all, then 403", async () => {
    const cookie = cookieJar.get(team.engineer)!;
    const response = await fetch(`${server.url}/api/workspaces/${team.slug}/sweeps/${sweepId}/cancel`, { method: "POST", headers: { cookie } });
    expect(response.status).toBe(403);
  });

  it("when a body is sent as a form from the app's own origin, then 415 asking for JSON", async () => {
    const response = await raw(`/api/workspaces/${team.slug}/plants`, { headers: { "content-type": "text/plain" }, body: JSON.stringify(twoLagPlant("Plain")) });
    expect(response.status).toBe(415);
  });
});

describe("cancel rights", () => {
  it("when an engineer cancels a colleague's sweep, then 403; its author, a lead and an admin may", async () => {
    const colleague = await signedInClient(server.url, "Hostile colleague");
    await addMemberInDatabase(team.slug, colleague.user.email, "engineer");
    const ids: string[] = [];
    for (let i = 0; i < 3; i += 1) {
      const created = await team.engineer.post(`/api/workspaces/${team.slug}/sweeps`, queuedSweep(`Cancel rights ${i}`));
      expect(created.status).toBe(201);
      ids.push(created.body.id);
    }
    const path = (id: string) => `/api/workspaces/${team.slug}/sweeps/${id}/cancel`;
    const refused = await colleague.client.post(path(ids[0]!));
    expect(refused.status).toBe(403);
    expect(refused.body.error.message).toMatch(/a lead or an admin/);
    expect((await team.engineer.post(path(ids[0]!))).status).toBe(200);
    expect((await lead.post(path(ids[1]!))).status).toBe(200);
    expect((await team.admin.post(path(ids[2]!))).status).toBe(200);
  });
});

describe("headers", () => {
  it("when any answer is sent, then it carries a CSP, a Permissions-Policy and a request id", async () => {
    const response = await new ApiClient(server.url).get("/api/health");
    expect(response.headers.get("content-security-policy")).toMatch(/default-src 'none'/);
    expect(response.headers.get("permissions-policy")).toMatch(/camera=\(\)/);
    expect(response.headers.get("x-request-id")).toMatch(/^[0-9a-f-]{36}$/);
  });
});
