import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { collimatedBeamWander } from './beam-wander.js';
import {
  fadeMarginDb,
  gammaGammaCdf,
  gammaGammaCdfSeries,
  gammaGammaPdf,
  gammaGammaQuantile,
  gammaGammaQuantileWithStop,
  gammaGammaQuantileSearch,
  lognormalIrradianceCdf,
  lognormalIrradiancePdf,
} from './fade-statistics.js';
import {
  GAUSSIAN_BEAM_RYTOV_FORM_RATIO,
  gaussianBeamRytovRatio,
  gaussianBeamRytovRatioIntegral,
  gaussianBeamScintillationIndex,
} from './gaussian-beam-scintillation.js';
import { rytovVariance, turbulenceRegime } from './rytov.js';
import {
  apertureAveragedFadeMarginDb,
  apertureAveragedScintillationIndexFast,
  gammaGammaParameters,
  normalisedApertureSquared,
  scintillationIndexAllRegimes,
  weakApertureAveragingNumerical,
} from './scintillation.js';

describe('Rytov variance and scintillation index', () => {
  it('gives σ_R² = 0.1991 and β0² = 0.0809 at 1550 nm, Cn² = 1e-14, 1 km (METHODS.md §6.2 example, Andrews & Phillips 2005 ch. 8)', () => {
    const common = { cn2: 1e-14, wavelengthM: 1550e-9, distanceM: 1000 };
    expect(rytovVariance({ ...common, wave: 'plane' })).toBeCloseTo(0.1991, 4);
    expect(rytovVariance({ ...common, wave: 'spherical' })).toBeCloseTo(0.0809, 4);
    expect(turbulenceRegime(0.2)).toBe('weak');
  });

  it('rejects a negative Cn² and an unknown wave model, naming the field', () => {
    expect(() => rytovVariance({ cn2: -1e-14, wavelengthM: 1550e-9, distanceM: 1000, wave: 'plane' })).toThrow(/cn2/);
    expect(() => rytovVariance({ cn2: 1e-14, wavelengthM: 1550e-9, distanceM: 1000, wave: 'cylindrical' as 'plane' })).toThrow(/wave/);
  });

  it('matches the weak-fluctuation limit σ_I² → σ_R² and saturates towards 1 (Andrews & Phillips 2005 ch. 9)', () => {
    expect(scintillationIndexAllRegimes(1e-4, 'plane') / 1e-4).toBeCloseTo(1, 3);
    expect(scintillationIndexAllRegimes(1e4, 'plane')).toBeLessThan(1.1);
    expect(scintillationIndexAllRegimes(1e4, 'plane')).toBeGreaterThan(1);
  });

  it('satisfies σ_I² = 1/α + 1/β + 1/(αβ) (Al-Habash, Andrews & Phillips 2001)', () => {
    for (const rytov of [0.05, 0.5, 3, 20]) {
      for (const apertureD2 of [0, 2, 40]) {
        const p = gammaGammaParameters({ rytovVariance: rytov, wave: 'spherical', apertureD2 });
        expect(1 / p.alpha + 1 / p.beta + 1 / (p.alpha * p.beta)).toBeCloseTo(p.scintillationIndex, 12);
      }
    }
  });

  it('aperture averaging reduces σ_I² 5–15× for D = 0.1 m at 1 km, 1550 nm (METHODS.md §6.6, Andrews & Phillips 2005 ch. 10)', () => {
    const d2 = normalisedApertureSquared(1550e-9, 1000, 0.1);
    expect(d2).toBeCloseTo(10.134, 3);
    const point = scintillationIndexAllRegimes(0.2, 'plane');
    const averaged = gammaGammaParameters({ rytovVariance: 0.2, wave: 'plane', apertureD2: d2 }).scintillationIndex;
    expect(point / averaged).toBeGreaterThan(5);
    expect(point / averaged).toBeLessThan(15);
  });

  it('weak numerical aperture averaging is 1 for a point receiver and falls with the aperture', () => {
    expect(weakApertureAveragingNumerical(0, 'plane')).toBeCloseTo(1, 12);
    expect(weakApertureAveragingNumerical(5, 'spherical')).toBeLessThan(weakApertureAveragingNumerical(1, 'spherical'));
  });
});

describe('Gaussian-beam scintillation', () => {
  it('the hypergeometric form tends to the plane (1) and spherical (≈ 0.40) limits', () => {
    expect(gaussianBeamRytovRatio(1, 0)).toBeCloseTo(1, 2);
    const spherical = gaussianBeamRytovRatio(0, 0);
    expect(spherical).toBeGreaterThan(0.39);
    expect(spherical).toBeLessThan(0.42);
  });

  it('hypergeometric and integral forms differ only by the constant rounding ratio, also past a focus', () => {
    for (const [theta, lambda] of [[0.6160800056, 0.486338804], [0.0244, 0.00047], [0.2, 0.3], [-0.5, 0.4], [0.5, 1.2]] as const) {
      const ratio = gaussianBeamRytovRatio(theta, lambda) / gaussianBeamRytovRatioIntegral(theta, lambda);
      expect(ratio).toBeCloseTo(GAUSSIAN_BEAM_RYTOV_FORM_RATIO, 8);
    }
    expect(GAUSSIAN_BEAM_RYTOV_FORM_RATIO).toBeCloseTo(1.000256, 5);
  });

  it('on-axis index is close to the plane-wave form at Θ = 1 (0.56·2 = 1.12 against 1.11) and equals the spherical form at Θ = 0', () => {
    expect(gaussianBeamScintillationIndex(2, 1)).toBeCloseTo(scintillationIndexAllRegimes(2, 'plane'), 2);
    expect(gaussianBeamScintillationIndex(2, 0)).toBeCloseTo(scintillationIndexAllRegimes(2, 'spherical'), 12);
  });

  it('beam wander: 9.1 mm rms for Cn² = 1e-14, 1 km, W0 = 25 mm (METHODS.md §6.10, Andrews & Phillips 2005 ch. 6)', () => {
    expect(collimatedBeamWander(1e-14, 1000, 0.025).wanderRmsRadialM).toBeCloseTo(0.0091, 4);
  });
});

describe('gamma-gamma statistics and fade margin', () => {
  it('product-form CDF agrees with the independent 1F2 series where the series is well conditioned', () => {
    for (const [alpha, beta, x] of [[4.39, 2.56, 0.3], [2.07, 1.3, 0.05], [5.7, 1.1, 0.01], [11.65, 10.12, 0.05], [3.3, 2.9, 0.5]] as const) {
      expect(gammaGammaCdf(x, alpha, beta) / gammaGammaCdfSeries(x, alpha, beta)).toBeCloseTo(1, 8);
    }
  });

  it('the pdf integrates to the CDF (trapezoid in ln x)', () => {
    const [alpha, beta] = [4.34, 1.31];
    // Midpoint rule in t = ln x on [−25, ln 0.3]: F(0.3) = ∫ f(e^t)·e^t dt.
    const panels = 4000;
    const h = (Math.log(0.3) + 25) / panels;
    let sum = 0;
    for (let i = 0; i < panels; i++) {
      const x = Math.exp(-25 + (i + 0.5) * h);
      sum += gammaGammaPdf(x, alpha, beta) * x * h;
    }
    expect(sum / gammaGammaCdf(0.3, alpha, beta)).toBeCloseTo(1, 4);
  });

  it('the quantile inverts the CDF', () => {
    for (const [alpha, beta, p] of [[17.7, 69.9, 1e-3], [2.07, 1.3, 1e-6], [300, 400, 0.01], [1.2, 40, 1e-4]] as const) {
      expect(gammaGammaCdf(gammaGammaQuantile(alpha, beta, p), alpha, beta) / p).toBeCloseTo(1, 6);
    }
  });

  it('the fast (cubic stop) quantile matches a fully converged search over a grid of α, β, p', () => {
    let worst = 0;
    for (const alpha of [0.7, 1.7, 4, 12, 35, 100, 450]) {
      for (const beta of [0.6, 1.6, 3.7, 11, 59, 210]) {
        for (const p of [0.1, 1e-3, 1e-6, 1e-9]) {
          const fast = Math.log(gammaGammaQuantile(alpha, beta, p));
          const tight = Math.log(gammaGammaQuantileWithStop(alpha, beta, p, 1e-14));
          worst = Math.max(worst, Math.abs(fast - tight));
        }
      }
    }
    expect(worst).toBeLessThan(1e-7);
  });

  it('needs a single quadrature pass for typical aperture-averaged parameters', () => {
    expect(gammaGammaQuantileSearch(100, 150, 1e-3).passes).toBe(1);
  });

  it('the hot-path chain gives the LB-01 scintillation terms (F = 9.8154 dB, σ_I² = 0.28749; METHODS.md §10.1)', () => {
    expect(apertureAveragedFadeMarginDb(1550e-9, 2000, 5e-14, 0.1, 1e-3)).toBeCloseTo(9.815440988, 6);
    expect(apertureAveragedScintillationIndexFast(1550e-9, 2000, 5e-14, 0.1)).toBeCloseTo(0.2874881169, 9);
    expect(apertureAveragedFadeMarginDb(1550e-9, 2000, 0, 0.1, 1e-3)).toBe(0);
  });

  it('gamma-gamma needs more margin than log-normal at the same σ_I² in moderate turbulence (METHODS.md §6.9, Al-Habash et al. 2001)', () => {
    const { alpha, beta, scintillationIndex } = gammaGammaParameters({ rytovVariance: 1, wave: 'plane' });
    const gg = fadeMarginDb({ model: 'gamma-gamma', alpha, beta, probability: 1e-3 });
    const ln = fadeMarginDb({ model: 'lognormal', scintillationIndex, probability: 1e-3 });
    expect(gg - ln).toBeGreaterThan(4);
  });

  it('handles a non-fluctuating factor (infinite shape) and zero turbulence', () => {
    const { alpha, beta } = gammaGammaParameters({ rytovVariance: 0, wave: 'spherical' });
    expect(fadeMarginDb({ model: 'gamma-gamma', alpha, beta, probability: 1e-3 })).toBe(0);
    // With α → ∞ the law is Gamma(β, 1/β): compare with a very large α.
    expect(fadeMarginDb({ model: 'gamma-gamma', alpha: Infinity, beta: 3, probability: 1e-3 })).toBeCloseTo(fadeMarginDb({ model: 'gamma-gamma', alpha: 1e6, beta: 3, probability: 1e-3 }), 3);
  });

  it('log-normal CDF at the log-normal fade threshold equals p', () => {
    const threshold = Math.pow(10, -fadeMarginDb({ model: 'lognormal', scintillationIndex: 0.3, probability: 1e-4 }) / 10);
    expect(lognormalIrradianceCdf(threshold, 0.3) / 1e-4).toBeCloseTo(1, 9);
    expect(lognormalIrradiancePdf(1, 0.3)).toBeGreaterThan(0);
  });

  it('rejects probabilities outside (0, 1)', () => {
    expect(() => fadeMarginDb({ model: 'gamma-gamma', alpha: 4, beta: 2, probability: 0 })).toThrow(/probability/);
    expect(() => fadeMarginDb({ model: 'lognormal', scintillationIndex: 0.2, probability: 1 })).toThrow(/probability/);
  });

  it('fade margin increases as the probability decreases, for both laws (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.3, max: 400, noNaN: true }),
        fc.double({ min: 0.3, max: 400, noNaN: true }),
        fc.double({ min: -9, max: -0.5, noNaN: true }),
        fc.double({ min: 0.05, max: 2, noNaN: true }),
        (alpha, beta, logP, decades) => {
          const p = Math.pow(10, logP);
          const smaller = Math.pow(10, logP - decades);
          const gg = fadeMarginDb({ model: 'gamma-gamma', alpha, beta, probability: smaller }) > fadeMarginDb({ model: 'gamma-gamma', alpha, beta, probability: p });
          const scintillationIndex = 1 / alpha + 1 / beta + 1 / (alpha * beta);
          const ln = fadeMarginDb({ model: 'lognormal', scintillationIndex, probability: smaller }) > fadeMarginDb({ model: 'lognormal', scintillationIndex, probability: p });
          return gg && ln;
        },
      ),
      { numRuns: 300 },
    );
  });
});
