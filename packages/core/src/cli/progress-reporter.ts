/** Reports sweep progress on a stream (stderr): a redrawn bar on a terminal, plain lines otherwise. */
export interface ProgressReporter {
  update(done: number): void;
  finish(): void;
}

/** Width of the terminal bar in characters. */
const BAR_WIDTH = 30;
/** Plain-line mode prints at every tenth of the work. */
const PLAIN_STEPS = 10;

/**
 * A progress reporter for `total` candidates. On a TTY (`stream.isTTY`), one line redrawn in
 * place: `[######……] 45% 9000/20000 candidates, 12345/s`. Otherwise (a file or a pipe, e.g. CI
 * logs) a plain line at each tenth of the work and one at the end, never control characters.
 */
export function createProgressReporter(stream: NodeJS.WritableStream & { isTTY?: boolean }, total: number, label = "sweep"): ProgressReporter {
  const tty = stream.isTTY === true;
  const started = performance.now();
  let nextStep = 1;
  const rate = (done: number) => Math.round(done / Math.max(1e-3, (performance.now() - started) / 1000));
  return {
    update(done) {
      if (tty) {
        const fraction = total === 0 ? 1 : done / total;
        const filled = Math.round(fraction * BAR_WIDTH);
        stream.write(`\r[${"#".repeat(filled)}${"-".repeat(BAR_WIDTH - filled)}] ${Math.floor(fraction * 100)}% ${done}/${total} candidates, ${rate(done)}/s`);
        return;
      }
      if (nextStep >= PLAIN_STEPS || done < (nextStep * total) / PLAIN_STEPS) return;
      while (nextStep < PLAIN_STEPS && done >= (nextStep * total) / PLAIN_STEPS) nextStep++;
      if (done < total) stream.write(`loopyard ${label}: ${done}/${total} candidates (${Math.floor((done / total) * 100)}%)\n`);
    },
    finish() {
      const seconds = (performance.now() - started) / 1000;
      const line = `loopyard ${label}: ${total} candidates in ${seconds.toFixed(2)} s (${rate(total)}/s)`;
      stream.write(tty ? `\r${line}${" ".repeat(20)}\n` : `${line}\n`);
    },
  };
}
