import { eq, lt } from "drizzle-orm";
import type { Database } from "../db/database.js";
import { worker } from "../db/schema.js";

export async function registerWorker(db: Database, values: { id: string; host: string; pid: number; threads: number }): Promise<void> {
  await db
    .insert(worker)
    .values(values)
    .onConflictDoUpdate({ target: worker.id, set: { heartbeatAt: new Date() } });
}

export async function heartbeatWorker(db: Database, id: string): Promise<void> {
  await db.update(worker).set({ heartbeatAt: new Date() }).where(eq(worker.id, id));
}

export async function removeWorker(db: Database, id: string): Promise<void> {
  await db.delete(worker).where(eq(worker.id, id));
}

/** Forgets workers silent for an hour (killed processes never say goodbye). */
export async function pruneWorkers(db: Database): Promise<void> {
  await db.delete(worker).where(lt(worker.heartbeatAt, new Date(Date.now() - 3600_000)));
}
