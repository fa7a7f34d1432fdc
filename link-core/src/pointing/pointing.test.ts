import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  combineJitterPerAxis,
  faridHranilovicOutageProbability,
  faridHranilovicPointingStatistics,
  meanPointingLossDb,
  meanPointingRelativePower,
  pointingJitterBudget,
  pointingLossAtOutageDb,
  pointingLossDb,
  pointingOutageProbability,
  requiredThresholdOverSigma,
} from './pointing.js';
import { buildingFundamentalFrequencyHz, buildingTiltEstimates } from './building-sway.js';
import { integrate } from '../numeric/quadrature.js';
import { besselI0Scaled } from '../numeric/bessel.js';
import { captureFraction } from '../capture/capture.js';

// Rice density of the radial error (offset ν, per-axis σ), written with the scaled Bessel function.
function riceDensity(r: number, nu: number, sigma: number): number {
  return (r / (sigma * sigma)) * Math.exp(-((r - nu) ** 2) / (2 * sigma * sigma)) * besselI0Scaled((r * nu) / (sigma * sigma));
}

describe('pointingOutageProbability', () => {
  it('Rayleigh: exp(−r²/(2σ²))', () => {
    expect(pointingOutageProbability({ jitterSigmaPerAxisM: 0.1, thresholdRadiusM: 0.3 })).toBeCloseTo(Math.exp(-4.5), 15);
  });
  it('Rician: agrees with quadrature of the Rice density', () => {
    for (const [nu, sigma, r] of [[0.1, 0.1, 0.3], [0.5, 0.1, 0.6], [0.05, 0.2, 0.1]] as const) {
      const tail = integrate((x) => riceDensity(x, nu, sigma), r, nu + r + 40 * sigma);
      expect(Math.abs(pointingOutageProbability({ jitterSigmaPerAxisM: sigma, staticOffsetM: nu, thresholdRadiusM: r }) - tail)).toBeLessThan(1e-12);
    }
  });
  it('is deterministic without jitter', () => {
    expect(pointingOutageProbability({ jitterSigmaPerAxisM: 0, staticOffsetM: 0.2, thresholdRadiusM: 0.1 })).toBe(1);
    expect(pointingOutageProbability({ jitterSigmaPerAxisM: 0, staticOffsetM: 0.05, thresholdRadiusM: 0.1 })).toBe(0);
  });
  it('rejects bad input naming the field', () => {
    expect(() => pointingOutageProbability({ jitterSigmaPerAxisM: -1, thresholdRadiusM: 1 })).toThrow(/jitterSigmaPerAxisM/);
    expect(() => pointingOutageProbability({ jitterSigmaPerAxisM: 1, staticOffsetM: Number.NaN, thresholdRadiusM: 1 })).toThrow(/staticOffsetM/);
  });
  it('decreases with the threshold and increases with the offset (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-3, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 3, noNaN: true }),
        fc.double({ min: 0, max: 3, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (sigma, nu, r, step) => {
          const base = pointingOutageProbability({ jitterSigmaPerAxisM: sigma, staticOffsetM: nu, thresholdRadiusM: r });
          const wider = pointingOutageProbability({ jitterSigmaPerAxisM: sigma, staticOffsetM: nu, thresholdRadiusM: r + step });
          const biased = pointingOutageProbability({ jitterSigmaPerAxisM: sigma, staticOffsetM: nu + step, thresholdRadiusM: r });
          const slack = 1e-12;
          return base >= 0 && base <= 1 && wider <= base + slack && biased >= base - slack;
        },
      ),
    );
  });
});

describe('requiredThresholdOverSigma', () => {
  it('inverts the outage probability (round trip)', () => {
    for (const nu of [0, 0.5, 2, 6]) {
      for (const p of [1e-2, 1e-4, 1e-9]) {
        const ratio = requiredThresholdOverSigma({ outageProbability: p, staticOffsetOverSigma: nu });
        const back = pointingOutageProbability({ jitterSigmaPerAxisM: 1, staticOffsetM: nu, thresholdRadiusM: ratio });
        expect(Math.abs(back / p - 1)).toBeLessThan(1e-9);
      }
    }
  });
  it('rejects a probability outside (0, 1)', () => {
    expect(() => requiredThresholdOverSigma({ outageProbability: 1 })).toThrow(/outageProbability/);
  });
});

describe('mean pointing loss (small receiver)', () => {
  it('the closed form agrees with quadrature over the Rice density', () => {
    for (const [w, sigma, nu] of [[1, 0.2, 0.3], [0.5, 0.05, 0], [2, 0.6, 1.5]] as const) {
      const numeric = integrate((r) => riceDensity(r, nu, sigma) * Math.exp((-2 * r * r) / (w * w)), 0, nu + 40 * sigma);
      expect(meanPointingRelativePower(w, sigma, nu)).toBeCloseTo(numeric, 12);
      expect(meanPointingLossDb(w, sigma, nu)).toBeCloseTo(-10 * Math.log10(numeric), 10);
    }
  });
  it('an error equal to the beam radius costs 8.686 dB', () => {
    expect(pointingLossDb(1, 1)).toBeCloseTo(20 / Math.LN10, 14);
  });
  it('the loss at outage p is the loss at the radius exceeded with probability p', () => {
    const loss = pointingLossAtOutageDb({ beamRadiusM: 1, jitterSigmaPerAxisM: 0.1, outageProbability: 1e-3 });
    expect(loss).toBeCloseTo(pointingLossDb(0.1 * Math.sqrt(-2 * Math.log(1e-3)), 1), 12);
  });
});

describe('pointingJitterBudget', () => {
  it('with a static offset, the returned σ meets the outage target exactly', () => {
    const budget = pointingJitterBudget({ beamRadiusM: 1, allowedPointingLossDb: 3, outageProbability: 1e-3, rangeM: 1000, staticOffsetM: 0.2 });
    const outage = pointingOutageProbability({ jitterSigmaPerAxisM: budget.maxSigmaPerAxisM, staticOffsetM: 0.2, thresholdRadiusM: budget.allowedOffsetM });
    expect(outage / 1e-3).toBeCloseTo(1, 8);
    expect(budget.maxSigmaPerAxisRad).toBeCloseTo(budget.maxSigmaPerAxisM / 1000, 15);
  });
  it('leaves no jitter when the static offset alone exceeds the allowance', () => {
    expect(pointingJitterBudget({ beamRadiusM: 1, allowedPointingLossDb: 1, outageProbability: 1e-3, rangeM: 1000, staticOffsetM: 0.9 }).maxSigmaPerAxisM).toBe(0);
  });
});

describe('Farid & Hranilovic (2007) statistics', () => {
  it('the model outage (h/A0)^ξ² tracks the exact capture for a ≪ w', () => {
    const w = 2;
    const a = 0.05;
    const sigma = 0.3;
    const stats = faridHranilovicPointingStatistics({ beamRadiusM: w, apertureRadiusM: a, jitterSigmaPerAxisM: sigma });
    // Exact: P(η(R) < h) for h = 0.5·A0, found from the radius where the exact capture equals it.
    const target = 0.5 * stats.peakFraction;
    let lo = 0;
    let hi = 5;
    for (let i = 0; i < 200; i++) {
      const mid = (lo + hi) / 2;
      if (captureFraction({ beamRadiusM: w, apertureRadiusM: a, offsetM: mid }) > target) lo = mid;
      else hi = mid;
    }
    const exact = Math.exp(-(lo * lo) / (2 * sigma * sigma));
    expect(Math.abs(faridHranilovicOutageProbability(stats.xi, 0.5) / exact - 1)).toBeLessThan(1e-3);
    expect(stats.meanFraction).toBeCloseTo(stats.peakFraction * stats.meanFractionOverPeak, 15);
  });
});

describe('jitter combination and building sway', () => {
  it('adds independent jitters in quadrature', () => {
    expect(combineJitterPerAxis([3e-5, 4e-5])).toBeCloseTo(5e-5, 18);
  });
  it('n1 = 46/h (EN 1991-1-4 Annex F, from memory) and tilt estimates', () => {
    expect(buildingFundamentalFrequencyHz(200)).toBeCloseTo(0.23, 15);
    expect(() => buildingFundamentalFrequencyHz(0)).toThrow(/buildingHeightM/);
    const tilt = buildingTiltEstimates({ driftRatio: 1 / 400, heightM: 40, widthM: 20, thermalExpansionPerK: 1e-5, temperatureDifferenceK: 5, rangeM: 2000 });
    expect(tilt.flexuralCantileverTiltRad).toBeCloseTo(4 / 3 / 400, 15);
    expect(tilt.thermalBowingTiltRad).toBeCloseTo(1e-4, 15);
    expect(tilt.thermalBeamDisplacementAtRangeM).toBeCloseTo(0.2, 12);
  });
});
