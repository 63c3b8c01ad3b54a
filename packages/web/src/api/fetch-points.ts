import type { PointsDto } from "@loopyard/core";
import { ApiError } from "./api-error.js";
import { apiErrorOf, apiFetch } from "./client.js";
import { toPointsColumns, type PointsColumns } from "./points-columns.js";
import type { PointsWorkerReply, PointsWorkerRequest } from "./points-worker.js";

let worker: Worker | null = null;
let nextId = 0;
const waiting = new Map<number, { resolve: (columns: PointsColumns) => void; reject: (error: Error) => void }>();

function pointsWorker(): Worker {
  if (worker) return worker;
  worker = new Worker(new URL("./points-worker.ts", import.meta.url), { type: "module" });
  worker.onmessage = (event: MessageEvent<PointsWorkerReply>) => {
    const reply = event.data;
    const pending = waiting.get(reply.id);
    if (!pending) return;
    waiting.delete(reply.id);
    if (reply.ok) pending.resolve(reply.columns);
    else pending.reject(reply.status === 0 ? new ApiError(0, { message: "Could not reach the Loopyard server." }) : apiErrorOf(reply.status, reply.text));
  };
  worker.onerror = () => {
    // The worker could not start or crashed: fail what it held; the next call starts a new one.
    for (const pending of waiting.values()) pending.reject(new Error("The points could not be loaded in the background; reload the page."));
    waiting.clear();
    worker?.terminate();
    worker = null;
  };
  return worker;
}

/**
 * GET /api{path} for a PointsDto, fetched and parsed in a worker (points-worker.ts) and handed over as
 * Float64Array columns; in the page itself where workers are not available. Throws ApiError as apiFetch does.
 */
export function fetchPoints(path: string): Promise<PointsColumns> {
  if (typeof Worker === "undefined") return apiFetch<PointsDto>(path).then(toPointsColumns);
  const id = nextId++;
  return new Promise<PointsColumns>((resolve, reject) => {
    waiting.set(id, { resolve, reject });
    pointsWorker().postMessage({ id, url: `/api${path}` } satisfies PointsWorkerRequest);
  });
}
