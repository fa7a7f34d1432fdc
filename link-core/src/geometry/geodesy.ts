/**
 * Geodesics on the ellipsoid (Karney's algorithm through geographiclib-geodesic) and
 * geodetic ↔ ECEF ↔ local East-North-Up conversions.
 */
import geodesicLibrary from 'geographiclib-geodesic';
import { WGS84_ELLIPSOID, type Ellipsoid } from '../units/constants.js';

/** Result of {@link geodesicInverse}. Azimuths are true, clockwise from north, in [0, 360). */
export interface GeodesicInverse {
  /** Geodesic distance s12 [m]. */
  distanceM: number;
  /** Azimuth at point 1 towards point 2 [deg]. */
  azimuth1to2Deg: number;
  /** Forward azimuth of the geodesic at point 2 (direction of travel, continuing past 2) [deg]. */
  forwardAzimuthAt2Deg: number;
  /** Azimuth at point 2 back towards point 1 = forward azimuth + 180° [deg]. */
  azimuth2to1Deg: number;
}

/**
 * Normalises an angle in degrees to [0, 360) (azimuths: true, clockwise from north).
 * @param angleDeg any finite angle [deg]
 * @returns the same direction in [0, 360) [deg]
 * @see common practice (azimuth convention of METHODS.md §0).
 */
export function normaliseAzimuthDeg(angleDeg: number): number {
  const wrapped = angleDeg % 360;
  const positive = wrapped < 0 ? wrapped + 360 : wrapped;
  return positive === 360 ? 0 : positive;
}

const geodesicCache = new Map<string, InstanceType<typeof geodesicLibrary.Geodesic.Geodesic>>();

function geodesicFor(ellipsoid: Ellipsoid): InstanceType<typeof geodesicLibrary.Geodesic.Geodesic> {
  if (ellipsoid.equatorialRadiusM === WGS84_ELLIPSOID.equatorialRadiusM && ellipsoid.flattening === WGS84_ELLIPSOID.flattening) {
    return geodesicLibrary.Geodesic.WGS84;
  }
  const key = `${ellipsoid.equatorialRadiusM}/${ellipsoid.flattening}`;
  let geodesic = geodesicCache.get(key);
  if (!geodesic) {
    geodesic = new geodesicLibrary.Geodesic.Geodesic(ellipsoid.equatorialRadiusM, ellipsoid.flattening);
    geodesicCache.set(key, geodesic);
  }
  return geodesic;
}

function checkLatLon(latDeg: number, lonDeg: number, field: string): void {
  if (!Number.isFinite(latDeg) || latDeg < -90 || latDeg > 90) throw new RangeError(`${field}.latDeg must be in [−90, 90]`);
  if (!Number.isFinite(lonDeg) || lonDeg < -540 || lonDeg > 540) throw new RangeError(`${field}.lonDeg must be a finite longitude in degrees`);
}

/**
 * Inverse geodesic problem: distance and azimuths between two points on an ellipsoid, robust for
 * all point pairs including nearly antipodal ones (where Vincenty's iteration fails).
 *
 * @param input lat1Deg, lon1Deg, lat2Deg, lon2Deg [deg] (latitudes in [−90, 90]); ellipsoid (default WGS84)
 * @returns distance [m] and azimuths [deg] in [0, 360)
 * @throws RangeError naming the field for out-of-range coordinates
 * @see Karney C.F.F., "Algorithms for geodesics", J. Geodesy 87(1), 43–55 (2013), inverse problem
 *   (implementation: geographiclib-geodesic 2.2.0 by the same author).
 */
export function geodesicInverse(input: { lat1Deg: number; lon1Deg: number; lat2Deg: number; lon2Deg: number; ellipsoid?: Ellipsoid }): GeodesicInverse {
  checkLatLon(input.lat1Deg, input.lon1Deg, 'point1');
  checkLatLon(input.lat2Deg, input.lon2Deg, 'point2');
  const result = geodesicFor(input.ellipsoid ?? WGS84_ELLIPSOID).Inverse(input.lat1Deg, input.lon1Deg, input.lat2Deg, input.lon2Deg);
  const azi1 = result.azi1 ?? NaN;
  const azi2 = result.azi2 ?? NaN;
  return {
    distanceM: result.s12 ?? NaN,
    azimuth1to2Deg: normaliseAzimuthDeg(azi1),
    forwardAzimuthAt2Deg: normaliseAzimuthDeg(azi2),
    azimuth2to1Deg: normaliseAzimuthDeg(azi2 + 180),
  };
}

/** Earth-centred, Earth-fixed coordinates [m]. */
export interface Ecef {
  xM: number;
  yM: number;
  zM: number;
}

/**
 * Geodetic latitude, longitude and ellipsoidal height to ECEF:
 * N = a/sqrt(1 − e² sin²φ), X = (N+h)cosφ cosλ, Y = (N+h)cosφ sinλ, Z = (N(1−e²)+h) sinφ.
 *
 * @param latDeg φ [deg], lonDeg λ [deg], heightM h above the ellipsoid [m]
 * @param ellipsoid default WGS84
 * @returns ECEF [m]
 * @see Hofmann-Wellenhof B., Lichtenegger H., Wasle E., "GNSS — Global Navigation Satellite Systems",
 *   Springer (2008), §10.2.1 (ellipsoidal to Cartesian coordinates).
 */
export function geodeticToEcef(latDeg: number, lonDeg: number, heightM: number, ellipsoid: Ellipsoid = WGS84_ELLIPSOID): Ecef {
  const f = ellipsoid.flattening;
  const eSquared = f * (2 - f);
  const phi = (latDeg * Math.PI) / 180;
  const lambda = (lonDeg * Math.PI) / 180;
  const sinPhi = Math.sin(phi);
  const cosPhi = Math.cos(phi);
  const n = ellipsoid.equatorialRadiusM / Math.sqrt(1 - eSquared * sinPhi * sinPhi);
  return {
    xM: (n + heightM) * cosPhi * Math.cos(lambda),
    yM: (n + heightM) * cosPhi * Math.sin(lambda),
    zM: (n * (1 - eSquared) + heightM) * sinPhi,
  };
}

/** Local East-North-Up vector [m]. */
export interface Enu {
  eastM: number;
  northM: number;
  upM: number;
}

/**
 * Vector from one site to another in the local East-North-Up frame of the first site
 * (the up axis is the ellipsoid normal at the first site).
 *
 * @param from origin site (lat/lon [deg], height [m])
 * @param to target site
 * @param ellipsoid default WGS84
 * @returns ENU components [m]
 * @see Hofmann-Wellenhof et al. (2008), §10.2.3 (local-level system).
 */
export function enuVector(
  from: { latDeg: number; lonDeg: number; heightM: number },
  to: { latDeg: number; lonDeg: number; heightM: number },
  ellipsoid: Ellipsoid = WGS84_ELLIPSOID,
): Enu {
  const a = geodeticToEcef(from.latDeg, from.lonDeg, from.heightM, ellipsoid);
  const b = geodeticToEcef(to.latDeg, to.lonDeg, to.heightM, ellipsoid);
  const dx = b.xM - a.xM;
  const dy = b.yM - a.yM;
  const dz = b.zM - a.zM;
  const phi = (from.latDeg * Math.PI) / 180;
  const lambda = (from.lonDeg * Math.PI) / 180;
  const sinPhi = Math.sin(phi);
  const cosPhi = Math.cos(phi);
  const sinLambda = Math.sin(lambda);
  const cosLambda = Math.cos(lambda);
  return {
    eastM: -sinLambda * dx + cosLambda * dy,
    northM: -sinPhi * cosLambda * dx - sinPhi * sinLambda * dy + cosPhi * dz,
    upM: cosPhi * cosLambda * dx + cosPhi * sinLambda * dy + sinPhi * dz,
  };
}

/**
 * Formats an angle in degrees as degrees, minutes and seconds, e.g. 306°52′05.37″ or, in ASCII,
 * 306d52'05.37". Rounding carries into minutes and degrees (never 60″).
 *
 * @param angleDeg angle [deg] (negative values get a leading minus)
 * @param options secondsDecimals (default 2), style 'symbols' (° ′ ″, default) or 'ascii' (d ' ")
 * @returns the formatted angle
 * @see ISO 80000-3:2019 (degree, minute, second of arc).
 */
export function formatDegreesMinutesSeconds(angleDeg: number, options: { secondsDecimals?: number; style?: 'symbols' | 'ascii' } = {}): string {
  const decimals = options.secondsDecimals ?? 2;
  const [degreeMark, minuteMark, secondMark] = options.style === 'ascii' ? ['d', "'", '"'] : ['°', '′', '″'];
  const sign = angleDeg < 0 ? '-' : '';
  const scale = Math.pow(10, decimals);
  // Work in integer units of the last printed decimal of a second so that rounding carries correctly.
  const totalUnits = Math.round(Math.abs(angleDeg) * 3600 * scale);
  const unitsPerMinute = 60 * scale;
  const unitsPerDegree = 3600 * scale;
  const degrees = Math.floor(totalUnits / unitsPerDegree);
  const minutes = Math.floor((totalUnits - degrees * unitsPerDegree) / unitsPerMinute);
  const secondUnits = totalUnits - degrees * unitsPerDegree - minutes * unitsPerMinute;
  const seconds = (secondUnits / scale).toFixed(decimals).padStart(decimals > 0 ? decimals + 3 : 2, '0');
  return `${sign}${degrees}${degreeMark}${String(minutes).padStart(2, '0')}${minuteMark}${seconds}${secondMark}`;
}

/**
 * Parses an angle written in degrees, minutes and seconds (or decimal degrees) into decimal degrees.
 * Accepts ° ′ ″ (or d ' " and the ASCII apostrophes), spaces as separators, a leading sign or a
 * trailing hemisphere letter N/S/E/W (S and W negative): "−37°57′03.72030″", "144d25'29.5244\"E",
 * "37 57 3.7203 S", "-37.95".
 *
 * @param text the angle as typed
 * @returns decimal degrees, or null when the text is not an angle (minutes or seconds ≥ 60 are rejected)
 * @see ISO 6709:2022, "Standard representation of geographic point location by coordinates" (sexagesimal forms).
 */
export function parseDegreesMinutesSeconds(text: string): number | null {
  const trimmed = text.trim().replace(/[−–]/g, '-');
  const match = /^([+-])?\s*(\d+(?:\.\d+)?)\s*(?:°|d)?\s*(?:(\d+(?:\.\d+)?)\s*(?:′|')?\s*(?:(\d+(?:\.\d+)?)\s*(?:″|"|'')?)?)?\s*([NSEWnsew])?$/.exec(trimmed);
  if (!match) return null;
  const [, sign, degreesText, minutesText, secondsText, hemisphere] = match;
  const degrees = Number(degreesText);
  const minutes = minutesText ? Number(minutesText) : 0;
  const seconds = secondsText ? Number(secondsText) : 0;
  if (!Number.isFinite(degrees) || minutes >= 60 || seconds >= 60) return null;
  if ((minutesText || secondsText) && !Number.isInteger(degrees)) return null;
  const negative = sign === '-' || (hemisphere !== undefined && /[SWsw]/.test(hemisphere));
  if (sign === '-' && hemisphere !== undefined && /[SWsw]/.test(hemisphere)) return null;
  const value = degrees + minutes / 60 + seconds / 3600;
  return negative ? -value : value;
}
