// Reads vitest's JSON report and sums it up per project (unit, integration, browser).
import { readFileSync } from "node:fs";
import { relative } from "node:path";
import { REPO_ROOT } from "./paths.mjs";

/** Test projects in the order they are reported, with the folder each owns. */
export const PROJECTS = [
  { name: "core", kind: "unit", folder: "packages/core/" },
  { name: "server", kind: "unit", folder: "packages/server/" },
  { name: "web", kind: "unit", folder: "packages/web/" },
  { name: "integration", kind: "integration", folder: "tests/integration/" },
  { name: "browser", kind: "browser", folder: "tests/browser/" },
];

function projectOf(file) {
  const path = relative(REPO_ROOT, file);
  return PROJECTS.find((p) => path.startsWith(p.folder))?.name ?? "other";
}

/**
 * { total: {passed, failed, skipped}, perProject: Map<name, {passed, failed, skipped, files, brokenFiles}> }.
 * A test file that failed without any failed test (it did not load, or a hook threw) counts as one failure.
 */
export function summarize(...reportPaths) {
  const files = reportPaths.flatMap((path) => JSON.parse(readFileSync(path, "utf8")).testResults ?? []);
  const perProject = new Map();
  const total = { passed: 0, failed: 0, skipped: 0 };
  for (const file of files) {
    const name = projectOf(file.name);
    const counts = perProject.get(name) ?? { passed: 0, failed: 0, skipped: 0, files: 0, brokenFiles: [] };
    counts.files += 1;
    let failedHere = 0;
    for (const test of file.assertionResults ?? []) {
      if (test.status === "passed") counts.passed += 1;
      else if (test.status === "failed") {
        counts.failed += 1;
        failedHere += 1;
      } else counts.skipped += 1;
    }
    if (file.status === "failed" && failedHere === 0) {
      counts.failed += 1;
      counts.brokenFiles.push({ file: relative(REPO_ROOT, file.name), message: (file.message ?? "").split("\n")[0] });
    }
    perProject.set(name, counts);
  }
  for (const counts of perProject.values()) {
    total.passed += counts.passed;
    total.failed += counts.failed;
    total.skipped += counts.skipped;
  }
  return { total, perProject };
}

/** "N passed, M failed" (+ ", K skipped" when any). */
export function countsLine({ passed, failed, skipped }) {
  return `${passed} passed, ${failed} failed${skipped > 0 ? `, ${skipped} skipped` : ""}`;
}
