import type { Plant } from "@loopyard/core";

/**
 * The unit of the plant input u: the step test's input unit for an identified plant, else the one
 * named in the units note as "u: … [unit]" (e.g. "u: heater power [W]; y: …" → "W"); null when
 * neither says.
 */
export function inputUnitOf(model: Plant, unitsNote: string): string | null {
  if (model.kind === "identified" && model.identification.settings.units.input.trim() !== "") return model.identification.settings.units.input.trim();
  const match = /(?:^|[;,\n])\s*u\s*[:=][^;\n[\]]*\[([^\]]+)\]/i.exec(unitsNote);
  return match ? match[1].trim() : null;
}

/** The units of the actuator limits: the input's unit and per second for the rate ("W", "W/s"), or "u", "u/s" when unknown. */
export function actuatorUnits(inputUnit: string | null): { level: string; rate: string } {
  const unit = inputUnit ?? "u";
  return { level: unit, rate: `${unit}/s` };
}
