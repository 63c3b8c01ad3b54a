import type { ErrorRequestHandler, RequestHandler } from "express";
import { z } from "zod";
import { HttpError } from "./http-error.js";
import { zodToHttpError } from "./validation.js";

/** Error shape body-parser attaches to what it throws. */
interface BodyParserError {
  type?: string;
  status?: number;
}

function isBodyParserError(error: unknown): error is BodyParserError {
  return typeof error === "object" && error !== null && "type" in error && typeof (error as BodyParserError).type === "string";
}

function toHttpError(error: unknown, bodyLimit: string): HttpError | null {
  if (error instanceof HttpError) return error;
  if (error instanceof z.ZodError) return zodToHttpError(error);
  if (isBodyParserError(error)) {
    switch (error.type) {
      case "entity.parse.failed":
        return new HttpError(400, "The request body is not valid JSON.");
      case "entity.too.large":
        return new HttpError(413, `The request body is larger than the ${bodyLimit} allowed.`);
      case "encoding.unsupported":
      case "charset.unsupported":
        return new HttpError(415, "Send the request body as UTF-8 JSON.");
      default:
        if (error.status !== undefined && error.status >= 400 && error.status < 500) {
          return new HttpError(400, "The request body could not be read.");
        }
    }
  }
  return null;
}

/** The one error middleware: known errors become their status and sentence, the rest a logged 500. */
export function errorMiddleware(bodyLimit: string): ErrorRequestHandler {
  return (error, req, res, next) => {
    if (res.headersSent) {
      next(error);
      return;
    }
    const known = toHttpError(error, bodyLimit);
    if (known) {
      res.status(known.status).json({ error: known.toBody() });
      return;
    }
    console.error(`[loopyard] ${req.method} ${req.originalUrl} failed:`, error);
    res.status(500).json({ error: { message: "Something went wrong on the server; try again, and tell your admin if it keeps happening." } });
  };
}

/** 404 for any /api path no route answered. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new HttpError(404, `There is no API endpoint ${req.method} ${req.baseUrl}${req.path}.`));
};
