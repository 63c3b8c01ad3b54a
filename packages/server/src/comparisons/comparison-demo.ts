import type { ComparisonInput, SweepFamily } from "@loopyard/core";
import { comparisonInputSchema } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { libraryFamily } from "../families/family-reference.js";
import { DEMO_FAMILY_NAME, findDemoFamilyRevision } from "../seed/demo-families.js";
import { findUserByEmail } from "../users/user-repository.js";
import { findWorkspaceBySlug } from "../workspaces/workspace-repository.js";
import { DEMO_WORKSPACE } from "../seed/demo-seed.js";
import { planOf, resolveFamily } from "./comparison-engine.js";
import { createComparisonJobSystem } from "./comparison-job-system.js";
import { advanceComparison, prescanChunks } from "./comparison-jobs.js";
import { findComparison, findComparisonIdByName, insertComparison } from "./comparison-repository.js";

export const DEMO_COMPARISON_NAME = "Ember line — which criterion should we tune by?";
/** The demo family: the three transfer-function plates of the Ember line (the saved family's revision 1). */
export const DEMO_COMPARISON_PLANTS = ["Ember 200 plate", "Ember 400 plate", "Ember 800 plate"] as const;
/** The revision of the saved Ember line the demo comparison runs on. */
const DEMO_FAMILY_REVISION = 1;
/** Longest the seed waits for the demo comparison to finish [ms]. */
const DEMO_TIMEOUT_MS = 15 * 60_000;

/**
 * The demo comparison: a filtered PID for the Ember 200, 400 and 800 plates (one controller
 * structure for the product line), worst case over the three, 120 s after a unit setpoint step at
 * dt = 0.02 s. IAE, ITAE, ISE and two weighted quadratic costs (r = 0.1 and r = 1) compete;
 * overshoot, settling time, peak |u|, total variation of u, effort, Ms and the gain and phase
 * margins judge; every pick must keep Ms ≤ 1.8 and peak |u| ≤ 10 (ten times rated power at the
 * step: a generous bound on the derivative kick) on every plate. The box is wide (log axes) so that
 * the criteria, not the box, choose.
 */
export function demoComparisonInput(family: SweepFamily): ComparisonInput {
  return comparisonInputSchema.parse({
    name: DEMO_COMPARISON_NAME,
    family,
    familyRevisionId: family.source?.familyRevisionId,
    structure: "pid",
    ranges: { kp: { min: 0.05, max: 30, scale: "log" }, ki: { min: 0.005, max: 3, scale: "log" }, kd: { min: 0.01, max: 300, scale: "log" } },
    filter: { mode: "ratio", n: 10 },
    scenario: { kind: "setpoint-step", horizon: 120, dt: 0.02 },
    aggregate: { kind: "worst" },
    contenders: ["iae", "itae", "ise", { criterion: "quadratic", q: 1, r: 0.1, label: "J(r=0.1)" }, { criterion: "quadratic", q: 1, r: 1, label: "J(r=1)" }],
    judges: ["overshoot", "settlingTime", "upeak", "tv", "effort", "ms", "gainMargin", "phaseMargin"],
    constraints: { ms: { max: 1.8 }, upeak: { max: 10 } },
    budget: { prescan: 512, starts: 3, evaluations: 150, stability: true },
    seed: 2026,
  });
}

/**
 * Seeds the demo comparison and runs it to its end through the job queues, like any other: stores
 * it (once; a database seeded before keeps its own), then starts pg-boss with a comparison worker
 * in this process, enqueues what it needs and waits until it has finished. Returns whether it
 * created the comparison. Needs the demo workspace and plants (seedDemo first).
 */
export async function seedDemoComparison(db: Database, databaseUrl: string): Promise<boolean> {
  const workspace = await findWorkspaceBySlug(db, DEMO_WORKSPACE.slug);
  const engineer = await findUserByEmail(db, "priya@halvard.example");
  if (!workspace || !engineer) throw new Error("seed the demo workspace before its comparison");
  let id = await findComparisonIdByName(db, workspace.id, DEMO_COMPARISON_NAME);
  let created = false;
  if (!id) {
    const input = demoComparisonInput(libraryFamily(await findDemoFamilyRevision(db, workspace.id, DEMO_FAMILY_NAME, DEMO_FAMILY_REVISION)));
    const plan = planOf(input, await resolveFamily(db, input));
    id = await insertComparison(db, {
      workspaceId: workspace.id,
      createdBy: engineer.id,
      name: input.name,
      definition: input,
      prescanTotal: plan.budget.prescan,
      contenders: plan.contenders,
      chunks: prescanChunks(plan.budget.prescan, plan.variants.length),
    });
    created = true;
  }
  const record = await findComparison(db, id);
  if (record?.status === "queued" || record?.status === "running") {
    const jobs = createComparisonJobSystem(db, databaseUrl, { resume: false });
    try {
      await advanceComparison(db, await jobs.boss(), id);
      const deadline = Date.now() + DEMO_TIMEOUT_MS;
      for (;;) {
        const now = await findComparison(db, id);
        if (!now || (now.status !== "queued" && now.status !== "running")) {
          if (now?.status !== "finished") throw new Error(`the demo comparison stopped as ${now?.status ?? "deleted"}: ${now?.error ?? ""}`);
          break;
        }
        if (Date.now() > deadline) throw new Error("the demo comparison did not finish within 15 minutes");
        await new Promise((resolve) => setTimeout(resolve, 250));
      }
    } finally {
      await jobs.close();
    }
  }
  return created;
}
