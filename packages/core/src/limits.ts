/**
 * Limits and constants that the web app, the server and the CLI all read. One place, so that a form
 * never accepts what the server refuses (or the other way round).
 */

/**
 * Largest number of candidates one sweep may hold (grid product, design count or search budget).
 * The server may set a lower per-workspace limit (LOOPYARD_MAX_CANDIDATES, default this).
 */
export const MAX_SWEEP_CANDIDATES = 1_000_000;

/** Most plant variants in one sweep's family (web, server and CLI alike). */
export const MAX_FAMILY_VARIANTS = 20;

/** Largest number of time samples one simulation may take (horizon / dt). */
export const MAX_SIMULATION_SAMPLES = 200_000;

/**
 * Largest number of samples of one re-simulation of a deployment sheet: the sampled loop runs on a
 * grid no coarser than the sample time (every sample instant on it), so a 400 s heater scenario at
 * 1 kHz takes 400,001 samples (about 16 MB per trace of five signals; a linear plant's step is a few
 * multiplications).
 */
export const MAX_SHEET_SAMPLES = 1_000_000;

/**
 * Most state-feedback gains k[0] … k[m−1]: one per plant state, and no plant kind has more than
 * ten states (MAX_PLANT_ORDER of a transfer function, MAX_NONLINEAR_STATES, a state-space model's
 * matrix size). A sweep naming k[i] with i ≥ this is refused before any name list is built.
 */
export const MAX_STATE_FEEDBACK_GAINS = 10;

/** Most parameters one sweep may range or fix (the largest structure has 11 names plus sampleTime). */
export const MAX_SWEEP_PARAMETERS = 16;

/** Longest name of a sweep, a family, a variant label or a workspace [characters]. */
export const MAX_TITLE_LENGTH = 120;

/** Default most sweeps queued or running at once in one workspace (LOOPYARD_MAX_CONCURRENT_SWEEPS). */
export const DEFAULT_MAX_CONCURRENT_SWEEPS = 3;

/** Shortest password a new account may have (the server's better-auth setting and the sign-up form). */
export const MIN_PASSWORD_LENGTH = 10;

/** Most starts of a Nelder–Mead search design. */
export const MAX_SEARCH_STARTS = 1000;
/** Most iterations per start of a Nelder–Mead search design. */
export const MAX_SEARCH_ITERATIONS = 100_000;
/** Largest population of an NSGA-II search design. */
export const MAX_SEARCH_POPULATION = 10_000;
/** Most generations of an NSGA-II search design. */
export const MAX_SEARCH_GENERATIONS = 10_000;
