/**
 * The HTML part of a received mail as a document for a sandboxed iframe's srcdoc: a policy that
 * lets no script, frame, form or remote resource run or load (the sandbox blocks scripts already;
 * this is a second lock), and links that open in a new tab instead of inside the frame.
 */
export function mailPreviewDocument(html: string): string {
  const head =
    `<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'; img-src data:">` +
    `<base target="_blank">`;
  // Put the lock first in <head> (or before everything), so nothing in the mail comes before it.
  const match = /<head[^>]*>/i.exec(html);
  if (match) return html.slice(0, match.index + match[0].length) + head + html.slice(match.index + match[0].length);
  return `<!doctype html><html><head>${head}</head><body>${html}</body></html>`;
}

/** Recipients for a table cell: the first two and "+ n more". */
export function recipientsLabel(to: readonly string[]): string {
  if (to.length === 0) return "(no recipient)";
  if (to.length <= 2) return to.join(", ");
  return `${to.slice(0, 2).join(", ")} + ${to.length - 2} more`;
}
