/**
 * The one string schema for every free-text field of the API and the forms: names, notes, maker,
 * revision notes, review comments and the search parameter.
 *
 * - Control characters are refused with a message naming the character and where it is: NUL
 *   (which PostgreSQL cannot store in text), the rest of C0 (U+0000–U+001F), DEL (U+007F) and C1
 *   (U+0080–U+009F). Tab and line breaks are allowed only in multiline fields (notes, comments),
 *   where CRLF and a lone CR are first turned into LF, so a note reads the same on every system.
 * - The text is normalised to NFC, so "e" + combining acute and the precomposed "é" are one
 *   spelling (searches and comparisons agree), then trimmed at both ends.
 * - The length limit counts characters (code points) after normalisation, as PostgreSQL's
 *   varchar(n) does, and the message states it.
 *
 * The field itself is named by the issue path (formatZodIssues), so messages never repeat it.
 */
import { z } from 'zod';

export interface TextFieldOptions {
  /** fewest characters after trimming; 1 makes the field required ("is required") */
  min?: number;
  /** most characters after normalisation and trimming */
  max: number;
  /** true for notes and comments: tab and line breaks allowed */
  multiline?: boolean;
}

/**
 * Index of the first control character (C0, DEL or C1), or −1. A multiline field allows tab
 * (U+0009) and LF (U+000A); CR never reaches this check there, it is turned into LF first.
 * A loop over code units rather than a regular expression of control characters (which the lint
 * rules rightly flag as usually a mistake).
 */
function firstControlCharacter(value: string, multiline: boolean): number {
  for (let i = 0; i < value.length; i++) {
    const unit = value.charCodeAt(i);
    if (unit <= 0x1f) {
      if (multiline && (unit === 0x09 || unit === 0x0a)) continue;
      return i;
    }
    if (unit >= 0x7f && unit <= 0x9f) return i;
  }
  return -1;
}

function codePointLength(value: string): number {
  let count = 0;
  for (let i = 0; i < value.length; i++) {
    const unit = value.charCodeAt(i);
    // a high surrogate followed by a low one is one character
    if (unit >= 0xd800 && unit <= 0xdbff && i + 1 < value.length) {
      const next = value.charCodeAt(i + 1);
      if (next >= 0xdc00 && next <= 0xdfff) i++;
    }
    count++;
  }
  return count;
}

function describeControlCharacter(value: string, index: number): string {
  const code = value.charCodeAt(index).toString(16).toUpperCase().padStart(4, '0');
  // characters counted from 1, as a person counts them
  return `U+${code} at character ${codePointLength(value.slice(0, index)) + 1}`;
}

/**
 * A bounded text field: control characters refused, NFC, trimmed, length in characters.
 *
 * @param options min (default 0), max characters, multiline (default false)
 * @returns a zod string schema (output type string; `.optional()` and `.default()` work as usual)
 * @see Unicode Standard Annex #15, "Unicode Normalization Forms" (NFC); Unicode general category
 *   Cc (the C0 and C1 control characters and DEL).
 */
export function textField({ min = 0, max, multiline = false }: TextFieldOptions) {
  const controlMessage = multiline ? 'must not contain control characters other than tab and line breaks' : 'must not contain control characters';
  let schema = z.string({ error: (issue) => (issue.input === undefined ? 'is required' : 'must be text') });
  if (multiline) schema = schema.overwrite((value) => value.replace(/\r\n?/g, '\n'));
  return schema
    .normalize('NFC')
    .trim()
    .superRefine((value, context) => {
      const index = firstControlCharacter(value, multiline);
      if (index >= 0) {
        context.addIssue({ code: 'custom', message: `${controlMessage} (${describeControlCharacter(value, index)})`, input: value, abort: true });
        return;
      }
      const length = codePointLength(value);
      if (min > 0 && length < min) {
        context.addIssue({ code: 'custom', message: min === 1 ? 'is required' : `must be at least ${min} characters`, input: value });
      } else if (length > max) {
        context.addIssue({ code: 'custom', message: `must be at most ${max} characters`, input: value });
      }
    })
    // the refinement is invisible to JSON Schema: state the limits for the OpenAPI document
    .meta(min > 0 ? { minLength: min, maxLength: max } : { maxLength: max });
}
