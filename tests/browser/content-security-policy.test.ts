// The Content-Security-Policy and Permissions-Policy of the built app in headless chromium: the
// pages carry them, and the app still works under them — sign-in, the plant page's step chart, the
// sweep page's plotly chart with its front, the points worker — with no violation reported by the
// browser (the `securitypolicyviolation` event, W3C CSP Level 3, section 6) and no page error.
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
    expect(headers["content-security-policy"]).not.toMatch(/script-src[^;]*(https?:|\*|'unsafe-inline')/);
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
});
