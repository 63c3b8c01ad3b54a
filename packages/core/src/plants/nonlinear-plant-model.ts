import { compileSystem, type CompiledSystem } from "../expressions/compile-system.js";
import { ExpressionError } from "../expressions/expression-error.js";
import type { SisoStateSpace } from "../linear-algebra/siso-state-space.js";
import type { NonlinearPlant } from "./nonlinear.js";

/** A compiled nonlinear plant with its operating point. */
export interface NonlinearPlantModel {
  system: CompiledSystem;
  /** Parameter values in the order the compiled functions expect. */
  parameters: Float64Array;
  initial: Float64Array;
  /** Plant input before t = 0 [u]. */
  operatingInput: number;
  /** Output at the operating point, y0 = output(initial, operatingInput). */
  y0: number;
}

const cache = new WeakMap<object, NonlinearPlantModel>();

/**
 * Compiles a nonlinear plant's expressions (compileSystem: whitelist-checked, never JavaScript
 * eval of user text) and its operating point. Cached per plant object. Throws a RangeError naming
 * `plant.initial` / `plant.parameters.<name>`, or the compiler's ExpressionError / DeclaredNameError.
 */
export function nonlinearPlantModel(plant: NonlinearPlant): NonlinearPlantModel {
  const hit = cache.get(plant);
  if (hit) return hit;
  const names = Object.keys(plant.parameters ?? {});
  const system = compileSystem({ states: plant.states, parameters: names, derivatives: plant.derivatives, output: plant.output });
  const parameters = new Float64Array(names.length);
  names.forEach((name, i) => {
    const v = plant.parameters[name];
    if (typeof v !== "number" || !Number.isFinite(v)) throw new RangeError(`plant.parameters.${name} must be a finite number`);
    parameters[i] = v;
  });
  if (!Array.isArray(plant.initial) || plant.initial.length !== plant.states.length) {
    throw new RangeError(`plant.initial: give one value per state (${plant.states.length})`);
  }
  const initial = Float64Array.from(plant.initial);
  if (!initial.every(Number.isFinite)) throw new RangeError("plant.initial: every value must be finite");
  const operatingInput = plant.operatingInput ?? 0;
  if (!Number.isFinite(operatingInput)) throw new RangeError("plant.operatingInput must be finite");
  const at = operatingPointText(plant, operatingInput);
  const rates = new Float64Array(plant.states.length);
  system.derivatives(0, initial, parameters, operatingInput, rates);
  rates.forEach((rate, i) => {
    if (!Number.isFinite(rate)) throw notFiniteAt(`d${plant.states[i]}/dt`, plant.derivatives[i], `derivatives.${i}`, rate, at);
  });
  const y0 = system.output(0, initial, parameters, operatingInput);
  if (!Number.isFinite(y0)) throw notFiniteAt("the output y", plant.output, "output", y0, at);
  const model = { system, parameters, initial, operatingInput, y0 };
  cache.set(plant, model);
  return model;
}

/** "x = 0, u = 0" for the sentences below. */
function operatingPointText(plant: NonlinearPlant, operatingInput: number): string {
  return `${plant.states.map((name, i) => `${name} = ${plant.initial[i]}`).join(", ")}, u = ${operatingInput}`;
}

/** The error for an expression that is not finite at the operating point, at its field (e.g. derivatives.1). */
function notFiniteAt(what: string, expression: string, field: string, value: number, at: string): ExpressionError {
  const how = Number.isNaN(value) ? "is not a number (NaN)" : "is infinite";
  return new ExpressionError(`${what} ${how} at the operating point (${at}): the expression divides by zero or leaves its domain there; change the initial state, the operating input or the expression`, {
    expression,
    token: "",
    field,
  });
}

/** Relative step of the central differences in linearizeNonlinearPlant. */
const DIFFERENCE_STEP = 1e-6;

/**
 * Linearisation of a nonlinear plant at its operating point (initial, operatingInput) by central
 * differences, h_j = 1e-6·max(1, |x_j|): A = ∂f/∂x, B = ∂f/∂u, C = ∂g/∂x, D = ∂g/∂u.
 * Used for plant poles and horizons, not for simulation. Reference: common practice
 * (Khalil, Nonlinear Systems, 3rd ed., 2002, §2.3 for linearisation).
 */
export function linearizeNonlinearPlant(plant: NonlinearPlant): SisoStateSpace {
  const { system, parameters, initial, operatingInput } = nonlinearPlantModel(plant);
  const n = system.stateCount;
  const a = new Float64Array(n * n);
  const b = new Float64Array(n);
  const c = new Float64Array(n);
  const plus = new Float64Array(n);
  const minus = new Float64Array(n);
  const x = Float64Array.from(initial);
  for (let j = 0; j < n; j++) {
    const h = DIFFERENCE_STEP * Math.max(1, Math.abs(initial[j]));
    x[j] = initial[j] + h;
    system.derivatives(0, x, parameters, operatingInput, plus);
    const gPlus = system.output(0, x, parameters, operatingInput);
    x[j] = initial[j] - h;
    system.derivatives(0, x, parameters, operatingInput, minus);
    const gMinus = system.output(0, x, parameters, operatingInput);
    x[j] = initial[j];
    for (let i = 0; i < n; i++) a[i * n + j] = (plus[i] - minus[i]) / (2 * h);
    c[j] = (gPlus - gMinus) / (2 * h);
  }
  const hu = DIFFERENCE_STEP * Math.max(1, Math.abs(operatingInput));
  system.derivatives(0, x, parameters, operatingInput + hu, plus);
  system.derivatives(0, x, parameters, operatingInput - hu, minus);
  for (let i = 0; i < n; i++) b[i] = (plus[i] - minus[i]) / (2 * hu);
  const d = (system.output(0, x, parameters, operatingInput + hu) - system.output(0, x, parameters, operatingInput - hu)) / (2 * hu);
  const at = operatingPointText(plant, operatingInput);
  for (let i = 0; i < n; i++) {
    let row = b[i];
    for (let j = 0; j < n; j++) row += a[i * n + j];
    if (!Number.isFinite(row)) throw notFiniteAt(`the slope of d${plant.states[i]}/dt`, plant.derivatives[i], `derivatives.${i}`, row, at);
  }
  if (!Number.isFinite(d) || !c.every(Number.isFinite)) throw notFiniteAt("the slope of the output y", plant.output, "output", Number.isFinite(d) ? Number.NaN : d, at);
  return { n, a, b, c, d };
}
