// Every test project (see DEVELOPERS.md, "Tests"; npm test runs browser in a pass of its own):
//   core, server, web  — unit tests inside each package (its own vitest.config.ts when it has one);
//   integration        — tests/integration, real PostgreSQL over real HTTP (one file at a time);
//   browser            — tests/browser, headless Debian chromium against the built app, after all others.
// `npm test` prepares the database and passes DATABASE_URL and LOOPYARD_AUTH_SECRET through the environment.
import { existsSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { defineConfig } from "vitest/config";
import type { TestProjectConfiguration } from "vitest/config";

const root = fileURLToPath(new URL(".", import.meta.url));
const at = (path: string) => fileURLToPath(new URL(path, import.meta.url));

/** Unit projects run together first; integration, then browser, each after the previous group. */
const GROUP = { unit: 0, integration: 1, browser: 2 } as const;

function packageProject(name: "core" | "server" | "web"): TestProjectConfiguration {
  const config = `packages/${name}/vitest.config.ts`;
  if (existsSync(at(config))) return config;
  return {
    test: {
      name,
      root: at(`packages/${name}`),
      include: ["src/**/*.test.{ts,tsx}", "test/**/*.test.{ts,tsx}"],
      sequence: { groupOrder: GROUP.unit },
    },
  };
}

export default defineConfig({
  test: {
    projects: [
      packageProject("core"),
      packageProject("server"),
      packageProject("web"),
      {
        test: {
          name: "integration",
          root,
          include: ["tests/integration/**/*.test.ts"],
          environment: "node",
          testTimeout: 60_000,
          hookTimeout: 60_000,
          fileParallelism: false,
          sequence: { groupOrder: GROUP.integration },
        },
      },
      {
        test: {
          name: "browser",
          root,
          include: ["tests/browser/**/*.test.ts"],
          environment: "node",
          globalSetup: [at("tests/support/global-setup.ts")],
          testTimeout: 180_000,
          hookTimeout: 120_000,
          // One Chromium at a time: browser files never run in parallel.
          fileParallelism: false,
          sequence: { groupOrder: GROUP.browser },
        },
      },
    ],
  },
});
