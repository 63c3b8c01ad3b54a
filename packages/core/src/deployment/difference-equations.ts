import type { DiscretePid } from "./discrete-pid.js";

/** Significant digits printed: enough to round-trip a double. */
const DIGITS = 17;

/**
 * The difference equations of a discrete PID as text lines with its coefficients written out (17
 * significant digits, so a reader can paste them into firmware and get the same doubles back), in
 * the order stepDiscretePid evaluates them. Limits that are absent are left out.
 */
export function differenceEquations(pid: DiscretePid): string[] {
  const c = pid.coefficients;
  const n = (v: number) => Number(v.toPrecision(DIGITS)).toString();
  const lines = [
    `h = ${n(pid.sampleTime)} s (${pid.method === "tustin" ? "Tustin" : "backward Euler"})`,
    "e[k] = r[k] − y[k]",
    `P[k] = ${n(c.pr)}·r[k] − ${n(c.py)}·y[k]`,
    `I[k] = Ī[k] + ${n(c.bi1)}·e[k] + ${n(c.bi0)}·e[k−1]`,
    `D[k] = ${n(c.ad)}·D[k−1] + ${n(c.dr)}·(r[k] − r[k−1]) − ${n(c.dy)}·(y[k] − y[k−1])`,
    "v[k] = P[k] + I[k] + D[k]",
  ];
  const { min, max, step } = pid.limits;
  if (Number.isFinite(min) || Number.isFinite(max)) lines.push(`u[k] = min(max(v[k], ${n(min)}), ${n(max)})`);
  else lines.push("u[k] = v[k]");
  if (Number.isFinite(step)) lines.push(`u[k] = min(max(u[k], u[k−1] − ${n(step)}), u[k−1] + ${n(step)})`);
  lines.push(`Ī[k+1] = I[k] + ${n(c.at)}·(u[k] − v[k])${Number.isFinite(pid.trackingTime) ? `   (Tt = ${n(pid.trackingTime)} s)` : ""}`);
  return lines;
}
