import { DISCRETIZATION_METHODS, FIXED_POINT_FORMATS, planSweep, recordDesign } from "@loopyard/core";
import type { DecisionRecord, DeploymentDesign, DeploymentSheetDto, DeploymentSheetRequest } from "@loopyard/core";
import { z } from "zod";
import { limitExceeded, type Compute } from "../compute/compute.js";
import type { Database } from "../db/database.js";
import { HttpError, notFound } from "../http/http-error.js";
import { findCandidate } from "../sweeps/candidate-repository.js";
import { loadSweepModels } from "../sweeps/sweep-evaluation.js";
import { getSweep } from "../sweeps/sweep-service.js";
import type { MemberAccess } from "../workspaces/require-member.js";

/**
 * ?sampleTime=&method=&format= of a sheet request. sampleTime is in seconds (omitted: the design's
 * own sample time when it has one); method tustin (default) or backward-euler; format q15 or q31
 * (omitted: no fixed point).
 */
export const sheetQuerySchema = z.object({
  sampleTime: z
    .string({ error: "give the sample time once, in seconds" })
    .optional()
    .transform((value, ctx) => {
      if (value === undefined || value.trim() === "") return undefined;
      const number = Number(value);
      if (!Number.isFinite(number) || number <= 0) {
        ctx.addIssue({ code: "custom", message: `the sample time must be a number of seconds greater than 0 (e.g. 0.001 for 1 kHz); got “${value}”` });
        return z.NEVER;
      }
      return number;
    }),
  method: z.enum(DISCRETIZATION_METHODS, { error: "choose tustin or backward-euler" }).default("tustin"),
  format: z.enum(Object.keys(FIXED_POINT_FORMATS) as ["q15", "q31"], { error: "choose q15 or q31, or leave the format out" }).optional(),
});

export type SheetQuery = z.output<typeof sheetQuerySchema>;

/**
 * The deployment sheet of any design (a sweep candidate here; a decision's through the same
 * function), built by core buildDeploymentSheet on the server's compute pool under its work budget
 * and time limit. A request core refuses is answered with core's sentence: 400 for a value that is
 * never valid, 422 for one that does not suit this design (too coarse, too many samples, unstable
 * sampled loop); past a limit 422.
 */
export async function sheetOfDesign(compute: Compute, design: DeploymentDesign, query: SheetQuery): Promise<DeploymentSheetDto> {
  const sampleTime = query.sampleTime ?? design.controller.sampleTime;
  if (sampleTime === undefined) {
    throw new HttpError(400, "Give the sample time the firmware runs at, in seconds: ?sampleTime=0.001 for 1 kHz.", { field: "sampleTime", issues: [{ field: "sampleTime", message: "sampleTime is required" }] });
  }
  const request: DeploymentSheetRequest = { sampleTime, method: query.method, format: query.format ?? null };
  const outcome = await compute.run("deploymentSheet", { design, request });
  if (outcome.ok) return outcome.value;
  const limited = limitExceeded(outcome, "This deployment sheet", "choose a longer sample time, or a design with a shorter scenario horizon.");
  if (limited) throw limited;
  const status = outcome.error === "DeploymentSheetInvalid" ? 400 : 422;
  const field = outcome.field;
  throw new HttpError(status, outcome.reason, field ? { field, issues: [{ field, message: outcome.reason }] } : {});
}

/** The design of one evaluated candidate of a sweep: its family's plants, its controller, the sweep's scenario and criteria. */
export async function candidateDesign(db: Database, access: MemberAccess, sweepId: string, index: number): Promise<DeploymentDesign> {
  const sweep = await getSweep(db, access, sweepId);
  const stored = await findCandidate(db, sweepId, index);
  if (!stored) {
    throw notFound(
      index < sweep.total
        ? `Candidate ${index} of this sweep has not been evaluated yet; try again when the sweep has progressed.`
        : `This sweep has candidates 0 to ${sweep.total - 1}; there is no candidate ${index}.`,
    );
  }
  const plan = planSweep(sweep.definition, await loadSweepModels(db, sweep.definition));
  return {
    variants: plan.family.map((plant, i) => {
      const v = sweep.family[i];
      return {
        label: v?.label ?? `variant ${i + 1}`,
        plant,
        revision: v ? { plantId: v.plantId, plantName: v.plantName, revisionId: v.revisionId, revisionNumber: v.revisionNumber } : null,
      };
    }),
    controller: plan.controllerFromParameters(stored.params),
    scenario: plan.scenario,
    criteria: [...plan.criteria],
    ...(plan.evaluation.criterion ? { criterionOptions: plan.evaluation.criterion } : {}),
    aggregate: plan.aggregate,
  };
}

/** GET …/sweeps/:sweepId/candidates/:index/sheet */
export async function getCandidateSheet(db: Database, compute: Compute, access: MemberAccess, sweepId: string, index: number, query: SheetQuery): Promise<DeploymentSheetDto> {
  return sheetOfDesign(compute, await candidateDesign(db, access, sweepId, index), query);
}

/** A decision's deployment sheet (GET …/decisions/:id/sheet): the sheet of the design its record holds. */
export async function decisionSheet(compute: Compute, record: DecisionRecord, query: SheetQuery): Promise<DeploymentSheetDto> {
  return sheetOfDesign(compute, recordDesign(record), query);
}
