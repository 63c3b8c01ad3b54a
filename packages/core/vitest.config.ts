import { defineConfig } from "vitest/config";

// Unit tests of @loopyard/core. Tests mirror the source path: src/criteria/iae.ts → test/criteria/iae.test.ts.
export default defineConfig({
  test: {
    name: "core",
    environment: "node",
    // test/ mirrors src/ for the numerics; some folders keep their tests beside the source (*.test.ts).
    include: ["test/**/*.test.ts", "src/**/*.test.ts"],
    sequence: { groupOrder: 0 },
  },
});
