import { spawn } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { defaultSweepForm, formFieldOf, sweepFormResolver, toSweepInput, type SweepFormValues } from "../../packages/web/src/features/sweeps/sweep-form-values.js";
import { startTestServer, type TestServer } from "../support/test-server.js";
import { twoLagPlant, workspaceWithTeam } from "./fixtures.js";

// One bad sweep, three doors: the web form (its resolver, on the form's own values), the server
// (POST /sweeps with the form's toSweepInput) and the CLI (the same definition, the plant inline in
// the family). Each row states the sentence once; every door must give exactly that sentence (the
// web form shows its reason at the field the sentence names). Reference: core's sweep contract
// (checkSweepDefinition, planSweep, firstSweepIssue) — common practice, one rule in one place.

let server: TestServer;
let team: Awaited<ReturnType<typeof workspaceWithTeam>>;
let revisionId: string;
const PLANT = twoLagPlant("Contract check plate");
const CLI_MAIN = join(process.cwd(), "packages", "core", "bin", "loopyard.js");
const dir = mkdtempSync(join(tmpdir(), "loopyard-contract-"));

beforeAll(async () => {
  server = await startTestServer();
  team = await workspaceWithTeam(server.url, "Contract");
  const plant = await team.engineer.post(`/api/workspaces/${team.slug}/plants`, PLANT);
  revisionId = plant.body.revision.id;
});

afterAll(async () => {
  await server?.close();
});

interface BadSweep {
  what: string;
  /** Makes the form's values bad (the form starts as defaultSweepForm: a 5 × 5 × 3 PID grid, 60 s at dt = 0.1 s). */
  spoil(form: SweepFormValues): void;
  /** Plant states the form shows (state feedback: one row per state). */
  stateNames?: string[];
  field: string;
  reason: string;
  /** False where the form cannot express the mistake (it builds its rows from the chosen plant). */
  web?: false;
}

const CASES: BadSweep[] = [
  {
    what: "a range whose max lies below its min",
    spoil: (f) => void (f.ranges.ki = { min: 2, max: 1, count: 3 }),
    field: "ranges.ki.max",
    reason: "max must be ≥ min",
  },
  {
    what: "a negative proportional gain",
    spoil: (f) => void (f.ranges.kp = { min: -1, max: 2, count: 3 }),
    field: "ranges.kp.min",
    reason: "kp must be ≥ 0",
  },
  {
    what: "a time step over a tenth of the horizon",
    spoil: (f) => void (f.scenario.dt = 10),
    field: "scenario.dt",
    reason: "the time step must be at most a tenth of the horizon",
  },
  {
    what: "a grid larger than MAX_SWEEP_CANDIDATES",
    spoil: (f) => {
      f.ranges.kp = { min: 0.5, max: 5, count: 1000 };
      f.ranges.ki = { min: 0.05, max: 1, count: 1000 };
    },
    field: "ranges",
    reason: "3000000 candidates is more than the 1000000 allowed per sweep; lower the counts",
  },
  {
    what: "a sample time below the time step",
    spoil: (f) => {
      f.sampled = true;
      f.sampleTime = 0.01;
    },
    field: "sampleTime",
    reason: "sampleTime must be ≥ the time step (0.1 s)",
  },
  {
    what: "the ratio filter with kp allowed to be zero while kd is not",
    spoil: (f) => void (f.ranges.kp = { min: 0, max: 5, count: 3 }),
    field: "ranges.kp.min",
    reason: "with the ratio filter tf = kd/(n·kp), kp must be > 0 wherever kd is non-zero; raise kp min or use a fixed tf",
  },
  {
    what: "state feedback with three gains on a two-state plant",
    spoil: (f) => void (f.structure = "state-feedback"),
    stateNames: ["x1", "x2", "x3"],
    field: "ranges",
    reason: "state feedback on this plant needs 2 gains k[0]…k[1], got 3",
    web: false,
  },
];

function runCli(args: string[]): Promise<{ status: number | null; stderr: string }> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [CLI_MAIN, ...args], { stdio: ["ignore", "ignore", "pipe"] });
    let stderr = "";
    child.stderr.on("data", (d: Buffer) => (stderr += d.toString()));
    child.on("error", reject);
    child.on("close", (status) => resolve({ status, stderr }));
  });
}

function errorAt(errors: Record<string, unknown>, field: string): string | undefined {
  let node: unknown = errors;
  for (const part of field.split(".")) node = (node as Record<string, unknown> | undefined)?.[part];
  return (node as { message?: string } | undefined)?.message;
}

describe("one bad sweep, one sentence at every door", () => {
  for (const c of CASES) {
    it(`when the sweep has ${c.what}, then the form, the server and the CLI say “${c.field}: ${c.reason}”`, async () => {
      const sentence = `${c.field}: ${c.reason}`;
      const form = defaultSweepForm("", 60);
      form.name = `Contract: ${c.what}`;
      c.spoil(form);
      const context = { stateNames: c.stateNames ?? [] };
      form.plantRevisionId = revisionId;

      if (c.web !== false) {
        const result = await sweepFormResolver(form, context, { fields: {}, shouldUseNativeValidation: false });
        expect(errorAt(result.errors as Record<string, unknown>, formFieldOf(c.field))).toBe(c.reason);
      }

      const input = toSweepInput(form, context);
      const response = await team.engineer.post(`/api/workspaces/${team.slug}/sweeps`, input);
      expect(response.status).toBe(400);
      expect(response.body.error).toMatchObject({ message: sentence, field: c.field });

      const { plantRevisionId: _revision, ...definition } = input;
      const spec = { ...definition, family: { variants: [{ label: "plate", plant: PLANT.model }] } };
      const file = join(dir, `${c.field}-${CASES.indexOf(c)}.json`);
      writeFileSync(file, JSON.stringify(spec));
      // Spawned without blocking: the test server runs in this process and must keep answering.
      const cli = await runCli(["sweep", file, "--workers", "1"]);
      expect(cli.status).toBe(2);
      expect(cli.stderr).toBe(`loopyard: ${sentence}.\n`);
    });
  }
});

describe("a variant's label and its revision", () => {
  it("when a variant's label names another plant of the workspace, then the answer is 400 naming that label", async () => {
    const other = await team.engineer.post(`/api/workspaces/${team.slug}/plants`, twoLagPlant("Contract other plate"));
    const otherRevision = other.body.revision.id as string;
    const form = defaultSweepForm(revisionId, 60);
    form.name = "Label left from another plant";
    // The bug this guards: the second variant kept the first plant's name after another plant was picked.
    form.variants = [{ plantId: other.body.plant.id, plantRevisionId: otherRevision, label: PLANT.name, labelTyped: false, parameters: "" }];
    const input = toSweepInput(form, { stateNames: [] });
    const response = await team.engineer.post(`/api/workspaces/${team.slug}/sweeps`, input);
    expect(response.status).toBe(400);
    expect(response.body.error.field).toBe("family.variants.1.label");
    expect(response.body.error.message).toBe(
      `family.variants.1.label: “${PLANT.name}” is the name of another plant; this variant is Contract other plate, so change the label or leave it empty`,
    );
    // The plant's own name, or a label that names no plant, is fine.
    form.variants[0]!.label = "Contract other plate";
    const own = await team.engineer.post(`/api/workspaces/${team.slug}/sweeps`, toSweepInput(form, { stateNames: [] }));
    expect(own.status).toBe(201);
    await team.engineer.post(`/api/workspaces/${team.slug}/sweeps/${own.body.id}/cancel`, {});
  });
});
