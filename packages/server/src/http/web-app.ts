import { existsSync, readFileSync } from "node:fs";
import path from "node:path";
import express, { type Express, type RequestHandler } from "express";
import { isDrawingPage } from "@loopyard/core/api";

/** The source of the plotting bundle, as Vite's manifest names its chunk (web: components/charts/lazy-plot.tsx). */
const PLOT_BUNDLE_SOURCE = "src/components/charts/plotly-plot.tsx";

/**
 * The URL of the plotting bundle in a build (from dist/.vite/manifest.json, written by the web
 * build), or null when the build has no manifest or no such chunk.
 */
export function plotBundleUrl(webDist: string): string | null {
  try {
    const manifest = JSON.parse(readFileSync(path.join(webDist, ".vite", "manifest.json"), "utf8")) as Record<string, { file?: string }>;
    const file = manifest[PLOT_BUNDLE_SOURCE]?.file;
    return file ? `/${file}` : null;
  } catch {
    return null;
  }
}

/**
 * index.html for a page that draws on opening: the same, with the plotting bundle named as a module
 * to preload, so the browser fetches and compiles its 4–5 MB alongside the app's own script instead
 * of after it. Other pages get index.html as built.
 */
export function withPlotPreload(indexHtml: string, bundleUrl: string): string {
  return indexHtml.replace("</head>", `  <link rel="modulepreload" crossorigin href="${bundleUrl}" />\n  </head>`);
}

/**
 * Serves the built web app from `webDist`: files as they are (hashed assets cached for a year),
 * and index.html for every other GET outside /api so that the client router handles the path
 * (with the plotting bundle preloaded on pages that draw, see withPlotPreload).
 * Returns false (and serves nothing) when the folder has no index.html.
 */
export function serveWebApp(app: Express, webDist: string): boolean {
  const indexHtml = path.join(webDist, "index.html");
  if (!existsSync(indexHtml)) return false;
  const bundleUrl = plotBundleUrl(webDist);
  const drawingHtml = bundleUrl ? withPlotPreload(readFileSync(indexHtml, "utf8"), bundleUrl) : null;
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
    if (drawingHtml !== null && isDrawingPage(req.path)) res.type("html").send(drawingHtml);
    else res.sendFile(indexHtml);
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
