import { createRequire } from "node:module";

/**
 * The odex package (E. Hairer and G. Wanner's ODEX, Gragg–Bulirsch–Stoer extrapolation, ported to
 * JavaScript), loaded through require so that TypeScript does not type-check its shipped .ts source.
 * Used only as an independent reference integrator in tests.
 */
export interface OdexSolver {
  absoluteTolerance: number;
  relativeTolerance: number;
  solve(f: (t: number, y: number[]) => number[], t0: number, y0: number[], t1: number): { y: number[] };
}

const odex = createRequire(import.meta.url)("odex") as { Solver: new (n: number) => OdexSolver };

/** A fresh odex solver for n equations. */
export function createOdexSolver(n: number): OdexSolver {
  return new odex.Solver(n);
}
