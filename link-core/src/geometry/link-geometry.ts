/**
 * Geometry of a link between two sites: geodesic distance and true azimuths (Karney), slant range
 * and geometric elevations at both ends (ECEF/ENU on the WGS84 ellipsoid), optical refraction
 * reported apart, Earth bulge and line-of-sight clearance of obstacles against the beam envelope.
 */
import { DEFAULT_REFRACTION_COEFFICIENT, MEAN_EARTH_RADIUS_M, WGS84_ELLIPSOID, type Ellipsoid } from '../units/constants.js';
import { launchBeamRadiusAtRangeM } from '../beam/launch.js';
import { enuVector, geodesicInverse, normaliseAzimuthDeg, type Enu } from './geodesy.js';

const DEGREES_PER_RADIAN = 180 / Math.PI;

/** A site: geodetic latitude and longitude [deg] and height [m] (both ends on the same datum). */
export interface Site {
  latDeg: number;
  lonDeg: number;
  /** Height of the terminal [m]; ellipsoidal (GNSS) or above MSL, the same kind at both ends. */
  heightM: number;
}

/** Input of {@link linkGeometry}. */
export interface LinkGeometryInput {
  a: Site;
  b: Site;
  /** Refraction coefficient κ (ray curvature κ/R), typically −1 … +1; default 0.13. */
  refractionCoefficient?: number;
  /** Earth radius for the curvature and refraction terms [m] (default 6 371 000). */
  earthRadiusM?: number;
  /** Ellipsoid for geodesic and ECEF (default WGS84). */
  ellipsoid?: Ellipsoid;
}

/** Result of {@link linkGeometry}. Azimuths true, clockwise from north, in [0, 360); elevations geometric. */
export interface LinkGeometry {
  /** Geodesic distance on the ellipsoid [m]. */
  distanceM: number;
  /** Azimuth at A towards B [deg]. */
  azimuthAtoBDeg: number;
  /** Azimuth at B towards A [deg] (forward azimuth at B + 180°). */
  azimuthBtoADeg: number;
  /** Straight-line distance between the two terminals [m]. */
  slantRangeM: number;
  /** Geometric elevation of B seen from A [deg] (positive upward; excludes refraction). */
  elevationAtoBDeg: number;
  /** Geometric elevation of A seen from B [deg]. Not the negative of the other: each horizon tilts. */
  elevationBtoADeg: number;
  /** B in A's East-North-Up frame [m]. */
  enuAtA: Enu;
  /** Azimuth of the ENU vector at A [deg] (differs from the geodesic azimuth by < 1e-5° below 10 km). */
  enuAzimuthAtoBDeg: number;
  /** Spherical cross-check atan((h_B − h_A)/D − D/(2R)) [deg]. */
  sphericalElevationAtoBDeg: number;
  /** Refraction coefficient used. */
  refractionCoefficient: number;
  /** Refraction lift of the apparent elevation at either end, κ·s/(2R) [deg]. */
  refractionCorrectionDeg: number;
  /** Apparent (refracted) elevation at A, geometric + correction [deg]. */
  apparentElevationAtoBDeg: number;
  /** Apparent elevation at B [deg]. */
  apparentElevationBtoADeg: number;
  /** Earth bulge at mid-path, D²/(8R) [m]. */
  midpointEarthBulgeM: number;
  /** Mid-path bulge with refraction, (1 − κ)·D²/(8R) [m]. */
  midpointEarthBulgeWithRefractionM: number;
}

function checkSite(site: Site | undefined, field: string): void {
  if (!site) throw new RangeError(`${field} is required`);
  if (!Number.isFinite(site.latDeg) || Math.abs(site.latDeg) > 90) throw new RangeError(`${field}.latDeg must be in [−90, 90]`);
  if (!Number.isFinite(site.lonDeg) || Math.abs(site.lonDeg) > 540) throw new RangeError(`${field}.lonDeg must be a finite longitude in degrees`);
  if (!Number.isFinite(site.heightM) || Math.abs(site.heightM) > 1e5) throw new RangeError(`${field}.heightM must be a finite height in metres`);
}

/**
 * Link geometry from two sites: geodesic distance and azimuths, slant range, geometric and apparent
 * elevations at both ends, and the Earth bulge.
 *
 * @param input sites A and B (lat/lon [deg], height [m]), refraction coefficient (default 0.13),
 *   Earth radius [m] (default 6 371 000), ellipsoid (default WGS84)
 * @returns see {@link LinkGeometry}
 * @throws RangeError naming the field for out-of-range input
 * @see Karney C.F.F., "Algorithms for geodesics", J. Geodesy 87(1), 43–55 (2013) (distance, azimuths);
 *   Hofmann-Wellenhof B. et al., "GNSS" (2008), §10.2 (ECEF, local-level frame);
 *   Brunner F.K. (ed.), "Geodetic Refraction" (1984) (κ = 0.13, refraction angle κ·s/(2R)).
 */
export function linkGeometry(input: LinkGeometryInput): LinkGeometry {
  checkSite(input.a, 'a');
  checkSite(input.b, 'b');
  const kappa = input.refractionCoefficient ?? DEFAULT_REFRACTION_COEFFICIENT;
  const earthRadiusM = input.earthRadiusM ?? MEAN_EARTH_RADIUS_M;
  const ellipsoid = input.ellipsoid ?? WGS84_ELLIPSOID;
  if (!Number.isFinite(kappa) || Math.abs(kappa) > 2) throw new RangeError('refractionCoefficient must be a finite number in [−2, 2]');
  if (!(earthRadiusM > 0) || !Number.isFinite(earthRadiusM)) throw new RangeError('earthRadiusM must be a finite number > 0');
  const { a, b } = input;
  const geodesic = geodesicInverse({ lat1Deg: a.latDeg, lon1Deg: a.lonDeg, lat2Deg: b.latDeg, lon2Deg: b.lonDeg, ellipsoid });
  const forward = enuVector(a, b, ellipsoid);
  const backward = enuVector(b, a, ellipsoid);
  const horizontalForward = Math.hypot(forward.eastM, forward.northM);
  const slantRangeM = Math.hypot(horizontalForward, forward.upM);
  const elevationAtoBDeg = Math.atan2(forward.upM, horizontalForward) * DEGREES_PER_RADIAN;
  const elevationBtoADeg = Math.atan2(backward.upM, Math.hypot(backward.eastM, backward.northM)) * DEGREES_PER_RADIAN;
  const distanceM = geodesic.distanceM;
  const refractionCorrectionDeg = ((kappa * slantRangeM) / (2 * earthRadiusM)) * DEGREES_PER_RADIAN;
  const midpointBulge = (distanceM * distanceM) / (8 * earthRadiusM);
  return {
    distanceM,
    azimuthAtoBDeg: geodesic.azimuth1to2Deg,
    azimuthBtoADeg: geodesic.azimuth2to1Deg,
    slantRangeM,
    elevationAtoBDeg,
    elevationBtoADeg,
    enuAtA: forward,
    enuAzimuthAtoBDeg: normaliseAzimuthDeg(Math.atan2(forward.eastM, forward.northM) * DEGREES_PER_RADIAN),
    sphericalElevationAtoBDeg: Math.atan((b.heightM - a.heightM) / distanceM - distanceM / (2 * earthRadiusM)) * DEGREES_PER_RADIAN,
    refractionCoefficient: kappa,
    refractionCorrectionDeg,
    apparentElevationAtoBDeg: elevationAtoBDeg + refractionCorrectionDeg,
    apparentElevationBtoADeg: elevationBtoADeg + refractionCorrectionDeg,
    midpointEarthBulgeM: midpointBulge,
    midpointEarthBulgeWithRefractionM: (1 - kappa) * midpointBulge,
  };
}

/** Result of {@link earthCurvature}. */
export interface EarthCurvature {
  /** Drop of the horizontal plane below a straight line at distance D, D²/(2R) [m]. */
  curvatureDropM: number;
  /** Drop reduced by refraction, (1 − κ)·D²/(2R) [m]. */
  dropWithRefractionM: number;
  /** Bulge at mid-path of a chord of length D, D²/(8R) [m]. */
  midpointBulgeM: number;
  /** Mid-path bulge with refraction, (1 − κ)·D²/(8R) [m]. */
  midpointBulgeWithRefractionM: number;
  /** Dip of a level chord at its end, D/(2R) [rad]. */
  elevationDipRad: number;
  /** Refraction angle at an end, κ·D/(2R) [rad]. */
  refractionAngleAtEndRad: number;
  /** Effective Earth-radius factor 1/(1 − κ) (1.15 for κ = 0.13). */
  effectiveRadiusFactor: number;
}

/**
 * Earth curvature and refraction over a distance D on a sphere of radius R.
 *
 * @param input distanceM [m] ≥ 0, refractionCoefficient κ (default 0.13), earthRadiusM [m] (default 6 371 000)
 * @returns drops and bulges [m], angles [rad], effective radius factor
 * @see Brunner F.K. (ed.), "Geodetic Refraction", Springer (1984); Ghilani C.D., Wolf P.R.,
 *   "Elementary Surveying", Pearson (curvature and refraction, 0.0675·K² m for K in km).
 */
export function earthCurvature(input: { distanceM: number; refractionCoefficient?: number; earthRadiusM?: number }): EarthCurvature {
  const kappa = input.refractionCoefficient ?? DEFAULT_REFRACTION_COEFFICIENT;
  const radius = input.earthRadiusM ?? MEAN_EARTH_RADIUS_M;
  const d = input.distanceM;
  const drop = (d * d) / (2 * radius);
  return {
    curvatureDropM: drop,
    dropWithRefractionM: (1 - kappa) * drop,
    midpointBulgeM: drop / 4,
    midpointBulgeWithRefractionM: ((1 - kappa) * drop) / 4,
    elevationDipRad: d / (2 * radius),
    refractionAngleAtEndRad: (kappa * d) / (2 * radius),
    effectiveRadiusFactor: 1 / (1 - kappa),
  };
}

/**
 * Surveyors' combined curvature-and-refraction correction 0.0675·K² [m] with K in km (κ ≈ 0.14 built in).
 * @param distanceM D [m], ≥ 0
 * @returns drop [m]
 * @see Ghilani C.D., Wolf P.R., "Elementary Surveying: An Introduction to Geomatics", Pearson, ch. 4
 *   (combined curvature and refraction, h_cr = 0.0675 K²).
 */
export function surveyingCurvatureRefractionDropM(distanceM: number): number {
  const km = distanceM / 1000;
  return 0.0675 * km * km;
}

/**
 * Earth bulge (with refraction) at distance d1 from one end and d2 from the other: (1 − κ)·d1·d2/(2R).
 * @param d1M distance from A [m], ≥ 0
 * @param d2M distance from B [m], ≥ 0
 * @param refractionCoefficient κ (default 0.13)
 * @param earthRadiusM R [m] (default 6 371 000)
 * @returns bulge [m]
 * @see Brunner (1984); standard path-profile geometry.
 */
export function earthBulgeM(d1M: number, d2M: number, refractionCoefficient = DEFAULT_REFRACTION_COEFFICIENT, earthRadiusM = MEAN_EARTH_RADIUS_M): number {
  return ((1 - refractionCoefficient) * d1M * d2M) / (2 * earthRadiusM);
}

/**
 * First Fresnel-zone radius sqrt(λ·d1·d2/(d1 + d2)) (centimetres for optical links).
 * @param wavelengthM λ [m], > 0
 * @param d1M distance from A [m], ≥ 0
 * @param d2M distance from B [m], ≥ 0
 * @returns radius [m]
 * @see Born M., Wolf E., "Principles of Optics", 7th ed., Cambridge (1999), §8.2 (Fresnel zones).
 */
export function fresnelRadiusM(wavelengthM: number, d1M: number, d2M: number): number {
  return Math.sqrt((wavelengthM * d1M * d2M) / (d1M + d2M));
}

/** An obstacle along the path: distance from A along the path [m] and top height on the sites' datum [m]. */
export interface PathObstacle {
  distanceFromAM: number;
  heightM: number;
  /** Free label shown back in the result. */
  label?: string;
}

/** Beam of each terminal, used to draw the beam envelope (both terminals assumed alike). */
export interface ClearanceBeam {
  /** Vacuum wavelength [m], > 0. */
  wavelengthM: number;
  /** 1/e² radius at the transmit aperture [m], > 0. */
  apertureBeamRadiusM: number;
  /** Datasheet 1/e² half-angle [rad] (omitted: collimated). */
  halfAngleDivergenceRad?: number;
  /** M² ≥ 1 (default 1). */
  m2?: number;
}

/** Input of {@link lineOfSightClearance}. */
export interface LineOfSightClearanceInput {
  /** Terminal height at A [m] (same datum as B and the obstacles). */
  heightAM: number;
  /** Terminal height at B [m]. */
  heightBM: number;
  /** Path length D [m], > 0. */
  distanceM: number;
  obstacles: readonly PathObstacle[];
  /** κ (default 0.13). Check a pessimistic κ (e.g. −0.5) too: near the ground it ranges about −1 … +1. */
  refractionCoefficient?: number;
  /** R [m] (default 6 371 000). */
  earthRadiusM?: number;
  /** Beam of the terminals; when given, the clearance must exceed the larger of the two beams' radii. */
  beam?: ClearanceBeam;
  /** Extra allowance (pointing error, tree growth, cranes, eye-safety separation) [m], ≥ 0 (default 0). */
  allowanceM?: number;
}

/** Clearance of one obstacle. */
export interface ObstacleClearance extends PathObstacle {
  /** Height of the (refracted) ray above the datum at the obstacle [m]. */
  rayHeightM: number;
  /** Earth bulge with refraction at the obstacle [m]. */
  earthBulgeM: number;
  /** Ray height − obstacle height [m] (negative: the line of sight is blocked). */
  clearanceM: number;
  /** First Fresnel radius [m] (null without a beam, which carries the wavelength). */
  fresnelRadiusM: number | null;
  /** Larger of the two beams' 1/e² radii at the obstacle [m] (0 without a beam). */
  beamRadiusM: number;
  /** Beam radius + allowance [m]. */
  requiredClearanceM: number;
  /** clearanceM − requiredClearanceM [m]. */
  marginM: number;
  /** True when marginM ≥ 0. */
  clear: boolean;
}

/** Result of {@link lineOfSightClearance}. */
export interface LineOfSightClearance {
  obstacles: ObstacleClearance[];
  /** Smallest margin over all obstacles [m] (Infinity when there are none). */
  minimumMarginM: number;
  /** True when every obstacle clears the beam envelope. */
  allClear: boolean;
}

/**
 * Line-of-sight clearance of obstacles along a path: the ray height at distance d1 from A is
 * h_A + (h_B − h_A)·d1/D − (1 − κ)·d1·d2/(2R); the clearance is that height minus the obstacle's,
 * compared with the beam envelope (larger of the beam radii from either end) plus an allowance.
 *
 * @param input see {@link LineOfSightClearanceInput}
 * @returns per-obstacle clearances [m] and verdicts
 * @throws RangeError naming the field for out-of-range input
 * @see Brunner (1984) (refraction coefficient); path-profile geometry as in ITU-R P.530 (with the
 *   optical κ in place of the radio k-factor); Andrews & Phillips (2005), ch. 4 (beam radius).
 */
export function lineOfSightClearance(input: LineOfSightClearanceInput): LineOfSightClearance {
  const kappa = input.refractionCoefficient ?? DEFAULT_REFRACTION_COEFFICIENT;
  const radius = input.earthRadiusM ?? MEAN_EARTH_RADIUS_M;
  const allowance = input.allowanceM ?? 0;
  const total = input.distanceM;
  if (!(total > 0) || !Number.isFinite(total)) throw new RangeError('distanceM must be a finite number > 0');
  if (!Number.isFinite(input.heightAM)) throw new RangeError('heightAM must be a finite number');
  if (!Number.isFinite(input.heightBM)) throw new RangeError('heightBM must be a finite number');
  if (!(allowance >= 0) || !Number.isFinite(allowance)) throw new RangeError('allowanceM must be a finite number ≥ 0');
  const beam = input.beam;
  const results: ObstacleClearance[] = input.obstacles.map((obstacle, index) => {
    const d1 = obstacle.distanceFromAM;
    if (!(d1 >= 0 && d1 <= total)) throw new RangeError(`obstacles[${index}].distanceFromAM must be between 0 and distanceM`);
    if (!Number.isFinite(obstacle.heightM)) throw new RangeError(`obstacles[${index}].heightM must be a finite number`);
    const d2 = total - d1;
    const bulge = earthBulgeM(d1, d2, kappa, radius);
    const rayHeightM = input.heightAM + ((input.heightBM - input.heightAM) * d1) / total - bulge;
    const clearanceM = rayHeightM - obstacle.heightM;
    let beamRadiusM = 0;
    let fresnel: number | null = null;
    if (beam) {
      const theta = beam.halfAngleDivergenceRad ?? 0;
      const m2 = beam.m2 ?? 1;
      beamRadiusM = Math.max(
        launchBeamRadiusAtRangeM(beam.wavelengthM, beam.apertureBeamRadiusM, theta, m2, d1),
        launchBeamRadiusAtRangeM(beam.wavelengthM, beam.apertureBeamRadiusM, theta, m2, d2),
      );
      fresnel = fresnelRadiusM(beam.wavelengthM, d1, d2);
    }
    const requiredClearanceM = beamRadiusM + allowance;
    const marginM = clearanceM - requiredClearanceM;
    return { ...obstacle, rayHeightM, earthBulgeM: bulge, clearanceM, fresnelRadiusM: fresnel, beamRadiusM, requiredClearanceM, marginM, clear: marginM >= 0 };
  });
  const minimumMarginM = results.reduce((min, result) => Math.min(min, result.marginM), Infinity);
  return { obstacles: results, minimumMarginM, allClear: results.every((result) => result.clear) };
}
