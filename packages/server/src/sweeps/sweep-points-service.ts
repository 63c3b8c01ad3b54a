import { encodePointsBinary, type CriterionId, type PointsHeader, type SweepDetailDto } from "@loopyard/core";
import type { Database } from "../db/database.js";
import type { MemberAccess } from "../workspaces/require-member.js";
import { finiteCriteria, pointColumnsBytes, pointColumnsText } from "./points-repository.js";
import { CANDIDATE_LIST_LIMIT, frontAxis, frontOf, getSweep } from "./sweep-service.js";

/** Significant digits of the numbers of PointsDto: enough to draw (a 4000-pixel axis needs 4). */
export const POINT_DIGITS = 6;

/** PostgreSQL's text of a number array ('{1.5,2e-07}') as a JSON array. */
const jsonArray = (text: string) => `[${text.slice(1, -1)}]`;

/** What both forms of the points read first: the sweep, the axes, the sample rule and the plottable criteria. */
async function pointsQuery(db: Database, sweep: SweepDetailDto, query: { x?: string; y?: string }) {
  const { criteria } = sweep;
  const x = frontAxis("x", query.x, criteria, criteria[0] as CriterionId);
  const y = frontAxis("y", query.y, criteria, criteria[criteria.length - 1] as CriterionId);
  const sampled = sweep.done > CANDIDATE_LIST_LIMIT;
  const front = sampled ? await frontOf(db, sweep, { x, y }) : null;
  const columns = {
    xAt: criteria.indexOf(x),
    yAt: criteria.indexOf(y),
    paramAt: sweep.swept.map((name) => sweep.parameters.indexOf(name)),
    ...(front ? { stride: Math.ceil(sweep.done / CANDIDATE_LIST_LIMIT), extra: front.indices } : {}),
  };
  return { x, y, sampled, columns };
}

/**
 * The binary form of the points (core POINTS_BINARY_TYPE, encodePointsBinary): the same content as
 * getPointsJson, with the numbers exact and nothing printed, for the web app's chart.
 */
export async function getPointsBinary(db: Database, access: MemberAccess, sweepId: string, query: { x?: string; y?: string }): Promise<Uint8Array> {
  return pointsBinaryOf(db, await getSweep(db, access, sweepId), query);
}

/** getPointsBinary of a sweep already read. */
export async function pointsBinaryOf(db: Database, sweep: SweepDetailDto, query: { x?: string; y?: string }): Promise<Uint8Array> {
  const { x, y, sampled, columns } = await pointsQuery(db, sweep, query);
  const [bytes, finite] = await Promise.all([pointColumnsBytes(db, sweep.id, columns), finiteCriteria(db, sweep.id, sweep.criteria.length)]);
  const header: PointsHeader = {
    x,
    y,
    total: sweep.done,
    sampled,
    plottable: sweep.criteria.filter((_, i) => finite[i]),
    count: bytes.count,
    paramCount: bytes.params.length,
  };
  return encodePointsBinary(header, bytes);
}

/**
 * The JSON text of a PointsDto, the cloud of a front chart in columns: the stable candidates with finite aggregate x
 * and y scores (defaults and 400s as for the front), their swept parameters, and the plottable
 * criteria. Over CANDIDATE_LIST_LIMIT stored candidates: every ⌈done / limit⌉-th index, the rule of
 * the candidate list, plus every candidate of the front on these axes, so the front is always drawn.
 */
export async function getPointsJson(db: Database, access: MemberAccess, sweepId: string, query: { x?: string; y?: string }): Promise<string> {
  return pointsJsonOf(db, await getSweep(db, access, sweepId), query);
}

/** getPointsJson of a sweep already read. */
export async function pointsJsonOf(db: Database, sweep: SweepDetailDto, query: { x?: string; y?: string }): Promise<string> {
  const { x, y, sampled, columns: options } = await pointsQuery(db, sweep, query);
  const [columns, finite] = await Promise.all([
    pointColumnsText(db, sweep.id, { ...options, digits: POINT_DIGITS }),
    finiteCriteria(db, sweep.id, sweep.criteria.length),
  ]);
  // The JSON text of a PointsDto, written from PostgreSQL's text of the arrays (no number parsed or printed here).
  return (
    `{"x":${JSON.stringify(x)},"y":${JSON.stringify(y)},"total":${sweep.done},"sampled":${sampled},` +
    `"indices":${jsonArray(columns.indices)},"xs":${jsonArray(columns.xs)},"ys":${jsonArray(columns.ys)},` +
    `"params":[${columns.params.map(jsonArray).join(",")}],"plottable":${JSON.stringify(sweep.criteria.filter((_, i) => finite[i]))}}`
  );
}
