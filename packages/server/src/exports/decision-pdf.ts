import { CRITERIA, DEPLOYMENT_CAUTION, parameterColumn } from "@loopyard/core";
import type { DecisionEventDto, DecisionRecord, DesignCurves, ScoreValue } from "@loopyard/core";
import PDFDocument from "pdfkit";
import { drawPlot, type PlotSeries } from "./pdf-plot.js";
import { pdfText } from "./pdf-text.js";

/** Colours of the variants' curves, in family order (the record's own palette). */
const VARIANT_COLOURS = ["#1f5f8b", "#c2571a", "#2e7d4f", "#7b3f99", "#a3792c", "#3f6e73", "#b23a48", "#5a6b2d"];
const INK = "#1d252c";
const MUTED = "#5b6670";
const ACCENT = "#8a4b12";
const PAGE_MARGIN = 50;
const NUMBER_FONT = "Courier";
const TEXT_FONT = "Helvetica";
const BOLD_FONT = "Helvetica-Bold";

/** A number for the record: 6 significant digits, "inf"/"-inf", "–" where it does not apply. */
function num(value: ScoreValue | number | undefined): string {
  if (value === null || value === undefined || (typeof value === "number" && Number.isNaN(value))) return "–";
  if (value === "inf" || value === Number.POSITIVE_INFINITY) return "inf";
  if (value === "-inf" || value === Number.NEGATIVE_INFINITY) return "-inf";
  return Number((value as number).toPrecision(6)).toString();
}

/** What the audit summary lists when the decision's events are not given: the record's own dates. */
function recordEvents(record: DecisionRecord): string[] {
  const lines = [`Proposed by ${record.proposedBy.name} <${record.proposedBy.email}> at ${record.proposedAt}`];
  if (record.approvedBy && record.approvedAt) lines.push(`Approved by ${record.approvedBy.name} <${record.approvedBy.email}> at ${record.approvedAt}`);
  if (record.supersededBy && record.supersededAt) lines.push(`Superseded by decision ${record.supersededBy} at ${record.supersededAt}`);
  return lines;
}

function eventLine(event: DecisionEventDto): string {
  const who = `${event.actor.name}`;
  const change = event.fromState || event.toState ? ` (${event.fromState ?? "–"} -> ${event.toState ?? "–"})` : "";
  const comment = event.comment ? `: “${event.comment.length > 160 ? `${event.comment.slice(0, 157)}…` : event.comment}”` : "";
  return `${event.at}  ${event.kind} by ${who}${change}${comment}`;
}

/**
 * The decision record as a PDF (A4), drawn with pdfkit's standard fonts: the title, state, source
 * and people; the controller's parameters with their units; the rationale; the family's plant
 * revisions and the scenario; VECTOR plots (pdfkit paths, no images) of the step response y(t) of
 * every variant with the setpoint, and of |S(jω)| on log–log axes; the scores per variant and the
 * family's aggregate; the comparison's cross-score row when the design is a pick; the audit summary
 * (the decision's events when given, else the record's dates); the safety caution on every page.
 * Resolves to the file's bytes.
 */
export function renderDecisionPdf(record: DecisionRecord, curves: DesignCurves, audit?: readonly DecisionEventDto[]): Promise<Buffer> {
  const doc = new PDFDocument({
    size: "A4",
    margin: PAGE_MARGIN,
    bufferPages: true,
    info: { Title: pdfText(`Decision record: ${record.title}`), Author: pdfText(record.proposedBy.name), Subject: "Loopyard decision record", Creator: "Loopyard" },
  });
  const chunks: Buffer[] = [];
  doc.on("data", (chunk: Buffer) => chunks.push(chunk));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on("end", () => resolve(Buffer.concat(chunks)));
    doc.on("error", reject);
  });

  const width = doc.page.width - 2 * PAGE_MARGIN;
  const text = (value: string, options: PDFKit.Mixins.TextOptions = {}) => doc.text(pdfText(value), options);
  const ensure = (space: number) => {
    if (doc.y + space > doc.page.height - PAGE_MARGIN - 40) doc.addPage();
  };
  const heading = (title: string) => {
    ensure(60);
    doc.moveDown(0.8);
    doc.font(BOLD_FONT).fontSize(12).fillColor(ACCENT);
    text(title);
    const y = doc.y + 1;
    doc.lineWidth(0.6).strokeColor(ACCENT).moveTo(PAGE_MARGIN, y).lineTo(PAGE_MARGIN + width, y).stroke();
    doc.moveDown(0.4);
    doc.font(TEXT_FONT).fontSize(9.5).fillColor(INK);
  };
  /** A table: header row, then rows; column widths as fractions of the page width; numeric columns in Courier. */
  const table = (header: string[], rows: string[][], fractions: number[], numeric: (col: number) => boolean) => {
    const widths = fractions.map((f) => f * width);
    const row = (cells: string[], bold: boolean) => {
      doc.font(bold ? BOLD_FONT : TEXT_FONT).fontSize(8.5);
      const heights = cells.map((cell, i) => doc.heightOfString(pdfText(cell), { width: (widths[i] as number) - 6 }));
      const h = Math.max(12, ...heights) + 4;
      ensure(h);
      const top = doc.y;
      let x = PAGE_MARGIN;
      cells.forEach((cell, i) => {
        doc.font(bold ? BOLD_FONT : numeric(i) ? NUMBER_FONT : TEXT_FONT).fontSize(8.5).fillColor(bold ? MUTED : INK);
        doc.text(pdfText(cell), x + 3, top + 2, { width: (widths[i] as number) - 6, align: numeric(i) && !bold ? "right" : "left" });
        x += widths[i] as number;
      });
      doc.lineWidth(0.3).strokeColor("#c9ced3").moveTo(PAGE_MARGIN, top + h).lineTo(PAGE_MARGIN + width, top + h).stroke();
      doc.x = PAGE_MARGIN;
      doc.y = top + h;
    };
    row(header, true);
    for (const cells of rows) row(cells, false);
    doc.font(TEXT_FONT).fontSize(9.5).fillColor(INK);
  };

  // Title block.
  doc.font(TEXT_FONT).fontSize(8).fillColor(MUTED);
  text(`Loopyard decision record · ${record.workspace.name} · format ${record.format} v${record.version}`);
  doc.moveDown(0.3);
  doc.font(BOLD_FONT).fontSize(18).fillColor(INK);
  text(record.title);
  doc.font(TEXT_FONT).fontSize(9.5).fillColor(INK);
  doc.moveDown(0.3);
  text(`State: ${record.state}    Source: ${record.sourceLabel}`);
  text(`Proposed by ${record.proposedBy.name} at ${record.proposedAt}` + (record.approvedBy ? `; approved by ${record.approvedBy.name} at ${record.approvedAt}` : "; not approved"));
  text(`Family: ${record.family.name ?? record.family.key} (${record.family.variants.length} variant${record.family.variants.length === 1 ? "" : "s"})    Record written ${record.exportedAt}`);

  heading("Controller parameters");
  text(`Structure: ${record.structure.kind}${record.structure.controller.sampleTime ? `, sampled every ${record.structure.controller.sampleTime} s` : ", continuous"}`);
  doc.moveDown(0.3);
  table(
    ["parameter [unit]", "value", "tuned"],
    Object.entries(record.structure.parameters).map(([name, value]) => [parameterColumn(record.structure.kind, name), num(value), record.structure.tuned.includes(name) ? "tuned" : "fixed"]),
    [0.4, 0.35, 0.25],
    (col) => col === 1,
  );

  heading("Rationale");
  text(record.rationale || "(none given)", { width });

  heading("Family: plant revisions");
  table(
    ["variant", "plant", "revision", "model"],
    record.family.variants.map((v) => [v.label, v.plantName, `${v.revisionNumber} (${v.revisionName})`, `${v.model.kind}${v.parameters ? `, overrides ${Object.entries(v.parameters).map(([k, x]) => `${k} = ${num(x)}`).join(", ")}` : ""}`]),
    [0.22, 0.28, 0.25, 0.25],
    () => false,
  );

  heading("Scenario");
  const sc = record.scenario as { kind: string; horizon: number; dt: number; setpoint?: number; load?: { size: number; time: number }; noise?: { sd: number; seed: number } };
  text(
    `${sc.kind}, horizon ${num(sc.horizon)} s at dt = ${num(sc.dt)} s` +
      (sc.setpoint !== undefined ? `, setpoint step ${num(sc.setpoint)}` : "") +
      (sc.load ? `, load step ${num(sc.load.size)} at ${num(sc.load.time)} s` : "") +
      (sc.noise ? `, measurement noise sd ${num(sc.noise.sd)} (seed ${sc.noise.seed})` : "") +
      `; aggregate over the family: ${record.evaluation.aggregate.kind === "percentile" ? `${record.evaluation.aggregate.p}th percentile` : record.evaluation.aggregate.kind === "worst" ? "worst case" : "mean"}.`,
    { width },
  );

  // Plots: vector paths.
  const colour = (i: number) => VARIANT_COLOURS[i % VARIANT_COLOURS.length] as string;
  const legend = () => {
    doc.font(TEXT_FONT).fontSize(8);
    let x = PAGE_MARGIN + 50;
    const y = doc.y;
    curves.forEach((c, i) => {
      doc.lineWidth(1.5).strokeColor(colour(i)).moveTo(x, y + 4).lineTo(x + 14, y + 4).stroke();
      doc.fillColor(INK).text(pdfText(c.label + (c.reason ? ` (${c.reason})` : "")), x + 18, y, { lineBreak: false });
      x += 30 + doc.widthOfString(pdfText(c.label + (c.reason ? ` (${c.reason})` : "")));
    });
    doc.x = PAGE_MARGIN;
    doc.y = y + 14;
  };
  const plotBox = (title: string, draw: (left: number, top: number, w: number, h: number) => void) => {
    heading(title);
    ensure(210);
    const top = doc.y + 4;
    draw(PAGE_MARGIN + 50, top, width - 60, 150);
    doc.x = PAGE_MARGIN;
    doc.y = top + 180;
    legend();
  };
  plotBox("Step response per variant", (left, top, w, h) => {
    const series: PlotSeries[] = curves.flatMap((c, i) => [{ x: c.step.t, y: c.step.y, color: colour(i), label: c.label }]);
    if (curves[0]) series.push({ x: curves[0].step.t, y: curves[0].step.r, color: "#7d868f", dash: true, label: "setpoint" });
    drawPlot(doc, { left, top, width: w, height: h, xLabel: "t [s]", yLabel: "y [y]" }, series);
  });
  plotBox("Sensitivity |S(jw)| per variant (log axes)", (left, top, w, h) => {
    const series: PlotSeries[] = curves.map((c, i) => ({ x: c.sensitivity.omega, y: c.sensitivity.magnitude, color: colour(i), label: c.label }));
    drawPlot(doc, { left, top, width: w, height: h, xLabel: "w [rad/s]", yLabel: "|S(jw)| [–]", xLog: true, yLog: true }, series);
  });

  heading("Scores per variant");
  const variants = record.scores.variants;
  const fraction = 0.7 / (variants.length + 1);
  table(
    ["criterion [unit]", ...variants.map((v) => `${v.label}${v.status === "stable" ? "" : ` (${v.status})`}`), "family aggregate"],
    record.criteria.map((id, c) => [`${CRITERIA[id].label} [${CRITERIA[id].unit || "–"}]`, ...variants.map((v) => num(v.scores?.[c] ?? null)), num(record.scores.aggregate?.[c] ?? null)]),
    [0.3, ...variants.map(() => fraction), fraction],
    (col) => col > 0,
  );

  if (record.comparison) {
    const cmp = record.comparison;
    heading(`Comparison “${cmp.name}”: the pick of ${cmp.contender}`);
    table(
      ["column", "value", "regret [%]"],
      cmp.columns.map((key, k) => [key, num(cmp.values[k] ?? null), num(cmp.regrets[k] ?? null)]),
      [0.4, 0.3, 0.3],
      (col) => col > 0,
    );
    if (cmp.atBound.length > 0) text(`On a bound of the box: ${cmp.atBound.map((b) => `${b.parameter} (${b.bound})`).join(", ")}.`);
  }

  heading("Audit summary");
  for (const line of audit && audit.length > 0 ? audit.map(eventLine) : recordEvents(record)) {
    ensure(14);
    text(`• ${line}`, { width });
  }

  heading("Safety");
  doc.font(BOLD_FONT).fontSize(9.5).fillColor(ACCENT);
  text(record.caution || DEPLOYMENT_CAUTION, { width });

  // Footer on every page: the caution in one line and the page number.
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const bottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    doc.font(TEXT_FONT).fontSize(7).fillColor(MUTED);
    doc.text(pdfText(`${DEPLOYMENT_CAUTION}   Page ${i + 1} of ${range.count}`), PAGE_MARGIN, doc.page.height - 38, { width, align: "center" });
    doc.page.margins.bottom = bottom;
  }
  doc.end();
  return done;
}
