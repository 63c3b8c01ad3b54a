import PgBoss from "pg-boss";
import type { MailKind } from "@loopyard/core";
import type { Database } from "../db/database.js";
import type { MailConfig } from "./mail-config.js";
import type { MailMessage } from "./mail-message.js";
import { configureMailQueue, DEFAULT_MAIL_RETRY_POLICY, ensureMailQueue, queueMail } from "./mail-queue.js";
import { createMailTransport } from "./mail-transport.js";
import { startMailWorker } from "./mail-worker.js";
import { notifyUsers, type NotifyUsersInput } from "./notify-users.js";

/** Mail as the web server sees it: queue messages from routes and services; send them in the background. */
export interface MailSystem {
  /** Resolves once the queue is ready (and the sending worker, when mail is configured). */
  ready: Promise<void>;
  /** queueMail on this process's queue connection: resolves to the job id, or null when it could not be queued. */
  queue(message: MailMessage): Promise<string | null>;
  /** notifyUsers on this process's queue connection: resolves to how many messages were queued. */
  notify<K extends MailKind>(input: NotifyUsersInput<K>): Promise<number>;
  /** The settings it runs with (null: mail is queued but nobody sends it from this process). */
  config: MailConfig | null;
  close(): Promise<void>;
}

/**
 * A pg-boss connection of its own for mail (schema "pgboss", queue MAIL_QUEUE) and, when `config`
 * is given, a worker that sends the queued messages over SMTP at config.smtpUrl with the retry
 * policy config.retry. Without `config` messages are queued and wait for a process that sends.
 *
 * @param after start once this settles (the other queues' set-up: concurrent pg-boss DDL can deadlock)
 */
export function createMailSystem(db: Database, databaseUrl: string, config: MailConfig | null, after?: Promise<unknown>): MailSystem {
  const boss = new PgBoss({ connectionString: databaseUrl, max: 2, schedule: false, supervise: config !== null });
  boss.on("error", (error) => console.error(`[loopyard] mail queue: ${error instanceof Error ? error.message : String(error)}`));
  const transport = config ? createMailTransport(config.smtpUrl, config.from) : null;
  let worker: { close(): Promise<void> } | null = null;
  const ready = (async () => {
    await after?.catch(() => undefined);
    await boss.start();
    if (config && transport) {
      await configureMailQueue(boss, config.retry ?? DEFAULT_MAIL_RETRY_POLICY);
      worker = await startMailWorker(boss, transport.send);
    } else {
      await ensureMailQueue(boss);
    }
  })();
  ready.catch((error: unknown) => console.error("[loopyard] the mail queue could not start:", error));
  let closing: Promise<void> | null = null;
  return {
    ready,
    config,
    async queue(message) {
      try {
        await ready;
      } catch {
        return null;
      }
      return queueMail(boss, message);
    },
    async notify(input) {
      try {
        await ready;
      } catch {
        return 0;
      }
      return notifyUsers(db, boss, input);
    },
    close() {
      closing ??= (async () => {
        await ready.catch(() => undefined);
        await worker?.close();
        await boss.stop({ graceful: true, timeout: 10_000, wait: true }).catch(() => undefined);
        transport?.close();
      })();
      return closing;
    },
  };
}
