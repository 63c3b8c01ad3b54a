import { createHash, randomBytes } from "node:crypto";

/** Random bytes of an invitation token: 256 bits, far beyond guessing (NIST SP 800-63B, 5.1.1.2 asks ≥ 112 bits for secrets it looks up). */
const TOKEN_BYTES = 32;

/**
 * A fresh invitation token for the link (base64url, 43 characters) and the SHA-256 hex digest that
 * is stored in its place: the database never holds a working link, so a copy of it leaks none.
 */
export function createInvitationToken(): { token: string; tokenHash: string } {
  const token = randomBytes(TOKEN_BYTES).toString("base64url");
  return { token, tokenHash: hashInvitationToken(token) };
}

/** SHA-256 hex digest of a token, the key an invitation is found by. */
export function hashInvitationToken(token: string): string {
  return createHash("sha256").update(token, "utf8").digest("hex");
}
