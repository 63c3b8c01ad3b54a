import type { AuditEventDto } from "@loopyard/core";
import { describe, expect, it } from "vitest";
import { auditSentence } from "../../../src/features/members/audit-sentence.js";

const base: AuditEventDto = {
  id: 1,
  at: "2026-12-05T22:00:00.000Z",
  action: "invitation-sent",
  actor: { name: "Mira Okafor", email: "mira@halvard.example" },
  subject: { name: null, email: "ola@halvard.example" },
  role: "engineer",
  previousRole: null,
};

// The expected sentences are the page's own wording (no outside reference; common practice for audit logs: who, what, whom, when).
describe("auditSentence", () => {
  it("names the invited address and the role with its article", () => {
    expect(auditSentence(base)).toBe("invited ola@halvard.example as an engineer");
    expect(auditSentence({ ...base, role: "viewer" })).toBe("invited ola@halvard.example as a viewer");
  });

  it("names both roles of a role change and the member by name and address", () => {
    const event: AuditEventDto = { ...base, action: "role-changed", subject: { name: "Jon Eide", email: "jon@halvard.example" }, role: "engineer", previousRole: "viewer" };
    expect(auditSentence(event)).toBe("changed the role of Jon Eide (jon@halvard.example) from viewer to engineer");
  });

  it("says what an acceptance gave and what a removal took", () => {
    expect(auditSentence({ ...base, action: "invitation-accepted", role: "lead" })).toBe("accepted the invitation and joined as a lead");
    expect(auditSentence({ ...base, action: "member-removed", subject: { name: "Jon Eide", email: "jon@halvard.example" }, role: null, previousRole: "admin" })).toBe(
      "removed Jon Eide (jon@halvard.example), an admin, from the workspace",
    );
  });
});
