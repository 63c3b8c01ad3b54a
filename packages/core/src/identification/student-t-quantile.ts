/** Lanczos coefficients (g = 5, n = 6) for ln Γ, as in Press et al., Numerical Recipes, 3rd ed., 2007, §6.1. */
const LANCZOS = [76.18009172947146, -86.50532032941677, 24.01409824083091, -1.231739572450155, 0.1208650973866179e-2, -0.5395239384953e-5];
/** Continued-fraction settings for the incomplete beta function (Numerical Recipes §6.4). */
const CF_MAX_TERMS = 300;
const CF_EPS = 3e-16;
const CF_TINY = 1e-300;
/** Bisection steps for the quantile: halves [0, 1e8] to below 1e-13 relative. */
const BISECTION_STEPS = 200;

/**
 * The quantile t_p(ν) of Student's t distribution: the t with P(T ≤ t) = p for ν degrees of
 * freedom, from the regularised incomplete beta function,
 *
 *   P(T ≤ t) = 1 − ½·I_{ν/(ν+t²)}(ν/2, ½)   (t ≥ 0),
 *
 * solved for t by bisection (monotone in t); symmetric for p < ½. I_x(a, b) from its continued
 * fraction (modified Lentz). Accurate to about 1e-10 relative.
 *
 * p in (0, 1); nu > 0 (need not be whole). Throws a RangeError naming the argument.
 * References: M. Abramowitz and I. A. Stegun, Handbook of Mathematical Functions, 1964, eq. 26.7.1
 * and 26.5.27; W. H. Press et al., Numerical Recipes, 3rd ed., 2007, §6.1, §6.4, §6.14.
 */
export function studentTQuantile(p: number, nu: number): number {
  if (!(p > 0 && p < 1)) throw new RangeError(`p must lie in (0, 1), got ${p}`);
  if (!(nu > 0) || !Number.isFinite(nu)) throw new RangeError(`nu must be a finite number > 0, got ${nu}`);
  if (p === 0.5) return 0;
  if (p < 0.5) return -studentTQuantile(1 - p, nu);
  const tail = 2 * (1 - p); // = I_{ν/(ν+t²)}(ν/2, ½) at the quantile
  let lo = 0;
  let hi = 1e8;
  for (let i = 0; i < BISECTION_STEPS && hi - lo > 1e-14 * hi; i++) {
    const mid = (lo + hi) / 2;
    if (incompleteBeta(nu / (nu + mid * mid), nu / 2, 0.5) > tail) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

/** ln Γ(x), x > 0 (Lanczos; Numerical Recipes §6.1, gammln). */
function lnGamma(x: number): number {
  let y = x;
  const tmp = x + 5.5 - (x + 0.5) * Math.log(x + 5.5);
  let ser = 1.000000000190015;
  for (const c of LANCZOS) ser += c / ++y;
  return -tmp + Math.log((2.5066282746310005 * ser) / x);
}

/** The regularised incomplete beta function I_x(a, b) (Numerical Recipes §6.4, betai). */
function incompleteBeta(x: number, a: number, b: number): number {
  if (x <= 0) return 0;
  if (x >= 1) return 1;
  const front = Math.exp(lnGamma(a + b) - lnGamma(a) - lnGamma(b) + a * Math.log(x) + b * Math.log(1 - x));
  if (x < (a + 1) / (a + b + 2)) return (front * betaFraction(x, a, b)) / a;
  return 1 - (front * betaFraction(1 - x, b, a)) / b;
}

/** Continued fraction of I_x(a, b) by the modified Lentz method (Numerical Recipes §6.4, betacf). */
function betaFraction(x: number, a: number, b: number): number {
  const qab = a + b;
  const qap = a + 1;
  const qam = a - 1;
  let c = 1;
  let d = 1 - (qab * x) / qap;
  if (Math.abs(d) < CF_TINY) d = CF_TINY;
  d = 1 / d;
  let h = d;
  for (let m = 1; m <= CF_MAX_TERMS; m++) {
    const m2 = 2 * m;
    let aa = (m * (b - m) * x) / ((qam + m2) * (a + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < CF_TINY) d = CF_TINY;
    c = 1 + aa / c;
    if (Math.abs(c) < CF_TINY) c = CF_TINY;
    d = 1 / d;
    h *= d * c;
    aa = (-(a + m) * (qab + m) * x) / ((a + m2) * (qap + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < CF_TINY) d = CF_TINY;
    c = 1 + aa / c;
    if (Math.abs(c) < CF_TINY) c = CF_TINY;
    d = 1 / d;
    const del = d * c;
    h *= del;
    if (Math.abs(del - 1) < CF_EPS) break;
  }
  return h;
}
