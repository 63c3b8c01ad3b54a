import { latinHypercubeUnit } from "../batch/latin-hypercube.js";
import { assertValidSpace, axisValue, type ParameterSpace } from "../batch/parameter-space.js";
import { createSeededRandom } from "../batch/seeded-random.js";
import { nonDominatedSort } from "../fronts/non-dominated-sort.js";
import { crowdingDistance } from "./crowding-distance.js";
import { CROSSOVER_PROBABILITY, POLYNOMIAL_ETA_M, SBX_ETA_C, polynomialMutation, sbxCrossover } from "./variation-operators.js";

/** Options of an NSGA-II search. */
export interface Nsga2Options {
  /** Population size N (whole number ≥ 4). */
  population: number;
  /** Offspring generations after the initial population (whole number ≥ 0). */
  generations: number;
  /** Seed of every random draw (createSeededRandom). */
  seed: number;
  /** Crossover probability p_c per pair (default 0.9). */
  crossoverProbability?: number;
  /** Per-variable mutation probability p_m (default 1/d). */
  mutationProbability?: number;
  /** SBX distribution index η_c (default 20). */
  etaC?: number;
  /** Polynomial mutation distribution index η_m (default 20). */
  etaM?: number;
}

/** The current non-dominated set: m candidates (parameter values, m × d) and their objectives (m × k). */
export interface Nsga2Front {
  count: number;
  x: Float64Array;
  objectives: Float64Array;
}

/** An ask/tell NSGA-II search; see createNsga2Search. */
export interface Nsga2Search {
  /** The next generation's candidates, N × d row-major parameter values; empty when done. */
  ask(): Float64Array;
  /** Their objective vectors, N × k row-major, every objective minimised; non-finite ranks last. */
  tell(objectives: Float64Array): void;
  readonly done: boolean;
  /** Generations told so far, the initial population counting as 0 (−1 before the first tell). */
  readonly generation: number;
  readonly evaluations: number;
  /** The non-dominated candidates with finite objectives of the current population. */
  front(): Nsga2Front;
}

/**
 * NSGA-II (Deb, Pratap, Agarwal & Meyarivan 2002) as an ask/tell search over a parameter space, so
 * a job system evaluates one generation at a time. k objectives, all minimised (negate a larger-is-
 * better criterion first); k is read from the first tell (objectives.length / N).
 *
 * Generation 0 is a Latin hypercube of N points (McKay et al. 1979). Each later ask breeds N
 * offspring Q_t from the parents P_t: binary tournaments with the crowded-comparison operator
 * (lower rank wins, then larger crowding distance, then the first drawn), SBX crossover with
 * probability p_c = 0.9 and η_c = 20, polynomial mutation with p_m = 1/d and η_m = 20. Its tell
 * sorts R_t = P_t ∪ Q_t into fronts (nonDominatedSort) and fills P_(t+1) front by front, the last
 * front that does not fit by decreasing crowding distance (ties by position in R_t).
 *
 * Variables live in unit coordinates w ∈ [0, 1]^d, mapped by axisValue (a log axis is searched
 * in log v); the operators keep w in the box. Deterministic: the same space, options and told
 * objectives give the same asks.
 *
 * Throws a RangeError naming `population`, `generations`, `seed` or an operator option, and on
 * misuse (ask twice, tell without ask, tell of the wrong length, ask after done) an Error.
 *
 * Reference: K. Deb, A. Pratap, S. Agarwal and T. Meyarivan, "A fast and elitist multiobjective
 * genetic algorithm: NSGA-II", IEEE Trans. Evol. Comput. 6(2), 182–197, 2002.
 */
export function createNsga2Search(space: ParameterSpace, options: Nsga2Options): Nsga2Search {
  assertValidSpace(space);
  const d = space.length;
  const N = options.population;
  if (!Number.isInteger(N) || N < 4) throw new RangeError(`population must be a whole number ≥ 4, got ${String(N)}`);
  const generations = options.generations;
  if (!Number.isInteger(generations) || generations < 0) throw new RangeError(`generations must be a whole number ≥ 0, got ${String(generations)}`);
  const pc = probability(options.crossoverProbability ?? CROSSOVER_PROBABILITY, "crossoverProbability");
  const pm = probability(options.mutationProbability ?? 1 / d, "mutationProbability");
  const etaC = index(options.etaC ?? SBX_ETA_C, "etaC");
  const etaM = index(options.etaM ?? POLYNOMIAL_ETA_M, "etaM");
  const random = createSeededRandom(options.seed);

  let k = 0;
  let generation = -1;
  let evaluations = 0;
  let parents = new Float64Array(0); // N × d unit coordinates
  let parentObjectives = new Float64Array(0); // N × k
  let parentRank = new Int32Array(0);
  let parentCrowding = new Float64Array(0);
  let asked: Float64Array | null = null; // unit coordinates of the outstanding ask

  const toValues = (unit: Float64Array): Float64Array => {
    const out = new Float64Array(unit.length);
    for (let i = 0; i < unit.length; i++) out[i] = axisValue(space[i % d], unit[i]);
    return out;
  };

  const tournament = (): number => {
    const a = Math.floor(random() * N);
    let b = Math.floor(random() * (N - 1));
    if (b >= a) b++;
    if (parentRank[a] !== parentRank[b]) return parentRank[a] < parentRank[b] ? a : b;
    if (parentCrowding[a] !== parentCrowding[b]) return parentCrowding[a] > parentCrowding[b] ? a : b;
    return a;
  };

  const breed = (): Float64Array => {
    const children = new Float64Array(N * d);
    const c1 = new Float64Array(d);
    const c2 = new Float64Array(d);
    for (let i = 0; i < N; i += 2) {
      const a = tournament();
      const b = tournament();
      const pa = parents.subarray(a * d, (a + 1) * d);
      const pb = parents.subarray(b * d, (b + 1) * d);
      if (random() <= pc) sbxCrossover(pa, pb, c1, c2, random, etaC);
      else {
        c1.set(pa);
        c2.set(pb);
      }
      polynomialMutation(c1, pm, random, etaM);
      polynomialMutation(c2, pm, random, etaM);
      children.set(c1, i * d);
      if (i + 1 < N) children.set(c2, (i + 1) * d);
    }
    return children;
  };

  /** Environmental selection of N from `count` rows (unit, objectives): fills the parent arrays. */
  const select = (unit: Float64Array, objectives: Float64Array, count: number): void => {
    const rank = nonDominatedSort(objectives, count, k);
    const fronts: number[][] = [];
    for (let i = 0; i < count; i++) (fronts[rank[i]] ??= []).push(i);
    const chosen: number[] = [];
    const crowding = new Float64Array(count);
    for (const front of fronts) {
      if (front === undefined) continue;
      const finite = front.every((i) => objectives.subarray(i * k, (i + 1) * k).every(Number.isFinite));
      const distance = finite ? crowdingDistance(objectives, k, front) : new Float64Array(front.length);
      front.forEach((i, t) => (crowding[i] = distance[t]));
      if (chosen.length + front.length <= N) chosen.push(...front);
      else {
        const rest = [...front].sort((a, b) => crowding[b] - crowding[a] || a - b);
        chosen.push(...rest.slice(0, N - chosen.length));
      }
      if (chosen.length === N) break;
    }
    const nextUnit = new Float64Array(N * d);
    const nextObjectives = new Float64Array(N * k);
    parentRank = new Int32Array(N);
    parentCrowding = new Float64Array(N);
    chosen.forEach((i, t) => {
      nextUnit.set(unit.subarray(i * d, (i + 1) * d), t * d);
      nextObjectives.set(objectives.subarray(i * k, (i + 1) * k), t * k);
      parentRank[t] = rank[i];
      parentCrowding[t] = crowding[i];
    });
    parents = nextUnit;
    parentObjectives = nextObjectives;
  };

  const search: Nsga2Search = {
    ask() {
      if (asked !== null) throw new Error("ask: the previous generation has not been told yet");
      if (search.done) throw new Error("ask: the search is done; read front()");
      asked = generation < 0 ? latinHypercubeUnit(N, d, random) : breed();
      return toValues(asked);
    },
    tell(objectives: Float64Array) {
      if (asked === null) throw new Error("tell: call ask() first");
      if (generation < 0) {
        if (objectives.length === 0 || objectives.length % N !== 0) {
          throw new RangeError(`objectives: length ${objectives.length} is not a positive multiple of the population ${N}`);
        }
        k = objectives.length / N;
      } else if (objectives.length !== N * k) throw new RangeError(`objectives: expected ${N * k} (N × k), got ${objectives.length}`);
      evaluations += N;
      if (generation < 0) select(asked, Float64Array.from(objectives), N);
      else {
        const unit = new Float64Array(2 * N * d);
        unit.set(parents);
        unit.set(asked, N * d);
        const all = new Float64Array(2 * N * k);
        all.set(parentObjectives);
        all.set(objectives, N * k);
        select(unit, all, 2 * N);
      }
      asked = null;
      generation++;
    },
    get done() {
      return generation >= generations;
    },
    get generation() {
      return generation;
    },
    get evaluations() {
      return evaluations;
    },
    front() {
      const rows: number[] = [];
      for (let i = 0; i < parentRank.length; i++) {
        if (parentRank[i] === 0 && parentObjectives.subarray(i * k, (i + 1) * k).every(Number.isFinite)) rows.push(i);
      }
      const x = new Float64Array(rows.length * d);
      const objectives = new Float64Array(rows.length * k);
      rows.forEach((i, t) => {
        x.set(toValues(parents.subarray(i * d, (i + 1) * d)), t * d);
        objectives.set(parentObjectives.subarray(i * k, (i + 1) * k), t * k);
      });
      return { count: rows.length, x, objectives };
    },
  };
  return search;
}

function probability(p: number, name: string): number {
  if (!(typeof p === "number" && p >= 0 && p <= 1)) throw new RangeError(`${name} must be a number from 0 to 1, got ${String(p)}`);
  return p;
}

function index(eta: number, name: string): number {
  if (!(Number.isFinite(eta) && eta >= 0)) throw new RangeError(`${name} must be a finite number ≥ 0, got ${String(eta)}`);
  return eta;
}
