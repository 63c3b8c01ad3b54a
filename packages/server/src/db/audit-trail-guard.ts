import { sql } from "drizzle-orm";
import type { Database } from "./database.js";

/**
 * Makes the workspace audit trail append-only in PostgreSQL itself: a trigger refuses UPDATE of any
 * entry and DELETE of an entry whose workspace still exists (a deleted workspace takes its trail
 * along by ON DELETE CASCADE; by then the workspace row is gone). Drizzle's schema cannot express
 * triggers, so this runs after the migrations (`runMigrations`), idempotently (CREATE OR REPLACE,
 * PostgreSQL ≥ 14).
 */
export async function installAuditTrailGuard(db: Database): Promise<void> {
  await db.execute(sql`
    CREATE OR REPLACE FUNCTION loopyard_audit_trail_append_only() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF TG_OP = 'DELETE' AND NOT EXISTS (SELECT 1 FROM workspace WHERE id = OLD.workspace_id) THEN
        RETURN OLD;
      END IF;
      RAISE EXCEPTION 'the workspace audit trail is append-only: % refused', TG_OP USING ERRCODE = 'insufficient_privilege';
    END
    $$`);
  await db.execute(sql`
    CREATE OR REPLACE TRIGGER workspace_audit_event_append_only
      BEFORE UPDATE OR DELETE ON workspace_audit_event
      FOR EACH ROW EXECUTE FUNCTION loopyard_audit_trail_append_only()`);
}
