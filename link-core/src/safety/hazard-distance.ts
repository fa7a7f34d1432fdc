/**
 * Nominal ocular hazard distance (NOHD) of a Gaussian FSO beam: the exact Gaussian form (default)
 * and the far-field hazard-evaluation form beside it, unaided or with magnifying optics.
 */
import { requireNonNegative, requirePositive } from '../numeric/input-guards.js';
import { diffractionHalfAngleRad } from '../beam/gaussian-beam.js';

/** Optical gain of 7×50 binoculars for a beam larger than the objective: (50/7)² ≈ 51. */
export const BINOCULAR_7X50_GAIN = (50 / 7) ** 2;

/**
 * Optical gain of a viewing instrument for a beam larger than its objective: (D_objective/D_pupil)²
 * × transmission.
 *
 * @param objectiveDiameterM objective diameter [m], > 0 (50 mm for 7×50 binoculars)
 * @param pupilApertureDiameterM limiting aperture of the eye [m], > 0 (7 mm)
 * @param transmission optics transmission in (0, 1] (default 1: conservative)
 * @returns gain, dimensionless, ≥ 0
 * @see ANSI Z136.1 (optically aided viewing) [from memory]; common practice ((50/7)² for 7×50).
 */
export function viewingOpticsGain(objectiveDiameterM: number, pupilApertureDiameterM = 7e-3, transmission = 1): number {
  requirePositive('objectiveDiameterM', objectiveDiameterM);
  requirePositive('pupilApertureDiameterM', pupilApertureDiameterM);
  if (!(transmission > 0 && transmission <= 1)) throw new RangeError(`transmission: must lie in (0, 1] (got ${transmission})`);
  return (objectiveDiameterM / pupilApertureDiameterM) ** 2 * transmission;
}

/** Input of {@link nohdM} and {@link nohdFarFieldM}. */
export interface NohdInput {
  /** Emitted power [W], > 0. */
  powerW: number;
  /** MPE [W/m²], > 0 (from `ocularMpeWPerM2`). */
  mpeWPerM2: number;
  /** Vacuum wavelength [m], > 0. */
  wavelengthM: number;
  /** Exit beam radius W0 at the aperture (1/e²) [m], > 0. */
  waistRadiusM: number;
  /** Far-field half-angle divergence (1/e²) [rad], ≥ 0; below the diffraction limit the beam is taken as collimated. */
  halfAngleDivergenceRad: number;
  /** Gain of viewing optics (1 unaided, default; {@link BINOCULAR_7X50_GAIN} ≈ 51 for 7×50 binoculars). */
  opticalGain?: number;
}

function validateNohd(input: NohdInput): number {
  requirePositive('powerW', input.powerW);
  requirePositive('mpeWPerM2', input.mpeWPerM2);
  requirePositive('wavelengthM', input.wavelengthM);
  requirePositive('waistRadiusM', input.waistRadiusM);
  requireNonNegative('halfAngleDivergenceRad', input.halfAngleDivergenceRad);
  const gain = input.opticalGain ?? 1;
  requirePositive('opticalGain', gain);
  return gain;
}

/**
 * NOHD by the exact Gaussian form: the distance where the peak irradiance 2P·G/(π·W(z)²) of the 1/e²
 * beam falls to the MPE, with W(z) of the defocused launch from the exit radius W0 and half-angle θ
 * (collimated when θ ≤ θ_d = λ/(πW0)). With W_lim² = 2PG/(π·MPE):
 * θ²z² + 2·W0·sqrt(θ² − θ_d²)·z + (W0² − W_lim²) = 0, θ = max(θ, θ_d); NOHD = positive root, 0 when W0 ≥ W_lim.
 * Assumes the beam at that range is larger than the viewing optics' objective when G > 1.
 *
 * @param input `{ powerW, mpeWPerM2, wavelengthM, waistRadiusM, halfAngleDivergenceRad, opticalGain? }`
 * @returns NOHD [m], ≥ 0 — indicative; defer to the applicable standard and a laser safety officer
 * @see Kogelnik H., Li T., "Laser beams and resonators", Applied Optics 5(10), 1550–1567 (1966)
 *   (Gaussian beam radius); Andrews & Phillips (2005), ch. 4 (defocused launch); NOHD definition per
 *   ANSI Z136.1 / IEC 60825-1 [derived].
 */
export function nohdM(input: NohdInput): number {
  const gain = validateNohd(input);
  const w0 = input.waistRadiusM;
  const diffraction = diffractionHalfAngleRad(input.wavelengthM, w0);
  const theta = Math.max(input.halfAngleDivergenceRad, diffraction);
  const limitRadiusSquared = (2 * input.powerW * gain) / (Math.PI * input.mpeWPerM2);
  const c = w0 * w0 - limitRadiusSquared;
  if (c >= 0) return 0;
  const a = theta * theta;
  const b = 2 * w0 * Math.sqrt(Math.max(0, theta * theta - diffraction * diffraction));
  // Positive root in the cancellation-free form 2|c|/(b + sqrt(b² − 4ac)).
  return (-2 * c) / (b + Math.sqrt(b * b - 4 * a * c));
}

/**
 * NOHD by the far-field hazard-evaluation form, with 1/e sizes: a = √2·W0, φ = √2·θ,
 * NOHD = max(0, (sqrt(4PG/(π·MPE)) − a)/φ). It assumes linear growth W0 + θz and underestimates
 * the exact value for near-diffraction-limited beams: show it only beside {@link nohdM}.
 *
 * @param input as {@link nohdM}; θ must be > 0
 * @returns NOHD [m], ≥ 0
 * @see ANSI Z136.1, hazard evaluation (NOHD for a diverging beam) [from memory].
 */
export function nohdFarFieldM(input: NohdInput): number {
  const gain = validateNohd(input);
  requirePositive('halfAngleDivergenceRad', input.halfAngleDivergenceRad);
  const exitDiameter1e = Math.SQRT2 * input.waistRadiusM;
  const fullAngle1e = Math.SQRT2 * input.halfAngleDivergenceRad;
  return Math.max(0, (Math.sqrt((4 * input.powerW * gain) / (Math.PI * input.mpeWPerM2)) - exitDiameter1e) / fullAngle1e);
}

/**
 * Peak (on-axis) irradiance of the 1/e² Gaussian beam at the exit aperture, 2P/(π·W0²).
 *
 * @param powerW power [W], > 0
 * @param waistRadiusM exit radius W0 [m], > 0
 * @returns irradiance [W/m²]
 * @see Siegman A.E., "Lasers", University Science Books (1986), ch. 17.
 */
export function exitPeakIrradianceWPerM2(powerW: number, waistRadiusM: number): number {
  requirePositive('powerW', powerW);
  requirePositive('waistRadiusM', waistRadiusM);
  return (2 * powerW) / (Math.PI * waistRadiusM * waistRadiusM);
}
