// A sweep large enough for the WebGL cloud, opened straight from its address as a colleague would open a
// shared link: the page names the plotting bundle as a module to preload, fetches the cloud in its binary
// form in a worker, and draws every stable candidate as one scattergl trace with the front beside it.
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Page } from "playwright-core";
import { saveScreenshot } from "../support/chromium.js";
import { DEMO_WORKSPACE, openBrowserSession, signIn } from "../support/browser-session.js";
import type { BrowserSession } from "../support/browser-session.js";

const appUrl = inject("appUrl");
const api = `${appUrl}/api/workspaces/${DEMO_WORKSPACE}`;
/** Above the page's WEBGL_POINTS (5000), so the cloud is drawn with WebGL. */
const CANDIDATES = 6000;
const RESULT_TIMEOUT_MS = 120_000;

let session: BrowserSession;
let page: Page;
let sweepId: string;

beforeAll(async () => {
  session = await openBrowserSession(appUrl, { width: 1440, height: 1000 });
  page = session.page;
  await signIn(page, appUrl, "priya@halvard.example");
  // Started through the API with the page's session: the form is covered by the other browser tests.
  const plants = (await (await page.request.get(`${api}/plants`)).json()) as { name: string; latestRevision: { id: string } }[];
  const ember = plants.find((p) => p.name === "Ember 200 plate");
  if (!ember) throw new Error("the demo library has no Ember 200 plate");
  const created = await page.request.post(`${api}/sweeps`, {
    headers: { origin: appUrl },
    data: {
      name: `Ember 200 — ${CANDIDATES} random PI ${Date.now().toString(36)}`,
      plantRevisionId: ember.latestRevision.id,
      structure: "pi",
      ranges: { kp: { min: 0.5, max: 6 }, ki: { min: 0.02, max: 1 } },
      design: { kind: "random", count: CANDIDATES, seed: 42 },
      scenario: { horizon: 40, dt: 0.05 },
      criteria: ["ise", "effort"],
    },
  });
  expect(created.status()).toBe(201);
  sweepId = (await created.json()).id;
  const deadline = Date.now() + RESULT_TIMEOUT_MS;
  for (;;) {
    const sweep = await (await page.request.get(`${api}/sweeps/${sweepId}`)).json();
    if (sweep.status === "finished") break;
    if (sweep.status === "failed" || Date.now() > deadline) throw new Error(`the sweep is ${sweep.status} at ${sweep.done}/${sweep.total}`);
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
});

afterAll(async () => {
  await session?.close();
});

describe("a sweep of 6000 candidates opened from its address", () => {
  it("when the page opens, then it preloads the plotting bundle, reads the cloud in binary and draws every stable candidate with WebGL and the front", async () => {
    const pointRequests: { accept: string | undefined }[] = [];
    session.context.on("request", (request) => {
      if (request.url().includes(`/sweeps/${sweepId}/points`)) pointRequests.push({ accept: request.headers().accept });
    });
    await page.goto(`${appUrl}/w/${DEMO_WORKSPACE}/sweeps/${sweepId}`);
    expect(await page.locator('head link[rel="modulepreload"][href*="plotly-plot"]').count()).toBe(1);
    await page.waitForFunction(
      () => {
        const holder = document.querySelector("[data-testid=front-chart]");
        const gd = holder?.querySelector(".js-plotly-plot") as (HTMLElement & { _fullLayout?: { _replotting?: boolean } }) | null;
        return Boolean(gd?._fullLayout && gd._fullLayout._replotting === false && gd.querySelector("canvas.gl-canvas-context"));
      },
      undefined,
      { timeout: 30_000 },
    );

    // The JSON form of the same points (the default answer) tells how many the chart must hold.
    const expected = await (await page.request.get(`${api}/sweeps/${sweepId}/points?x=ise&y=effort`)).json();
    const front = await (await page.request.get(`${api}/sweeps/${sweepId}/front?x=ise&y=effort`)).json();
    expect(expected.indices.length).toBeGreaterThan(5000);
    const chart = page.locator("[data-testid=front-chart]");
    expect(await chart.getAttribute("data-webgl")).toBe("true");
    expect(Number(await chart.getAttribute("data-points"))).toBe(expected.indices.length);
    expect(Number(await chart.getAttribute("data-front-size"))).toBe(front.indices.length);
    const traces = await page.evaluate(() => {
      const gd = document.querySelector("[data-testid=front-chart] .js-plotly-plot") as unknown as { _fullData: { type: string; name: string; x: ArrayLike<number> }[] };
      return gd._fullData.map((t) => ({ type: t.type, name: t.name, points: t.x.length }));
    });
    expect(traces).toContainEqual({ type: "scattergl", name: "stable candidates", points: expected.indices.length });
    expect(traces).toContainEqual({ type: "scattergl", name: "front", points: front.indices.length });
    // The page's own request for the cloud asked for the binary form (from the worker).
    expect(pointRequests.some((r) => r.accept?.startsWith("application/x-loopyard-points"))).toBe(true);
    expect(session.pageErrors).toEqual([]);
    await saveScreenshot(page, "large-cloud-01-webgl");
  });
});
