import { discretizeZoh } from "../linear-algebra/discretize-zoh.js";
import { timeGrid } from "../simulation/time-grid.js";
import { DormandPrince } from "../simulation/dormand-prince.js";
import { linearPlantModel } from "./linear-plant-model.js";
import { nonlinearPlantModel } from "./nonlinear-plant-model.js";
import type { NonlinearPlant } from "./nonlinear.js";
import type { Plant } from "./plant.js";

/** Relative tolerance within which θ/dt counts as a whole number of steps. */
const GRID_ALIGNMENT_TOLERANCE = 1e-9;

/**
 * Open-loop unit step response of a plant, y(t) for u(t) = 1 (t ≥ 0), on the grid t_k = k·dt,
 * k = 0…round(horizon/dt).
 *
 * Exact at every grid point (to the accuracy of the matrix exponential): the realisation
 * (A, B, C, D) of num/den is discretised by zero-order hold, which is exact for a step input.
 * The dead time θ delays the input, u(t) = 1 for t ≥ θ; θ need not be a multiple of dt. The first
 * grid point t_{k₀} ≥ θ is reached with a partial step δ = t_{k₀} − θ from x = 0:
 *
 *   y_k = 0 (t_k < θ),   x_{k₀} = Γ(δ),   x_{k+1} = Φ(dt) x_k + Γ(dt),   y_k = C x_k + D.
 *
 * At t = θ exactly, the sample holds the right limit y(θ⁺) = D (the input has just switched on).
 *
 * State-space plants have no dead time. Nonlinear plants: the demand steps from the operating input
 * u_op to u_op + 1 at t = 0 from the initial state and passes the plant's actuator limits — the
 * input is u_op + 1 saturated to [min, max], reached from u_op at the rate limit (a ramp of slope
 * ±rate) — integrated by Dormand–Prince 5(4) with the step split where the ramp ends; y is returned
 * as the change y(t) − y0 from the operating-point output (so all kinds read as a unit step
 * response). A nonlinear model is only meaningful within its actuator's range, so its step
 * respects it; a linear model's step is its transfer characteristic and ignores the limits.
 *
 * horizon: final time [s] > 0; dt: step [s] > 0. Throws a RangeError naming the bad argument.
 * Reference: K. J. Åström and B. Wittenmark, Computer-Controlled Systems, 3rd ed., 1997, §2.3–2.4
 * (zero-order-hold sampling, including a delay that is not a multiple of the step).
 */
export function openLoopStep(plant: Plant, horizon: number, dt: number): { t: Float64Array; y: Float64Array } {
  if (plant.kind === "nonlinear") return nonlinearStep(plant, horizon, dt);
  const tf = linearPlantModel(plant);
  const t = timeGrid(horizon, dt);
  const y = new Float64Array(t.length);
  const { ss } = tf;
  const { n } = ss;

  const q = tf.delay / dt;
  const nearest = Math.round(q);
  const aligned = Math.abs(q - nearest) <= GRID_ALIGNMENT_TOLERANCE * Math.max(1, q);
  const k0 = aligned ? nearest : Math.ceil(q);
  if (k0 >= t.length) return { t, y };

  let x = new Float64Array(n);
  let next = new Float64Array(n);
  if (!aligned && n > 0) x = Float64Array.from(discretizeZoh(ss, k0 * dt - tf.delay).gamma);
  const step = n > 0 ? discretizeZoh(ss, dt) : null;
  for (let k = k0; k < t.length; k++) {
    let out = ss.d;
    for (let i = 0; i < n; i++) out += ss.c[i] * x[i];
    y[k] = out;
    if (step) {
      for (let i = 0; i < n; i++) {
        let acc = step.gamma[i];
        for (let j = 0; j < n; j++) acc += step.phi[i * n + j] * x[j];
        next[i] = acc;
      }
      const swap = x;
      x = next;
      next = swap;
    }
  }
  return { t, y };
}

function nonlinearStep(plant: NonlinearPlant, horizon: number, dt: number): { t: Float64Array; y: Float64Array } {
  const model = nonlinearPlantModel(plant);
  const t = timeGrid(horizon, dt);
  const y = new Float64Array(t.length);
  const x = Float64Array.from(model.initial);
  const uOp = model.operatingInput;
  // The actuator: the demand u_op + 1 saturated to [min, max], reached at the rate limit from u_op.
  const limits = plant.actuator;
  const target = Math.min(Math.max(uOp + 1, limits?.min ?? -Infinity), limits?.max ?? Infinity);
  const rate = limits?.rate ?? Infinity;
  const slope = target === uOp ? 0 : Math.sign(target - uOp) * rate;
  const rampEnd = slope === 0 || rate === Infinity ? 0 : Math.abs(target - uOp) / rate;
  const input = (time: number): number => (time >= rampEnd ? target : uOp + slope * time);
  const solver = new DormandPrince(model.system, model.parameters);
  for (let k = 0; k < t.length; k++) {
    y[k] = model.system.output(t[k], x, model.parameters, input(t[k])) - model.y0;
    if (k + 1 === t.length) break;
    // Split the step where the ramp ends, so each piece has a smooth input.
    let ok = true;
    if (t[k] < rampEnd && rampEnd < t[k + 1]) {
      ok = solver.advance(x, t[k], rampEnd, input(t[k]), slope) && solver.advance(x, rampEnd, t[k + 1], target);
    } else ok = solver.advance(x, t[k], t[k + 1], input(t[k]), t[k] < rampEnd ? slope : 0);
    if (!ok) {
      y.fill(NaN, k + 1);
      break;
    }
  }
  return { t, y };
}
