// Identifying a plant from a step test in headless chromium against the built app: the demo engineer
// uploads a CSV of a heater step, picks its columns and units, fits the three models, compares them
// on the data with their residuals, saves the first-order fit as a plant, and sweeps a PI on it.
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Page } from "playwright-core";
import { saveScreenshot } from "../support/chromium.js";
import { DEMO_WORKSPACE, openBrowserSession, signIn } from "../support/browser-session.js";
import type { BrowserSession } from "../support/browser-session.js";
import { EMBER_STEP, emberStepCsv } from "../integration/step-test-fixtures.js";

const appUrl = inject("appUrl");
const RESULT_TIMEOUT_MS = 120_000;
const plantName = `Ember 400 step ${Date.now().toString(36)}`;

let session: BrowserSession;
let page: Page;
let file: string;

beforeAll(async () => {
  session = await openBrowserSession(appUrl, { width: 1440, height: 1000 });
  page = session.page;
  // The file has a text column before the numbers, so the columns must be picked, not taken as 1, 2, 3.
  const lines = emberStepCsv().trim().split("\n");
  const text = [`operator,${lines[0]}`, ...lines.slice(1).map((line) => `priya,${line}`)].join("\n");
  file = join(mkdtempSync(join(tmpdir(), "loopyard-identify-")), "ember-400-heater-step.csv");
  writeFileSync(file, `${text}\n`);
});

afterAll(async () => {
  await session?.close();
});

describe("a plant identified from a step test", () => {
  it("when the engineer uploads a CSV from the library, then its columns and first rows show with time, input and output suggested", async () => {
    await signIn(page, appUrl, "priya@halvard.example");
    await page.goto(`${appUrl}/w/${DEMO_WORKSPACE}/plants`);
    await page.click("[data-testid=upload-step-test-link]");
    await page.waitForSelector("[data-testid=step-test-upload-page]");
    await page.setInputFiles("[data-testid=step-test-file]", file);
    await saveScreenshot(page, "identify-01-upload");
    // The upload is read on the server's compute pool (a worker thread that may be starting): allow it time.
    await page.click("[data-testid=upload-step-test]", { noWaitAfter: true });
    await page.waitForSelector("[data-testid=step-test-workbench]", { timeout: RESULT_TIMEOUT_MS });
    // Suggested: time = the increasing column (2), input = the column with two values (3), output = 4.
    expect(await page.inputValue("[data-testid=column-time]")).toBe("2");
    expect(await page.inputValue("[data-testid=column-input]")).toBe("3");
    expect(await page.inputValue("[data-testid=column-output]")).toBe("4");
    expect(await page.textContent("[data-testid=step-test-preview]")).toContain("401 rows");
  });

  it("when she picks the columns and units and fits, then the three fits show with 95 % intervals, and the data, models and residuals are drawn", async () => {
    await page.selectOption("[data-testid=column-output]", "4");
    await page.fill("[data-testid=unit-input]", "%");
    await page.fill("[data-testid=unit-output]", "°C");
    await page.click("[data-testid=fit-models]", { noWaitAfter: true });
    await page.waitForSelector("[data-testid=fit-table]", { timeout: RESULT_TIMEOUT_MS });
    await page.waitForSelector("[data-testid=fit-chart] .main-svg", { timeout: RESULT_TIMEOUT_MS });
    const k = await page.textContent("[data-testid=fit-fopdt-k]");
    // "k = 0.6xx [lo, hi] °C/%": the true gain 0.6 °C/% lies in the interval (EMBER_STEP; Bates & Watts 1988, §2.3).
    const [, lo, hi] = /\[([-−\d.e]+), ([-−\d.e]+)\]/.exec(k ?? "") ?? [];
    expect(Number(lo.replace("−", "-"))).toBeLessThan(EMBER_STEP.k);
    expect(Number(hi.replace("−", "-"))).toBeGreaterThan(EMBER_STEP.k);
    expect(k).toContain("°C/%");
    expect(Number(await page.textContent("[data-testid=fit-fopdt-r2]"))).toBeGreaterThan(0.999);
    expect(await page.$("[data-testid=fit-row-sopdt]")).not.toBeNull();
    expect(await page.$("[data-testid=fit-row-ipdt]")).not.toBeNull();
    await page.evaluate(() => window.scrollTo(0, 0));
    await saveScreenshot(page, "identify-02-fits");
    await page.evaluate(() => document.querySelector("[data-testid=fit-chart]")?.scrollIntoView());
    await saveScreenshot(page, "identify-03-overlay-residuals");
  });

  it("when she saves the first-order fit as a plant, then its page shows G(s), the step test it came from and its intervals", async () => {
    await page.click("[data-testid=choose-fopdt]");
    await page.fill("[data-testid=identified-name]", plantName);
    await page.click("[data-testid=save-identified]", { noWaitAfter: true });
    await page.waitForSelector("[data-testid=plant-detail-page]", { timeout: RESULT_TIMEOUT_MS });
    expect(await page.textContent("[data-testid=plant-kind-label]")).toBe("identified");
    expect(await page.textContent("[data-testid=identification-view]")).toContain("ember-400-heater-step.csv");
    expect(await page.textContent("[data-testid=identification-view]")).toContain("u = heater_pct [%]");
    expect(await page.textContent("[data-testid=identified-tau]")).toContain("95 %");
    await page.waitForSelector("[data-testid=plant-step-chart] .main-svg", { timeout: RESULT_TIMEOUT_MS });
    await saveScreenshot(page, "identify-04-plant");
  });

  it("when she sweeps a controller on it, then the sweep finishes with a front", async () => {
    await page.click("[data-testid=sweep-this-revision]");
    await page.waitForSelector("[data-testid=sweep-form]");
    await page.fill("#sweep-name", `${plantName} sweep`);
    await saveScreenshot(page, "identify-05-sweep-form");
    await page.click("[data-testid=sweep-submit]");
    await page.waitForURL((url) => /\/sweeps\/[^/]+$/.test(url.pathname) && !url.pathname.endsWith("/new"));
    await page.waitForSelector("[data-testid=front-chart] .main-svg", { timeout: RESULT_TIMEOUT_MS });
    await page.waitForSelector("[data-testid=front-row]", { timeout: RESULT_TIMEOUT_MS });
    expect(await page.textContent("[data-testid=sweep-status]")).toBe("finished");
    await saveScreenshot(page, "identify-06-sweep-front");
    expect(session.pageErrors).toEqual([]);
  });
});
