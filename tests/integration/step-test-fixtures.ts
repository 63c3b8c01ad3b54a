/**
 * A step test of an Ember heater plate as a CSV, made in the test: an FOPDT response
 * y = 21 + k·Δu·(1 − e^(−(s − θ)/τ)) after a heater step of Δu at t = 20 s (closed form, Seborg,
 * Edgar, Mellichamp & Doyle, Process Dynamics and Control, 4th ed., 2016, §5.2), sampled every
 * 0.5 s, with seeded uniform noise of ±`noise` °C (a linear congruential generator, Park & Miller 1988).
 */
export const EMBER_STEP = { k: 0.6, tau: 30, theta: 4, du: 20 } as const;

export function emberStepCsv(options: { noise?: number; seed?: number; rows?: number; delimiter?: string } = {}): string {
  const { k, tau, theta, du } = EMBER_STEP;
  const noise = options.noise ?? 0.02;
  const rows = options.rows ?? 401;
  const sep = options.delimiter ?? ",";
  let state = options.seed ?? 7;
  const uniform = () => (state = (state * 16807) % 2147483647) / 2147483647;
  const lines = [["time_s", "heater_pct", "plate_degC"].join(sep)];
  for (let i = 0; i < rows; i++) {
    const t = i * 0.5;
    const s = t - 20;
    const y = 21 + (s > theta ? k * du * (1 - Math.exp(-(s - theta) / tau)) : 0) + noise * (2 * uniform() - 1);
    lines.push([t, t >= 20 ? 30 + du : 30, y.toFixed(5)].join(sep));
  }
  return `${lines.join("\n")}\n`;
}

/** The settings that pick the heater step's columns by name. */
export const EMBER_SETTINGS = {
  columns: { time: "time_s", input: "heater_pct", output: "plate_degC" },
  units: { time: "s", input: "%", output: "°C" },
  offset: "initial",
} as const;
