import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { formatDegreesMinutesSeconds, geodesicInverse, geodeticToEcef, normaliseAzimuthDeg, parseDegreesMinutesSeconds } from './geodesy.js';
import { earthCurvature, lineOfSightClearance, linkGeometry } from './link-geometry.js';
import { launchBeamRadiusAtRangeM } from '../beam/launch.js';

describe('geodeticToEcef', () => {
  it('puts the equator/prime meridian at (a, 0, 0) and the pole at (0, 0, b) on WGS84', () => {
    const equator = geodeticToEcef(0, 0, 0);
    expect(equator.xM).toBe(6378137);
    const pole = geodeticToEcef(90, 0, 0);
    // b = a(1 − f) = 6 356 752.314 245 m (NIMA TR8350.2, table 3.3)
    expect(pole.zM).toBeCloseTo(6356752.314245, 5);
  });
});

describe('linkGeometry', () => {
  const a = { latDeg: 52.52, lonDeg: 13.405, heightM: 60 };
  const b = { latDeg: 52.53, lonDeg: 13.43, heightM: 95 };

  it('is consistent between directions: same distance, swapped azimuths and elevations', () => {
    const forward = linkGeometry({ a, b });
    const backward = linkGeometry({ a: b, b: a });
    expect(backward.distanceM).toBeCloseTo(forward.distanceM, 8);
    expect(backward.azimuthAtoBDeg).toBeCloseTo(forward.azimuthBtoADeg, 9);
    expect(backward.elevationAtoBDeg).toBeCloseTo(forward.elevationBtoADeg, 12);
    expect(backward.slantRangeM).toBeCloseTo(forward.slantRangeM, 8);
  });
  it('end elevations differ by the horizon tilt D/R (not negatives of each other)', () => {
    const geometry = linkGeometry({ a, b });
    const tiltDeg = ((geometry.distanceM / 6371000) * 180) / Math.PI;
    expect(geometry.elevationAtoBDeg + geometry.elevationBtoADeg).toBeCloseTo(-tiltDeg, 4);
  });
  it('the slant range is close to sqrt(D² + Δh²) for a short link and the ENU azimuth matches the geodesic one', () => {
    const geometry = linkGeometry({ a, b });
    expect(geometry.slantRangeM).toBeCloseTo(Math.hypot(geometry.distanceM, 35), 0);
    expect(Math.abs(geometry.enuAzimuthAtoBDeg - geometry.azimuthAtoBDeg)).toBeLessThan(1e-4);
  });
  it('reports refraction apart: apparent = geometric + κ·s/(2R)', () => {
    const geometry = linkGeometry({ a, b, refractionCoefficient: -0.5 });
    expect(geometry.apparentElevationAtoBDeg - geometry.elevationAtoBDeg).toBeCloseTo(((-0.5 * geometry.slantRangeM) / (2 * 6371000)) * (180 / Math.PI), 14);
  });
  it('rejects bad sites naming the field', () => {
    expect(() => linkGeometry({ a: { ...a, latDeg: 91 }, b })).toThrow(/a\.latDeg/);
    expect(() => linkGeometry({ a, b: { ...b, heightM: Number.NaN } })).toThrow(/b\.heightM/);
  });
  it('returns azimuths in [0, 360) for any pair of distinct points (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -89, max: 89, noNaN: true }),
        fc.double({ min: -180, max: 180, noNaN: true }),
        fc.double({ min: -0.2, max: 0.2, noNaN: true }),
        fc.double({ min: -0.2, max: 0.2, noNaN: true }),
        (lat, lon, dLat, dLon) => {
          fc.pre(Math.abs(dLat) + Math.abs(dLon) > 1e-6);
          const geometry = linkGeometry({ a: { latDeg: lat, lonDeg: lon, heightM: 10 }, b: { latDeg: Math.max(-90, Math.min(90, lat + dLat)), lonDeg: lon + dLon, heightM: 20 } });
          return [geometry.azimuthAtoBDeg, geometry.azimuthBtoADeg].every((az) => az >= 0 && az < 360) && geometry.slantRangeM > 0;
        },
      ),
    );
  });
});

describe('geodesicInverse', () => {
  it('quarter meridian on WGS84 is 10 001 965.729 m (GeographicLib documentation; value recalled from memory)', () => {
    expect(geodesicInverse({ lat1Deg: 0, lon1Deg: 0, lat2Deg: 90, lon2Deg: 0 }).distanceM).toBeCloseTo(10001965.729, 3);
  });
  it('reverse azimuth is the forward azimuth at the far end ± 180°', () => {
    const result = geodesicInverse({ lat1Deg: 10, lon1Deg: 20, lat2Deg: 11, lon2Deg: 22 });
    expect(normaliseAzimuthDeg(result.forwardAzimuthAt2Deg + 180)).toBeCloseTo(result.azimuth2to1Deg, 12);
  });
});

describe('earth curvature and line-of-sight clearance', () => {
  it('κ = 0.13 gives the effective radius factor 1.15 and a 1.707 m refracted mid-path bulge over 10 km', () => {
    const curvature = earthCurvature({ distanceM: 10000 });
    expect(curvature.effectiveRadiusFactor).toBeCloseTo(1 / 0.87, 14);
    expect(curvature.midpointBulgeWithRefractionM).toBeCloseTo((0.87 * 1e8) / (8 * 6371000), 12);
  });
  it('checks each obstacle against the larger beam radius from either end plus the allowance', () => {
    const beam = { wavelengthM: 1.55e-6, apertureBeamRadiusM: 0.025, halfAngleDivergenceRad: 1e-3 };
    const result = lineOfSightClearance({
      heightAM: 50,
      heightBM: 80,
      distanceM: 4000,
      obstacles: [
        { distanceFromAM: 1500, heightM: 55, label: 'crane' },
        { distanceFromAM: 3900, heightM: 78.5, label: 'parapet' },
      ],
      beam,
      allowanceM: 0.5,
    });
    const [crane, parapet] = result.obstacles;
    expect(crane!.beamRadiusM).toBeCloseTo(launchBeamRadiusAtRangeM(1.55e-6, 0.025, 1e-3, 1, 2500), 14);
    expect(crane!.clear).toBe(true);
    expect(parapet!.clearanceM).toBeGreaterThan(0);
    expect(parapet!.clear).toBe(false);
    expect(result.allClear).toBe(false);
    expect(result.minimumMarginM).toBe(parapet!.marginM);
  });
  it('rejects an obstacle beyond the path', () => {
    expect(() => lineOfSightClearance({ heightAM: 1, heightBM: 1, distanceM: 100, obstacles: [{ distanceFromAM: 150, heightM: 0 }] })).toThrow(/obstacles\[0\]/);
  });
});

describe('degrees, minutes and seconds', () => {
  it('formats with carry and parses back', () => {
    expect(formatDegreesMinutesSeconds(306.8681592, { secondsDecimals: 2 })).toBe('306°52′05.37″');
    expect(formatDegreesMinutesSeconds(10.999999999, { secondsDecimals: 2, style: 'ascii' })).toBe("11d00'00.00\"");
    expect(parseDegreesMinutesSeconds('37 57 3.7203 S')).toBeCloseTo(-(37 + 57 / 60 + 3.7203 / 3600), 14);
    expect(parseDegreesMinutesSeconds('37°61′')).toBeNull();
    expect(parseDegreesMinutesSeconds('north')).toBeNull();
  });
  it('round-trips any angle to the printed precision (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: -180, max: 360, noNaN: true }), (angle) => {
        const parsed = parseDegreesMinutesSeconds(formatDegreesMinutesSeconds(angle, { secondsDecimals: 4 }));
        return parsed !== null && Math.abs(parsed - angle) <= 0.5e-4 / 3600 + 1e-12;
      }),
    );
  });
});
