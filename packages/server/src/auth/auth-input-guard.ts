import type { RequestHandler } from "express";
import { textField } from "@loopyard/core";
import { z } from "zod";
import { badRequest } from "../http/http-error.js";
import { zodToHttpError } from "../http/validation.js";
import { isCommonPassword } from "./common-passwords.js";

/** Longest user name (people's names; it is shown in every member list). */
export const MAX_USER_NAME_LENGTH = 80;
/** Longest email address (RFC 5321, 4.5.3.1: a path of at most 256 octets, 254 for the address). */
export const MAX_EMAIL_LENGTH = 254;
/** Longest password accepted (better-auth's maxPasswordLength is set to the same). */
export const MAX_PASSWORD_LENGTH = 128;

const userName = textField({ label: "name", min: 1, required: "give your name", max: MAX_USER_NAME_LENGTH });

/** The JSON fields of the auth endpoints that Loopyard checks before better-auth sees them. */
const authFieldsSchema = z.looseObject({
  name: userName.optional(),
  email: z.string({ error: "give your email address" }).max(MAX_EMAIL_LENGTH, `an email address has at most ${MAX_EMAIL_LENGTH} characters`).optional(),
  password: z.string({ error: "give a password" }).max(MAX_PASSWORD_LENGTH, `use at most ${MAX_PASSWORD_LENGTH} characters`).optional(),
  newPassword: z.string({ error: "give a password" }).max(MAX_PASSWORD_LENGTH, `use at most ${MAX_PASSWORD_LENGTH} characters`).optional(),
});

/** Endpoints (under /api/auth) where a password is chosen, with the field that holds it. */
const CHOSEN_PASSWORD: Record<string, "password" | "newPassword"> = {
  "/sign-up/email": "password",
  "/change-password": "newPassword",
  "/reset-password": "newPassword",
};

/**
 * Checks the JSON body of a state-changing /api/auth/* request (parsed by express.json before it):
 * the user name is text (no control characters, NFC, at most MAX_USER_NAME_LENGTH characters) and
 * is replaced by its normalised form; email and passwords have length caps; a password being chosen
 * is not on the common-password list. 400 with a sentence naming the field.
 */
export const authInputGuard: RequestHandler = async (req, _res, next) => {
  if (req.method !== "POST" || typeof req.body !== "object" || req.body === null || Array.isArray(req.body)) {
    next();
    return;
  }
  const parsed = authFieldsSchema.safeParse(req.body);
  if (!parsed.success) {
    next(zodToHttpError(parsed.error));
    return;
  }
  if (parsed.data.name !== undefined) (req.body as { name: string }).name = parsed.data.name;
  const field = CHOSEN_PASSWORD[req.path];
  const chosen = field === undefined ? undefined : parsed.data[field];
  if (typeof chosen === "string" && (await isCommonPassword(chosen))) {
    next(badRequest(`${field}: this password is on the list of the most common passwords that guessing scripts try first; choose another (a few unrelated words work well).`, field));
    return;
  }
  next();
};
