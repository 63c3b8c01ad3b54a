/** One curve of a plot: points (x, y) joined by straight segments; a non-finite point breaks the line. */
export interface PlotSeries {
  x: readonly number[];
  y: readonly number[];
  color: string;
  dash?: boolean;
  label?: string;
}

export interface PlotFrame {
  /** Top-left corner and size of the plotting area [pt]. */
  left: number;
  top: number;
  width: number;
  height: number;
  xLabel: string;
  yLabel: string;
  xLog?: boolean;
  yLog?: boolean;
}

/** "Nice" linear ticks (1, 2, 5 × 10ⁿ) covering [lo, hi]: common practice for chart axes. */
export function linearTicks(lo: number, hi: number, target = 5): number[] {
  if (!(hi > lo)) return [lo];
  const raw = (hi - lo) / target;
  const power = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * power).find((s) => s >= raw) ?? 10 * power;
  const ticks: number[] = [];
  for (let v = Math.ceil(lo / step) * step; v <= hi + step * 1e-9; v += step) ticks.push(Math.abs(v) < step * 1e-9 ? 0 : v);
  return ticks;
}

function range(values: readonly number[], log: boolean): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (const v of values) {
    if (!Number.isFinite(v) || (log && v <= 0)) continue;
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  if (!(hi >= lo)) return log ? [0.1, 10] : [0, 1];
  if (log) return [10 ** Math.floor(Math.log10(lo)), 10 ** Math.ceil(Math.log10(hi))];
  if (hi === lo) return [lo - 1, hi + 1];
  const pad = 0.05 * (hi - lo);
  return [lo - pad, hi + pad];
}

function tickText(v: number): string {
  if (v === 0) return "0";
  const a = Math.abs(v);
  if (a >= 1e4 || a < 1e-3) return v.toExponential(0).replace("e+", "e");
  return Number(v.toPrecision(3)).toString();
}

/**
 * Draws a framed plot with VECTOR paths (pdfkit moveTo/lineTo, no image): axes with ticks (decades
 * on a log axis), labels, a grid and every series, clipped to the frame.
 */
export function drawPlot(doc: PDFKit.PDFDocument, frame: PlotFrame, series: readonly PlotSeries[]): void {
  const { left, top, width, height } = frame;
  const xLog = frame.xLog ?? false;
  const yLog = frame.yLog ?? false;
  const [x0, x1] = range(series.flatMap((s) => s.x), xLog);
  const [y0, y1] = range(series.flatMap((s) => s.y), yLog);
  const tx = (v: number) => (xLog ? Math.log10(v) : v);
  const ty = (v: number) => (yLog ? Math.log10(v) : v);
  const px = (v: number) => left + ((tx(v) - tx(x0)) / (tx(x1) - tx(x0))) * width;
  const py = (v: number) => top + height - ((ty(v) - ty(y0)) / (ty(y1) - ty(y0))) * height;
  const ticks = (lo: number, hi: number, log: boolean) => {
    if (!log) return linearTicks(lo, hi);
    const out: number[] = [];
    for (let e = Math.round(Math.log10(lo)); e <= Math.round(Math.log10(hi)); e++) out.push(10 ** e);
    return out;
  };
  doc.save();
  doc.lineWidth(0.4).strokeColor("#d5d9de");
  doc.font("Helvetica").fontSize(7).fillColor("#4a5560");
  for (const v of ticks(x0, x1, xLog)) {
    const x = px(v);
    doc.moveTo(x, top).lineTo(x, top + height).stroke();
    doc.text(tickText(v), x - 20, top + height + 3, { width: 40, align: "center", lineBreak: false });
  }
  for (const v of ticks(y0, y1, yLog)) {
    const y = py(v);
    doc.moveTo(left, y).lineTo(left + width, y).stroke();
    doc.text(tickText(v), left - 44, y - 3, { width: 40, align: "right", lineBreak: false });
  }
  doc.lineWidth(0.8).strokeColor("#39424b").rect(left, top, width, height).stroke();
  doc.fontSize(8).fillColor("#1d252c");
  doc.text(frame.xLabel, left, top + height + 14, { width, align: "center", lineBreak: false });
  doc.save();
  doc.rotate(-90, { origin: [left - 48, top + height / 2] });
  doc.text(frame.yLabel, left - 48 - height / 2, top + height / 2 - 4, { width: height, align: "center", lineBreak: false });
  doc.restore();
  doc.rect(left, top, width, height).clip();
  for (const s of series) {
    doc.lineWidth(1.1).strokeColor(s.color);
    if (s.dash) doc.dash(3, { space: 2 });
    else doc.undash();
    let open = false;
    for (let i = 0; i < s.x.length; i++) {
      const xv = s.x[i] as number;
      const yv = s.y[i] as number;
      const ok = Number.isFinite(xv) && Number.isFinite(yv) && (!xLog || xv > 0) && (!yLog || yv > 0);
      if (!ok) {
        if (open) doc.stroke();
        open = false;
        continue;
      }
      if (open) doc.lineTo(px(xv), py(yv));
      else doc.moveTo(px(xv), py(yv));
      open = true;
    }
    if (open) doc.stroke();
  }
  doc.undash();
  doc.restore();
}
