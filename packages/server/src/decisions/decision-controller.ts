import type { Controller } from "@loopyard/core";

/**
 * Every numeric parameter of a controller by name, as the study names them: kp, ki, kd, tf, b, c,
 * k, tLead, tLag, n, a state-feedback gain as k[i], and sampleTime when it is sampled. Non-finite
 * values are left out (a record holds finite numbers only).
 */
export function controllerParameters(controller: Controller): Record<string, number> {
  const out: Record<string, number> = {};
  for (const [name, value] of Object.entries(controller)) {
    if (typeof value === "number" && Number.isFinite(value)) out[name] = value;
    if (Array.isArray(value)) value.forEach((v, i) => Number.isFinite(v) && (out[`${name}[${i}]`] = v as number));
  }
  return out;
}
