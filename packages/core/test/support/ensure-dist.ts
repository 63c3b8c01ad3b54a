import { execFileSync } from "node:child_process";
import { chmodSync, existsSync, mkdirSync, readdirSync, rmSync, statSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";

/** packages/core */
export const CORE_DIR = fileURLToPath(new URL("../..", import.meta.url));
/** The built CLI entry. */
export const CLI_MAIN = join(CORE_DIR, "dist", "cli", "main.js");
const TSC = join(CORE_DIR, "..", "..", "node_modules", "typescript", "bin", "tsc");
const LOCK = join(CORE_DIR, ".dist-build.lock");
const STALE_LOCK_MS = 120_000;
const OUTPUTS = [CLI_MAIN, join(CORE_DIR, "dist", "pool", "index.js"), join(CORE_DIR, "dist", "pool", "evaluate-chunk-worker.js")];

/**
 * Builds packages/core/dist with tsc when it is missing or older than a source file, so tests that
 * spawn the CLI or start worker threads run the current code. Test files run in parallel, so one
 * builds (holding a lock directory) while the others wait for it. A type error elsewhere in the
 * tree does not stop tsc from emitting; only missing outputs fail.
 */
export function ensureDist(): void {
  const deadline = Date.now() + 180_000;
  while (isStale()) {
    let owner = false;
    try {
      mkdirSync(LOCK);
      owner = true;
    } catch {
      // A lock left by a killed run (older than any build takes) is cleared.
      if (existsSync(LOCK) && Date.now() - statSync(LOCK).mtimeMs > STALE_LOCK_MS) rmSync(LOCK, { recursive: true, force: true });
      if (Date.now() > deadline) throw new Error(`waited too long for another test to build dist (${LOCK})`);
      sleep(200);
      continue;
    }
    try {
      if (isStale()) {
        try {
          execFileSync(process.execPath, [TSC, "-p", join(CORE_DIR, "tsconfig.build.json")], { cwd: CORE_DIR, stdio: "pipe" });
        } catch {
          // tsc exits non-zero on a type error but still emits; the check below decides.
        }
      }
    } finally {
      if (owner) rmSync(LOCK, { recursive: true, force: true });
    }
    for (const file of OUTPUTS) if (!existsSync(file)) throw new Error(`building packages/core did not produce ${file}`);
    chmodSync(CLI_MAIN, 0o755); // as the package's build script does, so `npx loopyard` keeps working
    return;
  }
}

function isStale(): boolean {
  if (!OUTPUTS.every((f) => existsSync(f))) return true;
  const built = Math.min(...OUTPUTS.map((f) => statSync(f).mtimeMs));
  return newestSource(join(CORE_DIR, "src")) > built;
}

function newestSource(dir: string): number {
  let newest = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) newest = Math.max(newest, newestSource(path));
    else if (entry.name.endsWith(".ts") && !entry.name.endsWith(".test.ts")) newest = Math.max(newest, statSync(path).mtimeMs);
  }
  return newest;
}

function sleep(ms: number): void {
  Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, ms);
}
