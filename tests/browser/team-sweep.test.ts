// A sweep at team scale in headless chromium against the built app: the demo engineer starts a
// Latin hypercube of 400 candidates on a family of two Ember plants, watches the progress panel,
// sees the front once it finishes with the scores of a candidate on each variant, switches the
// candidate's response to the second variant, and "Run again with changes" opens the form filled from
// the sweep's definition.
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Page } from "playwright-core";
import { saveScreenshot } from "../support/chromium.js";
import { DEMO_WORKSPACE, openBrowserSession, signIn } from "../support/browser-session.js";
import type { BrowserSession } from "../support/browser-session.js";

const WORKSPACE = DEMO_WORKSPACE;
const RESULT_TIMEOUT_MS = 150_000;
const appUrl = inject("appUrl");
const sweepName = `Ember 200/400 family ${Date.now().toString(36)}`;

let session: BrowserSession;
let page: Page;

beforeAll(async () => {
  session = await openBrowserSession(appUrl, { width: 1440, height: 1000 });
  page = session.page;
});

afterAll(async () => {
  await session?.close();
});

describe("a family sweep with a Latin hypercube", () => {
  it("when the engineer starts 400 candidates on Ember 200 and Ember 400, then the progress panel shows and the sweep finishes with a front", async () => {
    await signIn(page, appUrl, "priya@halvard.example");

    await page.goto(`${appUrl}/w/${WORKSPACE}/sweeps/new`);
    await page.waitForSelector("[data-testid=sweep-form]");
    await page.selectOption("#sweep-plant", { label: "Ember 200 plate" });
    await page.waitForSelector("#sweep-revision option:has-text('rev')", { state: "attached" });
    await page.fill("[data-testid=first-variant-label]", "Ember 200");
    await page.click("[data-testid=add-variant]");
    await page.selectOption("[data-testid=variant-0-plant]", { label: "Ember 400 plate" });
    // Until the engineer types a label, it follows the chosen plant (it used to keep the first plant's name).
    await page.waitForFunction(() => (document.querySelector("[data-testid=variant-0-label]") as HTMLInputElement | null)?.value === "Ember 400 plate");
    await page.fill("[data-testid=variant-0-label]", "Ember 400");
    await page.click("[data-testid=design-latin-hypercube]");
    await page.fill("[data-testid=design-count]", "400");
    await page.fill("[data-testid=design-seed]", "11");
    // A fine time step (4000 samples per run) keeps the sweep running long enough to watch it.
    await page.fill("#sweep-name", sweepName);
    await page.fill("#dt", "0.01");
    // A Latin hypercube holds its own count (400); every candidate is simulated on both variants: 400 · 2 = 800.
    expect(await page.textContent("[data-testid=candidate-count]")).toBe("400");
    expect(await page.textContent("[data-testid=evaluation-count]")).toContain("2 variants = 800 simulations");
    await saveScreenshot(page, "team-01-family-form");
    await page.click("[data-testid=sweep-submit]");

    await page.waitForURL((url) => /\/sweeps\/[^/]+$/.test(url.pathname) && !url.pathname.endsWith("/new"));
    await page.waitForSelector("[data-testid=progress-panel]", { timeout: 20_000 });
    expect(await page.textContent("[data-testid=progress-done]")).toMatch(/of 400$/);
    await saveScreenshot(page, "team-02-progress");

    await page.waitForSelector("[data-testid=front-chart] .main-svg", { timeout: RESULT_TIMEOUT_MS });
    expect(await page.textContent("[data-testid=sweep-status]")).toBe("finished");
    expect(await page.textContent("[data-testid=sweep-definition]")).toContain("Latin hypercube, 400 candidates, seed 11");
    expect(await page.textContent("[data-testid=sweep-definition]")).toContain("Ember 200 · Ember 400");
    const rows = await page.$$("[data-testid=front-row]");
    expect(rows.length).toBeGreaterThan(0);
    await rows[0].click();
    const variants = await page.waitForSelector("[data-testid=variant-scores]", { timeout: RESULT_TIMEOUT_MS });
    expect(await page.$$eval("[data-testid=variant-row]", (r) => r.map((row) => row.querySelector("td")?.textContent))).toEqual(["Ember 200", "Ember 400"]);
    expect(await variants.textContent()).toContain("worst variant");
    await saveScreenshot(page, "team-03-front-and-variants");
  });

  it("when she switches the response to the second variant, then the page says which variant is drawn and draws that variant's loop", async () => {
    // The response opens on the first variant and says so.
    await page.waitForSelector("[data-testid=response-chart] .main-svg", { timeout: RESULT_TIMEOUT_MS });
    expect(await page.textContent("[data-testid=response-section] h2")).toMatch(/^Response of candidate #\d+ on Ember 200$/);
    expect(await page.inputValue("[data-testid=response-variant]")).toBe("0");
    expect(await page.textContent("[data-testid=sensitivity-section]")).toContain("on Ember 200 (variant 1 of 2)");
    const lastY = () =>
      page.$eval("[data-testid=response-chart] .js-plotly-plot", (graph) => {
        const y = (graph as unknown as { data: { name?: string; y: number[] }[] }).data.find((t) => t.name === "y(t)")?.y ?? [];
        return y[y.length - 1];
      });
    const onFirst = await lastY();
    const second = page.waitForResponse((r) => r.url().includes("/response?variant=1"));
    await page.selectOption("[data-testid=response-variant]", "1");
    expect((await second).status()).toBe(200);
    await page.waitForFunction(() => document.querySelector("[data-testid=response-section] h2")?.textContent?.endsWith("on Ember 400") === true);
    await page.waitForSelector("[data-testid=response-chart] .main-svg", { timeout: RESULT_TIMEOUT_MS });
    await page.waitForFunction(() => document.querySelector("[data-testid=sensitivity-section]")?.textContent?.includes("on Ember 400 (variant 2 of 2)") === true, undefined, { timeout: RESULT_TIMEOUT_MS });
    // The two plates differ (Ember 400 is a third-order plant with gain 1.2), so the drawn trace changes.
    await page.waitForFunction((before) => {
      const graph = document.querySelector("[data-testid=response-chart] .js-plotly-plot") as unknown as { data?: { name?: string; y: number[] }[] } | null;
      const y = graph?.data?.find((t) => t.name === "y(t)")?.y ?? [];
      return y.length > 0 && y[y.length - 1] !== before;
    }, onFirst);
    // The variant table marks the drawn row; clicking the first row switches back.
    expect(await page.$$eval("[data-testid=variant-row]", (rows) => rows.map((r) => r.getAttribute("aria-selected")))).toEqual(["false", "true"]);
    await saveScreenshot(page, "team-04-second-variant");
    await page.click("[data-testid=variant-row] >> nth=0");
    await page.waitForFunction(() => document.querySelector("[data-testid=response-section] h2")?.textContent?.endsWith("on Ember 200") === true);
    expect(await page.inputValue("[data-testid=response-variant]")).toBe("0");
    expect(await lastY()).toBe(onFirst);
  });

  it("when she chooses Run again with changes, then the form opens filled from the sweep's definition", async () => {
    await page.evaluate(() => window.scrollTo(0, 0));
    await page.click("[data-testid=run-again]");
    await page.waitForSelector("[data-testid=sweep-form]");
    expect(await page.textContent("[data-testid=page-title]")).toBe("Run again with changes");
    await page.waitForFunction(() => (document.querySelector("#sweep-name") as HTMLInputElement | null)?.value.endsWith("(again)"));
    expect(await page.inputValue("#sweep-name")).toBe(`${sweepName} (again)`);
    expect(await page.isChecked("[data-testid=design-latin-hypercube]")).toBe(true);
    expect(await page.inputValue("[data-testid=design-count]")).toBe("400");
    expect(await page.inputValue("[data-testid=design-seed]")).toBe("11");
    expect(await page.inputValue("[data-testid=first-variant-label]")).toBe("Ember 200");
    expect(await page.inputValue("[data-testid=variant-0-label]")).toBe("Ember 400");
    expect(await page.inputValue("#sweep-revision")).not.toBe("");
    await saveScreenshot(page, "team-05-run-again");
    expect(session.pageErrors).toEqual([]);
  });
});
