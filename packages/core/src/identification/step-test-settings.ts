import { z } from "zod";
import { textField } from "../schemas/text.js";
// time-units.js, not read-step-test.js: the plant schema imports this file, and should not pull the CSV parser in.
import { TIME_UNITS } from "./time-units.js";
import { STEP_MODEL_KINDS } from "./step-model.js";

/** A chosen column: its header name or its number from 1. */
const columnChoice = z.union([
  z.number({ error: "give a column number or a header name" }).int("give a whole column number").min(1, "columns are counted from 1").max(10_000, "no step-test file has that many columns"),
  textField({ label: "column name", min: 1, required: "choose a column", max: 200 }),
]);

/** How a step test is read and prepared for fitting: columns, units, trim window, offset. Shared by the web form, the server and the stored provenance. */
export const stepTestSettingsSchema = z
  .object({
    columns: z.object({ time: columnChoice, input: columnChoice, output: columnChoice }),
    units: z
      .object({
        time: z.enum(Object.keys(TIME_UNITS) as [keyof typeof TIME_UNITS, ...(keyof typeof TIME_UNITS)[]], { error: "the time unit must be s, ms, min or h" }).default("s"),
        input: textField({ label: "input unit", max: 40 }).default(""),
        output: textField({ label: "output unit", max: 40 }).default(""),
      })
      .default({ time: "s", input: "", output: "" }),
    trim: z
      .object({
        from: z.number({ error: "give the start of the window in seconds" }).finite("the start of the window must be finite").optional(),
        to: z.number({ error: "give the end of the window in seconds" }).finite("the end of the window must be finite").optional(),
      })
      .refine((w) => w.from === undefined || w.to === undefined || w.from < w.to, { path: ["to"], message: "the window must end after it starts" })
      .default({}),
    offset: z.enum(["initial", "none"], { error: 'offset must be "initial" (remove the level before the step) or "none"' }).default("initial"),
  })
  .superRefine((s, ctx) => {
    const keys = ["time", "input", "output"] as const;
    for (let i = 0; i < keys.length; i++) {
      for (let j = 0; j < i; j++) {
        if (String(s.columns[keys[i]]).toLowerCase() === String(s.columns[keys[j]]).toLowerCase()) {
          ctx.addIssue({ code: "custom", path: ["columns", keys[i]], message: `choose a column other than the ${keys[j]} column` });
        }
      }
    }
  });

export type StepTestSettings = z.output<typeof stepTestSettingsSchema>;
export type StepTestSettingsInput = z.input<typeof stepTestSettingsSchema>;

/** The step-model kind as a zod enum. */
export const stepModelKindSchema = z.enum(STEP_MODEL_KINDS, { error: "the model must be fopdt, sopdt or ipdt" });
