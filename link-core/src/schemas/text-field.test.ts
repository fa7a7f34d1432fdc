import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { formatZodIssues } from './format-zod-issues.js';
import { textField } from './text-field.js';

const form = z.strictObject({
  name: textField({ min: 1, max: 20 }),
  notes: textField({ max: 40, multiline: true }).default(''),
});

function issuesOf(value: unknown) {
  const result = form.safeParse(value);
  expect(result.success).toBe(false);
  return formatZodIssues(result.error!);
}

describe('textField', () => {
  it('rejects a NUL character with a message naming the field and the character', () => {
    expect(issuesOf({ name: 'Roof\u0000A' })).toEqual([{ path: 'name', message: 'must not contain control characters (U+0000 at character 5)' }]);
    expect(issuesOf({ name: 'Roof', notes: '\u0000' })).toEqual([
      { path: 'notes', message: 'must not contain control characters other than tab and line breaks (U+0000 at character 1)' },
    ]);
  });

  it('rejects every C0 control character, DEL and the C1 set', () => {
    const allowedInNotes = new Set([0x09, 0x0a, 0x0d]);
    for (let code = 0; code <= 0x9f; code++) {
      if (code > 0x1f && code < 0x7f) continue;
      const character = String.fromCharCode(code);
      expect(form.safeParse({ name: `a${character}b` }).success, `U+${code.toString(16)} in a name`).toBe(false);
      expect(form.safeParse({ name: 'a', notes: `a${character}b` }).success, `U+${code.toString(16)} in notes`).toBe(allowedInNotes.has(code));
    }
  });

  it('allows tab and line breaks only where the field is multiline, with CRLF kept as one line break', () => {
    expect(form.parse({ name: 'a', notes: 'line 1\r\nline 2\tend\rlast' }).notes).toBe('line 1\nline 2\tend\nlast');
    expect(issuesOf({ name: 'two\nlines' })).toEqual([{ path: 'name', message: 'must not contain control characters (U+000A at character 4)' }]);
    expect(issuesOf({ name: 'a\tb' })).toEqual([{ path: 'name', message: 'must not contain control characters (U+0009 at character 2)' }]);
  });

  it('normalises to NFC and trims the ends', () => {
    const parsed = form.parse({ name: '  Caf\u0065\u0301  ', notes: 'e\u0301' });
    expect(parsed.name).toBe('Café');
    expect(parsed.name).toHaveLength(4);
    expect(parsed.notes).toBe('\u00e9');
    // a line break at the very end of a one-line field is trimmed away, not refused
    expect(form.parse({ name: 'Roof A\n' }).name).toBe('Roof A');
  });

  it('states the length limit, counted in characters after normalisation', () => {
    expect(issuesOf({ name: 'x'.repeat(21) })).toEqual([{ path: 'name', message: 'must be at most 20 characters' }]);
    // 20 decomposed "é" are 40 UTF-16 units but 20 characters once composed
    expect(form.parse({ name: 'e\u0301'.repeat(20) }).name).toHaveLength(20);
    // an astral character (one character, two UTF-16 units) counts once
    expect(form.parse({ name: '\u{1F4E1}'.repeat(20) }).name).toHaveLength(40);
    expect(issuesOf({ name: '\u{1F4E1}'.repeat(21) })).toEqual([{ path: 'name', message: 'must be at most 20 characters' }]);
  });

  it('keeps the "is required" and "must be text" messages', () => {
    expect(issuesOf({})).toEqual([{ path: 'name', message: 'is required' }]);
    expect(issuesOf({ name: '   ' })).toEqual([{ path: 'name', message: 'is required' }]);
    expect(issuesOf({ name: 42 })).toEqual([{ path: 'name', message: 'must be text' }]);
  });

  it('keeps a string output type (usable in z.output and with .optional/.default)', () => {
    const parsed: { name: string; notes: string } = form.parse({ name: 'x' });
    expect(parsed).toEqual({ name: 'x', notes: '' });
  });
});
