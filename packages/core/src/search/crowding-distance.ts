/**
 * Crowding distance of the members of one front (Deb et al. 2002, §III-B): for each objective j,
 * sort the front by f_j; the two extremes get +Infinity, every other member adds the normalised
 * gap between its neighbours,
 *
 *   I[i] += (f_j(next) − f_j(previous)) / (f_j^max − f_j^min),
 *
 * an objective with f_j^max = f_j^min adds nothing. Larger means less crowded.
 *
 * objectives: rows × k row-major; members: the rows of the front. Returns one distance per member,
 * in the order of `members`. Ties in a sort are broken by row index, so the result is deterministic.
 *
 * Reference: K. Deb, A. Pratap, S. Agarwal and T. Meyarivan, "A fast and elitist multiobjective
 * genetic algorithm: NSGA-II", IEEE Trans. Evol. Comput. 6(2), 182–197, 2002.
 */
export function crowdingDistance(objectives: ArrayLike<number>, k: number, members: readonly number[]): Float64Array {
  const m = members.length;
  const distance = new Float64Array(m);
  if (m <= 2) return distance.fill(Infinity);
  const order = Array.from({ length: m }, (_, i) => i);
  for (let j = 0; j < k; j++) {
    const f = (i: number) => objectives[members[i] * k + j];
    order.sort((a, b) => f(a) - f(b) || members[a] - members[b]);
    const lo = f(order[0]);
    const hi = f(order[m - 1]);
    distance[order[0]] = Infinity;
    distance[order[m - 1]] = Infinity;
    if (!(hi > lo)) continue;
    for (let t = 1; t < m - 1; t++) distance[order[t]] += (f(order[t + 1]) - f(order[t - 1])) / (hi - lo);
  }
  return distance;
}
