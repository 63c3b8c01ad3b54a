import { z } from "zod";
import { badRequest } from "../http/http-error.js";

/** A new revision (of a plant or a family) says what changed: a 400 on `note` otherwise. */
export function assertChangeNote(note: string | undefined): void {
  if (note === undefined || note.trim() === "") {
    throw badRequest("note: say what changed in this revision and why; a change note is required when revising.", "note");
  }
}

/** ?from=A&to=B: the two revision numbers a diff compares (to: the latest by default; from: the one before `to`). */
export const diffQuerySchema = z.object({
  from: z.coerce.number({ error: "give the revision to compare from as a number" }).int("give a whole revision number").min(1, "revisions start at 1").optional(),
  to: z.coerce.number({ error: "give the revision to compare to as a number" }).int("give a whole revision number").min(1, "revisions start at 1").optional(),
});

/** The revision numbers a diff compares when the query leaves them out: the latest and the one before it (itself for a first revision). */
export function diffNumbers(query: { from?: number | undefined; to?: number | undefined }, count: number): { from: number; to: number } {
  const to = query.to ?? count;
  return { from: query.from ?? Math.max(1, to - 1), to };
}

/** The 404 for a revision number a plant or family does not have. */
export function revisionRangeSentence(name: string, number: number, count: number): string {
  return `${name} has no revision ${number}; it has revisions 1 to ${count}.`;
}
