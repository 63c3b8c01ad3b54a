/**
 * Finds tokens of an expression's text by kind and occurrence, so that an
 * error found while walking the parse tree (which carries no positions)
 * can point at a column.
 *
 * The checker walks the tree in source order and, for every accepted node,
 * counts the tokens it accounts for (`consume`). The offending token of the
 * first refused node is then the next not-yet-counted occurrence of its
 * kind. This scanner is used only to place error messages; it decides
 * nothing about what is accepted.
 *
 * Token keys: an identifier or operator word is keyed by its text, a number
 * by `#num`, a string literal by `#str`, punctuation by its text (longest
 * match of the syntax's delimiters), a line break outside brackets by `\n`.
 */
export interface LocatedToken {
  readonly key: string;
  readonly text: string;
  /** 0-based character position. */
  readonly index: number;
  /** Bracket nesting depth at this token; an opening bracket counts itself. */
  readonly depth: number;
}

const NUMBER_KEY = "#num";
const STRING_KEY = "#str";
const NUMBER = /^(?:0[xXbBoO][0-9a-fA-F]+(?:\.[0-9a-fA-F]*)?(?:i\d+)?|(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)/;
const IDENTIFIER = /^[A-Za-z_$\u00C0-\uFFFF][A-Za-z0-9_$\u00C0-\uFFFF]*/;
const PUNCTUATION = [
  ">>>", ".*", "./", ".^", "^|", "?.", "??", "==", "!=", "<=", ">=", "<<", ">>",
] as const;
const OPENING = new Set(["(", "[", "{"]);
const CLOSING = new Set([")", "]", "}"]);

export class TokenLocator {
  readonly tokens: readonly LocatedToken[];
  private readonly byKey = new Map<string, LocatedToken[]>();
  private readonly seen = new Map<string, number>();

  constructor(text: string) {
    this.tokens = scan(text);
    for (const token of this.tokens) {
      const list = this.byKey.get(token.key);
      if (list) list.push(token);
      else this.byKey.set(token.key, [token]);
    }
  }

  /** Counts one token of `key` as accounted for by an accepted node. */
  consume(key: string): void {
    this.seen.set(key, (this.seen.get(key) ?? 0) + 1);
  }

  /** Counts one number token as accounted for. */
  consumeNumber(): void {
    this.consume(NUMBER_KEY);
  }

  /** The next occurrence of `key` not yet accounted for, if the scan found one. */
  next(key: string): LocatedToken | undefined {
    return this.byKey.get(key)?.[this.seen.get(key) ?? 0];
  }

  /** The next number token not yet accounted for. */
  nextNumber(): LocatedToken | undefined {
    return this.next(NUMBER_KEY);
  }

  /** The next string literal not yet accounted for. */
  nextString(): LocatedToken | undefined {
    return this.next(STRING_KEY);
  }

  /** The first opening bracket nested deeper than `limit`, if any. */
  firstDeeperThan(limit: number): LocatedToken | undefined {
    return this.tokens.find((token) => OPENING.has(token.key) && token.depth > limit);
  }
}

function scan(text: string): LocatedToken[] {
  const tokens: LocatedToken[] = [];
  let depth = 0;
  let i = 0;
  const push = (key: string, tokenText: string, index: number): void => {
    tokens.push({ key, text: tokenText, index, depth });
  };
  while (i < text.length) {
    const ch = text[i];
    const rest = text.slice(i);
    if (ch === " " || ch === "\t" || ch === "\r") {
      i += 1;
    } else if (ch === "\n") {
      if (depth === 0) push("\n", "\n", i);
      i += 1;
    } else if (ch === "#") {
      const end = text.indexOf("\n", i);
      i = end === -1 ? text.length : end;
    } else if (ch === '"' || (ch === "'" && !followsValue(tokens))) {
      const end = closingQuote(text, i);
      push(STRING_KEY, text.slice(i, end), i);
      i = end;
    } else {
      const number = NUMBER.exec(rest);
      const identifier = number ? null : IDENTIFIER.exec(rest);
      if (number) {
        push(NUMBER_KEY, number[0], i);
        i += number[0].length;
      } else if (identifier) {
        push(identifier[0], identifier[0], i);
        i += identifier[0].length;
      } else {
        const punct = PUNCTUATION.find((p) => rest.startsWith(p)) ?? ch;
        if (OPENING.has(punct)) depth += 1;
        push(punct, punct, i);
        if (CLOSING.has(punct)) depth = Math.max(0, depth - 1);
        i += punct.length;
      }
    }
  }
  return tokens;
}

/** Whether a `'` here is a postfix transpose rather than the start of a string. */
function followsValue(tokens: readonly LocatedToken[]): boolean {
  const last = tokens[tokens.length - 1];
  if (!last) return false;
  return last.key === NUMBER_KEY || /^[A-Za-z_$\u00C0-\uFFFF]/.test(last.key) || last.key === ")" || last.key === "]" || last.key === "'";
}

/** Index just past the quote closing the string that starts at `start`. */
function closingQuote(text: string, start: number): number {
  const quote = text[start];
  let i = start + 1;
  while (i < text.length) {
    if (text[i] === "\\") i += 2;
    else if (text[i] === quote) return i + 1;
    else i += 1;
  }
  return text.length;
}
