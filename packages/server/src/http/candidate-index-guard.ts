import type { RequestHandler } from "express";
import { HttpError } from "./http-error.js";

/** Largest candidate index (candidate.index is a PostgreSQL integer: 2³¹ − 1). */
export const MAX_CANDIDATE_INDEX = 2 ** 31 - 1;

/**
 * In front of the sweep routes under …/candidates/:index: an index that no candidate can have
 * (not a whole number from 0, or above MAX_CANDIDATE_INDEX, which PostgreSQL's integer cannot hold)
 * is a 404 saying so, before any query.
 */
export const candidateIndexGuard: RequestHandler = (req, _res, next) => {
  const text = typeof req.params.index === "string" ? req.params.index : "";
  const index = Number(text);
  if (!/^(0|[1-9][0-9]*)$/.test(text) || index > MAX_CANDIDATE_INDEX) {
    next(new HttpError(404, `“${text.slice(0, 40)}” is not a candidate index; indices are whole numbers from 0 to ${MAX_CANDIDATE_INDEX}.`));
    return;
  }
  next();
};
