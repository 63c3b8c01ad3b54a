import { expandFamily } from "@loopyard/core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startTestServer, type TestServer } from "../support/test-server.js";
import { smallComparison } from "./comparison-fixtures.js";
import { twoLagPlant, twoVariantFamily, workspaceWithTeam } from "./fixtures.js";

let server: TestServer;
let team: Awaited<ReturnType<typeof workspaceWithTeam>>;
let lagRevision: string;
let heaterRevision: string;

// dx/dt = (−x + k·u)/τ: a lag typed as expressions, so its parameters τ and k can spread.
const heater = {
  name: "Bench heater (expressions)",
  unitsNote: "u: power fraction; y: temperature rise [K]",
  model: { kind: "nonlinear", states: ["x"], parameters: { tau: 2, k: 3 }, derivatives: ["(-x + k*u) / tau"], output: "x", initial: [0] },
};

beforeAll(async () => {
  server = await startTestServer({ limits: { maxCandidates: 1_000, maxConcurrentSweeps: 20 } });
  team = await workspaceWithTeam(server.url, "Families");
  const lag = await team.engineer.post(plantsPath(), twoLagPlant("Family lags"));
  expect(lag.status, JSON.stringify(lag.body)).toBe(201);
  lagRevision = lag.body.revision.id;
  const expressions = await team.engineer.post(plantsPath(), heater);
  expect(expressions.status, JSON.stringify(expressions.body)).toBe(201);
  heaterRevision = expressions.body.revision.id;
}, 120_000);

afterAll(async () => {
  await server?.close();
});

const plantsPath = () => `/api/workspaces/${team.slug}/plants`;
const familiesPath = () => `/api/workspaces/${team.slug}/families`;

/** The lag plate, then a 2 × 2 grid over the heater's τ and k. */
function spreadFamily(name: string) {
  return {
    name,
    description: "lags and a heater spread over its time constant and gain",
    definition: {
      entries: [
        { plantRevisionId: lagRevision, label: "lags" },
        { plantRevisionId: heaterRevision, label: "heater", spread: { ranges: { tau: { min: 1.5, max: 2.5, count: 2 }, k: { min: 2.5, max: 3.5, count: 2 } }, design: { kind: "grid" } } },
      ],
    },
  };
}

describe("families in the library", () => {
  it("when an engineer saves a family with a spread, then it is listed and its revision expands to 1 + 2·2 variants in the stated order", async () => {
    const created = await team.engineer.post(familiesPath(), spreadFamily("Bench line"));
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const variants = created.body.revision.variants;
    expect(variants).toHaveLength(5);
    // Grid order: names sorted ("k" < "tau"), the first slowest (core expandFamily).
    expect(variants.slice(1).map((v: { parameters: { k: number; tau: number } }) => [v.parameters.k, v.parameters.tau])).toEqual([
      [2.5, 1.5],
      [2.5, 2.5],
      [3.5, 1.5],
      [3.5, 2.5],
    ]);
    expect(variants[0]).toMatchObject({ plantName: "Family lags", revisionNumber: 1, label: "lags" });
    expect(created.body.revision.note).toBeNull();
    const list = await team.viewer.get(familiesPath());
    expect(list.status).toBe(200);
    expect(list.body.map((f: { name: string }) => f.name)).toContain("Bench line");
  });

  it("when a viewer saves or archives a family, then the answer is 403 naming the engineer role", async () => {
    const refused = await team.viewer.post(familiesPath(), spreadFamily("Viewer line"));
    expect(refused.status).toBe(403);
    expect(refused.body.error.message).toBe(`Saving families needs the engineer role or higher in ${team.name}; you are a viewer.`);
    const created = await team.engineer.post(familiesPath(), twoVariantFamily("Viewer cannot archive", lagRevision));
    expect((await team.viewer.post(`${familiesPath()}/${created.body.family.id}/archive`, {})).status).toBe(403);
  });

  it("when a family names a parameter its plant lacks, or a plant of another workspace, then the answer is 400 naming the entry", async () => {
    const body = spreadFamily("Wrong parameter");
    body.definition.entries[1]!.spread!.ranges = { mass: { min: 1, max: 2, count: 2 } } as never;
    const response = await team.engineer.post(familiesPath(), body);
    expect(response.status).toBe(400);
    expect(response.body.error.field).toBe("definition.entries.1.spread.ranges");
    expect(response.body.error.message).toContain("“mass”");
    const other = await workspaceWithTeam(server.url, "Families other");
    const foreign = await other.engineer.post(`/api/workspaces/${other.slug}/families`, twoVariantFamily("Foreign", lagRevision));
    expect(foreign.status).toBe(400);
    expect(foreign.body.error.field).toBe("definition.entries.0.plantRevisionId");
  });

  it("when an engineer revises a family, then a change note is required, earlier revisions stay, and the diff lists the variant changes", async () => {
    const created = await team.engineer.post(familiesPath(), twoVariantFamily("Revised line", lagRevision));
    const id = created.body.family.id;
    const body = { ...twoVariantFamily("Revised line", lagRevision), definition: { entries: [{ plantRevisionId: lagRevision, label: "bench A" }, { plantRevisionId: heaterRevision, label: "heater", parameters: { k: 4 } }] } };
    const noNote = await team.engineer.post(`${familiesPath()}/${id}/revisions`, body);
    expect(noNote.status).toBe(400);
    expect(noNote.body.error.field).toBe("note");
    const revised = await team.engineer.post(`${familiesPath()}/${id}/revisions`, { ...body, note: "bench B replaced by the heater at k = 4" });
    expect(revised.status).toBe(201);
    expect(revised.body.revision.number).toBe(2);
    expect(revised.body.revisions.map((r: { note: string | null }) => r.note)).toEqual([null, "bench B replaced by the heater at k = 4"]);
    const first = await team.viewer.get(`${familiesPath()}/${id}?revision=1`);
    expect(first.body.revision).toEqual(created.body.revision);
    const diff = await team.viewer.get(`${familiesPath()}/${id}/diff?from=1&to=2`);
    expect(diff.status).toBe(200);
    expect(diff.body.changes.map((c: { field: string; change: string }) => [c.field, c.change])).toEqual([
      ["variants.bench B", "removed"],
      ["variants.heater", "added"],
    ]);
    const defaults = await team.viewer.get(`${familiesPath()}/${id}/diff`);
    expect([defaults.body.from, defaults.body.to]).toEqual([1, 2]);
    expect((await team.viewer.get(`${familiesPath()}/${id}/diff?from=1&to=9`)).status).toBe(404);
  });

  it("when a family is archived, then it is marked (and kept), and restoring clears the mark", async () => {
    const created = await team.engineer.post(familiesPath(), twoVariantFamily("Archived line", lagRevision));
    const id = created.body.family.id;
    const archived = await team.engineer.post(`${familiesPath()}/${id}/archive`, {});
    expect(archived.status).toBe(200);
    expect(archived.body.family.archivedAt).not.toBeNull();
    const listed = (await team.viewer.get(familiesPath())).body.find((f: { id: string }) => f.id === id);
    expect(listed.archivedAt).not.toBeNull();
    const restored = await team.engineer.post(`${familiesPath()}/${id}/restore`, {});
    expect(restored.body.family.archivedAt).toBeNull();
  });
});

describe("sweeps and comparisons on a saved family", () => {
  const sweepBody = (name: string, extra: Record<string, unknown>) => ({
    name,
    structure: "pi",
    ranges: { kp: { min: 0.5, max: 2, count: 2 }, ki: { min: 0.2, max: 1, count: 2 } },
    scenario: { kind: "setpoint-step", horizon: 5, dt: 0.01 },
    criteria: ["iae", "effort"],
    ...extra,
  });

  it("when a sweep names a family revision, then the stored definition holds exactly its expanded variants and which revision it used", async () => {
    const family = await team.engineer.post(familiesPath(), spreadFamily("Swept line"));
    const revision = family.body.revision;
    const sweep = await team.engineer.post(`/api/workspaces/${team.slug}/sweeps`, sweepBody("On the swept line", { familyRevisionId: revision.id }));
    expect(sweep.status, JSON.stringify(sweep.body)).toBe(201);
    const expected = expandFamily(revision.definition, "Swept line");
    expect(sweep.body.definition.family.variants).toEqual(expected.variants);
    expect(sweep.body.definition.family.source).toEqual({ familyId: family.body.family.id, familyRevisionId: revision.id, number: 1 });
    expect(sweep.body.definition.plantRevisionId).toBe(lagRevision);
    expect(sweep.body.family).toHaveLength(5);
    const detail = await team.viewer.get(`${familiesPath()}/${family.body.family.id}`);
    expect(detail.body.usedBy).toEqual([{ kind: "sweep", id: sweep.body.id, name: "On the swept line", revisionNumber: 1 }]);
  });

  it("when a sweep lists other variants than its family revision, or names a revision that does not exist, then the answer is 400 naming the field", async () => {
    const family = await team.engineer.post(familiesPath(), twoVariantFamily("Mismatched line", lagRevision));
    const mismatch = await team.engineer.post(
      `/api/workspaces/${team.slug}/sweeps`,
      sweepBody("Mismatch", { familyRevisionId: family.body.revision.id, plantRevisionId: lagRevision, family: { variants: [{ plantRevisionId: lagRevision }] } }),
    );
    expect(mismatch.status).toBe(400);
    expect(mismatch.body.error.field).toBe("family");
    const missing = await team.engineer.post(`/api/workspaces/${team.slug}/sweeps`, sweepBody("Missing", { familyRevisionId: "00000000-0000-4000-8000-000000000000" }));
    expect(missing.status).toBe(400);
    expect(missing.body.error.field).toBe("familyRevisionId");
    const forged = await team.engineer.post(
      `/api/workspaces/${team.slug}/sweeps`,
      sweepBody("Forged", {
        plantRevisionId: lagRevision,
        family: { source: { familyId: family.body.family.id, familyRevisionId: family.body.revision.id, number: 1 }, variants: [{ plantRevisionId: lagRevision }] },
      }),
    );
    expect(forged.status).toBe(400);
    expect(forged.body.error.field).toBe("familyRevisionId");
  });

  it("when a comparison names a family revision, then it runs on that revision's variants", async () => {
    const family = await team.engineer.post(familiesPath(), twoVariantFamily("Compared line", lagRevision));
    const { family: _adHoc, ...body } = smallComparison("On the compared line", [lagRevision], {
      structure: "pi",
      ranges: { kp: { min: 0.2, max: 5, scale: "log" }, ki: { min: 0.1, max: 2, scale: "log" } },
      filter: undefined,
      scenario: { kind: "setpoint-step", horizon: 5, dt: 0.01 },
      contenders: ["iae", "ise"],
      judges: ["overshoot"],
      constraints: {},
      budget: { prescan: 16, starts: 1, evaluations: 20, stability: false },
    });
    const comparison = await team.engineer.post(`/api/workspaces/${team.slug}/comparisons`, { ...body, familyRevisionId: family.body.revision.id });
    expect(comparison.status, JSON.stringify(comparison.body)).toBe(201);
    expect(comparison.body.definition.family.variants.map((v: { label: string }) => v.label)).toEqual(["bench A", "bench B"]);
    expect(comparison.body.definition.family.source.familyRevisionId).toBe(family.body.revision.id);
  });
});

describe("plant revisions: notes, diff, archive", () => {
  it("when a plant is revised, then the note is required, stored, and the diff names the changed coefficient with its sign", async () => {
    const created = await team.engineer.post(plantsPath(), { ...twoLagPlant("Noted lags"), note: "first fit" });
    expect(created.body.revision.note).toBe("first fit");
    const id = created.body.plant.id;
    const revised = { ...twoLagPlant("Noted lags"), model: { kind: "transfer-function", num: [1], den: [1, 3, -2], delay: 0.2 } };
    const noNote = await team.engineer.post(`${plantsPath()}/${id}/revisions`, revised);
    expect(noNote.status).toBe(400);
    expect(noNote.body.error.field).toBe("note");
    const blank = await team.engineer.post(`${plantsPath()}/${id}/revisions`, { ...revised, note: "   " });
    expect(blank.status).toBe(400);
    const saved = await team.engineer.post(`${plantsPath()}/${id}/revisions`, { ...revised, note: "unstable pole seen in the second test" });
    expect(saved.status, JSON.stringify(saved.body)).toBe(201);
    expect(saved.body.revisions.map((r: { note: string | null }) => r.note)).toEqual(["first fit", "unstable pole seen in the second test"]);
    const diff = await team.viewer.get(`${plantsPath()}/${id}/diff?from=1&to=2`);
    expect(diff.body.changes).toEqual([
      { field: "model.delay", group: "coefficients", change: "changed", before: 0, after: 0.2 },
      { field: "model.den.2", group: "coefficients", change: "changed", before: 2, after: -2 },
    ]);
  });

  it("when a plant is archived, then it stays readable with its mark and a sweep on it still reads; restoring clears the mark", async () => {
    const created = await team.engineer.post(plantsPath(), twoLagPlant("Archived lags"));
    const id = created.body.plant.id;
    const viewerTry = await team.viewer.post(`${plantsPath()}/${id}/archive`, {});
    expect(viewerTry.status).toBe(403);
    const archived = await team.engineer.post(`${plantsPath()}/${id}/archive`, {});
    expect(archived.status).toBe(200);
    expect(archived.body.plant.archivedAt).not.toBeNull();
    expect((await team.viewer.get(`${plantsPath()}/${id}`)).status).toBe(200);
    const restored = await team.engineer.post(`${plantsPath()}/${id}/restore`, {});
    expect(restored.body.plant.archivedAt).toBeNull();
    expect((await team.engineer.post(`${plantsPath()}/00000000-0000-4000-8000-000000000000/archive`, {})).status).toBe(404);
  });
});
