import type { PlantInputParsed, Role, SweepInputParsed, UserDto } from "@loopyard/core";
import { planSweep, plantInputSchema, sweepInputSchema } from "@loopyard/core";
import type { Auth } from "../auth/auth.js";
import type { Database } from "../db/database.js";
import { libraryFamily } from "../families/family-reference.js";
import { findPlantIdByName, findPlantWithRevisions, findRevisionById, insertPlant } from "../plants/plant-repository.js";
import { DEMO_FAMILY_NAME, findDemoFamilyRevision, seedDemoFamilies } from "./demo-families.js";
import { findSweepForRun, findSweepIdByName, insertSweep } from "../sweeps/sweep-repository.js";
import { findUserByEmail } from "../users/user-repository.js";
import { markEmailVerified } from "../members/member-repository.js";
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

/**
 * The demo plants: three transfer functions (denominators are the expanded products of their
 * first-order lags), a two-state state-space plate and a nonlinear plate with radiative loss.
 */
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
  // Heating element x1 and plate x2 (temperature rises, fractions of the rated rise):
  //   x1' = −0.5·x1 + 0.4·x2 + 0.5·u,  x2' = 0.1·x1 − 0.2·x2,  y = x2.
  // Poles −0.1 and −0.6 (trace −0.7, det 0.06); static gain −C·A⁻¹·B = 0.1·0.5/0.06 ≈ 0.83.
  {
    name: "Ember 600 plate (state-space)",
    unitsNote: "u: heater power, fraction of rated power (0–1); states: element and plate temperature rise; y: plate temperature rise, fraction of the rated rise",
    model: {
      kind: "state-space",
      A: [
        [-0.5, 0.4],
        [0.1, -0.2],
      ],
      B: [[0.5], [0]],
      C: [[0, 1]],
      D: [[0]],
      actuator: { min: 0, max: 1 },
    },
  },
  // Lumped plate with convective and radiative loss (Stefan–Boltzmann, e = ε·σ·area):
  //   c·dT/dt = Pmax·u − h·T − e·((T + Ta)⁴ − Ta⁴),  T the temperature rise [K] over ambient Ta [K].
  // Full power settles near T ≈ 290 K; at T = 0 the linearisation has the pole −(h + 4·e·Ta³)/c ≈ −0.0055 s⁻¹.
  {
    name: "Ember 800 plate (radiative)",
    unitsNote: "u: heater power, fraction of rated power Pmax (0–1); y: plate temperature rise T over ambient [K]",
    model: {
      kind: "nonlinear",
      states: ["T"],
      parameters: { c: 400, h: 2, e: 2.0e-9, Ta: 293, Pmax: 800 },
      derivatives: ["(Pmax*u - h*T - e*((T + Ta)^4 - Ta^4)) / c"],
      output: "T",
      initial: [0],
      actuator: { min: 0, max: 1 },
    },
  },
];

export const DEMO_SWEEP_NAME = "Ember 200 — first PID grid";
export const DEMO_LOAD_SWEEP_NAME = "Ember 600 — PI load rejection";
export const DEMO_FAMILY_SWEEP_NAME = "Ember line — PI over the family";

/** A demo sweep: its name, the plant it runs on (revision 1) and its definition. */
interface DemoSweep {
  name: string;
  plantName: string;
  input(plantRevisionId: string): SweepInputParsed;
}

/**
 * The demo sweep on a saved family: a 6 × 6 PI grid over the Ember line (revision 1: the 200, 400
 * and 800 plates), worst case over the three, 120 s after a unit setpoint step at dt = 0.02 s.
 * Its definition names the family revision; the variants are the revision's (libraryFamily).
 */
function demoFamilySweep(family: ReturnType<typeof libraryFamily>): SweepInputParsed {
  const source = family.source;
  return sweepInputSchema.parse({
    name: DEMO_FAMILY_SWEEP_NAME,
    plantRevisionId: family.variants[0]?.plantRevisionId,
    familyRevisionId: source?.familyRevisionId,
    family,
    structure: "pi",
    ranges: { kp: { min: 0.2, max: 3, count: 6 }, ki: { min: 0.02, max: 0.4, count: 6 } },
    scenario: { kind: "setpoint-step", horizon: 120, dt: 0.02 },
    criteria: ["iae", "ise", "effort", "overshoot"],
    aggregate: { kind: "worst" },
  });
}

export const DEMO_SWEEPS: readonly DemoSweep[] = [
  {
    // A 6 × 6 × 4 PID grid on Ember 200, filter ten times faster than Td. Horizon 400 s and dt = 2.5 ms
    // (160 000 steps, about a second for the grid): the slowest loops of the grid (ki = 0.05 and the
    // lightly damped ki = 0.8 ones) settle, and the derivative kick (tf down to 0.04 s) is integrated
    // finely, so every stored (ISE, effort) is within 0.1 % of exactQuadraticCosts (checked over the
    // whole grid; 60 s at 50 ms left up to 30 %). A database seeded before keeps its old sweep.
    name: DEMO_SWEEP_NAME,
    plantName: "Ember 200 plate",
    input: (plantRevisionId) =>
      sweepInputSchema.parse({
        name: DEMO_SWEEP_NAME,
        plantRevisionId,
        structure: "pid",
        ranges: {
          kp: { min: 0.5, max: 5, count: 6 },
          ki: { min: 0.05, max: 0.8, count: 6 },
          kd: { min: 0, max: 6, count: 4 },
        },
        filter: { mode: "ratio", n: 10 },
        scenario: { kind: "setpoint-step", horizon: 400, dt: 0.0025 },
        criteria: ["iae", "ise", "itae", "effort"],
      }),
  },
  {
    // An 8 × 8 PI grid on the state-space Ember 600 rejecting a load step of −0.2 (a draught
    // taking a fifth of rated power) at t = 10 s, from the operating point 0 with the setpoint held.
    name: DEMO_LOAD_SWEEP_NAME,
    plantName: "Ember 600 plate (state-space)",
    input: (plantRevisionId) =>
      sweepInputSchema.parse({
        name: DEMO_LOAD_SWEEP_NAME,
        plantRevisionId,
        structure: "pi",
        ranges: {
          kp: { min: 0.25, max: 4, count: 8 },
          ki: { min: 0.02, max: 0.6, count: 8 },
        },
        scenario: { kind: "load-step", horizon: 150, dt: 0.05, load: { size: -0.2, time: 10 } },
        criteria: ["iae", "ise", "effort", "tv", "upeak"],
      }),
  },
];

export interface SeedReport {
  usersCreated: number;
  workspaceCreated: boolean;
  membershipsAdded: number;
  plantsCreated: number;
  familiesCreated: number;
  sweepsCreated: number;
}

/**
 * Seeds the demo workspace. Idempotent: what exists (matched by email, slug and name) is left
 * as it is, so a second run changes nothing. Users are created through better-auth so that
 * their passwords are hashed as at sign-up. The demo sweeps are started as jobs like any other
 * sweep (`jobs.start`, the path of POST /sweeps), and this waits until a worker has finished them
 * (the caller runs one: the seed command and the app's embedded worker), so the demo shows finished
 * sweeps once the seed returns.
 */
export async function seedDemo(db: Database, auth: Auth, jobs: DemoSweepJobs, options: { waitMs?: number } = {}): Promise<SeedReport> {
  const report: SeedReport = { usersCreated: 0, workspaceCreated: false, membershipsAdded: 0, plantsCreated: 0, familiesCreated: 0, sweepsCreated: 0 };

  const users = new Map<string, UserDto>();
  for (const demo of DEMO_USERS) {
    let found = await findUserByEmail(db, demo.email);
    if (!found) {
      await auth.api.signUpEmail({ body: { name: demo.name, email: demo.email, password: DEMO_PASSWORD } });
      found = await findUserByEmail(db, demo.email);
      if (!found) throw new Error(`signing up ${demo.email} did not create a user`);
      report.usersCreated += 1;
      // Demo addresses count as checked (no mail goes to the fictional .example domain).
      await markEmailVerified(db, found.id);
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
  const started: { id: string; name: string }[] = [];
  for (const demo of DEMO_PLANTS) {
    if (await findPlantIdByName(db, workspace.id, demo.name)) continue;
    await insertPlant(db, workspace.id, engineer.id, plantInputSchema.parse(demo));
    report.plantsCreated += 1;
  }
  report.familiesCreated = await seedDemoFamilies(db, workspace.id, engineer.id);

  for (const demo of DEMO_SWEEPS) {
    let sweepId = await findSweepIdByName(db, workspace.id, demo.name);
    if (!sweepId) {
      const plantId = await findPlantIdByName(db, workspace.id, demo.plantName);
      const plant = plantId ? await findPlantWithRevisions(db, workspace.id, plantId) : null;
      const revision = plant?.revisions[0];
      if (!revision) throw new Error(`the ${demo.plantName} has no revision to sweep`);
      const definition = demo.input(revision.id);
      const total = planSweep(definition, [revision.model]).budget;
      sweepId = await insertSweep(db, { workspaceId: workspace.id, createdBy: engineer.id, definition, total });
      report.sweepsCreated += 1;
    }
    // Starts a new sweep, resumes one an interrupted seed left behind, and does nothing to a finished one.
    await jobs.start(sweepId);
    started.push({ id: sweepId, name: demo.name });
  }
  let familySweepId = await findSweepIdByName(db, workspace.id, DEMO_FAMILY_SWEEP_NAME);
  if (!familySweepId) {
    const definition = demoFamilySweep(libraryFamily(await findDemoFamilyRevision(db, workspace.id, DEMO_FAMILY_NAME, 1)));
    const models = [];
    for (const variant of definition.family?.variants ?? []) {
      const revision = await findRevisionById(db, variant.plantRevisionId);
      if (!revision) throw new Error(`a plant revision of the ${DEMO_FAMILY_NAME} family is missing`);
      models.push(revision.model);
    }
    const total = planSweep(definition, models).budget;
    familySweepId = await insertSweep(db, { workspaceId: workspace.id, createdBy: engineer.id, definition, total });
    report.sweepsCreated += 1;
  }
  await jobs.start(familySweepId);
  started.push({ id: familySweepId, name: DEMO_FAMILY_SWEEP_NAME });
  for (const sweep of started) await waitForSweep(db, sweep, options.waitMs ?? DEMO_SWEEP_WAIT_MS);
  return report;
}

/** What the seed asks of the job system: start a stored sweep as jobs (SweepJobSystem.start). */
export interface DemoSweepJobs {
  start(sweepId: string): Promise<void>;
}

/** Longest the seed waits for a demo sweep's jobs [ms]; the demo sweeps take seconds on one core. */
export const DEMO_SWEEP_WAIT_MS = 10 * 60_000;
/** Interval between reads of a demo sweep's status while waiting [ms]. */
const POLL_MS = 100;

/** Waits until a sweep is finished; throws a sentence when it failed, was cancelled or took too long. */
async function waitForSweep(db: Database, sweep: { id: string; name: string }, waitMs: number): Promise<void> {
  const deadline = Date.now() + waitMs;
  for (;;) {
    const record = await findSweepForRun(db, sweep.id);
    if (!record) throw new Error(`the demo sweep “${sweep.name}” disappeared while the seed waited for it`);
    if (record.status === "finished") return;
    if (record.status === "failed" || record.status === "cancelled") {
      throw new Error(`the demo sweep “${sweep.name}” ended ${record.status}; delete it and seed again`);
    }
    if (Date.now() > deadline) {
      throw new Error(`the demo sweep “${sweep.name}” did not finish within ${waitMs / 1000} s; check that a sweep worker runs (npm run worker)`);
    }
    await new Promise((resolve) => setTimeout(resolve, POLL_MS));
  }
}
