/** Distribution index η_c of simulated binary crossover (Deb et al. 2002, §V: η_c = 20). */
export const SBX_ETA_C = 20;
/** Distribution index η_m of polynomial mutation (Deb et al. 2002, §V: η_m = 20). */
export const POLYNOMIAL_ETA_M = 20;
/** Crossover probability p_c per pair (Deb et al. 2002, §V: 0.9). */
export const CROSSOVER_PROBABILITY = 0.9;
/** Per-variable probability that SBX exchanges a variable pair (common practice, as in Deb's reference code). */
const SBX_VARIABLE_PROBABILITY = 0.5;
/** Parents closer than this in a variable are copied, not crossed (Deb's reference code). */
const SBX_EPSILON = 1e-14;

/**
 * Simulated binary crossover on the box [0, 1]^d, in the bounded form of Deb's NSGA-II reference
 * code: for each variable, with probability ½ and distinct parent values y1 < y2, with u ~ U[0,1),
 *
 *   β = 1 + 2(y1 − lower)/(y2 − y1),  α = 2 − β^−(η+1),
 *   β_q = (uα)^(1/(η+1)) if u ≤ 1/α, else (1/(2 − uα))^(1/(η+1)),
 *   c1 = ½[(y1 + y2) − β_q(y2 − y1)]   (and likewise c2 with β = 1 + 2(upper − y2)/(y2 − y1), +β_q),
 *
 * children clamped into the box and given to the two children at random. Writes the children into
 * c1, c2 (length d). `random` gives U[0, 1).
 *
 * References: K. Deb and R. B. Agrawal, "Simulated binary crossover for continuous search space",
 * Complex Systems 9, 115–148, 1995; Deb et al. 2002 (NSGA-II); the bounded form from memory of
 * Deb's published NSGA-II C code (nsga2 v1.1, crossover.c).
 */
export function sbxCrossover(p1: ArrayLike<number>, p2: ArrayLike<number>, c1: Float64Array, c2: Float64Array, random: () => number, etaC = SBX_ETA_C): void {
  const d = c1.length;
  const e = 1 / (etaC + 1);
  for (let j = 0; j < d; j++) {
    const a = p1[j];
    const b = p2[j];
    if (random() > SBX_VARIABLE_PROBABILITY || Math.abs(a - b) <= SBX_EPSILON) {
      c1[j] = a;
      c2[j] = b;
      continue;
    }
    const y1 = Math.min(a, b);
    const y2 = Math.max(a, b);
    const u = random();
    const spread = (beta: number) => {
      const alpha = 2 - Math.pow(beta, -(etaC + 1));
      return u <= 1 / alpha ? Math.pow(u * alpha, e) : Math.pow(1 / (2 - u * alpha), e);
    };
    const lowChild = clamp01(0.5 * (y1 + y2 - spread(1 + (2 * y1) / (y2 - y1)) * (y2 - y1)));
    const highChild = clamp01(0.5 * (y1 + y2 + spread(1 + (2 * (1 - y2)) / (y2 - y1)) * (y2 - y1)));
    if (random() <= 0.5) {
      c1[j] = highChild;
      c2[j] = lowChild;
    } else {
      c1[j] = lowChild;
      c2[j] = highChild;
    }
  }
}

/**
 * Polynomial mutation on the box [0, 1]^d (Deb's bounded form): each variable y mutates with
 * probability pm; with δ1 = y − lower, δ2 = upper − y (the box has width 1) and u ~ U[0,1),
 *
 *   u ≤ ½:  δ_q = [2u + (1 − 2u)(1 − δ1)^(η+1)]^(1/(η+1)) − 1
 *   u > ½:  δ_q = 1 − [2(1 − u) + 2(u − ½)(1 − δ2)^(η+1)]^(1/(η+1))
 *
 * y ← clamp(y + δ_q). In place.
 *
 * References: K. Deb and M. Goyal, "A combined genetic adaptive search (GeneAS) for engineering
 * design", Computer Science and Informatics 26(4), 30–45, 1996; Deb et al. 2002; the bounded form
 * from memory of Deb's NSGA-II C code (mutation.c).
 */
export function polynomialMutation(y: Float64Array, pm: number, random: () => number, etaM = POLYNOMIAL_ETA_M): void {
  const e = 1 / (etaM + 1);
  for (let j = 0; j < y.length; j++) {
    if (random() > pm) continue;
    const x = y[j];
    const u = random();
    let deltaQ: number;
    if (u <= 0.5) {
      const v = 2 * u + (1 - 2 * u) * Math.pow(1 - x, etaM + 1);
      deltaQ = Math.pow(v, e) - 1;
    } else {
      const v = 2 * (1 - u) + 2 * (u - 0.5) * Math.pow(x, etaM + 1);
      deltaQ = 1 - Math.pow(v, e);
    }
    y[j] = clamp01(x + deltaQ);
  }
}

function clamp01(v: number): number {
  return v < 0 ? 0 : v > 1 ? 1 : v;
}
