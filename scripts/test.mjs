#!/usr/bin/env node
// npm test: the same set-up as npm start on a fresh `loopyard_test` database, Debian chromium when
// missing, then vitest over every project in two passes: core, server, web and integration first,
// then browser. The browser project's app server runs an embedded sweep worker; in a pass of its
// own it cannot take the integration tests' sweep jobs (they count and kill their own workers).
// Extra arguments go to ONE vitest run, e.g. `npm test -- --project core`.
import { spawn } from "node:child_process";
import { existsSync, rmSync } from "node:fs";
import { join } from "node:path";
import { REPO_ROOT, TEST_RESULTS_FILE, WEB_DIST_DIR, rel } from "./lib/paths.mjs";
import { aptInstall } from "./lib/postgres.mjs";
import { buildAll, ensureAuthSecret, ensureDatabaseFor, ensureDependencies, mailSettings, migrateAndSeed } from "./lib/preflight.mjs";
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

/** The passes of a plain `npm test`; extra arguments make one pass of their own. */
function passes() {
  const extra = process.argv.slice(2);
  if (extra.length > 0) return [{ names: PROJECTS.map((p) => p.name), args: extra, report: TEST_RESULTS_FILE }];
  const first = PROJECTS.filter((p) => p.name !== "browser").map((p) => p.name);
  return [
    { names: first, args: first.flatMap((name) => ["--project", name]), report: TEST_RESULTS_FILE },
    { names: ["browser"], args: ["--project", "browser"], report: TEST_RESULTS_FILE.replace(/\.json$/, "-browser.json") },
  ];
}

function runVitest(pass, env) {
  rmSync(pass.report, { force: true });
  const args = ["run", "--reporter=default", "--reporter=json", `--outputFile.json=${pass.report}`, ...pass.args];
  say(`Running vitest (projects: ${pass.names.join(", ")}) …`);
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

  // The browser project's app server (cli.js serve) starts the local mail sink with these.
  const mail = await mailSettings("test");
  say(mail.line);
  const env = { DATABASE_URL: databaseUrl, LOOPYARD_AUTH_SECRET: authSecret, LOOPYARD_WEB_DIST: WEB_DIST_DIR, ...mail.env };
  let vitestCode = 0;
  const reports = [];
  for (const pass of passes()) {
    const code = await runVitest(pass, env);
    if (!existsSync(pass.report)) {
      throw new StepError(`vitest exited with code ${code} and wrote no report to ${rel(pass.report)}.`, "Read vitest's output above (a config error, most likely).");
    }
    if (code !== 0) vitestCode = code;
    reports.push(pass.report);
  }
  const { total, perProject } = summarize(...reports);
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
