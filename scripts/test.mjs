#!/usr/bin/env node
// npm test: the same set-up as npm start on a fresh `loopyard_test` database, Debian chromium when
// missing, then ONE vitest run over every project (core, server, web, integration, browser).
// Extra arguments go to vitest, e.g. `npm test -- --project core`.
import { spawn } from "node:child_process";
import { existsSync, rmSync } from "node:fs";
import { join } from "node:path";
import { REPO_ROOT, TEST_RESULTS_FILE, WEB_DIST_DIR, rel } from "./lib/paths.mjs";
import { aptInstall } from "./lib/postgres.mjs";
import { buildAll, ensureAuthSecret, ensureDatabaseFor, ensureDependencies, migrateAndSeed } from "./lib/preflight.mjs";
import { StepError, failAndExit, say, step } from "./lib/step.mjs";
import { PROJECTS, countsLine, summarize } from "./lib/test-summary.mjs";

const CHROMIUM = "/usr/bin/chromium";

async function ensureChromium() {
  if (existsSync(CHROMIUM)) {
    say(`Chromium … ${CHROMIUM}`);
    return;
  }
  if (process.getuid?.() !== 0) {
    throw new StepError(`${CHROMIUM} is missing and this is not a root shell.`, "Install Debian's chromium package (sudo apt-get install -y chromium) and run again.");
  }
  await step("Installing Chromium (apt-get install chromium)", async () => {
    await aptInstall(["chromium"], "chromium");
    if (!existsSync(CHROMIUM)) throw new StepError(`apt-get installed chromium but ${CHROMIUM} is missing.`, "Check the chromium package's files (dpkg -L chromium).");
  });
}

function runVitest(env) {
  rmSync(TEST_RESULTS_FILE, { force: true });
  const args = [
    "run",
    "--reporter=default",
    "--reporter=json",
    `--outputFile.json=${TEST_RESULTS_FILE}`,
    ...process.argv.slice(2),
  ];
  say(`Running vitest (projects: ${PROJECTS.map((p) => p.name).join(", ")}) …`);
  return new Promise((resolve, reject) => {
    const child = spawn(join(REPO_ROOT, "node_modules", ".bin", "vitest"), args, {
      cwd: REPO_ROOT,
      stdio: ["ignore", "inherit", "inherit"],
      env: { ...process.env, ...env },
    });
    child.on("error", reject);
    child.on("exit", (code, signal) => resolve(signal ? 1 : (code ?? 1)));
  });
}

async function main() {
  await ensureDependencies();
  const { databaseUrl } = await ensureDatabaseFor("test");
  await ensureChromium();
  await buildAll();
  const authSecret = ensureAuthSecret();
  await migrateAndSeed(databaseUrl, authSecret);

  const vitestCode = await runVitest({
    DATABASE_URL: databaseUrl,
    LOOPYARD_AUTH_SECRET: authSecret,
    LOOPYARD_WEB_DIST: WEB_DIST_DIR,
  });

  if (!existsSync(TEST_RESULTS_FILE)) {
    throw new StepError(`vitest exited with code ${vitestCode} and wrote no report to ${rel(TEST_RESULTS_FILE)}.`, "Read vitest's output above (a config error, most likely).");
  }
  const { total, perProject } = summarize(TEST_RESULTS_FILE);
  process.stdout.write("\n");
  for (const project of [...PROJECTS, { name: "other", kind: "other" }]) {
    const counts = perProject.get(project.name);
    if (!counts) {
      if (project.name !== "other") say(`${project.name.padEnd(12)} (${project.kind}): no test files ran`);
      continue;
    }
    say(`${project.name.padEnd(12)} (${project.kind}): ${countsLine(counts)} in ${counts.files} file${counts.files === 1 ? "" : "s"}`);
    for (const broken of counts.brokenFiles) say(`  ${broken.file} failed outside any test: ${broken.message}`);
  }
  const ranNothing = total.passed + total.failed === 0;
  if (ranNothing) say("No test ran: that counts as a failure.");
  if (vitestCode !== 0 && total.failed === 0) say(`vitest exited with code ${vitestCode} (an error outside the tests; see above).`);
  process.stdout.write(`Tests: ${countsLine(total)}\n`);
  process.exit(total.failed > 0 || ranNothing || vitestCode !== 0 ? 1 : 0);
}

main().catch(failAndExit);
