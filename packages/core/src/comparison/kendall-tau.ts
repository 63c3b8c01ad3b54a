/**
 * Kendall's rank correlation τ-b of two samples, in O(n log n) by the method of Knight (1966):
 * sort the pairs by x (ties in x by y), then count the exchanges a merge sort makes to order the
 * y sequence — each exchange is one discordant pair. With n₀ = n(n−1)/2,
 *
 *   n₁ = Σ_i t_i(t_i − 1)/2   (t_i: sizes of the groups of equal x),
 *   n₂ = Σ_j u_j(u_j − 1)/2   (u_j: sizes of the groups of equal y),
 *   n₃ = Σ_k v_k(v_k − 1)/2   (v_k: sizes of the groups equal in both),
 *   S  = exchanges of the merge sort (discordant pairs),
 *
 *   τ_b = (n₀ − n₁ − n₂ + n₃ − 2S) / √((n₀ − n₁)(n₀ − n₂)).
 *
 * τ_b = 1 when y is a strictly increasing function of x, −1 when strictly decreasing; ties in
 * either sample are corrected for as in Kendall (1945).
 *
 * Values: a pair (x_i, y_i) where either is NaN is left out (pairwise deletion). ±Infinity are
 * ordinary values: larger (smaller) than every finite number, tied with each other — so a settling
 * time never reached ranks as the worst and several of them tie. −0 and +0 tie. The result is NaN
 * when fewer than two pairs remain or when every remaining x (or every y) is the same (τ_b is 0/0).
 *
 * References: W. R. Knight, "A computer method for calculating Kendall's tau with ungrouped data",
 * Journal of the American Statistical Association 61(314), 436–439, 1966; M. G. Kendall, "The
 * treatment of ties in ranking problems", Biometrika 33(3), 239–251, 1945 (τ_b).
 */
export function kendallTau(x: ArrayLike<number>, y: ArrayLike<number>): number {
  if (x.length !== y.length) throw new RangeError(`y: length ${y.length} differs from x's ${x.length}`);
  const order = sortedOrder(x);
  return tauFromOrder(x, y, order, new KendallScratch(x.length));
}

/**
 * Kendall's τ_b between every pair of k samples of equal length n (e.g. k criteria over the same
 * n candidates), as a k × k row-major matrix: entry (a, b) = kendallTau(samples[a], samples[b]),
 * 1 on the diagonal for a sample with two distinct values (NaN when it has fewer). Each sample is
 * sorted once and the scratch arrays are shared, so the cost is O(k² · n log n) with small constants.
 * Throws a RangeError when the samples differ in length.
 */
export function kendallTauMatrix(samples: readonly ArrayLike<number>[]): Float64Array {
  const k = samples.length;
  const n = k === 0 ? 0 : samples[0].length;
  samples.forEach((s, a) => {
    if (s.length !== n) throw new RangeError(`samples[${a}]: length ${s.length} differs from samples[0]'s ${n}`);
  });
  const orders = samples.map((s) => sortedOrder(s));
  const scratch = new KendallScratch(n);
  const out = new Float64Array(k * k);
  for (let a = 0; a < k; a++) {
    for (let b = a; b < k; b++) {
      const tau = tauFromOrder(samples[a], samples[b], orders[a], scratch);
      out[a * k + b] = tau;
      out[b * k + a] = tau;
    }
  }
  return out;
}

/** Preallocated work arrays of one τ computation over at most n pairs. */
class KendallScratch {
  readonly ys: Float64Array;
  readonly buffer: Float64Array;
  constructor(n: number) {
    this.ys = new Float64Array(n);
    this.buffer = new Float64Array(n);
  }
}

/** Indices of the non-NaN values of v in ascending order of value (NaN indices dropped). */
function sortedOrder(v: ArrayLike<number>): Uint32Array {
  let m = 0;
  for (let i = 0; i < v.length; i++) if (!Number.isNaN(v[i])) m++;
  const order = new Uint32Array(m);
  let j = 0;
  for (let i = 0; i < v.length; i++) if (!Number.isNaN(v[i])) order[j++] = i;
  // A typed-array sort of (value, index) keys would need packing; a comparator sort is O(m log m).
  const values = Float64Array.from(order, (i) => v[i]);
  const positions = Uint32Array.from({ length: m }, (_, p) => p);
  positions.sort((p, q) => (values[p] < values[q] ? -1 : values[p] > values[q] ? 1 : p - q));
  return Uint32Array.from(positions, (p) => order[p]);
}

/**
 * τ_b of (x, y) given the indices of x's non-NaN values sorted by x. Pairs with y NaN are skipped;
 * within each group of equal x the y values are sorted (so x-ties are not counted as exchanges).
 */
function tauFromOrder(x: ArrayLike<number>, y: ArrayLike<number>, order: Uint32Array, scratch: KendallScratch): number {
  const ys = scratch.ys;
  // Gather y along x's order, skipping NaN y; count x-ties and joint ties group by group.
  let m = 0;
  let n1 = 0;
  let n3 = 0;
  let groupStart = 0;
  let previousX = NaN;
  for (let p = 0; p <= order.length; p++) {
    const index = p < order.length ? order[p] : -1;
    const yi = index >= 0 ? y[index] : NaN;
    if (index >= 0 && Number.isNaN(yi)) continue;
    const xi = index >= 0 ? x[index] : NaN;
    if (index < 0 || xi !== previousX) {
      // Close the group [groupStart, m) of equal x: sort its y, count its ties.
      const t = m - groupStart;
      if (t > 1) {
        n1 += (t * (t - 1)) / 2;
        const group = ys.subarray(groupStart, m);
        group.sort();
        n3 += tiedPairs(group);
      }
      groupStart = m;
      previousX = xi;
    }
    if (index >= 0) ys[m++] = yi;
  }
  if (m < 2) return NaN;
  const sequence = ys.subarray(0, m);
  const exchanges = mergeSortExchanges(sequence, scratch.buffer.subarray(0, m));
  const n2 = tiedPairs(sequence); // sorted now
  const n0 = (m * (m - 1)) / 2;
  const denominator = Math.sqrt((n0 - n1) * (n0 - n2));
  if (denominator === 0) return NaN;
  return (n0 - n1 - n2 + n3 - 2 * exchanges) / denominator;
}

/** Σ t(t−1)/2 over the runs of equal values of a sorted array. */
function tiedPairs(sorted: Float64Array): number {
  let pairs = 0;
  let run = 1;
  for (let i = 1; i <= sorted.length; i++) {
    if (i < sorted.length && sorted[i] === sorted[i - 1]) run++;
    else {
      pairs += (run * (run - 1)) / 2;
      run = 1;
    }
  }
  return pairs;
}

/**
 * Sorts a ascending in place (bottom-up merge sort, `buffer` of the same length) and returns the
 * number of pairs i < j with a_i > a_j (strictly; equal values are not exchanged) — Knight's S.
 */
function mergeSortExchanges(a: Float64Array, buffer: Float64Array): number {
  const n = a.length;
  let exchanges = 0;
  let source = a;
  let target = buffer;
  for (let width = 1; width < n; width *= 2) {
    for (let lo = 0; lo < n; lo += 2 * width) {
      const mid = Math.min(lo + width, n);
      const hi = Math.min(lo + 2 * width, n);
      let i = lo;
      let j = mid;
      let k = lo;
      while (i < mid && j < hi) {
        if (source[j] < source[i]) {
          target[k++] = source[j++];
          exchanges += mid - i; // source[j] jumps over every remaining left element
        } else target[k++] = source[i++];
      }
      while (i < mid) target[k++] = source[i++];
      while (j < hi) target[k++] = source[j++];
    }
    const swap = source;
    source = target;
    target = swap;
  }
  if (source !== a) a.set(source);
  return exchanges;
}
