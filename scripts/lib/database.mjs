// Creating and re-creating Loopyard's databases through the `pg` client (installed with the server's deps).
import { createRequire } from "node:module";
import { join } from "node:path";
import { REPO_ROOT } from "./paths.mjs";
import { StepError } from "./step.mjs";

const DATABASE_NAME = /^[A-Za-z_][A-Za-z0-9_]*$/;

function loadPg() {
  // Resolved from the server package, which depends on pg; available once npm ci has run.
  const require = createRequire(join(REPO_ROOT, "packages", "server", "package.json"));
  return require("pg");
}

/** The same server URL with another database name. */
export function withDatabase(url, database) {
  const parsed = new URL(url);
  parsed.pathname = `/${database}`;
  return parsed.toString();
}

/** Database name of a postgres:// URL. */
export function databaseName(url) {
  return decodeURIComponent(new URL(url).pathname.replace(/^\//, ""));
}

/** Hides the password of a URL for printing. */
export function redact(url) {
  const parsed = new URL(url);
  if (parsed.password) parsed.password = "***";
  return parsed.toString();
}

async function withMaintenanceClient(serverUrl, fn) {
  const { Client } = loadPg();
  const client = new Client({ connectionString: withDatabase(serverUrl, "postgres"), connectionTimeoutMillis: 10_000 });
  try {
    await client.connect();
  } catch (error) {
    throw new StepError(
      `Could not connect to PostgreSQL at ${redact(withDatabase(serverUrl, "postgres"))}: ${error.message}`,
      "Check that the server runs and that the user and password are right (the local cluster: npm run db:stop, then run again).",
    );
  }
  try {
    return await fn(client);
  } finally {
    await client.end();
  }
}

function assertName(name) {
  if (!DATABASE_NAME.test(name)) {
    throw new StepError(`"${name}" is not a database name Loopyard will create.`, "Use letters, digits and underscores only.");
  }
}

/** Creates the database when missing; returns a short note. */
export async function ensureDatabase(serverUrl, name) {
  assertName(name);
  return withMaintenanceClient(serverUrl, async (client) => {
    const found = await client.query("select 1 from pg_database where datname = $1", [name]);
    if (found.rowCount > 0) return `${name} exists`;
    await client.query(`create database "${name}"`);
    return `${name} created`;
  });
}

/** Drops (closing its connections) and creates the database afresh; returns a short note. */
export async function recreateDatabase(serverUrl, name) {
  assertName(name);
  return withMaintenanceClient(serverUrl, async (client) => {
    await client.query(`drop database if exists "${name}" with (force)`);
    await client.query(`create database "${name}"`);
    return `${name} created fresh`;
  });
}
