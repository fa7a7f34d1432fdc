/**
 * Variants: named alternatives of a revision's design (the same path at another wavelength, with
 * another equipment pair, a larger aperture…). They are saved with the revision, each with the
 * budget link-core computed for it at save time, and are as immutable as the revision itself, so a
 * reviewer sees what was considered beside what was chosen. One of them can be promoted: it becomes
 * the design of the next revision, and the former design is kept there as a variant.
 *
 * Indices are 0-based, as in the field paths of a refused save (`variants.2.design.rangeM`) and in
 * the promotion route (`…/variants/2/promote`).
 */
import { z } from 'zod';
import { LinkDesignSchema } from '../schemas/link-design.schema.js';
import { textField } from '../schemas/text-field.js';

/** At most this many variants per revision (enough for a wavelength set and a few equipment pairs). */
export const MAX_VARIANTS_PER_REVISION = 8;
/** Longest variant name, in characters (names are short labels: "850 nm", "80 mm transmit aperture"). */
export const VARIANT_NAME_MAX_LENGTH = 100;

/**
 * The key two variant names are compared by: case-folded, after the NFC and trimming textField
 * already applied, so "850 nm" and "850 NM" are one name.
 */
export function variantNameKey(name: string): string {
  return name.normalize('NFC').trim().toLocaleLowerCase('en');
}

export const VariantRequestSchema = z.strictObject({
  name: textField({ min: 1, max: VARIANT_NAME_MAX_LENGTH }),
  design: LinkDesignSchema,
});
export type VariantRequest = z.input<typeof VariantRequestSchema>;

/**
 * The `variants` of a revision body: at most MAX_VARIANTS_PER_REVISION, names unique within the
 * revision regardless of case. A repeated name is refused on the later one's `name`
 * (`variants.3.name`), saying which variant holds it first. Absent means no variants.
 */
export const VariantsRequestSchema = z
  .array(VariantRequestSchema, { error: (issue) => (issue.input === undefined ? 'is required' : 'must be a list of variants') })
  .max(MAX_VARIANTS_PER_REVISION, `must hold at most ${MAX_VARIANTS_PER_REVISION} variants`)
  .superRefine((variants, context) => {
    const firstIndexByName = new Map<string, number>();
    variants.forEach((variant, index) => {
      const key = variantNameKey(variant.name);
      const first = firstIndexByName.get(key);
      if (first === undefined) {
        firstIndexByName.set(key, index);
        return;
      }
      context.addIssue({
        code: 'custom',
        path: [index, 'name'],
        message: `must differ from the name of variant ${first} ("${variants[first]!.name}"); names are compared regardless of case`,
        input: variant.name,
      });
    });
  })
  .default([]);

/**
 * `POST /api/links/:id/revisions/:revision/variants/:index/promote`. The path's revision is the base:
 * it must still be the latest, else 409 as for any save. Both fields are optional.
 */
export const PromoteVariantRequestSchema = z.strictObject({
  /** note of the new revision; absent: "Promoted variant "…" of revision n" */
  note: textField({ max: 2000, multiline: true }).optional(),
  /**
   * name under which the former design is kept as a variant of the new revision; absent:
   * "Primary of revision n" (made unique among the other variants' names)
   */
  primaryName: textField({ min: 1, max: VARIANT_NAME_MAX_LENGTH }).optional(),
});
export type PromoteVariantRequest = z.input<typeof PromoteVariantRequestSchema>;

/** Default name of the former design when a variant of revision `revisionNumber` is promoted. */
export function formerPrimaryVariantName(revisionNumber: number): string {
  return `Primary of revision ${revisionNumber}`;
}

/**
 * `preferred`, or `preferred (2)`, `(3)`… — the first spelling no name in `taken` already holds
 * (compared as variantNameKey does).
 */
export function uniqueVariantName(preferred: string, taken: readonly string[]): string {
  const keys = new Set(taken.map(variantNameKey));
  if (!keys.has(variantNameKey(preferred))) return preferred;
  for (let suffix = 2; ; suffix += 1) {
    const candidate = `${preferred} (${suffix})`;
    if (!keys.has(variantNameKey(candidate))) return candidate;
  }
}
