/** Small shapes shared by several contracts. */
import { z } from 'zod';

/** The one text-field schema (control characters refused, NFC, trimmed, length in characters). */
export { textField, type TextFieldOptions } from '../schemas/text-field.js';

/** A number in a range; the message names the bound (units are part of the field name). */
export function numberField({ min, max }: { min: number; max: number }) {
  return z
    .number({ error: (issue) => (issue.input === undefined ? 'is required' : 'must be a finite number') })
    .min(min, `must be at least ${min}`)
    .max(max, `must be at most ${max}`);
}

export const IsoDateTimeSchema = z.string();

/** A page of a list. */
export function pageOf<Item extends z.ZodType>(item: Item) {
  return z.object({
    items: z.array(item),
    /** 1-based page number */
    page: z.number().int().min(1),
    pageSize: z.number().int().min(1),
    /** number of items over all pages */
    total: z.number().int().min(0),
  });
}

/** Query-string integers arrive as text. */
export function queryInteger({ min, max, fallback }: { min: number; max: number; fallback: number }) {
  return z.coerce
    .number({ error: 'must be a whole number' })
    .int('must be a whole number')
    .min(min, `must be at least ${min}`)
    .max(max, `must be at most ${max}`)
    .default(fallback);
}
