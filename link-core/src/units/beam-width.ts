/**
 * Conversions between beam-width definitions of a Gaussian (TEM00) beam.
 *
 * The engine's convention is the 1/e² intensity RADIUS w and the 1/e² HALF-angle divergence.
 * Datasheets quote diameters or full angles, often as FWHM or 1/e (the eye-safety standards'
 * 63 %-power definition). For a Gaussian profile I(r) = I0·exp(−2r²/w²), the radius where the
 * intensity falls to a fraction t of the peak is r_t = w·sqrt(−ln(t)/2). Angles convert exactly like
 * widths because the far-field profile is Gaussian too.
 */

/** Width definitions: intensity level (1/e², 1/e, half maximum) and second-moment (D4σ = 1/e² for TEM00). */
export type BeamWidthDefinition = '1/e2' | '1/e' | 'fwhm' | 'd4sigma';

/** Whether a quoted width is a radius (half-angle) or a diameter (full angle). */
export type BeamWidthExtent = 'radius' | 'diameter';

/**
 * Ratio r_definition / w of a Gaussian beam, where w is the 1/e² intensity radius.
 *
 * @param definition width definition
 * @returns 1 for 1/e² and D4σ, 1/√2 for 1/e, sqrt(ln 2 / 2) ≈ 0.5887 for FWHM
 * @see Siegman A.E., "Lasers", University Science Books (1986), §17.1, eq. 17.5 (Gaussian profile);
 *   ISO 11146-1:2021 (second-moment width = 1/e² width for TEM00).
 */
export function widthOverOneOverESquaredRadius(definition: BeamWidthDefinition): number {
  switch (definition) {
    case '1/e2':
    case 'd4sigma':
      return 1;
    case '1/e':
      return Math.SQRT1_2;
    case 'fwhm':
      return Math.sqrt(Math.LN2 / 2);
  }
}

/** A width (or angle) with its definition and extent. */
export interface BeamWidth {
  /** The value, in metres for widths or radians for angles (> 0). */
  value: number;
  definition: BeamWidthDefinition;
  extent: BeamWidthExtent;
}

/**
 * Converts a Gaussian beam width (or divergence angle) between definitions and between
 * radius/diameter (half/full angle).
 *
 * @param width value with definition and extent (metres or radians, > 0)
 * @param to target definition and extent
 * @returns the converted value in the same unit as `width.value`
 * @see Siegman A.E., "Lasers" (1986), §17.1; ISO 11146-1:2021.
 */
export function convertBeamWidth(width: BeamWidth, to: { definition: BeamWidthDefinition; extent: BeamWidthExtent }): number {
  const fromExtent = width.extent === 'diameter' ? 0.5 : 1;
  const toExtent = to.extent === 'diameter' ? 2 : 1;
  const oneOverESquaredRadius = (width.value * fromExtent) / widthOverOneOverESquaredRadius(width.definition);
  return oneOverESquaredRadius * widthOverOneOverESquaredRadius(to.definition) * toExtent;
}

/**
 * Ratio of two width definitions (same extent): value_in_`numerator` / value_in_`denominator`.
 * Example: ('1/e2', 'fwhm') = sqrt(2/ln 2) ≈ 1.6986.
 *
 * @param numerator definition on top
 * @param denominator definition below
 * @returns dimensionless ratio > 0
 * @see Siegman A.E., "Lasers" (1986), §17.1.
 */
export function beamWidthDefinitionRatio(numerator: BeamWidthDefinition, denominator: BeamWidthDefinition): number {
  return widthOverOneOverESquaredRadius(numerator) / widthOverOneOverESquaredRadius(denominator);
}

/**
 * Half-angle from a full angle (or radius from a diameter).
 * @param fullAngleRad full angle [rad], ≥ 0
 * @returns half-angle [rad]
 * @see common practice (definition).
 */
export function fullAngleToHalfAngleRad(fullAngleRad: number): number {
  return fullAngleRad / 2;
}

/**
 * Full angle from a half-angle.
 * @param halfAngleRad half-angle [rad], ≥ 0
 * @returns full angle [rad]
 * @see common practice (definition).
 */
export function halfAngleToFullAngleRad(halfAngleRad: number): number {
  return halfAngleRad * 2;
}

/**
 * Degrees from radians.
 * @param angleRad angle [rad]
 * @returns angle [deg]
 * @see BIPM SI Brochure, 9th ed. (2019), table 8 (1° = π/180 rad).
 */
export function radiansToDegrees(angleRad: number): number {
  return (angleRad * 180) / Math.PI;
}

/**
 * Radians from degrees.
 * @param angleDeg angle [deg]
 * @returns angle [rad]
 * @see BIPM SI Brochure, 9th ed. (2019), table 8 (1° = π/180 rad).
 */
export function degreesToRadians(angleDeg: number): number {
  return (angleDeg * Math.PI) / 180;
}
