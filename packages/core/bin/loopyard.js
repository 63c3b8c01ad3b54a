#!/usr/bin/env node
// The `loopyard` command. Committed (not built) so that `npm ci` on a fresh clone links
// node_modules/.bin/loopyard: npm links a workspace's bin only when its target exists at install
// time, and dist/ is built later. It runs the built CLI, or says how to build it.
import { existsSync } from "node:fs";

const main = new URL("../dist/cli/main.js", import.meta.url);
if (!existsSync(main)) {
  process.stderr.write("loopyard: the CLI is not built yet; run npm run build (or npm start) in the repository first.\n");
  process.exit(2);
}
await import(main.href);
