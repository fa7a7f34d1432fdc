/**
 * Transverse intensity profile of a Gaussian beam: I(r) = (2P/(π w²))·exp(−2r²/w²).
 */

/**
 * Peak (on-axis) intensity of a Gaussian beam.
 * @param powerW total beam power [W], ≥ 0
 * @param beamRadiusM 1/e² radius [m], > 0
 * @returns 2P/(π w²) [W/m²]
 * @see Siegman A.E., "Lasers" (1986), §17.1, eq. 17.5 (normalised TEM00 profile).
 */
export function gaussianPeakIntensityWPerM2(powerW: number, beamRadiusM: number): number {
  return (2 * powerW) / (Math.PI * beamRadiusM * beamRadiusM);
}

/**
 * Intensity relative to the peak at radial distance r: exp(−2r²/w²).
 * @param beamRadiusM 1/e² radius [m], > 0
 * @param radialDistanceM distance from the beam axis [m], ≥ 0
 * @returns ratio in (0, 1]
 * @see Siegman (1986), eq. 17.5.
 */
export function relativeIntensity(beamRadiusM: number, radialDistanceM: number): number {
  const ratio = radialDistanceM / beamRadiusM;
  return Math.exp(-2 * ratio * ratio);
}

/**
 * Intensity at radial distance r.
 * @param powerW beam power [W], ≥ 0
 * @param beamRadiusM 1/e² radius [m], > 0
 * @param radialDistanceM distance from the axis [m], ≥ 0
 * @returns I(r) [W/m²]
 * @see Siegman (1986), eq. 17.5.
 */
export function gaussianIntensityWPerM2(powerW: number, beamRadiusM: number, radialDistanceM: number): number {
  return gaussianPeakIntensityWPerM2(powerW, beamRadiusM) * relativeIntensity(beamRadiusM, radialDistanceM);
}

/**
 * Fraction of a centred Gaussian beam's power inside radius r: 1 − exp(−2r²/w²).
 * Computed with expm1 so it stays exact for r ≪ w.
 * @param beamRadiusM 1/e² radius [m], > 0
 * @param radiusM radius of the circle [m], ≥ 0
 * @returns fraction in [0, 1] (0.8647 at r = w, 0.6321 at r = w/√2, 0.5 at the FWHM radius)
 * @see Siegman (1986), §17.1 (integral of eq. 17.5).
 */
export function encircledPowerFraction(beamRadiusM: number, radiusM: number): number {
  const ratio = radiusM / beamRadiusM;
  return -Math.expm1(-2 * ratio * ratio);
}
