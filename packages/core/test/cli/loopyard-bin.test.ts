import { execFileSync, spawnSync } from "node:child_process";
import { copyFileSync, existsSync, mkdirSync, mkdtempSync, readFileSync, realpathSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { dirname, join } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { CORE_DIR, ensureDist } from "../support/ensure-dist.js";

// The README's `npx loopyard …` after `npm start` on a fresh clone answered "could not determine
// executable to run": npm links a workspace's bin into node_modules/.bin only when the bin's target
// exists at install time, and the target was dist/cli/main.js, built after the install. What
// reproduces it is an install of the package's files as git holds them (no dist/): these tests do
// that in a temporary workspace (no registry, no dependencies), then check the repository's own link.
beforeAll(() => ensureDist(), 200_000);

const ROOT = join(CORE_DIR, "..", "..");
const manifest = JSON.parse(readFileSync(join(CORE_DIR, "package.json"), "utf8")) as { name: string; version: string; bin: Record<string, string> };

describe("the loopyard bin on a fresh clone", () => {
  it("the bin's target is a file git tracks, so it exists right after a clone", () => {
    const target = join("packages/core", manifest.bin.loopyard as string);
    const tracked = execFileSync("git", ["ls-files", "--error-unmatch", target], { cwd: ROOT, encoding: "utf8" });
    expect(tracked.trim()).toBe(target);
  });

  it("npm install of the tracked files (no dist/) links node_modules/.bin/loopyard, which says to build first", () => {
    const clone = mkdtempSync(join(tmpdir(), "loopyard-clone-"));
    const core = join(clone, "packages", "core");
    const tracked = execFileSync("git", ["ls-files", "packages/core/bin"], { cwd: ROOT, encoding: "utf8" }).trim().split("\n").filter(Boolean);
    for (const file of tracked) {
      mkdirSync(dirname(join(clone, file)), { recursive: true });
      copyFileSync(join(ROOT, file), join(clone, file));
    }
    // The real name and bin field; no dependencies, so the install needs no registry.
    writeFileSync(join(core, "package.json"), JSON.stringify({ name: manifest.name, version: manifest.version, type: "module", bin: manifest.bin }));
    writeFileSync(join(clone, "package.json"), JSON.stringify({ name: "clone", private: true, workspaces: ["packages/core"] }));
    const npm = spawnSync("npm", ["install", "--offline", "--no-audit", "--no-fund", "--ignore-scripts"], { cwd: clone, encoding: "utf8" });
    expect(npm.status, npm.stderr).toBe(0);
    const link = join(clone, "node_modules", ".bin", "loopyard");
    expect(existsSync(link)).toBe(true);
    const run = spawnSync(link, ["help"], { cwd: clone, encoding: "utf8" });
    expect(run.status).toBe(2);
    expect(run.stderr).toBe("loopyard: the CLI is not built yet; run npm run build (or npm start) in the repository first.\n");
  }, 120_000);

  it("in this checkout, node_modules/.bin/loopyard resolves to the committed bin and runs the built CLI", () => {
    const link = join(ROOT, "node_modules", ".bin", "loopyard");
    expect(existsSync(link), "node_modules/.bin/loopyard is missing: run npm ci (npm test does) so npm links the bin").toBe(true);
    expect(realpathSync(link)).toBe(realpathSync(join(CORE_DIR, manifest.bin.loopyard as string)));
    const run = spawnSync(link, ["evaluate", join(CORE_DIR, "examples", "evaluate-first-order-p.json")], { cwd: ROOT, encoding: "utf8" });
    expect(run.stderr).toBe("");
    expect(run.status).toBe(0);
    expect(JSON.parse(run.stdout).status).toBe("stable");
  });
});
