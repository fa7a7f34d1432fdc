import { describe, expect, it } from 'vitest';
import {
  friisPowerRatio,
  gaussianBeamOnAxisGain,
  optimumTruncation,
  transmitApertureForSpot,
  transmittedFraction,
  truncationGainEfficiency,
  uniformApertureGain,
} from './truncation.js';
import { launchBeamRadiusAtRangeM } from '../beam/launch.js';
import { centredCaptureFraction } from '../capture/capture.js';

describe('Klein & Degnan (1974) truncation', () => {
  it('the unobscured optimum solves e^x = 1 + 2x with x = α² (α = 1.12, g = 0.8145 in the paper)', () => {
    const optimum = optimumTruncation();
    const x = optimum.apertureToBeamRatio ** 2;
    expect(Math.exp(x) - 1 - 2 * x).toBeCloseTo(0, 12);
    expect(optimum.apertureToBeamRatio).toBeCloseTo(1.12, 2);
    expect(optimum.onAxisGainEfficiency).toBeCloseTo(0.8145, 4);
  });
  it('is a maximum of g for every obscuration', () => {
    for (const gamma of [0, 0.1, 0.25, 0.4, 0.6]) {
      const { apertureToBeamRatio: alpha, onAxisGainEfficiency: g } = optimumTruncation({ obscurationRatio: gamma });
      expect(truncationGainEfficiency(alpha * 0.99, gamma)).toBeLessThan(g);
      expect(truncationGainEfficiency(alpha * 1.01, gamma)).toBeLessThan(g);
    }
  });
  it('rejects an obscuration outside [0, 1)', () => {
    expect(() => optimumTruncation({ obscurationRatio: 1 })).toThrow(/obscurationRatio/);
  });
  it('clipping at a/w = 1.5 is below 0.05 dB (common practice)', () => {
    expect(-10 * Math.log10(transmittedFraction(1.5))).toBeLessThan(0.05);
  });
  it('Friis with G_t = 8/θ² equals the small-aperture Gaussian capture D²/(2θ²L²)', () => {
    const theta = 5e-4;
    const diameter = 0.08;
    const range = 3000;
    const friis = friisPowerRatio(gaussianBeamOnAxisGain(theta), uniformApertureGain(diameter, 1.55e-6), 1.55e-6, range);
    expect(friis / ((diameter * diameter) / (2 * theta * theta * range * range))).toBeCloseTo(1, 12);
    // Exact capture is below the small-aperture value by the factor ≈ 1 − a²/w² (here 0.9993).
    expect(centredCaptureFraction(theta * range, diameter / 2) / friis).toBeCloseTo(1 - (diameter / 2 / (theta * range)) ** 2, 6);
  });
});

describe('transmitApertureForSpot', () => {
  it('the collimated beam radius it returns produces the target spot', () => {
    const sizing = transmitApertureForSpot({ wavelengthM: 1.55e-6, rangeM: 1000, targetSpotRadiusM: 0.05 });
    expect(sizing.collimatedBeamRadiusM).not.toBeNull();
    expect(launchBeamRadiusAtRangeM(1.55e-6, sizing.collimatedBeamRadiusM!, 0, 1, 1000)).toBeCloseTo(0.05, 12);
    expect(sizing.apertureRadiusM).toBeCloseTo(1.5 * sizing.collimatedBeamRadiusM!, 14);
  });
  it('reports that a collimated launch cannot reach a spot below √2·sqrt(λL/π)', () => {
    const sizing = transmitApertureForSpot({ wavelengthM: 1.55e-6, rangeM: 1000, targetSpotRadiusM: 0.02 });
    expect(sizing.minimumCollimatedSpotRadiusM).toBeGreaterThan(0.02);
    expect(sizing.collimatedBeamRadiusM).toBeNull();
    expect(sizing.focusedBeamRadiusM).toBeCloseTo((1.55e-6 * 1000) / (Math.PI * 0.02), 15);
  });
});
