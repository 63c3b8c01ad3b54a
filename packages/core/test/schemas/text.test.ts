import { describe, expect, it } from "vitest";
import { hasForbiddenControl, isWellFormedText, textField } from "../../src/index.js";

const name = textField({ label: "name", min: 1, required: "give a name", max: 10 });

describe("textField", () => {
  it("textField refuses NUL, BEL, DEL and C1 controls but keeps tab and newline (Unicode general category Cc)", () => {
    for (const bad of ["a\u0000", "a\u0007", "a\u001b", "a\u007f", "a\u0085", "a\r"]) expect(name.safeParse(bad).success).toBe(false);
    expect(name.parse("a\tb\nc")).toBe("a\tb\nc");
    expect(hasForbiddenControl("a\tb\nc")).toBe(false);
  });

  it("textField refuses a lone surrogate and accepts a pair (UTF-16, Unicode Standard 3.9)", () => {
    expect(name.safeParse("x\ud800").success).toBe(false);
    expect(name.safeParse("\udc00x").success).toBe(false);
    expect(name.parse("🔥")).toBe("🔥");
    expect(isWellFormedText("a\ud83d\udd25b")).toBe(true);
  });

  it("textField normalises to NFC (UAX #15: e + U+0301 → U+00E9; U+212B ANGSTROM SIGN → U+00C5)", () => {
    expect(name.parse("cafe\u0301")).toBe("caf\u00e9");
    expect(name.parse("\u212b")).toBe("\u00c5");
  });

  it("textField trims, then checks the length with the given messages", () => {
    expect(name.parse("  Ember  ")).toBe("Ember");
    expect(name.safeParse("   ").error?.issues[0]?.message).toBe("give a name");
    expect(name.safeParse("x".repeat(11)).error?.issues[0]?.message).toBe("keep the name under 10 characters");
  });
});
