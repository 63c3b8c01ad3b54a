import type { Readable, Transform } from "node:stream";
import { pipeline } from "node:stream/promises";
import type { Response } from "express";
import type pg from "pg";

/**
 * Streams CSV into `res` from a pooled client: `stages(client)` gives the source (a query stream)
 * and the transforms; the client goes back to the pool when the pipeline ends. A failure before
 * the first byte is thrown (the error middleware answers it); after it the response can only be
 * cut off, which a client sees as a truncated download rather than a wrong file.
 */
export async function sendCsvStream(pool: pg.Pool, res: Response, file: string, stages: (client: pg.PoolClient) => [Readable, ...Transform[]]): Promise<void> {
  const client = await pool.connect();
  let failed = false;
  try {
    res.status(200);
    res.type("text/csv; charset=utf-8");
    res.attachment(file);
    await pipeline([...stages(client), res] as unknown as NodeJS.ReadWriteStream[]);
  } catch (error) {
    failed = true;
    if (!res.headersSent) throw error;
    res.destroy(error as Error);
  } finally {
    client.release(failed);
  }
}
