import type { ApiErrorBody } from "@loopyard/core";
import { ApiError } from "./api-error.js";

type Method = "GET" | "POST" | "PUT" | "PATCH" | "DELETE";

/**
 * Reads the error sentence out of a failed response. Loopyard routes answer
 * `{ error: { message, field?, issues? } }`; the auth routes answer `{ message, code }`.
 */
function errorBody(status: number, body: unknown): Partial<ApiErrorBody> {
  if (body && typeof body === "object") {
    const record = body as Record<string, unknown>;
    const nested = record.error;
    if (nested && typeof nested === "object" && typeof (nested as ApiErrorBody).message === "string") {
      return nested as ApiErrorBody;
    }
    if (typeof record.message === "string" && record.message.length > 0) return { message: record.message };
  }
  return { message: `The server answered ${status} without an explanation.` };
}

/**
 * Calls the Loopyard API under /api with the session cookie; returns the parsed JSON body
 * or throws an ApiError carrying status, message, field and issues.
 */
export async function apiFetch<T>(path: string, options: { method?: Method; body?: unknown } = {}): Promise<T> {
  const method = options.method ?? "GET";
  let response: Response;
  try {
    response = await fetch(`/api${path}`, {
      method,
      credentials: "same-origin",
      headers: options.body === undefined ? { accept: "application/json" } : { accept: "application/json", "content-type": "application/json" },
      body: options.body === undefined ? undefined : JSON.stringify(options.body),
    });
  } catch {
    throw new ApiError(0, { message: "Could not reach the Loopyard server." });
  }
  const text = await response.text();
  if (!response.ok) throw apiErrorOf(response.status, text);
  return parseJson(text) as T;
}

/**
 * POSTs one file as multipart/form-data in `field` (the browser sets the boundary); returns the
 * parsed JSON answer or throws an ApiError like apiFetch.
 */
export async function apiUpload<T>(path: string, file: File, field = "file"): Promise<T> {
  const form = new FormData();
  form.append(field, file, file.name);
  let response: Response;
  try {
    response = await fetch(`/api${path}`, { method: "POST", credentials: "same-origin", headers: { accept: "application/json" }, body: form });
  } catch {
    throw new ApiError(0, { message: "Could not reach the Loopyard server." });
  }
  const text = await response.text();
  if (!response.ok) throw apiErrorOf(response.status, text);
  return parseJson(text) as T;
}

/** The ApiError of a failed response from its status and body text. */
export function apiErrorOf(status: number, text: string): ApiError {
  return new ApiError(status, errorBody(status, parseJson(text)));
}

function parseJson(text: string): unknown {
  if (text.length === 0) return null;
  try {
    return JSON.parse(text);
  } catch {
    return null;
  }
}
