// Issue 11, item 5: the error log once passed the request URL to console.error as its format
// string, so a `%s` or `%f` in a URL consumed the stack. Now the logger is pino and the URL is a
// field: a failing request whose address holds %s and %f is logged with the address as sent and
// the whole stack. (Common practice: log values as fields, never as format strings.)
import { createServer } from "node:http";
import type { AddressInfo } from "node:net";
import { Writable } from "node:stream";
import express from "express";
import { pino } from "pino";
import { describe, expect, it } from "vitest";
import { errorMiddleware } from "../../src/http/error-middleware.js";

describe("errorMiddleware's log line", () => {
  it("when a request whose address holds %s and %f fails, then the line has the address as sent and the error's stack", async () => {
    const lines: string[] = [];
    const sink = new Writable({
      write(chunk: Buffer, _encoding, done) {
        lines.push(chunk.toString());
        done();
      },
    });
    const app = express();
    app.use((req, _res, next) => {
      req.log = pino({ level: "info" }, sink);
      next();
    });
    app.get("/boom/:anything", () => {
      throw new Error("the kettle boiled over");
    });
    app.use(errorMiddleware("256kb"));
    const server = createServer(app);
    await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
    try {
      const { port } = server.address() as AddressInfo;
      const response = await fetch(`http://127.0.0.1:${port}/boom/%25s%25f?q=%s%f`);
      expect(response.status).toBe(500);
    } finally {
      await new Promise((resolve) => server.close(resolve));
    }
    const line = JSON.parse(lines.find((l) => l.includes("request failed"))!);
    expect(line.url).toBe("/boom/%25s%25f?q=%s%f");
    expect(line.err.message).toBe("the kettle boiled over");
    expect(line.err.stack).toMatch(/^Error: the kettle boiled over\n\s+at /);
  });
});
