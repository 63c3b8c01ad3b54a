import { inflateSync } from "node:zlib";

/**
 * The standard fonts' encoding, WinAnsiEncoding (ISO 32000-1, Annex D): Latin-1, except codes
 * 0x80–0x9F, which hold these signs (undefined codes left as they are).
 */
const WIN_ANSI_HIGH = "€\x81‚ƒ„…†‡ˆ‰Š‹Œ\x8dŽ\x8f\x90‘’“”•–—˜™š›œ\x9džŸ";
const WIN_ANSI = {
  decode(bytes: Uint8Array): string {
    let out = "";
    for (const b of bytes) out += b >= 0x80 && b <= 0x9f ? (WIN_ANSI_HIGH[b - 0x80] as string) : String.fromCharCode(b);
    return out;
  },
};

/**
 * A small PDF text check for tests (no PDF library): inflates every Flate stream of the file and
 * reads the strings of its text operators (TJ arrays and Tj, hex or literal), decoded as the
 * standard fonts' WinAnsi (Latin-1 for the characters the record uses). One line per operator;
 * the fragments of one TJ array (split by kerning) are joined. Enough to see which words a page
 * shows; not a general PDF parser.
 */
export function pdfTextLines(pdf: Buffer): string[] {
  const raw = pdf.toString("latin1");
  const lines: string[] = [];
  const streams = /stream\r?\n/g;
  let match: RegExpExecArray | null;
  while ((match = streams.exec(raw))) {
    const start = match.index + match[0].length;
    const end = raw.indexOf("endstream", start);
    if (end < 0) break;
    let content: string;
    try {
      content = inflateSync(pdf.subarray(start, end)).toString("latin1");
    } catch {
      content = raw.slice(start, end);
    }
    for (const op of content.matchAll(/\[((?:[^\]\\]|\\.)*)\]\s*TJ|(<[0-9A-Fa-f]*>|\((?:[^)\\]|\\.)*\))\s*Tj/g)) {
      const body = op[1] ?? op[2] ?? "";
      let line = "";
      for (const s of body.matchAll(/<([0-9A-Fa-f]*)>|\(((?:[^)\\]|\\.)*)\)/g)) {
        if (s[1] !== undefined) line += WIN_ANSI.decode(Buffer.from(s[1], "hex"));
        else line += (s[2] ?? "").replace(/\\([()\\])/g, "$1");
      }
      lines.push(line);
    }
    streams.lastIndex = end + "endstream".length;
  }
  return lines;
}

/** Every operator's text of a PDF in one string (lines joined by "\n"). */
export function pdfText(pdf: Buffer): string {
  return pdfTextLines(pdf).join("\n");
}

/** Drawing operators in the page content streams: lines (l), moves (m) and image draws (Do of an /Image XObject). */
export function pdfDrawingCounts(pdf: Buffer): { lineTo: number; moveTo: number; images: number } {
  const raw = pdf.toString("latin1");
  let lineTo = 0;
  let moveTo = 0;
  const streams = /stream\r?\n/g;
  let match: RegExpExecArray | null;
  while ((match = streams.exec(raw))) {
    const start = match.index + match[0].length;
    const end = raw.indexOf("endstream", start);
    if (end < 0) break;
    let content = "";
    try {
      content = inflateSync(pdf.subarray(start, end)).toString("latin1");
    } catch {
      content = raw.slice(start, end);
    }
    lineTo += (content.match(/ l\n/g) ?? []).length;
    moveTo += (content.match(/ m\n/g) ?? []).length;
    streams.lastIndex = end + "endstream".length;
  }
  return { lineTo, moveTo, images: (raw.match(/\/Subtype\s*\/Image/g) ?? []).length };
}
