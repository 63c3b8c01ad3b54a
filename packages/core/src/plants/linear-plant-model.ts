import type { SisoStateSpace } from "../linear-algebra/siso-state-space.js";
import { normalizeTransferFunction } from "./normalize-transfer-function.js";
import { identifiedTransferFunction } from "./identified.js";
import type { LinearPlant } from "./plant.js";
import { stateSpaceToTransferFunction } from "./state-space-to-transfer-function.js";
import { transferFunctionToStateSpace } from "./transfer-function-to-state-space.js";

/** A linear plant in both forms: realisation (states x) and rational function, plus dead time. */
export interface LinearPlantModel {
  ss: SisoStateSpace;
  /** Numerator and monic denominator of the rational part, descending powers. */
  num: number[];
  den: number[];
  /** Dead time θ [s] (0 for state-space plants). */
  delay: number;
}

const cache = new WeakMap<object, LinearPlantModel>();

/**
 * Both forms of a linear plant. Transfer functions: normalised (normalizeTransferFunction) and
 * realised in controllable canonical form (transferFunctionToStateSpace) — these are the states a
 * state-feedback controller sees. State space: (A, B, C, D) as given, its transfer function by
 * stateSpaceToTransferFunction. An identified plant is its fitted transfer function with dead time. Results are cached per plant object (plants are treated as immutable).
 * Throws a RangeError naming the bad field.
 */
export function linearPlantModel(plant: LinearPlant): LinearPlantModel {
  const hit = cache.get(plant);
  if (hit) return hit;
  let model: LinearPlantModel;
  if (plant.kind === "transfer-function" || plant.kind === "identified") {
    const tf = normalizeTransferFunction(plant.kind === "identified" ? identifiedTransferFunction(plant) : plant);
    model = { ss: transferFunctionToStateSpace(tf), num: tf.num, den: tf.den, delay: tf.delay };
  } else if (plant.kind === "state-space") {
    const ss = stateSpaceFromMatrices(plant.A, plant.B, plant.C, plant.D);
    const tf = stateSpaceToTransferFunction(ss);
    let first = 0;
    while (first < tf.num.length - 1 && tf.num[first] === 0) first++;
    model = { ss, num: tf.num.slice(first), den: tf.den, delay: 0 };
  } else {
    throw new TypeError(`plant.kind must be "transfer-function" or "state-space" here, got ${String((plant as { kind?: unknown }).kind)}`);
  }
  cache.set(plant, model);
  return model;
}

function stateSpaceFromMatrices(A: number[][], B: number[][], C: number[][], D: number[][] | undefined): SisoStateSpace {
  if (!Array.isArray(A) || A.length === 0) throw new RangeError("plant.A: give a square matrix with at least one row");
  const n = A.length;
  const a = new Float64Array(n * n);
  const b = new Float64Array(n);
  const c = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    if (!Array.isArray(A[i]) || A[i].length !== n) throw new RangeError(`plant.A: must be ${n}×${n}; row ${i} is not`);
    for (let j = 0; j < n; j++) a[i * n + j] = finite(A[i][j], `plant.A.${i}.${j}`);
    if (!Array.isArray(B) || B.length !== n || !Array.isArray(B[i]) || B[i].length !== 1) throw new RangeError(`plant.B: must be ${n}×1`);
    b[i] = finite(B[i][0], `plant.B.${i}.0`);
  }
  if (!Array.isArray(C) || C.length !== 1 || !Array.isArray(C[0]) || C[0].length !== n) throw new RangeError(`plant.C: must be 1×${n}`);
  for (let j = 0; j < n; j++) c[j] = finite(C[0][j], `plant.C.0.${j}`);
  const dm = D ?? [[0]];
  if (!Array.isArray(dm) || dm.length !== 1 || !Array.isArray(dm[0]) || dm[0].length !== 1) throw new RangeError("plant.D: must be 1×1");
  return { n, a, b, c, d: finite(dm[0][0], "plant.D.0.0") };
}

function finite(v: unknown, field: string): number {
  if (typeof v !== "number" || !Number.isFinite(v)) throw new RangeError(`${field} must be a finite number, got ${String(v)}`);
  return v;
}
