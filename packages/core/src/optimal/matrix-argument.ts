import { Matrix } from "ml-matrix";

/**
 * Reads a dense real matrix given as rows of numbers (`[[1, 2], [3, 4]]`) into an ml-matrix
 * `Matrix`, checking its shape. `rows`/`columns`: the required size, or undefined for any.
 * Throws a RangeError naming `name` when it is not a non-empty rectangular array of finite numbers
 * or has the wrong size.
 */
export function matrixArgument(value: readonly (readonly number[])[], name: string, rows?: number, columns?: number): Matrix {
  if (!Array.isArray(value) || value.length === 0) throw new RangeError(`${name} must be a matrix given as a non-empty list of rows`);
  const width = Array.isArray(value[0]) ? value[0].length : -1;
  if (!(width > 0)) throw new RangeError(`${name} must be a matrix given as a non-empty list of rows`);
  value.forEach((row, i) => {
    if (!Array.isArray(row) || row.length !== width) throw new RangeError(`${name}: every row must have ${width} entries; row ${i} does not`);
    row.forEach((v, j) => {
      if (typeof v !== "number" || !Number.isFinite(v)) throw new RangeError(`${name}[${i}][${j}] must be a finite number, got ${String(v)}`);
    });
  });
  if (rows !== undefined && value.length !== rows) throw new RangeError(`${name} must have ${rows} row${rows === 1 ? "" : "s"}, got ${value.length}`);
  if (columns !== undefined && width !== columns) throw new RangeError(`${name} must have ${columns} column${columns === 1 ? "" : "s"}, got ${width}`);
  return new Matrix(value.map((row) => Array.from(row)));
}

/** Throws a RangeError naming `name` unless the square matrix m is symmetric to 1e-10 relative. */
export function assertSymmetric(m: Matrix, name: string): void {
  const n = m.rows;
  if (m.columns !== n) throw new RangeError(`${name} must be square, got ${n}×${m.columns}`);
  const scale = Math.max(1e-300, m.max(), -m.min());
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      if (Math.abs(m.get(i, j) - m.get(j, i)) > SYMMETRY_TOLERANCE * scale) {
        throw new RangeError(`${name} must be symmetric; entries [${i}][${j}] and [${j}][${i}] differ`);
      }
    }
  }
}

/**
 * The arguments every Riccati solver shares: A square (n × n), B with n rows, Q (n × n) and R (m × m, m
 * the columns of B), Q and R symmetric. Definiteness is left to the caller (the solvers ask different things of Q).
 */
export function riccatiArguments(
  A: readonly (readonly number[])[],
  B: readonly (readonly number[])[],
  Q: readonly (readonly number[])[],
  R: readonly (readonly number[])[],
): { n: number; a: Matrix; b: Matrix; q: Matrix; r: Matrix } {
  const a = matrixArgument(A, "A");
  const n = a.rows;
  if (a.columns !== n) throw new RangeError(`A must be square, got ${n}×${a.columns}`);
  const b = matrixArgument(B, "B", n);
  const q = matrixArgument(Q, "Q", n, n);
  const r = matrixArgument(R, "R", b.columns, b.columns);
  assertSymmetric(q, "Q");
  assertSymmetric(r, "R");
  return { n, a, b, q, r };
}

/** Relative tolerance of the symmetry check (a little above the rounding of a typed matrix). */
const SYMMETRY_TOLERANCE = 1e-10;

/** ½(M + Mᵀ): removes the rounding asymmetry of a computed symmetric matrix. */
export function symmetrize(m: Matrix): Matrix {
  return m.clone().add(m.transpose()).mul(0.5);
}

/** Rows of a Matrix as plain arrays (for JSON results). */
export function matrixRows(m: Matrix): number[][] {
  return m.to2DArray();
}
