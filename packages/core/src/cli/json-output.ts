/**
 * JSON text of a CLI result, two-space indented. Numbers JSON cannot hold are spelt out:
 * Infinity → "inf", −Infinity → "-inf" (a rise or settling time not reached within the horizon);
 * NaN → null (a criterion that does not apply).
 */
export function toCliJson(value: unknown, indent = 2): string {
  return JSON.stringify(value, (_key, v: unknown) => (typeof v === "number" ? cliNumber(v) : v), indent);
}

/** A number for JSON output: itself when finite, "inf"/"-inf" for infinities, null for NaN. */
export function cliNumber(v: number): number | string | null {
  if (Number.isFinite(v)) return v;
  if (v === Infinity) return "inf";
  if (v === -Infinity) return "-inf";
  return null;
}
