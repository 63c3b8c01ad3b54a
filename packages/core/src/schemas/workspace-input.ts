import { z } from "zod";
import { MAX_TITLE_LENGTH } from "../limits.js";
import { textField } from "./text.js";

/** Shape of a workspace slug: lower-case words joined by single hyphens. */
export const SLUG_PATTERN = /^[a-z0-9]+(?:-[a-z0-9]+)*$/;

/** A workspace's name: 1 to MAX_TITLE_LENGTH characters after trimming (the server and the create page). */
export const workspaceNameSchema = textField({ label: "name", min: 1, required: "give the workspace a name", max: MAX_TITLE_LENGTH });

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

export type WorkspaceInput = z.output<typeof workspaceInputSchema>;
