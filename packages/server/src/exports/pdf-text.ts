/**
 * pdfkit's standard fonts (Helvetica, Courier) encode text in WinAnsi: Latin-1 and a few signs.
 * The lab's texts use mathematical signs beyond it; these are written out so the record prints
 * every character (anything else unknown becomes "?").
 */
const REPLACEMENTS: Record<string, string> = {
  "−": "-",
  "∞": "inf",
  "≤": "<=",
  "≥": ">=",
  "≠": "!=",
  "≈": "~",
  "√": "sqrt",
  "ω": "w",
  "θ": "theta",
  "τ": "tau",
  "λ": "lambda",
  "Δ": "delta ",
  "‖": "||",
  "∫": "int",
  "Ī": "I_",
  "⁻": "^-",
  "¹": "1",
  "→": "->",
  "←": "<-",
  "…": "...",
  "′": "'",
  "ᵢ": "i",
};

/** WinAnsi-encodable characters beyond Latin-1 (pdfkit's standard-font encoding). */
const WIN_ANSI_EXTRA = new Set("€‚ƒ„…†‡ˆ‰Š‹ŒŽ‘’“”•–—˜™š›œžŸ");

/** Text as the standard fonts can print it. */
export function pdfText(text: string): string {
  let out = "";
  for (const ch of text.normalize("NFC")) {
    const code = ch.codePointAt(0) as number;
    if (code === 9 || code === 10 || (code >= 32 && code < 127) || (code >= 160 && code <= 255) || WIN_ANSI_EXTRA.has(ch)) out += ch;
    else out += REPLACEMENTS[ch] ?? "?";
  }
  return out;
}
