import { existsSync } from "node:fs";
import path from "node:path";
import express, { type Express } from "express";

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
