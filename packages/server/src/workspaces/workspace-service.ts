import { randomBytes } from "node:crypto";
import type { MeDto, Role, UserDto, WorkspaceDto, WorkspaceHomeDto } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { HttpError } from "../http/http-error.js";
import { isEmailVerified } from "../users/user-repository.js";
import { listRecentSweeps } from "../sweeps/sweep-repository.js";
import { workspaceDirectory } from "./workspace-directory-cache.js";
import type { MemberAccess } from "./require-member.js";
import type { WorkspaceInput } from "./workspace-input.js";
import {
  countPlants,
  insertMembership,
  insertWorkspace,
  listMembers,
  listMembershipsOfUser,
} from "./workspace-repository.js";

/** How many recent sweeps the workspace home lists. */
const RECENT_SWEEPS = 5;

/** "Halvard Thermoworks — Ember line" → "halvard-thermoworks-ember-line". */
export function slugify(name: string): string {
  const slug = name
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 48)
    .replace(/-+$/g, "");
  return slug.length >= 2 ? slug : "workspace";
}

export async function getMe(db: Database, user: UserDto): Promise<MeDto> {
  const [memberships, emailVerified] = await Promise.all([listMembershipsOfUser(db, user.id), isEmailVerified(db, user.id)]);
  return { user, emailVerified, memberships };
}

/**
 * Creates a workspace with the signed-in user as its admin. An explicit slug that is taken is a 409;
 * a slug derived from the name gets a short random suffix until it is free.
 */
export async function createWorkspace(db: Database, user: UserDto, input: WorkspaceInput): Promise<WorkspaceDto> {
  return db.transaction(async (tx) => {
    let created: WorkspaceDto | null;
    if (input.slug) {
      created = await insertWorkspace(tx, { slug: input.slug, name: input.name });
      if (!created) throw new HttpError(409, `The slug “${input.slug}” is taken; choose another.`, { field: "slug" });
    } else {
      const base = slugify(input.name);
      created = await insertWorkspace(tx, { slug: base, name: input.name });
      for (let attempt = 0; !created && attempt < 5; attempt += 1) {
        created = await insertWorkspace(tx, { slug: `${base}-${randomBytes(3).toString("hex")}`, name: input.name });
      }
      if (!created) throw new HttpError(409, "Could not find a free slug for this name; give a slug.", { field: "slug" });
    }
    await insertMembership(tx, created.id, user.id, "admin");
    return created;
  });
}

/**
 * The workspace home of any member. The plant count and the members come from the workspace's
 * directory (kept a few seconds, forgotten at once by this server's writes); the sweeps, which
 * workers in other processes move on, are read on every visit, with their count in the same query.
 */
export async function getWorkspaceHome(db: Database, access: MemberAccess): Promise<WorkspaceHomeDto> {
  const { workspace, role } = access;
  const [directory, recent] = await Promise.all([
    workspaceDirectory(workspace.id, async () => {
      const [plants, members] = await Promise.all([countPlants(db, workspace.id), listMembers(db, workspace.id)]);
      return { plants, members };
    }),
    listRecentSweeps(db, workspace.id, RECENT_SWEEPS),
  ]);
  const counts = { plants: directory.plants, sweeps: recent.total, members: directory.members.length };
  return { workspace, role, counts, members: directory.members, recentSweeps: recent.sweeps };
}
