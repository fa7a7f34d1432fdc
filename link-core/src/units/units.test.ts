import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { formatQuantity, parseQuantity } from './parse-quantity.js';
import { beamWidthDefinitionRatio, convertBeamWidth } from './beam-width.js';
import { dbmToWatts, wattsToDbm } from './decibels.js';

describe('parseQuantity', () => {
  it.each([
    ['25 mm', 'length', 0.025],
    ['1.55 µm', 'length', 1.55e-6],
    ['1.55 um', 'length', 1.55e-6],
    ['3 km', 'length', 3000],
    ['0.9 mrad', 'angle', 9e-4],
    ['20 µrad', 'angle', 2e-5],
    ['50 mW', 'power', 0.05],
    ['5e-14', 'structureConstant', 5e-14],
    ['0.1 %', 'fraction', 1e-3],
    ['3 dB', 'decibel', 3],
  ] as const)('reads %s as %s', (text, kind, expected) => {
    const result = parseQuantity(text, kind);
    expect(result.ok).toBe(true);
    if (result.ok) expect(result.valueSi).toBeCloseTo(expected, 15);
  });
  it('reads dBm (not known to mathjs) into watts', () => {
    const result = parseQuantity('17 dBm', 'power');
    expect(result.ok && result.valueSi).toBeCloseTo(0.0501187233627, 12);
  });
  it('applies the field default unit to plain numbers', () => {
    const result = parseQuantity('25', 'length', { defaultUnit: 'mm' });
    expect(result.ok && result.valueSi).toBeCloseTo(0.025, 15);
  });
  it.each([
    ['', 'length', /empty/],
    ['5 W', 'length', /not a unit of length/],
    ['5 furlongs', 'length', /unknown unit/],
    ['1,5 mm', 'length', /decimal separator/],
    ['-2 mm', 'length', /negative/],
    ['NaN', 'angle', /finite/],
    ['Infinity m', 'length', /finite/],
    ['1e999 m', 'length', /finite/],
    ['abc', 'power', /not a number/],
  ] as const)('rejects %j with a reason', (text, kind, reason) => {
    const result = parseQuantity(text, kind);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.reason).toMatch(reason);
  });
  it('formats and parses back within the printed precision (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-9, max: 1e5, noNaN: true }), (metres) => {
        const parsed = parseQuantity(formatQuantity(metres, 'length', { significantDigits: 6 }), 'length');
        return parsed.ok && Math.abs(parsed.valueSi / metres - 1) < 1e-5;
      }),
    );
  });
  it('formats common values', () => {
    expect(formatQuantity(0.025, 'length')).toBe('25 mm');
    expect(formatQuantity(9e-4, 'angle')).toBe('0.9 mrad');
    expect(formatQuantity(0.05, 'power', { unit: 'dBm' })).toBe('16.99 dBm');
  });
});

describe('width definitions and dB', () => {
  it('1/e² = 1.6986 × FWHM, 1/e = 1.2011 × FWHM, 1/e² = √2 × 1/e (Siegman 1986 §17.1)', () => {
    expect(beamWidthDefinitionRatio('1/e2', 'fwhm')).toBeCloseTo(Math.sqrt(2 / Math.LN2), 15);
    expect(beamWidthDefinitionRatio('1/e', 'fwhm')).toBeCloseTo(1 / Math.sqrt(Math.LN2), 15);
    expect(beamWidthDefinitionRatio('1/e2', '1/e')).toBeCloseTo(Math.SQRT2, 15);
  });
  it('converts a full FWHM datasheet angle to the 1/e² half-angle', () => {
    expect(convertBeamWidth({ value: 2e-3, definition: 'fwhm', extent: 'diameter' }, { definition: '1/e2', extent: 'radius' })).toBeCloseTo(1e-3 * Math.sqrt(2 / Math.LN2), 15);
  });
  it('0 dBm is 1 mW and the conversions invert each other', () => {
    expect(dbmToWatts(0)).toBe(1e-3);
    expect(wattsToDbm(dbmToWatts(17.3))).toBeCloseTo(17.3, 12);
  });
});

describe('bundle boundary', () => {
  it('the main entry never imports the mathjs-based parser (it ships as the ./units subpath)', () => {
    const index = readFileSync(new URL('../index.ts', import.meta.url), 'utf8');
    expect(index).not.toMatch(/parse-quantity/);
    expect(index).not.toMatch(/from 'mathjs'/);
  });
});
