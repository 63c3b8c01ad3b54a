import type { ApiClient } from "./api-client.js";

/** A transfer-function plant k/((s+1)(s+2)) = k/(s² + 3s + 2), one variant of a small family. */
export function lagPlant(name: string, gain: number) {
  return { name, unitsNote: "u: heater power fraction; y: temperature rise", model: { kind: "transfer-function", num: [gain], den: [1, 3, 2], delay: 0 } };
}

/** Creates the family's plants (gains 1, 1.4 and 0.7) and returns their first revisions' ids. */
export async function lagFamily(client: ApiClient, slug: string, label: string): Promise<string[]> {
  const ids: string[] = [];
  for (const [i, gain] of [1, 1.4, 0.7].entries()) {
    const created = await client.post(`/api/workspaces/${slug}/plants`, lagPlant(`${label} lag ${i + 1}`, gain));
    if (created.status !== 201) throw new Error(`creating a plant failed: ${created.status} ${JSON.stringify(created.body)}`);
    ids.push(created.body.revision.id as string);
  }
  return ids;
}

/**
 * A small comparison on the family: a filtered PID over kp ∈ [0.2, 10], ki ∈ [0.1, 5] (log axes)
 * and kd ∈ [0, 2], 12 s at dt = 0.01 s, worst case; IAE, ITAE, ISE and a quadratic cost compete,
 * overshoot, peak |u| and Ms judge, with Ms ≤ 1.8 on every variant.
 */
export function smallComparison(name: string, revisions: readonly string[], extra: Record<string, unknown> = {}) {
  return {
    name,
    family: { variants: revisions.map((plantRevisionId, i) => ({ plantRevisionId, label: `gain ${["1", "1.4", "0.7"][i] ?? i}` })) },
    structure: "pid",
    ranges: { kp: { min: 0.2, max: 10, scale: "log" }, ki: { min: 0.1, max: 5, scale: "log" }, kd: { min: 0, max: 2 } },
    filter: { mode: "ratio", n: 10 },
    scenario: { kind: "setpoint-step", horizon: 12, dt: 0.01 },
    aggregate: { kind: "worst" },
    contenders: ["iae", "itae", "ise", { criterion: "quadratic", q: 1, r: 0.05, label: "J(r=0.05)" }],
    judges: ["overshoot", "upeak", "ms"],
    constraints: { ms: { max: 1.8 } },
    budget: { prescan: 64, starts: 2, evaluations: 60, stability: false },
    seed: 7,
    ...extra,
  };
}

/** Polls a comparison until it has stopped (finished, failed, cancelled) or the timeout passes. */
export async function waitForComparison(client: ApiClient, slug: string, id: string, timeoutMs = 120_000) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const response = await client.get(`/api/workspaces/${slug}/comparisons/${id}`);
    if (response.status !== 200) throw new Error(`reading comparison ${id} answered ${response.status}`);
    if (!["queued", "running"].includes(response.body.status as string)) return response.body;
    if (Date.now() > deadline) throw new Error(`comparison ${id} still ${response.body.status}: ${JSON.stringify(response.body.progress)}`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}
