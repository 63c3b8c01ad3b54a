// Headless Debian chromium for the browser tests, kept off the network, and a screenshot helper.
import { mkdir } from "node:fs/promises";
import { fileURLToPath } from "node:url";
import { chromium } from "playwright-core";
import type { Browser, Page } from "playwright-core";

import { CHROMIUM_ARGS, CHROMIUM_PATH } from "../../packages/server/src/bench/headless-chromium.js";

export { CHROMIUM_ARGS, CHROMIUM_PATH };

/** Folder for screenshots taken by browser tests (ignored by git). */
export const SCREENS_DIR = fileURLToPath(new URL("../../test-results/screens/", import.meta.url));

/**
 * Launches headless chromium. playwright-core gives each launch a fresh temporary profile
 * (its own --user-data-dir), removed when the browser closes.
 */
export async function launchChromium(): Promise<Browser> {
  return chromium.launch({
    executablePath: CHROMIUM_PATH,
    headless: true,
    args: [...CHROMIUM_ARGS],
  });
}

/**
 * Saves a PNG of the whole page (or, with `fullPage: false`, of the window only — quicker for a very tall
 * page on a busy machine) as test-results/screens/<name>.png and returns its path.
 */
export async function saveScreenshot(page: Page, name: string, { fullPage = true }: { fullPage?: boolean } = {}): Promise<string> {
  if (!/^[a-z0-9][a-z0-9._-]*$/i.test(name)) {
    throw new RangeError(`saveScreenshot: name must be letters, digits, dots, dashes or underscores, got "${name}"`);
  }
  await mkdir(SCREENS_DIR, { recursive: true });
  const path = `${SCREENS_DIR}${name}.png`;
  await page.screenshot({ path, fullPage });
  return path;
}
