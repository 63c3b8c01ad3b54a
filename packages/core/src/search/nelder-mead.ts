/** Reflection coefficient α of Nelder & Mead (1965) (ρ in Lagarias et al. 1998). */
export const NM_ALPHA = 1;
/** Expansion coefficient γ (χ in Lagarias et al. 1998). */
export const NM_GAMMA = 2;
/** Contraction coefficient ρ (γ in Lagarias et al. 1998), used for outside and inside contraction. */
export const NM_RHO = 0.5;
/** Shrink coefficient σ. */
export const NM_SIGMA = 0.5;

/** Stopping and start options of one simplex. */
export interface SimplexOptions {
  /** Initial edge along each coordinate: one number for all or one per coordinate (default 0.1). */
  step?: number | ArrayLike<number>;
  /** Box bounds; every point asked for is clamped into [lower, upper] coordinate-wise. */
  lower?: ArrayLike<number>;
  upper?: ArrayLike<number>;
  /** Most iterations (reflect/expand/contract/shrink steps), default 200·d. */
  maxIterations?: number;
  /** Most objective evaluations, default Infinity (the iteration limit bounds them). */
  maxEvaluations?: number;
  /** Converged when every vertex lies within xTolerance (max norm) of the best, default 1e-8 … */
  xTolerance?: number;
  /** … and the values span at most fTolerance (absolute), default 1e-12. */
  fTolerance?: number;
}

/** Result of a Nelder–Mead run. */
export interface NelderMeadResult {
  x: Float64Array;
  value: number;
  evaluations: number;
  iterations: number;
  /** true when the tolerances were met, false when a budget ran out. */
  converged: boolean;
}

type Phase = "start" | "reflect" | "expand" | "outside" | "inside" | "shrink" | "done";

/**
 * One Nelder–Mead simplex as an ask/tell state machine: `ask()` gives the points whose values it
 * needs next (all d + 1 vertices at the start, d after a shrink, one otherwise) and `tell(values)`
 * takes them in the same order. A step of the method of Nelder & Mead (1965) in the ordering and
 * acceptance rules of Lagarias et al. (1998, §2), vertices ordered f_1 ≤ … ≤ f_(d+1), x̄ the
 * centroid of the best d:
 *
 *   reflect   x_r = x̄ + α(x̄ − x_(d+1));           accept if f_1 ≤ f_r < f_d
 *   expand    x_e = x̄ + γ(x_r − x̄)   if f_r < f_1;  accept x_e if f_e < f_r, else x_r
 *   outside   x_c = x̄ + ρ(x_r − x̄)   if f_d ≤ f_r < f_(d+1); accept if f_c ≤ f_r
 *   inside    x_cc = x̄ − ρ(x̄ − x_(d+1)) if f_r ≥ f_(d+1); accept if f_cc < f_(d+1)
 *   shrink    v_i = x_1 + σ(x_i − x_1), i = 2…d+1, when a contraction is not accepted
 *
 * with α = 1, γ = 2, ρ = ½, σ = ½. An accepted point enters the order after the vertices of equal
 * value (Lagarias et al. 1998). Bounds are handled by clamping: every point asked for is projected
 * onto the box [lower, upper], so the objective is only ever evaluated inside it (a simplex may
 * flatten against a face; restarts from other points, as multi-start does, cover that).
 * A non-finite value (e.g. an unstable loop) counts as +Infinity.
 *
 * Converged when max_i ‖x_i − x_1‖∞ ≤ xTolerance and f_(d+1) − f_1 ≤ fTolerance — the two tests
 * of Lagarias et al. (1998, §5) as common implementations apply them.
 *
 * References: J. A. Nelder and R. Mead, "A simplex method for function minimization", The Computer
 * Journal 7(4), 308–313, 1965; J. C. Lagarias, J. A. Reeds, M. H. Wright and P. E. Wright,
 * "Convergence properties of the Nelder–Mead simplex method in low dimensions", SIAM J. Optim.
 * 9(1), 112–147, 1998.
 */
export class NelderMeadSimplex {
  readonly d: number;
  private readonly vertices: Float64Array[];
  private readonly values: Float64Array;
  private readonly lower?: ArrayLike<number>;
  private readonly upper?: ArrayLike<number>;
  private readonly maxIterations: number;
  private readonly maxEvaluations: number;
  private readonly xTolerance: number;
  private readonly fTolerance: number;
  private phase: Phase = "start";
  private pending: Float64Array[];
  private readonly centroid: Float64Array;
  private reflected: Float64Array;
  private reflectedValue = Infinity;
  evaluations = 0;
  iterations = 0;
  converged = false;

  constructor(x0: ArrayLike<number>, options: SimplexOptions = {}) {
    const d = x0.length;
    if (d < 1) throw new RangeError("x0 must have at least one coordinate");
    for (let j = 0; j < d; j++) if (!Number.isFinite(x0[j])) throw new RangeError(`x0[${j}] must be finite`);
    this.d = d;
    this.lower = checkBound(options.lower, d, "lower");
    this.upper = checkBound(options.upper, d, "upper");
    for (let j = 0; j < d; j++) {
      if (this.lower && this.upper && this.lower[j] > this.upper[j]) throw new RangeError(`upper[${j}] must be ≥ lower[${j}]`);
    }
    this.maxIterations = checkBudget(options.maxIterations ?? 200 * d, "maxIterations");
    this.maxEvaluations = checkBudget(options.maxEvaluations ?? Infinity, "maxEvaluations");
    this.xTolerance = checkTolerance(options.xTolerance ?? 1e-8, "xTolerance");
    this.fTolerance = checkTolerance(options.fTolerance ?? 1e-12, "fTolerance");
    const step = options.step ?? 0.1;
    const start = this.clamp(Float64Array.from(x0));
    this.vertices = [start];
    for (let j = 0; j < d; j++) {
      const h = typeof step === "number" ? step : step[j];
      if (!(Number.isFinite(h) && h !== 0)) throw new RangeError(`step${typeof step === "number" ? "" : `[${j}]`} must be finite and non-zero`);
      const v = Float64Array.from(start);
      v[j] += h;
      this.clamp(v);
      if (v[j] === start[j]) {
        v[j] = start[j] - h; // at a bound: step the other way
        this.clamp(v);
      }
      this.vertices.push(v);
    }
    this.values = new Float64Array(d + 1).fill(Infinity);
    this.centroid = new Float64Array(d);
    this.reflected = new Float64Array(d);
    this.pending = this.vertices;
  }

  /** true when converged or out of budget; ask() then returns no points. */
  get done(): boolean {
    return this.phase === "done";
  }

  /** Best vertex so far and its value (+Infinity before the first values arrive). */
  get best(): { x: Float64Array; value: number } {
    return { x: Float64Array.from(this.vertices[0]), value: this.values[0] };
  }

  /** The points to evaluate next (copies), in order; empty when done. */
  ask(): Float64Array[] {
    return this.phase === "done" ? [] : this.pending.map((p) => Float64Array.from(p));
  }

  /** The values of the points of the last ask(), in order. */
  tell(values: ArrayLike<number>): void {
    if (this.phase === "done") throw new Error("tell: this simplex is done; ask() has no points");
    if (values.length !== this.pending.length) throw new RangeError(`values: expected ${this.pending.length}, got ${values.length}`);
    this.evaluations += values.length;
    const v = (i: number) => (Number.isFinite(values[i]) ? values[i] : Infinity);
    const d = this.d;
    switch (this.phase) {
      case "start":
        for (let i = 0; i <= d; i++) this.values[i] = v(i);
        this.order(0);
        return this.next(false);
      case "reflect": {
        const fr = v(0);
        this.reflectedValue = fr;
        const f = this.values;
        if (fr >= f[0] && fr < f[d - 1]) return this.accept(this.reflected, fr);
        if (fr < f[0]) return this.propose("expand", this.along(this.reflected, NM_GAMMA));
        if (fr < f[d]) return this.propose("outside", this.along(this.reflected, NM_RHO));
        return this.propose("inside", this.along(this.vertices[d], NM_RHO));
      }
      case "expand": {
        const fe = v(0);
        return fe < this.reflectedValue ? this.accept(this.pending[0], fe) : this.accept(this.reflected, this.reflectedValue);
      }
      case "outside": {
        const fc = v(0);
        return fc <= this.reflectedValue ? this.accept(this.pending[0], fc) : this.shrink();
      }
      case "inside": {
        const fcc = v(0);
        return fcc < this.values[d] ? this.accept(this.pending[0], fcc) : this.shrink();
      }
      case "shrink":
        for (let i = 1; i <= d; i++) {
          this.vertices[i] = this.pending[i - 1];
          this.values[i] = v(i - 1);
        }
        this.order(1);
        return this.next(true);
    }
  }

  /** The run's result so far. */
  result(): NelderMeadResult {
    const { x, value } = this.best;
    return { x, value, evaluations: this.evaluations, iterations: this.iterations, converged: this.converged };
  }

  private accept(point: Float64Array, value: number): void {
    this.vertices[this.d] = Float64Array.from(point);
    this.values[this.d] = value;
    this.order(this.d);
    this.next(true);
  }

  private shrink(): void {
    const best = this.vertices[0];
    const points: Float64Array[] = [];
    for (let i = 1; i <= this.d; i++) {
      const p = new Float64Array(this.d);
      for (let j = 0; j < this.d; j++) p[j] = best[j] + NM_SIGMA * (this.vertices[i][j] - best[j]);
      points.push(this.clamp(p));
    }
    this.phase = "shrink";
    this.pending = points;
  }

  /** x̄ + c·(p − x̄), clamped. */
  private along(p: Float64Array, c: number): Float64Array {
    const out = new Float64Array(this.d);
    for (let j = 0; j < this.d; j++) out[j] = this.centroid[j] + c * (p[j] - this.centroid[j]);
    return this.clamp(out);
  }

  private propose(phase: Phase, point: Float64Array): void {
    this.phase = phase;
    this.pending = [point];
  }

  /** After an iteration (counted when `stepped`): test convergence and budgets, then reflect. */
  private next(stepped: boolean): void {
    if (stepped) this.iterations++;
    const d = this.d;
    let spread = 0;
    for (let i = 1; i <= d; i++) {
      for (let j = 0; j < d; j++) spread = Math.max(spread, Math.abs(this.vertices[i][j] - this.vertices[0][j]));
    }
    const fSpread = this.values[d] - this.values[0];
    if (spread <= this.xTolerance && (fSpread <= this.fTolerance || this.values[0] === this.values[d])) {
      this.converged = true;
      this.phase = "done";
      this.pending = [];
      return;
    }
    if (this.iterations >= this.maxIterations || this.evaluations + 1 > this.maxEvaluations) {
      this.phase = "done";
      this.pending = [];
      return;
    }
    this.centroid.fill(0);
    for (let i = 0; i < d; i++) for (let j = 0; j < d; j++) this.centroid[j] += this.vertices[i][j] / d;
    this.reflected = this.along(this.vertices[d], -NM_ALPHA);
    this.propose("reflect", this.reflected);
  }

  /** Restores f_1 ≤ … ≤ f_(d+1) from position `from` on, moving later entries after equal values (stable). */
  private order(from: number): void {
    const d = this.d;
    for (let i = Math.max(1, from); i <= d; i++) {
      const x = this.vertices[i];
      const f = this.values[i];
      let k = i - 1;
      while (k >= 0 && this.values[k] > f) {
        this.vertices[k + 1] = this.vertices[k];
        this.values[k + 1] = this.values[k];
        k--;
      }
      this.vertices[k + 1] = x;
      this.values[k + 1] = f;
    }
  }

  private clamp(p: Float64Array): Float64Array {
    for (let j = 0; j < p.length; j++) {
      if (this.lower && p[j] < this.lower[j]) p[j] = this.lower[j];
      if (this.upper && p[j] > this.upper[j]) p[j] = this.upper[j];
    }
    return p;
  }
}

/**
 * Minimises f from x0 by the Nelder–Mead simplex method (see NelderMeadSimplex for the steps,
 * coefficients α = 1, γ = 2, ρ = ½, σ = ½, the clamping of bounds and the stopping tests).
 * The initial simplex is x0 and x0 + step·e_j, j = 1…d. f receives a fresh Float64Array.
 * Returns the best point, its value, the evaluation and iteration counts and whether the
 * tolerances were met. Throws a RangeError naming a bad x0, step, bound, budget or tolerance.
 */
export function nelderMead(f: (x: Float64Array) => number, x0: ArrayLike<number>, options: SimplexOptions = {}): NelderMeadResult {
  const simplex = new NelderMeadSimplex(x0, options);
  while (!simplex.done) {
    const points = simplex.ask();
    simplex.tell(points.map((p) => f(p)));
  }
  return simplex.result();
}

function checkBound(bound: ArrayLike<number> | undefined, d: number, name: string): ArrayLike<number> | undefined {
  if (bound === undefined) return undefined;
  if (bound.length !== d) throw new RangeError(`${name}: give one bound per coordinate (${d}), got ${bound.length}`);
  for (let j = 0; j < d; j++) if (Number.isNaN(bound[j])) throw new RangeError(`${name}[${j}] must be a number`);
  return bound;
}

function checkBudget(value: number, name: string): number {
  if (!(value === Infinity || (Number.isInteger(value) && value >= 1))) throw new RangeError(`${name} must be a whole number ≥ 1, got ${String(value)}`);
  return value;
}

function checkTolerance(value: number, name: string): number {
  if (!(Number.isFinite(value) && value >= 0)) throw new RangeError(`${name} must be a finite number ≥ 0, got ${String(value)}`);
  return value;
}
