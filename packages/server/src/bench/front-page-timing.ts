// Times the sweep page in headless Debian chromium for the sweep bench: signs in through the web app,
// opens the sweep's page and measures from navigation start until the front chart has drawn: three first
// visits, each in a fresh browser context (nothing cached), reported by their median, then one reload.
// "Drawn" = the plotly graph inside [data-testid=front-chart] has finished its plot call
// (plotly sets _fullLayout._replotting back to false at the end of drawing, just before it emits
// plotly_afterplot), holds a scattergl trace with the page's point count, and has its WebGL canvas.
import { existsSync } from "node:fs";
import { CHROMIUM_ARGS, CHROMIUM_PATH } from "./headless-chromium.js";

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

/** In the page: resolves with performance.now() when the second animation frame from now begins. */
const PAINTED = `new Promise((resolve) => requestAnimationFrame(() => requestAnimationFrame(() => resolve(performance.now()))))`;

export type FrontPageTiming =
  | { skipped: string }
  | (Drawn & {
      /** drawMs and paintMs of each first visit, in order; the fields of Drawn are those of the median one (by drawMs). */
      coldDrawMs: number[];
      coldPaintMs: number[];
      warmDrawMs: number;
      warmPaintMs: number;
    });

type Drawn = {
  drawMs: number;
  /**
   * Until the second animation frame after drawMs begins, i.e. the frame holding the chart has been
   * produced: with software WebGL (no GPU here) the canvas is rasterised then, some 0.3 s after plotly's
   * draw calls returned.
   */
  paintMs: number;
  wallMs: number;
  points: number;
  webgl: boolean;
  traceTypes: string[];
  frontSize: number;
};

/** First visits timed, each in a fresh browser context (empty cache); the median is reported. */
export const FIRST_VISITS = 3;

/** Opens url in a fresh document and waits until the front has drawn; drawMs counts from that document's navigation start. */
async function measure(page: import("playwright-core").Page, url: string): Promise<Drawn> {
  const wallStart = performance.now();
  await page.goto(url, { waitUntil: "commit" });
  const handle = await page.waitForFunction(FRONT_DRAWN, undefined, { polling: "raf", timeout: DRAW_TIMEOUT_MS });
  const paintMs = (await page.evaluate(PAINTED)) as number;
  const wallMs = performance.now() - wallStart;
  return { ...((await handle.jsonValue()) as Omit<Drawn, "wallMs" | "paintMs">), paintMs, wallMs };
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
  const browser = await chromium.launch({ executablePath: CHROMIUM_PATH, headless: true, args: [...CHROMIUM_ARGS] });
  const url = `${options.base}${options.sweepPath}`;
  try {
    // First visits (plotly's bundle in no cache, as for someone opening a sweep after signing in), each in a fresh
    // context; then a reload in the last one. LOOPYARD_BENCH_TRACE=file.json records a chromium performance trace
    // of the first of them (open it in the browser's devtools).
    const tracePath = process.env.LOOPYARD_BENCH_TRACE;
    const cold: Drawn[] = [];
    let warm: Drawn | null = null;
    for (let visit = 0; visit < FIRST_VISITS; visit++) {
      const context = await browser.newContext({ viewport: { width: 1400, height: 1000 } });
      const page = await context.newPage();
      const pageErrors: string[] = [];
      page.on("pageerror", (error) => pageErrors.push(error.message));
      await page.goto(`${options.base}/sign-in`);
      await page.fill("#email", options.email);
      await page.fill("#password", options.password);
      await page.click("[data-testid=sign-in-submit]");
      await page.waitForURL((address) => !address.pathname.startsWith("/sign-in"));
      if (tracePath && visit === 0) await browser.startTracing(page, { path: tracePath, screenshots: false });
      cold.push(await measure(page, url));
      if (tracePath && visit === 0) await browser.stopTracing();
      if (visit === FIRST_VISITS - 1) warm = await measure(page, url);
      if (pageErrors.length > 0) throw new Error(`the sweep page raised: ${pageErrors.join("; ")}`);
      await context.close();
    }
    const median = [...cold].sort((a, b) => a.drawMs - b.drawMs)[Math.floor(cold.length / 2)] as Drawn;
    return {
      ...median,
      coldDrawMs: cold.map((c) => c.drawMs),
      coldPaintMs: cold.map((c) => c.paintMs),
      warmDrawMs: warm?.drawMs ?? Number.NaN,
      warmPaintMs: warm?.paintMs ?? Number.NaN,
    };
  } finally {
    await browser.close();
  }
}
