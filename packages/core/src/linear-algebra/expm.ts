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
 * a: n×n matrix, row-major (not modified). Returns e^A, n×n, row-major. Plain Float64Array loops
 * (no matrix objects), since the simulation discretises one small closed loop per candidate.
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

  const norm = norm1(a, n);
  for (const [m, theta] of THETA) {
    if (norm <= theta) return padeLowDegree(a, n, PADE_COEFFICIENTS[m]);
  }
  const s = Math.max(0, Math.ceil(Math.log2(norm / THETA_13)));
  const x = new Float64Array(a);
  if (s > 0) {
    const scale = 2 ** -s;
    for (let i = 0; i < x.length; i++) x[i] *= scale;
  }
  let r = pade13(x, n);
  for (let k = 0; k < s; k++) r = multiply(r, r, n);
  return r;
}

/** r_m(X) for m ≤ 9 from even powers of X (Higham 2005, eq. 2.5 and 2.6). */
function padeLowDegree(x: Float64Array, n: number, b: readonly number[]): Float64Array {
  const x2 = multiply(x, x, n);
  const u0 = identity(n, b[1]);
  const v = identity(n, b[0]);
  let power = identity(n, 1);
  for (let j = 2; j < b.length; j += 2) {
    power = multiply(power, x2, n);
    addScaled(v, power, b[j]);
    if (j + 1 < b.length) addScaled(u0, power, b[j + 1]);
  }
  return solvePade(multiply(x, u0, n), v, n);
}

/** r₁₃(X) with six matrix products (Higham 2005, eq. 2.7). */
function pade13(x: Float64Array, n: number): Float64Array {
  const b = PADE_COEFFICIENTS[13];
  const x2 = multiply(x, x, n);
  const x4 = multiply(x2, x2, n);
  const x6 = multiply(x4, x2, n);
  const inner = new Float64Array(n * n);
  addScaled(inner, x6, b[13]);
  addScaled(inner, x4, b[11]);
  addScaled(inner, x2, b[9]);
  const u0 = multiply(x6, inner, n);
  addScaled(u0, x6, b[7]);
  addScaled(u0, x4, b[5]);
  addScaled(u0, x2, b[3]);
  for (let i = 0; i < n; i++) u0[i * n + i] += b[1];
  const u = multiply(x, u0, n);
  const innerV = new Float64Array(n * n);
  addScaled(innerV, x6, b[12]);
  addScaled(innerV, x4, b[10]);
  addScaled(innerV, x2, b[8]);
  const v = multiply(x6, innerV, n);
  addScaled(v, x6, b[6]);
  addScaled(v, x4, b[4]);
  addScaled(v, x2, b[2]);
  for (let i = 0; i < n; i++) v[i * n + i] += b[0];
  return solvePade(u, v, n);
}

/** Solves (−U + V) R = (U + V) for R by LU with partial pivoting (in place on copies). */
function solvePade(u: Float64Array, v: Float64Array, n: number): Float64Array {
  const q = new Float64Array(n * n);
  const r = new Float64Array(n * n);
  for (let i = 0; i < n * n; i++) {
    q[i] = v[i] - u[i];
    r[i] = v[i] + u[i];
  }
  for (let col = 0; col < n; col++) {
    let pivot = col;
    let best = Math.abs(q[col * n + col]);
    for (let i = col + 1; i < n; i++) {
      const value = Math.abs(q[i * n + col]);
      if (value > best) {
        best = value;
        pivot = i;
      }
    }
    if (best === 0) throw new RangeError("expm: the Padé denominator is singular");
    if (pivot !== col) {
      for (let j = 0; j < n; j++) {
        const tq = q[col * n + j];
        q[col * n + j] = q[pivot * n + j];
        q[pivot * n + j] = tq;
        const tr = r[col * n + j];
        r[col * n + j] = r[pivot * n + j];
        r[pivot * n + j] = tr;
      }
    }
    const diag = q[col * n + col];
    for (let i = col + 1; i < n; i++) {
      const f = q[i * n + col] / diag;
      if (f === 0) continue;
      for (let j = col; j < n; j++) q[i * n + j] -= f * q[col * n + j];
      for (let j = 0; j < n; j++) r[i * n + j] -= f * r[col * n + j];
    }
  }
  for (let col = n - 1; col >= 0; col--) {
    const diag = q[col * n + col];
    for (let j = 0; j < n; j++) {
      let acc = r[col * n + j];
      for (let k = col + 1; k < n; k++) acc -= q[col * n + k] * r[k * n + j];
      r[col * n + j] = acc / diag;
    }
  }
  return r;
}

function multiply(a: Float64Array, b: Float64Array, n: number): Float64Array {
  const out = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let k = 0; k < n; k++) {
      const aik = a[i * n + k];
      if (aik === 0) continue;
      for (let j = 0; j < n; j++) out[i * n + j] += aik * b[k * n + j];
    }
  }
  return out;
}

function identity(n: number, value: number): Float64Array {
  const out = new Float64Array(n * n);
  for (let i = 0; i < n; i++) out[i * n + i] = value;
  return out;
}

function addScaled(target: Float64Array, source: Float64Array, factor: number): void {
  for (let i = 0; i < target.length; i++) target[i] += factor * source[i];
}

function norm1(a: Float64Array, n: number): number {
  let best = 0;
  for (let j = 0; j < n; j++) {
    let sum = 0;
    for (let i = 0; i < n; i++) sum += Math.abs(a[i * n + j]);
    if (sum > best) best = sum;
  }
  return best;
}
