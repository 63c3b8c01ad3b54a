/**
 * Step-test upload and model fitting over real HTTP: upload good and bad files (each bad one gets a
 * sentence naming its row and column), fit the three models, save a fit as an identified plant,
 * refit it as a new revision, and run a sweep on it.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startTestServer, type TestServer } from "../support/test-server.js";
import { twoLagPlant, waitForSweep, workspaceWithTeam } from "./fixtures.js";
import { EMBER_SETTINGS, EMBER_STEP, emberStepCsv } from "./step-test-fixtures.js";

let server: TestServer;
let team: Awaited<ReturnType<typeof workspaceWithTeam>>;
let base: string;

beforeAll(async () => {
  server = await startTestServer();
  team = await workspaceWithTeam(server.url, "Step tests");
  base = `/api/workspaces/${team.slug}`;
}, 60_000);

afterAll(async () => {
  await server?.close();
});

/** Uploads `text` as the engineer and returns the answer. */
function upload(text: string | Uint8Array, name = "ember-400-step.csv", type = "text/csv") {
  return team.engineer.upload(`${base}/step-tests`, { name, text, type });
}

/** The good file with line `line` (1-based, header = 1) replaced. */
function withLine(line: number, replacement: string): string {
  const lines = emberStepCsv().split("\n");
  lines[line - 1] = replacement;
  return lines.join("\n");
}

describe("step-test upload", () => {
  it("when an engineer uploads a CSV, then it is stored and the answer lists its columns, rows, preview and suggested columns", async () => {
    const response = await upload(emberStepCsv());
    expect(response.status, JSON.stringify(response.body)).toBe(201);
    const { overview } = response.body;
    expect(response.body.fileName).toBe("ember-400-step.csv");
    expect(overview.columns.map((c: { name: string }) => c.name)).toEqual(["time_s", "heater_pct", "plate_degC"]);
    expect(overview.rowCount).toBe(401);
    expect(overview.suggested).toEqual({ time: 1, input: 2, output: 3 });
    expect(overview.preview[0]).toEqual({ line: 2, cells: ["0", "30", expect.any(String)] });
    // The viewer reads it back, without its text.
    const read = await team.viewer.get(`${base}/step-tests/${response.body.id}`);
    expect(read.status).toBe(200);
    expect(read.body.overview.rowCount).toBe(401);
    expect(JSON.stringify(read.body)).not.toContain("plate_degC\n");
  });

  it("when a TSV with a decimal comma is uploaded, then its columns are found too", async () => {
    const tsv = emberStepCsv({ delimiter: "\t" }).replace(/(\d)\.(\d)/g, "$1,$2");
    const response = await upload(tsv, "ember.tsv", "text/tab-separated-values");
    expect(response.status, JSON.stringify(response.body)).toBe(201);
    expect(response.body.overview.delimiter).toBe("\t");
  });

  it("when a cell is not a number, then the 400 names its row and column", async () => {
    const response = await upload(withLine(12, "5.5,30,warm"));
    expect(response.status).toBe(400);
    expect(response.body.error.field).toBe("file");
    expect(response.body.error.message).toMatch(/^Row 12, column 3 \("plate_degC"\) holds "warm", not a number; /);
  });

  it("when time does not increase, then the 400 names the row and the time column", async () => {
    const response = await upload(withLine(30, "13,30,21.0"));
    expect(response.status).toBe(400);
    expect(response.body.error.message).toMatch(/^Row 30, column 1 \("time_s"\): time 13 does not increase from 13.5 on row 29, and no other column increases either; sort the rows by time\.$/);
  });

  it("when the file has too few rows, then the 400 says how many it has and needs", async () => {
    const response = await upload(emberStepCsv().split("\n").slice(0, 5).join("\n"));
    expect(response.status).toBe(400);
    expect(response.body.error.message).toBe("The file has 4 data rows; a step test needs at least 10.");
  });

  it("when a row is short, then the 400 names the row", async () => {
    const response = await upload(withLine(40, "19.5,30"));
    expect(response.status).toBe(400);
    expect(response.body.error.message).toBe("Row 40 has 2 cells where the header has 3; give every row the same columns.");
  });

  it("when the file is not text or not a CSV, or larger than 10 MB, then it is refused with a sentence", async () => {
    const binary = await upload(new Uint8Array([0x50, 0x4b, 0x03, 0x04, 0, 0, 1]), "ember.csv", "text/csv");
    expect(binary.status).toBe(415);
    expect(binary.body.error.message).toContain("export it as CSV");
    const workbook = await upload(emberStepCsv(), "ember.xlsx", "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet");
    expect(workbook.status).toBe(415);
    expect(workbook.body.error.message).toContain("is not a CSV or TSV file");
    // 10 MB + 1 byte: multer's memory storage stops reading at the limit.
    const big = await upload(`${"1,2,3\n".repeat(Math.ceil((10 * 1024 * 1024 + 1) / 6))}`);
    expect(big.status).toBe(413);
    expect(big.body.error.message).toContain("larger than the 10 MB allowed");
    const json = await team.engineer.post(`${base}/step-tests`, { file: "1,2,3" });
    expect(json.status).toBe(415);
    expect(json.body.error.message).toContain("multipart/form-data");
  });

  it("when a viewer uploads, then the 403 names the role before the file is read", async () => {
    const response = await team.viewer.upload(`${base}/step-tests`, { name: "ember.csv", text: emberStepCsv() });
    expect(response.status).toBe(403);
    expect(response.body.error.message).toContain("needs the engineer role");
  });
});

describe("fitting, saving and refitting", () => {
  let stepTestId: string;
  let plantId: string;

  beforeAll(async () => {
    const uploaded = await upload(emberStepCsv());
    stepTestId = uploaded.body.id;
  });

  it("when the three models are fitted, then FOPDT brackets the true parameters in its 95 % intervals", async () => {
    const response = await team.engineer.post(`${base}/step-tests/${stepTestId}/fits`, { settings: EMBER_SETTINGS });
    expect(response.status, JSON.stringify(response.body)).toBe(200);
    const { fits, series, stepTime, stepSize } = response.body;
    // The step: 30 → 50 % at t = 20 s (the file's first sample at the new level).
    expect(stepTime).toBe(20);
    expect(stepSize).toBeCloseTo(20, 12);
    expect(series.t.length).toBe(401);
    // Truth k = 0.6 °C/%, τ = 30 s, θ = 4 s (EMBER_STEP) inside each 95 % interval (Bates & Watts 1988, §2.3).
    for (const [name, value] of Object.entries({ k: EMBER_STEP.k, tau: EMBER_STEP.tau, theta: EMBER_STEP.theta })) {
      const [lo, hi] = fits.fopdt.intervals[name];
      expect(lo, name).toBeLessThan(value);
      expect(hi, name).toBeGreaterThan(value);
    }
    expect(fits.fopdt.r2).toBeGreaterThan(0.999);
    expect(fits.sopdt.ok).toBe(true);
    expect(fits.ipdt.ok).toBe(true);
    // Residuals are y − ŷ at the plotted samples: one per sample, in °C.
    expect(fits.fopdt.residuals.length).toBe(series.t.length);
    expect(fits.fopdt.fitted[0]).toBeCloseTo(21, 1);
  });

  it("when a chosen column is missing or holds text, then the fit's 400 names it", async () => {
    const missing = await team.engineer.post(`${base}/step-tests/${stepTestId}/fits`, { settings: { ...EMBER_SETTINGS, columns: { ...EMBER_SETTINGS.columns, output: "flow" } } });
    expect(missing.status).toBe(400);
    expect(missing.body.error.message).toBe('The output column "flow" is not in the file; the header names "time_s", "heater_pct", "plate_degC".');
    const same = await team.engineer.post(`${base}/step-tests/${stepTestId}/fits`, { settings: { columns: { time: 1, input: 2, output: 2 } } });
    expect(same.status).toBe(400);
    expect(same.body.error.field).toBe("settings.columns.output");
    const window = await team.engineer.post(`${base}/step-tests/${stepTestId}/fits`, { settings: { ...EMBER_SETTINGS, trim: { from: 25, to: 100 } } });
    expect(window.status).toBe(400);
    expect(window.body.error.message).toMatch(/^Column 2 \("heater_pct"\) ends where it starts \(rows 52 and 202\)/);
  });

  it("when a fit is saved as a plant, then it is an identified plant with its provenance and its transfer function's pole", async () => {
    const response = await team.engineer.post(`${base}/step-tests/${stepTestId}/plants`, { name: "Ember 400 (step test)", settings: EMBER_SETTINGS, model: "fopdt", actuator: { min: 0, max: 100 } });
    expect(response.status, JSON.stringify(response.body)).toBe(201);
    plantId = response.body.plant.id;
    const model = response.body.revision.model;
    expect(model.kind).toBe("identified");
    expect(response.body.plant.kind).toBe("identified");
    expect(model.identification.stepTestId).toBe(stepTestId);
    expect(model.identification.columns.output).toEqual({ index: 3, name: "plate_degC" });
    expect(model.identification.settings.units).toEqual({ time: "s", input: "%", output: "°C" });
    // G(s) = k·e^(−θs)/(τs + 1): num [k], den [τ, 1], the pole at −1/τ.
    const { k, tau, theta } = model.identification.fit.parameters;
    expect(model.num).toEqual([k]);
    expect(model.den).toEqual([tau, 1]);
    expect(model.delay).toBe(theta);
    expect(response.body.poles[0].re).toBeCloseTo(-1 / tau, 10);
    expect(model.actuator).toEqual({ min: 0, max: 100 });
  });

  it("when an identified plant is typed by hand, then the generic plant route refuses it", async () => {
    const detail = await team.viewer.get(`${base}/plants/${plantId}`);
    const response = await team.engineer.post(`${base}/plants`, { name: "Forged", model: detail.body.revision.model });
    expect(response.status).toBe(400);
    expect(response.body.error.field).toBe("model.kind");
  });

  it("when the plant is refitted with another model and window, then it gets revision 2 and revision 1 stays", async () => {
    const response = await team.engineer.post(`${base}/plants/${plantId}/refit`, { settings: { ...EMBER_SETTINGS, trim: { from: 5, to: 180 } }, model: "sopdt" });
    expect(response.status, JSON.stringify(response.body)).toBe(201);
    expect(response.body.revision.number).toBe(2);
    expect(response.body.revision.model.identification.fit.model).toBe("sopdt");
    expect(response.body.revision.model.den).toHaveLength(3);
    expect(response.body.revision.model.identification.settings.trim).toEqual({ from: 5, to: 180 });
    // Name and actuator limits carry over.
    expect(response.body.revision.name).toBe("Ember 400 (step test)");
    expect(response.body.revision.model.actuator).toEqual({ min: 0, max: 100 });
    const first = await team.viewer.get(`${base}/plants/${plantId}?revision=1`);
    expect(first.body.revision.model.identification.fit.model).toBe("fopdt");
    const typed = await team.engineer.post(`${base}/plants`, twoLagPlant("Typed two-lag"));
    const refused = await team.engineer.post(`${base}/plants/${typed.body.plant.id}/refit`, { settings: EMBER_SETTINGS, model: "fopdt" });
    expect(refused.status).toBe(400);
    expect(refused.body.error.message).toContain("was not identified from a step test");
  });

  it("when a sweep runs on the identified plant and on a family with it, then every candidate is scored", async () => {
    const detail = await team.viewer.get(`${base}/plants/${plantId}?revision=1`);
    const revisionId = detail.body.revision.id;
    const typed = await team.engineer.post(`${base}/plants`, twoLagPlant("Typed two-lag for the family"));
    const sweep = await team.engineer.post(`${base}/sweeps`, {
      name: "PI on the fitted Ember 400",
      plantRevisionId: revisionId,
      family: { variants: [{ plantRevisionId: revisionId }, { plantRevisionId: typed.body.revision.id }] },
      structure: "pi",
      ranges: { kp: { min: 0.2, max: 1, count: 2 }, ki: { min: 0.01, max: 0.04, count: 2 } },
      scenario: { kind: "setpoint-step", horizon: 200, dt: 0.1 },
      criteria: ["iae", "effort"],
    });
    expect(sweep.status, JSON.stringify(sweep.body)).toBe(201);
    const done = await waitForSweep(team.viewer, team.slug, sweep.body.id, 60_000);
    expect(done.status).toBe("finished");
    expect(done.done).toBe(4);
    const front = await team.viewer.get(`${base}/sweeps/${sweep.body.id}/front?x=iae&y=effort`);
    expect(front.status).toBe(200);
  });

  it("when another workspace names the step test, then it is not found", async () => {
    const other = await workspaceWithTeam(server.url, "Step tests other");
    const response = await other.engineer.post(`/api/workspaces/${other.slug}/step-tests/${stepTestId}/fits`, { settings: EMBER_SETTINGS });
    expect(response.status).toBe(404);
  });
});
