/**
 * Standard normal quantile (thin wrapper so callers need not know the library's signature).
 */
import normalQuantile from '@stdlib/stats-base-dists-normal-quantile';
import { requireOpenUnitInterval } from '../atmosphere/input-guards.js';

/**
 * Standard normal quantile Φ⁻¹(p).
 *
 * @param probability p in (0, 1)
 * @returns Φ⁻¹(p), dimensionless (−3.0902 at 1e-3, −4.7534 at 1e-6)
 * @see Wichura M.J., "Algorithm AS 241: The percentage points of the normal distribution", Applied
 *   Statistics 37(3), 477–484 (1988) (as implemented by @stdlib).
 */
export function normalQuantileOf(probability: number): number {
  requireOpenUnitInterval('probability', probability);
  return normalQuantile(probability, 0, 1);
}
