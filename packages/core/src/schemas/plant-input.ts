import { z } from "zod";
import { plantModelSchema } from "../plants/plant.js";

/**
 * What a user submits to create a plant or a new revision of it:
 * a name, an optional units note (e.g. "u: heater power [W]; y: plate temperature [°C]")
 * and the model. Errors carry a path such as `model.den`.
 */
export const plantInputSchema = z.object({
  name: z.string().trim().min(1, "give the plant a name").max(120, "keep the name under 120 characters"),
  unitsNote: z.string().trim().max(500, "keep the units note under 500 characters").default(""),
  model: plantModelSchema,
});

export type PlantInput = z.input<typeof plantInputSchema>;
export type PlantInputParsed = z.output<typeof plantInputSchema>;
