import { randomUUID } from "node:crypto";
import type { IncomingMessage, ServerResponse } from "node:http";
import { pino, type Logger, type LevelWithSilent } from "pino";
import { pinoHttp, type HttpLogger } from "pino-http";

/** Levels LOOPYARD_LOG_LEVEL may name. */
export const LOG_LEVELS = ["fatal", "error", "warn", "info", "debug", "trace", "silent"] as const satisfies readonly LevelWithSilent[];

/**
 * The server's structured logger: one JSON object per line on stdout (pino), with the level from
 * LOOPYARD_LOG_LEVEL (default info). Values are fields, never format strings, so a `%s` in a URL is
 * printed as it is.
 */
export const logger: Logger = pino(
  {
    name: "loopyard",
    level: process.env.LOOPYARD_LOG_LEVEL ?? "info",
    // A session cookie or an authorisation header never reaches the log.
    redact: ["req.headers.cookie", "req.headers.authorization", 'res.headers["set-cookie"]'],
  },
  // Buffered (4 kB) and written asynchronously: one write per few dozen lines instead of a
  // blocking write per request; what is buffered is flushed when the process exits.
  pino.destination({ dest: 1, sync: false, minLength: 4096 }),
);

/**
 * A URL as it may be logged: the secrets of better-auth's own links (`?token=…` of the address
 * check, `/reset-password/<token>`) replaced by "[redacted]". Loopyard's mailed links carry theirs
 * after "#", which never reaches the server.
 */
export function redactSecrets(url: string): string {
  return url.replace(/([?&]token=)[^&#]*/gi, "$1[redacted]").replace(/(\/reset-password\/)[^/?#]+/g, "$1[redacted]");
}

/** An incoming X-Request-Id is kept when it looks like an id (a proxy's), else a fresh uuid is made. */
const REQUEST_ID = /^[A-Za-z0-9._-]{8,64}$/;

/**
 * Request logging with request ids: each request gets an id (echoed in the X-Request-Id response
 * header, and on every log line of the request as `req.id`), and one line when answered with its
 * method, path, status and time. 4xx answers are logged at info, 5xx at error.
 */
export function requestLogger(level: LevelWithSilent): HttpLogger {
  return pinoHttp({
    logger: logger.child({}, { level }),
    genReqId(req: IncomingMessage, res: ServerResponse) {
      const incoming = req.headers["x-request-id"];
      const id = typeof incoming === "string" && REQUEST_ID.test(incoming) ? incoming : randomUUID();
      res.setHeader("X-Request-Id", id);
      return id;
    },
    customLogLevel(_req, res, error) {
      if (error || res.statusCode >= 500) return "error";
      return "info";
    },
    serializers: {
      req(req: { id: unknown; method: string; url: string }) {
        return { id: req.id, method: req.method, url: redactSecrets(req.url) };
      },
      res(res: { statusCode: number }) {
        return { statusCode: res.statusCode };
      },
    },
  });
}
