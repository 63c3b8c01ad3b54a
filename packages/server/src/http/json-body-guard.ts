import type { RequestHandler } from "express";
import { isWellFormedText } from "@loopyard/core";
import { badRequest } from "./http-error.js";
import { issuePath } from "./validation.js";

/** Deepest nesting of arrays and objects a request body may have (the deepest API input, a sweep, needs 6). */
export const MAX_BODY_DEPTH = 32;

/** A string or key no request body may carry, whatever the field: what PostgreSQL's text and jsonb cannot store. */
function unstorable(text: string): string | null {
  if (text.includes("\u0000")) return "holds a NUL character (U+0000)";
  if (!isWellFormedText(text)) return "holds a lone UTF-16 surrogate (a broken character)";
  return null;
}

/**
 * The first problem of a parsed JSON body, walked without recursion (so that 10,000 nested arrays
 * cannot exhaust the stack): nesting deeper than MAX_BODY_DEPTH, or a string or key PostgreSQL could
 * not store. Returns the sentence of the 400, or null when the body is fine.
 */
export function bodyProblem(body: unknown): { field: string; message: string } | null {
  const stack: { value: unknown; path: (string | number)[] }[] = [{ value: body, path: [] }];
  while (stack.length > 0) {
    const { value, path } = stack.pop()!;
    if (typeof value === "string") {
      const problem = unstorable(value);
      if (problem) return { field: issuePath(path), message: `${issuePath(path) || "The body"} ${problem}; remove it.` };
      continue;
    }
    if (typeof value !== "object" || value === null) continue;
    if (path.length >= MAX_BODY_DEPTH) {
      return { field: issuePath(path.slice(0, 8)), message: `The request body is nested deeper than ${MAX_BODY_DEPTH} levels; no Loopyard request needs that.` };
    }
    if (Array.isArray(value)) {
      for (let i = value.length - 1; i >= 0; i -= 1) stack.push({ value: value[i], path: [...path, i] });
    } else {
      for (const [key, item] of Object.entries(value)) {
        const problem = unstorable(key);
        if (problem) return { field: issuePath(path), message: `A field name in ${issuePath(path) || "the body"} ${problem}; remove it.` };
        stack.push({ value: item, path: [...path, key] });
      }
    }
  }
  return null;
}

/** After express.json(): refuses bodies bodyProblem finds fault with, with a 400 naming the field. */
export const jsonBodyGuard: RequestHandler = (req, _res, next) => {
  const problem = req.body === undefined ? null : bodyProblem(req.body);
  next(problem ? badRequest(problem.message, problem.field || undefined) : undefined);
};
