// Times the sweep page in headless Debian chromium for the sweep bench: signs in through the web app,
// opens the sweep's page and measures from navigation start until the front chart has drawn.
// "Drawn" = the plotly graph inside [data-testid=front-chart] has finished its plot call
// (plotly sets _fullLayout._replotting back to false at the end of drawing, just before it emits
// plotly_afterplot), holds a scattergl trace with the page's point count, and has its WebGL canvas.
import { existsSync } from "node:fs";

const CHROMIUM_PATH = "/usr/bin/chromium";
/** The same flags as tests/support/chromium.ts: headless, sandbox-free, no network but loopback. */
const CHROMIUM_ARGS = [
  "--no-sandbox",
  "--disable-gpu",
  "--disable-quic",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
  "--disable-dev-shm-usage",
];
const DRAW_TIMEOUT_MS = 60_000;

/**
 * Runs in the page (a string, since the server compiles without DOM types): null until the front chart has drawn, then
 * performance.now() (ms since this document's navigation start), the point count and the trace types.
 */
const FRONT_DRAWN = `(() => {
  const holder = document.querySelector("[data-testid=front-chart]");
  const gd = holder && holder.querySelector(".js-plotly-plot");
  if (!gd || !gd._fullLayout || !gd._fullData || gd._fullLayout._replotting !== false) return null;
  const expected = Number(holder.getAttribute("data-points"));
  const webgl = holder.getAttribute("data-webgl") === "true";
  const cloudType = webgl ? "scattergl" : "scatter";
  const cloud = gd._fullData.filter((t) => t.type === cloudType).reduce((n, t) => n + (t.x ? t.x.length : 0), 0);
  if (cloud < expected || (webgl && !gd.querySelector("canvas.gl-canvas-context"))) return null;
  // Drawn means the front too: its query may answer after the candidates'; the bench's sweep has one.
  if (Number(holder.getAttribute("data-front-size")) === 0) return null;
  return {
    drawMs: performance.now(),
    points: expected,
    webgl,
    traceTypes: [...new Set(gd._fullData.map((t) => t.type))],
    frontSize: Number(holder.getAttribute("data-front-size")),
  };
})()`;

export type FrontPageTiming =
  | { skipped: string }
  | (Drawn & { warmDrawMs: number });

type Drawn = { drawMs: number; wallMs: number; points: number; webgl: boolean; traceTypes: string[]; frontSize: number };

/** Opens url in a fresh document and waits until the front has drawn; drawMs counts from that document's navigation start. */
async function measure(page: import("playwright-core").Page, url: string): Promise<Drawn> {
  const wallStart = performance.now();
  await page.goto(url, { waitUntil: "commit" });
  const handle = await page.waitForFunction(FRONT_DRAWN, undefined, { polling: "raf", timeout: DRAW_TIMEOUT_MS });
  const wallMs = performance.now() - wallStart;
  return { ...((await handle.jsonValue()) as Omit<Drawn, "wallMs">), wallMs };
}

export async function timeFrontPage(options: {
  base: string;
  email: string;
  password: string;
  sweepPath: string;
}): Promise<FrontPageTiming> {
  if (!existsSync(CHROMIUM_PATH)) return { skipped: `no chromium at ${CHROMIUM_PATH}` };
  let chromium: typeof import("playwright-core").chromium;
  try {
    ({ chromium } = await import("playwright-core"));
  } catch (error) {
    return { skipped: `playwright-core not installed (${(error as Error).message})` };
  }
  const browser = await chromium.launch({ executablePath: CHROMIUM_PATH, headless: true, args: CHROMIUM_ARGS });
  try {
    const context = await browser.newContext({ viewport: { width: 1400, height: 1000 } });
    const page = await context.newPage();
    const pageErrors: string[] = [];
    page.on("pageerror", (error) => pageErrors.push(error.message));
    await page.goto(`${options.base}/sign-in`);
    await page.fill("#email", options.email);
    await page.fill("#password", options.password);
    await page.click("[data-testid=sign-in-submit]");
    await page.waitForURL((url) => !url.pathname.startsWith("/sign-in"));

    // First visit (plotly's chunk not yet in the cache, as for someone opening a sweep after signing in), then a reload.
    // LOOPYARD_BENCH_TRACE=file.json records a chromium performance trace of the first visit (open it in the browser's devtools).
    const tracePath = process.env.LOOPYARD_BENCH_TRACE;
    if (tracePath) await browser.startTracing(page, { path: tracePath, screenshots: false });
    const cold = await measure(page, `${options.base}${options.sweepPath}`);
    if (tracePath) await browser.stopTracing();
    const warm = await measure(page, `${options.base}${options.sweepPath}`);
    if (pageErrors.length > 0) throw new Error(`the sweep page raised: ${pageErrors.join("; ")}`);
    await context.close();
    return { ...cold, warmDrawMs: warm.drawMs };
  } finally {
    await browser.close();
  }
}
