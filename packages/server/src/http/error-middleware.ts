import type { ErrorRequestHandler, RequestHandler } from "express";
import { z } from "zod";
import { HttpError } from "./http-error.js";
import { zodToHttpError } from "./validation.js";
import { databaseFailure } from "./database-failure.js";
import { logger } from "./logger.js";

/** What body-parser, router and http-errors attach to what they throw. */
interface StatusError {
  type?: unknown;
  status?: unknown;
  statusCode?: unknown;
  code?: unknown;
  name?: unknown;
}

/** The 4xx status an error carries (http-errors, body-parser, router), or null. */
function clientStatus(error: StatusError): number | null {
  const status = typeof error.status === "number" ? error.status : typeof error.statusCode === "number" ? error.statusCode : null;
  return status !== null && status >= 400 && status < 500 ? status : null;
}

/** The sentence for a 4xx raised below the routes (body-parser, zlib, router), chosen by its type. */
function sentenceOf(error: StatusError, status: number, bodyLimit: string): string {
  switch (error.type) {
    case "entity.parse.failed":
      return "The request body is not valid JSON.";
    case "entity.too.large":
      return `The request body is larger than the ${bodyLimit} allowed.`;
    case "encoding.unsupported":
      return "The request body's Content-Encoding is not supported; send it uncompressed, or as gzip, deflate or br.";
    case "charset.unsupported":
      return "Send the request body as UTF-8 JSON.";
    case "request.aborted":
      return "The request body was cut off before its end; send it again.";
    case "request.size.invalid":
      return "The request body is not as long as its Content-Length says; send it again.";
    case "parameters.too.many":
      return "The request has too many parameters.";
    default:
      break;
  }
  // zlib's errors: Z_DATA_ERROR and friends for gzip/deflate, ERR__ERROR_… for brotli.
  if (typeof error.code === "string" && (error.code.startsWith("Z_") || error.code.startsWith("ERR__ERROR"))) {
    return "The request body says it is compressed (Content-Encoding) but could not be decompressed; send it uncompressed or compressed correctly.";
  }
  if (error.name === "URIError") return "The address holds a malformed percent-escape; correct the link.";
  if (status === 413) return `The request body is larger than the ${bodyLimit} allowed.`;
  if (status === 415) return "Send the request body as UTF-8 JSON.";
  return "The request could not be read; check its address, headers and body.";
}

function toHttpError(error: unknown, bodyLimit: string): { error: HttpError; retryAfter?: number } | null {
  if (error instanceof HttpError) return { error };
  if (error instanceof z.ZodError) return { error: zodToHttpError(error) };
  if (typeof error === "object" && error !== null) {
    const status = clientStatus(error);
    if (status !== null) return { error: new HttpError(status, sentenceOf(error, status, bodyLimit)) };
  }
  return databaseFailure(error);
}

/**
 * The one error middleware: known errors become their status and sentence (a 4xx raised by the
 * body parser or the router keeps its status), a database that is away a 503 with Retry-After, the
 * rest a logged 500.
 */
export function errorMiddleware(bodyLimit: string): ErrorRequestHandler {
  return (error, req, res, next) => {
    if (res.headersSent) {
      next(error);
      return;
    }
    const known = toHttpError(error, bodyLimit);
    const log = req.log ?? logger;
    if (known) {
      if (known.error.status >= 500) log.warn({ err: error, status: known.error.status }, "request refused: database unavailable");
      if (known.retryAfter !== undefined) res.setHeader("Retry-After", String(known.retryAfter));
      res.status(known.error.status).json({ error: known.error.toBody() });
      return;
    }
    log.error({ err: error, method: req.method, url: req.originalUrl }, "request failed");
    res.status(500).json({ error: { message: "Something went wrong on the server; try again, and tell your admin if it keeps happening." } });
  };
}

/** 404 for any /api path no route answered. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new HttpError(404, `There is no API endpoint ${req.method} ${req.baseUrl}${req.path}.`));
};
