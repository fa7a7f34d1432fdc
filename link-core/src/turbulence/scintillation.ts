/**
 * Scintillation index in all regimes, aperture averaging, and the gamma-gamma parameters α, β
 * (point receiver and aperture-averaged), for plane and spherical waves with constant Cn².
 */
import { requireNonNegative } from '../numeric/input-guards.js';
import { integrate } from '../numeric/quadrature.js';
import { kolmogorovKernelReal } from '../numeric/complex-math.js';
import type { WaveModel } from './rytov.js';
import { rytovVarianceFast } from './rytov.js';
import { fadeMarginGammaGammaDb } from './fade-statistics.js';

/** Large- and small-scale log-irradiance variances and the gamma-gamma law they imply. */
export interface GammaGammaParameters {
  /** Large-scale log-irradiance variance σ_lnX² (dimensionless). */
  largeScaleLogVariance: number;
  /** Small-scale log-irradiance variance σ_lnY² (dimensionless). */
  smallScaleLogVariance: number;
  /** α = 1/(exp(σ_lnX²) − 1), effective number of large-scale cells. */
  alpha: number;
  /** β = 1/(exp(σ_lnY²) − 1), effective number of small-scale cells. */
  beta: number;
  /** σ_I² = exp(σ_lnX² + σ_lnY²) − 1 = 1/α + 1/β + 1/(αβ). */
  scintillationIndex: number;
}

/**
 * Allocation-free core, large scale: σ_lnX² for a Rytov variance, its power σ^(12/5) (passed in so
 * that the pair shares one Math.pow) and the normalised aperture d².
 * plane:     σ_lnX² = 0.49σ_R²/(1 + 0.65d² + 1.11σ_R^(12/5))^(7/6)
 * spherical: 0.18d² and 0.56 instead of 0.65d² and 1.11 (β0² instead of σ_R²).
 */
function largeScaleLogVarianceFast(rytov: number, rytovPower125: number, apertureD2: number, spherical: boolean): number {
  const largeDenominator = 1 + (spherical ? 0.18 : 0.65) * apertureD2 + (spherical ? 0.56 : 1.11) * rytovPower125;
  return (0.49 * rytov) / Math.pow(largeDenominator, 7 / 6);
}

/**
 * Allocation-free core, small scale (the same for both waves):
 * σ_lnY² = 0.51σ²(1 + 0.69σ^(12/5))^(−5/6)/(1 + 0.90d² + 0.62d²σ^(12/5)).
 */
function smallScaleLogVarianceFast(rytov: number, rytovPower125: number, apertureD2: number): number {
  return (0.51 * rytov * Math.pow(1 + 0.69 * rytovPower125, -5 / 6)) / (1 + 0.9 * apertureD2 + 0.62 * apertureD2 * rytovPower125);
}

/**
 * Normalised receive aperture d² = k·D²/(4L).
 *
 * @param wavelengthM vacuum wavelength [m], > 0
 * @param distanceM path length L [m], > 0
 * @param apertureDiameterM receive aperture diameter D [m], ≥ 0
 * @returns d², dimensionless, ≥ 0
 * @see Andrews & Phillips (2005), ch. 10 [from memory].
 */
export function normalisedApertureSquared(wavelengthM: number, distanceM: number, apertureDiameterM: number): number {
  return ((2 * Math.PI) / wavelengthM) * (apertureDiameterM * apertureDiameterM) / (4 * distanceM);
}

/** Input of {@link gammaGammaParameters}. */
export interface GammaGammaParametersInput {
  /** Rytov variance of the chosen wave model: σ_R² (plane) or β0² (spherical), ≥ 0. */
  rytovVariance: number;
  /** Wave model the variance belongs to. */
  wave: WaveModel;
  /** Normalised aperture d² = kD²/(4L) ≥ 0; omit or 0 for a point receiver. */
  apertureD2?: number;
}

/**
 * Gamma-gamma parameters from the all-regime large- and small-scale log variances (zero inner scale).
 * With apertureD2 = 0 (default) this is the point receiver of `gammaGammaParameters({ rytovVariance, wave })`.
 *
 * @param input `{ rytovVariance ≥ 0, wave: 'plane' | 'spherical', apertureD2? ≥ 0 }`
 * @returns `{ alpha, beta, scintillationIndex, largeScaleLogVariance, smallScaleLogVariance }`; α, β > 0
 *   (Infinity when the Rytov variance is 0)
 * @see Andrews & Phillips (2005), ch. 9 (point receiver) and ch. 10 (aperture averaged);
 *   Al-Habash, Andrews & Phillips, Opt. Eng. 40(8), 1554–1562 (2001) (α, β from the log variances).
 */
export function gammaGammaParameters(input: GammaGammaParametersInput): GammaGammaParameters {
  requireNonNegative('rytovVariance', input.rytovVariance);
  const apertureD2 = input.apertureD2 ?? 0;
  requireNonNegative('apertureD2', apertureD2);
  if (input.wave !== 'plane' && input.wave !== 'spherical') throw new RangeError(`wave: must be 'plane' or 'spherical' (got ${String(input.wave)})`);
  const power = Math.pow(input.rytovVariance, 1.2);
  const largeScaleLogVariance = largeScaleLogVarianceFast(input.rytovVariance, power, apertureD2, input.wave === 'spherical');
  const smallScaleLogVariance = smallScaleLogVarianceFast(input.rytovVariance, power, apertureD2);
  return {
    largeScaleLogVariance,
    smallScaleLogVariance,
    alpha: 1 / Math.expm1(largeScaleLogVariance),
    beta: 1 / Math.expm1(smallScaleLogVariance),
    scintillationIndex: Math.expm1(largeScaleLogVariance + smallScaleLogVariance),
  };
}

/**
 * Scintillation index of a point receiver in all regimes:
 * plane σ_I² = exp[0.49σ_R²/(1+1.11σ_R^(12/5))^(7/6) + 0.51σ_R²/(1+0.69σ_R^(12/5))^(5/6)] − 1;
 * spherical: 0.56 instead of 1.11 with β0².
 *
 * @param rytov Rytov variance σ_R² or β0² (dimensionless), ≥ 0
 * @param wave wave model of the variance
 * @returns σ_I², dimensionless, ≥ 0 (≈ rytov when weak; peaks ≈ 1.2 plane / 1.7 spherical; → 1 in saturation)
 * @see Andrews & Phillips (2005), ch. 9 [from memory].
 */
export function scintillationIndexAllRegimes(rytov: number, wave: WaveModel): number {
  requireNonNegative('rytovVariance', rytov);
  const power = Math.pow(rytov, 1.2);
  return Math.expm1(largeScaleLogVarianceFast(rytov, power, 0, wave === 'spherical') + smallScaleLogVarianceFast(rytov, power, 0));
}

/**
 * Aperture-averaged scintillation index σ_I²(D) = exp(σ_lnX² + σ_lnY²) − 1 (all regimes).
 *
 * @param rytov σ_R² or β0², ≥ 0
 * @param wave wave model
 * @param apertureD2 d² = kD²/(4L), ≥ 0
 * @returns σ_I²(D), dimensionless, ≥ 0
 * @see Andrews & Phillips (2005), ch. 10 [from memory].
 */
export function apertureAveragedScintillationIndex(rytov: number, wave: WaveModel, apertureD2: number): number {
  requireNonNegative('rytovVariance', rytov);
  requireNonNegative('apertureD2', apertureD2);
  const power = Math.pow(rytov, 1.2);
  return Math.expm1(largeScaleLogVarianceFast(rytov, power, apertureD2, wave === 'spherical') + smallScaleLogVarianceFast(rytov, power, apertureD2));
}

/** Closed-form weak-turbulence aperture-averaging factors A = σ_I²(D)/σ_I²(0). */
export interface WeakApertureAveraging {
  /** Andrews' plane-wave fit [1 + 1.062 d²]^(−7/6). */
  planeAndrews: number;
  /** Spherical-wave fit [1 + 0.33 d²]^(−7/6) (conservative: higher than the integral). */
  sphericalAndrews: number;
  /** Churnside's plane-wave form [1 + 1.07 (d²)^(7/6)]^(−1). */
  planeChurnside: number;
}

/**
 * Weak-turbulence aperture-averaging factors from closed-form fits.
 *
 * @param apertureD2 d² = kD²/(4L), ≥ 0
 * @returns A factors in (0, 1]
 * @see Andrews L.C., "Aperture-averaging factor for optical scintillations of plane and spherical
 *   waves in the atmosphere", JOSA A 9(4), 597–600 (1992) (spherical 0.33 constant from memory);
 *   Churnside J.H., "Aperture averaging of optical scintillations in the turbulent atmosphere",
 *   Applied Optics 30(15), 1982–1994 (1991) (form from memory).
 */
export function weakApertureAveraging(apertureD2: number): WeakApertureAveraging {
  requireNonNegative('apertureD2', apertureD2);
  return {
    planeAndrews: Math.pow(1 + 1.062 * apertureD2, -7 / 6),
    sphericalAndrews: Math.pow(1 + 0.33 * apertureD2, -7 / 6),
    planeChurnside: 1 / (1 + 1.07 * Math.pow(apertureD2, 7 / 6)),
  };
}

/**
 * Weak-turbulence aperture-averaging factor by numerical integration of the Rytov integral with a
 * Gaussian aperture filter exp(−D²κ²/16) and the Kolmogorov spectrum:
 * A = ∫0^1 K(a(ξ), b(ξ)) dξ / ∫0^1 K(a0(ξ), b(ξ)) dξ with K(a, b) = Re{Γ(−5/6)[a^(5/6) − (a − i b)^(5/6)]},
 * plane: a = d²/4, b = ξ; spherical: a = d²ξ²/4, b = ξ(1 − ξ).
 *
 * @param apertureD2 d² ≥ 0
 * @param wave wave model
 * @returns A in (0, 1]
 * @see Andrews & Phillips (2005), ch. 10 (weak-fluctuation aperture averaging, Gaussian aperture
 *   filter) [derived and checked numerically in the project's reference cases TU-06b].
 */
export function weakApertureAveragingNumerical(apertureD2: number, wave: WaveModel): number {
  requireNonNegative('apertureD2', apertureD2);
  const spherical = wave === 'spherical';
  const integrand = (d2: number) => (xi: number) =>
    spherical ? kolmogorovKernelReal((d2 * xi * xi) / 4, xi * (1 - xi)) : kolmogorovKernelReal(d2 / 4, xi);
  const options = { relativeTolerance: 1e-11, absoluteTolerance: 1e-15 };
  return integrate(integrand(apertureD2), 0, 1, options) / integrate(integrand(0), 0, 1, options);
}

/**
 * Allocation-free hot-path chain for the link budget: spherical-wave Rytov variance → aperture
 * averaging (d² = kD²/(4L)) → gamma-gamma α, β → fade margin at probability p.
 * Returns 0 when Cn² = 0.
 *
 * @param wavelengthM vacuum wavelength [m], > 0
 * @param distanceM path length [m], > 0
 * @param cn2 Cn² [m^(−2/3)], ≥ 0
 * @param apertureDiameterM receive aperture diameter [m], ≥ 0
 * @param probability fade probability p in (0, 1)
 * @returns fade margin [dB] below the mean irradiance
 * @see METHODS.md §10.1 (F_scint of §6.9, spherical wave, aperture averaged); Andrews & Phillips
 *   (2005), ch. 10; Al-Habash, Andrews & Phillips (2001).
 */
export function apertureAveragedFadeMarginDb(wavelengthM: number, distanceM: number, cn2: number, apertureDiameterM: number, probability: number): number {
  if (cn2 === 0) return 0;
  const rytov = rytovVarianceFast(cn2, wavelengthM, distanceM, true);
  const apertureD2 = normalisedApertureSquared(wavelengthM, distanceM, apertureDiameterM);
  const power = Math.pow(rytov, 1.2);
  return fadeMarginGammaGammaDb(1 / Math.expm1(largeScaleLogVarianceFast(rytov, power, apertureD2, true)), 1 / Math.expm1(smallScaleLogVarianceFast(rytov, power, apertureD2)), probability);
}

/**
 * Allocation-free aperture-averaged scintillation index for the budget's report (same chain as
 * {@link apertureAveragedFadeMarginDb}, spherical wave).
 *
 * @param wavelengthM vacuum wavelength [m], > 0
 * @param distanceM path length [m], > 0
 * @param cn2 Cn² [m^(−2/3)], ≥ 0
 * @param apertureDiameterM receive aperture diameter [m], ≥ 0
 * @returns σ_I²(D), dimensionless
 * @see Andrews & Phillips (2005), ch. 10.
 */
export function apertureAveragedScintillationIndexFast(wavelengthM: number, distanceM: number, cn2: number, apertureDiameterM: number): number {
  if (cn2 === 0) return 0;
  const rytov = rytovVarianceFast(cn2, wavelengthM, distanceM, true);
  const apertureD2 = normalisedApertureSquared(wavelengthM, distanceM, apertureDiameterM);
  const power = Math.pow(rytov, 1.2);
  return Math.expm1(largeScaleLogVarianceFast(rytov, power, apertureD2, true) + smallScaleLogVarianceFast(rytov, power, apertureD2));
}
