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
  const rx = rankSample(x);
  return tauFromRanks(rx, rankSample(y).ranks, new KendallScratch(x.length));
}

/**
 * Kendall's τ_b between every pair of k samples of equal length n (e.g. k criteria over the same
 * n candidates), as a k × k row-major matrix: entry (a, b) = kendallTau(samples[a], samples[b]),
 * 1 on the diagonal for a sample with two distinct values (NaN when it has fewer). Each sample is
 * ranked once (one sort) and the scratch arrays are shared, so the cost is one sort per sample and
 * one O(n log n) merge count per pair, on 32-bit integer ranks.
 * Throws a RangeError when the samples differ in length.
 */
export function kendallTauMatrix(samples: readonly ArrayLike<number>[]): Float64Array {
  const k = samples.length;
  const n = k === 0 ? 0 : samples[0].length;
  samples.forEach((s, a) => {
    if (s.length !== n) throw new RangeError(`samples[${a}]: length ${s.length} differs from samples[0]'s ${n}`);
  });
  const ranked = samples.map((s) => rankSample(s));
  const scratch = new KendallScratch(n);
  const out = new Float64Array(k * k);
  for (let a = 0; a < k; a++) {
    // τ_b(x, x) = (n₀ − n₁)/(n₀ − n₁): 1 unless every value ties (or fewer than two remain).
    const m = ranked[a].order.length;
    out[a * k + a] = m >= 2 && ranked[a].distinct >= 2 ? 1 : NaN;
    for (let b = a + 1; b < k; b++) {
      const tau = tauFromRanks(ranked[a], ranked[b].ranks, scratch);
      out[a * k + b] = tau;
      out[b * k + a] = tau;
    }
  }
  return out;
}

/** A sample's dense ranks (0 … distinct − 1, equal values equal ranks, −1 for NaN) and its non-NaN indices in ascending order. */
interface RankedSample {
  ranks: Int32Array;
  order: Uint32Array;
  distinct: number;
}

/** Preallocated work arrays of one τ computation over at most n pairs. */
class KendallScratch {
  readonly ys: Int32Array;
  readonly buffer: Int32Array;
  constructor(n: number) {
    this.ys = new Int32Array(n);
    this.buffer = new Int32Array(n);
  }
}

/**
 * Ranks a sample: its non-NaN values sorted once (the engine's numeric typed-array sort), each
 * value's dense rank by binary search among the distinct values, and the indices ordered by rank
 * (ties by index) by a counting sort.
 */
function rankSample(v: ArrayLike<number>): RankedSample {
  let m = 0;
  for (let i = 0; i < v.length; i++) if (!Number.isNaN(v[i])) m++;
  const sorted = new Float64Array(m);
  let j = 0;
  for (let i = 0; i < v.length; i++) if (!Number.isNaN(v[i])) sorted[j++] = v[i];
  sorted.sort();
  let distinct = 0;
  for (let p = 0; p < m; p++) if (p === 0 || sorted[p] !== sorted[distinct - 1]) sorted[distinct++] = sorted[p];
  const levels = sorted.subarray(0, distinct);
  const ranks = new Int32Array(v.length).fill(-1);
  const counts = new Uint32Array(distinct + 1);
  for (let i = 0; i < v.length; i++) {
    const value = v[i];
    if (Number.isNaN(value)) continue;
    let lo = 0;
    let hi = distinct - 1;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (levels[mid] < value) lo = mid + 1;
      else hi = mid;
    }
    ranks[i] = lo;
    counts[lo + 1]++;
  }
  for (let r = 0; r < distinct; r++) counts[r + 1] += counts[r];
  const order = new Uint32Array(m);
  for (let i = 0; i < v.length; i++) if (ranks[i] >= 0) order[counts[ranks[i]]++] = i;
  return { ranks, order, distinct };
}

/**
 * τ_b of (x, y) from x's ranking and y's ranks. Pairs with y NaN (rank −1) are skipped; within each
 * group of equal x the y ranks are sorted (so x-ties are not counted as exchanges).
 */
function tauFromRanks(x: RankedSample, yRanks: Int32Array, scratch: KendallScratch): number {
  const ys = scratch.ys;
  const order = x.order;
  const xRanks = x.ranks;
  // Gather y along x's order, skipping NaN y; count x-ties and joint ties group by group.
  let m = 0;
  let n1 = 0;
  let n3 = 0;
  let groupStart = 0;
  let previousX = -1;
  for (let p = 0; p < order.length; p++) {
    const index = order[p];
    const yi = yRanks[index];
    if (yi < 0) continue;
    const xi = xRanks[index];
    if (xi !== previousX) {
      const t = m - groupStart;
      if (t > 1) {
        n1 += (t * (t - 1)) / 2;
        n3 += sortedTies(ys.subarray(groupStart, m).sort());
      }
      groupStart = m;
      previousX = xi;
    }
    ys[m++] = yi;
  }
  const t = m - groupStart;
  if (t > 1) {
    n1 += (t * (t - 1)) / 2;
    n3 += sortedTies(ys.subarray(groupStart, m).sort());
  }
  if (m < 2) return NaN;
  const sequence = ys.subarray(0, m);
  const exchanges = mergeSortExchanges(sequence, scratch.buffer.subarray(0, m));
  const n2 = sortedTies(sequence); // sorted now
  const n0 = (m * (m - 1)) / 2;
  const denominator = Math.sqrt((n0 - n1) * (n0 - n2));
  if (denominator === 0) return NaN;
  return (n0 - n1 - n2 + n3 - 2 * exchanges) / denominator;
}

/** Σ t(t−1)/2 over the runs of equal values of a sorted array. */
function sortedTies(sorted: Int32Array): number {
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

/** Runs sorted by insertion before merging (short runs are cheaper by insertion; exchanges counted alike). */
const INSERTION_RUN = 16;

/**
 * Sorts a ascending in place (insertion-sorted runs, then bottom-up merges through `buffer` of the
 * same length) and returns the number of pairs i < j with a_i > a_j (strictly; equal values are
 * not exchanged) — Knight's S.
 */
function mergeSortExchanges(a: Int32Array, buffer: Int32Array): number {
  const n = a.length;
  let exchanges = 0;
  for (let lo = 0; lo < n; lo += INSERTION_RUN) {
    const hi = Math.min(lo + INSERTION_RUN, n);
    for (let i = lo + 1; i < hi; i++) {
      const v = a[i];
      let j = i - 1;
      while (j >= lo && a[j] > v) {
        a[j + 1] = a[j];
        j--;
      }
      exchanges += i - 1 - j;
      a[j + 1] = v;
    }
  }
  let source = a;
  let target = buffer;
  for (let width = INSERTION_RUN; width < n; width *= 2) {
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
