import { defineConfig } from "vitest/config";

// Unit tests of @loopyard/core. Tests mirror the source path: src/criteria/iae.ts → test/criteria/iae.test.ts.
export default defineConfig({
  test: {
    name: "core",
    environment: "node",
    include: ["test/**/*.test.ts"],
    sequence: { groupOrder: 0 },
  },
});
