/**
 * International visibility code: the weather label of a visibility range, for UI captions.
 */
import { requirePositive } from '../numeric/input-guards.js';

/** One row of the international visibility code. */
export interface VisibilityCodeClass {
  /** Machine key. */
  key:
    | 'dense-fog'
    | 'thick-fog'
    | 'moderate-fog'
    | 'light-fog'
    | 'thin-fog'
    | 'haze'
    | 'light-haze'
    | 'clear'
    | 'very-clear'
    | 'exceptionally-clear';
  /** English label. */
  label: string;
  /** Lower bound of the class [m] (inclusive). */
  minVisibilityM: number;
  /** Upper bound of the class [m] (exclusive); Infinity for the last class. */
  maxVisibilityM: number;
}

/**
 * The international visibility code classes, dense fog to exceptionally clear.
 *
 * @see Table reproduced in Kim, McArthur & Korevaar, Proc. SPIE 4214 (2001) and ITU-R P.1817
 *   [from memory].
 */
export const VISIBILITY_CODE: readonly VisibilityCodeClass[] = [
  { key: 'dense-fog', label: 'Dense fog', minVisibilityM: 0, maxVisibilityM: 50 },
  { key: 'thick-fog', label: 'Thick fog', minVisibilityM: 50, maxVisibilityM: 200 },
  { key: 'moderate-fog', label: 'Moderate fog', minVisibilityM: 200, maxVisibilityM: 500 },
  { key: 'light-fog', label: 'Light fog', minVisibilityM: 500, maxVisibilityM: 1000 },
  { key: 'thin-fog', label: 'Thin fog or mist', minVisibilityM: 1000, maxVisibilityM: 2000 },
  { key: 'haze', label: 'Haze', minVisibilityM: 2000, maxVisibilityM: 4000 },
  { key: 'light-haze', label: 'Light haze', minVisibilityM: 4000, maxVisibilityM: 10000 },
  { key: 'clear', label: 'Clear', minVisibilityM: 10000, maxVisibilityM: 20000 },
  { key: 'very-clear', label: 'Very clear', minVisibilityM: 20000, maxVisibilityM: 50000 },
  { key: 'exceptionally-clear', label: 'Exceptionally clear', minVisibilityM: 50000, maxVisibilityM: Infinity },
];

/**
 * The international visibility code class of a visibility.
 *
 * @param visibilityM visibility [m], > 0
 * @returns the class whose [min, max) range holds the visibility
 * @see {@link VISIBILITY_CODE} [from memory].
 */
export function visibilityCodeClass(visibilityM: number): VisibilityCodeClass {
  requirePositive('visibilityM', visibilityM);
  for (const row of VISIBILITY_CODE) if (visibilityM < row.maxVisibilityM) return row;
  return VISIBILITY_CODE[VISIBILITY_CODE.length - 1]!;
}
