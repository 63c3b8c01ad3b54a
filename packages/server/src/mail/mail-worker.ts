import type PgBoss from "pg-boss";
import type { MailJobData } from "./mail-message.js";
import { MAIL_QUEUE } from "./mail-queue.js";
import type { SendMail } from "./mail-transport.js";

/** How often an idle mail worker looks for new messages [s]. */
const MAIL_POLL_SECONDS = 1;

/**
 * Works the mail queue: each job is one message sent with `send`. A send that throws (the SMTP
 * server down or refusing) fails the job, and pg-boss retries it with backoff up to the queue's
 * retry limit; a message that failed for good stays in pgboss.job with its error.
 */
export async function startMailWorker(boss: PgBoss, send: SendMail): Promise<{ close(): Promise<void> }> {
  const workId = await boss.work<MailJobData>(MAIL_QUEUE, { batchSize: 1, pollingIntervalSeconds: MAIL_POLL_SECONDS }, async (jobs) => {
    for (const job of jobs) await send(job.data);
  });
  return {
    async close() {
      await boss.offWork({ id: workId }).catch(() => undefined);
    },
  };
}
