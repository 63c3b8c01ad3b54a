import type { LoopTrace } from "../../src/simulation/loop-trace.js";

/** The grid t_k = k·dt, k = 0…n. */
export function grid(n: number, dt: number): Float64Array {
  return Float64Array.from({ length: n + 1 }, (_, k) => k * dt);
}

/**
 * A LoopTrace built from given output and input samples of a setpoint step from y0 by stepSize:
 * r = y0 + stepSize, e = r − y. Defaults: u ≡ 0, y0 = 0, stepSize = 1, yInfinity = y0 + stepSize,
 * uInfinity = 0, status "ok".
 */
export function traceFromSamples(
  t: Float64Array,
  y: ArrayLike<number>,
  options: { u?: ArrayLike<number>; y0?: number; stepSize?: number; yInfinity?: number; uInfinity?: number; status?: "ok" | "diverged" } = {},
): LoopTrace {
  const y0 = options.y0 ?? 0;
  const stepSize = options.stepSize ?? 1;
  const r = new Float64Array(t.length).fill(y0 + stepSize);
  const yy = Float64Array.from(y);
  return {
    t,
    r,
    y: yy,
    u: options.u ? Float64Array.from(options.u) : new Float64Array(t.length),
    e: r.map((rk, k) => rk - yy[k]),
    uInfinity: options.uInfinity ?? 0,
    y0,
    stepSize,
    yInfinity: options.yInfinity ?? y0 + stepSize,
    status: options.status ?? "ok",
  };
}
