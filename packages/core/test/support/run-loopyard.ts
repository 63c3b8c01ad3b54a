import { spawn } from "node:child_process";
import { expect } from "vitest";
import { CLI_MAIN, CORE_DIR } from "./ensure-dist.js";

/** What one run of the built CLI left behind. */
export interface LoopyardRun {
  code: number | null;
  stdout: string;
  stderr: string;
}

/**
 * Runs the built CLI (node packages/core/dist/cli/main.js) in packages/core with `args`, writing
 * `input` (default empty) to its standard input. Call `ensureDist()` first (in a `beforeAll`).
 */
export function runLoopyard(args: string[], input?: string): Promise<LoopyardRun> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [CLI_MAIN, ...args], { cwd: CORE_DIR, stdio: ["pipe", "pipe", "pipe"] });
    let stdout = "";
    let stderr = "";
    child.stdout.on("data", (d: Buffer) => (stdout += d.toString()));
    child.stderr.on("data", (d: Buffer) => (stderr += d.toString()));
    child.on("error", reject);
    child.on("close", (code) => resolve({ code, stdout, stderr }));
    child.stdin.end(input ?? "");
  });
}

/** One sentence on stderr: a single line, starting with "loopyard: ", ending with a full stop and naming `field`. */
export function expectOneSentence(stderr: string, field: string): void {
  const lines = stderr.trimEnd().split("\n");
  expect(lines).toHaveLength(1);
  expect(lines[0]).toMatch(/^loopyard: .*\.$/);
  expect(lines[0]).toContain(field);
}
