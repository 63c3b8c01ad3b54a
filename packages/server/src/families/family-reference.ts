import { expandFamily } from "@loopyard/core";
import type { FamilyRevisionDto, SweepFamily } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { badRequest } from "../http/http-error.js";
import type { MemberAccess } from "../workspaces/require-member.js";
import { findFamilyRevisionInWorkspace } from "./family-repository.js";

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Variants as compared: revision, label and parameters only, parameters sorted by name. */
function canonical(variants: readonly unknown[]): string {
  return JSON.stringify(
    variants.map((v) => {
      const { plantRevisionId, label, parameters } = (v ?? {}) as { plantRevisionId?: unknown; label?: unknown; parameters?: Record<string, unknown> };
      const sorted = parameters && typeof parameters === "object" ? Object.fromEntries(Object.entries(parameters).sort(([a], [b]) => (a < b ? -1 : 1))) : undefined;
      return [plantRevisionId, label ?? null, sorted && Object.keys(sorted).length > 0 ? sorted : null];
    }),
  );
}

/** The family a sweep or comparison on this saved revision holds: its variants (core expandFamily), its name, and its source. */
export function libraryFamily(revision: FamilyRevisionDto): SweepFamily {
  return { ...expandFamily(revision.definition, revision.name), source: { familyId: revision.familyId, familyRevisionId: revision.id, number: revision.number } };
}

/**
 * A sweep or comparison body that names a saved family (`familyRevisionId`), with the family
 * filled in from it before the definition is parsed: the revision's variants (core expandFamily —
 * exactly the list the sweep contract plans), its name, and `family.source` (family, revision,
 * number), and `plantRevisionId` (sweeps) the first variant's when not given. A body that also
 * lists `family` must list the same variants (a 400 on `family` otherwise). Bodies without
 * `familyRevisionId`, or with one that is not an id (the schema names it), pass unchanged.
 */
export async function resolveFamilyReference(db: Database, access: MemberAccess, body: unknown, withPlantRevision: boolean): Promise<unknown> {
  if (typeof body !== "object" || body === null || Array.isArray(body)) return body;
  const { familyRevisionId, family } = body as { familyRevisionId?: unknown; family?: { variants?: unknown } };
  if (typeof familyRevisionId !== "string" || !UUID.test(familyRevisionId)) return body;
  const revision = await findFamilyRevisionInWorkspace(db, access.workspace.id, familyRevisionId);
  if (!revision) throw badRequest("familyRevisionId: there is no such family revision in this workspace; choose one from the library's families", "familyRevisionId");
  const resolved = libraryFamily(revision);
  if (family !== undefined && (!Array.isArray(family?.variants) || canonical(family.variants) !== canonical(resolved.variants))) {
    throw badRequest(
      `family: these variants differ from ${revision.name} revision ${revision.number}; leave family out to use the saved variants, or leave familyRevisionId out to sweep an ad-hoc family`,
      "family",
    );
  }
  const out: Record<string, unknown> = { ...(body as Record<string, unknown>), family: resolved };
  if (withPlantRevision && out.plantRevisionId === undefined) out.plantRevisionId = resolved.variants[0]?.plantRevisionId;
  return out;
}
