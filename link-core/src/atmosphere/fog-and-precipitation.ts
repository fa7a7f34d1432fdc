/**
 * Fog attenuation with a fog type (Al Naboulsi), rain and snow attenuation, clear-air absorption.
 */
import { DB_PER_NATURAL_LOG_POWER } from '../units/constants.js';
import { requireNonNegative, requirePositive } from '../numeric/input-guards.js';
import { toContrast2PercentVisibilityM, type VisibilityDefinition } from './visibility-attenuation.js';

/** Fog type of the Al Naboulsi model. */
export type FogType = 'advection' | 'radiation';

/** Input of {@link alNaboulsiFogAttenuationDbPerKm}. */
export interface AlNaboulsiFogInput {
  /** `advection` (coastal, larger droplets) or `radiation` (convection, inland night fog). */
  fogType: FogType;
  /** Visibility [m], > 0; the model is stated for 50 m–1 km. */
  visibilityM: number;
  /** Vacuum wavelength [m], > 0; the model is stated for 0.69–1.55 µm. */
  wavelengthM: number;
  /** How the visibility is defined (default `contrast-2-percent`). */
  visibilityDefinition?: VisibilityDefinition;
}

/**
 * Al Naboulsi fog extinction (λ in µm, V in km):
 * advection β = (0.11478 λ + 3.8367)/V; radiation β = (0.18126 λ² + 0.13709 λ + 3.7502)/V.
 *
 * @param input fog type, visibility [m] > 0, wavelength [m] > 0
 * @returns β [1/km], > 0
 * @see Al Naboulsi M., Sizun H., de Fornel F., "Fog attenuation prediction for optical and infrared
 *   waves", Optical Engineering 43(2), 319–329 (2004), eq. for advection and convection fog.
 */
export function alNaboulsiFogExtinctionPerKm(input: AlNaboulsiFogInput): number {
  requirePositive('visibilityM', input.visibilityM);
  requirePositive('wavelengthM', input.wavelengthM);
  const visibilityKm = toContrast2PercentVisibilityM(input.visibilityM, input.visibilityDefinition) / 1000;
  const lambdaUm = input.wavelengthM * 1e6;
  const numerator = input.fogType === 'advection' ? 0.11478 * lambdaUm + 3.8367 : 0.18126 * lambdaUm * lambdaUm + 0.13709 * lambdaUm + 3.7502;
  return numerator / visibilityKm;
}

/**
 * Al Naboulsi fog attenuation in dB/km (4.3429 × {@link alNaboulsiFogExtinctionPerKm}).
 *
 * @param input fog type, visibility [m] > 0 (stated validity 50 m–1 km), wavelength [m] > 0 (0.69–1.55 µm)
 * @returns γ [dB/km], > 0, inversely proportional to visibility
 * @see Al Naboulsi, Sizun & de Fornel, Opt. Eng. 43(2), 319–329 (2004).
 */
export function alNaboulsiFogAttenuationDbPerKm(input: AlNaboulsiFogInput): number {
  return DB_PER_NATURAL_LOG_POWER * alNaboulsiFogExtinctionPerKm(input);
}

/** Rain attenuation curve: the default Carbonneau relation or the higher geometric-optics curve. */
export type RainModel = 'carbonneau' | 'geometric-upper';

/**
 * Rain attenuation, wavelength independent in the near infrared.
 * - `carbonneau` (default): γ = 1.076·R^0.67 dB/km.
 * - `geometric-upper`: γ = 1.58·R^0.63 dB/km, the geometric-optics extinction over a Marshall–Palmer
 *   drop spectrum; suits narrow-FOV receivers that collect no forward-scattered light.
 *
 * @param rainRateMmPerH rain rate R [mm/h], ≥ 0 (0 gives 0)
 * @param model curve (default `carbonneau`)
 * @returns γ [dB/km], ≥ 0
 * @see Carbonneau T.H., Wisely D.R., Proc. SPIE 3232 (1998) (1.076·R^0.67, as widely quoted; the
 *   original was not read); the 1.58·R^0.63 alternative is quoted in the FSO literature (origin uncertain).
 */
export function rainAttenuationDbPerKm(rainRateMmPerH: number, model: RainModel = 'carbonneau'): number {
  requireNonNegative('rainRateMmPerH', rainRateMmPerH);
  if (rainRateMmPerH === 0) return 0;
  return model === 'geometric-upper' ? 1.58 * Math.pow(rainRateMmPerH, 0.63) : 1.076 * Math.pow(rainRateMmPerH, 0.67);
}

/** Snow type of the snow attenuation relation. */
export type SnowType = 'wet' | 'dry';

/**
 * Snow attenuation (indicative): γ = a·S^b with λ in nm;
 * wet: a = 1.023e-4·λ + 3.7855466, b = 0.72; dry: a = 5.42e-5·λ + 5.4958776, b = 1.38.
 * The sources do not say clearly whether S is a liquid-equivalent rate: show the result as indicative.
 *
 * @param snowRateMmPerH snowfall rate S [mm/h], ≥ 0
 * @param wavelengthM vacuum wavelength [m], > 0
 * @param snowType `wet` or `dry`
 * @returns γ [dB/km], ≥ 0
 * @see ITU-R P.1817-1 (2012), "Propagation data required for the design of terrestrial free-space
 *   optical links" (coefficients as reported there and by Al Naboulsi et al. 2005) [from memory / secondary].
 */
export function snowAttenuationDbPerKm(snowRateMmPerH: number, wavelengthM: number, snowType: SnowType): number {
  requireNonNegative('snowRateMmPerH', snowRateMmPerH);
  requirePositive('wavelengthM', wavelengthM);
  if (snowRateMmPerH === 0) return 0;
  const lambdaNm = wavelengthM * 1e9;
  return snowType === 'wet'
    ? (1.023e-4 * lambdaNm + 3.7855466) * Math.pow(snowRateMmPerH, 0.72)
    : (5.42e-5 * lambdaNm + 5.4958776) * Math.pow(snowRateMmPerH, 1.38);
}

/**
 * Typical clear-air molecular (gaseous) absorption for the usual FSO wavelengths — a default, not a
 * prediction: 0.1 dB/km at 785–870 nm and 1500–1600 nm (transmission windows), 0.2 dB/km at
 * 1260–1360 nm (near water-vapour bands), 0.2 dB/km elsewhere.
 *
 * @param wavelengthM vacuum wavelength [m], > 0
 * @returns γ [dB/km], ≥ 0
 * @see common practice (clear-air absorption typically ≤ 0.1–0.2 dB/km in the windows).
 */
export function clearAirAbsorptionDbPerKm(wavelengthM: number): number {
  requirePositive('wavelengthM', wavelengthM);
  const nm = wavelengthM * 1e9;
  if ((nm >= 780 && nm <= 870) || (nm >= 1500 && nm <= 1600)) return 0.1;
  return 0.2;
}

/** Result of {@link atmosphericPathLoss}. */
export interface AtmosphericPathLoss {
  /** Specific attenuation γ [dB/km]. */
  specificAttenuationDbPerKm: number;
  /** Path loss γ·L_km [dB], ≥ 0. */
  pathLossDb: number;
  /** Power transmittance 10^(−loss/10), in (0, 1]. */
  transmittance: number;
}

/**
 * Path loss of a uniform path: loss = γ·L_km, transmittance = 10^(−loss/10).
 *
 * @param specificAttenuationDbPerKm γ [dB/km], ≥ 0
 * @param pathLengthM path length L [m], ≥ 0
 * @returns γ [dB/km], loss [dB] and transmittance in (0, 1]
 * @see Kim, McArthur & Korevaar (2001) (Beer–Lambert law with β from visibility).
 */
export function atmosphericPathLoss(specificAttenuationDbPerKm: number, pathLengthM: number): AtmosphericPathLoss {
  requireNonNegative('specificAttenuationDbPerKm', specificAttenuationDbPerKm);
  requireNonNegative('pathLengthM', pathLengthM);
  const pathLossDb = (specificAttenuationDbPerKm * pathLengthM) / 1000;
  return { specificAttenuationDbPerKm, pathLossDb, transmittance: Math.pow(10, -pathLossDb / 10) };
}
