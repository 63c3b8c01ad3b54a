import { z } from "zod";
import { CONTROLLER_KINDS } from "../controllers/controller.js";
import { OPTIONAL_STRUCTURE_PARAMETERS, structureParameterNames, type Structure } from "../batch/structure.js";
import type { ParameterSpace } from "../batch/parameter-space.js";
import { plantModelSchema } from "../plants/plant.js";
import { criterionOptionsSchema, derivativeFilterSchema } from "../sweeps/sweep-input.js";
import { criteriaSpecSchema } from "./criteria-spec.js";
import { scenarioSpecSchema } from "./scenario-spec.js";

/** Most candidates one CLI sweep may hold (designs × variants stay in memory). */
export const MAX_CLI_SWEEP_CANDIDATES = 2_000_000;
/** Most plants in one sweep family. */
export const MAX_FAMILY_SIZE = 100;

const finite = (what: string) => z.number({ error: `${what} must be a number` }).finite(`${what} must be finite`);
const count = z
  .number({ error: "count must be a number" })
  .int("count must be a whole number")
  .min(1, "count must be at least 1")
  .max(MAX_CLI_SWEEP_CANDIDATES, `count must be at most ${MAX_CLI_SWEEP_CANDIDATES}`);
const seed = z.number({ error: "seed must be a number" }).int("seed must be a whole number");

const axisSchema = z
  .strictObject({ min: finite("min"), max: finite("max"), scale: z.enum(["linear", "log"], { error: 'scale must be "linear" or "log"' }).default("linear") })
  .refine((a) => a.max >= a.min, { message: "max must be ≥ min", path: ["max"] })
  .refine((a) => a.scale !== "log" || a.min > 0, { message: "min must be > 0 on a log scale", path: ["min"] });

const designSchema = z.discriminatedUnion(
  "kind",
  [
    z.strictObject({ kind: z.literal("grid"), counts: z.record(z.string(), count).optional(), count: count.optional() }),
    z.strictObject({ kind: z.literal("latin-hypercube"), count, seed }),
    z.strictObject({ kind: z.literal("random"), count, seed }),
  ],
  { error: 'kind must be "grid", "latin-hypercube" or "random"' },
);

const antiWindupSchema = z.discriminatedUnion("kind", [
  z.strictObject({ kind: z.literal("none") }),
  z.strictObject({ kind: z.literal("back-calculation"), tt: finite("tt").gt(0, "tt must be > 0 s").optional() }),
  z.strictObject({ kind: z.literal("conditional") }),
]);

/**
 * The spec of `loopyard sweep` (see packages/core/README.md, "CLI"):
 * - family: one or more variants { name?, plant } (names default to v1, v2, …);
 * - structure: { kind, tunable: { <name>: { min, max, scale? } } in candidate-vector order,
 *   fixed?: { <name>: value }, filter?: { mode: "ratio", n } | { mode: "fixed", tf }, antiWindup? };
 * - design: { kind: "grid", counts: { <name>: n } | count: n } | { kind: "latin-hypercube" | "random", count, seed };
 * - scenario, criteria, criterionOptions?: as in the evaluate spec.
 */
export const sweepSpecSchema = z
  .strictObject({
    family: z
      .array(z.strictObject({ name: z.string().trim().min(1, "name must not be empty").max(80, "keep the name under 80 characters").optional(), plant: plantModelSchema }))
      .min(1, "give at least one plant variant")
      .max(MAX_FAMILY_SIZE, `at most ${MAX_FAMILY_SIZE} variants`),
    structure: z.strictObject({
      kind: z.enum(CONTROLLER_KINDS, { error: `kind must be one of ${CONTROLLER_KINDS.join(", ")}` }),
      tunable: z.record(z.string(), axisSchema),
      fixed: z.record(z.string(), finite("a fixed value")).default({}),
      filter: derivativeFilterSchema.optional(),
      antiWindup: antiWindupSchema.optional(),
    }),
    design: designSchema,
    scenario: scenarioSpecSchema,
    criteria: criteriaSpecSchema,
    criterionOptions: criterionOptionsSchema.strict().optional(),
  })
  .superRefine((spec, ctx) => {
    const names = new Set(spec.family.map((v, i) => v.name ?? `v${i + 1}`));
    if (names.size !== spec.family.length) ctx.addIssue({ code: "custom", path: ["family"], message: "give each variant a different name" });
    const s = spec.structure;
    const tunable = Object.keys(s.tunable);
    if (tunable.length === 0) {
      ctx.addIssue({ code: "custom", path: ["structure", "tunable"], message: "name at least one tunable parameter with its range" });
      return;
    }
    if (s.filter && s.kind !== "pid" && s.kind !== "pid2dof") {
      ctx.addIssue({ code: "custom", path: ["structure", "filter"], message: "a derivative filter applies to pid and pid2dof only" });
      return;
    }
    const structure = toStructure(spec);
    const required = structureParameterNames(structure);
    const allowed = new Set([...required, ...OPTIONAL_STRUCTURE_PARAMETERS]);
    const hint = `${s.kind} takes ${[...allowed].join(", ")}${s.filter ? " (tf comes from the filter)" : ""}`;
    for (const name of tunable) {
      if (!allowed.has(name)) ctx.addIssue({ code: "custom", path: ["structure", "tunable", name], message: `not a parameter here; ${hint}` });
    }
    for (const name of Object.keys(s.fixed)) {
      if (!allowed.has(name)) ctx.addIssue({ code: "custom", path: ["structure", "fixed", name], message: `not a parameter here; ${hint}` });
      else if (name in s.tunable) ctx.addIssue({ code: "custom", path: ["structure", "fixed", name], message: "already tunable; a parameter is either tuned or fixed" });
    }
    for (const name of required) {
      if (!(name in s.tunable) && !(name in s.fixed)) {
        ctx.addIssue({ code: "custom", path: ["structure", "fixed", name], message: `${s.kind} needs ${name}; make it tunable or give a fixed value` });
      }
    }
    if (s.kind === "state-feedback") {
      for (const [i, variant] of spec.family.entries()) {
        const states = plantStates(variant.plant);
        if (states !== null && states !== required.length - 1) {
          ctx.addIssue({
            code: "custom",
            path: ["family", i, "plant"],
            message: `has ${states} states but the structure gives ${required.length - 1} gains k[0]…; give one gain per state`,
          });
        }
      }
    }
    const d = spec.design;
    if (d.kind === "grid") {
      if ((d.counts === undefined) === (d.count === undefined)) {
        ctx.addIssue({ code: "custom", path: ["design", "counts"], message: "give either counts per tunable parameter or one count for all" });
        return;
      }
      if (d.counts) {
        for (const name of Object.keys(d.counts)) {
          if (!(name in s.tunable)) ctx.addIssue({ code: "custom", path: ["design", "counts", name], message: "not a tunable parameter of the structure" });
        }
        for (const name of tunable) {
          if (!(name in d.counts)) ctx.addIssue({ code: "custom", path: ["design", "counts", name], message: "missing; give a count for every tunable parameter" });
        }
      }
      const total = gridCounts(spec).reduce((a, b) => a * b, 1);
      if (total > MAX_CLI_SWEEP_CANDIDATES) {
        ctx.addIssue({ code: "custom", path: ["design"], message: `the grid has ${total} candidates, more than ${MAX_CLI_SWEEP_CANDIDATES}; lower the counts` });
      }
    }
  });

export type SweepSpec = z.output<typeof sweepSpecSchema>;

/** The batch Structure of a validated sweep spec (tunable in the spec's key order). */
export function toStructure(spec: SweepSpec): Structure {
  const s = spec.structure;
  return {
    kind: s.kind,
    tunable: Object.keys(s.tunable),
    fixed: s.fixed,
    ...(s.filter ? { filter: s.filter } : {}),
    ...(s.antiWindup ? { antiWindup: s.antiWindup } : {}),
  };
}

/** The parameter space of a validated sweep spec, one axis per tunable parameter. */
export function toParameterSpace(spec: SweepSpec): ParameterSpace {
  return Object.entries(spec.structure.tunable).map(([name, a]) => ({ name, min: a.min, max: a.max, scale: a.scale }));
}

/** The grid counts of a validated grid sweep spec, in tunable order. */
export function gridCounts(spec: SweepSpec): number[] {
  const d = spec.design;
  if (d.kind !== "grid") throw new TypeError("gridCounts: the design is not a grid");
  return Object.keys(spec.structure.tunable).map((name) => (d.counts ? (d.counts[name] ?? 1) : (d.count ?? 1)));
}

/** Variant names of a validated sweep spec: the given names, else v1, v2, …. */
export function variantNames(spec: SweepSpec): string[] {
  return spec.family.map((v, i) => v.name ?? `v${i + 1}`);
}

function plantStates(plant: SweepSpec["family"][number]["plant"]): number | null {
  if (plant.kind === "state-space") return plant.A.length;
  if (plant.kind === "nonlinear") return plant.states.length;
  if (plant.kind === "transfer-function") {
    const first = plant.den.findIndex((c) => c !== 0);
    return first < 0 ? null : plant.den.length - 1 - first;
  }
  return null;
}
