import { Matrix, solve } from "ml-matrix";

/**
 * Coefficients b₀…b_m of the diagonal Padé approximant r_m(x) = p_m(x)/p_m(−x) of eˣ,
 * p_m(x) = Σ b_j x^j (Higham 2005, eq. 2.2, scaled to integers as in his Algorithm 2.3).
 */
const PADE_COEFFICIENTS: Readonly<Record<3 | 5 | 7 | 9 | 13, readonly number[]>> = {
  3: [120, 60, 12, 1],
  5: [30240, 15120, 3360, 420, 30, 1],
  7: [17297280, 8648640, 1995840, 277200, 25200, 1512, 56, 1],
  9: [17643225600, 8821612800, 2075673600, 302702400, 30270240, 2162160, 110880, 3960, 90, 1],
  13: [
    64764752532480000, 32382376266240000, 7771770303897600, 1187353796428800, 129060195264000,
    10559470521600, 670442572800, 33522128640, 1323241920, 40840800, 960960, 16380, 182, 1,
  ],
};

/**
 * θ_m: the largest ‖A‖₁ for which r_m(A) meets unit roundoff 2⁻⁵³ in backward error
 * (Higham 2005, Table 2.3).
 */
const THETA: ReadonlyArray<readonly [3 | 5 | 7 | 9, number]> = [
  [3, 1.495585217958292e-2],
  [5, 2.539398330063230e-1],
  [7, 9.504178996162932e-1],
  [9, 2.097847961257068e0],
];
const THETA_13 = 5.371920351148152e0;

/**
 * Matrix exponential e^A of a real square matrix by scaling and squaring with a diagonal Padé
 * approximant of degree m ∈ {3, 5, 7, 9, 13} chosen from ‖A‖₁:
 *
 *   e^A ≈ (r_m(A / 2^s))^(2^s),   r_m(X) = [−U + V]⁻¹ [U + V],
 *   U = X Σ_{j odd} b_j X^(j−1),   V = Σ_{j even} b_j X^j.
 *
 * a: n×n matrix, row-major (not modified). Returns e^A, n×n, row-major.
 *
 * References: N. J. Higham, "The scaling and squaring method for the matrix exponential
 * revisited", SIAM J. Matrix Anal. Appl. 26(4), 1179–1193, 2005 (Algorithm 2.3);
 * C. Moler and C. Van Loan, "Nineteen dubious ways to compute the exponential of a matrix,
 * twenty-five years later", SIAM Review 45(1), 3–49, 2003.
 */
export function expm(a: Float64Array, n: number): Float64Array {
  if (!Number.isInteger(n) || n < 0) throw new RangeError(`n must be a whole number ≥ 0, got ${n}`);
  if (a.length !== n * n) throw new RangeError(`a must hold n·n = ${n * n} entries, got ${a.length}`);
  for (let i = 0; i < a.length; i++) {
    if (!Number.isFinite(a[i])) throw new RangeError(`a must be finite; entry ${i} is ${a[i]}`);
  }
  if (n === 0) return new Float64Array(0);

  const A = toMatrix(a, n);
  const norm = norm1(A);
  for (const [m, theta] of THETA) {
    if (norm <= theta) return fromMatrix(padeLowDegree(A, PADE_COEFFICIENTS[m]), n);
  }
  const s = Math.max(0, Math.ceil(Math.log2(norm / THETA_13)));
  const X = s > 0 ? A.clone().mul(2 ** -s) : A;
  let R = pade13(X);
  for (let k = 0; k < s; k++) R = R.mmul(R);
  return fromMatrix(R, n);
}

/** r_m(X) for m ≤ 9 from even powers of X (Higham 2005, eq. 2.5 and 2.6). */
function padeLowDegree(X: Matrix, b: readonly number[]): Matrix {
  const n = X.rows;
  const X2 = X.mmul(X);
  const U0 = Matrix.eye(n, n, b[1]);
  const V = Matrix.eye(n, n, b[0]);
  let power = Matrix.eye(n, n);
  for (let j = 2; j < b.length; j += 2) {
    power = power.mmul(X2);
    V.add(power.clone().mul(b[j]));
    if (j + 1 < b.length) U0.add(power.clone().mul(b[j + 1]));
  }
  return solvePade(X.mmul(U0), V);
}

/** r₁₃(X) with six matrix products (Higham 2005, eq. 2.7). */
function pade13(X: Matrix): Matrix {
  const b = PADE_COEFFICIENTS[13];
  const n = X.rows;
  const I = Matrix.eye(n, n);
  const X2 = X.mmul(X);
  const X4 = X2.mmul(X2);
  const X6 = X4.mmul(X2);
  const inner = X6.clone().mul(b[13]).add(X4.clone().mul(b[11])).add(X2.clone().mul(b[9]));
  const U0 = X6.mmul(inner)
    .add(X6.clone().mul(b[7]))
    .add(X4.clone().mul(b[5]))
    .add(X2.clone().mul(b[3]))
    .add(I.clone().mul(b[1]));
  const U = X.mmul(U0);
  const innerV = X6.clone().mul(b[12]).add(X4.clone().mul(b[10])).add(X2.clone().mul(b[8]));
  const V = X6.mmul(innerV)
    .add(X6.clone().mul(b[6]))
    .add(X4.clone().mul(b[4]))
    .add(X2.clone().mul(b[2]))
    .add(I.clone().mul(b[0]));
  return solvePade(U, V);
}

/** Solves (−U + V) R = (U + V) for R by LU with partial pivoting. */
function solvePade(U: Matrix, V: Matrix): Matrix {
  const P = V.clone().add(U);
  const Q = V.clone().sub(U);
  return solve(Q, P);
}

function norm1(A: Matrix): number {
  let best = 0;
  for (let j = 0; j < A.columns; j++) {
    let sum = 0;
    for (let i = 0; i < A.rows; i++) sum += Math.abs(A.get(i, j));
    if (sum > best) best = sum;
  }
  return best;
}

function toMatrix(a: Float64Array, n: number): Matrix {
  const M = new Matrix(n, n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) M.set(i, j, a[i * n + j]);
  return M;
}

function fromMatrix(M: Matrix, n: number): Float64Array {
  const out = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) out[i * n + j] = M.get(i, j);
  return out;
}
