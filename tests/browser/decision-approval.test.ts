// Propose → approve across two people signed in at once, in headless chromium against the built app:
// the demo engineer (Priya) proposes a candidate from a finished sweep's front table with a title and a
// rationale; the demo lead (Tomas) finds it waiting on his workspace home, opens it, reads the record
// and the caution, approves it; Priya's page then reads "approved" and offers her no approval of her own.
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Page } from "playwright-core";
import { DECISION_RECORD_FORMAT } from "@loopyard/core";
import { saveScreenshot } from "../support/chromium.js";
import { DEMO_WORKSPACE, openBrowserSession, signIn } from "../support/browser-session.js";
import type { BrowserSession } from "../support/browser-session.js";

const appUrl = inject("appUrl");
const base = `/w/${DEMO_WORKSPACE}`;
const title = `Ember 600 PI for the load case ${Date.now().toString(36)}`;

let engineer: BrowserSession;
let lead: BrowserSession;
let priya: Page;
let tomas: Page;
let decisionUrl = "";

beforeAll(async () => {
  engineer = await openBrowserSession(appUrl, { width: 1280, height: 900 });
  lead = await openBrowserSession(appUrl, { width: 1280, height: 900 });
  priya = engineer.page;
  tomas = lead.page;
  await signIn(priya, appUrl, "priya@halvard.example");
  await signIn(tomas, appUrl, "tomas@halvard.example");
});

afterAll(async () => {
  await engineer?.close();
  await lead?.close();
});

describe("propose and approve a design", () => {
  it("when the engineer proposes a row of a sweep's front, then the proposal opens on its own page as proposed, with the caution and no approve button for her", async () => {
    const response = await priya.request.get(`${appUrl}/api/workspaces/${DEMO_WORKSPACE}/sweeps`);
    const sweeps = (await response.json()) as { id: string; status: string; name: string }[];
    const sweep = sweeps.find((s) => s.status === "finished" && s.name.startsWith("Ember 600")) ?? sweeps.find((s) => s.status === "finished");
    expect(sweep).toBeDefined();
    await priya.goto(`${appUrl}${base}/sweeps/${sweep!.id}`);
    await priya.waitForSelector("[data-testid=front-row]", { timeout: 60_000 });
    const index = await priya.getAttribute("[data-testid=front-row] >> nth=0", "data-index");

    await priya.click("[data-testid=propose-row] >> nth=0");
    await priya.waitForSelector("[data-testid=propose-dialog][open]");
    expect(await priya.textContent("[data-testid=propose-what]")).toContain(`Candidate #${index} of “${sweep!.name}”`);
    // An empty rationale is refused in the dialog with the server's own sentence, before anything is sent.
    await priya.fill("[data-testid=propose-title]", title);
    await priya.click("[data-testid=propose-submit]");
    await priya.waitForSelector("[data-testid=field-error-rationale]");
    expect(await priya.textContent("[data-testid=field-error-rationale]")).toContain("rationale");
    await priya.fill("[data-testid=propose-rationale]", "Lowest effort on the front at an ISE within 5 % of the best; Ms checked below 1.6.");
    await saveScreenshot(priya, "decision-01-propose-dialog");
    await priya.click("[data-testid=propose-submit]");

    await priya.waitForURL((url) => /\/decisions\/[^/]+$/.test(url.pathname));
    decisionUrl = priya.url();
    await priya.waitForSelector("[data-testid=decision-page]");
    expect(await priya.textContent("[data-testid=page-title]")).toContain(title);
    expect(await priya.getAttribute("[data-testid=decision-state]", "data-state")).toBe("proposed");
    expect(await priya.textContent("[data-testid=decision-caution]")).toContain("never replace validation on the real machine");
    expect(await priya.textContent("[data-testid=decision-source-link]")).toContain(sweep!.name);
    expect(await priya.$("[data-testid=decision-approve]")).toBeNull();
    // She proposed it, so she may withdraw it; the trail starts with her proposal.
    expect(await priya.isVisible("[data-testid=decision-withdraw]")).toBe(true);
    expect(await priya.$$eval("[data-testid=decision-event]", (events) => events.map((e) => e.getAttribute("data-kind")))).toEqual(["proposed"]);
    await saveScreenshot(priya, "decision-02-proposed");
  });

  it("when the lead opens his workspace home, then the proposal waits for him; he reads it and approves it", async () => {
    await tomas.goto(`${appUrl}${base}`);
    await tomas.waitForSelector("[data-testid=waiting-approve]");
    await tomas.click(`[data-testid=waiting-link] >> text=${title}`);
    await tomas.waitForSelector("[data-testid=decision-page]");
    expect(tomas.url()).toBe(decisionUrl);
    await tomas.waitForSelector("[data-testid=decision-scores]");
    expect(await tomas.locator("[data-testid=decision-score-row]").count()).toBeGreaterThan(0);
    expect(await tomas.locator("[data-testid=decision-parameters] tr").count()).toBeGreaterThan(0);
    await saveScreenshot(tomas, "decision-03-lead-reads");

    await tomas.click("[data-testid=decision-approve]");
    await tomas.waitForSelector("[data-testid=decision-state][data-state=approved]");
    expect(await tomas.$("[data-testid=decision-approve]")).toBeNull();
    const kinds = await tomas.$$eval("[data-testid=decision-event]", (events) => events.map((e) => e.getAttribute("data-kind")));
    expect(kinds[0]).toBe("proposed");
    expect(kinds).toContain("approved");
    // The record of an approved decision names who approved it.
    const href = await tomas.getAttribute("[data-testid=record-json]", "href");
    const record = await tomas.request.get(`${appUrl}${href}`);
    expect(record.status()).toBe(200);
    const json = (await record.json()) as { format: string; state: string; approvedBy: { email: string } | null };
    expect(json.format).toBe(DECISION_RECORD_FORMAT);
    expect(json.state).toBe("approved");
    expect(json.approvedBy?.email).toBe("tomas@halvard.example");
    await saveScreenshot(tomas, "decision-04-approved");
  });

  it("when the engineer looks again, then her proposal reads approved by the lead, frozen, and is listed among approved decisions", async () => {
    await priya.reload();
    await priya.waitForSelector("[data-testid=decision-state][data-state=approved]");
    expect(await priya.textContent("[data-testid=decision-state-meaning]")).toContain("Frozen");
    expect(await priya.$("[data-testid=decision-actions]")).toBeNull();
    await priya.goto(`${appUrl}${base}/decisions?state=approved`);
    await priya.waitForSelector("[data-testid=decision-table]");
    const titles = await priya.$$eval("[data-testid=decision-link]", (links) => links.map((a) => a.textContent));
    expect(titles).toContain(title);
    expect(await priya.$$eval("[data-testid=decision-row]", (rows) => rows.every((r) => r.getAttribute("data-state") === "approved"))).toBe(true);
    expect(engineer.pageErrors).toEqual([]);
    expect(lead.pageErrors).toEqual([]);
  });
});
