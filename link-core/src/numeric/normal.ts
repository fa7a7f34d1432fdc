/**
 * Standard normal quantile, accurate in both tails.
 *
 * Not @stdlib's normal quantile: it computes √2·erfinv(2p − 1), and 2p − 1 rounds to −1 below
 * p ≈ 1e-16, so it answers −Infinity there (and loses digits long before). The complementary
 * inverse error function keeps every digit: Φ⁻¹(p) = −√2·erfcinv(2p) for p < 1/2.
 */
import erfcinv from '@stdlib/math-base-special-erfcinv';
import { requireOpenUnitInterval } from './input-guards.js';

/**
 * Allocation-free Φ⁻¹(p) without argument checks (the hot paths check p once, up front).
 *
 * @param probability p in (0, 1)
 * @returns Φ⁻¹(p), dimensionless; finite for every p in (0, 1) (−37.05 at 1e-300)
 * @see Abramowitz M., Stegun I.A., "Handbook of Mathematical Functions" (1964), ch. 26
 *   (Φ(x) = erfc(−x/√2)/2) [from memory]; erfcinv as implemented by @stdlib (after Boost.Math);
 *   checked against scipy.special.ndtri down to 1e-300 in fade-tail.test.ts.
 */
export function standardNormalQuantile(probability: number): number {
  // For p > 1/2 the upper tail 1 − p is as exact as the caller's p allows.
  return probability < 0.5 ? -Math.SQRT2 * erfcinv(2 * probability) : Math.SQRT2 * erfcinv(2 * (1 - probability));
}

/**
 * Standard normal quantile Φ⁻¹(p).
 *
 * @param probability p in (0, 1)
 * @returns Φ⁻¹(p), dimensionless (−3.0902 at 1e-3, −4.7534 at 1e-6, −8.4938 at 1e-17)
 * @see {@link standardNormalQuantile}
 */
export function normalQuantileOf(probability: number): number {
  requireOpenUnitInterval('probability', probability);
  return standardNormalQuantile(probability);
}
