import type { ApiErrorBody } from "@loopyard/core";

/**
 * The one error type routes and services throw for a request that cannot be served.
 * `message` is a sentence shown to the user as is; the error middleware turns it into
 * `{ error: { message, field?, issues? } }` with `status`.
 */
export class HttpError extends Error {
  override name = "HttpError";
  readonly status: number;
  readonly field: string | undefined;
  readonly issues: ApiErrorBody["issues"];

  constructor(status: number, message: string, details: { field?: string; issues?: ApiErrorBody["issues"] } = {}) {
    super(message);
    this.status = status;
    this.field = details.field;
    this.issues = details.issues;
  }

  toBody(): ApiErrorBody {
    const body: ApiErrorBody = { message: this.message };
    if (this.field !== undefined) body.field = this.field;
    if (this.issues !== undefined) body.issues = this.issues;
    return body;
  }
}

export const SIGN_IN_MESSAGE = "Sign in to continue.";

export function unauthorized(): HttpError {
  return new HttpError(401, SIGN_IN_MESSAGE);
}

export function notFound(message: string): HttpError {
  return new HttpError(404, message);
}

export function badRequest(message: string, field?: string): HttpError {
  return new HttpError(400, message, field === undefined ? {} : { field, issues: [{ field, message }] });
}
