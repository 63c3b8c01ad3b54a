import type { DeploymentSheetDto, DiscretizationMethod, FixedPointFormat, ScoreValue } from "@loopyard/core";

/** What the reader of a sheet chooses. */
export interface SheetSettings {
  sampleTime: number;
  method: DiscretizationMethod;
  format: FixedPointFormat | null;
}

/** The sheet a firmware team asks for first: 1 kHz, Tustin, no fixed point. */
export const DEFAULT_SHEET_SETTINGS: SheetSettings = { sampleTime: 0.001, method: "tustin", format: null };

/** Settings from the page's search parameters (unknown values fall back to the defaults; the server checks the sample time). */
export function sheetSettingsFrom(params: URLSearchParams): SheetSettings {
  const h = Number(params.get("sampleTime"));
  const method = params.get("method");
  const format = params.get("format");
  return {
    sampleTime: params.has("sampleTime") && params.get("sampleTime") !== "" ? h : DEFAULT_SHEET_SETTINGS.sampleTime,
    method: method === "backward-euler" ? "backward-euler" : "tustin",
    format: format === "q15" || format === "q31" ? format : null,
  };
}

/** The query string of the sheet endpoint and of the page's address. */
export function sheetQuery(settings: SheetSettings): string {
  const q = new URLSearchParams({ sampleTime: String(settings.sampleTime), method: settings.method });
  if (settings.format) q.set("format", settings.format);
  return q.toString();
}

/** A score as a number (NaN where it does not apply, ±Infinity for "inf"/"-inf"). */
export function scoreNumber(value: ScoreValue | undefined): number {
  if (value === "inf") return Number.POSITIVE_INFINITY;
  if (value === "-inf") return Number.NEGATIVE_INFINITY;
  return typeof value === "number" ? value : Number.NaN;
}

/** Relative change (b − a)/|a| in per cent; NaN when either is not finite or a = 0 with b ≠ a. */
export function changePercent(a: number, b: number): number {
  if (!Number.isFinite(a) || !Number.isFinite(b)) return Number.NaN;
  if (a === b) return 0;
  if (a === 0) return Number.NaN;
  return (100 * (b - a)) / Math.abs(a);
}

/** One row of the before/after table: a criterion on one variant, continuous, sampled, rounded, and the changes. */
export interface CriterionChangeRow {
  variant: string;
  criterion: string;
  unit: string;
  continuous: number;
  sampled: number;
  rounded: number | null;
  /** Sampled against continuous, and rounded against sampled [%]. */
  samplingChange: number;
  roundingChange: number | null;
}

/**
 * The before/after rows of a sheet: every variant × every criterion (then the family's aggregate),
 * with what sampling did (sampled vs continuous) and what rounding did (rounded vs sampled).
 */
export function criterionChangeRows(sheet: DeploymentSheetDto): CriterionChangeRow[] {
  const rows: CriterionChangeRow[] = [];
  const add = (variant: string, continuous: (k: number) => number, sampled: (k: number) => number, rounded: ((k: number) => number) | null) => {
    sheet.criteria.forEach((c, k) => {
      const r = rounded ? rounded(k) : null;
      rows.push({
        variant,
        criterion: c.label,
        unit: c.unit,
        continuous: continuous(k),
        sampled: sampled(k),
        rounded: r,
        samplingChange: changePercent(continuous(k), sampled(k)),
        roundingChange: r === null ? null : changePercent(sampled(k), r),
      });
    });
  };
  for (const v of sheet.variants) {
    add(
      v.label,
      (k) => scoreNumber(v.continuous.scores?.[k] ?? null),
      (k) => scoreNumber(v.sampled?.scores?.[k] ?? null),
      sheet.fixedPoint ? (k) => scoreNumber(v.rounded?.scores?.[k] ?? null) : null,
    );
  }
  if (sheet.variants.length > 1) {
    const a = sheet.aggregate;
    const rounded = a.rounded;
    add("family", (k) => scoreNumber(a.continuous[k]), (k) => scoreNumber(a.sampled[k]), rounded ? (k) => scoreNumber(rounded[k]) : null);
  }
  return rows;
}
