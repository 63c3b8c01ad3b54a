import { assertValidSpace, axisValue, type ParameterSpace } from "./parameter-space.js";

/**
 * A full factorial grid over a parameter space: axis i takes counts[i] values evenly spread from
 * min to max inclusive (in log(value) on a log axis), w_j = j/(counts[i] − 1), j = 0…counts[i]−1;
 * a count of 1 gives min alone.
 *
 * Returns the candidates row-major (n × d, d = space.length, n = Π counts): the first axis varies
 * slowest and the last fastest, so with three axes candidate index = (j₀·c₁ + j₁)·c₂ + j₂ — the
 * same order as gridCandidates for kp, ki, kd.
 *
 * counts: whole numbers ≥ 1, one per axis. Throws a RangeError naming `counts[i]` or the bad axis,
 * or `counts` when the product exceeds maxCandidates (default 10⁷).
 */
export function gridDesign(space: ParameterSpace, counts: readonly number[], maxCandidates = DEFAULT_MAX_CANDIDATES): Float64Array {
  assertValidSpace(space);
  if (!Array.isArray(counts) || counts.length !== space.length) {
    throw new RangeError(`counts: give one count per axis (${space.length}), got ${Array.isArray(counts) ? counts.length : String(counts)}`);
  }
  let n = 1;
  counts.forEach((c, i) => {
    if (!Number.isInteger(c) || c < 1) throw new RangeError(`counts[${i}] (${space[i].name}) must be a whole number ≥ 1, got ${String(c)}`);
    n *= c;
  });
  if (n > maxCandidates) throw new RangeError(`counts: the grid has ${n} candidates, more than ${maxCandidates}`);
  const d = space.length;
  const values = space.map((axis, i) => {
    const c = counts[i];
    const v = new Float64Array(c);
    for (let j = 0; j < c; j++) v[j] = c === 1 ? axis.min : axisValue(axis, j / (c - 1));
    return v;
  });
  const out = new Float64Array(n * d);
  for (let row = 0; row < n; row++) {
    let rest = row;
    for (let i = d - 1; i >= 0; i--) {
      const c = counts[i];
      out[row * d + i] = values[i][rest % c];
      rest = Math.floor(rest / c);
    }
  }
  return out;
}

/** Largest grid gridDesign builds unless told otherwise. */
export const DEFAULT_MAX_CANDIDATES = 10_000_000;
