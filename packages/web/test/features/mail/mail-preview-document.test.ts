import { describe, expect, it } from "vitest";
import { mailPreviewDocument, recipientsLabel } from "../../../src/features/mail/mail-preview-document.js";

describe("mailPreviewDocument", () => {
  it("puts the no-script policy and the new-tab base first inside an existing <head>", () => {
    const doc = mailPreviewDocument('<!doctype html><html><head><meta charset="utf-8"><title>x</title></head><body><p>Hi</p></body></html>');
    const head = doc.indexOf("<head>") + "<head>".length;
    expect(doc.slice(head).startsWith(`<meta http-equiv="Content-Security-Policy" content="default-src 'none'`)).toBe(true);
    expect(doc).toContain('<base target="_blank">');
    expect(doc).toContain("<p>Hi</p>");
  });

  it("wraps a fragment without <head> in a document that starts with the policy", () => {
    const doc = mailPreviewDocument("<p>fragment</p>");
    expect(doc.indexOf("Content-Security-Policy")).toBeLessThan(doc.indexOf("<p>fragment</p>"));
  });
});

describe("recipientsLabel", () => {
  it("names up to two recipients and counts the rest", () => {
    expect(recipientsLabel([])).toBe("(no recipient)");
    expect(recipientsLabel(["a@x.example", "b@x.example"])).toBe("a@x.example, b@x.example");
    expect(recipientsLabel(["a@x.example", "b@x.example", "c@x.example", "d@x.example"])).toBe("a@x.example, b@x.example + 2 more");
  });
});
