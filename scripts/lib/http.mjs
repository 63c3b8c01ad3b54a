// Small HTTP helpers for the start script: the app's port and its health check.
import { StepError } from "./step.mjs";

export const DEFAULT_HTTP_PORT = 4470;

/** PORT or 4470. */
export function httpPort() {
  const raw = process.env.PORT;
  if (raw === undefined || raw === "") return DEFAULT_HTTP_PORT;
  const port = Number(raw);
  if (!Number.isInteger(port) || port < 1 || port > 65535) {
    throw new StepError(`PORT=${raw} is not a port number.`, "Set PORT to a whole number between 1 and 65535, e.g. PORT=4471.");
  }
  return port;
}

/** True when GET <baseUrl>/api/health answers 2xx. */
export async function isHealthy(baseUrl) {
  try {
    const response = await fetch(new URL("/api/health", baseUrl), { signal: AbortSignal.timeout(2000) });
    return response.ok;
  } catch {
    return false;
  }
}
