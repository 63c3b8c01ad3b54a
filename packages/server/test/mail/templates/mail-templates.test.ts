import { MAIL_KINDS } from "@loopyard/core";
import { simpleParser } from "mailparser";
import { describe, expect, it } from "vitest";
import { escapeHtml, renderMail } from "../../../src/mail/templates/mail-layout.js";
import { DECISION_MAIL_CAUTION } from "../../../src/mail/templates/decision-mails.js";
import { MAIL_TEMPLATES, renderMailOf, type MailTemplateData } from "../../../src/mail/templates/mail-templates.js";

const HOSTILE = `<script>alert("x")</script> & 'Ember' <b>800</b>`;
const LINK = "http://127.0.0.1:4470/w/halvard-thermal/sweeps/3f2c0000-0000-4000-8000-000000000000?a=1&b=2";

/** Sample data for every kind, each text field carrying markup that must not survive into the HTML. */
const SAMPLES: MailTemplateData = {
  "proposal-submitted": { workspaceName: HOSTILE, proposerName: HOSTILE, title: HOSTILE, familyName: HOSTILE, rationale: HOSTILE, link: LINK },
  "decision-approved": { workspaceName: HOSTILE, leadName: HOSTILE, title: HOSTILE, link: LINK, recordFilename: HOSTILE },
  "decision-returned": { workspaceName: HOSTILE, leadName: HOSTILE, title: HOSTILE, comment: HOSTILE, link: LINK },
  "decision-commented": { workspaceName: HOSTILE, authorName: HOSTILE, title: HOSTILE, comment: HOSTILE, link: LINK },
  "sweep-finished": { workspaceName: HOSTILE, name: HOSTILE, link: LINK, facts: [[HOSTILE, HOSTILE]] },
  "sweep-failed": { workspaceName: HOSTILE, name: HOSTILE, link: LINK, error: HOSTILE },
  "comparison-finished": { workspaceName: HOSTILE, name: HOSTILE, link: LINK },
  "comparison-failed": { workspaceName: HOSTILE, name: HOSTILE, link: LINK, error: HOSTILE },
  invitation: { workspaceName: HOSTILE, inviterName: HOSTILE, role: "engineer", link: LINK, expiresAt: HOSTILE },
  "password-reset": { name: HOSTILE, link: LINK, expiresInMinutes: 60 },
  "email-verification": { name: HOSTILE, link: LINK },
};

describe("mail templates", () => {
  it("escapeHtml replaces the five characters that open markup or end an attribute (HTML standard, serialising text and attributes; common practice for the single quote)", () => {
    expect(escapeHtml(`<a href="x">'&'</a>`)).toBe("&lt;a href=&quot;x&quot;&gt;&#39;&amp;&#39;&lt;/a&gt;");
    expect(escapeHtml("Ember 200 plate, 0.8 kW")).toBe("Ember 200 plate, 0.8 kW");
  });

  it("MAIL_TEMPLATES has one template for every kind", () => {
    expect(Object.keys(MAIL_TEMPLATES).sort()).toEqual([...MAIL_KINDS].sort());
  });

  for (const kind of MAIL_KINDS) {
    it(`${kind}: data with markup is escaped in the HTML, kept verbatim in the text, and the link is in both`, async () => {
      const mail = renderMailOf(kind, SAMPLES[kind] as never);
      expect(mail.subject.length).toBeGreaterThan(0);
      expect(mail.subject).not.toMatch(/[\r\n]/);
      // No element or attribute from the data: the only <script or <b> would come from HOSTILE.
      expect(mail.html).not.toContain("<script");
      expect(mail.html).not.toContain("<b>800");
      expect(mail.html).toContain("&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt; &amp; &#39;Ember&#39; &lt;b&gt;800&lt;/b&gt;");
      expect(mail.text).toContain(HOSTILE);
      expect(mail.text).toContain(LINK);
      expect(mail.html).toContain(`href="${escapeHtml(LINK)}"`);
      // What a mail reader shows: the HTML parsed back as text holds the hostile string as plain
      // text (mailparser's html-to-text writes headings in capitals, hence the lower case).
      const parsed = await simpleParser(`Content-Type: text/html; charset=utf-8\r\n\r\n${mail.html}`);
      expect((parsed.text ?? "").toLowerCase()).toContain(HOSTILE.toLowerCase());
    });
  }

  it("decision mails say that a simulated design does not replace validation on the real machine; run mails do not", () => {
    for (const kind of ["proposal-submitted", "decision-approved", "decision-returned", "decision-commented"] as const) {
      const mail = renderMailOf(kind, SAMPLES[kind] as never);
      expect(mail.text).toContain(DECISION_MAIL_CAUTION);
      expect(mail.html).toContain(escapeHtml(DECISION_MAIL_CAUTION));
    }
    expect(renderMailOf("sweep-finished", SAMPLES["sweep-finished"]).text).not.toContain(DECISION_MAIL_CAUTION);
  });

  it("renderMail refuses a link that is not http(s), so no javascript: link reaches a mail", () => {
    expect(() => renderMail("x", { heading: "x", blocks: [], action: { label: "Open", href: "javascript:alert(1)" } })).toThrow(TypeError);
  });

  it("a subject is one line: line breaks in data become spaces (no header injection)", () => {
    const mail = renderMailOf("sweep-finished", { workspaceName: "W", name: "Ember\r\nBcc: someone@example.com", link: LINK });
    expect(mail.subject).toBe("Sweep finished: Ember Bcc: someone@example.com");
  });
});
