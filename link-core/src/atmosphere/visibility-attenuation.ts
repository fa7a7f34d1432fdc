/**
 * Visibility-based aerosol (haze and fog) attenuation: the Koschmieder relation with the
 * Kim and Kruse wavelength exponents, the 2 % / 5 % visibility definitions and the inverse
 * (the visibility at which a given specific attenuation is reached).
 */
import { DB_PER_NATURAL_LOG_POWER } from '../units/constants.js';
import { requirePositive } from '../numeric/input-guards.js';

/** Empirical wavelength-exponent models of visibility attenuation. */
export type VisibilityModel = 'kim' | 'kruse';

/**
 * How the visibility figure was defined:
 * - `contrast-2-percent`: the classical visual range with a 2 % contrast threshold (Kim, Kruse).
 * - `mor-5-percent`: the WMO meteorological optical range (5 % threshold), as airport sensors and
 *   synoptic reports give it. It is converted to the 2 % visibility before the model is applied.
 */
export type VisibilityDefinition = 'contrast-2-percent' | 'mor-5-percent';

/**
 * Koschmieder constant used by Kim and Kruse, K = 3.91 (ln 50 = 3.912 rounded as printed in both
 * sources; the project's check values use 3.91 exactly).
 */
export const KOSCHMIEDER_CONSTANT_2_PERCENT = 3.91;

/** Reference wavelength of the visibility definition, 550 nm [m]. */
export const VISIBILITY_REFERENCE_WAVELENGTH_M = 550e-9;

/**
 * Ratio of the 2 % visual range to the 5 % meteorological optical range, ln(50)/ln(20) ≈ 1.3059.
 *
 * @see Koschmieder H., "Theorie der horizontalen Sichtweite", Beitr. Phys. freien Atmos. 12 (1924):
 *   V = ln(1/ε)/β; WMO-No. 8 (MOR uses ε = 5 %).
 */
export const VISIBILITY_2_PERCENT_PER_MOR = Math.log(50) / Math.log(20);

/**
 * Koschmieder extinction constant ln(1/ε) for a contrast threshold ε.
 *
 * @param contrastThreshold ε, dimensionless, in (0, 1) (0.02 classical, 0.05 WMO MOR)
 * @returns ln(1/ε), dimensionless (3.912 for 2 %, 2.996 for 5 %)
 * @see Koschmieder (1924), β = ln(1/ε)/V.
 */
export function koschmiederConstant(contrastThreshold: number): number {
  if (!(contrastThreshold > 0 && contrastThreshold < 1)) throw new RangeError(`contrastThreshold: must lie strictly between 0 and 1 (got ${contrastThreshold})`);
  return -Math.log(contrastThreshold);
}

/**
 * Converts a visibility figure to the 2 % contrast visibility the Kim/Kruse formulas expect.
 *
 * @param visibilityM visibility [m], > 0
 * @param definition how `visibilityM` is defined (default `contrast-2-percent`: returned unchanged)
 * @returns the 2 % visibility [m]: V2 = (ln 50/ln 20)·MOR = 1.30587·MOR for `mor-5-percent`
 * @see Koschmieder (1924); WMO-No. 8 (MOR, 5 %). Converting first and using V2 in both K/V and q(V)
 *   is the consistent choice (METHODS.md §5.1, derived).
 */
export function toContrast2PercentVisibilityM(visibilityM: number, definition: VisibilityDefinition = 'contrast-2-percent'): number {
  return definition === 'mor-5-percent' ? visibilityM * VISIBILITY_2_PERCENT_PER_MOR : visibilityM;
}

/**
 * Kim's size-distribution exponent q(V).
 *
 * q = 1.6 (V > 50 km), 1.3 (6 < V ≤ 50), 0.16·V + 0.34 (1 < V ≤ 6), V − 0.5 (0.5 < V ≤ 1), 0 (V ≤ 0.5 km).
 * The paper gives open ranges; the lower branch includes its upper bound here.
 *
 * @param visibilityKm 2 % visibility [km], > 0
 * @returns q, dimensionless, in [0, 1.6]
 * @see Kim I.I., McArthur B., Korevaar E., "Comparison of laser beam propagation at 785 nm and
 *   1550 nm in fog and haze for optical wireless communications", Proc. SPIE 4214, 26–37 (2001), eq. 3.
 */
export function kimExponent(visibilityKm: number): number {
  if (visibilityKm > 50) return 1.6;
  if (visibilityKm > 6) return 1.3;
  if (visibilityKm > 1) return 0.16 * visibilityKm + 0.34;
  if (visibilityKm > 0.5) return visibilityKm - 0.5;
  return 0;
}

/**
 * Kruse's size-distribution exponent q(V): 1.6 (V > 50 km), 1.3 (6 < V ≤ 50), 0.585·V^(1/3) (V ≤ 6 km).
 *
 * @param visibilityKm 2 % visibility [km], > 0
 * @returns q, dimensionless
 * @see Kruse P.W., McGlauchlin L.D., McQuistan R.B., "Elements of Infrared Technology: Generation,
 *   Transmission and Detection", Wiley (1962), ch. 5 (the q(V) rule).
 */
export function kruseExponent(visibilityKm: number): number {
  if (visibilityKm > 50) return 1.6;
  if (visibilityKm > 6) return 1.3;
  return 0.585 * Math.cbrt(visibilityKm);
}

/**
 * The wavelength exponent of a model at a 2 % visibility.
 *
 * @param model `kim` or `kruse`
 * @param visibilityKm 2 % visibility [km], > 0
 * @returns q, dimensionless
 * @see Kim, McArthur & Korevaar (2001); Kruse, McGlauchlin & McQuistan (1962).
 */
export function visibilityExponent(model: VisibilityModel, visibilityKm: number): number {
  return model === 'kruse' ? kruseExponent(visibilityKm) : kimExponent(visibilityKm);
}

/** Input of {@link visibilityExtinctionPerKm} and {@link visibilityAttenuationDbPerKm}. */
export interface VisibilityAttenuationInput {
  /** `kim` (default choice of the project) or `kruse`. */
  model: VisibilityModel;
  /** Visibility [m], > 0 (see `visibilityDefinition`). */
  visibilityM: number;
  /** Vacuum wavelength [m], > 0 (the models are meant for about 0.55–1.7 µm). */
  wavelengthM: number;
  /** How the visibility is defined (default `contrast-2-percent`). MOR is converted to the 2 % visibility first. */
  visibilityDefinition?: VisibilityDefinition;
  /** Koschmieder constant K (default 3.91, as printed by Kim and Kruse). */
  koschmiederConstant?: number;
}

/**
 * Power extinction coefficient of haze/fog from visibility: β = (K/V)·(λ/550 nm)^(−q(V)).
 *
 * @param input model, visibility [m] > 0, wavelength [m] > 0, optional visibility definition and K
 * @returns β [1/km] (a power coefficient, not nepers), > 0
 * @see Kim, McArthur & Korevaar, Proc. SPIE 4214 (2001), eq. 2–3; Kruse et al. (1962).
 */
export function visibilityExtinctionPerKm(input: VisibilityAttenuationInput): number {
  requirePositive('visibilityM', input.visibilityM);
  requirePositive('wavelengthM', input.wavelengthM);
  const k = input.koschmiederConstant ?? KOSCHMIEDER_CONSTANT_2_PERCENT;
  requirePositive('koschmiederConstant', k);
  const visibilityKm = toContrast2PercentVisibilityM(input.visibilityM, input.visibilityDefinition) / 1000;
  return visibilityExtinctionPerKmFast(input.model === 'kruse', visibilityKm, input.wavelengthM, k);
}

/**
 * Allocation-free, unvalidated form of {@link visibilityExtinctionPerKm} for hot loops
 * (link budget, availability over many records).
 *
 * @param kruse true for Kruse's exponent, false for Kim's
 * @param visibilityKm 2 % visibility [km], > 0
 * @param wavelengthM vacuum wavelength [m], > 0
 * @param koschmiederConstantValue K (3.91 in the sources)
 * @returns β [1/km]
 * @see Kim, McArthur & Korevaar, Proc. SPIE 4214 (2001), eq. 2–3; Kruse et al. (1962).
 */
export function visibilityExtinctionPerKmFast(kruse: boolean, visibilityKm: number, wavelengthM: number, koschmiederConstantValue = KOSCHMIEDER_CONSTANT_2_PERCENT): number {
  return visibilityExtinctionPerKmOfLogWavelength(kruse, visibilityKm, Math.log(wavelengthM / VISIBILITY_REFERENCE_WAVELENGTH_M), koschmiederConstantValue);
}

/**
 * {@link visibilityExtinctionPerKmFast} with ln(λ/550 nm) at hand: (λ/550 nm)^(−q) is written as
 * exp(−q·ln(λ/550 nm)), a few times cheaper than Math.pow, and the budget takes the logarithm once
 * per design.
 *
 * @param kruse true for Kruse's exponent, false for Kim's
 * @param visibilityKm 2 % visibility [km], > 0
 * @param logWavelengthRatio ln(λ/550 nm), λ the vacuum wavelength
 * @param koschmiederConstantValue K (3.91 in the sources)
 * @returns β [1/km]
 * @see Kim, McArthur & Korevaar, Proc. SPIE 4214 (2001), eq. 2–3; Kruse et al. (1962).
 */
export function visibilityExtinctionPerKmOfLogWavelength(kruse: boolean, visibilityKm: number, logWavelengthRatio: number, koschmiederConstantValue = KOSCHMIEDER_CONSTANT_2_PERCENT): number {
  const q = kruse ? kruseExponent(visibilityKm) : kimExponent(visibilityKm);
  const base = koschmiederConstantValue / visibilityKm;
  return q === 0 ? base : base * Math.exp(-q * logWavelengthRatio);
}

/**
 * Specific attenuation of haze/fog from visibility: γ = 10/ln10 · β = 4.3429·(K/V)·(λ/550 nm)^(−q(V)).
 *
 * @param input `{ model: 'kim' | 'kruse', visibilityM, wavelengthM, visibilityDefinition?, koschmiederConstant? }`;
 *   visibility [m] > 0, wavelength [m] > 0
 * @returns γ [dB/km], > 0; non-increasing in visibility for λ ≥ 550 nm
 * @see Kim, McArthur & Korevaar, Proc. SPIE 4214, 26–37 (2001), eq. 2–3 (default model);
 *   Kruse, McGlauchlin & McQuistan (1962) (comparison; not supported in fog by Pierce et al., Proc. SPIE 4530, 2001).
 */
export function visibilityAttenuationDbPerKm(input: VisibilityAttenuationInput): number {
  return DB_PER_NATURAL_LOG_POWER * visibilityExtinctionPerKm(input);
}

/** Input of {@link visibilityForAttenuationM}. */
export interface VisibilityForAttenuationInput {
  /** `kim` or `kruse`. */
  model: VisibilityModel;
  /** Vacuum wavelength [m], ≥ 550 nm (where γ falls monotonically with V). */
  wavelengthM: number;
  /** The specific attenuation to reach [dB/km], > 0. */
  attenuationDbPerKm: number;
  /** Definition of the returned visibility (default `contrast-2-percent`; `mor-5-percent` returns MOR). */
  visibilityDefinition?: VisibilityDefinition;
  /** Koschmieder constant K (default 3.91). */
  koschmiederConstant?: number;
}

/** Visibility search interval of the inverse [m]: 1 m to 1000 km. */
const INVERSE_VISIBILITY_MIN_M = 1;
const INVERSE_VISIBILITY_MAX_M = 1e6;

/**
 * Inverse of {@link visibilityAttenuationDbPerKm}: the visibility V_min at which the specific
 * attenuation equals the given value. Bisection on log V (γ is non-increasing in V for λ ≥ 550 nm).
 * Where the target falls into the drop of q at V = 50 km (or 6 km for Kruse) the boundary is returned.
 *
 * @param input model, wavelength [m] ≥ 550 nm, attenuation [dB/km] > 0, optional definition and K
 * @returns V_min [m], clamped to [1 m, 1000 km] (1 m when even 1 m visibility attenuates less, 1000 km when
 *   even 1000 km attenuates more)
 * @see Kim I.I., Korevaar E., "Availability of free space optics (FSO) and hybrid FSO/RF systems",
 *   Proc. SPIE 4530, 84–95 (2001) (availability from V_min); bisection is common practice.
 */
export function visibilityForAttenuationM(input: VisibilityForAttenuationInput): number {
  requirePositive('attenuationDbPerKm', input.attenuationDbPerKm);
  requirePositive('wavelengthM', input.wavelengthM);
  if (input.wavelengthM < VISIBILITY_REFERENCE_WAVELENGTH_M) {
    throw new RangeError(`wavelengthM: must be at least 550 nm for the inverse (got ${input.wavelengthM})`);
  }
  const k = input.koschmiederConstant ?? KOSCHMIEDER_CONSTANT_2_PERCENT;
  requirePositive('koschmiederConstant', k);
  const v2 = visibility2PercentForAttenuationKm(input.model === 'kruse', input.wavelengthM, input.attenuationDbPerKm, k) * 1000;
  return input.visibilityDefinition === 'mor-5-percent' ? v2 / VISIBILITY_2_PERCENT_PER_MOR : v2;
}

/**
 * Allocation-free, unvalidated core of {@link visibilityForAttenuationM}: the 2 % visibility [km] at
 * which the specific attenuation equals `attenuationDbPerKm`, by 60 bisections on log10 V.
 *
 * @param kruse true for Kruse's exponent
 * @param wavelengthM vacuum wavelength [m], ≥ 550 nm
 * @param attenuationDbPerKm target γ [dB/km], > 0
 * @param koschmiederConstantValue K (3.91)
 * @returns V [km] in [0.001, 1000]
 * @see Kim & Korevaar, Proc. SPIE 4530 (2001) (V_min for availability); bisection is common practice.
 */
export function visibility2PercentForAttenuationKm(kruse: boolean, wavelengthM: number, attenuationDbPerKm: number, koschmiederConstantValue = KOSCHMIEDER_CONSTANT_2_PERCENT): number {
  let lo = Math.log10(INVERSE_VISIBILITY_MIN_M / 1000);
  let hi = Math.log10(INVERSE_VISIBILITY_MAX_M / 1000);
  const logWavelengthRatio = Math.log(wavelengthM / VISIBILITY_REFERENCE_WAVELENGTH_M);
  const gamma = (logV: number) => DB_PER_NATURAL_LOG_POWER * visibilityExtinctionPerKmOfLogWavelength(kruse, Math.pow(10, logV), logWavelengthRatio, koschmiederConstantValue);
  if (gamma(lo) <= attenuationDbPerKm) return Math.pow(10, lo);
  if (gamma(hi) >= attenuationDbPerKm) return Math.pow(10, hi);
  // 60 halvings of a 6-decade interval give ~5e-18 decades: below double precision of V.
  for (let i = 0; i < 60; i++) {
    const mid = 0.5 * (lo + hi);
    if (gamma(mid) > attenuationDbPerKm) lo = mid;
    else hi = mid;
  }
  return Math.pow(10, 0.5 * (lo + hi));
}
