/**
 * A beam launched from a transmit aperture with a given beam radius W0 and phase-front radius F0,
 * described by the Andrews & Phillips input/output-plane parameters, and the model of an FSO
 * terminal from its datasheet divergence (a deliberately defocused Gaussian).
 *
 * Sign convention for F0: Infinity = collimated (waist at the aperture), F0 > 0 converging,
 * F0 < 0 diverging. Radii are 1/e² intensity radii; angles 1/e² half-angles.
 */
import { diffractionHalfAngleRad } from './gaussian-beam.js';

/** Input of {@link andrewsPhillipsBeamParameters}. */
export interface LaunchedBeamInput {
  /** Vacuum wavelength [m], > 0. */
  wavelengthM: number;
  /** Beam radius W0 at the transmit aperture (1/e²) [m], > 0. */
  apertureBeamRadiusM: number;
  /** Phase-front radius of curvature F0 at the aperture [m]: Infinity collimated, > 0 converging, < 0 diverging. */
  phaseFrontRadiusM: number;
  /** Path length L from the aperture [m], ≥ 0. */
  rangeM: number;
  /** Beam quality M² ≥ 1 (default 1): the diffraction term scales with M² (embedded Gaussian). */
  m2?: number;
}

/** Andrews & Phillips beam parameters (all dimensionless except the radius). */
export interface AndrewsPhillipsParameters {
  /** Θ0 = 1 − L/F0 (input-plane curvature parameter). */
  theta0: number;
  /** Λ0 = 2L/(k W0²)·M² (input-plane Fresnel ratio). */
  lambda0: number;
  /** Θ = Θ0/(Θ0² + Λ0²) (output-plane curvature parameter; ≈ 0 for a spherical-wave-like beam). */
  theta: number;
  /** Λ = Λ0/(Θ0² + Λ0²) (output-plane Fresnel ratio). */
  lambda: number;
  /** W(L) = W0·sqrt(Θ0² + Λ0²), the 1/e² radius at the receiver [m]. */
  beamRadiusM: number;
}

/**
 * Andrews & Phillips parameters of a Gaussian beam launched with radius W0 and phase-front radius F0,
 * after a path L (vacuum propagation; these parameters feed the turbulence formulas).
 *
 * @param input wavelength [m] > 0, W0 [m] > 0, F0 [m] (±Infinity allowed), L [m] ≥ 0, M² ≥ 1
 * @returns Θ0, Λ0, Θ, Λ (dimensionless) and W(L) [m]
 * @see Andrews L.C., Phillips R.L., "Laser Beam Propagation through Random Media", 2nd ed., SPIE
 *   Press (2005), ch. 4 (input- and output-plane beam parameters; equation numbers not verified).
 */
export function andrewsPhillipsBeamParameters(input: LaunchedBeamInput): AndrewsPhillipsParameters {
  const { wavelengthM, apertureBeamRadiusM, phaseFrontRadiusM, rangeM } = input;
  const m2 = input.m2 ?? 1;
  const theta0 = Number.isFinite(phaseFrontRadiusM) ? 1 - rangeM / phaseFrontRadiusM : 1;
  const lambda0 = (m2 * wavelengthM * rangeM) / (Math.PI * apertureBeamRadiusM * apertureBeamRadiusM);
  const sum = theta0 * theta0 + lambda0 * lambda0;
  return {
    theta0,
    lambda0,
    theta: theta0 / sum,
    lambda: lambda0 / sum,
    beamRadiusM: apertureBeamRadiusM * Math.sqrt(sum),
  };
}

/** Input of {@link defocusedLaunch}. */
export interface DefocusedLaunchInput {
  /** Vacuum wavelength [m], > 0. */
  wavelengthM: number;
  /** Beam radius W0 at the transmit aperture (1/e²) [m], > 0. */
  apertureBeamRadiusM: number;
  /** Measured far-field half-angle divergence θ (1/e²) [rad], ≥ 0. */
  halfAngleDivergenceRad: number;
  /** Beam quality M² ≥ 1 (default 1). */
  m2?: number;
}

/** A terminal modelled as a Gaussian with a phase-front radius chosen to reproduce its divergence. */
export interface DefocusedLaunch {
  /** Diffraction-limited half-angle θ_d = M² λ/(π W0) [rad]. */
  diffractionHalfAngleRad: number;
  /** F0 = −W0/sqrt(θ² − θ_d²) [m] (negative: diverging); Infinity when θ ≤ θ_d (collimated). */
  phaseFrontRadiusM: number;
  /** True when the requested divergence is at or below the diffraction limit: the beam is collimated. */
  collimated: boolean;
  /** Effective far-field half-angle max(θ, θ_d) [rad]. */
  farFieldHalfAngleRad: number;
}

/**
 * Models an FSO terminal from its aperture beam radius and datasheet divergence: a Gaussian
 * launched with phase-front radius F0 = −W0/sqrt(θ² − θ_d²), which reproduces the far-field
 * half-angle θ exactly. When θ ≤ θ_d the beam is taken as collimated at the aperture.
 *
 * @param input wavelength [m] > 0, W0 [m] > 0, θ [rad] ≥ 0, M² ≥ 1
 * @returns θ_d [rad], F0 [m] (negative or Infinity), whether collimated, far-field half-angle [rad]
 * @see Andrews & Phillips (2005), ch. 4 (Θ0, Λ0 definitions), with the far-field limit
 *   W(L)/L → sqrt(W0²/F0² + θ_d²) solved for F0 (derived; checked numerically in the project's
 *   reference cases GB-07).
 */
export function defocusedLaunch(input: DefocusedLaunchInput): DefocusedLaunch {
  const { wavelengthM, apertureBeamRadiusM, halfAngleDivergenceRad } = input;
  const m2 = input.m2 ?? 1;
  const diffraction = diffractionHalfAngleRad(wavelengthM, apertureBeamRadiusM, m2);
  const excess = halfAngleDivergenceRad * halfAngleDivergenceRad - diffraction * diffraction;
  if (!(excess > 0)) {
    return { diffractionHalfAngleRad: diffraction, phaseFrontRadiusM: Infinity, collimated: true, farFieldHalfAngleRad: diffraction };
  }
  return {
    diffractionHalfAngleRad: diffraction,
    phaseFrontRadiusM: -apertureBeamRadiusM / Math.sqrt(excess),
    collimated: false,
    farFieldHalfAngleRad: halfAngleDivergenceRad,
  };
}

/**
 * Beam radius at range L of a terminal described by its aperture beam radius and (optional)
 * datasheet half-angle divergence. Plain-number, allocation-free form for the link budget's hot
 * path; no validation.
 *
 * W(L)² = (W0 + L·sqrt(θ² − θ_d²))² + (θ_d L)²  when θ > θ_d (defocused launch, F0 < 0);
 * W(L)² = W0² + (θ_d L)²                          otherwise (collimated at the aperture).
 *
 * @param wavelengthM vacuum wavelength [m], > 0
 * @param apertureBeamRadiusM W0, 1/e² radius at the aperture [m], > 0
 * @param halfAngleDivergenceRad datasheet 1/e² half-angle [rad]; NaN, 0 or ≤ θ_d means collimated
 * @param m2 M² ≥ 1
 * @param rangeM path length [m], ≥ 0
 * @returns W(L) [m], ≥ W0
 * @see Andrews & Phillips (2005), ch. 4: W = W0·sqrt(Θ0² + Λ0²) with F0 from {@link defocusedLaunch}.
 */
export function launchBeamRadiusAtRangeM(
  wavelengthM: number,
  apertureBeamRadiusM: number,
  halfAngleDivergenceRad: number,
  m2: number,
  rangeM: number,
): number {
  const diffraction = diffractionHalfAngleRad(wavelengthM, apertureBeamRadiusM, m2);
  const excess = halfAngleDivergenceRad * halfAngleDivergenceRad - diffraction * diffraction;
  const defocusGrowth = excess > 0 ? rangeM * Math.sqrt(excess) : 0;
  const geometric = apertureBeamRadiusM + defocusGrowth;
  const diffracted = diffraction * rangeM;
  return Math.sqrt(geometric * geometric + diffracted * diffracted);
}

/** Input of {@link beamRadiusAtRangeM}. */
export interface BeamRadiusAtRangeInput {
  /** Vacuum wavelength [m], > 0. */
  wavelengthM: number;
  /** W0, 1/e² radius at the transmit aperture [m], > 0. */
  apertureBeamRadiusM: number;
  /** Datasheet 1/e² half-angle [rad] ≥ 0; omitted or ≤ diffraction limit: collimated at the aperture. */
  halfAngleDivergenceRad?: number;
  /** M² ≥ 1 (default 1). */
  m2?: number;
  /** Path length [m], ≥ 0. */
  rangeM: number;
}

/**
 * Beam radius (1/e²) at the receiver for the link budget: collimated at the aperture when the
 * divergence is missing or at/below the diffraction limit, the defocused launch otherwise.
 *
 * @param input see {@link BeamRadiusAtRangeInput}
 * @returns W(L) [m]
 * @throws RangeError naming the field when an input is out of range
 * @see {@link launchBeamRadiusAtRangeM}; Andrews & Phillips (2005), ch. 4.
 */
export function beamRadiusAtRangeM(input: BeamRadiusAtRangeInput): number {
  const m2 = input.m2 ?? 1;
  const theta = input.halfAngleDivergenceRad ?? 0;
  if (!(input.wavelengthM > 0) || !Number.isFinite(input.wavelengthM)) throw new RangeError('wavelengthM must be a finite number > 0');
  if (!(input.apertureBeamRadiusM > 0) || !Number.isFinite(input.apertureBeamRadiusM)) throw new RangeError('apertureBeamRadiusM must be a finite number > 0');
  if (!(theta >= 0) || !Number.isFinite(theta)) throw new RangeError('halfAngleDivergenceRad must be a finite number ≥ 0');
  if (!(m2 >= 1) || !Number.isFinite(m2)) throw new RangeError('m2 must be a finite number ≥ 1');
  if (!(input.rangeM >= 0) || !Number.isFinite(input.rangeM)) throw new RangeError('rangeM must be a finite number ≥ 0');
  return launchBeamRadiusAtRangeM(input.wavelengthM, input.apertureBeamRadiusM, theta, m2, input.rangeM);
}

/**
 * The "linear" spot-size rule of FSO practice, W0 + θ·L: the limit of the defocused launch for θ ≫ θ_d.
 * @param apertureBeamRadiusM W0 [m], > 0
 * @param halfAngleDivergenceRad θ [rad], ≥ 0
 * @param rangeM L [m], ≥ 0
 * @returns W0 + θ L [m]
 * @see common practice; limit of {@link launchBeamRadiusAtRangeM} (derived).
 */
export function linearSpotRadiusM(apertureBeamRadiusM: number, halfAngleDivergenceRad: number, rangeM: number): number {
  return apertureBeamRadiusM + halfAngleDivergenceRad * rangeM;
}

/**
 * The quadrature spot-size rule sqrt(W0² + θ²L²): exact only for a waist at the aperture (θ = θ_d);
 * it underestimates a defocused terminal's spot. Shown for comparison.
 * @param apertureBeamRadiusM W0 [m], > 0
 * @param halfAngleDivergenceRad θ [rad], ≥ 0
 * @param rangeM L [m], ≥ 0
 * @returns sqrt(W0² + θ²L²) [m]
 * @see Kogelnik & Li (1966), eq. 17 (with θ = θ_d).
 */
export function quadratureSpotRadiusM(apertureBeamRadiusM: number, halfAngleDivergenceRad: number, rangeM: number): number {
  return Math.hypot(apertureBeamRadiusM, halfAngleDivergenceRad * rangeM);
}
