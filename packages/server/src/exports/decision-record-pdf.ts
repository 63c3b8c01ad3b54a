import { recordDesign } from "@loopyard/core";
import type { DecisionEventDto, DecisionRecord } from "@loopyard/core";
import { limitExceeded, type Compute } from "../compute/compute.js";
import { HttpError } from "../http/http-error.js";
import { renderDecisionPdf } from "./decision-pdf.js";

/**
 * The PDF of a decision record: the design's curves computed on the compute pool (core
 * designCurves of recordDesign, under its work budget and time limit), then drawn by
 * renderDecisionPdf with the audit trail when given. 422 past a limit, 409 when core refuses the
 * record's design (a plant revision that no longer reads, …).
 */
export async function decisionRecordPdf(compute: Compute, record: DecisionRecord, audit?: readonly DecisionEventDto[]): Promise<Buffer> {
  const outcome = await compute.run("designCurves", { design: recordDesign(record) });
  if (!outcome.ok) {
    throw (
      limitExceeded(outcome, "Drawing this decision's curves", "download its record as JSON instead.") ??
      new HttpError(409, `This decision's curves could not be computed (${outcome.reason}); download its record as JSON instead.`)
    );
  }
  return renderDecisionPdf(record, outcome.value, audit);
}
