// A clicked candidate's deployment sheet in headless chromium: the link beside its response, the sheet
// at 1 kHz (forms, difference equations, the before/after table, the caution), then Q15 chosen with
// the controls (the fixed-point coefficients and their column in the table appear), and a sample time
// the server refuses shown with its sentence.
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Page } from "playwright-core";
import { saveScreenshot } from "../support/chromium.js";
import { DEMO_WORKSPACE, openBrowserSession, signIn } from "../support/browser-session.js";
import type { BrowserSession } from "../support/browser-session.js";

const DEMO_SWEEP = "Ember 200 — first PID grid";
const RESULT_TIMEOUT_MS = 90_000;
const appUrl = inject("appUrl");

let session: BrowserSession;
let page: Page;

beforeAll(async () => {
  session = await openBrowserSession(appUrl, { width: 1440, height: 1000 });
  page = session.page;
});

afterAll(async () => {
  await session?.close();
});

describe("the deployment sheet of a clicked candidate", () => {
  it("when the engineer clicks a front row and follows the sheet link, then the sheet shows at 1 kHz; with Q15 the rounded coefficients appear", async () => {
    await signIn(page, appUrl, "priya@halvard.example");
    const sweeps = await page.evaluate(async (slug) => (await fetch(`/api/workspaces/${slug}/sweeps`)).json(), DEMO_WORKSPACE);
    const sweep = (sweeps as { id: string; name: string }[]).find((s) => s.name === DEMO_SWEEP);
    expect(sweep).toBeDefined();
    await page.goto(`${appUrl}/w/${DEMO_WORKSPACE}/sweeps/${sweep?.id}`);
    await page.waitForSelector("[data-testid=front-row]", { timeout: RESULT_TIMEOUT_MS });
    await page.click("[data-testid=front-row] >> nth=0");
    await page.click("[data-testid=sheet-link]");
    await page.waitForSelector("[data-testid=deployment-sheet]", { timeout: RESULT_TIMEOUT_MS });
    expect(page.url()).toContain("/sheet");
    expect(await page.textContent("[data-testid=sheet-equations]")).toContain("h = 0.001 s (Tustin)");
    expect(await page.$$("[data-testid=sheet-coefficients] tbody tr")).toHaveLength(8);
    expect(await page.textContent("[data-testid=sheet-caution]")).toContain("real machine");
    // Coefficients in JetBrains Mono (the app's number font).
    const font = await page.$eval("[data-testid=sheet-coefficients] tbody td:nth-child(2)", (td) => getComputedStyle(td).fontFamily);
    expect(font).toContain("JetBrains Mono");
    await page.selectOption("#sheet-format", "q15");
    await page.click("[data-testid=sheet-apply]");
    await page.waitForSelector("[data-testid=sheet-fixed-point]", { timeout: RESULT_TIMEOUT_MS });
    expect(page.url()).toContain("format=q15");
    expect(await page.textContent("[data-testid=sheet-change-table] thead")).toContain("Q15");
    await saveScreenshot(page, "sheet-01-q15");
    await page.fill("#sheet-sample-time", "0");
    await page.click("[data-testid=sheet-apply]");
    await page.waitForSelector("[data-testid=error-note]", { timeout: RESULT_TIMEOUT_MS });
    expect(await page.textContent("[data-testid=error-note]")).toContain("sample time must be a number of seconds greater than 0");
    expect(session.pageErrors).toEqual([]);
    expect(session.externalRequests).toEqual([]);
  }, 180_000);
});
