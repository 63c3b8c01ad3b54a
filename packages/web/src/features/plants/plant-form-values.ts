import { MAX_NONLINEAR_STATES, plantInputSchema, type Plant, type PlantInput, type PlantKind, type PlantRevisionDto } from "@loopyard/core";
import type { Resolver } from "react-hook-form";
import { fieldErrors, type FieldIssue } from "../../forms/field-errors.js";
import { toResolverErrors } from "../../forms/resolver-errors.js";
import { formatCoefficientText, parseCoefficients } from "./coefficient-text.js";
import { formatMatrixText, parseMatrix } from "./matrix-text.js";
import { formatParametersText, parseNames, parseParameters } from "./nonlinear-text.js";

/**
 * What the plant form holds: every kind's fields as typed text, side by side, so that switching
 * the kind keeps what was typed. Paths follow plantInputSchema (`model.den`, `model.derivatives.0`,
 * `model.actuator.max` …) so that schema and server errors land on the fields.
 */
export interface PlantFormValues {
  name: string;
  unitsNote: string;
  /** What changed and why (required for a new revision; optional on a new plant). */
  note: string;
  model: {
    kind: PlantKind;
    /** Transfer function: coefficient lists and dead time. */
    num: string;
    den: string;
    delay: string;
    /** State space: matrices as rows, one row per line. */
    A: string;
    B: string;
    C: string;
    D: string;
    /** Nonlinear: state names, "name = value" lines, one derivative and one initial value per state. */
    states: string;
    parameters: string;
    derivatives: string[];
    output: string;
    initial: string[];
    operatingInput: string;
    /** Any kind: optional actuator limits ("" = none). */
    actuator: { min: string; max: string; rate: string };
  };
}

const indexed = (name: string) => Array.from({ length: MAX_NONLINEAR_STATES }, (_, i) => `model.${name}.${i}`);

/** Form fields in the dotted paths of plantInputSchema, so that schema and server errors land on them. */
export const PLANT_FORM_FIELDS = [
  "name",
  "unitsNote",
  "note",
  "model.kind",
  "model.num",
  "model.den",
  "model.delay",
  "model.A",
  "model.B",
  "model.C",
  "model.D",
  "model.states",
  "model.parameters",
  "model.derivatives",
  ...indexed("derivatives"),
  "model.output",
  "model.initial",
  ...indexed("initial"),
  "model.operatingInput",
  "model.actuator",
  "model.actuator.min",
  "model.actuator.max",
  "model.actuator.rate",
] as const;

export const EMPTY_PLANT_FORM: PlantFormValues = {
  name: "",
  unitsNote: "",
  note: "",
  model: {
    kind: "transfer-function",
    num: "",
    den: "",
    delay: "0",
    A: "",
    B: "",
    C: "",
    D: "0",
    states: "",
    parameters: "",
    derivatives: [],
    output: "",
    initial: [],
    operatingInput: "0",
    actuator: { min: "", max: "", rate: "" },
  },
};

const text = (value: number | undefined) => (value === undefined ? "" : String(value));

/** A revision as form text, for the "New revision" form. */
export function plantFormFromRevision(revision: PlantRevisionDto): PlantFormValues {
  const model = revision.model;
  const values: PlantFormValues = {
    name: revision.name,
    unitsNote: revision.unitsNote,
    note: "",
    // A hand-made revision of an identified plant is a typed transfer function with its coefficients.
    model: { ...EMPTY_PLANT_FORM.model, kind: model.kind === "identified" ? "transfer-function" : model.kind, actuator: { min: text(model.actuator?.min), max: text(model.actuator?.max), rate: text(model.actuator?.rate) } },
  };
  if (model.kind === "transfer-function" || model.kind === "identified") {
    Object.assign(values.model, { num: formatCoefficientText(model.num), den: formatCoefficientText(model.den), delay: String(model.delay) });
  } else if (model.kind === "state-space") {
    Object.assign(values.model, { A: formatMatrixText(model.A), B: formatMatrixText(model.B), C: formatMatrixText(model.C), D: formatMatrixText(model.D) });
  } else {
    Object.assign(values.model, {
      states: model.states.join(", "),
      parameters: formatParametersText(model.parameters),
      derivatives: [...model.derivatives],
      output: model.output,
      initial: model.initial.map(String),
      operatingInput: text(model.operatingInput ?? 0),
    });
  }
  return values;
}

const DECIMAL = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** A typed number: undefined for blank text, NaN when it is not a plain decimal. */
function readNumber(value: string | undefined): number | undefined {
  const trimmed = (value ?? "").replace(/\u2212/g, "-").trim();
  if (trimmed === "") return undefined;
  return DECIMAL.test(trimmed) ? Number(trimmed) : Number.NaN;
}

type ModelRead = { model: Plant | null; issues: FieldIssue[] };

function readTransferFunction(m: PlantFormValues["model"]): ModelRead {
  const issues: FieldIssue[] = [];
  const num = parseCoefficients(m.num);
  if (!num.ok) issues.push({ path: "model.num", message: num.message });
  const den = parseCoefficients(m.den);
  if (!den.ok) issues.push({ path: "model.den", message: den.message });
  const delay = readNumber(m.delay) ?? 0;
  if (Number.isNaN(delay)) issues.push({ path: "model.delay", message: "dead time must be a number of seconds ≥ 0, e.g. 0 or 1.5" });
  if (!num.ok || !den.ok || issues.length > 0) return { model: null, issues };
  return { model: { kind: "transfer-function", num: num.values, den: den.values, delay }, issues };
}

function readStateSpace(m: PlantFormValues["model"]): ModelRead {
  const issues: FieldIssue[] = [];
  const read = (name: "A" | "B" | "C" | "D", fallback?: string) => {
    const parsed = parseMatrix(m[name].trim() === "" && fallback !== undefined ? fallback : m[name], name);
    if (!parsed.ok) issues.push({ path: `model.${name}`, message: parsed.message });
    return parsed.ok ? parsed.rows : null;
  };
  const A = read("A");
  const B = read("B");
  const C = read("C");
  const D = read("D", "0");
  if (!A || !B || !C || !D) return { model: null, issues };
  return { model: { kind: "state-space", A, B, C, D }, issues };
}

function readNonlinear(m: PlantFormValues["model"]): ModelRead {
  const issues: FieldIssue[] = [];
  const states = parseNames(m.states);
  if (!states.ok) issues.push({ path: "model.states", message: states.message });
  const parameters = parseParameters(m.parameters);
  if (!parameters.ok) issues.push({ path: "model.parameters", message: parameters.message });
  const operatingInput = readNumber(m.operatingInput) ?? 0;
  if (Number.isNaN(operatingInput)) issues.push({ path: "model.operatingInput", message: "the operating input must be a number, e.g. 0 or 0.4" });
  if (!states.ok || !parameters.ok) return { model: null, issues };
  const initial = states.value.map((name, i) => {
    const value = readNumber(m.initial?.[i]);
    if (value === undefined) issues.push({ path: `model.initial.${i}`, message: `give the value of ${name} at t = 0` });
    else if (Number.isNaN(value)) issues.push({ path: `model.initial.${i}`, message: `“${m.initial[i]}” is not a number` });
    return value ?? Number.NaN;
  });
  const derivatives = states.value.map((_, i) => m.derivatives?.[i] ?? "");
  if (issues.length > 0) return { model: null, issues };
  return {
    model: { kind: "nonlinear", states: states.value, parameters: parameters.value, derivatives, output: m.output, initial, operatingInput },
    issues,
  };
}

function readActuator(a: PlantFormValues["model"]["actuator"]): { limits: Plant["actuator"]; issues: FieldIssue[] } {
  const issues: FieldIssue[] = [];
  const limits: NonNullable<Plant["actuator"]> = {};
  for (const key of ["min", "max", "rate"] as const) {
    const value = readNumber(a?.[key]);
    if (value === undefined) continue;
    if (Number.isNaN(value)) issues.push({ path: `model.actuator.${key}`, message: `“${a[key]}” is not a number; leave it empty for no limit` });
    else limits[key] = value;
  }
  return { limits: Object.keys(limits).length > 0 ? limits : undefined, issues };
}

const READERS: Record<PlantKind, (m: PlantFormValues["model"]) => ModelRead> = {
  "transfer-function": readTransferFunction,
  "state-space": readStateSpace,
  nonlinear: readNonlinear,
  identified: () => ({ model: null, issues: [{ path: "model.kind", message: "an identified plant is fitted from a step test; choose a transfer function to type its coefficients" }] }),
};

/**
 * Reads the typed text of the chosen kind into a plant input and checks it with the shared
 * plantInputSchema. Returns the input, or the problems keyed by form field.
 */
export function readPlantForm(values: PlantFormValues): { ok: true; input: PlantInput } | { ok: false; errors: Record<string, string> } {
  const kind = values.model.kind ?? "transfer-function";
  const read = READERS[kind](values.model);
  const actuator = readActuator(values.model.actuator);
  const issues = [...read.issues, ...actuator.issues];
  if (issues.length > 0 || !read.model) {
    // Check the name too, so that every problem shows at once.
    const name = plantInputSchema.shape.name.safeParse(values.name);
    if (!name.success) issues.push({ path: "name", message: name.error.issues[0].message });
    return { ok: false, errors: fieldErrors(issues, PLANT_FORM_FIELDS) };
  }
  const model: Plant = actuator.limits ? { ...read.model, actuator: actuator.limits } : read.model;
  const input: PlantInput = { name: values.name, unitsNote: values.unitsNote, model };
  if ((values.note ?? "").trim() !== "") input.note = values.note;
  const parsed = plantInputSchema.safeParse(input);
  if (!parsed.success) return { ok: false, errors: fieldErrors(parsed.error.issues, PLANT_FORM_FIELDS) };
  return { ok: true, input };
}

/** react-hook-form resolver over readPlantForm: submits the PlantInput, or shows each problem at its field. */
export const plantFormResolver: Resolver<PlantFormValues, unknown, PlantInput> = async (values) => {
  const read = readPlantForm(values);
  return read.ok ? { values: read.input, errors: {} } : { values: {}, errors: toResolverErrors<PlantFormValues>(read.errors) };
};
