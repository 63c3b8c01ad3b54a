import type { AntiWindup, Controller, ControllerKind } from "../controllers/controller.js";
import { CONTROLLER_PARAMETERS, type FixedParameterKind } from "../controllers/controller-parameters.js";
import type { DerivativeFilter } from "../controllers/derivative-filter.js";
import { MAX_STATE_FEEDBACK_GAINS } from "../limits.js";

/**
 * A structure refused by assertValidStructure or structureParameterNames: `field` is the path
 * inside the structure ("structure.tunable[1]", "structure.fixed.kd"), `reason` the sentence
 * without it, carried as data so that callers never rewrite the message.
 */
export class StructureError extends RangeError {
  override name = "StructureError";
  readonly field: string;
  readonly reason: string;
  constructor(field: string, reason: string) {
    super(`${field}: ${reason}`);
    this.field = field;
    this.reason = reason;
  }
}

/**
 * A controller structure with some parameters tuned by a sweep and the others held fixed:
 * `tunable` names the entries of a candidate vector in order; `fixed` gives every other required
 * parameter. Parameter names per kind (STRUCTURE_PARAMETERS): p: kp; pi: kp, ki;
 * pid: kp, ki, kd, tf; pid2dof: kp, ki, kd, tf, b, c; lead-lag: k, tLead, tLag;
 * state-feedback: k[0], k[1], …, n (one gain per plant state). Any kind may also take
 * `sampleTime` (a sampled controller), tunable or fixed.
 *
 * `filter` (pid and pid2dof only) derives tf instead of listing it: `{ mode: "ratio", n }` gives
 * tf = kd/(n·kp) (0 when kd = 0), `{ mode: "fixed", tf }` that tf.
 */
export interface Structure {
  kind: ControllerKind;
  tunable: readonly string[];
  fixed: Readonly<Record<string, number>>;
  filter?: DerivativeFilter;
  antiWindup?: AntiWindup;
}

/** Required parameter names of each controller kind, read from CONTROLLER_PARAMETERS (state feedback: see stateFeedbackNames). */
export const STRUCTURE_PARAMETERS: Readonly<Record<FixedParameterKind, readonly string[]>> = Object.fromEntries(
  Object.entries(CONTROLLER_PARAMETERS).map(([kind, table]) => [kind, table.map((p) => p.name)]),
) as unknown as Record<FixedParameterKind, readonly string[]>;

/** Optional parameter every kind accepts. */
export const OPTIONAL_STRUCTURE_PARAMETERS: readonly string[] = ["sampleTime"];

const STATE_GAIN = /^k\[(\d+)\]$/;

/**
 * Parameter names of state feedback on a plant with `states` states: k[0] … k[states−1], n.
 * Throws a RangeError for more than MAX_STATE_FEEDBACK_GAINS states (before building any list).
 */
export function stateFeedbackNames(states: number): string[] {
  if (!(Number.isInteger(states) && states >= 0 && states <= MAX_STATE_FEEDBACK_GAINS)) {
    throw new StructureError("structure.tunable", `state feedback takes at most ${MAX_STATE_FEEDBACK_GAINS} gains k[0]…k[${MAX_STATE_FEEDBACK_GAINS - 1}], one per plant state`);
  }
  return [...Array.from({ length: states }, (_, i) => `k[${i}]`), "n"];
}

/**
 * The required parameter names of a structure, in the kind's order. For state feedback the number
 * of gains is read from the names the structure gives (k[0] … k[m−1], contiguous).
 */
export function structureParameterNames(structure: Structure): string[] {
  if (structure.kind === "state-feedback") {
    const indices = [...structure.tunable, ...Object.keys(structure.fixed)]
      .map((name) => STATE_GAIN.exec(name))
      .filter((m): m is RegExpExecArray => m !== null)
      .map((m) => Number(m[1]));
    // Checked before any list is built: k[999999999] must not allocate a billion names.
    const m = indices.reduce((largest, i) => Math.max(largest, i + 1), 0);
    return stateFeedbackNames(m);
  }
  const names = STRUCTURE_PARAMETERS[structure.kind];
  if (!names) throw new StructureError("structure.kind", `unknown controller structure "${String(structure.kind)}"`);
  return structure.filter && (structure.kind === "pid" || structure.kind === "pid2dof") ? names.filter((n) => n !== "tf") : [...names];
}

/**
 * Checks a structure: a known kind; tunable and fixed names known for the kind, none twice, none
 * in both; every required parameter given once (tf from `filter` when one is set); fixed values
 * finite; `filter` only on pid and pid2dof, with a finite n > 0 or tf ≥ 0; state-feedback gains
 * k[0] … k[m−1] contiguous with m = plantStates when that is given.
 * Throws a StructureError (a RangeError) with the field (`structure.tunable[i]`, `structure.fixed.<name>`, …) and the reason.
 */
export function assertValidStructure(structure: Structure, plantStates?: number): void {
  if (structure === null || typeof structure !== "object") throw new TypeError("structure must be an object");
  const kind = structure.kind;
  if (kind !== "state-feedback" && !(kind in STRUCTURE_PARAMETERS)) {
    throw new StructureError("structure.kind", `unknown controller structure "${String(kind)}"`);
  }
  if (!Array.isArray(structure.tunable)) throw new StructureError("structure.tunable", "give a list of parameter names");
  if (structure.fixed === null || typeof structure.fixed !== "object") throw new StructureError("structure.fixed", "give an object of numbers");
  const required = structureParameterNames(structure);
  const allowed = new Set([...required, ...OPTIONAL_STRUCTURE_PARAMETERS]);
  const given = new Set<string>();
  structure.tunable.forEach((name, i) => {
    if (!allowed.has(name)) throw new StructureError(`structure.tunable[${i}]`, `"${String(name)}" is not a parameter of ${kind}; use ${[...allowed].join(", ")}`);
    if (given.has(name)) throw new StructureError(`structure.tunable[${i}]`, `"${name}" appears twice`);
    given.add(name);
  });
  for (const [name, value] of Object.entries(structure.fixed)) {
    if (!allowed.has(name)) throw new StructureError(`structure.fixed.${name}`, `"${name}" is not a parameter of ${kind}; use ${[...allowed].join(", ")}`);
    if (given.has(name)) throw new StructureError(`structure.fixed.${name}`, `${name} is already tunable; a parameter is either tuned or fixed`);
    if (typeof value !== "number" || !Number.isFinite(value)) throw new StructureError(`structure.fixed.${name}`, `${name} must be a finite number`);
    given.add(name);
  }
  for (const name of required) {
    if (!given.has(name)) throw new StructureError(`structure.fixed.${name}`, `${kind} needs ${name}; make it tunable or give a fixed value`);
  }
  if (structure.filter !== undefined) {
    if (kind !== "pid" && kind !== "pid2dof") throw new StructureError("structure.filter", "a derivative filter applies to pid and pid2dof only");
    const f = structure.filter;
    if (f.mode === "ratio") {
      if (!(Number.isFinite(f.n) && f.n > 0)) throw new StructureError("structure.filter.n", "n must be a finite number > 0");
    } else if (f.mode === "fixed") {
      if (!(Number.isFinite(f.tf) && f.tf >= 0)) throw new StructureError("structure.filter.tf", "tf must be a finite time ≥ 0 s");
    } else throw new StructureError("structure.filter.mode", 'mode must be "ratio" or "fixed"');
  }
  if (kind === "state-feedback") {
    const gains = required.length - 1;
    if (gains === 0) throw new StructureError("structure.tunable", "state feedback needs gains k[0], k[1], … (one per plant state)");
    if (plantStates !== undefined && gains !== plantStates) {
      throw new StructureError("structure.tunable", `state feedback on this plant needs ${plantStates} gains k[0]…k[${plantStates - 1}], got ${gains}`);
    }
  }
}

/**
 * The controller for one candidate: `values[offset + i]` is the value of `structure.tunable[i]`,
 * the other parameters come from `structure.fixed`, tf from `structure.filter` when one is set
 * (ratio: tf = kd/(n·kp), 0 when kd = 0; NaN when kd ≠ 0 and kp = 0, which evaluation rejects).
 * Does not validate (call assertValidStructure once per batch); evaluation checks the controller.
 */
export function controllerFromVector(structure: Structure, values: ArrayLike<number>, offset = 0): Controller {
  const p: Record<string, number> = { ...structure.fixed };
  const tunable = structure.tunable;
  for (let i = 0; i < tunable.length; i++) p[tunable[i]] = values[offset + i];
  const common: { sampleTime?: number; antiWindup?: AntiWindup } = {};
  if (p.sampleTime !== undefined) common.sampleTime = p.sampleTime;
  if (structure.antiWindup !== undefined) common.antiWindup = structure.antiWindup;
  switch (structure.kind) {
    case "p":
      return { kind: "p", kp: p.kp, ...common };
    case "pi":
      return { kind: "pi", kp: p.kp, ki: p.ki, ...common };
    case "pid":
      return { kind: "pid", kp: p.kp, ki: p.ki, kd: p.kd, tf: filterTime(structure, p), ...common };
    case "pid2dof":
      return { kind: "pid2dof", kp: p.kp, ki: p.ki, kd: p.kd, tf: filterTime(structure, p), b: p.b, c: p.c, ...common };
    case "lead-lag":
      return { kind: "lead-lag", k: p.k, tLead: p.tLead, tLag: p.tLag, ...common };
    case "state-feedback": {
      const names = structureParameterNames(structure);
      const k = names.slice(0, -1).map((name) => p[name]);
      return { kind: "state-feedback", k, n: p.n, ...common };
    }
  }
}

/** tf of a pid-like candidate: from the filter when set, else the listed value. */
function filterTime(structure: Structure, p: Record<string, number>): number {
  const f = structure.filter;
  if (!f) return p.tf;
  if (f.mode === "fixed") return f.tf;
  if (p.kd === 0) return 0;
  return p.kp === 0 ? NaN : p.kd / (f.n * p.kp);
}
