/// <reference lib="webworker" />
// Fetches a sweep's cloud (GET …/points in its binary form, a few MB for 10⁵ candidates) off the page's
// thread: while the page evaluates the plotting bundle (half a second of main-thread work), a fetch made
// there could not read its body, and the transfer would wait. Answers PointsWorkerReply, the columns
// as views of the answer's buffer, which moves to the page without a copy.
import { POINTS_BINARY_TYPE } from "@loopyard/core";
import { binaryPointsColumns, columnBuffers, type PointsColumns } from "./points-columns.js";

export type PointsWorkerRequest = { id: number; url: string };
export type PointsWorkerReply =
  | { id: number; ok: true; columns: PointsColumns }
  | { id: number; ok: false; status: number; text: string };

const scope = self as unknown as DedicatedWorkerGlobalScope;

scope.onmessage = async (event: MessageEvent<PointsWorkerRequest>) => {
  const { id, url } = event.data;
  let response: Response;
  try {
    response = await fetch(url, { credentials: "same-origin", headers: { accept: `${POINTS_BINARY_TYPE}, application/json;q=0.5` } });
  } catch {
    scope.postMessage({ id, ok: false, status: 0, text: "" } satisfies PointsWorkerReply);
    return;
  }
  if (!response.ok) {
    scope.postMessage({ id, ok: false, status: response.status, text: await response.text() } satisfies PointsWorkerReply);
    return;
  }
  let columns: PointsColumns;
  try {
    columns = binaryPointsColumns(await response.arrayBuffer());
  } catch (error) {
    // A cut or garbled answer: say so as a server fault.
    const message = `The points could not be read (${error instanceof Error ? error.message : String(error)}); reload the page.`;
    scope.postMessage({ id, ok: false, status: 502, text: JSON.stringify({ error: { message } }) } satisfies PointsWorkerReply);
    return;
  }
  scope.postMessage({ id, ok: true, columns } satisfies PointsWorkerReply, columnBuffers(columns));
};
