/**
 * Flattens a zod error into `{ path, message }` pairs with dotted paths, e.g.
 * `{ path: 'transmitter.wavelengthM', message: 'must be at least 200 nm' }`. The API answers 400
 * with this list; the UI puts each message beside the field with that path.
 */
import type { z } from 'zod';

export interface FieldIssue {
  /** dotted path of the field, '' for the whole document; array indices appear as numbers */
  path: string;
  /** the reason, in words a user understands */
  message: string;
}

function joinPath(segments: readonly PropertyKey[]): string {
  return segments.map((segment) => String(segment)).join('.');
}

/** @param error a ZodError (or anything with zod's `issues` array) */
export function formatZodIssues(error: Pick<z.ZodError, 'issues'>): FieldIssue[] {
  const result: FieldIssue[] = [];
  for (const issue of error.issues) {
    if (issue.code === 'unrecognized_keys') {
      // One entry per unknown key, placed on the key itself so the caller sees the typo.
      for (const key of issue.keys) {
        result.push({ path: joinPath([...issue.path, key]), message: 'is not a known field' });
      }
      continue;
    }
    result.push({ path: joinPath(issue.path), message: issue.message });
  }
  return result;
}
