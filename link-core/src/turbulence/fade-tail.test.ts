/**
 * The fade statistics at the far ends of the probability range. The engine's own functions accept
 * any p in (0, 1) (the design schema narrows it to 1e-9 … 0.5): far below that range they must still
 * answer a finite number after a bounded amount of work, never loop or overflow.
 *
 * Reference values computed for this test with scipy 1.17.1 (`scipy.special.ndtri`) and mpmath 1.3.0
 * at 30 digits (gamma-gamma CDF as the product-of-gammas integral ∫ f_lnX(s)·P(a, a·x·e^(−s)) ds with
 * the regularised incomplete gamma, quantile by bisection in ln x to 1e-14). The same script reproduces
 * the TU-04 threshold at p = 1e-3 (0.2016587024) of fixtures/reference/check-values.json.
 */
import { describe, expect, it } from 'vitest';
import { fadeMarginDb, fadeMarginLognormalDb, gammaGammaCdf, gammaGammaQuantile, gammaGammaQuantileSearch } from './fade-statistics.js';
import { normalQuantileOf } from '../numeric/normal.js';

/** [α, β, p, I_T/⟨I⟩] from mpmath as described above. */
const GAMMA_GAMMA_TAIL: readonly (readonly [number, number, number, number])[] = [
  [11.65104538, 10.12236531, 1e-9, 0.03244239145505469],
  [11.65104538, 10.12236531, 0.5, 0.9252316318397911],
  [11.65104538, 10.12236531, 1e-17, 0.004473670960513434],
  [4.340662543, 1.308802679, 1e-9, 8.394514660790045e-8],
  [4.340662543, 1.308802679, 0.5, 0.6596343865057491],
  [4.340662543, 1.308802679, 1e-17, 6.479457144998327e-14],
  // the LB-01 design's aperture-averaged shapes (2 km, 1550 nm, Cn² = 5e-14, D = 0.1 m)
  [4.184964796488559, 25.525647674009306, 1e-9, 0.0034777515223552305],
  [4.184964796488559, 25.525647674009306, 0.5, 0.8992953350762372],
  [4.184964796488559, 25.525647674009306, 1e-17, 4.247988851794195e-5],
];

describe('fade statistics far in the tail', () => {
  it('the normal quantile keeps its accuracy below p = 1e-16 (scipy.special.ndtri)', () => {
    for (const [p, expected] of [
      [1e-3, -3.090232306167813],
      [1e-9, -5.9978070150076865],
      [1e-17, -8.493793224109599],
      [1e-300, -37.0470962993612],
      [0.5, 0],
    ] as const) {
      expect(Math.abs(normalQuantileOf(p) - expected)).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(expected)));
    }
    // symmetric: the upper tail is as accurate as the lower one
    expect(normalQuantileOf(1 - 1e-9)).toBeCloseTo(5.9978070150076865, 6);
  });

  it('the gamma-gamma quantile matches an independent high-precision inversion from 1e-17 to 0.5', () => {
    for (const [alpha, beta, p, expected] of GAMMA_GAMMA_TAIL) {
      expect(Math.abs(gammaGammaQuantile(alpha, beta, p) / expected - 1)).toBeLessThan(1e-6);
      expect(gammaGammaQuantileSearch(alpha, beta, p).passes).toBeLessThanOrEqual(12);
    }
  });

  it('answers a finite quantile with bounded work even far below the design range', () => {
    for (const [alpha, beta] of [[4.184964796488559, 25.525647674009306], [2.1, 1.01], [450, 480], [0.7, 0.6]] as const) {
      for (const p of [1e-17, 1e-30, 1e-100]) {
        const threshold = gammaGammaQuantile(alpha, beta, p);
        expect(threshold).toBeGreaterThan(0);
        expect(Number.isFinite(fadeMarginDb({ model: 'gamma-gamma', alpha, beta, probability: p }))).toBe(true);
        expect(gammaGammaQuantileSearch(alpha, beta, p).passes).toBeLessThanOrEqual(60);
        const cdf = gammaGammaCdf(threshold, alpha, beta);
        // where the CDF is still representable it must come back to p
        if (p >= 1e-100) expect(cdf / p).toBeCloseTo(1, 5);
      }
    }
  });

  it('the log-normal fade margin stays finite below p = 1e-16', () => {
    // ln I_T = −σ²/2 + σ·Φ⁻¹(p), σ² = ln(1 + σ_I²): with σ_I² = 0.2 and Φ⁻¹(1e-17) from ndtri
    const logVariance = Math.log1p(0.2);
    const expected = -(10 / Math.LN10) * (-logVariance / 2 + Math.sqrt(logVariance) * -8.493793224109599);
    expect(fadeMarginLognormalDb(0.2, 1e-17)).toBeCloseTo(expected, 9);
  });
});
