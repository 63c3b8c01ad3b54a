// The seeded Ember 200 sweep page in headless chromium against the built app on the seeded test
// database: the LQR bound and the tuning-rule baselines are drawn beside the ISE–effort front (checked
// through the legend list rendered from the references data), and a clicked candidate gets its
// |S| and |T| plot.
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Page } from "playwright-core";
import { saveScreenshot } from "../support/chromium.js";
import { DEMO_WORKSPACE, openBrowserSession, signIn } from "../support/browser-session.js";
import type { BrowserSession } from "../support/browser-session.js";

const WORKSPACE = DEMO_WORKSPACE;
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

describe("sweep page: bound, baselines and sensitivity", () => {
  it("when the viewer opens the seeded Ember 200 sweep, then the bound and the baselines are drawn on ISE against effort", async () => {
    await signIn(page, appUrl, "jon@halvard.example");
    const sweeps = await page.evaluate(async (slug) => (await fetch(`/api/workspaces/${slug}/sweeps`)).json(), WORKSPACE);
    const sweep = (sweeps as { id: string; name: string }[]).find((s) => s.name === DEMO_SWEEP);
    expect(sweep).toBeDefined();
    await page.goto(`${appUrl}/w/${WORKSPACE}/sweeps/${sweep?.id}`);
    await page.waitForSelector("[data-testid=front-chart] .main-svg", { timeout: RESULT_TIMEOUT_MS });
    // The seeded sweep opens on ISE against effort (defaultAxes), where the bound applies.
    expect(await page.inputValue("[data-testid=criterion-x]")).toBe("ise");
    expect(await page.inputValue("[data-testid=criterion-y]")).toBe("effort");
    const bound = await page.waitForSelector("[data-testid=reference-bound]", { timeout: RESULT_TIMEOUT_MS });
    expect(await bound.textContent()).toContain("LQR bound (no controller can go below-left)");
    expect(await bound.getAttribute("title")).toMatch(/ANY controller/);
    const baselines = await page.$$("[data-testid=reference-baseline]");
    expect(baselines.length).toBeGreaterThanOrEqual(1);
    expect(await baselines[0].getAttribute("title")).toMatch(/^Published tuning rule .+, scored like any candidate$/);
    const chart = await page.$("[data-testid=front-chart]");
    expect(Number(await chart?.getAttribute("data-bound-points"))).toBeGreaterThan(1);
    expect(Number(await chart?.getAttribute("data-baselines"))).toBe(baselines.length);
    await saveScreenshot(page, "references-01-bound-and-baselines");
  });

  it("when a front point is clicked, then |S| and |T| of that candidate are plotted", async () => {
    const frontPoint = await page.waitForSelector("[data-testid=front-chart] .scatterlayer .trace:nth-child(2) .point");
    const box = await frontPoint.boundingBox();
    expect(box).not.toBeNull();
    await page.mouse.click(box!.x + box!.width / 2, box!.y + box!.height / 2);
    await page.waitForSelector("[data-testid=sensitivity-chart] .main-svg", { timeout: RESULT_TIMEOUT_MS });
    expect(await page.textContent("[data-testid=sensitivity-section] h2")).toBe("Sensitivity |S| and complementary sensitivity |T|");
    expect(await page.textContent("[data-testid=caution-note]")).toContain("Simulated designs are not validated designs.");
    await saveScreenshot(page, "references-02-sensitivity");
    expect(session.pageErrors).toEqual([]);
  });
});
