#!/usr/bin/env node
// npm run db:stop: stops the local PostgreSQL cluster in .data/pg (pg_ctl stop -m fast). Idempotent.
import { findPgBinDir, stopCluster } from "./lib/postgres.mjs";
import { failAndExit, step } from "./lib/step.mjs";

step("Stopping the local PostgreSQL cluster", () => stopCluster(findPgBinDir())).catch(failAndExit);
