// An admin invites a colleague from the Members page; the colleague opens the link from the mail the
// local sink received (.eml parsed with mailparser), creates an account, accepts, and lands in the
// workspace with the invited role. Expectations are issue 13's.
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { saveScreenshot } from "../support/chromium.js";
import { DEMO_WORKSPACE, openBrowserSession, signIn, type BrowserSession } from "../support/browser-session.js";
import { waitForMail } from "../support/mail-inbox.js";

const appUrl = inject("appUrl");
const ADMIN = "mira@halvard.example";
const MAIL_DIR = process.env.LOOPYARD_MAIL_DIR ?? "";

let admin: BrowserSession;
let invitee: BrowserSession;

beforeAll(async () => {
  admin = await openBrowserSession(appUrl, { width: 1360, height: 1000 });
  invitee = await openBrowserSession(appUrl, { width: 1280, height: 900 });
});

afterAll(async () => {
  await admin?.close();
  await invitee?.close();
});

describe("invitation journey", () => {
  const email = `ola-${Date.now().toString(36)}@loopyard-tests.example`;
  let link = "";

  it("when the admin invites an address as an engineer, then the page lists it as pending and the sink receives the mail", async () => {
    expect(MAIL_DIR, "npm test sets LOOPYARD_MAIL_DIR for the browser project's mail sink").not.toBe("");
    const page = admin.page;
    await signIn(page, appUrl, ADMIN);
    await page.goto(`${appUrl}/w/${DEMO_WORKSPACE}/members`);
    await page.waitForSelector("[data-testid=member-table]");
    await page.fill("#invite-email", email);
    await page.selectOption("#invite-role", "engineer");
    await page.click("[data-testid=invite-submit]");
    await page.waitForSelector("[data-testid=invite-sent]");
    await page.waitForSelector(`[data-testid=invitation-row]:has-text("${email}")`);
    const mail = await waitForMail(MAIL_DIR, email, "invitation");
    link = mail.link;
    expect(new URL(link).pathname).toBe("/invitation");
    expect(mail.text).toContain(link);
  });

  it("when the invitee opens the link, signs up and accepts, then they see the workspace as an engineer", async () => {
    const page = invitee.page;
    await page.goto(link);
    await page.waitForSelector("[data-testid=invitation-signed-out]");
    await page.click("[data-testid=invitation-sign-up]");
    await page.waitForSelector("[data-testid=sign-up-form]");
    expect(await page.textContent("[data-testid=sign-up-note]")).toContain("address the invitation was mailed to");
    await page.fill("#name", "Ola Brekke");
    await page.fill("#email", email);
    await page.fill("#password", "ember-plates-in-a-row");
    await page.click("[data-testid=sign-up-submit]");
    await page.waitForSelector("[data-testid=invitation-offer]", { timeout: 30_000 });
    expect(await page.textContent("[data-testid=invitation-offer]")).toContain("Halvard Thermoworks");
    await saveScreenshot(page, "invitation-01-offer");
    await page.click("[data-testid=invitation-accept]");
    await page.waitForSelector("[data-testid=workspace-home]", { timeout: 30_000 });
    expect(new URL(page.url()).pathname).toBe(`/w/${DEMO_WORKSPACE}`);
    expect(await page.textContent("[data-testid=user-role]")).toBe("engineer");
    // Accepting the mailed link confirms the address: no notice asks for it.
    expect(await page.locator("[data-testid=verify-notice]").count()).toBe(0);
    expect(invitee.pageErrors).toEqual([]);
  });

  it("when the admin reloads the Members page, then the new engineer is listed and the audit trail shows the invitation and the acceptance", async () => {
    const page = admin.page;
    await page.reload();
    await page.waitForSelector(`[data-testid=member-row]:has-text("${email}")`);
    const audit = await page.textContent("[data-testid=audit-table]");
    expect(audit).toContain(`invited ${email} as an engineer`);
    expect(audit).toContain("accepted the invitation and joined as an engineer");
    expect(await page.locator(`[data-testid=invitation-row]:has-text("${email}")`).count()).toBe(0);
    await saveScreenshot(page, "members-01-admin");
    expect(admin.pageErrors).toEqual([]);
    expect(admin.externalRequests).toEqual([]);
  });
});
