import { describe, expect, it } from "vitest";
import { decisionPermissions, FOUR_EYES_SENTENCE } from "../../src/decisions/decision-permissions.js";
import { decisionFamilyKey } from "../../src/decisions/decision-family.js";

const proposer = "u-priya";
const other = "u-tomas";

describe("decisionPermissions", () => {
  it("when a lead looks at someone else's proposal, then they may approve, return, comment and withdraw", () => {
    expect(decisionPermissions({ state: "proposed", proposedBy: proposer }, { userId: other, role: "lead", allowSelfApproval: false })).toEqual({
      canApprove: true,
      canReturn: true,
      canComment: true,
      canWithdraw: true,
      canRevise: false,
      approveBlockedBecause: null,
    });
  });

  it("when a lead looks at their own proposal, then the four-eyes rule blocks approval unless the workspace allows it (common practice)", () => {
    const own = decisionPermissions({ state: "proposed", proposedBy: other }, { userId: other, role: "lead", allowSelfApproval: false });
    expect(own.canApprove).toBe(false);
    expect(own.approveBlockedBecause).toBe(FOUR_EYES_SENTENCE);
    expect(decisionPermissions({ state: "proposed", proposedBy: other }, { userId: other, role: "lead", allowSelfApproval: true }).canApprove).toBe(true);
  });

  it("when the proposer (an engineer) looks at a returned proposal, then they may revise, comment and withdraw, not approve", () => {
    expect(decisionPermissions({ state: "returned", proposedBy: proposer }, { userId: proposer, role: "engineer", allowSelfApproval: true })).toEqual({
      canApprove: false,
      canReturn: false,
      canComment: true,
      canWithdraw: true,
      canRevise: true,
      approveBlockedBecause: null,
    });
  });

  it("when the decision is frozen or withdrawn, then nobody may do anything; a viewer never may", () => {
    for (const state of ["approved", "superseded", "withdrawn"] as const) {
      for (const role of ["viewer", "engineer", "lead", "admin"] as const) {
        const can = decisionPermissions({ state, proposedBy: proposer }, { userId: proposer, role, allowSelfApproval: true });
        expect([can.canApprove, can.canReturn, can.canComment, can.canWithdraw, can.canRevise]).toEqual([false, false, false, false, false]);
      }
    }
    const viewer = decisionPermissions({ state: "proposed", proposedBy: proposer }, { userId: "u-jon", role: "viewer", allowSelfApproval: true });
    expect([viewer.canApprove, viewer.canReturn, viewer.canComment, viewer.canWithdraw, viewer.canRevise]).toEqual([false, false, false, false, false]);
  });

  it("when another engineer looks at a proposal, then they may comment but not withdraw it", () => {
    const can = decisionPermissions({ state: "proposed", proposedBy: proposer }, { userId: "u-ida", role: "engineer", allowSelfApproval: false });
    expect([can.canComment, can.canWithdraw]).toEqual([true, false]);
  });
});

describe("decisionFamilyKey", () => {
  it("when the same revisions come in another order or twice, then the key is the same", () => {
    expect(decisionFamilyKey(["b", "a", "c"])).toBe("a+b+c");
    expect(decisionFamilyKey(["c", "a", "b", "a"])).toBe("a+b+c");
    expect(() => decisionFamilyKey([])).toThrow(RangeError);
  });
});
