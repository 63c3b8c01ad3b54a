// Sign-up through the page: sign-up alone starts no session (a taken address must answer like a fresh
// one), so the page signs in right after; a common password is refused with the server's sentence.
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Page } from "playwright-core";
import { saveScreenshot } from "../support/chromium.js";
import { openBrowserSession } from "../support/browser-session.js";
import type { BrowserSession } from "../support/browser-session.js";

const appUrl = inject("appUrl");
let session: BrowserSession;
let page: Page;

beforeAll(async () => {
  session = await openBrowserSession(appUrl, { width: 1280, height: 900 });
  page = session.page;
});

afterAll(async () => {
  await session?.close();
});

async function fillSignUp(name: string, email: string, password: string): Promise<void> {
  await page.goto(`${appUrl}/sign-up`);
  await page.fill("#name", name);
  await page.fill("#email", email);
  await page.fill("#password", password);
  await page.click("[data-testid=sign-up-submit]");
}

describe("sign-up page", () => {
  it("when someone picks a common password, then the page shows the server's sentence and no account is made", async () => {
    await fillSignUp("Ada Common", `ada-common-${Date.now()}@loopyard-tests.example`, "qwertyuiop");
    await page.waitForSelector("text=most common passwords", { timeout: 30_000 });
    await saveScreenshot(page, "sign-up-01-common-password");
  });

  it("when someone signs up with a fresh address, then the page signs them in and leaves the sign-up page", async () => {
    await fillSignUp("Ada Fresh", `ada-fresh-${Date.now()}@loopyard-tests.example`, "ember-plates-in-a-row");
    await page.waitForURL((url) => !url.pathname.startsWith("/sign-up"), { timeout: 30_000 });
    const me = await page.evaluate(async () => (await fetch("/api/me")).status);
    expect(me).toBe(200);
    expect(session.pageErrors).toEqual([]);
  });
});
