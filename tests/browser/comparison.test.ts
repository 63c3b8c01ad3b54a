// Comparisons in headless chromium against the built app: the demo engineer opens the seeded Ember
// line comparison from the left navigation, reads its summary and cross-score, sorts a column,
// switches the overlaid responses to another variant; then starts a small comparison from the form
// and sees it finish with its cross-score and overlays; the across-families page lines them up.
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Page } from "playwright-core";
import { SCREENS_DIR, saveScreenshot } from "../support/chromium.js";
import { DEMO_WORKSPACE, openBrowserSession, signIn } from "../support/browser-session.js";
import type { BrowserSession } from "../support/browser-session.js";

const appUrl = inject("appUrl");
const RESULT_TIMEOUT_MS = 150_000;
const name = `Ember 200: which criterion? ${Date.now().toString(36)}`;

let session: BrowserSession;
let page: Page;

beforeAll(async () => {
  session = await openBrowserSession(appUrl, { width: 1440, height: 1000 });
  page = session.page;
  await signIn(page, appUrl, "priya@halvard.example");
});

afterAll(async () => {
  await session?.close();
});

/** The caption and the first y(t) trace's points: what the overlays show now. */
async function overlayState(p: Page): Promise<{ caption: string; firstY: string }> {
  const caption = (await p.textContent("[data-testid=overlay-caption]")) ?? "";
  const firstY = await p.evaluate(() => {
    const plot = document.querySelector("[data-testid=overlay-output] .js-plotly-plot") as unknown as { data?: { name: string; y: number[] }[] } | null;
    const trace = plot?.data?.find((t) => t.name !== "setpoint r");
    return trace ? trace.y.slice(0, 400).join(",") : "";
  });
  return { caption, firstY };
}

describe("the demo comparison", () => {
  it("when the engineer opens Compare criteria, then the Ember line's answer shows: summary, cross-score, overlays, per variant, agreement, stability", async () => {
    await page.goto(`${appUrl}/w/${DEMO_WORKSPACE}`);
    await page.click("[data-testid=nav-comparisons]");
    await page.waitForSelector("[data-testid=comparison-list-page]");
    await page.click("[data-testid=comparison-link] >> text=Ember line");
    await page.waitForSelector("[data-testid=comparison-summary]");
    const summary = await page.textContent("[data-testid=comparison-summary]");
    expect(summary).toMatch(/pre-scan candidates/);
    expect(await page.locator("[data-testid=cross-score-row]").count()).toBe(5);
    // Each contender's own column holds its best: regret 0 on the diagonal.
    const diagonal = await page.$$eval("[data-testid=cross-score-row]", (rows) =>
      rows.map((row, i) => (row.querySelectorAll("[data-testid=regret-cell]")[i] as HTMLElement | undefined)?.dataset.regret ?? ""),
    );
    expect(diagonal).toEqual(["0", "0", "0", "0", "0"]);
    await page.waitForSelector("[data-testid=overlay-output] .js-plotly-plot", { timeout: 60_000 });
    await page.waitForSelector("[data-testid=overlay-sensitivity] .js-plotly-plot");
    await page.waitForSelector("[data-testid=per-variant] [data-worst=true]");
    await page.waitForSelector("[data-testid=agreement-reading]");
    await page.waitForSelector("[data-testid=stability-row]");
    await page.waitForSelector("[data-testid=caution-note]");
    await saveScreenshot(page, "comparison-demo");
    await page.locator("[data-testid=cross-score]").screenshot({ path: `${SCREENS_DIR}comparison-demo-cross-score.png` });

    // Sorting by overshoot puts the pick best on it first.
    const overshootHeader = page.locator("th", { hasText: "Overshoot" }).locator("button");
    await overshootHeader.click();
    const firstRegret = await page.$$eval("[data-testid=cross-score-row]", (rows) => {
      const headers = [...document.querySelectorAll("[data-testid=cross-score] thead th")].map((th) => th.textContent ?? "");
      const col = headers.findIndex((h) => h.startsWith("Overshoot")) - 1;
      return (rows[0]?.querySelectorAll("[data-testid=regret-cell]")[col] as HTMLElement | undefined)?.dataset.regret;
    });
    expect(firstRegret).toBe("0");

    // Switching the variant redraws all overlays.
    const before = await overlayState(page);
    expect(before.caption).toMatch(/worst case/);
    // Each pick's worst variant is the Ember 800 (the slowest plate, with dead time); switch to the Ember 200.
    await page.click("[data-testid=overlay-variant-0]");
    await page.waitForFunction(() => document.querySelector("[data-testid=overlay-caption]")?.textContent?.includes("Ember 200"));
    await page.waitForFunction((old) => {
      const plot = document.querySelector("[data-testid=overlay-output] .js-plotly-plot") as unknown as { data?: { name: string; y: number[] }[] } | null;
      const trace = plot?.data?.find((t) => t.name !== "setpoint r");
      return trace !== undefined && trace.y.slice(0, 400).join(",") !== old;
    }, before.firstY);
    const after = await overlayState(page);
    expect(after.caption).toBe("Every pick on Ember 200.");
    await page.locator("[data-testid=pick-overlays]").scrollIntoViewIfNeeded();
    await saveScreenshot(page, "comparison-demo-ember-200");
    expect(session.pageErrors).toEqual([]);
  });
});

describe("a comparison started from the page", () => {
  it("when the engineer starts a small comparison on the Ember 200 plate, then it finishes with its cross-score and overlays", async () => {
    await page.goto(`${appUrl}/w/${DEMO_WORKSPACE}/comparisons/new`);
    await page.waitForSelector("[data-testid=comparison-form]");
    await page.selectOption("#comparison-plant", { label: "Ember 200 plate" });
    await page.waitForSelector("#comparison-revision option:has-text('rev')", { state: "attached" });
    await page.fill("[data-testid=comparison-name]", name);
    await page.fill("#budget-prescan", "64");
    await page.fill("#budget-starts", "2");
    await page.fill("#budget-evaluations", "40");
    await page.uncheck("[data-testid=budget-stability]");
    await saveScreenshot(page, "comparison-form");
    await page.click("[data-testid=comparison-submit]");
    await page.waitForURL(/\/comparisons\/[0-9a-f-]{36}$/);
    await page.waitForSelector("[data-testid=comparison-status][data-status=finished]", { timeout: RESULT_TIMEOUT_MS });
    await page.waitForSelector("[data-testid=cross-score]");
    expect(await page.locator("[data-testid=cross-score-row]").count()).toBe(5);
    await page.waitForSelector("[data-testid=overlay-output] .js-plotly-plot", { timeout: 60_000 });
    await saveScreenshot(page, "comparison-started");

    await page.goto(`${appUrl}/w/${DEMO_WORKSPACE}/comparisons/across?judge=overshoot`);
    await page.waitForSelector("[data-testid=across-table]");
    expect(await page.textContent("[data-testid=across-table]")).toContain(name);
    await saveScreenshot(page, "comparison-across");
    expect(session.pageErrors).toEqual([]);
  });
});
