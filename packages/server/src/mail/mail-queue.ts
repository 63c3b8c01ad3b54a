import type PgBoss from "pg-boss";
import { toMailJobData, type MailMessage } from "./mail-message.js";

/** The pg-boss queue of outgoing mail: one job per message. */
export const MAIL_QUEUE = "mail-send";
/** Retries of a message after its first attempt (an SMTP server down for a while). */
export const MAIL_RETRY_LIMIT = 8;
/**
 * First retry delay [s]. pg-boss's backoff waits delay·2^(n−1)·(1 + random) before retry n
 * (pg-boss 10 plans.js), so 8 retries from 5 s span about 10 to 20 minutes in all.
 */
export const MAIL_RETRY_DELAY_SECONDS = 5;
/** How long one send may take before pg-boss hands it to another attempt [s]. */
export const MAIL_EXPIRE_SECONDS = 120;

/** Retry policy of the mail queue; tests shorten the delay. */
export interface MailRetryPolicy {
  retryLimit: number;
  retryDelaySeconds: number;
}

export const DEFAULT_MAIL_RETRY_POLICY: MailRetryPolicy = { retryLimit: MAIL_RETRY_LIMIT, retryDelaySeconds: MAIL_RETRY_DELAY_SECONDS };

const ensured = new WeakMap<PgBoss, Promise<void>>();

function queueOptions(policy: MailRetryPolicy) {
  return {
    name: MAIL_QUEUE,
    retryLimit: policy.retryLimit,
    retryDelay: policy.retryDelaySeconds,
    retryBackoff: true,
    expireInSeconds: MAIL_EXPIRE_SECONDS,
    // Sent mail stays visible in pgboss.job for a week (what was sent when, and what failed).
    retentionMinutes: 7 * 24 * 60,
  };
}

/**
 * Creates the mail queue on a started pg-boss once per process (no DDL when it exists already).
 * Jobs take the queue's retry policy at insert time, so only the sending process sets it
 * (`configureMailQueue`); enqueuing processes just make sure the queue exists.
 */
export function ensureMailQueue(boss: PgBoss): Promise<void> {
  let done = ensured.get(boss);
  if (!done) {
    done = (async () => {
      if (!(await boss.getQueue(MAIL_QUEUE))) await boss.createQueue(MAIL_QUEUE, queueOptions(DEFAULT_MAIL_RETRY_POLICY));
    })();
    done.catch(() => ensured.delete(boss));
    ensured.set(boss, done);
  }
  return done;
}

/** Creates or updates the mail queue with this retry policy (the process that sends mail calls it). */
export async function configureMailQueue(boss: PgBoss, policy: MailRetryPolicy): Promise<void> {
  await ensureMailQueue(boss);
  await boss.updateQueue(MAIL_QUEUE, queueOptions(policy));
}

/**
 * Enqueues one message on the mail queue and returns its job id; a send job (startMailWorker)
 * delivers it over SMTP, retried with backoff while the server is unreachable. Never rejects
 * for the queue's sake: a database hiccup while enqueuing is logged and answered with null, so a
 * request or a finishing sweep never fails because of mail. A malformed message throws TypeError
 * at once (see toMailJobData): that is a programming mistake.
 *
 * @param boss a started pg-boss on the app's database (the sweep worker's, the comparison worker's or the app's MailSystem)
 */
export async function queueMail(boss: PgBoss, message: MailMessage): Promise<string | null> {
  const data = toMailJobData(message);
  try {
    await ensureMailQueue(boss);
    return await boss.send(MAIL_QUEUE, data as unknown as object);
  } catch (error) {
    console.error(`[loopyard] a ${data.kind} mail to ${data.to.join(", ")} could not be queued: ${error instanceof Error ? error.message : String(error)}`);
    return null;
  }
}
