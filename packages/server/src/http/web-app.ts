import { existsSync } from "node:fs";
import path from "node:path";
import express, { type Express, type RequestHandler } from "express";

/**
 * Serves the built web app from `webDist`: files as they are (hashed assets cached for a year),
 * and index.html for every other GET outside /api so that the client router handles the path.
 * Returns false (and serves nothing) when the folder has no index.html.
 */
export function serveWebApp(app: Express, webDist: string): boolean {
  const indexHtml = path.join(webDist, "index.html");
  if (!existsSync(indexHtml)) return false;
  app.use(
    express.static(webDist, {
      index: false,
      setHeaders(res, filePath) {
        const immutable = filePath.includes(`${path.sep}assets${path.sep}`);
        res.setHeader("Cache-Control", immutable ? "public, max-age=31536000, immutable" : "no-cache");
      },
    }),
  );
  app.use((req, res, next) => {
    if ((req.method !== "GET" && req.method !== "HEAD") || req.path === "/api" || req.path.startsWith("/api/")) {
      next();
      return;
    }
    res.setHeader("Cache-Control", "no-cache");
    res.sendFile(indexHtml);
  });
  return true;
}

/** Answers page requests with a hint when the web app has not been built (the API still works). */
export function webAppMissing(webDist: string): RequestHandler {
  return (req, res, next) => {
    if ((req.method !== "GET" && req.method !== "HEAD") || req.path === "/api" || req.path.startsWith("/api/")) {
      next();
      return;
    }
    res
      .status(503)
      .type("text/plain")
      .send(`The Loopyard web app is not built (no index.html in ${webDist}). Build it with "npm run build", or start everything with "npm start".\n`);
  };
}
