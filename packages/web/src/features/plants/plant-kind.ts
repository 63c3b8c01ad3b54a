import type { PlantKind } from "@loopyard/core";

/** How each plant kind is named in the app, with one line on what the user types for it. */
/** The kinds a user types by hand (an identified plant is fitted from a step test instead). */
export type TypedPlantKind = Exclude<PlantKind, "identified">;

export const PLANT_KINDS: readonly { kind: TypedPlantKind; label: string; short: string; summary: string }[] = [
  { kind: "transfer-function", label: "Transfer function", short: "transfer function", summary: "G(s) as numerator and denominator coefficients, with dead time" },
  { kind: "state-space", label: "State space", short: "state space", summary: "matrices A, B, C, D of x′ = Ax + Bu, y = Cx + Du" },
  { kind: "nonlinear", label: "Nonlinear equations", short: "nonlinear", summary: "one derivative per named state, written as formulas" },
];

/** The short lower-case name of a kind for tables and badges, e.g. "state space". */
export function plantKindShort(kind: PlantKind): string {
  if (kind === "identified") return "identified";
  return PLANT_KINDS.find((k) => k.kind === kind)?.short ?? kind;
}
