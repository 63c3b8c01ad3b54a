import type { TransferFunctionPlant } from "@loopyard/core";

const SUPERSCRIPT_DIGITS = "⁰¹²³⁴⁵⁶⁷⁸⁹";
const MINUS = "−";

function superscript(n: number): string {
  return String(n)
    .split("")
    .map((d) => SUPERSCRIPT_DIGITS[Number(d)])
    .join("");
}

/** The magnitude of a coefficient as short text: integers as is, others to 6 significant digits, without trailing zeros. */
export function formatMagnitude(value: number): string {
  if (Number.isInteger(value) && Math.abs(value) < 1e9) return String(Math.abs(value));
  const text = Math.abs(value).toPrecision(6);
  return text.includes("e") ? text.replace(/\.?0+e/, "e") : text.replace(/\.?0+$/, "");
}

/** A coefficient with its sign as short text: −1 → "−1" (typographic minus), 2.50 → "2.5". */
export function formatCoefficient(value: number): string {
  return `${value < 0 ? MINUS : ""}${formatMagnitude(value)}`;
}

/** s to a power: "", "s", "s²", "s¹⁰". */
function power(exponent: number): string {
  if (exponent === 0) return "";
  if (exponent === 1) return "s";
  return `s${superscript(exponent)}`;
}

/**
 * A polynomial in s from coefficients in descending powers: [1, 3, 2] → "s² + 3s + 2",
 * [2, 0, -1] → "2s² − 1". Zero terms are left out; the zero polynomial is "0".
 */
export function formatPolynomial(coeffs: readonly number[]): string {
  const degree = coeffs.length - 1;
  const terms: { negative: boolean; body: string }[] = [];
  coeffs.forEach((c, i) => {
    if (c === 0) return;
    const exponent = degree - i;
    const magnitude = Math.abs(c);
    const factor = magnitude === 1 && exponent > 0 ? "" : formatMagnitude(c);
    terms.push({ negative: c < 0, body: `${factor}${power(exponent)}` });
  });
  if (terms.length === 0) return "0";
  return terms
    .map((term, i) => (i === 0 ? `${term.negative ? MINUS : ""}${term.body}` : `${term.negative ? ` ${MINUS} ` : " + "}${term.body}`))
    .join("");
}

/** The dead-time factor, "e^(−1.5s)", or "" without dead time. */
export function formatDelay(delay: number): string {
  return delay > 0 ? `e^(${MINUS}${formatMagnitude(delay)}s)` : "";
}

function grouped(text: string): string {
  return /[+−]/.test(text.slice(1)) ? `(${text})` : text;
}

/** The whole plant on one line: "G(s) = 1.5 / (80s² + 24s + 1) · e^(−1s)". */
export function formatTransferFunction(plant: Pick<TransferFunctionPlant, "num" | "den" | "delay">): string {
  const ratio = `${grouped(formatPolynomial(plant.num))} / ${grouped(formatPolynomial(plant.den))}`;
  const delay = formatDelay(plant.delay);
  return `G(s) = ${ratio}${delay ? ` · ${delay}` : ""}`;
}

/** Coefficients as stored, each with its sign: [5, −1] → "[5, −1]". */
export function coefficientList(values: readonly number[]): string {
  return `[${values.map(formatCoefficient).join(", ")}]`;
}
