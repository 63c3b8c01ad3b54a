// The walking-skeleton journey in headless chromium against the built app (API + web) on the seeded
// test database: the demo engineer enters a plant, sweeps a 5×5 PID grid and sees its front; the demo
// viewer is refused plant creation both in the UI and by the API.
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Page } from "playwright-core";
import { saveScreenshot } from "../support/chromium.js";
import { DEMO_WORKSPACE, openBrowserSession, signIn } from "../support/browser-session.js";
import type { BrowserSession } from "../support/browser-session.js";

const WORKSPACE = DEMO_WORKSPACE;
const ENGINEER = "priya@halvard.example";
const VIEWER = "jon@halvard.example";
/** Long enough for a 25-candidate sweep of a first-order plant plus the lazy plot bundle. */
const RESULT_TIMEOUT_MS = 90_000;

const appUrl = inject("appUrl");

let session: BrowserSession;
let page: Page;

/** Signs in and opens the workspace home. */
async function signInToHome(email: string): Promise<void> {
  await signIn(page, appUrl, email);
  await page.goto(`${appUrl}/w/${WORKSPACE}`);
  await page.waitForSelector("[data-testid=workspace-home]");
}

async function signOut(): Promise<void> {
  await page.click("[data-testid=user-menu] summary");
  await page.click("[data-testid=sign-out]");
  await page.waitForURL((url) => url.pathname === "/sign-in");
}

beforeAll(async () => {
  session = await openBrowserSession(appUrl, { width: 1360, height: 900 });
  page = session.page;
});

afterAll(async () => {
  await session?.close();
});

describe("journey: engineer runs a sweep, viewer is refused", () => {
  const plantName = `Ember journey ${Date.now().toString(36)}`;

  it("when a signed-out visitor opens the app, then the sign-in page shows", async () => {
    await page.goto(`${appUrl}/`);
    await page.waitForURL((url) => url.pathname === "/sign-in");
    await page.waitForSelector("[data-testid=sign-in-form]");
    await saveScreenshot(page, "journey-01-sign-in");
  });

  it("when the demo engineer signs in, then the workspace home shows her role and the demo library", async () => {
    await signInToHome(ENGINEER);
    expect(await page.textContent("[data-testid=user-role]")).toBe("engineer");
    expect(Number(await page.textContent("[data-testid=count-plants] .font-mono"))).toBeGreaterThanOrEqual(3);
    await saveScreenshot(page, "journey-02-home-engineer");
  });

  it("when she enters a plant with a typo and then the right coefficients, then the typo is named at its field and the plant is saved", async () => {
    await page.click("[data-testid=nav-library]");
    await page.waitForSelector("[data-testid=plant-table]");
    await saveScreenshot(page, "journey-03-library");
    await page.click("[data-testid=new-plant]");
    await page.waitForSelector("[data-testid=plant-form]");

    await page.fill("#plant-name", plantName);
    await page.fill("#plant-units", "u: heater power fraction [0–1]; y: plate temperature rise [K]");
    await page.fill("#plant-num", "1");
    await page.fill("#plant-den", "4 1o");
    await page.click("[data-testid=plant-submit]");
    const denError = await page.waitForSelector("[data-testid='field-error-model.den']");
    expect(await denError.textContent()).toContain("“1o”");
    await saveScreenshot(page, "journey-04-plant-form-error");

    // G(s) = 1/(4s + 1): a first-order lag with τ = 4 s.
    await page.fill("#plant-den", "4, 1");
    await page.fill("#plant-delay", "0");
    expect(await page.textContent("[data-testid=plant-preview]")).toContain("4s + 1");
    await saveScreenshot(page, "journey-05-plant-form");
    await page.click("[data-testid=plant-submit]");

    await page.waitForSelector("[data-testid=plant-detail-page]");
    expect(await page.textContent("[data-testid=page-title]")).toBe(plantName);
    expect(await page.textContent("[data-testid=coefficients-den]")).toBe("[4, 1]");
    // The single pole of 1/(4s+1) is s = −1/4 (closed form), shown with τ = 4 s.
    expect(await page.textContent("[data-testid=poles-table]")).toContain("−0.25");
    await page.waitForSelector("[data-testid=plant-step-chart] .main-svg", { timeout: RESULT_TIMEOUT_MS });
    await saveScreenshot(page, "journey-06-plant-detail");
  });

  it("when she sweeps a 5 × 5 grid (kd count 1) on it, then it finishes and the front chart, the front table and a picked candidate's response appear", async () => {
    await page.click("[data-testid=sweep-this-revision]");
    await page.waitForSelector("[data-testid=sweep-form]");
    await page.fill("#sweep-name", `${plantName} 5×5`);
    await page.fill("[data-testid=kp-min]", "0.5");
    await page.fill("[data-testid=kp-max]", "4");
    await page.fill("[data-testid=kp-count]", "5");
    await page.fill("[data-testid=ki-min]", "0.1");
    await page.fill("[data-testid=ki-max]", "1");
    await page.fill("[data-testid=ki-count]", "5");
    await page.fill("[data-testid=kd-min]", "0");
    await page.fill("[data-testid=kd-max]", "0");
    await page.fill("[data-testid=kd-count]", "1");
    // A full grid holds count_kp · count_ki · count_kd = 5 · 5 · 1 = 25 candidates.
    expect(await page.textContent("[data-testid=candidate-count]")).toBe("25");
    await saveScreenshot(page, "journey-07-sweep-form");
    await page.click("[data-testid=sweep-submit]");

    await page.waitForURL((url) => /\/sweeps\/[^/]+$/.test(url.pathname) && !url.pathname.endsWith("/new"));
    await page.waitForSelector("[data-testid=sweep-detail-page]");
    await saveScreenshot(page, "journey-08-sweep-started");
    await page.waitForSelector("[data-testid=front-chart] .main-svg", { timeout: RESULT_TIMEOUT_MS });
    await page.waitForSelector("[data-testid=front-row]", { timeout: RESULT_TIMEOUT_MS });
    expect(await page.textContent("[data-testid=sweep-status]")).toBe("finished");
    expect(await page.textContent("[data-testid=caution-note]")).toContain("Simulated designs are not validated designs.");
    const rows = await page.$$("[data-testid=front-row]");
    expect(rows.length).toBeGreaterThan(0);
    expect(rows.length).toBeLessThanOrEqual(25);
    await page.evaluate(() => window.scrollTo(0, 0));
    await saveScreenshot(page, "journey-09-sweep-front");

    // Clicking a highlighted point of the front picks that candidate (plotly reports the click at the mouse position).
    const frontPoint = await page.waitForSelector("[data-testid=front-chart] .scatterlayer .trace:nth-child(2) .point");
    const box = await frontPoint.boundingBox();
    expect(box).not.toBeNull();
    await page.mouse.click(box!.x + box!.width / 2, box!.y + box!.height / 2);
    await page.waitForSelector("[data-testid=response-chart] .main-svg", { timeout: RESULT_TIMEOUT_MS });
    expect(await page.textContent("[data-testid=response-section] h2")).toMatch(/candidate #\d+/);

    // Clicking a row of the front table picks that row's candidate.
    await rows[0].click();
    const firstIndex = await rows[0].getAttribute("data-index");
    await page.waitForFunction(
      (index) => document.querySelector("[data-testid=response-section] h2")?.textContent?.endsWith(`#${index}`) === true,
      firstIndex,
    );
    await page.waitForSelector("[data-testid=response-chart] .main-svg", { timeout: RESULT_TIMEOUT_MS });
    await page.evaluate(() => window.scrollTo(0, 0));
    await saveScreenshot(page, "journey-10-sweep-response");

    await page.click("[data-testid=nav-sweeps]");
    await page.waitForSelector("[data-testid=sweep-table]");
    await saveScreenshot(page, "journey-11-sweep-list");
  });

  it("when the demo viewer signs in, then creating a plant is refused in the UI and by the API", async () => {
    await signOut();
    await signInToHome(VIEWER);
    expect(await page.textContent("[data-testid=user-role]")).toBe("viewer");
    await saveScreenshot(page, "journey-12-home-viewer");

    await page.click("[data-testid=nav-library]");
    await page.waitForSelector("[data-testid=plant-table]");
    // The viewer is offered no button that leads to a form they cannot submit; the note says why.
    expect(await page.textContent("[data-testid=role-refusal]")).toContain("you are a viewer");
    expect(await page.$("[data-testid=new-plant]")).toBeNull();
    expect(await page.$("[data-testid=upload-step-test-link]")).toBeNull();
    await saveScreenshot(page, "journey-13-library-viewer");

    await page.goto(`${appUrl}/w/${WORKSPACE}/plants/new`);
    await page.waitForSelector("[data-testid=plant-form]");
    expect(await page.isDisabled("[data-testid=plant-submit]")).toBe(true);
    await saveScreenshot(page, "journey-14-plant-form-viewer");

    const answer = await page.evaluate(
      async ({ slug }) => {
        const response = await fetch(`/api/workspaces/${slug}/plants`, {
          method: "POST",
          headers: { "content-type": "application/json" },
          body: JSON.stringify({ name: "Viewer attempt", unitsNote: "", model: { kind: "transfer-function", num: [1], den: [1, 1], delay: 0 } }),
        });
        return { status: response.status, body: (await response.json()) as { error?: { message?: string } } };
      },
      { slug: WORKSPACE },
    );
    expect(answer.status).toBe(403);
    expect(answer.body.error?.message).toMatch(/engineer/);
  });

  it("then no page asked any host but the app, and no page threw", () => {
    expect(session.externalRequests).toEqual([]);
    expect(session.pageErrors).toEqual([]);
  });
});
