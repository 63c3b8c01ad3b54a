/** A mail's subject and its two bodies, as every template returns them. */
export interface RenderedMail {
  subject: string;
  text: string;
  html: string;
}

/**
 * Escapes text for HTML element content and double- or single-quoted attribute values: & < > " '
 * become character references (the five characters the HTML standard's serialisation escapes in
 * text and attributes, plus the single quote; common practice).
 */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c] as string);
}

/** One line of a mail's subject: control characters and runs of white space become one space, at most 200 characters. */
export function subjectLine(text: string): string {
  // eslint-disable-next-line no-control-regex
  const line = text.replace(/[\u0000-\u001f\u007f\s]+/g, " ").trim();
  return line.length > 200 ? `${line.slice(0, 199)}…` : line;
}

/** A piece of a mail body: a paragraph, a quoted passage (a comment, a rationale) or a key–value list. */
export type MailBlock = { paragraph: string } | { quote: string; by?: string } | { facts: [string, string][] };

export interface MailLayout {
  /** First line of the body: what happened, in one sentence. */
  heading: string;
  blocks: MailBlock[];
  /** The one action: a link into the app with its label ("Open the sweep"). */
  action: { label: string; href: string };
  /** Closing note (small print), e.g. the safety caution of decision mails. */
  note?: string;
}

const FOOTER = "You get this mail from Loopyard. Turn kinds of mail on or off under Notification settings in the user menu.";
const ACCOUNT_FOOTER = "You get this mail from Loopyard because someone used your address; if that was not you, ignore it.";

/**
 * Renders a mail's plain text and HTML from the same blocks, so the two say the same thing. Every
 * string that comes from data is escaped in the HTML (escapeHtml); link targets must be http(s)
 * and are escaped as attribute values.
 */
export function renderMail(subject: string, layout: MailLayout, options: { accountMail?: boolean } = {}): RenderedMail {
  const href = layout.action.href;
  if (!/^https?:\/\//i.test(href)) throw new TypeError(`action.href: "${href}" must be an absolute http(s) link`);
  const footer = options.accountMail ? ACCOUNT_FOOTER : FOOTER;

  const textBlocks = layout.blocks.map((block) => {
    if ("paragraph" in block) return block.paragraph;
    if ("quote" in block) return `${block.by ? `${block.by} wrote:\n` : ""}${block.quote.split("\n").map((line) => `> ${line}`).join("\n")}`;
    return block.facts.map(([key, value]) => `${key}: ${value}`).join("\n");
  });
  const text = [layout.heading, ...textBlocks, `${layout.action.label}: ${href}`, ...(layout.note ? [layout.note] : []), "-- ", footer].join("\n\n") + "\n";

  const htmlBlocks = layout.blocks.map((block) => {
    if ("paragraph" in block) return `<p style="margin:0 0 14px">${escapeHtml(block.paragraph)}</p>`;
    if ("quote" in block) {
      const by = block.by ? `<p style="margin:0 0 4px;color:#555">${escapeHtml(block.by)} wrote:</p>` : "";
      return `${by}<blockquote style="margin:0 0 14px;padding:6px 12px;border-left:3px solid #8aa4b8;color:#222;white-space:pre-wrap">${escapeHtml(block.quote)}</blockquote>`;
    }
    const rows = block.facts
      .map(([key, value]) => `<tr><th align="left" style="padding:2px 12px 2px 0;font-weight:600;color:#444">${escapeHtml(key)}</th><td style="padding:2px 0">${escapeHtml(value)}</td></tr>`)
      .join("");
    return `<table style="border-collapse:collapse;margin:0 0 14px;font-size:14px">${rows}</table>`;
  });
  const html = [
    "<!doctype html>",
    `<html><head><meta charset="utf-8"><title>${escapeHtml(subject)}</title></head>`,
    '<body style="margin:0;padding:24px;background:#f4f6f5;font-family:system-ui,sans-serif;font-size:15px;line-height:1.5;color:#1d2428">',
    '<div style="max-width:560px;margin:0 auto;background:#fff;border:1px solid #d6dcd9;border-radius:6px;padding:20px 24px">',
    '<p style="margin:0 0 12px;font-size:12px;letter-spacing:.08em;text-transform:uppercase;color:#2f6f62">Loopyard</p>',
    `<h1 style="margin:0 0 16px;font-size:18px;font-weight:600">${escapeHtml(layout.heading)}</h1>`,
    ...htmlBlocks,
    `<p style="margin:18px 0"><a href="${escapeHtml(href)}" style="display:inline-block;padding:8px 14px;background:#2f6f62;color:#fff;text-decoration:none;border-radius:4px">${escapeHtml(layout.action.label)}</a></p>`,
    `<p style="margin:0 0 14px;font-size:13px;color:#555">Or open this address: <a href="${escapeHtml(href)}" style="color:#2f6f62">${escapeHtml(href)}</a></p>`,
    ...(layout.note ? [`<p style="margin:0 0 14px;padding:8px 12px;background:#fff6e0;border-left:3px solid #c98a0b;font-size:13px">${escapeHtml(layout.note)}</p>`] : []),
    `<p style="margin:16px 0 0;font-size:12px;color:#777">${escapeHtml(footer)}</p>`,
    "</div></body></html>",
  ].join("\n");
  return { subject: subjectLine(subject), text, html };
}
