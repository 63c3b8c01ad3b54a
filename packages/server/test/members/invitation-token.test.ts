import { createHash } from "node:crypto";
import { INVITATION_TOKEN_PATTERN } from "@loopyard/core";
import { describe, expect, it } from "vitest";
import { createInvitationToken, hashInvitationToken } from "../../src/members/invitation-token.js";

describe("createInvitationToken", () => {
  it("when a token is made, then it is 32 random bytes in base64url (43 characters) and the stored hash is its SHA-256 hex", () => {
    const { token, tokenHash } = createInvitationToken();
    expect(token).toMatch(INVITATION_TOKEN_PATTERN);
    expect(Buffer.from(token, "base64url")).toHaveLength(32);
    // Reference: node's crypto SHA-256 (FIPS 180-4), computed independently here.
    expect(tokenHash).toBe(createHash("sha256").update(token).digest("hex"));
    expect(tokenHash).toMatch(/^[0-9a-f]{64}$/);
  });

  it("when many tokens are made, then none repeats (256 random bits each)", () => {
    const tokens = new Set(Array.from({ length: 1000 }, () => createInvitationToken().token));
    expect(tokens.size).toBe(1000);
  });

  it("hashInvitationToken matches the SHA-256 test vector of 'abc' (FIPS 180-2, appendix B.1)", () => {
    expect(hashInvitationToken("abc")).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  });
});
