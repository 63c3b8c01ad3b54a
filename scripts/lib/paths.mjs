// Where Loopyard keeps its local state. Everything under .data/ is ignored by git.
import { dirname, join, resolve } from "node:path";
import { fileURLToPath } from "node:url";

export const REPO_ROOT = resolve(dirname(fileURLToPath(import.meta.url)), "..", "..");
export const DATA_DIR = join(REPO_ROOT, ".data");
export const PG_DATA_DIR = join(DATA_DIR, "pg");
export const PG_RUN_DIR = join(DATA_DIR, "run");
export const PG_LOG_FILE = join(DATA_DIR, "pg.log");
export const LOG_DIR = join(DATA_DIR, "logs");
export const AUTH_SECRET_FILE = join(DATA_DIR, "auth-secret");
export const TEST_RESULTS_FILE = join(DATA_DIR, "test-results.json");
export const SERVER_CLI = join(REPO_ROOT, "packages", "server", "dist", "cli.js");
export const WEB_DIST_DIR = join(REPO_ROOT, "packages", "web", "dist");

/** Path relative to the repository root, for messages. */
export function rel(path) {
  return path.startsWith(REPO_ROOT + "/") ? path.slice(REPO_ROOT.length + 1) : path;
}
