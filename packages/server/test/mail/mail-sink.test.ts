import { mkdtemp, readdir, readFile, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { simpleParser } from "mailparser";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startMailSink, type MailSink } from "../../src/mail/mail-sink.js";
import { createMailTransport } from "../../src/mail/mail-transport.js";
import { toMailJobData } from "../../src/mail/mail-message.js";
import { listStoredMail } from "../../src/mail/outbox-repository.js";

let folder: string;
let sink: MailSink;

beforeAll(async () => {
  folder = await mkdtemp(path.join(tmpdir(), "loopyard-sink-"));
  sink = await startMailSink({ port: 0, folder });
});

afterAll(async () => {
  await sink?.close();
  await rm(folder, { recursive: true, force: true });
});

describe("local mail sink", () => {
  it("when nodemailer sends a message with a PDF attachment, then the sink stores one .eml that mailparser reads back whole", async () => {
    const transport = createMailTransport(sink.url, "Loopyard <loopyard@localhost>");
    const pdf = Buffer.from("%PDF-1.4\n% a tiny stand-in\n%%EOF\n");
    await transport.send(
      toMailJobData({
        to: ["priya@halvard.example"],
        kind: "decision-approved",
        subject: "Approved: Ember 200 PID",
        text: "Plain text part",
        html: "<p>HTML part</p>",
        link: "http://127.0.0.1:4470/w/halvard-thermal",
        workspaceSlug: "halvard-thermal",
        attachments: [{ filename: "decision.pdf", content: pdf, contentType: "application/pdf" }],
      }),
    );
    transport.close();
    const files = (await readdir(folder)).filter((name) => name.endsWith(".eml"));
    expect(files).toHaveLength(1);
    const mail = await simpleParser(await readFile(path.join(folder, files[0]!)));
    expect(mail.subject).toBe("Approved: Ember 200 PID");
    expect(mail.text?.trim()).toBe("Plain text part");
    expect(mail.html).toContain("<p>HTML part</p>");
    expect(mail.headers.get("x-loopyard-kind")).toBe("decision-approved");
    expect(mail.attachments[0]?.filename).toBe("decision.pdf");
    expect(mail.attachments[0]?.content.equals(pdf)).toBe(true);

    const [stored] = await listStoredMail(folder);
    expect(stored).toMatchObject({ to: ["priya@halvard.example"], kind: "decision-approved", workspaceSlug: "halvard-thermal", link: "http://127.0.0.1:4470/w/halvard-thermal" });
    expect(stored?.attachments).toEqual([{ filename: "decision.pdf", contentType: "application/pdf", size: pdf.length }]);
  });

  it("startMailSink refuses to listen beyond loopback (it takes mail from anyone without a password)", async () => {
    await expect(startMailSink({ host: "0.0.0.0", port: 0, folder })).rejects.toThrow(/loopback only/);
  });

  it("toMailJobData refuses a message without recipients, with a malformed address or with a two-line subject", () => {
    const base = { to: ["a@b.example"], kind: "sweep-finished" as const, subject: "s", text: "t", html: "h", link: "http://127.0.0.1/" };
    expect(() => toMailJobData({ ...base, to: [] })).toThrow(/mail.to/);
    expect(() => toMailJobData({ ...base, to: ["not an address"] })).toThrow(/mail.to/);
    expect(() => toMailJobData({ ...base, subject: "a\r\nBcc: x@y.example" })).toThrow(/mail.subject/);
    expect(() => toMailJobData({ ...base, link: "/relative" })).toThrow(/mail.link/);
  });
});
