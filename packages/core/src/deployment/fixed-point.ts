import { DISCRETE_PID_COEFFICIENTS, type DiscretePid, type DiscretePidCoefficients } from "./discrete-pid.js";

/** Fixed-point formats: signed fractions with 15 or 31 fractional bits (16- and 32-bit words). */
export const FIXED_POINT_FORMATS = { q15: 15, q31: 31 } as const;
export type FixedPointFormat = keyof typeof FIXED_POINT_FORMATS;

/**
 * How coefficients are scaled into the format: each coefficient c is stored as an integer
 * mantissa m with c ≈ m·2^(e − F) (F the fractional bits, e the coefficient's exponent, a shift
 * the firmware applies after the multiply).
 * - "per-coefficient" (default): each its own exponent, the smallest with |c| < 2^e, so every
 *   coefficient keeps the full F bits;
 * - { exponent }: one exponent for all (a common Q format, e.g. 0 for plain Qn); coefficients that
 *   do not fit saturate and are reported.
 */
export type FixedPointScaling = "per-coefficient" | { exponent: number };

export interface FixedPointOptions {
  format: FixedPointFormat;
  scaling?: FixedPointScaling;
}

/** One coefficient in fixed point. */
export interface FixedPointCoefficient {
  name: keyof DiscretePidCoefficients;
  exact: number;
  /** The stored integer, −2^F ≤ m ≤ 2^F − 1. */
  mantissa: number;
  /** The exponent e: value = mantissa·2^(e − F). */
  exponent: number;
  rounded: number;
  /** rounded − exact. */
  error: number;
  /** The coefficient did not fit and was clipped to the largest stored value. */
  saturated: boolean;
  /** A non-zero coefficient rounded to zero. */
  underflow: boolean;
}

/** What rounding to fixed point did, coefficient by coefficient. */
export interface FixedPointReport {
  format: FixedPointFormat;
  fractionalBits: number;
  scaling: FixedPointScaling;
  coefficients: FixedPointCoefficient[];
  /** Names of the coefficients that saturated or underflowed (empty when none did). */
  saturated: (keyof DiscretePidCoefficients)[];
  underflowed: (keyof DiscretePidCoefficients)[];
}

/** Exponents allowed for a common scaling (a shift within a 64-bit accumulator). */
const MAX_EXPONENT = 32;

/**
 * Rounds a discrete PID's coefficients to a fixed-point format: m = round(c·2^(F − e)) (half away
 * from zero), clipped to [−2^F, 2^F − 1], stored value m·2^(e − F). Limits and states are not
 * rounded (they are in engineering units). Returns the PID with the rounded coefficients, and the
 * report naming every coefficient that saturated or rounded to zero — never silently.
 * Rounding error per coefficient: |error| ≤ 2^(e − F − 1) unless saturated.
 * Reference: common practice for Qm.n arithmetic (e.g. R. Yates, "Fixed-point arithmetic: an
 * introduction", Digital Signal Labs, 2013).
 */
export function roundToFixedPoint(pid: DiscretePid, options: FixedPointOptions): { pid: DiscretePid; report: FixedPointReport } {
  const bits = FIXED_POINT_FORMATS[options.format];
  if (bits === undefined) throw new RangeError(`format must be q15 or q31, got "${String(options.format)}"`);
  const scaling = options.scaling ?? "per-coefficient";
  if (scaling !== "per-coefficient") {
    if (!Number.isInteger(scaling.exponent) || Math.abs(scaling.exponent) > MAX_EXPONENT) {
      throw new RangeError(`scaling.exponent must be a whole number from −${MAX_EXPONENT} to ${MAX_EXPONENT}, got ${scaling.exponent}`);
    }
  }
  const full = 2 ** bits;
  const coefficients: FixedPointCoefficient[] = [];
  const rounded = { ...pid.coefficients };
  for (const name of DISCRETE_PID_COEFFICIENTS) {
    const exact = pid.coefficients[name];
    let exponent = scaling === "per-coefficient" ? naturalExponent(exact) : scaling.exponent;
    let mantissa = roundHalfAway(exact * 2 ** (bits - exponent));
    if (scaling === "per-coefficient" && mantissa === full) {
      exponent += 1; // rounding reached 1.0: one more bit of range
      mantissa = roundHalfAway(exact * 2 ** (bits - exponent));
    }
    let saturated = false;
    if (mantissa > full - 1) {
      mantissa = full - 1;
      saturated = true;
    } else if (mantissa < -full) {
      mantissa = -full;
      saturated = true;
    }
    const value = mantissa * 2 ** (exponent - bits);
    rounded[name] = value;
    coefficients.push({ name, exact, mantissa, exponent, rounded: value, error: value - exact, saturated, underflow: exact !== 0 && mantissa === 0 });
  }
  return {
    pid: { ...pid, coefficients: rounded },
    report: {
      format: options.format,
      fractionalBits: bits,
      scaling,
      coefficients,
      saturated: coefficients.filter((c) => c.saturated).map((c) => c.name),
      underflowed: coefficients.filter((c) => c.underflow).map((c) => c.name),
    },
  };
}

/** The smallest exponent e with |c| < 2^e (0 for c = 0). */
function naturalExponent(c: number): number {
  if (c === 0) return 0;
  let e = Math.floor(Math.log2(Math.abs(c))) + 1;
  if (Math.abs(c) >= 2 ** e) e += 1;
  if (Math.abs(c) < 2 ** (e - 1)) e -= 1;
  return e;
}

function roundHalfAway(x: number): number {
  return Math.sign(x) * Math.floor(Math.abs(x) + 0.5);
}
