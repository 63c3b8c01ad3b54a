import type { RequestHandler } from "express";
import { hasForbiddenControl } from "@loopyard/core";
import { badRequest } from "./http-error.js";

/**
 * Refuses, before any router sees it, an address that cannot name anything: a malformed
 * percent-escape (e.g. `%E0%A4%A`, or `%ED%A0%80`, a lone surrogate in UTF-8) or an escaped control
 * character (e.g. `%00`, which PostgreSQL would refuse in a query). 400 with a sentence.
 */
export const urlGuard: RequestHandler = (req, _res, next) => {
  let decoded: string;
  try {
    decoded = decodeURIComponent(req.originalUrl);
  } catch {
    next(badRequest("The address holds a malformed percent-escape (a % not followed by two hex digits of valid UTF-8); correct the link."));
    return;
  }
  if (hasForbiddenControl(decoded)) {
    next(badRequest("The address holds a control character (such as %00); correct the link."));
    return;
  }
  next();
};
