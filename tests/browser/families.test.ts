// Families in headless chromium against the built app: the demo engineer opens the saved Ember line
// from the left navigation (its variants, revisions with notes, what changed from revision 1 to 2),
// saves a new family with a seeded manufacturing spread, revises it with a change note, sweeps it from
// the sweep form's family picker, and archives it (then it is no longer offered). The plant page shows
// revisions with their notes and the field-by-field diff after a revision saved with a note.
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Page } from "playwright-core";
import { saveScreenshot } from "../support/chromium.js";
import { DEMO_WORKSPACE, openBrowserSession, signIn } from "../support/browser-session.js";
import type { BrowserSession } from "../support/browser-session.js";

const appUrl = inject("appUrl");
const stamp = Date.now().toString(36);
const familyName = `Ember 800 bench spread ${stamp}`;

let session: BrowserSession;
let page: Page;

beforeAll(async () => {
  session = await openBrowserSession(appUrl, { width: 1440, height: 1000 });
  page = session.page;
  await signIn(page, appUrl, "priya@halvard.example");
});

afterAll(async () => {
  await session?.close();
});

describe("families in the library", () => {
  it("when the engineer opens Families, then the Ember line shows its variants, noted revisions and what changed", async () => {
    await page.goto(`${appUrl}/w/${DEMO_WORKSPACE}`);
    await page.click("[data-testid=nav-families]");
    await page.waitForSelector("[data-testid=family-list-page]");
    await saveScreenshot(page, "families-list");
    await page.click("[data-testid=family-link] >> text=Ember line");
    await page.waitForSelector("[data-testid=family-detail-page]");
    expect(await page.locator("[data-testid=family-variant-row]").count()).toBe(4);
    expect(await page.locator("[data-testid=revision-note]").allTextContents()).toEqual([
      "Adds the radiative 800 plate at Ta = 303 K for the summer acceptance tests.",
      "The line as sold in 2026.",
    ]);
    await page.waitForSelector("[data-testid=diff-change]");
    const changes = await page.locator("[data-testid=diff-change]").allTextContents();
    expect(changes.some((c) => c.includes("variants.Ember 800 radiative, warm floor"))).toBe(true);
    await page.waitForSelector("[data-testid=family-used-by] >> text=Ember line — which criterion should we tune by?");
    await saveScreenshot(page, "family-detail");
  });

  it("when the engineer saves a family with a seeded spread, then its page lists the drawn variants; a revision needs a note", async () => {
    await page.goto(`${appUrl}/w/${DEMO_WORKSPACE}/families/new`);
    await page.waitForSelector("[data-testid=family-form]");
    await page.fill("[data-testid=family-name]", familyName);
    await page.selectOption("[data-testid=family-entry-0-plant]", { label: "Ember 800 plate (radiative)" });
    await page.waitForSelector("[data-testid=family-entry-0-spread-on]");
    await page.check("[data-testid=family-entry-0-spread-on]");
    await page.selectOption("#family-entry-0-design", "latin-hypercube");
    await page.fill("#family-entry-0-count", "4");
    await page.fill("#family-entry-0-seed", "11");
    await page.selectOption("#family-entry-0-row-0-name", "c");
    await page.fill("#family-entry-0-row-0-min", "360");
    await page.fill("#family-entry-0-row-0-max", "440");
    await page.waitForFunction(() => document.querySelector("[data-testid=family-variant-count]")?.textContent === "4");
    await saveScreenshot(page, "family-new");
    await page.click("[data-testid=family-submit]");
    await page.waitForSelector("[data-testid=family-detail-page]");
    expect(await page.locator("[data-testid=family-variant-row]").count()).toBe(4);

    await page.click("[data-testid=revise-family]");
    await page.waitForSelector("[data-testid=family-form]");
    await page.fill("#family-entry-0-count", "5");
    await page.click("[data-testid=family-submit]");
    await page.waitForSelector("[data-testid=field-error-note]");
    await page.fill("[data-testid=family-note]", "one more plate from the March batch");
    await page.click("[data-testid=family-submit]");
    await page.waitForSelector("[data-testid=family-detail-page] >> text=Revision 2 of 2");
    expect(await page.locator("[data-testid=family-variant-row]").count()).toBe(5);
    await page.waitForSelector("[data-testid=diff-change]");
  });

  it("when the engineer picks the saved family in the sweep form, then the sweep runs on its variants; archived, it is no longer offered", async () => {
    await page.goto(`${appUrl}/w/${DEMO_WORKSPACE}/sweeps/new`);
    await page.waitForSelector("[data-testid=sweep-form]");
    const option = await page.locator("[data-testid=saved-family] option", { hasText: familyName }).getAttribute("value");
    await page.selectOption("[data-testid=saved-family]", option ?? "");
    await page.waitForSelector("[data-testid=saved-family-variants]");
    expect(await page.locator("[data-testid=saved-family-variants] [data-testid=family-variant-row]").count()).toBe(5);
    await page.waitForSelector("[data-testid=evaluation-count] >> text=5 variants");
    await saveScreenshot(page, "sweep-form-saved-family");

    await page.goto(`${appUrl}/w/${DEMO_WORKSPACE}/comparisons/new`);
    await page.waitForSelector("[data-testid=comparison-form]");
    const line = await page.locator("[data-testid=saved-family] option", { hasText: "Ember line" }).first().getAttribute("value");
    await page.selectOption("[data-testid=saved-family]", line ?? "");
    await page.waitForSelector("[data-testid=saved-family-variants]");
    expect(await page.locator("[data-testid=saved-family-variants] [data-testid=family-variant-row]").count()).toBe(4);

    await page.goto(`${appUrl}/w/${DEMO_WORKSPACE}/families`);
    await page.click(`[data-testid=family-link] >> text=${familyName}`);
    await page.click("[data-testid=archive-family]");
    await page.waitForSelector("[data-testid=archived-note]");
    await page.goto(`${appUrl}/w/${DEMO_WORKSPACE}/sweeps/new`);
    await page.waitForSelector("[data-testid=saved-family]");
    expect(await page.locator("[data-testid=saved-family] option", { hasText: familyName }).count()).toBe(0);
  });

  it("when the engineer chooses an exported library file to import, then the preview lists every plant and family with its action before anything is imported", async () => {
    const file = await page.evaluate(async (slug) => (await fetch(`/api/workspaces/${slug}/library/export`)).text(), DEMO_WORKSPACE);
    await page.goto(`${appUrl}/w/${DEMO_WORKSPACE}/plants`);
    await page.click("[data-testid=import-library]");
    await page.waitForSelector("[data-testid=library-import-page]");
    await page.setInputFiles("[data-testid=library-file]", { name: "ember.loopyard.json", mimeType: "application/json", buffer: Buffer.from(file) });
    await page.waitForSelector("[data-testid=import-row]");
    const actions = await page.locator("[data-testid=import-action]").allTextContents();
    // Every name of the file is taken in the workspace it came from: all renamed by default.
    expect(actions.length).toBeGreaterThanOrEqual(7);
    expect(new Set(actions)).toEqual(new Set(["rename"]));
    await saveScreenshot(page, "library-import-preview");
    await page.click("[data-testid=on-clash-skip]");
    await page.waitForFunction(() => [...document.querySelectorAll("[data-testid=import-action]")].every((cell) => cell.textContent === "skip"));
  });

  it("when the engineer revises a plant with a note, then its page lists the note and the changed coefficient with its sign", async () => {
    await page.goto(`${appUrl}/w/${DEMO_WORKSPACE}/plants/new`);
    await page.waitForSelector("[data-testid=plant-form]");
    const plantName = `Bench plate ${stamp}`;
    await page.fill("#plant-name", plantName);
    await page.fill("[name='model.num']", "1");
    await page.fill("[name='model.den']", "5, 1");
    await page.click("[data-testid=plant-submit]");
    await page.waitForSelector("[data-testid=plant-detail-page]");
    await page.click("[data-testid=new-revision]");
    await page.waitForSelector("[data-testid=plant-form]");
    await page.fill("[name='model.den']", "5, -1");
    await page.click("[data-testid=plant-submit]");
    await page.waitForSelector("[data-testid=field-error-note]");
    await page.fill("[data-testid=plant-note]", "the plate runs away without feedback: unstable pole");
    await page.click("[data-testid=plant-submit]");
    await page.waitForSelector("[data-testid=plant-detail-page] >> text=Revision 2 of 2");
    await page.waitForSelector("[data-testid=diff-change]");
    const changes = await page.locator("[data-testid=diff-change]").allTextContents();
    expect(changes).toEqual([expect.stringContaining("model.den.1")]);
    expect(changes[0]).toContain("−1");
    expect(await page.locator("[data-testid=revision-note]").allTextContents()).toEqual(["the plate runs away without feedback: unstable pole", "no note"]);
    await saveScreenshot(page, "plant-revisions-diff");
    expect(session.pageErrors).toEqual([]);
  });
});
