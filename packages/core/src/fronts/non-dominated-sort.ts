/**
 * The front index (rank) of every point of a k-objective set, every objective minimised: rank 0
 * holds the non-dominated points, rank 1 those dominated only by rank-0 points, and so on — the
 * fronts of the fast non-dominated sort of Deb et al. (2002). Point q dominates p when
 * f_j(q) ≤ f_j(p) for every j and f_j(q) < f_j(p) for some j; equal points do not dominate each
 * other and share a rank. Equivalently, rank(p) = 1 + max rank of the points that dominate p
 * (0 when none does).
 *
 * Points with any non-finite objective (NaN, ±Infinity: unstable or unscored candidates) rank
 * last: they all get the rank one past the last front of the finite points (0 when no point is
 * finite), and they do not dominate anything.
 *
 * Method: the finite points are sorted lexicographically (f_1, then f_2, …), so that a point's
 * dominators all come before it.
 * - k = 2: one sweep (Jensen 2003): the fronts found so far keep their least f_2, which grows with
 *   the front index; a point joins the first front whose least f_2 exceeds its own (binary
 *   search), or the front of an identical predecessor. O(n log n).
 * - k ≥ 3: efficient non-dominated sort with binary search over fronts (ENS-BS, Zhang et al. 2015):
 *   "some member of front r dominates p" is true for r < rank(p) and false from rank(p) on, so a
 *   binary search over the fronts finds the rank; each test scans the front's members, newest
 *   first. Worst case O(k·n²) comparisons (as Deb 2002), O(n) memory, and far fewer in practice.
 *
 * objectives: n × k row-major; n, k whole numbers ≥ 0 / ≥ 1 with objectives.length = n·k.
 * Returns an Int32Array of n ranks. Throws a RangeError naming n, k or objectives.
 *
 * References: K. Deb, A. Pratap, S. Agarwal and T. Meyarivan, "A fast and elitist multiobjective
 * genetic algorithm: NSGA-II", IEEE Trans. Evol. Comput. 6(2), 182–197, 2002; M. T. Jensen,
 * "Reducing the run-time complexity of multiobjective EAs: the NSGA-II and other algorithms",
 * IEEE Trans. Evol. Comput. 7(5), 503–515, 2003; X. Zhang, Y. Tian, R. Cheng and Y. Jin, "An
 * efficient approach to nondominated sorting for evolutionary multiobjective optimization",
 * IEEE Trans. Evol. Comput. 19(2), 201–213, 2015.
 */
export function nonDominatedSort(objectives: ArrayLike<number>, n: number, k: number): Int32Array {
  if (!Number.isInteger(n) || n < 0) throw new RangeError(`n must be a whole number ≥ 0, got ${String(n)}`);
  if (!Number.isInteger(k) || k < 1) throw new RangeError(`k must be a whole number ≥ 1, got ${String(k)}`);
  if (objectives.length !== n * k) throw new RangeError(`objectives: length ${objectives.length} is not n·k = ${n * k}`);
  const rank = new Int32Array(n);
  const finite: number[] = [];
  const nonFinite: number[] = [];
  for (let i = 0; i < n; i++) {
    let ok = true;
    for (let j = 0; j < k && ok; j++) ok = Number.isFinite(objectives[i * k + j]);
    (ok ? finite : nonFinite).push(i);
  }
  finite.sort((a, b) => {
    for (let j = 0; j < k; j++) {
      const d = objectives[a * k + j] - objectives[b * k + j];
      if (d !== 0) return d;
    }
    return a - b;
  });
  const fronts = k === 2 ? sweepTwo(objectives, finite, rank) : ensBinary(objectives, k, finite, rank);
  for (const i of nonFinite) rank[i] = fronts;
  return rank;
}

/** The number of fronts among the finite points (ranks 0 … fronts−1); the non-finite rank. */
function sweepTwo(f: ArrayLike<number>, order: number[], rank: Int32Array): number {
  const least: number[] = []; // least f_2 of each front so far, non-decreasing in the front index
  for (let t = 0; t < order.length; t++) {
    const p = order[t];
    const x = f[2 * p];
    const y = f[2 * p + 1];
    if (t > 0) {
      const q = order[t - 1];
      if (f[2 * q] === x && f[2 * q + 1] === y) {
        rank[p] = rank[q];
        continue;
      }
    }
    let lo = 0;
    let hi = least.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (least[mid] > y) hi = mid;
      else lo = mid + 1;
    }
    rank[p] = lo;
    if (lo === least.length) least.push(y);
    else least[lo] = y;
  }
  return least.length;
}

function ensBinary(f: ArrayLike<number>, k: number, order: number[], rank: Int32Array): number {
  const fronts: number[][] = [];
  const dominatedBy = (front: number[], p: number): boolean => {
    for (let m = front.length - 1; m >= 0; m--) if (dominates(f, k, front[m], p)) return true;
    return false;
  };
  for (const p of order) {
    let lo = 0;
    let hi = fronts.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (dominatedBy(fronts[mid], p)) lo = mid + 1;
      else hi = mid;
    }
    rank[p] = lo;
    if (lo === fronts.length) fronts.push([p]);
    else fronts[lo].push(p);
  }
  return fronts.length;
}

/** Does point q dominate point p (minimising all k objectives)? */
function dominates(f: ArrayLike<number>, k: number, q: number, p: number): boolean {
  let strict = false;
  for (let j = 0; j < k; j++) {
    const a = f[q * k + j];
    const b = f[p * k + j];
    if (a > b) return false;
    if (a < b) strict = true;
  }
  return strict;
}
