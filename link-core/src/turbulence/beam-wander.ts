/**
 * Beam wander and long-term (time-averaged) spreading of a beam in turbulence.
 */
import { requireNonNegative, requirePositive } from '../numeric/input-guards.js';

/** Beam wander statistics of a collimated beam. */
export interface BeamWander {
  /** ⟨r_c²⟩ = 2.42·Cn²·L³·W0^(−1/3) [m²]. */
  wanderVarianceM2: number;
  /** sqrt(⟨r_c²⟩) [m]. */
  wanderRmsRadialM: number;
  /** Per-axis standard deviation sqrt(⟨r_c²⟩/2) [m] (adds to pointing jitter). */
  wanderSigmaPerAxisM: number;
  /** Angular rms sqrt(⟨r_c²⟩)/L [rad]. */
  wanderRmsAngleRad: number;
}

/**
 * Beam wander of a collimated beam (infinite outer scale): ⟨r_c²⟩ = 2.42·Cn²·L³·W0^(−1/3).
 * Negligible for mrad FSO beams; it matters for narrow tracked beams.
 *
 * @param cn2 Cn² [m^(−2/3)], ≥ 0
 * @param distanceM path length L [m], > 0
 * @param apertureBeamRadiusM W0 (1/e²) [m], > 0
 * @returns variance [m²], rms radial [m], per-axis σ [m], rms angle [rad]
 * @see Andrews & Phillips (2005), ch. 6 (beam wander, collimated beam) [from memory].
 */
export function collimatedBeamWander(cn2: number, distanceM: number, apertureBeamRadiusM: number): BeamWander {
  requireNonNegative('cn2', cn2);
  requirePositive('distanceM', distanceM);
  requirePositive('apertureBeamRadiusM', apertureBeamRadiusM);
  const wanderVarianceM2 = 2.42 * cn2 * distanceM ** 3 * Math.pow(apertureBeamRadiusM, -1 / 3);
  const wanderRmsRadialM = Math.sqrt(wanderVarianceM2);
  return { wanderVarianceM2, wanderRmsRadialM, wanderSigmaPerAxisM: Math.sqrt(wanderVarianceM2 / 2), wanderRmsAngleRad: wanderRmsRadialM / distanceM };
}

/** Long-term beam radius in weak and moderate-to-strong turbulence. */
export interface LongTermBeamRadius {
  /** W·sqrt(1 + 1.33·σ_R²·Λ^(5/6)) [m] (weak turbulence). */
  weakM: number;
  /** W·sqrt(1 + 1.63·σ_R^(12/5)·Λ) [m] (moderate to strong turbulence). */
  strongM: number;
}

/**
 * Long-term (time-averaged) 1/e² beam radius; both forms give W_LT ≈ W for divergent FSO beams (Λ ≈ 0).
 * The long-term beam already contains the wander: counted as jitter instead (⟨r_c²⟩/2 per axis), the
 * short-term radius would be sqrt(W_LT² − 2⟨r_c²⟩) (METHODS.md §6.10).
 *
 * @param beamRadiusM free-space radius W at the receiver [m], > 0
 * @param lambda output-plane Fresnel ratio Λ ≥ 0
 * @param rytovPlaneVariance σ_R² ≥ 0
 * @returns weak and strong forms [m], ≥ W
 * @see Andrews & Phillips (2005), ch. 6–7 (coefficients 1.33 and 1.63 from memory; verify).
 */
export function longTermBeamRadius(beamRadiusM: number, lambda: number, rytovPlaneVariance: number): LongTermBeamRadius {
  requirePositive('beamRadiusM', beamRadiusM);
  requireNonNegative('lambda', lambda);
  requireNonNegative('rytovPlaneVariance', rytovPlaneVariance);
  return {
    weakM: beamRadiusM * Math.sqrt(1 + 1.33 * rytovPlaneVariance * Math.pow(lambda, 5 / 6)),
    strongM: beamRadiusM * Math.sqrt(1 + 1.63 * Math.pow(rytovPlaneVariance, 1.2) * lambda),
  };
}
