import { z } from "zod";
import { badRequest } from "../http/http-error.js";

/** A new revision (of a plant or a family) says what changed: a 400 on `note` otherwise. */
export function assertChangeNote(note: string | undefined): void {
  if (note === undefined || note.trim() === "") {
    throw badRequest("note: say what changed in this revision and why; a change note is required when revising.", "note");
  }
}

/** ?from=A&to=B: the two revision numbers a diff compares. */
export const diffQuerySchema = z.object({
  from: z.coerce.number({ error: "give the revision to compare from as a number" }).int("give a whole revision number").min(1, "revisions start at 1"),
  to: z.coerce.number({ error: "give the revision to compare to as a number" }).int("give a whole revision number").min(1, "revisions start at 1"),
});

/** The 404 for a revision number a plant or family does not have. */
export function revisionRangeSentence(name: string, number: number, count: number): string {
  return `${name} has no revision ${number}; it has revisions 1 to ${count}.`;
}
