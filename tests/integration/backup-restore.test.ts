/**
 * npm run db:backup and npm run db:restore FILE (Debian's pg_dump and pg_restore, custom format):
 * a round trip from the test database into a scratch database, compared table by table — the same
 * tables in every schema (the app's, drizzle's journal, pg-boss's), the same row count and the same
 * digest of every row (md5 over the rows' text forms in order). Common practice; the digest is ours.
 */
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { RUN_ID } from "./api-client.js";

const REPO = fileURLToPath(new URL("../../", import.meta.url));
const sourceUrl = process.env.DATABASE_URL!;
const scratchName = `loopyard_restore_${RUN_ID}`.toLowerCase().replace(/[^a-z0-9_]/g, "_");
const scratchUrl = (() => {
  const url = new URL(sourceUrl);
  url.pathname = `/${scratchName}`;
  return url.toString();
})();
const folder = mkdtempSync(join(tmpdir(), "loopyard-backup-"));
let admin: pg.Client;

function npmScript(script: string, args: string[], databaseUrl: string) {
  const result = spawnSync(process.execPath, [join(REPO, "scripts", script), ...args], { cwd: REPO, env: { ...process.env, DATABASE_URL: databaseUrl }, encoding: "utf8" });
  return { code: result.status, output: `${result.stdout}${result.stderr}` };
}

/** Every base table outside PostgreSQL's own schemas, as "schema.table" → "rows:digest". */
async function tableDigests(url: string): Promise<Map<string, string>> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    const { rows: tables } = await client.query<{ schema: string; name: string }>(
      `select table_schema as schema, table_name as name from information_schema.tables
       where table_type = 'BASE TABLE' and table_schema not in ('pg_catalog', 'information_schema') order by 1, 2`,
    );
    const digests = new Map<string, string>();
    for (const { schema, name } of tables) {
      const quoted = `"${schema.replace(/"/g, '""')}"."${name.replace(/"/g, '""')}"`;
      const { rows } = await client.query<{ n: number; digest: string | null }>(
        `select count(*)::int as n, md5(coalesce(string_agg(t::text, E'\\n' order by t::text), '')) as digest from ${quoted} t`,
      );
      digests.set(`${schema}.${name}`, `${rows[0]!.n}:${rows[0]!.digest}`);
    }
    return digests;
  } finally {
    await client.end();
  }
}

beforeAll(async () => {
  admin = new pg.Client({ connectionString: sourceUrl });
  await admin.connect();
  await admin.query(`drop database if exists ${scratchName}`);
  await admin.query(`create database ${scratchName}`);
});

afterAll(async () => {
  await admin?.query(`drop database if exists ${scratchName} with (force)`).catch(() => undefined);
  await admin?.end();
  rmSync(folder, { recursive: true, force: true });
});

describe("backup and restore", () => {
  it("when the test database is backed up and restored into an empty one, then every table holds the same rows", async () => {
    const file = join(folder, "round-trip.dump");
    const backup = npmScript("db-backup.mjs", [file], sourceUrl);
    expect(backup.code, backup.output).toBe(0);
    expect(backup.output).toMatch(/round-trip\.dump \(\d+ kB\)/);
    const restore = npmScript("db-restore.mjs", [file], scratchUrl);
    expect(restore.code, restore.output).toBe(0);

    const source = await tableDigests(sourceUrl);
    const restored = await tableDigests(scratchUrl);
    expect([...source.keys()]).toContain("public.candidate");
    expect([...source.keys()]).toContain("public.user");
    expect([...source.keys()].some((table) => table.startsWith("pgboss."))).toBe(true);
    expect(Object.fromEntries(restored)).toEqual(Object.fromEntries(source));
    expect(Number(source.get("public.plant")!.split(":")[0])).toBeGreaterThan(0);

    // Restoring again over the restored copy replaces it and changes nothing.
    const again = npmScript("db-restore.mjs", [file], scratchUrl);
    expect(again.code, again.output).toBe(0);
    expect(Object.fromEntries(await tableDigests(scratchUrl))).toEqual(Object.fromEntries(source));
  }, 300_000);

  it("when db:restore is given no file or a missing one, then it exits non-zero with a sentence", () => {
    const none = npmScript("db-restore.mjs", [], scratchUrl);
    expect(none.code).toBe(1);
    expect(none.output).toMatch(/Say which backup to restore/);
    const missing = npmScript("db-restore.mjs", [join(folder, "nothing.dump")], scratchUrl);
    expect(missing.code).toBe(1);
    expect(missing.output).toMatch(/There is no backup file/);
  });
});
