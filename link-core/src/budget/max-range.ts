/**
 * Maximum range for a required margin (METHODS.md §10.4): the root of M(L) = M_req on [50 m, 50 km].
 */
import { findRootBrent } from '../numeric/root-finding.js';
import type { LinkDesignInput } from '../schemas/link-design.schema.js';
import { evaluateChain, resolveDesign, specificAttenuationDbPerKm } from './link-chain.js';

/** Search interval of the maximum range [m] (METHODS.md §10.4). */
export const MAX_RANGE_SEARCH_M = { lower: 50, upper: 50_000 } as const;

/** Outcome of {@link maxRange}. */
export interface MaxRangeResult {
  /**
   * `found`: the margin falls to the requirement at `rangeM`; `not-achievable`: the margin is below
   * the requirement already at 50 m (`rangeM` null); `beyond-search-limit`: the margin still meets
   * the requirement at 50 km (`rangeM` = 50 000, a lower bound).
   */
  status: 'found' | 'not-achievable' | 'beyond-search-limit';
  rangeM: number | null;
  /** link margin at `rangeM` [dB] (at 50 m when not achievable) */
  marginAtRangeDb: number;
}

/** Samples of the bracketing scan, log-spaced over the search interval (a ratio of 1.12 between neighbours). */
const SCAN_POINTS = 64;

/**
 * Longest path length at which the design still has the required margin, with the reason when
 * there is none. Everything but the range is taken from the design (visibility, Cn², probability…).
 *
 * M(L) usually falls monotonically (METHODS.md §10.4), but not always: with a central obscuration, while
 * the beam is narrower than the obscuration, widening it *raises* the captured power; and with
 * strong turbulence and a very small fade probability (e.g. Cn² = 1e-13, p = 1e-6) the fade margin
 * shrinks as the scintillation index passes its peak towards saturation, faster than the other
 * losses grow (rises of ~0.05 dB seen). So the margin is first scanned on 64 log-spaced ranges;
 * the root is then bracketed
 * between the last range that meets the requirement and the next, and refined with Brent's method.
 * For a monotone margin this is the unique root.
 *
 * @param design the link design (its own rangeM is ignored)
 * @param requiredMarginDb required link margin [dB], finite (may be negative)
 * @returns status, range [m] in [50, 50 000] or null, and the margin there [dB] (for
 *   `not-achievable`: the best margin found on the scan)
 * @see METHODS.md §10.4; Brent R.P., "Algorithms for Minimization without Derivatives" (1973), ch. 4.
 */
export function maxRange(design: LinkDesignInput, requiredMarginDb: number): MaxRangeResult {
  if (!Number.isFinite(requiredMarginDb)) throw new RangeError(`requiredMarginDb: must be a finite number (got ${String(requiredMarginDb)})`);
  const resolved = resolveDesign(design);
  const attenuation = specificAttenuationDbPerKm(resolved, resolved.visibility2PercentKm);
  const excess = (rangeM: number) => evaluateChain(resolved, rangeM, attenuation, resolved.includeScintillation).linkMarginDb - requiredMarginDb;
  const { lower, upper } = MAX_RANGE_SEARCH_M;
  const ratio = Math.pow(upper / lower, 1 / (SCAN_POINTS - 1));
  let lastMetIndex = -1;
  let lastMetRange: number = lower;
  let bestExcess = -Infinity;
  for (let i = 0; i < SCAN_POINTS; i++) {
    const rangeM = i === SCAN_POINTS - 1 ? upper : lower * Math.pow(ratio, i);
    const value = excess(rangeM);
    if (value > bestExcess) bestExcess = value;
    if (value >= 0) {
      lastMetIndex = i;
      lastMetRange = rangeM;
    }
  }
  if (lastMetIndex < 0) return { status: 'not-achievable', rangeM: null, marginAtRangeDb: bestExcess + requiredMarginDb };
  if (lastMetIndex === SCAN_POINTS - 1) return { status: 'beyond-search-limit', rangeM: upper, marginAtRangeDb: excess(upper) + requiredMarginDb };
  const nextRange = lastMetIndex + 1 === SCAN_POINTS - 1 ? upper : lower * Math.pow(ratio, lastMetIndex + 1);
  const rangeM = findRootBrent(excess, lastMetRange, nextRange, { xTolerance: 1e-6 });
  return { status: 'found', rangeM, marginAtRangeDb: excess(rangeM) + requiredMarginDb };
}

/**
 * Maximum range [m] at which the link margin still equals `requiredMarginDb`, searched on
 * [50 m, 50 km]; null when the requirement is not met even at 50 m. When the margin still meets
 * the requirement at 50 km, 50 000 is returned (use {@link maxRange} to tell the two apart).
 *
 * @param design the link design (its own rangeM is ignored)
 * @param requiredMarginDb required link margin [dB]
 * @returns range [m] in [50, 50 000], or null when not achievable
 * @see METHODS.md §10.4; {@link maxRange}.
 */
export function maxRangeM(design: LinkDesignInput, requiredMarginDb: number): number | null {
  return maxRange(design, requiredMarginDb).rangeM;
}
