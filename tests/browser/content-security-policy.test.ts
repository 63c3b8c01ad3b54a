// The Content-Security-Policy and Permissions-Policy of the built app in headless chromium: the
// pages carry them, and the app still works under them — sign-in, the plant page's step chart, the
// sweep page's plotly chart with its front, a cloud large enough for WebGL (scattergl, whose draw
// calls plotly's strict bundle compiles ahead of time: the CSP has no 'unsafe-eval'), the points
// worker, a comparison's overlays — with no violation reported by the browser (the
// `securitypolicyviolation` event, W3C CSP Level 3, section 6) and no page error.
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Page } from "playwright-core";
import { saveScreenshot } from "../support/chromium.js";
import { DEMO_WORKSPACE, openBrowserSession, signIn } from "../support/browser-session.js";
import type { BrowserSession } from "../support/browser-session.js";

const RESULT_TIMEOUT_MS = 90_000;
const appUrl = inject("appUrl");

let session: BrowserSession;
let page: Page;
const violations: string[] = [];

beforeAll(async () => {
  session = await openBrowserSession(appUrl, { width: 1440, height: 1000 });
  page = session.page;
  await page.exposeFunction("reportCspViolation", (text: string) => violations.push(text));
  await page.addInitScript(() => {
    document.addEventListener("securitypolicyviolation", (event) => {
      (window as unknown as { reportCspViolation(text: string): void }).reportCspViolation(`${event.violatedDirective} ${event.blockedURI} ${event.sourceFile}:${event.lineNumber}`);
    });
  });
  page.on("console", (message) => {
    if (/Content Security Policy|Refused to/i.test(message.text())) violations.push(message.text());
  });
});

afterAll(async () => {
  await session?.close();
});

describe("content security policy", () => {
  it("when a page is served, then it carries a CSP allowing only the app's own scripts and a Permissions-Policy", async () => {
    const response = await page.goto(`${appUrl}/sign-in`);
    const headers = response!.headers();
    expect(headers["content-security-policy"]).toMatch(/script-src 'self'/);
    expect(headers["content-security-policy"]).not.toMatch(/script-src[^;]*(https?:|\*|'unsafe-inline'|'unsafe-eval')/);
    expect(headers["content-security-policy"]).toMatch(/object-src 'none'/);
    expect(headers["content-security-policy"]).toMatch(/frame-ancestors 'none'/);
    expect(headers["permissions-policy"]).toMatch(/camera=\(\)/);
    expect(headers["x-request-id"]).toBeTruthy();
  });

  it("when the engineer opens a plant and a sweep, then the charts draw with no CSP violation and no page error", async () => {
    await signIn(page, appUrl, "priya@halvard.example");
    const plants = (await page.evaluate(async (slug) => (await fetch(`/api/workspaces/${slug}/plants`)).json(), DEMO_WORKSPACE)) as { id: string }[];
    await page.goto(`${appUrl}/w/${DEMO_WORKSPACE}/plants/${plants[0]!.id}`);
    await page.waitForSelector(".main-svg", { timeout: RESULT_TIMEOUT_MS });
    const sweeps = (await page.evaluate(async (slug) => (await fetch(`/api/workspaces/${slug}/sweeps`)).json(), DEMO_WORKSPACE)) as { id: string; status: string }[];
    const sweep = sweeps.find((s) => s.status === "finished");
    expect(sweep).toBeDefined();
    await page.goto(`${appUrl}/w/${DEMO_WORKSPACE}/sweeps/${sweep!.id}`);
    await page.waitForSelector("[data-testid=front-chart] .main-svg", { timeout: RESULT_TIMEOUT_MS });
    await page.waitForTimeout(1_000);
    await saveScreenshot(page, "csp-01-sweep-page-under-csp");
    expect(violations).toEqual([]);
    expect(session.pageErrors).toEqual([]);
    expect(session.externalRequests).toEqual([]);
  });

  it("when a sweep of 6000 candidates opens, then its cloud is drawn with WebGL (scattergl) with no CSP violation", async () => {
    const api = `${appUrl}/api/workspaces/${DEMO_WORKSPACE}`;
    const plants = (await (await page.request.get(`${api}/plants`)).json()) as { name: string; latestRevision: { id: string } }[];
    const ember = plants.find((p) => p.name === "Ember 200 plate");
    expect(ember).toBeDefined();
    const created = await page.request.post(`${api}/sweeps`, {
      headers: { origin: appUrl },
      data: {
        name: `CSP cloud ${Date.now().toString(36)}`,
        plantRevisionId: ember!.latestRevision.id,
        structure: "pi",
        ranges: { kp: { min: 0.5, max: 6 }, ki: { min: 0.02, max: 1 } },
        design: { kind: "random", count: 6000, seed: 7 },
        scenario: { horizon: 40, dt: 0.05 },
        criteria: ["ise", "effort"],
      },
    });
    expect(created.status()).toBe(201);
    const sweepId = (await created.json()).id as string;
    const deadline = Date.now() + RESULT_TIMEOUT_MS;
    for (;;) {
      const sweep = await (await page.request.get(`${api}/sweeps/${sweepId}`)).json();
      if (sweep.status === "finished") break;
      if (sweep.status === "failed" || Date.now() > deadline) throw new Error(`the sweep is ${sweep.status} at ${sweep.done}/${sweep.total}`);
      await new Promise((resolve) => setTimeout(resolve, 250));
    }
    await page.goto(`${appUrl}/w/${DEMO_WORKSPACE}/sweeps/${sweepId}`);
    await page.waitForFunction(
      () => {
        const gd = document.querySelector("[data-testid=front-chart] .js-plotly-plot") as (HTMLElement & { _fullLayout?: { _replotting?: boolean } }) | null;
        return Boolean(gd?._fullLayout && gd._fullLayout._replotting === false && gd.querySelector("canvas.gl-canvas-context"));
      },
      undefined,
      { timeout: RESULT_TIMEOUT_MS },
    );
    await page.waitForTimeout(1_000);
    const expected = await (await page.request.get(`${api}/sweeps/${sweepId}/points?x=ise&y=effort`)).json();
    const traces = await page.evaluate(() => {
      const gd = document.querySelector("[data-testid=front-chart] .js-plotly-plot") as unknown as { _fullData: { type: string; name: string; x: ArrayLike<number> }[] };
      return gd._fullData.map((t) => ({ type: t.type, name: t.name, points: t.x.length }));
    });
    expect(traces).toContainEqual({ type: "scattergl", name: "stable candidates", points: expected.indices.length });
    // The WebGL context of the cloud exists and was not lost (regl compiled its draw calls without eval).
    const gl = await page.evaluate(() => {
      const canvas = document.querySelector("[data-testid=front-chart] canvas.gl-canvas-context") as HTMLCanvasElement | null;
      const context = canvas?.getContext("webgl") ?? null;
      return { canvas: canvas !== null, width: canvas?.width ?? 0, lost: context ? context.isContextLost() : null };
    });
    expect(gl.canvas).toBe(true);
    expect(gl.width).toBeGreaterThan(0);
    expect(gl.lost).toBe(false);
    await saveScreenshot(page, "csp-02-webgl-cloud-under-csp");
    expect(violations).toEqual([]);
    expect(session.pageErrors).toEqual([]);
  });

  it("when the demo comparison opens, then its overlays draw with no CSP violation and no page error", async () => {
    await page.goto(`${appUrl}/w/${DEMO_WORKSPACE}/comparisons`);
    await page.waitForSelector("[data-testid=comparison-list-page]", { timeout: RESULT_TIMEOUT_MS });
    await page.click("[data-testid=comparison-link] >> text=Ember line");
    await page.waitForSelector("[data-testid=comparison-summary]", { timeout: RESULT_TIMEOUT_MS });
    await page.waitForSelector("[data-testid=overlay-output] .js-plotly-plot .main-svg", { timeout: RESULT_TIMEOUT_MS });
    await page.waitForSelector("[data-testid=overlay-sensitivity] .js-plotly-plot .main-svg", { timeout: RESULT_TIMEOUT_MS });
    await page.waitForTimeout(1_000);
    await saveScreenshot(page, "csp-03-comparison-under-csp");
    expect(violations).toEqual([]);
    expect(session.pageErrors).toEqual([]);
    expect(session.externalRequests).toEqual([]);
  });
});
