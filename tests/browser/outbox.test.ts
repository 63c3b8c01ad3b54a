// Mail in the browser against the built app and its local mail sink (npm test starts it for the app
// server): the demo engineer's sweep ends, the admin reads its mail in the Outbox (HTML in a
// sandboxed frame, and the plain text), and the engineer turns that kind of mail off from the user menu.
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { BrowserContext, Page } from "playwright-core";
import { saveScreenshot } from "../support/chromium.js";
import { DEMO_WORKSPACE, openBrowserSession, signIn } from "../support/browser-session.js";
import type { BrowserSession } from "../support/browser-session.js";

const appUrl = inject("appUrl");
const sweepName = `Mail check ${Date.now().toString(36)}`;
const api = (path: string) => `${appUrl}/api/workspaces/${DEMO_WORKSPACE}${path}`;

/** The stored setting of `kind`, read from the API until it equals `expected` (the switch saves in the background) or 10 s pass. */
async function storedSetting(page: Page, kind: string, expected: boolean): Promise<boolean | undefined> {
  let enabled: boolean | undefined;
  for (let tries = 0; tries < 50; tries++) {
    const body = (await (await page.request.get(`${appUrl}/api/me/notifications`)).json()) as { settings: { kind: string; enabled: boolean }[] };
    enabled = body.settings.find((s) => s.kind === kind)?.enabled;
    if (enabled === expected) break;
    await page.waitForTimeout(200);
  }
  return enabled;
}

let session: BrowserSession;
let engineer: Page;
let adminContext: BrowserContext;
let admin: Page;

beforeAll(async () => {
  session = await openBrowserSession(appUrl, { width: 1440, height: 1000 });
  engineer = session.page;
  adminContext = await session.browser.newContext({ viewport: { width: 1440, height: 1000 } });
  admin = await adminContext.newPage();
});

afterAll(async () => {
  await adminContext?.close();
  await session?.close();
});

describe.skipIf(Boolean(process.env.SMTP_URL))("outbox and notification settings", () => {
  it("when Priya's sweep finishes, then Mira (admin) finds its mail in the Outbox and reads it as HTML and as plain text", async () => {
    await signIn(engineer, appUrl, "priya@halvard.example");
    // Not an admin: no Outbox in her navigation.
    expect(await engineer.$("[data-testid=nav-outbox]")).toBeNull();
    // Her sweep mail on (an earlier run of this file may have left it off).
    const on = await engineer.request.put(`${appUrl}/api/me/notifications`, { headers: { origin: appUrl }, data: { settings: [{ kind: "sweep-finished", enabled: true }] } });
    expect(on.status(), await on.text()).toBe(200);
    // A four-candidate sweep through the API, in her signed-in browser context (same origin, her cookie).
    const plants = await engineer.request.get(api("/plants"));
    const plant = ((await plants.json()) as { name: string; kind: string; latestRevision: { id: string } }[]).find((p) => p.kind === "transfer-function");
    expect(plant, "a transfer-function plant in the demo library").toBeDefined();
    const created = await engineer.request.post(api("/sweeps"), {
      headers: { origin: appUrl },
      data: {
        name: sweepName,
        plantRevisionId: plant!.latestRevision.id,
        structure: "pi",
        ranges: { kp: { min: 0.5, max: 2, count: 2 }, ki: { min: 0.05, max: 0.2, count: 2 } },
        scenario: { kind: "setpoint-step", horizon: 50, dt: 0.05 },
        criteria: ["iae", "effort"],
      },
    });
    expect(created.status(), await created.text()).toBe(201);

    await signIn(admin, appUrl, "mira@halvard.example");
    await admin.click("[data-testid=nav-outbox]");
    await admin.waitForSelector("[data-testid=page-title]:has-text('Outbox')");
    // The outbox looks again every 10 s; reload until the mail has come through queue and sink.
    const row = admin.locator("[data-testid=outbox-row]", { hasText: `Sweep finished: ${sweepName}` });
    for (let tries = 0; (await row.count()) === 0; tries++) {
      expect(tries, "the sweep's mail reached the outbox within 90 s").toBeLessThan(90);
      await admin.waitForTimeout(1_000);
      if (tries % 10 === 9) await admin.reload();
    }
    expect(await row.textContent()).toContain("priya@halvard.example");
    expect(await row.textContent()).toContain("Sweep finished");
    await row.locator("button").click();
    const frame = admin.frameLocator("[data-testid=outbox-html]");
    await frame.locator("h1").waitFor();
    expect(await frame.locator("h1").textContent()).toContain(`Your sweep “${sweepName}”`);
    expect(await admin.getAttribute("[data-testid=outbox-html]", "sandbox")).toBe("allow-popups allow-popups-to-escape-sandbox");
    await saveScreenshot(admin, "mail-01-outbox-html");
    await admin.click("button:has-text('Plain text')");
    expect(await admin.textContent("[data-testid=outbox-text]")).toMatch(new RegExp(`Open the sweep: ${appUrl}/w/${DEMO_WORKSPACE}/sweeps/[0-9a-f-]{36}`));
    await saveScreenshot(admin, "mail-02-outbox-text");
  });

  it("when Priya opens Notification settings from the user menu and turns 'Sweep finished' off, then the setting is saved; account mail cannot be turned off", async () => {
    await engineer.click("[data-testid=user-menu] summary");
    await engineer.click("[data-testid=menu-notifications]");
    await engineer.waitForSelector("[data-testid=notification-settings]");
    const box = engineer.locator("[data-testid=notify-sweep-finished]");
    expect(await box.isChecked()).toBe(true);
    // A click, not uncheck(): the box shows the stored setting, so it changes once the server has saved it.
    await box.click();
    expect(await storedSetting(engineer, "sweep-finished", false)).toBe(false);
    expect(await engineer.textContent("main")).toContain("These are always sent");
    await saveScreenshot(engineer, "mail-03-notification-settings");
    // Back on, as the demo had it.
    await box.click();
    expect(await storedSetting(engineer, "sweep-finished", true)).toBe(true);
    expect(session.pageErrors).toEqual([]);
  });
});
