import { logger } from "./logger.js";

/**
 * Work a request starts and does not wait for (e.g. computing a new sweep's references). Failures are
 * logged, never thrown; `settle` waits for whatever is still running, so the app closes its database
 * only after them.
 */
export class BackgroundTasks {
  private readonly running = new Set<Promise<void>>();

  /** Runs `task` after the current request has been answered. */
  run(label: string, task: () => Promise<void>): void {
    const done: Promise<void> = new Promise<void>((resolve) => setImmediate(resolve))
      .then(task)
      .catch((error: unknown) => logger.warn({ err: error, task: label }, "background task failed"))
      .finally(() => this.running.delete(done));
    this.running.add(done);
  }

  async settle(): Promise<void> {
    while (this.running.size > 0) await Promise.all([...this.running]);
  }
}
