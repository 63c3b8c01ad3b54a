import { z } from "zod";

/**
 * Control characters a stored text may not hold: C0 (U+0000–U+001F) but tab (U+0009) and line feed
 * (U+000A), DEL (U+007F) and C1 (U+0080–U+009F). PostgreSQL refuses U+0000 in text and jsonb outright;
 * the rest would print as nothing, or move the cursor, wherever the text is shown.
 */
const FORBIDDEN_CONTROL = /[\u0000-\u0008\u000B-\u001F\u007F-\u009F]/;

/** True when `text` holds a control character other than tab and line feed. */
export function hasForbiddenControl(text: string): boolean {
  return FORBIDDEN_CONTROL.test(text);
}

/**
 * True when `text` is well-formed UTF-16: no lone surrogate (U+D800–U+DFFF outside a pair),
 * which neither UTF-8 nor PostgreSQL's jsonb can represent.
 */
export function isWellFormedText(text: string): boolean {
  return !LONE_SURROGATE.test(text);
}

/** With the u flag a surrogate pair is one code point, so only a surrogate outside a pair matches. */
const LONE_SURROGATE = /\p{Cs}/u;

/** What a text field needs: a label for the messages and its length bounds (in UTF-16 code units, after trimming). */
export interface TextFieldConfig {
  /** How the messages name the field: "name", "units note", "label". */
  label: string;
  /** Most characters, e.g. 120. */
  max: number;
  /** Fewest characters (default 0); with `required` as its message. */
  min?: number;
  /** Message when shorter than `min`, e.g. "give the plant a name". */
  required?: string;
  /** Message when longer than `max` (default "keep the <label> under <max> characters"). */
  tooLong?: string;
}

/**
 * A user-typed text as the API stores it (names, labels, units notes): refused when it holds a
 * control character other than tab and newline or a lone surrogate, then normalised to Unicode NFC
 * (so "é" typed as e + U+0301 and as U+00E9 is one name) and trimmed, then its length checked.
 *
 * Reference: Unicode Standard Annex #15, Unicode Normalization Forms (NFC); control characters are
 * the general category Cc of the Unicode Character Database.
 */
export function textField(config: TextFieldConfig) {
  const min = config.min ?? 0;
  let schema = z
    .string({ error: `give the ${config.label} as text` })
    .refine((text) => !hasForbiddenControl(text), {
      message: `remove the control characters from the ${config.label} (only tab and newline are allowed)`,
      abort: true,
    })
    .refine(isWellFormedText, {
      message: `the ${config.label} holds a broken character (a lone UTF-16 surrogate); type it again`,
      abort: true,
    })
    .normalize("NFC")
    .trim();
  if (min > 0) schema = schema.min(min, config.required ?? `the ${config.label} needs at least ${min} characters`);
  return schema.max(config.max, config.tooLong ?? `keep the ${config.label} under ${config.max} characters`);
}
