// The shell on a phone (390 × 844, the width the lead approves from) in headless chromium against the
// built app: the navigation folds into a menu that opens and closes; no page scrolls sideways
// (document.scrollingElement.scrollWidth ≤ 390); every table scrolls inside its own frame; the front
// chart keeps a readable plot. Screenshots of every page land in test-results/screens/narrow-*.png.
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Page } from "playwright-core";
import { saveScreenshot } from "../support/chromium.js";
import { DEMO_WORKSPACE, openBrowserSession, signIn } from "../support/browser-session.js";
import type { BrowserSession } from "../support/browser-session.js";

const appUrl = inject("appUrl");
const WIDTH = 390;
const base = `/w/${DEMO_WORKSPACE}`;

let session: BrowserSession;
let page: Page;

beforeAll(async () => {
  session = await openBrowserSession(appUrl, { width: WIDTH, height: 844 });
  page = session.page;
});

afterAll(async () => {
  await session?.close();
});

/** How far the page itself is wider than the window [px] (0 when nothing sticks out sideways). */
const pageOverflow = (p: Page) => p.evaluate(() => document.scrollingElement!.scrollWidth - window.innerWidth);

/**
 * Every table of the page with the frame that scrolls it sideways: the nearest ancestor whose overflow-x is
 * auto or scroll, its right edge, and whether the table is wider than the frame.
 */
const tableFrames = (p: Page) =>
  p.evaluate(() =>
    [...document.querySelectorAll("main table")].map((table) => {
      let frame: HTMLElement | null = table.parentElement;
      while (frame && !["auto", "scroll"].includes(getComputedStyle(frame).overflowX)) frame = frame.parentElement;
      return {
        framed: frame !== null,
        frameRight: frame ? frame.getBoundingClientRect().right : Infinity,
        wider: frame ? frame.scrollWidth > frame.clientWidth : false,
        testId: table.getAttribute("data-testid") ?? "",
      };
    }),
  );

async function apiList<T>(path: string): Promise<T> {
  const response = await page.request.get(`${appUrl}/api/workspaces/${DEMO_WORKSPACE}${path}`);
  expect(response.status()).toBe(200);
  return (await response.json()) as T;
}

/**
 * Opens `path`, waits for `ready`, then checks the page does not scroll sideways and every table is framed
 * inside the window; saves a screenshot (of the window only for a very tall page: `fullPage` false).
 */
async function checkPage(path: string, ready: string, shot: string, fullPage = true) {
  await page.goto(`${appUrl}${path}`);
  await page.waitForSelector(ready, { timeout: 60_000 });
  expect(await pageOverflow(page), `${path} scrolls sideways`).toBeLessThanOrEqual(0);
  for (const frame of await tableFrames(page)) {
    expect(frame.framed, `a table (${frame.testId}) on ${path} has no frame that scrolls it`).toBe(true);
    expect(frame.frameRight, `the frame of ${frame.testId} on ${path} sticks out of the window`).toBeLessThanOrEqual(WIDTH);
  }
  await saveScreenshot(page, `narrow-${shot}`, { fullPage });
}

describe("the shell at 390 px", () => {
  it("when the sign-in and sign-up pages open on a phone, then neither scrolls sideways", async () => {
    await checkPage("/sign-up", "#email", "sign-up");
    await checkPage("/sign-in", "#email", "sign-in");
  });

  it("when signed in, then the left navigation is folded into a menu button that opens, closes (button, Escape) and closes on following a link", async () => {
    await signIn(page, appUrl, "tomas@halvard.example");
    await page.goto(`${appUrl}${base}`);
    await page.waitForSelector("[data-testid=workspace-home]");
    // The wide screen's left column is hidden; the menu button shows instead.
    expect(await page.isVisible("[data-testid=nav-library]")).toBe(false);
    expect(await page.isVisible("[data-testid=nav-toggle]")).toBe(true);
    expect(await page.getAttribute("[data-testid=nav-toggle]", "aria-expanded")).toBe("false");
    expect(await page.$("[data-testid=nav-panel]")).toBeNull();

    await page.click("[data-testid=nav-toggle]");
    await page.waitForSelector("[data-testid=nav-panel]");
    expect(await page.getAttribute("[data-testid=nav-toggle]", "aria-expanded")).toBe("true");
    const links = await page.$$eval("[data-testid=nav-panel] a", (as) => as.map((a) => a.textContent));
    expect(links).toEqual(["Home", "Library", "Families", "Sweeps", "Compare criteria", "Decisions", "Members"]);
    // The panel spans the window and does not widen the page.
    const panel = await page.$eval("[data-testid=nav-panel]", (el) => el.getBoundingClientRect().toJSON() as DOMRect);
    expect(panel.width).toBeLessThanOrEqual(WIDTH);
    expect(await pageOverflow(page)).toBeLessThanOrEqual(0);
    await saveScreenshot(page, "narrow-menu-open");

    await page.click("[data-testid=nav-toggle]");
    await page.waitForSelector("[data-testid=nav-panel]", { state: "detached" });

    await page.click("[data-testid=nav-toggle]");
    await page.waitForSelector("[data-testid=nav-panel]");
    await page.keyboard.press("Escape");
    await page.waitForSelector("[data-testid=nav-panel]", { state: "detached" });

    await page.click("[data-testid=nav-toggle]");
    await page.click("[data-testid=menu-nav-sweeps]");
    await page.waitForURL((url) => url.pathname === `${base}/sweeps`);
    await page.waitForSelector("[data-testid=nav-panel]", { state: "detached" });
    expect(await page.textContent("[data-testid=page-title]")).toBe("Sweeps");
  });

  it("when the home and the library open on a phone, then none scrolls sideways and every table scrolls inside its own frame", async () => {
    const plants = await apiList<{ id: string }[]>("/plants");
    expect(plants.length).toBeGreaterThan(0);
    await checkPage(base, "[data-testid=workspace-home]", "home");
    await checkPage(`${base}/plants`, "[data-testid=page-title]", "plants");
    await checkPage(`${base}/plants/${plants[0]!.id}`, "[data-testid=poles-table]", "plant");
    await checkPage(`${base}/plants/new`, "form", "plant-new");
  });

  it("when the sweep pages open on a phone (list, form, a finished sweep's front), then none scrolls sideways and every table scrolls inside its own frame", async () => {
    const sweeps = await apiList<{ id: string; status: string }[]>("/sweeps");
    const sweep = sweeps.find((s) => s.status === "finished");
    expect(sweep).toBeDefined();
    await checkPage(`${base}/sweeps`, "[data-testid=table-frame]", "sweeps");
    await checkPage(`${base}/sweeps/new`, "[data-testid=parameter-grid]", "sweep-new");
    await checkPage(`${base}/sweeps/${sweep!.id}`, "[data-testid=front-chart] .main-svg", "sweep");
  });

  it("when the comparison and decision pages open on a phone, then none scrolls sideways and every table scrolls inside its own frame", async () => {
    const comparisons = await apiList<{ id: string; status: string }[]>("/comparisons");
    const decisions = await apiList<{ id: string }[]>("/decisions");
    const comparison = comparisons.find((c) => c.status === "finished");
    expect(comparison).toBeDefined();
    await checkPage(`${base}/comparisons`, "[data-testid=comparison-table]", "comparisons");
    await checkPage(`${base}/comparisons/new`, "form", "comparison-new", false);
    // Some 5000 px tall on a phone: its screenshot is of the window only.
    await checkPage(`${base}/comparisons/${comparison!.id}`, "[data-testid=stability]", "comparison", false);
    await checkPage(`${base}/comparisons/across`, "[data-testid=across-table]", "across");
    await checkPage(`${base}/decisions`, "[data-testid=decision-list-page]", "decisions");
    // The seed holds an approved decision and a proposal waiting (issue 12, item 6).
    expect(decisions.length).toBeGreaterThan(0);
    await checkPage(`${base}/decisions/${decisions[0]!.id}`, "[data-testid=decision-trail]", "decision");
  });

  it("when the sweeps list is wider than the phone, then its table scrolls sideways inside its frame, not the page", async () => {
    await page.goto(`${appUrl}${base}/sweeps`);
    await page.waitForSelector("[data-testid=table-frame]");
    const frame = await page.$eval("[data-testid=table-frame]", (el) => ({ scroll: el.scrollWidth, client: el.clientWidth, overflowX: getComputedStyle(el).overflowX }));
    expect(frame.overflowX).toBe("auto");
    expect(frame.scroll).toBeGreaterThan(frame.client);
    await page.$eval("[data-testid=table-frame]", (el) => el.scrollTo({ left: el.scrollWidth }));
    expect(await page.$eval("[data-testid=table-frame]", (el) => el.scrollLeft)).toBeGreaterThan(0);
    expect(await page.evaluate(() => window.scrollX)).toBe(0);
    expect(await pageOverflow(page)).toBeLessThanOrEqual(0);
  });

  it("when a sweep's front is drawn on a phone, then its plot keeps a readable size and its legend sits under the plot", async () => {
    const sweeps = await apiList<{ id: string; status: string }[]>("/sweeps");
    await page.goto(`${appUrl}${base}/sweeps/${sweeps.find((s) => s.status === "finished")!.id}`);
    await page.waitForSelector("[data-testid=front-chart] .main-svg", { timeout: 60_000 });
    const sizes = await page.$eval("[data-testid=front-chart] .js-plotly-plot", (graph) => {
      const layout = (graph as unknown as { _fullLayout: { _size: { w: number; h: number }; legend?: { yref?: string; y?: number } } })._fullLayout;
      return { plotWidth: layout._size.w, plotHeight: layout._size.h, legendYref: layout.legend?.yref, legendY: layout.legend?.y };
    });
    // The plot area keeps the height it has on a wide screen (420 − 40 − 48 = 332 px) and most of the width.
    expect(sizes.plotHeight).toBeGreaterThanOrEqual(300);
    expect(sizes.plotWidth).toBeGreaterThanOrEqual(250);
    expect(sizes.legendYref).toBe("container");
    expect(sizes.legendY).toBe(0);
    expect(session.pageErrors).toEqual([]);
  });
});
