import { eq } from "drizzle-orm";
import type { Database } from "../db/database.js";
import { comparison, runMailNotice, sweep, workspace } from "../db/schema.js";

/** A sweep or a comparison, as its end-of-run mail needs it. */
export interface EndedRun {
  runKind: "sweep" | "comparison";
  id: string;
  name: string;
  status: string;
  error: string | null;
  authorId: string;
  workspaceSlug: string;
  workspaceName: string;
  /** Candidates stored (sweeps) or contenders (comparisons). */
  count: number;
}

/** The run with its workspace, or null when it is gone. */
export async function findRun(db: Database, runKind: EndedRun["runKind"], id: string): Promise<EndedRun | null> {
  const table = runKind === "sweep" ? sweep : comparison;
  const rows = await db
    .select({
      id: table.id,
      name: table.name,
      status: table.status,
      error: table.error,
      authorId: table.createdBy,
      workspaceSlug: workspace.slug,
      workspaceName: workspace.name,
      count: runKind === "sweep" ? sweep.done : comparison.contenders,
    })
    .from(table)
    .innerJoin(workspace, eq(workspace.id, table.workspaceId))
    .where(eq(table.id, id))
    .limit(1);
  const row = rows[0];
  return row ? { runKind, ...row } : null;
}

/** Records that the run's end was mailed; false when another worker recorded it first. */
export async function claimRunNotice(db: Database, runKind: EndedRun["runKind"], id: string, status: string): Promise<boolean> {
  const rows = await db.insert(runMailNotice).values({ runKind, runId: id, status }).onConflictDoNothing().returning({ runId: runMailNotice.runId });
  return rows.length > 0;
}
