/** Band of the response window: y and u within this fraction of their excursion from the final value count as settled. */
const SETTLED_FRACTION = 0.02;
/** The window shows this many times the settled time, so the approach to the final value stays visible. */
const WINDOW_MARGIN = 1.5;

/**
 * End of the time window [s] a response plot opens on: WINDOW_MARGIN × the last time at which y or u
 * is outside ±SETTLED_FRACTION of its excursion from its final value (the 2 % band, common practice),
 * at most the horizon t[N−1]. A long horizon chosen for exact costs then does not squeeze the
 * transient into a sliver; the whole horizon stays one double-click away. Returns the horizon when
 * the trace never settles or is empty.
 */
export function responseWindowEnd(t: readonly number[], y: readonly number[], u: readonly number[]): number {
  const n = t.length;
  if (n < 2) return t[n - 1] ?? 0;
  const horizon = t[n - 1] as number;
  const lastOutside = (v: readonly number[]): number => {
    const final = v[n - 1] as number;
    let excursion = 0;
    for (let k = 0; k < n; k++) excursion = Math.max(excursion, Math.abs((v[k] as number) - final));
    if (!(excursion > 0) || !Number.isFinite(excursion)) return 0;
    for (let k = n - 1; k >= 0; k--) if (Math.abs((v[k] as number) - final) > SETTLED_FRACTION * excursion) return t[k] as number;
    return 0;
  };
  const settled = Math.max(lastOutside(y), lastOutside(u));
  if (!(settled > 0)) return horizon;
  return Math.min(horizon, settled * WINDOW_MARGIN);
}
