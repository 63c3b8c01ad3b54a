/**
 * JSON for jsonb columns that keeps every double: PostgreSQL's jsonb has no NaN or ±Infinity, so a
 * non-finite number is written as the string "NaN", "Infinity" or "-Infinity" inside an object
 * { "$n": … } and read back as the number; typed arrays are written as plain arrays. What core
 * returns (pre-scan chunks, picks, analyses) is stored and read back unchanged through these two.
 */
export function toStoredJson(value: unknown): unknown {
  return JSON.parse(
    JSON.stringify(value, function (_key, v: unknown) {
      if (typeof v === "number" && !Number.isFinite(v)) return { $n: String(v) };
      if (ArrayBuffer.isView(v) && !(v instanceof DataView)) return Array.from(v as unknown as ArrayLike<number>, (x) => (Number.isFinite(x) ? x : { $n: String(x) }));
      return v;
    }),
  );
}

/** The inverse of toStoredJson (typed arrays come back as plain number arrays). */
export function fromStoredJson<T>(value: unknown): T {
  return revive(value) as T;
}

function revive(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(revive);
  if (value !== null && typeof value === "object") {
    const entries = Object.entries(value as Record<string, unknown>);
    if (entries.length === 1 && entries[0]?.[0] === "$n" && typeof entries[0][1] === "string") return Number(entries[0][1]);
    return Object.fromEntries(entries.map(([k, v]) => [k, revive(v)]));
  }
  return value;
}
