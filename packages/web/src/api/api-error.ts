import type { ApiErrorBody } from "@loopyard/core";

/**
 * A failed call to the Loopyard API: the HTTP status plus the server's sentence,
 * and, for bad input, the dotted path of the field at fault and every field problem.
 * `status` is 0 when the server could not be reached at all.
 */
export class ApiError extends Error {
  readonly status: number;
  readonly field: string | undefined;
  readonly issues: { field: string; message: string }[];

  constructor(status: number, body: Partial<ApiErrorBody>) {
    super(body.message ?? `The server answered ${status}.`);
    this.name = "ApiError";
    this.status = status;
    this.field = body.field;
    this.issues = body.issues ?? [];
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

/** What the user can do about a failed call, by status. */
export function howToFix(error: unknown): string {
  if (!isApiError(error)) return "Reload the page; if it keeps failing, check the server log.";
  switch (error.status) {
    case 0:
      return "Check that the Loopyard server is running (npm start) and that this machine can reach it, then reload.";
    case 400:
      return "Correct the highlighted input and try again.";
    case 401:
      return "Sign in again to continue.";
    case 403:
      return "Ask an admin of this workspace for a role that allows it.";
    case 404:
      return "Check the address, or go back to the list and pick an existing entry.";
    case 409:
      return "Reload the page to see the current state, then try again.";
    default:
      return error.status >= 500
        ? "The server failed on its side; try again, and if it persists check the server log."
        : "Try again; if it keeps failing, check the server log.";
  }
}
