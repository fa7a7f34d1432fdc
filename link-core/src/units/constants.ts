/**
 * Physical and geodetic constants used across link-core (SI units unless the name says otherwise).
 */

/** Decibels per unit of natural log of a power ratio: 10/ln 10 ≈ 4.3429 dB. A power ratio e^(−x) is 4.3429·x dB. */
export const DB_PER_NATURAL_LOG_POWER = 10 / Math.LN10;

/**
 * WGS84 ellipsoid: equatorial radius 6 378 137 m, flattening 1/298.257223563.
 * @see NIMA TR8350.2, "Department of Defense World Geodetic System 1984", 3rd ed. (2000), table 3.1.
 */
export const WGS84_ELLIPSOID = { equatorialRadiusM: 6378137, flattening: 1 / 298.257223563 } as const;

/**
 * GRS80 ellipsoid: equatorial radius 6 378 137 m, flattening 1/298.257222101.
 * @see Moritz H., "Geodetic Reference System 1980", Bulletin Géodésique 54(3), 395–405 (1980).
 */
export const GRS80_ELLIPSOID = { equatorialRadiusM: 6378137, flattening: 1 / 298.257222101 } as const;

/** An ellipsoid of revolution: equatorial radius [m] and flattening (dimensionless, 0 ≤ f < 1). */
export interface Ellipsoid {
  equatorialRadiusM: number;
  flattening: number;
}

/** Mean Earth radius used in curvature and refraction formulas [m] (IUGG mean radius R1, rounded). */
export const MEAN_EARTH_RADIUS_M = 6371000;

/**
 * Classical geodetic refraction coefficient κ for optical rays near the ground (Gauss), dimensionless.
 * The ray curvature is κ/R. Radio's 4/3-Earth (κ = 0.25) does not apply to optical links.
 * @see Brunner F.K. (ed.), "Geodetic Refraction", Springer (1984), ch. 1 (κ ≈ 0.13).
 */
export const DEFAULT_REFRACTION_COEFFICIENT = 0.13;
