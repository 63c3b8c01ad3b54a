import type PgBoss from "pg-boss";
import type { Database } from "../db/database.js";
import { notifyUsers } from "./notify-users.js";
import { claimRunNotice, findRun, type EndedRun } from "./run-notice-repository.js";

/** Default address of the app when a process has no configuration of its own (a `cli.js worker`). */
export function publicUrlFromEnv(env: NodeJS.ProcessEnv = process.env): string {
  if (env.LOOPYARD_PUBLIC_URL) return env.LOOPYARD_PUBLIC_URL.replace(/\/+$/, "");
  const host = env.HOST && env.HOST !== "0.0.0.0" ? env.HOST : "127.0.0.1";
  return `http://${host}:${env.PORT ?? "4470"}`;
}

/** The page of a run in the web app, e.g. http://127.0.0.1:4470/w/halvard-thermal/sweeps/3f2c…. */
export function runLink(publicUrl: string, run: Pick<EndedRun, "runKind" | "workspaceSlug" | "id">): string {
  const folder = run.runKind === "sweep" ? "sweeps" : "comparisons";
  return `${publicUrl.replace(/\/+$/, "")}/w/${encodeURIComponent(run.workspaceSlug)}/${folder}/${encodeURIComponent(run.id)}`;
}

/**
 * When the run has ended (finished or failed, not cancelled: whoever cancels knows), mails its
 * author once — the first caller claims the notice, later calls do nothing — unless the author
 * turned that kind off. Workers call it after every job of the run; it costs one query while the
 * run goes on. Never rejects: a failure is logged and the run goes on.
 */
export async function noticeRunEnded(db: Database, boss: PgBoss, runKind: EndedRun["runKind"], runId: string, publicUrl: string): Promise<void> {
  try {
    const run = await findRun(db, runKind, runId);
    if (!run || (run.status !== "finished" && run.status !== "failed")) return;
    if (!(await claimRunNotice(db, runKind, runId, run.status))) return;
    const link = runLink(publicUrl, run);
    const base = {
      workspaceName: run.workspaceName,
      name: run.name,
      link,
      facts: [[run.runKind === "sweep" ? "Candidates" : "Contenders", run.count.toLocaleString("en-US")]] as [string, string][],
    };
    const error = run.error ?? "no reason was stored";
    const common = { userIds: [run.authorId], workspaceSlug: run.workspaceSlug };
    if (runKind === "sweep") {
      if (run.status === "finished") await notifyUsers(db, boss, { ...common, kind: "sweep-finished", data: base });
      else await notifyUsers(db, boss, { ...common, kind: "sweep-failed", data: { ...base, error } });
    } else if (run.status === "finished") {
      await notifyUsers(db, boss, { ...common, kind: "comparison-finished", data: base });
    } else {
      await notifyUsers(db, boss, { ...common, kind: "comparison-failed", data: { ...base, error } });
    }
  } catch (error) {
    console.error(`[loopyard] the end of ${runKind} ${runId} was not mailed: ${error instanceof Error ? error.message : String(error)}`);
  }
}
