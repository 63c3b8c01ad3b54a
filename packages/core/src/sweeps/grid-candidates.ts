import type { PidController } from "../controllers/pid.js";
import type { DerivativeFilter, ParameterRange } from "./sweep-input.js";

/**
 * The PID candidates of a full grid over kp, ki and kd.
 *
 * Each range gives `count` values spaced evenly from min to max inclusive,
 * v_i = min + i·(max − min)/(count − 1) (count = 1 gives min alone). Candidates are listed
 * row-major: kp varies slowest, kd fastest, so candidate index = (i_kp·n_ki + i_ki)·n_kd + i_kd.
 *
 * The derivative filter time tf comes from `filter`:
 * - `{ mode: "ratio", n }`: tf = Td/n = kd/(n·kp), and tf = 0 when kd = 0; kd ≠ 0 with kp = 0 has
 *   no Td and throws a RangeError naming `filter`;
 * - `{ mode: "fixed", tf }`: that tf for every candidate; it must be > 0 when some kd ≠ 0.
 *
 * Throws a RangeError naming `ranges.<param>` for a bad range (non-finite, max < min, count not a
 * whole number ≥ 1).
 */
export function gridCandidates(
  ranges: { kp: ParameterRange; ki: ParameterRange; kd: ParameterRange },
  filter: DerivativeFilter,
): PidController[] {
  const kps = rangeValues(ranges.kp, "kp");
  const kis = rangeValues(ranges.ki, "ki");
  const kds = rangeValues(ranges.kd, "kd");
  if (filter.mode === "fixed" && !(filter.tf > 0) && kds.some((v) => v !== 0)) {
    throw new RangeError(`filter.tf must be > 0 s when kd can be non-zero, got ${filter.tf}`);
  }
  if (filter.mode === "ratio" && !(filter.n > 0 && Number.isFinite(filter.n))) {
    throw new RangeError(`filter.n must be a finite number > 0, got ${filter.n}`);
  }
  const out: PidController[] = [];
  for (const kp of kps) {
    for (const ki of kis) {
      for (const kd of kds) {
        let tf: number;
        if (filter.mode === "fixed") tf = filter.tf;
        else if (kd === 0) tf = 0;
        else if (kp === 0) {
          throw new RangeError("filter: the ratio filter tf = kd/(n·kp) needs kp > 0 wherever kd ≠ 0; raise kp.min or use a fixed tf");
        } else tf = kd / (filter.n * kp);
        out.push({ kind: "pid", kp, ki, kd, tf });
      }
    }
  }
  return out;
}

function rangeValues(range: ParameterRange, name: string): number[] {
  const { min, max, count } = range;
  if (!Number.isFinite(min) || !Number.isFinite(max)) throw new RangeError(`ranges.${name}: min and max must be finite`);
  if (max < min) throw new RangeError(`ranges.${name}.max must be ≥ min`);
  if (!Number.isInteger(count) || count < 1) throw new RangeError(`ranges.${name}.count must be a whole number ≥ 1`);
  if (count === 1) return [min];
  const step = (max - min) / (count - 1);
  const values: number[] = [];
  for (let i = 0; i < count; i++) values.push(i === count - 1 ? max : min + i * step);
  return values;
}
