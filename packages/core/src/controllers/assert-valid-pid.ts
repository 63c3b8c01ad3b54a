import type { PidController } from "./pid.js";

/**
 * Checks a PID controller: kp, ki, kd finite (any sign); tf finite and ≥ 0, and tf > 0 whenever
 * kd ≠ 0 (an unfiltered derivative is improper and cannot be simulated).
 * Throws a RangeError naming the offending parameter (`kp`, `ki`, `kd` or `tf`).
 */
export function assertValidPid(pid: PidController): void {
  if (pid === null || typeof pid !== "object" || pid.kind !== "pid") {
    throw new TypeError('controller must be a PID ({ kind: "pid", kp, ki, kd, tf })');
  }
  for (const name of ["kp", "ki", "kd", "tf"] as const) {
    const v = pid[name];
    if (typeof v !== "number" || !Number.isFinite(v)) throw new RangeError(`${name} must be a finite number, got ${String(v)}`);
  }
  if (pid.tf < 0) throw new RangeError(`tf must be ≥ 0 s, got ${pid.tf}`);
  if (pid.kd !== 0 && !(pid.tf > 0)) {
    throw new RangeError(`tf must be > 0 s when kd ≠ 0 (kd = ${pid.kd}); the derivative needs its filter`);
  }
}
