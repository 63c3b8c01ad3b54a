import { randomBytes } from "node:crypto";
import { mkdir, rename, writeFile } from "node:fs/promises";
import type { AddressInfo } from "node:net";
import path from "node:path";
import { SMTPServer } from "smtp-server";

/** Largest message the sink takes [bytes]: a decision record's PDF and then some. */
export const MAIL_SINK_MAX_BYTES = 25 * 1024 * 1024;

export interface MailSinkOptions {
  /** Address to listen on; loopback only (default 127.0.0.1). */
  host?: string;
  /** Port (0: any free port; see `port` of the result). */
  port: number;
  /** Folder that receives one .eml file per message (created when missing). */
  folder: string;
}

export interface MailSink {
  host: string;
  port: number;
  folder: string;
  /** smtp:// URL that sends to this sink. */
  url: string;
  close(): Promise<void>;
}

/** File name of a received message: receipt time (sortable, UTC) and a random suffix, e.g. 20261205T221503123Z-3fa9c1.eml. */
export function sinkFileName(receivedAt: Date): string {
  const stamp = receivedAt.toISOString().replace(/[-:.]/g, "");
  return `${stamp}-${randomBytes(4).toString("hex")}.eml`;
}

/**
 * A local SMTP server that keeps every message it receives as an .eml file (the raw message as
 * sent) in `folder`: the fake mail server of `npm start` and `npm test`. It accepts any sender and
 * recipient without authentication and without TLS, so it listens on loopback only. Files are
 * written under a temporary name and renamed, so a reader never sees half a message.
 */
export async function startMailSink(options: MailSinkOptions): Promise<MailSink> {
  const host = options.host ?? "127.0.0.1";
  if (!/^(127\.\d+\.\d+\.\d+|::1|localhost)$/.test(host)) throw new RangeError(`host: the mail sink listens on loopback only; got "${host}"`);
  const folder = path.resolve(options.folder);
  await mkdir(folder, { recursive: true });
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["AUTH", "STARTTLS"],
    size: MAIL_SINK_MAX_BYTES,
    banner: "Loopyard local mail sink",
    logger: false,
    onData(stream, _session, callback) {
      const chunks: Buffer[] = [];
      stream.on("data", (chunk: Buffer) => chunks.push(chunk));
      stream.on("error", (error) => callback(error));
      stream.on("end", () => {
        if (stream.sizeExceeded) {
          callback(Object.assign(new Error(`message larger than ${MAIL_SINK_MAX_BYTES} bytes`), { responseCode: 552 }));
          return;
        }
        const name = sinkFileName(new Date());
        const temporary = path.join(folder, `.${name}.part`);
        writeFile(temporary, Buffer.concat(chunks))
          .then(() => rename(temporary, path.join(folder, name)))
          .then(() => callback(null, `stored as ${name}`))
          .catch((error: unknown) => callback(error instanceof Error ? error : new Error(String(error))));
      });
    },
  });
  server.on("error", (error) => console.error(`[loopyard] mail sink: ${error.message}`));
  await new Promise<void>((resolve, reject) => {
    const onError = (error: Error) => reject(error);
    server.server.once("error", onError);
    server.listen(options.port, host, () => {
      server.server.off("error", onError);
      resolve();
    });
  });
  const port = (server.server.address() as AddressInfo).port;
  return {
    host,
    port,
    folder,
    url: `smtp://${host.includes(":") ? `[${host}]` : host}:${port}`,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
