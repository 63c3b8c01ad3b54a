import { z } from "zod";
import { ROLES } from "../api/roles.js";
import { MAX_TITLE_LENGTH } from "../limits.js";

/** Shape of a workspace slug: lower-case words joined by single hyphens. */
export const SLUG_PATTERN = /^[a-z0-9]+(?:-[a-z0-9]+)*$/;

/** A workspace's name: 1 to MAX_TITLE_LENGTH characters after trimming (the server and the create page). */
export const workspaceNameSchema = z
  .string()
  .trim()
  .min(1, "give the workspace a name")
  .max(MAX_TITLE_LENGTH, `keep the name under ${MAX_TITLE_LENGTH} characters`);

/** POST /api/workspaces */
export const workspaceInputSchema = z.object({
  name: workspaceNameSchema,
  slug: z
    .string()
    .trim()
    .min(2, "the slug needs at least 2 characters")
    .max(60, "keep the slug under 60 characters")
    .regex(SLUG_PATTERN, "use lower-case letters, digits and single hyphens, e.g. ember-line")
    .optional(),
});

/** POST /api/workspaces/:slug/members */
export const memberInputSchema = z.object({
  email: z.email("give the email address the person signed up with"),
  role: z.enum(ROLES, { error: `choose one of the roles ${ROLES.join(", ")}` }),
});

export type WorkspaceInput = z.output<typeof workspaceInputSchema>;
export type MemberInput = z.output<typeof memberInputSchema>;
