import { describe, expect, it } from "vitest";
import { redactSecrets } from "../../src/http/logger.js";

// Common practice (OWASP Logging Cheat Sheet: never log session ids, access tokens or password-reset links).
describe("redactSecrets", () => {
  it("when a URL carries better-auth's verification token in the query, then the token is replaced", () => {
    expect(redactSecrets("/api/auth/verify-email?token=eyJhbGciOi.abc.def&callbackURL=%2F")).toBe("/api/auth/verify-email?token=[redacted]&callbackURL=%2F");
  });

  it("when a URL is better-auth's reset link, then the path's token is replaced", () => {
    expect(redactSecrets("/api/auth/reset-password/Zq81xYw?callbackURL=%2Freset-password")).toBe("/api/auth/reset-password/[redacted]?callbackURL=%2Freset-password");
  });

  it("when a URL holds no secret, then it is logged as it is", () => {
    expect(redactSecrets("/api/workspaces/halvard-thermal/plants?tokenish=1")).toBe("/api/workspaces/halvard-thermal/plants?tokenish=1");
  });
});
