/** Most points of one trace sent in a JSON response. */
export const MAX_TRACE_POINTS = 2000;

/**
 * Sample positions that thin a trace of `length` points to at most `maxPoints`: every k-th point
 * with k = ⌈length / maxPoints⌉ (counted so that the last point always stays), first point included.
 */
export function downsampleIndices(length: number, maxPoints = MAX_TRACE_POINTS): number[] {
  if (length <= 0) return [];
  if (maxPoints < 2) throw new RangeError("maxPoints must be at least 2");
  if (length <= maxPoints) return Array.from({ length }, (_, i) => i);
  const stride = Math.ceil((length - 1) / (maxPoints - 1));
  const indices: number[] = [];
  for (let i = 0; i < length - 1; i += stride) indices.push(i);
  indices.push(length - 1);
  return indices;
}

/** The values of `values` at `indices`, as a plain array (JSON-ready). */
export function pick(values: ArrayLike<number>, indices: readonly number[]): number[] {
  return indices.map((i) => values[i] as number);
}
