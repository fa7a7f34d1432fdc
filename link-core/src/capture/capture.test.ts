import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  annularCaptureFraction,
  annularCaptureFractionStable,
  centredCaptureFraction,
  captureFraction,
  faridHranilovicCaptureFraction,
  fieldOfViewCheck,
  logCentredAnnularCapture,
  logOffsetAnnularCapture,
  logRicianAnnulusProbability,
  offsetForRelativeCapture,
  topHatCaptureRatio,
} from './capture.js';
import { integrate } from '../numeric/quadrature.js';
import { besselI0Scaled } from '../numeric/bessel.js';

// Independent path: the Bessel-I0 radial integral written with the scaled Bessel function (METHODS.md §3.2).
function captureByQuadrature(w: number, a: number, r0: number): number {
  return integrate((r) => ((4 * r) / (w * w)) * Math.exp((-2 * (r - r0) ** 2) / (w * w)) * besselI0Scaled((4 * r * r0) / (w * w)), 0, a, {
    absoluteTolerance: 1e-300,
    relativeTolerance: 1e-12,
  });
}

// Second independent path: brute 2-D integral over the disc in Cartesian coordinates.
function captureByCartesianQuadrature(w: number, a: number, r0: number): number {
  const inner = (x: number): number => {
    const half = Math.sqrt(Math.max(a * a - x * x, 0));
    return integrate((y) => (2 / (Math.PI * w * w)) * Math.exp((-2 * ((x - r0) ** 2 + y * y)) / (w * w)), -half, half, { relativeTolerance: 1e-11 });
  };
  return integrate(inner, -a, a, { relativeTolerance: 1e-10 });
}

describe('captureFraction', () => {
  it('centred: 1 − exp(−2a²/w²)', () => {
    expect(captureFraction({ beamRadiusM: 1, apertureRadiusM: 1 })).toBeCloseTo(1 - Math.exp(-2), 15);
  });
  it('offset: agrees with the Bessel-I0 radial integral and the Cartesian 2-D integral', () => {
    for (const [w, a, r0] of [[0.5, 0.05, 0.1], [0.15, 0.1, 0.2], [2, 0.05, 2], [0.05, 0.05, 0.2], [1, 0.5, 3]] as const) {
      const exact = captureFraction({ beamRadiusM: w, apertureRadiusM: a, offsetM: r0 });
      expect(Math.abs(exact - captureByQuadrature(w, a, r0)) / exact).toBeLessThan(1e-9);
      // The disc edge makes the inner integrand a square-root profile: this brute check is good to ~1e-6.
      expect(Math.abs(exact - captureByCartesianQuadrature(w, a, r0)) / exact).toBeLessThan(2e-6);
    }
  });
  it('the Farid & Hranilovic approximation is within 0.01 % for a/w = 0.025', () => {
    const exact = captureFraction({ beamRadiusM: 2, apertureRadiusM: 0.05, offsetM: 1 });
    expect(Math.abs(faridHranilovicCaptureFraction(2, 0.05, 1) / exact - 1)).toBeLessThan(1e-4);
  });
  it('annular capture subtracts the obscured disc', () => {
    expect(annularCaptureFraction(1, 0.5, 0.1)).toBeCloseTo(Math.exp(-0.02) - Math.exp(-0.5), 15);
  });
  it('rejects bad input naming the field', () => {
    expect(() => captureFraction({ beamRadiusM: 0, apertureRadiusM: 0.1 })).toThrow(/beamRadiusM/);
    expect(() => captureFraction({ beamRadiusM: 1, apertureRadiusM: -0.1 })).toThrow(/apertureRadiusM/);
    expect(() => captureFraction({ beamRadiusM: 1, apertureRadiusM: 0.1, offsetM: Number.NaN })).toThrow(/offsetM/);
  });
  it('is in [0, 1] and non-increasing in the offset (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-3, max: 10, noNaN: true }),
        fc.double({ min: 0, max: 2, noNaN: true }),
        fc.double({ min: 0, max: 20, noNaN: true }),
        fc.double({ min: 0, max: 5, noNaN: true }),
        (w, a, r0, extra) => {
          const near = captureFraction({ beamRadiusM: w, apertureRadiusM: a, offsetM: r0 });
          const far = captureFraction({ beamRadiusM: w, apertureRadiusM: a, offsetM: r0 + extra });
          return near >= 0 && near <= 1 && far >= 0 && far <= near + 1e-15 * Math.max(near, 1e-300);
        },
      ),
    );
  });
});

describe('offsetForRelativeCapture', () => {
  it('returns the offset where capture falls to the requested fraction of the centred value', () => {
    const offset = offsetForRelativeCapture({ beamRadiusM: 0.5, apertureRadiusM: 0.05, relativeFraction: 0.25 });
    const ratio = captureFraction({ beamRadiusM: 0.5, apertureRadiusM: 0.05, offsetM: offset }) / captureFraction({ beamRadiusM: 0.5, apertureRadiusM: 0.05 });
    expect(ratio).toBeCloseTo(0.25, 12);
  });
});

describe('top-hat ratio and field of view', () => {
  it('top-hat is ~3 dB below centred Gaussian capture for a ≪ w (METHODS.md §3.4)', () => {
    const topHat = topHatCaptureRatio({ transmitBeamDiameterM: 0.05, fullAngleDivergenceRad: 2e-3, rangeM: 2000, receiveApertureDiameterM: 0.1 });
    const gaussian = captureFraction({ beamRadiusM: 0.025 + 1e-3 * 2000, apertureRadiusM: 0.05 });
    expect(10 * Math.log10(gaussian / topHat)).toBeCloseTo(10 * Math.log10(2), 2);
    expect(topHatCaptureRatio({ transmitBeamDiameterM: 0.05, fullAngleDivergenceRad: 0, rangeM: 10, receiveApertureDiameterM: 0.2 })).toBe(1);
  });
  it('loses the signal when the focal spot walks off the detector', () => {
    const ok = fieldOfViewCheck({ detectorRadiusM: 100e-6, focalLengthM: 0.1, tiltRad: 0.5e-3, focalSpotRadiusM: 20e-6 });
    expect(ok.halfAngleFieldOfViewRad).toBeCloseTo(1e-3, 15);
    expect(ok.withinFieldOfView).toBe(true);
    expect(fieldOfViewCheck({ detectorRadiusM: 100e-6, focalLengthM: 0.1, tiltRad: 0.9e-3, focalSpotRadiusM: 20e-6 }).withinFieldOfView).toBe(false);
  });
});

describe('logRicianAnnulusProbability (exact annular capture under an offset)', () => {
  // Independent check: adaptive quadrature of the Rice density over the annulus (Rice 1945),
  // against the positive-term Poisson series of the fast path.
  const riceByQuadrature = (offset: number, sigma: number, inner: number, outer: number): number =>
    integrate(
      (t) => (t / (sigma * sigma)) * Math.exp(-((t - offset) ** 2) / (2 * sigma * sigma)) * besselI0Scaled((t * offset) / (sigma * sigma)),
      inner,
      outer,
      { absoluteTolerance: 0, relativeTolerance: 1e-13 },
    );

  it('agrees with quadrature of the Rice density, with and without obscuration, apertures smaller and larger than the beam', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 6, noNaN: true }),
        fc.double({ min: 0.05, max: 8, noNaN: true }),
        fc.double({ min: 0, max: 0.9, noNaN: true }),
        (offset, outer, obscuration) => {
          const inner = outer * obscuration;
          const expected = riceByQuadrature(offset, 1, inner, outer);
          const actual = Math.exp(logRicianAnnulusProbability(offset, 1, inner, outer));
          return Math.abs(actual - expected) <= 1e-11 * expected + 1e-300;
        },
      ),
    );
  });

  it('keeps to the quadrature where offsets of tens of s take the rescaled series (μ + y > 650)', () => {
    fc.assert(
      fc.property(fc.double({ min: 36, max: 60, noNaN: true }), fc.double({ min: -3, max: 3, noNaN: true }), fc.double({ min: 0.5, max: 4, noNaN: true }), (offset, shift, width) => {
        const inner = Math.max(0, offset + shift - width);
        const outer = offset + shift + width;
        const expected = Math.log(riceByQuadrature(offset, 1, inner, outer));
        return Math.abs(logRicianAnnulusProbability(offset, 1, inner, outer) - expected) <= 1e-9 * Math.max(1, Math.abs(expected));
      }),
    );
    // a small aperture far from the beam: ln P ≈ −(√μ − √y)² stays finite and close to the Gaussian tail
    const far = logRicianAnnulusProbability(200, 1, 0, 1);
    expect(far).toBeLessThan(-19000);
    expect(far).toBeGreaterThan(-20200);
  });

  it('switches to the log domain where the probability leaves the doubles, continuously', () => {
    // an obscuration of 40 s hides the beam: ln P ≈ −800, which the linear series cannot hold
    const deep = logRicianAnnulusProbability(2, 1, 40, 50);
    expect(Number.isFinite(deep)).toBe(true);
    expect(deep).toBeLessThan(-600);
    // the same by the closed form of the centred case, shifted slightly: a tiny offset changes little
    const centred = -0.5 * 40 * 40 + Math.log(-Math.expm1(-0.5 * (50 * 50 - 40 * 40)));
    expect(Math.abs(logRicianAnnulusProbability(1e-9, 1, 40, 50) - centred)).toBeLessThan(1e-9 * Math.abs(centred));
    // at the linear/log boundary the two paths agree
    const nearBoundary = logRicianAnnulusProbability(3, 1, 33, 40);
    expect(Math.abs(nearBoundary - Math.log(riceByQuadrature(3, 1, 33, 40)))).toBeLessThan(1e-9 * Math.abs(nearBoundary));
  });
});

describe('the small-receiver form bounds the exact offset loss', () => {
  it('exp(−2r²/W²) ≤ C(r)/C(0) ≤ exp(−2(r² − 2ar)/W²) for any annulus (derived)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.05, max: 5, noNaN: true }),
        fc.double({ min: 0, max: 0.9, noNaN: true }),
        fc.double({ min: 0, max: 4, noNaN: true }),
        (outer, obscuration, offset) => {
          const w = 1;
          const ratio = logOffsetAnnularCapture(w, outer, outer * obscuration, offset) - logCentredAnnularCapture(w, outer, outer * obscuration);
          // and from above by exp(−2(r² − 2ar)/W²), since |x| ≤ a on the aperture
          return ratio >= -2 * offset * offset - 1e-9 && ratio <= -2 * offset * (offset - 2 * outer) + 1e-9;
        },
      ),
    );
  });
});

describe('annularCaptureFractionStable', () => {
  it('equals the plain difference where nothing cancels, and keeps its digits under a large obscuration', () => {
    expect(annularCaptureFractionStable(1, 0.8, 0.3)).toBeCloseTo(annularCaptureFraction(1, 0.8, 0.3), 15);
    expect(annularCaptureFractionStable(1, 0.8, 0)).toBe(centredCaptureFraction(1, 0.8));
    // a 1 mm beam behind a 10 mm obscuration: exp(−200)·(1 − exp(−2·(0.011² − 0.01²)/1e-6)), derived
    const exact = Math.exp(-200) * -Math.expm1(-42);
    expect(annularCaptureFractionStable(1e-3, 0.011, 0.01) / exact).toBeCloseTo(1, 12);
    expect(annularCaptureFraction(1e-3, 0.011, 0.01)).toBe(0); // the difference underflows to nothing
  });
});
