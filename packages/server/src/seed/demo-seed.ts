import type { PlantInputParsed, Role, SweepInputParsed, UserDto } from "@loopyard/core";
import { plantInputSchema, sweepInputSchema } from "@loopyard/core";
import type { Auth } from "../auth/auth.js";
import type { Database } from "../db/database.js";
import { findPlantIdByName, findPlantWithRevisions, insertPlant } from "../plants/plant-repository.js";
import { findSweepIdByName, insertSweep } from "../sweeps/sweep-repository.js";
import type { SweepRunner } from "../sweeps/sweep-runner.js";
import { gridSize } from "../sweeps/sweep-service.js";
import { findUserByEmail } from "../users/user-repository.js";
import { findWorkspaceBySlug, insertMembership, insertWorkspace } from "../workspaces/workspace-repository.js";

/**
 * Demo content in a fictional scenario: Halvard Thermoworks (a made-up company) and its
 * Ember line of ceramic plate heaters. Input u: heater power as a fraction of rated power;
 * output y: plate temperature rise as a fraction of the rated rise.
 */
export const DEMO_WORKSPACE = { slug: "halvard-thermal", name: "Halvard Thermoworks — Ember line" } as const;

/** Password of every demo user (printed by `npm start`; for local demos only). */
export const DEMO_PASSWORD = "ember-demo-2026";

export const DEMO_USERS: readonly { name: string; email: string; role: Role }[] = [
  { name: "Mira Okafor", email: "mira@halvard.example", role: "admin" },
  { name: "Tomas Lind", email: "tomas@halvard.example", role: "lead" },
  { name: "Priya Raman", email: "priya@halvard.example", role: "engineer" },
  { name: "Jon Eide", email: "jon@halvard.example", role: "viewer" },
];

const UNITS_NOTE = "u: heater power, fraction of rated power (0–1); y: plate temperature rise, fraction of the rated rise";

/** The three demo plants; denominators are the expanded products of their first-order lags. */
export const DEMO_PLANTS: readonly PlantInputParsed[] = [
  // 1/((8s+1)(2s+1)) = 1/(16s² + 10s + 1)
  { name: "Ember 200 plate", unitsNote: UNITS_NOTE, model: { kind: "transfer-function", num: [1], den: [16, 10, 1], delay: 0 } },
  // 1.2/((12s+1)(3s+1)(0.5s+1)) = 1.2/(18s³ + 43.5s² + 15.5s + 1)
  {
    name: "Ember 400 plate",
    unitsNote: UNITS_NOTE,
    model: { kind: "transfer-function", num: [1.2], den: [18, 43.5, 15.5, 1], delay: 0 },
  },
  // 1.5/((20s+1)(4s+1)) · e^(−s) = 1.5/(80s² + 24s + 1) · e^(−s)
  { name: "Ember 800 plate", unitsNote: UNITS_NOTE, model: { kind: "transfer-function", num: [1.5], den: [80, 24, 1], delay: 1 } },
];

export const DEMO_SWEEP_NAME = "Ember 200 — first PID grid";

/** The demo sweep on Ember 200: a 6 × 6 × 4 grid, filter ten times faster than Td, 60 s horizon. */
function demoSweepInput(plantRevisionId: string): SweepInputParsed {
  return sweepInputSchema.parse({
    name: DEMO_SWEEP_NAME,
    plantRevisionId,
    structure: "pid",
    ranges: {
      kp: { min: 0.5, max: 5, count: 6 },
      ki: { min: 0.05, max: 0.8, count: 6 },
      kd: { min: 0, max: 6, count: 4 },
    },
    filter: { mode: "ratio", n: 10 },
    scenario: { kind: "setpoint-step", horizon: 60, dt: 0.05 },
    criteria: ["iae", "ise", "itae", "effort"],
  });
}

export interface SeedReport {
  usersCreated: number;
  workspaceCreated: boolean;
  membershipsAdded: number;
  plantsCreated: number;
  sweepCreated: boolean;
}

/**
 * Seeds the demo workspace. Idempotent: what exists (matched by email, slug and name) is left
 * as it is, so a second run changes nothing. Users are created through better-auth so that
 * their passwords are hashed as at sign-up. The demo sweep runs to its end before this returns.
 */
export async function seedDemo(db: Database, auth: Auth, runner: SweepRunner): Promise<SeedReport> {
  const report: SeedReport = { usersCreated: 0, workspaceCreated: false, membershipsAdded: 0, plantsCreated: 0, sweepCreated: false };

  const users = new Map<string, UserDto>();
  for (const demo of DEMO_USERS) {
    let found = await findUserByEmail(db, demo.email);
    if (!found) {
      await auth.api.signUpEmail({ body: { name: demo.name, email: demo.email, password: DEMO_PASSWORD } });
      found = await findUserByEmail(db, demo.email);
      if (!found) throw new Error(`signing up ${demo.email} did not create a user`);
      report.usersCreated += 1;
    }
    users.set(demo.email, found);
  }

  let workspace = await findWorkspaceBySlug(db, DEMO_WORKSPACE.slug);
  if (!workspace) {
    workspace = await insertWorkspace(db, { ...DEMO_WORKSPACE });
    report.workspaceCreated = workspace !== null;
    workspace ??= await findWorkspaceBySlug(db, DEMO_WORKSPACE.slug);
    if (!workspace) throw new Error(`could not create the workspace ${DEMO_WORKSPACE.slug}`);
  }
  for (const demo of DEMO_USERS) {
    const member = users.get(demo.email) as UserDto;
    if (await insertMembership(db, workspace.id, member.id, demo.role)) report.membershipsAdded += 1;
  }

  const engineer = users.get("priya@halvard.example") as UserDto;
  for (const demo of DEMO_PLANTS) {
    if (await findPlantIdByName(db, workspace.id, demo.name)) continue;
    await insertPlant(db, workspace.id, engineer.id, plantInputSchema.parse(demo));
    report.plantsCreated += 1;
  }

  let sweepId = await findSweepIdByName(db, workspace.id, DEMO_SWEEP_NAME);
  if (!sweepId) {
    const plantId = await findPlantIdByName(db, workspace.id, "Ember 200 plate");
    const plant = plantId ? await findPlantWithRevisions(db, workspace.id, plantId) : null;
    const revision = plant?.revisions[0];
    if (!revision) throw new Error("the Ember 200 plate has no revision to sweep");
    const definition = demoSweepInput(revision.id);
    sweepId = await insertSweep(db, { workspaceId: workspace.id, createdBy: engineer.id, definition, total: gridSize(definition.ranges) });
    report.sweepCreated = true;
  }
  // Runs a new sweep, finishes one an interrupted seed left behind, and does nothing to a finished one.
  await runner.runNow(sweepId);
  return report;
}
