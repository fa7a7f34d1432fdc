import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { minimiseBrent } from './minimisation.js';

describe('minimiseBrent', () => {
  it('finds the minimum of cos on [3, 4] at π (analytic)', () => {
    const minimum = minimiseBrent(Math.cos, 3, 4, { xTolerance: 1e-12 });
    // A smooth minimum is resolved to about √ε relative in x: f is flat to second order there.
    expect(minimum.x).toBeCloseTo(Math.PI, 7);
    expect(minimum.value).toBeCloseTo(-1, 14);
  });

  it('finds the maximum of x·e^(−x) at x = 1 (analytic: d/dx = (1 − x)e^(−x))', () => {
    const minimum = minimiseBrent((x) => -x * Math.exp(-x), 0, 5);
    expect(minimum.x).toBeCloseTo(1, 7);
    expect(-minimum.value).toBeCloseTo(Math.exp(-1), 14);
  });

  it('finds a kink (|x − c|, not differentiable at c) to the requested tolerance', () => {
    const minimum = minimiseBrent((x) => Math.abs(x - 0.3), -1, 2, { xTolerance: 1e-10 });
    expect(Math.abs(minimum.x - 0.3)).toBeLessThan(1e-8);
  });

  it('returns the end of the bracket when the function is monotone there', () => {
    const minimum = minimiseBrent((x) => x, 2, 3, { xTolerance: 1e-12 });
    // within a few times Brent's tolerance √ε·|x| + xTolerance ≈ 3e-8 of the end
    expect(minimum.x - 2).toBeLessThan(1e-7);
    expect(minimum.x).toBeGreaterThanOrEqual(2);
  });

  it('never evaluates outside the bracket', () => {
    const seen: number[] = [];
    minimiseBrent((x) => {
      seen.push(x);
      return (x - 10) ** 2;
    }, 0, 1);
    expect(Math.min(...seen)).toBeGreaterThanOrEqual(0);
    expect(Math.max(...seen)).toBeLessThanOrEqual(1);
  });

  it('locates the vertex of random parabolas (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: -50, max: 50, noNaN: true }), fc.double({ min: 0.01, max: 100, noNaN: true }), (vertex, curvature) => {
        const minimum = minimiseBrent((x) => curvature * (x - vertex) ** 2 + 3, -60, 60);
        return Math.abs(minimum.x - vertex) <= 1e-6 * Math.max(1, Math.abs(vertex));
      }),
    );
  });

  it('rejects an empty or reversed bracket, naming the bounds', () => {
    expect(() => minimiseBrent(Math.cos, 1, 1)).toThrow(/lower < upper/);
    expect(() => minimiseBrent(Math.cos, 2, 1)).toThrow(RangeError);
    expect(() => minimiseBrent(Math.cos, 0, Number.NaN)).toThrow(RangeError);
  });
});
