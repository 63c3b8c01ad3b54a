/** How values are spread between min and max: evenly, or evenly in log(value) (min > 0). */
export type ParameterScale = "linear" | "log";

/** One tunable parameter of a structure with its bounds. */
export interface ParameterAxis {
  /** A tunable name of the structure, e.g. "kp". */
  name: string;
  min: number;
  max: number;
  /** Default "linear". */
  scale?: ParameterScale;
}

/** The box a design samples: one axis per tunable parameter, in the structure's `tunable` order. */
export type ParameterSpace = readonly ParameterAxis[];

/**
 * The value of an axis at the unit coordinate w ∈ [0, 1]:
 *
 *   linear:  v = min + w·(max − min)
 *   log:     v = exp(ln min + w·(ln max − ln min))   (evenly spread in decades)
 *
 * w = 0 gives min and w = 1 gives max exactly.
 */
export function axisValue(axis: ParameterAxis, w: number): number {
  if (w <= 0) return axis.min;
  if (w >= 1) return axis.max;
  if (axis.scale === "log") {
    const lo = Math.log(axis.min);
    return Math.exp(lo + w * (Math.log(axis.max) - lo));
  }
  return axis.min + w * (axis.max - axis.min);
}

/**
 * Checks a parameter space: at least one axis, distinct non-empty names, finite bounds with
 * max ≥ min, and min > 0 on a log axis. Throws a RangeError naming `space[i].<field>`.
 */
export function assertValidSpace(space: ParameterSpace): void {
  if (!Array.isArray(space) || space.length === 0) throw new RangeError("space: give at least one parameter axis");
  const seen = new Set<string>();
  space.forEach((axis, i) => {
    if (typeof axis.name !== "string" || axis.name.length === 0) throw new RangeError(`space[${i}].name must be a non-empty string`);
    if (seen.has(axis.name)) throw new RangeError(`space[${i}].name: "${axis.name}" appears twice`);
    seen.add(axis.name);
    if (!Number.isFinite(axis.min)) throw new RangeError(`space[${i}].min (${axis.name}) must be finite`);
    if (!Number.isFinite(axis.max)) throw new RangeError(`space[${i}].max (${axis.name}) must be finite`);
    if (axis.max < axis.min) throw new RangeError(`space[${i}].max (${axis.name}) must be ≥ min`);
    if (axis.scale !== undefined && axis.scale !== "linear" && axis.scale !== "log") {
      throw new RangeError(`space[${i}].scale (${axis.name}) must be "linear" or "log"`);
    }
    if (axis.scale === "log" && !(axis.min > 0)) throw new RangeError(`space[${i}].min (${axis.name}) must be > 0 on a log scale`);
  });
}
