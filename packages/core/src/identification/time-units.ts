/** Units of a step test's time column and the factor that turns them into seconds. */
export const TIME_UNITS = { s: 1, ms: 1e-3, min: 60, h: 3600 } as const;
export type TimeUnit = keyof typeof TIME_UNITS;
