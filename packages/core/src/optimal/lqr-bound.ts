import { Matrix } from "ml-matrix";
import type { Complex } from "../linear-algebra/complex.js";
import type { Plant } from "../plants/plant.js";
import type { ExactCostScenario } from "./exact-quadratic-costs.js";
import { matrixRows } from "./matrix-argument.js";
import { finiteHorizonRiccati } from "./finite-horizon-riccati.js";
import { careMatrices } from "./solve-care.js";
import { riccatiFlow } from "./solve-rde.js";
import { setpointDeviationProblem } from "./setpoint-deviation-problem.js";

/** Options of lqrBound: the weights of J = ∫(q·e² + r·(u − u∞)²)dt and the horizon. */
export interface LqrBoundOptions {
  /** Weight of e², finite, > 0 (default 1). */
  q?: number;
  /** Weight of (u − u∞)², finite, > 0 (default 1). */
  r?: number;
  /** "infinite" (default; the CARE) or a finite horizon T [s] (the Riccati differential equation over [0, T]). */
  horizon?: "infinite" | number;
}

/** The bound: the least J any controller can reach, with the optimal (LQR) gain behind it. */
export type LqrBound =
  | {
      ok: true;
      /** The least cost: x̃₀ᵀ P x̃₀ + q·Δr²·min(θ, T). */
      cost: number;
      /** The part q·Δr²·min(θ, T) of cost spent while the dead time θ hides every input. */
      delayCost: number;
      /** P of the deviation problem (CARE solution, or P(0) of the RDE). */
      P: number[][];
      /** Optimal gain in ũ = −K x̃ (1×n; at t = 0 for a finite horizon). */
      K: number[][];
      /** Eigenvalues of A − BK for the infinite horizon; [] for a finite one. */
      poles: Complex[];
      /** Initial deviation x̃(0) = −x∞ of the plant's states. */
      x0: number[];
      uInfinity: number;
    }
  | { ok: false; reason: string };

/**
 * The least value of the quadratic criterion J = ∫₀^T (q·e² + r·(u − u∞)²) dt that ANY controller
 * can reach on a linear plant for a setpoint step (and/or a load step at t = 0), T ≤ ∞: the bound
 * drawn beside a front. No candidate of any structure can score below it.
 *
 * Posed in deviation coordinates from the new steady state (setpointDeviationProblem): the plant at
 * rest is the initial deviation x̃(0) = −x∞, and the minimum over all inputs of
 * ∫(x̃ᵀQx̃ + 2x̃ᵀNũ + Rũ²)dt with Q = q·CᵀC, N = q·CᵀD, R = r + q·D² (Q = q·CᵀC, R = r for a
 * strictly proper plant) is x̃₀ᵀ P x̃₀, P the stabilising solution of the CARE (solveCare) for
 * T = ∞ or P(0) of the Riccati differential equation over [0, T] with P(T) = 0 for a finite T —
 * in closed form from the CARE solution (finiteHorizonRiccati: any T, any weight ratio) when the
 * CARE has a stabilising solution, else by the stepped flow of solveRde. Any controller produces some input u(t), so its J is at least this minimum — for a
 * feedback law, a sampled, saturated or noise-driven one alike (limits only shrink the set of inputs).
 * The comparison is exact for candidates whose effort is measured from the same u∞ — every loop
 * without steady-state error; a loop with an offset has infinite J over an infinite horizon.
 *
 * Dead time θ: the output cannot move before t = θ whatever the input, so e = Δr on [0, θ) and
 * that part costs q·Δr²·θ for every controller; after it, the delay-free plant sees the input
 * shifted by θ. Hence J ≥ q·Δr²·θ + (delay-free bound over T − θ) — still a true lower bound,
 * though not attained (an optimal input would need to know the future; the bound ignores causality
 * through the delay).
 * Returns `{ ok: false, reason }` when the plant has a zero at s = 0, (A, B) is not stabilisable,
 * (C, A) not detectable (infinite horizon) or the solve fails. Throws a RangeError naming the bad
 * option or scenario field; a TypeError for a nonlinear plant.
 * References: R. E. Kalman 1960; B. D. O. Anderson and J. B. Moore, Optimal Control: Linear
 * Quadratic Methods, Prentice Hall, 1990, §2.3, §3.3, §3.4; the servo problem in deviation
 * coordinates: H. Kwakernaak and R. Sivan, Linear Optimal Control Systems, Wiley, 1972, §3.7.
 */
export function lqrBound(plant: Plant, scenario: ExactCostScenario, options: LqrBoundOptions = {}): LqrBound {
  if (plant.kind === "nonlinear") throw new TypeError('plant.kind must be "transfer-function" or "state-space"; the bound needs a linear plant');
  const q = positive("q", options.q);
  const r = positive("r", options.r);
  const horizon = options.horizon ?? "infinite";
  if (horizon !== "infinite" && (typeof horizon !== "number" || !(horizon > 0) || !Number.isFinite(horizon))) {
    throw new RangeError(`horizon must be "infinite" or a finite time > 0 s, got ${String(horizon)}`);
  }
  const problem = setpointDeviationProblem(plant, scenario, q, r);
  if ("ok" in problem) return problem;
  const { b, aBar, qBar, rBar, nBar, x0, setpoint, delay, uInfinity } = problem;
  const hidden = horizon === "infinite" ? delay : Math.min(delay, horizon);
  const delayCost = q * setpoint * setpoint * hidden;
  const x0Rows = x0.to1DArray();
  const n = b.rows;
  if (horizon !== "infinite" && horizon <= delay) {
    return { ok: true, cost: delayCost, delayCost, P: matrixRows(new Matrix(n, n)), K: matrixRows(new Matrix(1, n)), poles: [], x0: x0Rows, uInfinity };
  }
  const rMatrix = new Matrix([[rBar]]);
  let p: Matrix;
  let poles: Complex[] = [];
  if (horizon === "infinite") {
    const care = careMatrices(aBar, b, qBar, rMatrix);
    if (!care.ok) return care;
    p = new Matrix(care.P);
    poles = care.poles;
  } else {
    const g = Matrix.mul(b.mmul(b.transpose()), 1 / rBar);
    const care = careMatrices(aBar, b, qBar, rMatrix);
    const closedForm = care.ok ? finiteHorizonRiccati(g, new Matrix(care.P), Matrix.sub(aBar, g.mmul(new Matrix(care.P))), horizon - delay) : null;
    if (closedForm) p = closedForm;
    else {
      const flow = riccatiFlow(aBar, g, qBar, new Matrix(n, n), horizon - delay);
      if (!flow) return { ok: false, reason: "the Riccati differential equation escaped to infinity or needed too many steps" };
      p = flow.p;
    }
  }
  const gain = Matrix.mul(b.transpose().mmul(p).add(nBar.transpose()), 1 / rBar);
  const cost = x0.transpose().mmul(p).mmul(x0).get(0, 0) + delayCost;
  return { ok: true, cost, delayCost, P: matrixRows(p), K: matrixRows(gain), poles, x0: x0Rows, uInfinity };
}

function positive(name: string, value: number | undefined): number {
  if (value === undefined) return 1;
  if (typeof value !== "number" || !Number.isFinite(value) || !(value > 0)) throw new RangeError(`${name} must be a finite number > 0, got ${String(value)}`);
  return value;
}
