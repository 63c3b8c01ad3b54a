// The seeded Ember 200 grid's front page read as a newcomer would, in headless chromium: the axes fit
// the front and most of the cloud (the far-out candidates drawn at the edge, all of them one click
// away), the tuning-rule labels keep apart inside the plot, log axes print uncrowded full tick labels,
// and the front table tells neighbouring rows apart.
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Page } from "playwright-core";
import { saveScreenshot } from "../support/chromium.js";
import { DEMO_WORKSPACE, openBrowserSession, signIn } from "../support/browser-session.js";
import type { BrowserSession } from "../support/browser-session.js";

const DEMO_SWEEP = "Ember 200 — first PID grid";
const RESULT_TIMEOUT_MS = 90_000;
const appUrl = inject("appUrl");

let session: BrowserSession;
let page: Page;

type Rect = { x: number; y: number; width: number; height: number };
const overlap = (a: Rect, b: Rect) => Math.min(a.x + a.width, b.x + b.width) > Math.max(a.x, b.x) && Math.min(a.y + a.height, b.y + b.height) > Math.max(a.y, b.y);

/** Rectangles of the elements matched inside the front chart, in page pixels. */
function rects(selector: string): Promise<Rect[]> {
  return page.$$eval(`[data-testid=front-chart] ${selector}`, (elements) =>
    elements.map((e) => {
      const r = e.getBoundingClientRect();
      return { x: r.x, y: r.y, width: r.width, height: r.height };
    }),
  );
}

/** The drawn x range of the front chart and the x values of its front trace (plotly's figure on the graph div). */
function frontSpan(): Promise<{ range: number[]; front: number[]; log: boolean }> {
  return page.$eval("[data-testid=front-chart] .js-plotly-plot", (graph) => {
    const g = graph as unknown as { data: { name?: string; x: ArrayLike<number> }[]; _fullLayout: { xaxis: { range: number[]; type: string } } };
    const front = g.data.find((t) => t.name === "front");
    return { range: [...g._fullLayout.xaxis.range], front: Array.from(front?.x ?? []), log: g._fullLayout.xaxis.type === "log" };
  });
}

beforeAll(async () => {
  session = await openBrowserSession(appUrl, { width: 1440, height: 1000 });
  page = session.page;
});

afterAll(async () => {
  await session?.close();
});

describe("the front page reads well", () => {
  it("when the viewer opens the seeded grid, then the axes fit the front and most of the cloud and the far-out candidates sit at the edge", async () => {
    await signIn(page, appUrl, "jon@halvard.example");
    const sweeps = await page.evaluate(async (slug) => (await fetch(`/api/workspaces/${slug}/sweeps`)).json(), DEMO_WORKSPACE);
    const sweep = (sweeps as { id: string; name: string }[]).find((s) => s.name === DEMO_SWEEP);
    expect(sweep).toBeDefined();
    await page.goto(`${appUrl}/w/${DEMO_WORKSPACE}/sweeps/${sweep?.id}`);
    await page.waitForSelector("[data-testid=front-chart] .main-svg", { timeout: RESULT_TIMEOUT_MS });
    await page.waitForSelector("[data-testid=reference-bound]", { timeout: RESULT_TIMEOUT_MS });
    const chart = await page.$("[data-testid=front-chart]");
    const marks = Number(await chart?.getAttribute("data-edge-marks"));
    expect(marks).toBeGreaterThan(0);
    const note = await page.textContent("[data-testid=far-out-note]");
    expect(note).toContain(`${marks} far-out candidate`);
    // The front (ISE 1.1 to 6.6 on this grid) spans at least 40 % of the x axis; with one far candidate at ISE ≈ 24 it was about 20 %.
    const fitted = await frontSpan();
    const share = (Math.max(...fitted.front) - Math.min(...fitted.front)) / (fitted.range[1]! - fitted.range[0]!);
    expect(share).toBeGreaterThan(0.4);
    await saveScreenshot(page, "front-01-fitted-axes");

    await page.click("[data-testid=far-out-toggle]");
    await page.waitForFunction(() => document.querySelector("[data-testid=front-chart]")?.getAttribute("data-edge-marks") === "0");
    expect(await page.textContent("[data-testid=far-out-note]")).toContain("Showing every candidate");
    const all = await frontSpan();
    expect(all.range[1]! - all.range[0]!).toBeGreaterThan(fitted.range[1]! - fitted.range[0]!);
    await page.click("[data-testid=far-out-toggle]");
    await page.waitForFunction((n) => document.querySelector("[data-testid=front-chart]")?.getAttribute("data-edge-marks") === String(n), marks);
  });

  it("when the baselines are drawn, then their labels overlap neither each other nor leave the plot area", async () => {
    const chart = await page.$("[data-testid=front-chart]");
    const labelled = Number(await chart?.getAttribute("data-labels"));
    expect(labelled).toBeGreaterThanOrEqual(3);
    const labels = await rects("g.annotation .bg");
    expect(labels).toHaveLength(labelled);
    const [area] = await rects(".nsewdrag");
    for (let i = 0; i < labels.length; i++) {
      for (let j = i + 1; j < labels.length; j++) expect(overlap(labels[i]!, labels[j]!)).toBe(false);
      expect(labels[i]!.x).toBeGreaterThanOrEqual(area!.x - 1);
      expect(labels[i]!.x + labels[i]!.width).toBeLessThanOrEqual(area!.x + area!.width + 1);
      expect(labels[i]!.y).toBeGreaterThanOrEqual(area!.y - 1);
      expect(labels[i]!.y + labels[i]!.height).toBeLessThanOrEqual(area!.y + area!.height + 1);
    }
  });

  it("when log axes are chosen, then the tick labels are whole numbers that do not overlap", async () => {
    await page.check("[data-testid=log-axes]");
    await page.waitForFunction(() => {
      const graph = document.querySelector("[data-testid=front-chart] .js-plotly-plot") as unknown as { _fullLayout?: { xaxis: { type: string } } } | null;
      return graph?._fullLayout?.xaxis.type === "log";
    });
    await page.waitForTimeout(300);
    for (const axis of ["xtick", "ytick"]) {
      const texts = await page.$$eval(`[data-testid=front-chart] .${axis} text`, (elements) => elements.map((e) => e.textContent ?? ""));
      expect(texts.length).toBeGreaterThanOrEqual(3);
      // Printed in full (d3 "~g"): "0.5", "20", "200" — never plotly's lone small digits between the powers of ten on a multi-decade axis.
      for (const text of texts) expect(Number(text.replace("−", "-"))).not.toBeNaN();
      const boxes = await rects(`.${axis} text`);
      for (let i = 1; i < boxes.length; i++) expect(overlap(boxes[i - 1]!, boxes[i]!)).toBe(false);
    }
    await saveScreenshot(page, "front-02-log-axes");
  });

  it("when the front table is read, then neighbouring rows with different values print differently", async () => {
    const columns = await page.$$eval("[data-testid=front-row]", (rows) =>
      rows.map((row) => Array.from(row.querySelectorAll("td[data-score]")).map((td) => ({ value: td.getAttribute("data-score"), text: td.textContent }))),
    );
    expect(columns.length).toBeGreaterThan(10);
    for (let r = 1; r < columns.length; r++) {
      columns[r]!.forEach((cell, c) => {
        const above = columns[r - 1]![c]!;
        if (cell.value !== above.value) expect(cell.text).not.toBe(above.text);
      });
    }
    expect(session.pageErrors).toEqual([]);
  });
});
