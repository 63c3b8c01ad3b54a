/**
 * `count` samples of white Gaussian noise with standard deviation `sd`, reproducible from `seed`.
 *
 * Uniforms from mulberry32 (a 32-bit generator by T. Ettinger, 2017, public domain; common
 * practice in JavaScript), turned into normal deviates by the Box–Muller transform
 * z = √(−2 ln u₁)·cos(2π u₂) (G. E. P. Box and M. E. Muller, Ann. Math. Statist. 29(2), 610–611, 1958);
 * u₁ ∈ (0, 1] so the logarithm stays finite. The same seed always gives the same sequence, on
 * every platform (integer arithmetic with Math.imul).
 *
 * seed: any integer (taken modulo 2³²); sd: ≥ 0 [y]. Throws a RangeError naming the argument.
 */
export function gaussianNoise(seed: number, sd: number, count: number): Float64Array {
  if (!Number.isInteger(seed)) throw new RangeError(`noise.seed must be a whole number, got ${seed}`);
  if (!(sd >= 0) || !Number.isFinite(sd)) throw new RangeError(`noise.sd must be a finite number ≥ 0, got ${sd}`);
  const out = new Float64Array(count);
  let state = seed >>> 0;
  const next = (): number => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  for (let k = 0; k < count; k++) {
    const u1 = 1 - next();
    const u2 = next();
    out[k] = sd * Math.sqrt(-2 * Math.log(u1)) * Math.cos(2 * Math.PI * u2);
  }
  return out;
}
