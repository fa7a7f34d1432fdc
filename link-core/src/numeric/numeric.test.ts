import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { integrate } from './quadrature.js';
import { findRootBrent } from './root-finding.js';
import { besselI0Scaled } from './bessel.js';
import { marcumQ1, marcumQ1Complement, noncentralChiSquare2Tails } from './marcum-q.js';

describe('integrate (adaptive Gauss–Kronrod)', () => {
  it('is exact for polynomials up to degree 22 on one panel, here x^10 on [0, 1]', () => {
    expect(integrate((x) => x ** 10, 0, 1)).toBeCloseTo(1 / 11, 14);
  });
  it('integrates sin over [0, π] to 2 and a Gaussian to sqrt(π) (analytic values)', () => {
    expect(integrate(Math.sin, 0, Math.PI)).toBeCloseTo(2, 13);
    expect(integrate((x) => Math.exp(-x * x), -10, 10)).toBeCloseTo(Math.sqrt(Math.PI), 12);
  });
  it('follows the sign of reversed limits', () => {
    expect(integrate((x) => x, 1, 0)).toBeCloseTo(-0.5, 14);
  });
});

describe('findRootBrent', () => {
  it('finds the fixed point of cos (the Dottie number 0.7390851332151607, a known constant)', () => {
    expect(findRootBrent((x) => Math.cos(x) - x, 0, 1)).toBeCloseTo(0.7390851332151607, 14);
  });
  it('rejects a bracket without a sign change', () => {
    expect(() => findRootBrent((x) => x * x + 1, -1, 1)).toThrow(RangeError);
  });
  it('solves x^3 = c for random c (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.001, max: 1000, noNaN: true }), (c) => {
        const root = findRootBrent((x) => x * x * x - c, 0, 11);
        return Math.abs(root - Math.cbrt(c)) <= 1e-12 * Math.max(1, Math.cbrt(c));
      }),
    );
  });
});

describe('besselI0Scaled', () => {
  // Table values of I0 from Abramowitz & Stegun (1964), table 9.8: I0(1) = 1.266065878, I0(2) = 2.279585302.
  it('matches tabulated I0 values', () => {
    expect(besselI0Scaled(1) * Math.E).toBeCloseTo(1.266065878, 9);
    expect(besselI0Scaled(2) * Math.exp(2)).toBeCloseTo(2.279585302, 9);
    expect(besselI0Scaled(0)).toBe(1);
  });
  it('joins the series and the asymptotic branch smoothly at 25', () => {
    // 25 − 1e-12 uses the series, 25 the asymptotic expansion; the slope adds only ~2e-14 here.
    const below = besselI0Scaled(25 - 1e-12);
    const above = besselI0Scaled(25);
    expect(Math.abs(below - above) / below).toBeLessThan(1e-13);
  });
  it('agrees with the integral form (1/π)∫0^π e^(x cos t − x) dt (A&S 9.6.16)', () => {
    for (const x of [0.3, 5, 24, 26, 80]) {
      const integral = integrate((t) => Math.exp(x * Math.cos(t) - x), 0, Math.PI) / Math.PI;
      expect(Math.abs(besselI0Scaled(x) - integral) / integral).toBeLessThan(1e-12);
    }
  });
});

describe('Marcum Q1 / noncentral chi-square (2 dof)', () => {
  it('reduces to the Rayleigh tail exp(−b²/2) when a = 0', () => {
    expect(marcumQ1(0, 3)).toBeCloseTo(Math.exp(-4.5), 15);
  });
  it('satisfies Q1(a,b) + Q1(b,a) = 1 + exp(−(a²+b²)/2)·I0(ab) (Marcum 1960 symmetry relation)', () => {
    for (const [a, b] of [[0.5, 1.5], [2, 3], [4, 1], [6, 7.5]] as const) {
      const left = marcumQ1(a, b) + marcumQ1(b, a);
      const right = 1 + Math.exp(-((a - b) ** 2) / 2) * besselI0Scaled(a * b);
      expect(Math.abs(left - right)).toBeLessThan(1e-13);
    }
  });
  it('gives Q1(a, a) = ½(1 + e^(−a²)·I0(a²)) on both sides of the series/quadrature switch (a up to 100)', () => {
    for (const a of [5, 17, 24.4, 24.5, 40, 50, 100]) {
      expect(Math.abs(marcumQ1(a, a) - 0.5 * (1 + besselI0Scaled(a * a)))).toBeLessThan(1e-12);
    }
  });
  it('agrees with quadrature of the Rice density, including deep tails', () => {
    for (const [a, b] of [[1, 4.318249577], [3, 7.853179523], [2, 0.5], [10, 2]] as const) {
      const tail = integrate((t) => t * Math.exp(-((t - a) ** 2) / 2) * besselI0Scaled(a * t), b, a + b + 40, { absoluteTolerance: 1e-300, relativeTolerance: 1e-12 });
      const q = marcumQ1(a, b);
      expect(Math.abs(q - tail) / tail).toBeLessThan(1e-9);
    }
  });
  it('computes both tails without cancellation', () => {
    const tails = noncentralChiSquare2Tails(1e-6, 4);
    expect(tails.cdf).toBeGreaterThan(0);
    expect(tails.cdf).toBeLessThan(1e-6);
    expect(marcumQ1Complement(0.1, 1e-4)).toBeGreaterThan(0);
  });
  it('stays in [0, 1] and the two tails sum to 1 (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 40, noNaN: true }), fc.double({ min: 0, max: 40, noNaN: true }), (a, b) => {
        const q = marcumQ1(a, b);
        const p = marcumQ1Complement(a, b);
        return q >= 0 && q <= 1 && Math.abs(p + q - 1) < 1e-12;
      }),
    );
  });
  it('handles a large noncentrality without underflow (a = 40, b = 40: Q1 ≈ 0.5)', () => {
    const q = marcumQ1(40, 40);
    expect(q).toBeGreaterThan(0.45);
    expect(q).toBeLessThan(0.55);
  });
});
