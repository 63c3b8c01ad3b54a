import { describe, expect, it } from "vitest";
import { bodyProblem, MAX_BODY_DEPTH } from "../../src/http/json-body-guard.js";
import { databaseFailure } from "../../src/http/database-failure.js";

describe("bodyProblem", () => {
  it("bodyProblem(body) passes ordinary bodies and names the field of a NUL or a lone surrogate", () => {
    expect(bodyProblem({ name: "Ember 200", model: { num: [1], den: [1, 3, 2] } })).toBeNull();
    expect(bodyProblem({ family: { variants: [{ label: "a\u0000" }] } })?.field).toBe("family.variants.0.label");
    expect(bodyProblem({ name: "x\ud800" })?.message).toMatch(/surrogate/);
    expect(bodyProblem({ ["k\u0000"]: 1 })?.message).toMatch(/field name/);
  });

  it("bodyProblem(body) refuses nesting deeper than MAX_BODY_DEPTH without recursion, even 100,000 deep", () => {
    const deep = JSON.parse(`${"[".repeat(100_000)}${"]".repeat(100_000)}`);
    expect(bodyProblem(deep)?.message).toMatch(/nested deeper/);
    const ok = JSON.parse(`${"[".repeat(MAX_BODY_DEPTH)}${"]".repeat(MAX_BODY_DEPTH)}`);
    expect(bodyProblem(ok)).toBeNull();
  });
});

describe("databaseFailure", () => {
  // SQLSTATE codes: PostgreSQL 15 documentation, Appendix A.
  it("databaseFailure(error) maps unavailable and full databases to 503 with Retry-After, through Drizzle's cause chain", () => {
    const wrapped = (code: string) => Object.assign(new Error("Failed query"), { cause: Object.assign(new Error("pg"), { code }) });
    expect(databaseFailure(wrapped("53300"))?.error.status).toBe(503);
    expect(databaseFailure(wrapped("57P01"))?.retryAfter).toBeGreaterThan(0);
    expect(databaseFailure(wrapped("53100"))?.error.message).toMatch(/disk space/);
    expect(databaseFailure(wrapped("ECONNREFUSED"))?.error.status).toBe(503);
    expect(databaseFailure(new Error("Connection terminated unexpectedly"))?.error.status).toBe(503);
    expect(databaseFailure(wrapped("22021"))?.error.status).toBe(400);
    expect(databaseFailure(new Error("something else"))).toBeNull();
  });
});
