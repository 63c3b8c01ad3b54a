import { latinHypercubeUnit } from "../batch/latin-hypercube.js";
import { assertValidSpace, axisValue, type ParameterSpace } from "../batch/parameter-space.js";
import { createSeededRandom } from "../batch/seeded-random.js";
import { NelderMeadSimplex, type NelderMeadResult } from "./nelder-mead.js";

/** Options of a multi-start Nelder–Mead search over a parameter space. */
export interface NelderMeadSearchOptions {
  /** Number of starts, from a Latin hypercube (default 8). */
  starts?: number;
  /** Seed of the Latin hypercube of starts (createSeededRandom). */
  seed: number;
  /** Most iterations per start (default 200·d). */
  iterations?: number;
  /** Per start: stop when every vertex is within `tolerance` of the best in unit coordinates (default 1e-6) … */
  tolerance?: number;
  /** … and the values span at most valueTolerance (absolute, default 1e-9). */
  valueTolerance?: number;
  /** Initial simplex edge in unit coordinates (default 0.1 = a tenth of each axis). */
  step?: number;
}

/** An ask/tell multi-start Nelder–Mead search; see createNelderMeadSearch. */
export interface NelderMeadSearch {
  /** Candidates to evaluate next, m × d row-major parameter values (m = 0 when done). */
  ask(): Float64Array;
  /** Values of the last ask's candidates, in order (non-finite counts as +Infinity). */
  tell(values: Float64Array): void;
  readonly done: boolean;
  /** Best candidate so far (parameter values), its value and the start it came from; null before any value. */
  readonly best: { x: Float64Array; value: number; start: number } | null;
  readonly evaluations: number;
  /** Per start: its best point (parameter values), value, evaluations, iterations, converged. */
  results(): NelderMeadResult[];
}

/**
 * A multi-start Nelder–Mead search for the minimum of one scalar objective (e.g. one criterion's
 * aggregate over a family) over a parameter space, as an ask/tell object so a job system can
 * evaluate a whole generation at once: each ask() returns the points every unfinished start needs
 * next (d + 1 at the beginning, d after a shrink, else one), concatenated in start order.
 *
 * The simplexes live in unit coordinates w ∈ [0, 1]^d (v = axisValue(axis, w), so a log axis is
 * searched in log v), bounds handled by clamping into the unit box (NelderMeadSimplex). Start s is
 * row s of latinHypercubeUnit(starts, d, createSeededRandom(seed)); its simplex has edges `step`
 * along each axis. Deterministic: the same space, options and told values give the same asks.
 *
 * References: Nelder & Mead 1965 and Lagarias et al. 1998 (see NelderMeadSimplex); McKay, Beckman
 * & Conover 1979 (the starts); multi-start local search: common practice.
 */
export function createNelderMeadSearch(space: ParameterSpace, options: NelderMeadSearchOptions): NelderMeadSearch {
  assertValidSpace(space);
  const d = space.length;
  const starts = options.starts ?? 8;
  if (!Number.isInteger(starts) || starts < 1) throw new RangeError(`starts must be a whole number ≥ 1, got ${String(starts)}`);
  const random = createSeededRandom(options.seed);
  const origins = latinHypercubeUnit(starts, d, random);
  const lower = new Float64Array(d);
  const upper = new Float64Array(d).fill(1);
  const simplexes = Array.from(
    { length: starts },
    (_, s) =>
      new NelderMeadSimplex(origins.subarray(s * d, (s + 1) * d), {
        lower,
        upper,
        step: options.step ?? 0.1,
        maxIterations: options.iterations ?? 200 * d,
        xTolerance: options.tolerance ?? 1e-6,
        fTolerance: options.valueTolerance ?? 1e-9,
      }),
  );
  let asked: number[] | null = null; // points per simplex of the outstanding ask
  const toValues = (w: ArrayLike<number>, out: Float64Array, offset: number) => {
    for (let j = 0; j < d; j++) out[offset + j] = axisValue(space[j], w[j]);
  };
  const search: NelderMeadSearch = {
    ask() {
      if (asked !== null) throw new Error("ask: the previous candidates have not been told yet");
      const lists = simplexes.map((s) => s.ask());
      asked = lists.map((l) => l.length);
      const m = asked.reduce((a, b) => a + b, 0);
      const out = new Float64Array(m * d);
      let row = 0;
      for (const list of lists) for (const w of list) toValues(w, out, d * row++);
      return out;
    },
    tell(values: Float64Array) {
      if (asked === null) throw new Error("tell: call ask() first");
      const m = asked.reduce((a, b) => a + b, 0);
      if (values.length !== m) throw new RangeError(`values: expected ${m} (one per asked candidate), got ${values.length}`);
      let offset = 0;
      asked.forEach((count, s) => {
        if (count > 0) simplexes[s].tell(values.subarray(offset, offset + count));
        offset += count;
      });
      asked = null;
    },
    get done() {
      return simplexes.every((s) => s.done);
    },
    get best() {
      let bestStart = -1;
      let bestValue = Infinity;
      simplexes.forEach((s, i) => {
        const v = s.best.value;
        if (v < bestValue) {
          bestValue = v;
          bestStart = i;
        }
      });
      if (bestStart < 0) return null;
      const x = new Float64Array(d);
      toValues(simplexes[bestStart].best.x, x, 0);
      return { x, value: bestValue, start: bestStart };
    },
    get evaluations() {
      return simplexes.reduce((a, s) => a + s.evaluations, 0);
    },
    results() {
      return simplexes.map((s) => {
        const r = s.result();
        const x = new Float64Array(d);
        toValues(r.x, x, 0);
        return { ...r, x };
      });
    },
  };
  return search;
}

/** Result of multiStartNelderMead. */
export interface MultiStartResult {
  /** Best candidate (parameter values), or null when no start found a finite value. */
  x: Float64Array | null;
  value: number;
  evaluations: number;
  runs: NelderMeadResult[];
}

/**
 * Runs createNelderMeadSearch(space, options) to the end with f evaluated candidate by candidate
 * (f receives the parameter values, one Float64Array per call) and returns the best candidate.
 */
export function multiStartNelderMead(f: (x: Float64Array) => number, space: ParameterSpace, options: NelderMeadSearchOptions): MultiStartResult {
  const search = createNelderMeadSearch(space, options);
  const d = space.length;
  while (!search.done) {
    const candidates = search.ask();
    const m = candidates.length / d;
    const values = new Float64Array(m);
    for (let i = 0; i < m; i++) values[i] = f(candidates.slice(i * d, (i + 1) * d));
    search.tell(values);
  }
  const best = search.best;
  const found = best !== null && Number.isFinite(best.value);
  return { x: found ? best.x : null, value: found ? best.value : NaN, evaluations: search.evaluations, runs: search.results() };
}
