import { mkdtempSync, mkdirSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { createServer } from "node:http";
import type { AddressInfo } from "node:net";
import express from "express";
import { describe, expect, it } from "vitest";
import { plotBundleUrl, serveWebApp, withPlotPreload } from "../../src/http/web-app.js";

const INDEX = `<!doctype html>\n<html>\n  <head>\n    <title>Loopyard</title>\n  </head>\n  <body><div id="root"></div></body>\n</html>\n`;

/** A built web app as Vite writes it: index.html, an asset and .vite/manifest.json naming the plotting chunk. */
function fakeBuild(withManifest: boolean): string {
  const dist = mkdtempSync(path.join(tmpdir(), "loopyard-web-"));
  writeFileSync(path.join(dist, "index.html"), INDEX);
  mkdirSync(path.join(dist, "assets"));
  writeFileSync(path.join(dist, "assets", "plotly-plot-Ab12.js"), "export default 1;");
  if (withManifest) {
    mkdirSync(path.join(dist, ".vite"));
    writeFileSync(
      path.join(dist, ".vite", "manifest.json"),
      JSON.stringify({ "index.html": { file: "assets/index-Cd34.js" }, "src/components/charts/plotly-plot.tsx": { file: "assets/plotly-plot-Ab12.js" } }),
    );
  }
  return dist;
}

async function get(dist: string, pathname: string): Promise<string> {
  const app = express();
  serveWebApp(app, dist);
  const server = createServer(app);
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", () => resolve()));
  try {
    const response = await fetch(`http://127.0.0.1:${(server.address() as AddressInfo).port}${pathname}`);
    expect(response.status).toBe(200);
    return await response.text();
  } finally {
    server.close();
  }
}

describe("serving the web app", () => {
  it("plotBundleUrl reads the plotting chunk from Vite's manifest, and is null without one", () => {
    expect(plotBundleUrl(fakeBuild(true))).toBe("/assets/plotly-plot-Ab12.js");
    expect(plotBundleUrl(fakeBuild(false))).toBeNull();
  });

  it("withPlotPreload names the bundle as a module to preload inside head", () => {
    const html = withPlotPreload(INDEX, "/assets/plotly-plot-Ab12.js");
    expect(html).toContain('<link rel="modulepreload" crossorigin href="/assets/plotly-plot-Ab12.js" />');
    expect(html.indexOf("modulepreload")).toBeLessThan(html.indexOf("</head>"));
  });

  it("a sweep's or a plant's page gets the preload; lists, forms and sign-in get index.html as built", async () => {
    const dist = fakeBuild(true);
    expect(await get(dist, "/w/halvard-thermal/sweeps/3f2c9a7e")).toContain("modulepreload");
    expect(await get(dist, "/w/halvard-thermal/plants/7b1e")).toContain("modulepreload");
    for (const page of ["/w/halvard-thermal/sweeps", "/w/halvard-thermal/sweeps/new", "/sign-in"]) expect(await get(dist, page)).toBe(INDEX);
    // A build without a manifest still serves every page.
    expect(await get(fakeBuild(false), "/w/halvard-thermal/sweeps/3f2c9a7e")).toBe(INDEX);
  });
});
