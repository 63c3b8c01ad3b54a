import { z } from "zod";
import { plantModelSchema } from "../plants/plant.js";
import { textField } from "./text.js";

/**
 * What a user submits to create a plant or a new revision of it:
 * a name, an optional units note (e.g. "u: heater power [W]; y: plate temperature [°C]")
 * a change note (required for a new revision) and the model. Errors carry a path such as `model.den`.
 */
export const plantInputSchema = z.object({
  name: textField({ label: "name", min: 1, required: "give the plant a name", max: 120 }),
  unitsNote: textField({ label: "units note", max: 500 }).default(""),
  /** What changed and why: required when revising (the server checks), optional on a new plant. */
  note: textField({ label: "change note", max: 500 }).optional(),
  model: plantModelSchema,
});

export type PlantInput = z.input<typeof plantInputSchema>;
export type PlantInputParsed = z.output<typeof plantInputSchema>;
