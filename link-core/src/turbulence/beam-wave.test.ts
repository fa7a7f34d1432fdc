import { describe, expect, it } from 'vitest';
import { integrate } from '../numeric/quadrature.js';
import { evaluateLink } from '../budget/evaluate-link.js';
import type { LinkDesignInput } from '../schemas/link-design.schema.js';
import { beamWaveAtReceiverFast, beamWaveScintillationFast } from './beam-wave.js';
import { apertureAveragedFadeMarginDb, apertureAveragedScintillationIndexFast } from './scintillation.js';
import { launchBeamRadiusAtRangeM } from '../beam/launch.js';

const design: LinkDesignInput = {
  rangeM: 2000,
  transmitter: { wavelengthM: 1.55e-6, powerDbm: 20, waistRadiusM: 0.025, halfAngleDivergenceRad: 1e-3, opticsLossDb: 1 },
  receiver: { apertureDiameterM: 0.1, sensitivityDbm: -36, opticsLossDb: 1.5 },
  pointing: { jitterSigmaPerAxisRad: 50e-6, staticErrorRad: 100e-6 },
  atmosphere: { model: 'kim', visibilityM: 5000, cn2: 5e-14 },
  scintillation: { include: true, probability: 1e-3 },
};

describe('long-term beam spread (weak-turbulence coefficient against the Kolmogorov-spectrum integral)', () => {
  it('reproduces the 1.33 of Andrews & Phillips (2005) by our own integration', () => {
    // Weak long-term spread: T = 4π²k²L ∫0^1 ∫0^∞ κ·Φn(κ)·[1 − exp(−Λ L κ² ξ²/k)] dκ dξ with the
    // Kolmogorov spectrum Φn = 0.033·Cn²·κ^(−11/3) (Andrews & Phillips 2005, ch. 6). Integrated
    // numerically in physical units for one path, then divided by σ_R²·Λ^(5/6).
    const k = (2 * Math.PI) / 1.55e-6;
    const L = 1500;
    const cn2 = 1e-15;
    const lambda = 0.3;
    const inner = (xi: number): number => {
      const a = (lambda * L * xi * xi) / k;
      // κ = t³ removes the κ^(−2/3) behaviour at 0; the tail beyond κ_max is ∫ κ^(−8/3) = (3/5)κ_max^(−5/3)
      const tMax = Math.cbrt(40 / Math.sqrt(a));
      const body = integrate((t) => 3 * t * t * Math.pow(t, -8) * -Math.expm1(-a * Math.pow(t, 6)), 0, tMax, { relativeTolerance: 1e-11 });
      return 0.033 * cn2 * (body + 0.6 * Math.pow(tMax, -5));
    };
    const spread = 4 * Math.PI * Math.PI * k * k * L * integrate(inner, 0, 1, { relativeTolerance: 1e-10 });
    const rytov = 1.23 * cn2 * Math.pow(k, 7 / 6) * Math.pow(L, 11 / 6);
    const coefficient = spread / (rytov * Math.pow(lambda, 5 / 6));
    expect(coefficient).toBeCloseTo(1.3265, 3); // the integral itself
    expect(Math.abs(coefficient / 1.33 - 1)).toBeLessThan(0.003); // the published, rounded 1.33
  });

  it('is the weak form in weak turbulence and the strong form in strong turbulence, continuously between', () => {
    const radius = (cn2: number) => {
      const w = launchBeamRadiusAtRangeM(1.55e-6, 0.01, 0, 1, 3000);
      const beam = beamWaveAtReceiverFast(1.55e-6, 0.01, 0, 1, 3000, cn2, w, true);
      return { w, beam: { ...beam } };
    };
    const weak = radius(1e-17);
    const weakForm = 1.33 * weak.beam.planeRytovVariance * Math.pow(weak.beam.lambda, 5 / 6);
    expect(Math.abs(((weak.beam.longTermBeamRadiusM / weak.w) ** 2 - 1) / weakForm - 1)).toBeLessThan(3e-3); // the bridge adds (T_s/T_w)⁶/6 ≈ 2e-3 here
    const strong = radius(1e-12);
    const strongForm = 1.63 * Math.pow(strong.beam.planeRytovVariance, 1.2) * strong.beam.lambda;
    expect(Math.abs(((strong.beam.longTermBeamRadiusM / strong.w) ** 2 - 1) / strongForm - 1)).toBeLessThan(3e-3);
    // no step anywhere between: log-spaced Cn², second differences of ln W_LT stay small
    let previous: number[] = [];
    for (let i = 0; i <= 400; i++) {
      const value = Math.log(radius(10 ** (-17 + (5 * i) / 400)).beam.longTermBeamRadiusM);
      previous.push(value);
      if (previous.length === 3) {
        expect(Math.abs(previous[2]! - 2 * previous[1]! + previous[0]!)).toBeLessThan(2e-3);
        previous = previous.slice(1);
      }
    }
  });
});

describe('beam wander', () => {
  it('is 2.42·Cn²·L³·W0^(−1/3) for a collimated beam (Andrews & Phillips 2005, ch. 6; TU-08 example 9.1 mm)', () => {
    const w = launchBeamRadiusAtRangeM(1.55e-6, 0.025, 0, 1, 1000);
    const beam = beamWaveAtReceiverFast(1.55e-6, 0.025, 0, 1, 1000, 1e-14, w, true);
    expect(beam.beamWanderRmsM).toBeCloseTo(Math.sqrt(2.42e-14 * 1e9 * Math.pow(0.025, -1 / 3)), 12);
    expect(beam.beamWanderRmsM).toBeCloseTo(9.1e-3, 4);
  });

  it('uses 2F1(1/3, 1; 4; 1 − Θ0) for a divergent beam: its Euler integral by quadrature agrees, and wander falls', () => {
    const w = launchBeamRadiusAtRangeM(1.55e-6, 0.025, 1e-3, 1, 1000);
    const beam = beamWaveAtReceiverFast(1.55e-6, 0.025, 1e-3, 1, 1000, 1e-14, w, true);
    const diffraction = 1.55e-6 / (Math.PI * 0.025);
    const theta0 = 1 + (1000 * Math.sqrt(1e-6 - diffraction * diffraction)) / 0.025;
    const z = 1 - theta0;
    const euler = 3 * integrate((t) => (1 - t) ** 2 * Math.pow(1 - z * t, -1 / 3), 0, 1, { relativeTolerance: 1e-13 });
    expect(beam.beamWanderRmsM ** 2).toBeCloseTo(2.42e-14 * 1e9 * Math.pow(0.025, -1 / 3) * euler, 15);
    expect(beam.beamWanderRmsM).toBeLessThan(9.1e-3);
  });
});

describe('the Gaussian-beam model in the budget', () => {
  it('gives the same budget as the spherical wave when Cn² = 0', () => {
    const calm = { ...design, atmosphere: { ...design.atmosphere, cn2: 0 } };
    const gaussian = evaluateLink(calm);
    const spherical = evaluateLink({ ...calm, atmosphere: { ...calm.atmosphere, turbulenceModel: 'spherical-wave' } });
    expect(gaussian.turbulenceModel).toBe('gaussian-beam');
    expect(spherical.turbulenceModel).toBe('spherical-wave');
    expect(gaussian.linkMarginDb).toBe(spherical.linkMarginDb);
    expect(gaussian.terms.map((t) => t.valueDb)).toEqual(spherical.terms.map((t) => t.valueDb));
    expect(gaussian.longTermBeamRadiusM).toBe(gaussian.beamRadiusAtReceiverM);
    expect(gaussian.beamWanderRmsM).toBe(0);
  });

  it('approaches the spherical wave for a strongly divergent beam (Θ, Λ → 0)', () => {
    // 3 mrad from a 5 mm beam over 3 km: Θ ≈ 1e-3, Λ ≈ 1e-4. The limits differ only by the rounding
    // of the constants (σ_B²/σ_R² → 0.40 from the 3.86 form against β0²/σ_R² = 0.50/1.23 = 0.4065).
    const L = 3000;
    const w = launchBeamRadiusAtRangeM(1.55e-6, 0.005, 3e-3, 1, L);
    const beam = beamWaveAtReceiverFast(1.55e-6, 0.005, 3e-3, 1, L, 2e-14, w, true);
    expect(beam.theta).toBeLessThan(2e-3);
    expect(beam.lambda).toBeLessThan(1e-3);
    const wave = { ...beamWaveScintillationFast(1.55e-6, L, 0.1, 0, beam, w, 0, 1e-3) };
    const sphericalIndex = apertureAveragedScintillationIndexFast(1.55e-6, L, 2e-14, 0.1);
    const sphericalMargin = apertureAveragedFadeMarginDb(1.55e-6, L, 2e-14, 0.1, 1e-3);
    expect(Math.abs(wave.scintillationIndex / sphericalIndex - 1)).toBeLessThan(0.02);
    expect(Math.abs(wave.fadeMarginDb / sphericalMargin - 1)).toBeLessThan(0.02);
    expect(beam.longTermBeamRadiusM / w - 1).toBeLessThan(1e-3);
  });

  it('shows the long-term spread of a narrow collimated beam as its own term, right after the geometric spread', () => {
    const narrow: LinkDesignInput = {
      ...design,
      rangeM: 3000,
      transmitter: { ...design.transmitter, waistRadiusM: 0.025, halfAngleDivergenceRad: undefined },
      atmosphere: { ...design.atmosphere, cn2: 5e-14 },
    };
    const budget = evaluateLink(narrow);
    const keys = budget.terms.map((t) => t.key);
    expect(keys.indexOf('turbulenceBeamSpread')).toBe(keys.indexOf('geometricSpread') + 1);
    const spread = budget.terms.find((t) => t.key === 'turbulenceBeamSpread')!;
    expect(spread.valueDb).toBeLessThan(-3); // several dB lost to spreading
    expect(budget.longTermBeamRadiusM!).toBeGreaterThan(budget.beamRadiusAtReceiverM);
    expect(budget.beamWanderRmsM!).toBeGreaterThan(0);
    // the spread term is exactly the change of the centred capture from W to W_LT
    const capture = (w: number) => -Math.expm1(-2 * (0.05 / w) ** 2);
    expect(spread.valueDb).toBeCloseTo(10 * Math.log10(capture(budget.longTermBeamRadiusM!) / capture(budget.beamRadiusAtReceiverM)), 10);
    // applies whether or not the fade margin is included
    const noFade = evaluateLink({ ...narrow, scintillation: { include: false } });
    expect(noFade.terms.find((t) => t.key === 'turbulenceBeamSpread')!.valueDb).toBe(spread.valueDb);
    const spherical = evaluateLink({ ...narrow, atmosphere: { ...narrow.atmosphere, turbulenceModel: 'spherical-wave' } });
    expect(spherical.terms.find((t) => t.key === 'turbulenceBeamSpread')!.valueDb).toBe(0);
    expect(spherical.longTermBeamRadiusM).toBe(spherical.beamRadiusAtReceiverM);
    expect(spherical.beamWanderRmsM).toBe(0);
  });
});
