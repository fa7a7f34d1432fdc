/**
 * Truncation of a Gaussian beam by a circular transmit aperture (radius a, optional central
 * obscuration of radius b = γa), after Klein & Degnan. α = a/w, with w the 1/e² beam radius at the
 * aperture. Valid in the Fraunhofer far field of a collimated, diffraction-limited beam; for the
 * defocused beams of FSO terminals only the clipping loss is relevant.
 */
import { findRootBrent } from '../numeric/root-finding.js';
import { ratioToDb } from '../units/decibels.js';

function checkObscuration(obscurationRatio: number): void {
  if (!(obscurationRatio >= 0 && obscurationRatio < 1)) {
    throw new RangeError(`obscurationRatio must be in [0, 1) (got ${String(obscurationRatio)})`);
  }
}

/**
 * On-axis far-field gain efficiency g(α, γ) = (2/α²)·[exp(−γ²α²) − exp(−α²)]², the gain relative
 * to a uniformly illuminated unobscured aperture of the same outer radius (4πA/λ²).
 *
 * @param alpha aperture radius over 1/e² beam radius a/w, > 0
 * @param obscurationRatio γ = b/a in [0, 1) (default 0)
 * @returns g in [0, 1) (maximum 0.8145 at α = 1.1209 without obscuration)
 * @see Klein B.J., Degnan J.J., "Optical antenna gain. 1: Transmitting antennas", Appl. Opt. 13(9),
 *   2134–2141 (1974), on-axis far-field gain of a truncated, obscured Gaussian.
 */
export function truncationGainEfficiency(alpha: number, obscurationRatio = 0): number {
  const alphaSquared = alpha * alpha;
  const difference = Math.exp(-obscurationRatio * obscurationRatio * alphaSquared) - Math.exp(-alphaSquared);
  return (2 / alphaSquared) * difference * difference;
}

/**
 * Fraction of a Gaussian beam's power transmitted through an annular aperture:
 * T = exp(−2γ²α²) − exp(−2α²).
 *
 * @param alpha a/w, > 0
 * @param obscurationRatio γ = b/a in [0, 1) (default 0)
 * @returns T in [0, 1]; clipping loss = −10·log10(T) dB
 * @see Klein & Degnan (1974); Siegman A.E., "Lasers" (1986), §17.1 (encircled power).
 */
export function transmittedFraction(alpha: number, obscurationRatio = 0): number {
  if (obscurationRatio === 0) return -Math.expm1(-2 * alpha * alpha);
  return Math.exp(-2 * obscurationRatio * obscurationRatio * alpha * alpha) - Math.exp(-2 * alpha * alpha);
}

/** Result of {@link optimumTruncation}. */
export interface OptimumTruncation {
  /** α_opt = a/w maximising the on-axis far-field gain. */
  apertureToBeamRatio: number;
  /** g(α_opt, γ), the maximum gain efficiency (dimensionless). */
  onAxisGainEfficiency: number;
  /** w/a at the optimum. */
  beamToApertureRatio: number;
  /** 10·log10(g) [dB] (negative). */
  onAxisGainEfficiencyDb: number;
  /** Transmitted fraction at the optimum. */
  transmittedFraction: number;
  /** Clipping loss −10·log10(T) [dB]. */
  clippingLossDb: number;
  /** The polynomial fit α ≈ 1.12 − 1.30γ² + 2.12γ⁴, shown for comparison only. */
  apertureToBeamRatioFit: number;
}

/**
 * Klein–Degnan optimum truncation: the α = a/w that maximises the on-axis far-field gain for a given
 * central obscuration. Setting d ln g/du = 0 with u = α² gives
 * 2u·(e^(−u) − γ² e^(−γ²u)) = e^(−γ²u) − e^(−u), solved by Brent's method (γ = 0: e^u = 1 + 2u,
 * α = 1.12091, g = 0.81453).
 *
 * @param input obscurationRatio γ = b/a in [0, 1) (default 0)
 * @returns optimum a/w, gain efficiency, w/a, gain efficiency in dB, transmitted fraction, clipping loss [dB]
 * @throws RangeError when obscurationRatio is outside [0, 1)
 * @see Klein B.J., Degnan J.J., "Optical antenna gain. 1: Transmitting antennas", Appl. Opt. 13(9),
 *   2134–2141 (1974) (optimum α = 1.12 unobscured; the obscuration fit is recalled, not verified).
 */
export function optimumTruncation(input: { obscurationRatio?: number } = {}): OptimumTruncation {
  const gamma = input.obscurationRatio ?? 0;
  checkObscuration(gamma);
  const gammaSquared = gamma * gamma;
  const stationarity = (u: number): number => {
    const inner = Math.exp(-gammaSquared * u);
    const outer = Math.exp(-u);
    return 2 * u * (outer - gammaSquared * inner) - (inner - outer);
  };
  // Lower end: small-u expansion gives u(1 − γ²) > 0; upper end: the bracket [0.01, 30] changes sign for γ < 1.
  const u = findRootBrent(stationarity, 1e-2, 30, { xTolerance: 1e-15 });
  const alpha = Math.sqrt(u);
  const gain = truncationGainEfficiency(alpha, gamma);
  const transmitted = transmittedFraction(alpha, gamma);
  return {
    apertureToBeamRatio: alpha,
    onAxisGainEfficiency: gain,
    beamToApertureRatio: 1 / alpha,
    onAxisGainEfficiencyDb: ratioToDb(gain),
    transmittedFraction: transmitted,
    clippingLossDb: -ratioToDb(transmitted),
    apertureToBeamRatioFit: 1.12 - 1.3 * gammaSquared + 2.12 * gammaSquared * gammaSquared,
  };
}

/**
 * Gain of a uniformly illuminated circular aperture, (π D/λ)² = 4πA/λ².
 * @param apertureDiameterM D [m], > 0
 * @param wavelengthM λ [m], > 0
 * @returns gain (dimensionless, > 0); in dBi through ratioToDb
 * @see Klein & Degnan (1974); Silver S., "Microwave Antenna Theory and Design", McGraw-Hill (1949), ch. 6.
 */
export function uniformApertureGain(apertureDiameterM: number, wavelengthM: number): number {
  const ratio = (Math.PI * apertureDiameterM) / wavelengthM;
  return ratio * ratio;
}

/**
 * Far-field on-axis gain of a truncated Gaussian: (πD/λ)²·g(α, γ).
 * @param input apertureDiameterM [m] > 0, wavelengthM [m] > 0, alpha = a/w > 0, obscurationRatio in [0, 1)
 * @returns gain (dimensionless)
 * @see Klein & Degnan (1974).
 */
export function truncatedGaussianGain(input: { apertureDiameterM: number; wavelengthM: number; alpha: number; obscurationRatio?: number }): number {
  return uniformApertureGain(input.apertureDiameterM, input.wavelengthM) * truncationGainEfficiency(input.alpha, input.obscurationRatio ?? 0);
}

/**
 * Distance beyond which an aperture radiates in its far field, πa²/λ (the Rayleigh distance of the
 * aperture); the Klein–Degnan gain applies only for L ≫ this distance.
 * @param apertureRadiusM a [m], > 0
 * @param wavelengthM λ [m], > 0
 * @returns πa²/λ [m]
 * @see Klein & Degnan (1974), far-field condition.
 */
export function fraunhoferDistanceM(apertureRadiusM: number, wavelengthM: number): number {
  return (Math.PI * apertureRadiusM * apertureRadiusM) / wavelengthM;
}

/**
 * On-axis far-field irradiance of a transmitter of gain G: P·G/(4πL²).
 * @param powerW transmitted power [W], ≥ 0
 * @param gain on-axis gain (dimensionless)
 * @param rangeM L [m], > 0 (far field)
 * @returns irradiance [W/m²]
 * @see Klein & Degnan (1974), definition of gain.
 */
export function onAxisFarFieldIrradianceWPerM2(powerW: number, gain: number, rangeM: number): number {
  return (powerW * gain) / (4 * Math.PI * rangeM * rangeM);
}

/**
 * On-axis gain of an untruncated Gaussian beam of far-field half-angle θ: 8/θ².
 * @param halfAngleDivergenceRad θ (1/e²) [rad], > 0
 * @returns gain (dimensionless)
 * @see derived: peak far-field intensity 2P/(π θ²L²) over the isotropic P/(4πL²).
 */
export function gaussianBeamOnAxisGain(halfAngleDivergenceRad: number): number {
  return 8 / (halfAngleDivergenceRad * halfAngleDivergenceRad);
}

/**
 * Friis power ratio P_r/P_t = G_t·G_r·(λ/(4πL))².
 * @param transmitGain G_t (dimensionless)
 * @param receiveGain G_r (dimensionless)
 * @param wavelengthM λ [m], > 0
 * @param rangeM L [m], > 0
 * @returns power ratio (dimensionless)
 * @see Friis H.T., "A note on a simple transmission formula", Proc. IRE 34(5), 254–256 (1946).
 */
export function friisPowerRatio(transmitGain: number, receiveGain: number, wavelengthM: number, rangeM: number): number {
  const pathFactor = wavelengthM / (4 * Math.PI * rangeM);
  return transmitGain * receiveGain * pathFactor * pathFactor;
}

/** Input of {@link transmitApertureForSpot}. */
export interface TransmitApertureForSpotInput {
  /** Vacuum wavelength [m], > 0. */
  wavelengthM: number;
  /** Link range [m], > 0. */
  rangeM: number;
  /** Wanted 1/e² spot radius at the range [m], > 0. */
  targetSpotRadiusM: number;
  /** Beam quality M² ≥ 1 (default 1). */
  m2?: number;
  /** Aperture radius over beam radius a/W0 to keep clipping small (default 1.5: T ≥ 0.989, practice). */
  apertureToBeamRatio?: number;
}

/** Result of {@link transmitApertureForSpot}. */
export interface TransmitApertureForSpot {
  /** Smallest spot any collimated launch can give at this range, √2·sqrt(M²λL/π) [m]. */
  minimumCollimatedSpotRadiusM: number;
  /** W0 = sqrt(M²λL/π) that gives that smallest collimated spot [m]. */
  optimumCollimatedBeamRadiusM: number;
  /** Smallest W0 of a collimated launch reaching the target spot [m]; null when the target is below the minimum. */
  collimatedBeamRadiusM: number | null;
  /** Smallest W0 able to reach the target when focused on the receiver, M²λL/(π W_target) [m]. */
  focusedBeamRadiusM: number;
  /** Aperture radius a = ratio·W0 for the collimated launch (or the focused one when collimated is impossible) [m]. */
  apertureRadiusM: number;
  /** Clipping loss at that ratio [dB]. */
  clippingLossDb: number;
}

/**
 * Sizes the transmit beam and aperture for a target spot radius at range.
 * Collimated launch: W(L)² = W0² + (M²λL/(πW0))², solved for the smaller W0 (a quadratic in W0²);
 * focused on the receiver: W(L) = M²λL/(πW0). A larger spot is obtained from any W0 by defocusing.
 *
 * @param input see {@link TransmitApertureForSpotInput}
 * @returns beam radii [m], aperture radius [m] and clipping loss [dB]
 * @throws RangeError naming the field when an input is out of range
 * @see Kogelnik & Li (1966), eq. 17; Andrews & Phillips (2005), ch. 4 (focused beam, Θ0 = 0).
 */
export function transmitApertureForSpot(input: TransmitApertureForSpotInput): TransmitApertureForSpot {
  const m2 = input.m2 ?? 1;
  const ratio = input.apertureToBeamRatio ?? 1.5;
  for (const [field, value] of [['wavelengthM', input.wavelengthM], ['rangeM', input.rangeM], ['targetSpotRadiusM', input.targetSpotRadiusM], ['apertureToBeamRatio', ratio]] as const) {
    if (!(value > 0) || !Number.isFinite(value)) throw new RangeError(`${field} must be a finite number > 0`);
  }
  if (!(m2 >= 1) || !Number.isFinite(m2)) throw new RangeError('m2 must be a finite number ≥ 1');
  const product = (m2 * input.wavelengthM * input.rangeM) / Math.PI;
  const optimum = Math.sqrt(product);
  const target = input.targetSpotRadiusM;
  const discriminant = target ** 4 - 4 * product * product;
  const collimated = discriminant >= 0 ? Math.sqrt((2 * product * product) / (target * target + Math.sqrt(discriminant))) : null;
  const focused = product / target;
  const chosen = collimated ?? focused;
  return {
    minimumCollimatedSpotRadiusM: Math.SQRT2 * optimum,
    optimumCollimatedBeamRadiusM: optimum,
    collimatedBeamRadiusM: collimated,
    focusedBeamRadiusM: focused,
    apertureRadiusM: ratio * chosen,
    clippingLossDb: -ratioToDb(transmittedFraction(ratio)),
  };
}
