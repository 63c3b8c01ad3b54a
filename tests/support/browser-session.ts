// One chromium page per browser test file, watched for page errors and for requests that leave the app,
// and the demo sign-in through the app's own form.
import type { Browser, BrowserContext, Page } from "playwright-core";
import { launchChromium } from "./chromium.js";

/** The seeded demo workspace and the password every demo user shares (see the demo seed). */
export const DEMO_WORKSPACE = "halvard-thermal";
export const DEMO_PASSWORD = "ember-demo-2026";

export interface BrowserSession {
  browser: Browser;
  context: BrowserContext;
  page: Page;
  /** Every request the page made outside the app (other than data: and blob: URLs), in order. */
  externalRequests: string[];
  /** The message of every uncaught error in the page, in order. */
  pageErrors: string[];
  close(): Promise<void>;
}

/** Launches chromium with one page of the given viewport, recording page errors and requests that leave `appUrl`. */
export async function openBrowserSession(appUrl: string, viewport: { width: number; height: number }): Promise<BrowserSession> {
  const browser = await launchChromium();
  const context = await browser.newContext({ viewport });
  const page = await context.newPage();
  const externalRequests: string[] = [];
  const pageErrors: string[] = [];
  page.on("request", (request) => {
    const url = request.url();
    if (!url.startsWith(appUrl) && !url.startsWith("data:") && !url.startsWith("blob:")) externalRequests.push(url);
  });
  page.on("pageerror", (error) => pageErrors.push(error.message));
  return {
    browser,
    context,
    page,
    externalRequests,
    pageErrors,
    async close() {
      await context.close();
      await browser.close();
    },
  };
}

/** Signs in through the sign-in form and waits until the app has left the sign-in page. */
export async function signIn(page: Page, appUrl: string, email: string, password: string = DEMO_PASSWORD): Promise<void> {
  await page.goto(`${appUrl}/sign-in`);
  await page.fill("#email", email);
  await page.fill("#password", password);
  await page.click("[data-testid=sign-in-submit]");
  await page.waitForURL((url) => !url.pathname.startsWith("/sign-in"));
}
