import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startTestServer, type TestServer } from "../support/test-server.js";
import { twoLagPlant, workspaceWithTeam } from "./fixtures.js";

let server: TestServer;
let source: Awaited<ReturnType<typeof workspaceWithTeam>>;
let target: Awaited<ReturnType<typeof workspaceWithTeam>>;

const heater = {
  name: "Library heater",
  unitsNote: "u: power fraction; y: temperature rise [K]",
  note: "typed from the data sheet",
  model: { kind: "nonlinear", states: ["x"], parameters: { tau: 2, k: 3 }, derivatives: ["(-x + k*u) / tau"], output: "x", initial: [0], actuator: { min: 0, max: 1 } },
};

beforeAll(async () => {
  server = await startTestServer();
  source = await workspaceWithTeam(server.url, "Library source");
  target = await workspaceWithTeam(server.url, "Library target");
  const path = `/api/workspaces/${source.slug}`;
  const lags = await source.engineer.post(`${path}/plants`, twoLagPlant("Library lags"));
  expect(lags.status, JSON.stringify(lags.body)).toBe(201);
  const revised = await source.engineer.post(`${path}/plants/${lags.body.plant.id}/revisions`, {
    ...twoLagPlant("Library lags"),
    note: "dead time from the second test",
    model: { kind: "transfer-function", num: [1], den: [1, 3, 2], delay: 0.3 },
  });
  expect(revised.status).toBe(201);
  const expressions = await source.engineer.post(`${path}/plants`, heater);
  expect(expressions.status, JSON.stringify(expressions.body)).toBe(201);
  const family = await source.engineer.post(`${path}/families`, {
    name: "Library line",
    description: "lags and a spread heater",
    definition: {
      entries: [
        { plantRevisionId: lags.body.plant.latestRevision.id, label: "lags, first fit" },
        { plantRevisionId: revised.body.revision.id, label: "lags, second fit" },
        { plantRevisionId: expressions.body.revision.id, label: "heater", spread: { ranges: { tau: { min: 1.5, max: 2.5, count: 3 } }, design: { kind: "grid" } } },
      ],
    },
  });
  expect(family.status, JSON.stringify(family.body)).toBe(201);
}, 120_000);

afterAll(async () => {
  await server?.close();
});

describe("library files", () => {
  it("when a library is exported, imported into an empty workspace and exported again, then the two files are the same JSON", async () => {
    const first = await source.viewer.get(`/api/workspaces/${source.slug}/library/export`);
    expect(first.status).toBe(200);
    expect(first.body).toMatchObject({ format: "loopyard.library", version: 1 });
    expect(first.body.plants.map((p: { key: string; name: string }) => [p.key, p.name])).toEqual([
      ["p1", "Library heater"],
      ["p2", "Library lags"],
    ]);
    expect(first.body.families[0].revisions[0].entries.map((e: { plant: string; plantRevision: number }) => [e.plant, e.plantRevision])).toEqual([
      ["p2", 1],
      ["p2", 2],
      ["p1", 1],
    ]);
    const preview = await target.engineer.post(`/api/workspaces/${target.slug}/library/import/preview`, { file: first.body });
    expect(preview.status).toBe(200);
    expect([...preview.body.plants, ...preview.body.families].every((i: { action: string }) => i.action === "create")).toBe(true);
    expect((await target.viewer.get(`/api/workspaces/${target.slug}/plants`)).body).toEqual([]);
    const imported = await target.engineer.post(`/api/workspaces/${target.slug}/library/import`, { file: first.body });
    expect(imported.status, JSON.stringify(imported.body)).toBe(201);
    const again = await target.viewer.get(`/api/workspaces/${target.slug}/library/export`);
    // The file holds no ids, authors or dates, so "ids aside" is the whole file.
    expect(again.body).toEqual(first.body);
    const families = await target.viewer.get(`/api/workspaces/${target.slug}/families`);
    expect(families.body[0].latestRevision.variants).toHaveLength(5);
  });

  it("when names clash, then the preview lists renames (or skips) and the import does what it listed", async () => {
    const file = (await source.viewer.get(`/api/workspaces/${source.slug}/library/export`)).body;
    const renamed = await target.engineer.post(`/api/workspaces/${target.slug}/library/import/preview`, { file, onClash: "rename" });
    expect(renamed.body.plants.map((p: { action: string; finalName: string }) => [p.action, p.finalName])).toEqual([
      ["rename", "Library heater (imported)"],
      ["rename", "Library lags (imported)"],
    ]);
    const skipped = await target.engineer.post(`/api/workspaces/${target.slug}/library/import/preview`, { file, onClash: "skip" });
    expect(skipped.body.families[0]).toMatchObject({ action: "skip" });
    const done = await target.engineer.post(`/api/workspaces/${target.slug}/library/import`, { file, onClash: "rename" });
    expect(done.status).toBe(201);
    const names = (await target.viewer.get(`/api/workspaces/${target.slug}/plants`)).body.map((p: { name: string }) => p.name);
    expect(names).toEqual(expect.arrayContaining(["Library lags", "Library lags (imported)"]));
  });

  it("when one plant or one family is exported, then the file holds it (and the family's plants) only", async () => {
    const plants = (await source.viewer.get(`/api/workspaces/${source.slug}/plants`)).body;
    const lags = plants.find((p: { name: string }) => p.name === "Library lags");
    const one = await source.viewer.get(`/api/workspaces/${source.slug}/library/export?plant=${lags.id}`);
    expect(one.body.plants.map((p: { name: string }) => p.name)).toEqual(["Library lags"]);
    expect(one.body.families).toEqual([]);
    const family = (await source.viewer.get(`/api/workspaces/${source.slug}/families`)).body[0];
    const withPlants = await source.viewer.get(`/api/workspaces/${source.slug}/library/export?family=${family.id}`);
    expect(withPlants.body.plants).toHaveLength(2);
    expect(withPlants.body.families).toHaveLength(1);
  });

  it("when a file has an unknown version or a bad field, then the import is refused naming the field and nothing is created", async () => {
    const file = (await source.viewer.get(`/api/workspaces/${source.slug}/library/export`)).body;
    const before = (await target.viewer.get(`/api/workspaces/${target.slug}/plants`)).body.length;
    const version = await target.engineer.post(`/api/workspaces/${target.slug}/library/import`, { file: { ...file, version: 7 } });
    expect(version.status).toBe(400);
    expect(version.body.error.field).toBe("file.version");
    const broken = structuredClone(file);
    broken.plants[1].revisions[0].model.den = [0, 0];
    const bad = await target.engineer.post(`/api/workspaces/${target.slug}/library/import`, { file: broken });
    expect(bad.status).toBe(400);
    expect(bad.body.error.field).toBe("file.plants.1.revisions.0.model.den");
    const wrongParameter = structuredClone(file);
    wrongParameter.families[0].revisions[0].entries[2].spread.ranges = { mass: { min: 1, max: 2, count: 2 } };
    const misfit = await target.engineer.post(`/api/workspaces/${target.slug}/library/import`, { file: wrongParameter });
    expect(misfit.status).toBe(400);
    expect(misfit.body.error.field).toBe("file.families.0.revisions.0.entries.2.parameters");
    expect((await target.viewer.get(`/api/workspaces/${target.slug}/plants`)).body.length).toBe(before);
    const viewer = await target.viewer.post(`/api/workspaces/${target.slug}/library/import`, { file });
    expect(viewer.status).toBe(403);
  });
});
