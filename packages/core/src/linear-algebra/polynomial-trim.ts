/**
 * Drops the leading zero coefficients of a polynomial given in descending powers of s:
 * `[0, 0, 2, 1]` (= 2s + 1) becomes `[2, 1]`. The zero polynomial becomes `[]`.
 *
 * coeffs: coefficients, descending powers, finite.
 */
export function trimLeadingZeros(coeffs: readonly number[]): number[] {
  let first = 0;
  while (first < coeffs.length && coeffs[first] === 0) first++;
  return coeffs.slice(first);
}

/** Throws a RangeError naming `name` unless every coefficient is a finite number. */
export function assertFiniteCoefficients(coeffs: readonly number[], name: string): void {
  if (!Array.isArray(coeffs)) throw new TypeError(`${name} must be an array of coefficients`);
  for (let i = 0; i < coeffs.length; i++) {
    if (typeof coeffs[i] !== "number" || !Number.isFinite(coeffs[i])) {
      throw new RangeError(`${name}[${i}] must be a finite number, got ${String(coeffs[i])}`);
    }
  }
}
