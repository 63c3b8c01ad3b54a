/**
 * A number for a table cell or a label: 4 significant digits, exponent notation outside
 * [1e-3, 1e5), "−" for the minus sign, "—" for a missing or non-finite value.
 */
export function formatNumber(value: number | null | undefined, digits = 4): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "—";
  if (value === 0) return "0";
  const magnitude = Math.abs(value);
  let text: string;
  if (magnitude >= 1e5 || magnitude < 1e-3) {
    text = value.toExponential(digits - 1).replace(/\.?0+e/, "e").replace("e+", "e");
  } else {
    text = value.toPrecision(digits);
    if (text.includes(".")) text = text.replace(/\.?0+$/, "");
  }
  return text.replace(/-/g, "−");
}
