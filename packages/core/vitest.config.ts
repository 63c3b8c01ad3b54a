import { defineConfig } from "vitest/config";

// Unit tests of @loopyard/core. Tests mirror the source path: src/criteria/iae.ts → test/criteria/iae.test.ts.
export default defineConfig({
  test: {
    name: "core",
    environment: "node",
    // test/ mirrors src/ for the numerics; some folders keep their tests beside the source (*.test.ts).
    include: ["test/**/*.test.ts", "src/**/*.test.ts"],
    sequence: { groupOrder: 0 },
    // The CLI and worker-pool tests start Node processes and worker threads; on a busy 2-core machine
    // one such test can take several seconds, so they get more than vitest's 5 s default.
    testTimeout: 30_000,
  },
});
