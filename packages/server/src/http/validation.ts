import type { Request } from "express";
import { z } from "zod";
import { HttpError } from "./http-error.js";

/** Dotted path of a zod issue, e.g. ["model", "den", 0] → "model.den.0". */
export function issuePath(path: readonly PropertyKey[]): string {
  return path.map((part) => String(part)).join(".");
}

/** Turns a ZodError into the 400 HttpError of the API: field = dotted path, message "<field>: <message>". */
export function zodToHttpError(error: z.ZodError, prefix: readonly string[] = []): HttpError {
  const issues = error.issues.map((issue) => {
    const field = issuePath([...prefix, ...issue.path]);
    return { field, message: field ? `${field}: ${issue.message}` : issue.message };
  });
  const first = issues[0] ?? { field: "", message: "The request is not valid." };
  return new HttpError(400, first.message, first.field ? { field: first.field, issues } : { issues });
}

/** Parses the JSON body of `req` with `schema`, or throws a 400 that names the field. */
export function parseBody<S extends z.ZodType>(schema: S, req: Request): z.output<S> {
  if (req.body === undefined) {
    throw new HttpError(400, "Send the request body as JSON with the header Content-Type: application/json.");
  }
  const result = schema.safeParse(req.body);
  if (!result.success) throw zodToHttpError(result.error);
  return result.data;
}

/** Parses a request body already read (e.g. with a saved family filled in), or throws a 400 that names the field. */
export function parseValue<S extends z.ZodType>(schema: S, body: unknown): z.output<S> {
  if (body === undefined) {
    throw new HttpError(400, "Send the request body as JSON with the header Content-Type: application/json.");
  }
  const result = schema.safeParse(body);
  if (!result.success) throw zodToHttpError(result.error);
  return result.data;
}

/** Parses the query string of `req` with `schema`; field names are the query parameter names. */
export function parseQuery<S extends z.ZodType>(schema: S, req: Request): z.output<S> {
  const result = schema.safeParse(req.query);
  if (!result.success) throw zodToHttpError(result.error);
  return result.data;
}

/** Parses one path parameter, e.g. a uuid, into a 404 with `notFoundMessage` when malformed. */
export function parseIdParam(value: unknown, notFoundMessage: string): string {
  const result = z.uuid().safeParse(value);
  if (!result.success) throw new HttpError(404, notFoundMessage);
  return result.data;
}

/** A named (non-splat) path parameter as one string; "" when absent. */
export function pathParam(value: string | string[] | undefined): string {
  return typeof value === "string" ? value : "";
}
