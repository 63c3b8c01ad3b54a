// The engine's choices in headless chromium against the built app on the seeded test database: the demo
// engineer types a nonlinear tank (first with a misspelt function, named next to its derivative), reads its
// linearisation poles and step, and sweeps a PI grid on it under a load step, scored on IAE, settling time and
// effort. Settling time is a step-response figure: under a load step alone it does not apply (core criteria
// return NaN, the API null), so the front is drawn on IAE against effort and settling time reads "—".
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Page } from "playwright-core";
import { saveScreenshot } from "../support/chromium.js";
import { DEMO_WORKSPACE, openBrowserSession, signIn } from "../support/browser-session.js";
import type { BrowserSession } from "../support/browser-session.js";

const WORKSPACE = DEMO_WORKSPACE;
const ENGINEER = "priya@halvard.example";
/** A 16-candidate sweep of a one-state nonlinear loop plus the lazy plot bundle. */
const RESULT_TIMEOUT_MS = 120_000;

const appUrl = inject("appUrl");

let session: BrowserSession;
let page: Page;

beforeAll(async () => {
  session = await openBrowserSession(appUrl, { width: 1360, height: 900 });
  page = session.page;
});

afterAll(async () => {
  await session?.close();
});

describe("engine choices: a nonlinear tank, its poles, and a PI sweep under a load step", () => {
  const plantName = `Ember drain tank ${Date.now().toString(36)}`;

  it("when the demo engineer types the tank with sqr(h), then the refusal names the token next to dh/dt; fixed, the plant is saved", async () => {
    await signIn(page, appUrl, ENGINEER);
    await page.goto(`${appUrl}/w/${WORKSPACE}/plants/new`);
    await page.waitForSelector("[data-testid=plant-form]");

    await page.check("[data-testid=plant-kind-nonlinear]");
    await page.waitForSelector("#plant-states");
    await page.fill("#plant-name", plantName);
    await page.fill("#plant-units", "u: inflow valve opening [0–1]; y: level h [m]");
    await page.fill("#plant-states", "h");
    await page.fill("#plant-parameters", "a = 0.5\nb = 1\nA = 2");
    // Tank balance A·dh/dt = −a·√h + b·u, with the square root misspelt.
    await page.fill("[data-testid=derivative-0]", "(-a*sqr(h) + b*u)/A");
    await page.fill("[data-testid=initial-0]", "1");
    await page.fill("#plant-output", "h");
    // At h = 1 the outflow a·√h = 0.5 equals the inflow b·u for u₀ = 0.5: an equilibrium (closed form).
    await page.fill("#plant-operating-input", "0.5");
    await page.fill("#plant-actuator-min", "0");
    await page.fill("#plant-actuator-max", "1");
    expect(await page.textContent("[data-testid=expression-grammar]")).toContain("sqrt");
    await page.click("[data-testid=plant-submit]");

    const error = await page.waitForSelector("[data-testid='field-error-model.derivatives.0']");
    expect(await error.textContent()).toContain("sqr");
    await saveScreenshot(page, "engine-01-nonlinear-typo");

    await page.fill("[data-testid=derivative-0]", "(-a*sqrt(h) + b*u)/A");
    expect(await page.textContent("[data-testid=plant-preview]")).toContain("dh/dt = (-a*sqrt(h) + b*u)/A");
    await saveScreenshot(page, "engine-02-nonlinear-form");
    await page.click("[data-testid=plant-submit]");
    await page.waitForSelector("[data-testid=plant-detail-page]");
    expect(await page.textContent("[data-testid=page-title]")).toBe(plantName);
  });

  it("when she opens its detail page, then the formulas, parameters, the linearisation pole and the open-loop step show", async () => {
    expect(await page.textContent("[data-testid=plant-kind-label]")).toBe("nonlinear");
    expect(await page.textContent("[data-testid=nonlinear-equations]")).toContain("dh/dt = (-a*sqrt(h) + b*u)/A");
    expect(await page.textContent("[data-testid=parameter-table]")).toContain("A");
    // Linearisation at h = 1 (closed form): ∂/∂h [(−a√h + b u)/A] = −a/(2A√h) = −0.5/(2·2·1) = −0.125.
    expect(await page.textContent("[data-testid=poles-section] h2")).toBe("Poles of the linearisation");
    expect(await page.textContent("[data-testid=poles-table]")).toContain("−0.125");
    expect(await page.textContent("[data-testid=actuator-limits]")).toContain("Highest u");
    await page.waitForSelector("[data-testid=plant-step-chart] .main-svg", { timeout: RESULT_TIMEOUT_MS });
    await saveScreenshot(page, "engine-03-nonlinear-detail");
  });

  it("when she sweeps a 4 × 4 PI grid under a load step on IAE, settling time and effort, then it finishes, settling time reads — and the front and a response with the load time appear", async () => {
    await page.click("[data-testid=sweep-this-revision]");
    await page.waitForSelector("[data-testid=sweep-form]");
    await page.check("[data-testid=structure-pi]");
    await page.fill("#sweep-name", `${plantName} PI load`);
    await page.fill("[data-testid=kp-min]", "0.5");
    await page.fill("[data-testid=kp-max]", "4");
    await page.fill("[data-testid=kp-count]", "4");
    await page.fill("[data-testid=ki-min]", "0.05");
    await page.fill("[data-testid=ki-max]", "0.5");
    await page.fill("[data-testid=ki-count]", "4");
    expect(await page.$("[data-testid=kd-min]")).toBeNull();
    await page.check("[data-testid=scenario-load-step]");
    await page.fill("#load-size", "0.2");
    await page.fill("#load-time", "5");
    await page.fill("#horizon", "60");
    await page.fill("#dt", "0.05");
    for (const id of ["ise", "itae"]) await page.uncheck(`[data-testid=criterion-${id}]`);
    await page.check("[data-testid=criterion-iae]");
    await page.check("[data-testid=criterion-settlingTime]");
    await page.check("[data-testid=criterion-effort]");
    expect(await page.textContent("[data-testid=criteria-scenario-note]")).toContain("settling time do not apply");
    // A full grid holds count_kp · count_ki = 4 · 4 = 16 candidates.
    expect(await page.textContent("[data-testid=candidate-count]")).toBe("16");
    await saveScreenshot(page, "engine-04-sweep-form");
    await page.click("[data-testid=sweep-submit]");

    await page.waitForURL((url) => /\/sweeps\/[^/]+$/.test(url.pathname) && !url.pathname.endsWith("/new"));
    await page.waitForSelector("[data-testid=sweep-detail-page]");
    await page.waitForSelector("[data-testid=front-chart] .main-svg", { timeout: RESULT_TIMEOUT_MS });
    await page.waitForSelector("[data-testid=front-row]", { timeout: RESULT_TIMEOUT_MS });
    expect(await page.textContent("[data-testid=sweep-status]")).toBe("finished");
    expect(await page.textContent("[data-testid=sweep-definition]")).toContain("load step of 0.2 at t = 5 s");
    expect(await page.textContent("[data-testid=caution-note]")).toContain("Simulated designs are not validated designs.");
    expect(await page.inputValue("[data-testid=criterion-x]")).toBe("iae");
    expect(await page.inputValue("[data-testid=criterion-y]")).toBe("effort");
    const rows = await page.$$("[data-testid=front-row]");
    expect(rows.length).toBeGreaterThan(0);
    expect(rows.length).toBeLessThanOrEqual(16);
    const notApplicable = await page.waitForSelector("[data-testid=front-row] td[data-score='n/a']");
    expect(await notApplicable.textContent()).toBe("—");
    expect(await notApplicable.getAttribute("title")).toBe("does not apply to this scenario");

    await rows[0].click();
    const chart = await page.waitForSelector("[data-testid=response-chart] .main-svg", { timeout: RESULT_TIMEOUT_MS });
    expect(chart).not.toBeNull();
    expect(await page.getAttribute("[data-testid=response-chart]", "data-load-time")).toBe("5");
    expect(await page.textContent("[data-testid=response-section]")).toContain("load step");
    await page.evaluate(() => window.scrollTo(0, 0));
    await saveScreenshot(page, "engine-05-sweep-front");
  });

  it("then no page asked any host but the app, and no page threw", () => {
    expect(session.externalRequests).toEqual([]);
    expect(session.pageErrors).toEqual([]);
  });
});
