import { plantInputSchema, type PlantInput, type PlantRevisionDto } from "@loopyard/core";
import type { Resolver } from "react-hook-form";
import { fieldErrors, type FieldIssue } from "../../forms/field-errors.js";
import { toResolverErrors } from "../../forms/resolver-errors.js";
import { formatCoefficientText, parseCoefficients } from "./coefficient-text.js";

/** What the plant form holds: the coefficients and dead time as typed text. */
export interface PlantFormValues {
  name: string;
  unitsNote: string;
  model: { num: string; den: string; delay: string };
}

/** Form fields in the dotted paths of plantInputSchema, so schema and server errors land on them. */
export const PLANT_FORM_FIELDS = ["name", "unitsNote", "model.num", "model.den", "model.delay"] as const;

export const EMPTY_PLANT_FORM: PlantFormValues = { name: "", unitsNote: "", model: { num: "", den: "", delay: "0" } };

/** A revision as form text, for the "New revision" form. */
export function plantFormFromRevision(revision: PlantRevisionDto): PlantFormValues {
  return {
    name: revision.name,
    unitsNote: revision.unitsNote,
    model: {
      num: formatCoefficientText(revision.model.num),
      den: formatCoefficientText(revision.model.den),
      delay: String(revision.model.delay),
    },
  };
}

const SECONDS = /^[+]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/**
 * Reads the typed text into a plant input and checks it with the shared plantInputSchema.
 * Returns the input, or the problems keyed by form field.
 */
export function readPlantForm(values: PlantFormValues): { ok: true; input: PlantInput } | { ok: false; errors: Record<string, string> } {
  const issues: FieldIssue[] = [];
  const num = parseCoefficients(values.model.num);
  if (!num.ok) issues.push({ path: "model.num", message: num.message });
  const den = parseCoefficients(values.model.den);
  if (!den.ok) issues.push({ path: "model.den", message: den.message });
  const delayText = values.model.delay.trim();
  const delay = delayText === "" ? 0 : SECONDS.test(delayText) ? Number(delayText) : Number.NaN;
  if (Number.isNaN(delay)) issues.push({ path: "model.delay", message: "dead time must be a number of seconds ≥ 0, e.g. 0 or 1.5" });
  if (issues.length > 0 || !num.ok || !den.ok) {
    // Check the name too, so that every problem shows at once.
    const name = plantInputSchema.shape.name.safeParse(values.name);
    if (!name.success) issues.push({ path: "name", message: name.error.issues[0].message });
    return { ok: false, errors: fieldErrors(issues, PLANT_FORM_FIELDS) };
  }
  const input: PlantInput = {
    name: values.name,
    unitsNote: values.unitsNote,
    model: { kind: "transfer-function", num: num.values, den: den.values, delay },
  };
  const parsed = plantInputSchema.safeParse(input);
  if (!parsed.success) return { ok: false, errors: fieldErrors(parsed.error.issues, PLANT_FORM_FIELDS) };
  return { ok: true, input };
}

/** react-hook-form resolver over readPlantForm: submits the PlantInput, or shows each problem at its field. */
export const plantFormResolver: Resolver<PlantFormValues, unknown, PlantInput> = async (values) => {
  const read = readPlantForm(values);
  return read.ok ? { values: read.input, errors: {} } : { values: {}, errors: toResolverErrors<PlantFormValues>(read.errors) };
};
