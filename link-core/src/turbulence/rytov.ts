/**
 * Rytov variances, coherence radius, Fried parameter and turbulence regimes for a horizontal path
 * with constant Cn² (Kolmogorov spectrum, zero inner scale, infinite outer scale).
 */
import { requirePositive } from '../numeric/input-guards.js';

/** Wave model of the turbulence formulas: plane wave or spherical wave (point source). */
export type WaveModel = 'plane' | 'spherical';

/**
 * Optical wavenumber k = 2π/λ.
 *
 * @param wavelengthM vacuum wavelength [m], > 0
 * @returns k [rad/m]
 * @see common practice (definition of the wavenumber).
 */
export function wavenumberRadPerM(wavelengthM: number): number {
  return (2 * Math.PI) / wavelengthM;
}

/** Input of {@link rytovVariance}. */
export interface RytovVarianceInput {
  /** Refractive-index structure parameter Cn² [m^(−2/3)], ≥ 0 (typical 1e-17–1e-12). */
  cn2: number;
  /** Vacuum wavelength [m], > 0. */
  wavelengthM: number;
  /** Path length L [m], > 0. */
  distanceM: number;
  /** `plane` (σ_R², coefficient 1.23) or `spherical` (β0², coefficient 0.50). */
  wave: WaveModel;
}

/**
 * Rytov variance: σ_R² = 1.23·Cn²·k^(7/6)·L^(11/6) (plane wave) or β0² = 0.50·Cn²·k^(7/6)·L^(11/6)
 * (spherical wave). Equals the weak-fluctuation scintillation index of a point receiver.
 *
 * @param input `{ cn2 [m^(−2/3)] ≥ 0, wavelengthM [m] > 0, distanceM [m] > 0, wave }`
 * @returns the Rytov variance, dimensionless, ≥ 0 (weak < 1, moderate ≈ 1, strong > 1)
 * @see Andrews L.C., Phillips R.L., "Laser Beam Propagation through Random Media", 2nd ed., SPIE Press
 *   (2005), ch. 8, plane- and spherical-wave Rytov variances [equation numbers from memory].
 */
export function rytovVariance(input: RytovVarianceInput): number {
  if (!(input.cn2 >= 0) || !Number.isFinite(input.cn2)) throw new RangeError(`cn2: must be a finite number ≥ 0 (got ${String(input.cn2)})`);
  requirePositive('wavelengthM', input.wavelengthM);
  requirePositive('distanceM', input.distanceM);
  if (input.wave !== 'plane' && input.wave !== 'spherical') throw new RangeError(`wave: must be 'plane' or 'spherical' (got ${String(input.wave)})`);
  return rytovVarianceFast(input.cn2, input.wavelengthM, input.distanceM, input.wave === 'spherical');
}

/**
 * Allocation-free, unvalidated form of {@link rytovVariance} for the link budget's hot path.
 *
 * @param cn2 Cn² [m^(−2/3)], ≥ 0
 * @param wavelengthM vacuum wavelength [m], > 0
 * @param distanceM path length [m], > 0
 * @param spherical true for β0² (0.50), false for σ_R² (1.23)
 * @returns Rytov variance, dimensionless
 * @see Andrews & Phillips (2005), ch. 8 [from memory].
 */
export function rytovVarianceFast(cn2: number, wavelengthM: number, distanceM: number, spherical: boolean): number {
  const k = (2 * Math.PI) / wavelengthM;
  return (spherical ? 0.5 : 1.23) * cn2 * Math.pow(k, 7 / 6) * Math.pow(distanceM, 11 / 6);
}

/**
 * First Fresnel-zone size sqrt(L/k), the scale that separates small- and large-aperture receivers.
 *
 * @param wavelengthM vacuum wavelength [m], > 0
 * @param distanceM path length [m], > 0
 * @returns sqrt(L/k) [m]
 * @see Andrews & Phillips (2005), ch. 8.
 */
export function fresnelZoneM(wavelengthM: number, distanceM: number): number {
  requirePositive('wavelengthM', wavelengthM);
  requirePositive('distanceM', distanceM);
  return Math.sqrt(distanceM / wavenumberRadPerM(wavelengthM));
}

/** Input of {@link coherenceRadiusM} and {@link friedParameterM}. */
export interface CoherenceInput {
  /** Cn² [m^(−2/3)], > 0. */
  cn2: number;
  /** Vacuum wavelength [m], > 0. */
  wavelengthM: number;
  /** Path length [m], > 0. */
  distanceM: number;
  /** Wave model. */
  wave: WaveModel;
}

/**
 * Spatial coherence radius ρ0 = (1.46·Cn²·k²·L)^(−3/5) (plane) or (0.545·Cn²·k²·L)^(−3/5) (spherical).
 * Compare it with the receive aperture; the turbulence blur angle is about λ/ρ0.
 *
 * @param input Cn² [m^(−2/3)] > 0, wavelength [m] > 0, distance [m] > 0, wave model
 * @returns ρ0 [m], > 0
 * @see Andrews & Phillips (2005), ch. 6 (coherence radius, Kolmogorov spectrum) [from memory].
 */
export function coherenceRadiusM(input: CoherenceInput): number {
  requirePositive('cn2', input.cn2);
  requirePositive('wavelengthM', input.wavelengthM);
  requirePositive('distanceM', input.distanceM);
  const k = wavenumberRadPerM(input.wavelengthM);
  const coefficient = input.wave === 'spherical' ? 0.545 : 1.46;
  return Math.pow(coefficient * input.cn2 * k * k * input.distanceM, -3 / 5);
}

/**
 * Fried parameter r0 = (0.423·Cn²·k²·L)^(−3/5) (plane wave) or (0.423·(3/8)·Cn²·k²·L)^(−3/5)
 * (spherical wave), about 2.1·ρ0.
 *
 * @param input Cn² [m^(−2/3)] > 0, wavelength [m] > 0, distance [m] > 0, wave model
 * @returns r0 [m], > 0
 * @see Fried D.L., "Optical resolution through a randomly inhomogeneous medium for very long and
 *   very short exposures", JOSA 56(10), 1372–1379 (1966); Andrews & Phillips (2005), ch. 6 [from memory].
 */
export function friedParameterM(input: CoherenceInput): number {
  requirePositive('cn2', input.cn2);
  requirePositive('wavelengthM', input.wavelengthM);
  requirePositive('distanceM', input.distanceM);
  const k = wavenumberRadPerM(input.wavelengthM);
  const coefficient = input.wave === 'spherical' ? (0.423 * 3) / 8 : 0.423;
  return Math.pow(coefficient * input.cn2 * k * k * input.distanceM, -3 / 5);
}

/** Turbulence regime label. */
export type TurbulenceRegime = 'weak' | 'moderate' | 'strong' | 'saturated';

/**
 * Regime label of a plane-wave Rytov variance σ_R², for captions. Boundaries used here:
 * weak below 0.5, moderate below 5, strong below 25, saturated from 25 on.
 *
 * @param rytovPlaneVariance σ_R², dimensionless, ≥ 0
 * @returns the regime label
 * @see common practice (Andrews & Phillips 2005, ch. 9, use σ_R² < 1 for weak and ≫ 1 for strong).
 */
export function turbulenceRegime(rytovPlaneVariance: number): TurbulenceRegime {
  if (rytovPlaneVariance < 0.5) return 'weak';
  if (rytovPlaneVariance < 5) return 'moderate';
  if (rytovPlaneVariance < 25) return 'strong';
  return 'saturated';
}
