import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { gaussianBeam, beamRadiusFromWaistM, rayleighRangeM } from './gaussian-beam.js';
import { encircledPowerFraction, gaussianIntensityWPerM2, gaussianPeakIntensityWPerM2 } from './intensity.js';
import { andrewsPhillipsBeamParameters, beamRadiusAtRangeM, defocusedLaunch, launchBeamRadiusAtRangeM } from './launch.js';
import { integrate } from '../numeric/quadrature.js';

const wavelengthM = 1.55e-6;

describe('gaussianBeam: identities of Kogelnik & Li (1966) / Siegman (1986) ch. 17', () => {
  const beam = gaussianBeam({ wavelengthM, waistRadiusM: 0.01 });
  const zR = beam.rayleighRangeM;

  it('w(z_R) = √2·w0 and R(z_R) = 2·z_R', () => {
    expect(beam.radiusAtM(zR) / beam.waistRadiusM).toBeCloseTo(Math.SQRT2, 14);
    expect(beam.wavefrontRadiusAtM(zR) / zR).toBeCloseTo(2, 14);
  });
  it('the smallest |R(z)| is at z = z_R', () => {
    for (const factor of [0.5, 0.9, 0.99, 1.01, 1.1, 2, 10]) {
      expect(Math.abs(beam.wavefrontRadiusAtM(factor * zR))).toBeGreaterThan(2 * zR);
    }
  });
  it('R is infinite at the waist and odd in z; the Gouy phase is π/4 at z_R', () => {
    expect(beam.wavefrontRadiusAtM(0)).toBe(Infinity);
    expect(beam.wavefrontRadiusAtM(-50)).toBeCloseTo(-beam.wavefrontRadiusAtM(50), 9);
    expect(beam.gouyPhaseAtRad(zR)).toBeCloseTo(Math.PI / 4, 15);
  });
  it('beam parameter product w0·θ = λ/π and w(z) → θ·z in the far field', () => {
    expect(beam.beamParameterProductMRad).toBeCloseTo(wavelengthM / Math.PI, 20);
    const z = 1e4 * zR;
    expect(beam.radiusAtM(z) / beam.farFieldRadiusAtM(z)).toBeCloseTo(1, 7);
  });
  it('M² scales z_R by 1/M² and θ by M² for the same waist (ISO 11146-1 embedded Gaussian)', () => {
    const real = gaussianBeam({ wavelengthM, waistRadiusM: 0.01, m2: 1.5 });
    expect(real.rayleighRangeM).toBeCloseTo(zR / 1.5, 10);
    expect(real.halfAngleDivergenceRad / beam.halfAngleDivergenceRad).toBeCloseTo(1.5, 14);
  });
  it('a refractive index n lengthens z_R by n (wavelength λ/n in the medium)', () => {
    expect(gaussianBeam({ wavelengthM, waistRadiusM: 0.01, refractiveIndex: 1.5 }).rayleighRangeM / zR).toBeCloseTo(1.5, 14);
  });
  it('rejects bad input naming the field', () => {
    expect(() => gaussianBeam({ wavelengthM: 0, waistRadiusM: 0.01 })).toThrow(/wavelengthM/);
    expect(() => gaussianBeam({ wavelengthM, waistRadiusM: Number.NaN })).toThrow(/waistRadiusM/);
    expect(() => gaussianBeam({ wavelengthM, waistRadiusM: 0.01, m2: 0.5 })).toThrow(/m2/);
    expect(() => gaussianBeam({ wavelengthM, waistRadiusM: 0.01, refractiveIndex: -1 })).toThrow(/refractiveIndex/);
  });
  it('w(z) ≥ w0 and w(z) = w(−z) for any beam and distance (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 3e-7, max: 1.1e-5, noNaN: true }),
        fc.double({ min: 1e-5, max: 0.5, noNaN: true }),
        fc.double({ min: 1, max: 50, noNaN: true }),
        fc.double({ min: -1e5, max: 1e5, noNaN: true }),
        (lambda, w0, m2, z) => {
          const b = gaussianBeam({ wavelengthM: lambda, waistRadiusM: w0, m2 });
          return b.radiusAtM(z) >= w0 && b.radiusAtM(z) === b.radiusAtM(-z);
        },
      ),
    );
  });
});

describe('Gaussian intensity profile', () => {
  it('integrates to the beam power over the plane (2π∫ I r dr = P)', () => {
    const power = 0.01;
    const w = 0.003;
    const total = 2 * Math.PI * integrate((r) => gaussianIntensityWPerM2(power, w, r) * r, 0, 10 * w);
    expect(total).toBeCloseTo(power, 14);
  });
  it('encloses 86.5 % within w and 50 % within the FWHM radius', () => {
    expect(encircledPowerFraction(1, 1)).toBeCloseTo(1 - Math.exp(-2), 15);
    expect(encircledPowerFraction(1, Math.sqrt(Math.LN2 / 2))).toBeCloseTo(0.5, 15);
    expect(gaussianPeakIntensityWPerM2(Math.PI / 2, 1)).toBeCloseTo(1, 15);
  });
});

describe('launch: Andrews & Phillips parameters and the defocused terminal', () => {
  it('collimated W(L) equals w(z) of the waist formula (METHODS.md §1.4, Andrews & Phillips 2005 ch. 4)', () => {
    const parameters = andrewsPhillipsBeamParameters({ wavelengthM, apertureBeamRadiusM: 0.025, phaseFrontRadiusM: Infinity, rangeM: 1000 });
    expect(parameters.beamRadiusM).toBeCloseTo(beamRadiusFromWaistM(0.025, rayleighRangeM(wavelengthM, 0.025), 1000), 14);
  });
  it('a beam focused on the receiver (F0 = L) has Θ0 = 0 and W(L) = λL/(πW0)', () => {
    const parameters = andrewsPhillipsBeamParameters({ wavelengthM, apertureBeamRadiusM: 0.025, phaseFrontRadiusM: 500, rangeM: 500 });
    expect(parameters.theta0).toBe(0);
    expect(parameters.beamRadiusM).toBeCloseTo((wavelengthM * 500) / (Math.PI * 0.025), 15);
  });
  it('the defocused launch reproduces the datasheet divergence in the far field', () => {
    const theta = 1e-3;
    const far = launchBeamRadiusAtRangeM(wavelengthM, 0.025, theta, 1, 1e8);
    expect(far / 1e8).toBeCloseTo(theta, 9);
    const launch = defocusedLaunch({ wavelengthM, apertureBeamRadiusM: 0.025, halfAngleDivergenceRad: theta });
    expect(launch.phaseFrontRadiusM).toBeLessThan(0);
    expect(launch.collimated).toBe(false);
  });
  it('is collimated when θ is missing or below the diffraction limit, and continuous at the limit', () => {
    const limit = wavelengthM / (Math.PI * 0.025);
    const collimated = beamRadiusAtRangeM({ wavelengthM, apertureBeamRadiusM: 0.025, rangeM: 2000 });
    expect(beamRadiusAtRangeM({ wavelengthM, apertureBeamRadiusM: 0.025, halfAngleDivergenceRad: limit / 2, rangeM: 2000 })).toBe(collimated);
    expect(beamRadiusAtRangeM({ wavelengthM, apertureBeamRadiusM: 0.025, halfAngleDivergenceRad: limit * (1 + 1e-12), rangeM: 2000 })).toBeCloseTo(collimated, 6);
    expect(defocusedLaunch({ wavelengthM, apertureBeamRadiusM: 0.025, halfAngleDivergenceRad: limit / 2 }).phaseFrontRadiusM).toBe(Infinity);
  });
  it('rejects bad input naming the field', () => {
    expect(() => beamRadiusAtRangeM({ wavelengthM, apertureBeamRadiusM: 0.025, rangeM: -1 })).toThrow(/rangeM/);
    expect(() => beamRadiusAtRangeM({ wavelengthM, apertureBeamRadiusM: 0.025, halfAngleDivergenceRad: Number.POSITIVE_INFINITY, rangeM: 1 })).toThrow(/halfAngleDivergenceRad/);
  });
  it('W(L) grows with range and with divergence, never below W0 (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-3, max: 0.1, noNaN: true }),
        fc.double({ min: 0, max: 5e-3, noNaN: true }),
        fc.double({ min: 0, max: 2e4, noNaN: true }),
        fc.double({ min: 0, max: 1e3, noNaN: true }),
        (w0, theta, range, extra) => {
          const near = launchBeamRadiusAtRangeM(wavelengthM, w0, theta, 1, range);
          const farther = launchBeamRadiusAtRangeM(wavelengthM, w0, theta, 1, range + extra);
          const wider = launchBeamRadiusAtRangeM(wavelengthM, w0, theta * 1.5, 1, range);
          return near >= w0 && farther >= near && wider >= near;
        },
      ),
    );
  });
});
