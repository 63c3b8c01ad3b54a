/** A figure with 4 significant digits (no exponent between 1e-3 and 1e6); "∞" and "—" for none. */
export function formatFigure(value: number): string {
  if (Number.isNaN(value)) return "—";
  if (!Number.isFinite(value)) return value > 0 ? "∞" : "−∞";
  if (value === 0) return "0";
  const abs = Math.abs(value);
  if (abs >= 1e6 || abs < 1e-3) return value.toExponential(3).replace("e+", "e").replace("-", "−");
  return Number(value.toPrecision(4)).toLocaleString("en-GB", { maximumSignificantDigits: 4 }).replace("-", "−");
}

/** A figure with its unit when it has one: "4.1 %", "12.3 s", "0.86". */
export function formatWithUnit(value: number, unit: string): string {
  const text = formatFigure(value);
  if (text === "—" || unit === "" || unit === "–") return text;
  return unit === "%" ? `${text} %` : `${text} ${unit}`;
}

/** A percentage as read in a table: "< 0.1 %", "7.6 %", "120 %"; "—" for none. */
export function formatPercent(value: number): string {
  if (Number.isNaN(value)) return "—";
  if (!Number.isFinite(value)) return "∞ %";
  const abs = Math.abs(value);
  if (abs < 0.1) return "< 0.1 %";
  return `${abs < 10 ? abs.toFixed(1) : abs.toFixed(0)} %`;
}
