// Headless Debian chromium as the bench and the browser tests (tests/support/chromium.ts) launch it.

export const CHROMIUM_PATH = "/usr/bin/chromium";

/** Flags that keep chromium headless, sandbox-free (we run as root) and off every network but loopback. */
export const CHROMIUM_ARGS = [
  "--no-sandbox",
  "--disable-gpu",
  "--disable-quic",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
  "--disable-dev-shm-usage",
] as const;
