import { z } from "zod";
import { STEP_MODEL_KINDS } from "../identification/step-model.js";
import { stepModelKindSchema, stepTestSettingsSchema } from "../identification/step-test-settings.js";
import { actuatorLimitsSchema } from "../plants/actuator-limits.js";
import { textField } from "./text.js";

/** Largest step-test file accepted [bytes]: 10 MB. */
export const MAX_STEP_TEST_BYTES = 10 * 1024 * 1024;

/** POST …/step-tests/:stepTestId/fits: the settings and the models to fit (default: all three). */
export const stepTestFitInputSchema = z.object({
  settings: stepTestSettingsSchema,
  models: z
    .array(stepModelKindSchema)
    .min(1, "choose at least one model to fit")
    .max(STEP_MODEL_KINDS.length)
    .refine((m) => new Set(m).size === m.length, "name each model once")
    .default([...STEP_MODEL_KINDS]),
});

/** POST …/step-tests/:stepTestId/plants: a fit saved as a new identified plant. */
export const stepTestPlantInputSchema = z.object({
  name: textField({ label: "name", min: 1, required: "give the plant a name", max: 120 }),
  unitsNote: textField({ label: "units note", max: 500 }).default(""),
  settings: stepTestSettingsSchema,
  model: stepModelKindSchema,
  actuator: actuatorLimitsSchema.optional(),
});

/** POST …/plants/:plantId/refit: the identified plant fitted again from its step test as a new revision. */
export const refitInputSchema = z.object({
  name: textField({ label: "name", min: 1, required: "give the plant a name", max: 120 }).optional(),
  unitsNote: textField({ label: "units note", max: 500 }).optional(),
  /** The new revision's change note; without one it says which model was fitted over which window. */
  note: textField({ label: "change note", max: 500 }).optional(),
  settings: stepTestSettingsSchema,
  model: stepModelKindSchema,
  actuator: actuatorLimitsSchema.optional(),
});

export type StepTestFitInput = z.input<typeof stepTestFitInputSchema>;
export type StepTestPlantInput = z.input<typeof stepTestPlantInputSchema>;
export type RefitInput = z.input<typeof refitInputSchema>;
