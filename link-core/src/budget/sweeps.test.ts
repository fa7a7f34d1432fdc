import { describe, expect, it } from 'vitest';
import { workedExampleDesign } from '../examples/worked-example.js';
import { evaluateLink } from './evaluate-link.js';
import { marginVsRange, marginVsVisibility } from './samplers.js';
import { VARIABLE_DESIGN_FIELDS, designFieldRange, withDesignValue, type VariableDesignField } from './design-fields.js';
import { marginGrid, marginSweep, MAX_GRID_POINTS, sweepAxisValues } from './sweeps.js';

const worked = workedExampleDesign();

describe('sweepAxisValues', () => {
  it('spaces linearly or logarithmically with exact ends, in either direction', () => {
    const linear = sweepAxisValues({ field: 'rangeM', from: 500, to: 5000, points: 10 }).values;
    expect(linear[0]).toBe(500);
    expect(linear[9]).toBe(5000);
    for (let i = 1; i < 10; i++) expect(linear[i]! - linear[i - 1]!).toBeCloseTo(500, 9);
    const log = sweepAxisValues({ field: 'atmosphere.visibilityM', from: 20_000, to: 200, points: 5, spacing: 'log' }).values;
    expect(Array.from(log)).toEqual([20_000, expect.closeTo(20_000 / Math.sqrt(10), 6), expect.closeTo(2000, 8), expect.closeTo(200 * Math.sqrt(10), 8), 200]);
  });
});

describe('marginSweep', () => {
  it('agrees with marginVsRange over range (the §10.5 sampler on the internal chain)', () => {
    const sweep = marginSweep(worked, { field: 'rangeM', from: 50, to: 4000, points: 101 });
    const reference = marginVsRange(worked, { fromM: 50, toM: 4000, points: 101 });
    sweep.linkMarginDb.forEach((margin, i) => expect(margin).toBeCloseTo(reference.linkMarginDb[i]!, 9));
    expect(sweep.axis.designValue).toBe(2000);
  });

  it('agrees with marginVsVisibility over log-spaced visibility', () => {
    // Up to 40 km: marginVsVisibility's last sample comes out as 50000.00000000001 m, just past
    // Kim's published step at 50 km (METHODS.md §10.6), where this sweep's exact end does not go.
    const sweep = marginSweep(worked, { field: 'atmosphere.visibilityM', from: 50, to: 40_000, points: 61, spacing: 'log' });
    const reference = marginVsVisibility(worked, { fromM: 50, toM: 40_000, points: 61 });
    sweep.linkMarginDb.forEach((margin, i) => expect(margin).toBeCloseTo(reference.linkMarginDb[i]!, 9));
    sweep.axis.values.forEach((value, i) => expect(value).toBeCloseTo(reference.visibilityM[i]!, 6));
  });

  it('evaluates every field of VARIABLE_DESIGN_FIELDS as the budget of the changed design', () => {
    for (const field of VARIABLE_DESIGN_FIELDS) {
      const range = designFieldRange(field);
      const upper = Math.min(range.upper, field === 'rangeM' ? 10_000 : range.upper);
      const from = range.lowerExclusive || range.lower === 0 ? upper / 100 : range.lower;
      const sweep = marginSweep(worked, { field, from, to: upper, points: 7, spacing: from > 0 ? 'log' : 'linear' });
      sweep.axis.values.forEach((value, i) => expect(sweep.linkMarginDb[i]).toBe(evaluateLink(withDesignValue(worked, field, value)).linkMarginDb));
    }
  });

  it('moves the margin 1 dB per dB of power and down with the jitter (§10.1)', () => {
    const power = marginSweep(worked, { field: 'transmitter.powerDbm', from: 0, to: 30, points: 4 });
    for (let i = 1; i < 4; i++) expect(power.linkMarginDb[i]! - power.linkMarginDb[i - 1]!).toBeCloseTo(10, 9);
    const jitter = marginSweep(worked, { field: 'pointing.jitterSigmaPerAxisRad', from: 0, to: 300e-6, points: 13 });
    for (let i = 1; i < 13; i++) expect(jitter.linkMarginDb[i]!).toBeLessThan(jitter.linkMarginDb[i - 1]!);
  });

  it('marks an absent optional field as null', () => {
    const { halfAngleDivergenceRad: _divergence, ...collimatedTransmitter } = worked.transmitter;
    const sweep = marginSweep({ ...worked, transmitter: collimatedTransmitter }, { field: 'transmitter.halfAngleDivergenceRad', from: 1e-5, to: 1e-2, points: 4, spacing: 'log' });
    expect(sweep.axis.designValue).toBeNull();
  });

  it('rejects a bad axis or design, naming the entry and the reason', () => {
    expect(() => marginSweep(worked, { field: 'rangeM', from: 100, to: 2e5, points: 3 })).toThrow('marginSweep: axis.to: must be at most 100 km (as rangeM)');
    expect(() => marginSweep(worked, { field: 'atmosphere.cn2', from: 0, to: 1e-13, points: 3, spacing: 'log' })).toThrow(/axis\.from: must be greater than 0 for log spacing/);
    expect(() => marginSweep(worked, { field: 'rangeM', from: 100, to: 100, points: 3 })).toThrow(/axis\.to: must differ from from/);
    expect(() => marginSweep(worked, { field: 'rangeM', from: 100, to: 200, points: 2.5 })).toThrow(/axis\.points: must be a whole number/);
    expect(() => marginSweep(worked, { field: 'rangeM', from: 100, to: 200, points: 2001 })).toThrow(/axis\.points: must be at most 2000/);
    expect(() => marginSweep(worked, { field: 'transmitter.wavelengthM' as VariableDesignField, from: 1e-6, to: 2e-6, points: 3 })).toThrow(/axis\.field: must be one of rangeM, /);
    expect(() => marginSweep({ ...worked, rangeM: 0 }, { field: 'rangeM', from: 100, to: 200, points: 3 })).toThrow(/design\.rangeM: must be greater than 0/);
  });
});

describe('marginGrid', () => {
  const grid = marginGrid(worked, {
    x: { field: 'rangeM', from: 500, to: 5000, points: 20 },
    y: { field: 'atmosphere.visibilityM', from: 200, to: 20_000, points: 10, spacing: 'log' },
  });

  it('stores the margins row-major (row = y, column = x), each the budget of that point', () => {
    expect(grid.linkMarginDb).toHaveLength(200);
    for (const [i, j] of [[0, 0], [19, 0], [0, 9], [7, 4], [19, 9]] as const) {
      const design = withDesignValue(withDesignValue(worked, 'rangeM', grid.x.values[i]!), 'atmosphere.visibilityM', grid.y.values[j]!);
      expect(grid.linkMarginDb[j * 20 + i]).toBe(evaluateLink(design).linkMarginDb);
    }
    // the margin falls with range along a row and rises with visibility down a column
    expect(grid.linkMarginDb[5 * 20 + 19]!).toBeLessThan(grid.linkMarginDb[5 * 20]!);
    expect(grid.linkMarginDb[9 * 20 + 10]!).toBeGreaterThan(grid.linkMarginDb[10]!);
  });

  it('gives the colour range and the design point', () => {
    expect(grid.minMarginDb).toBe(Math.min(...grid.linkMarginDb));
    expect(grid.maxMarginDb).toBe(Math.max(...grid.linkMarginDb));
    expect(grid.x.designValue).toBe(2000);
    expect(grid.y.designValue).toBe(5000);
  });

  it('rejects the same field twice, too many points, and a bad axis, naming it', () => {
    const axis = { field: 'rangeM', from: 500, to: 5000, points: 10 } as const;
    expect(() => marginGrid(worked, { x: axis, y: axis })).toThrow('marginGrid: y.field: must differ from x.field (rangeM)');
    expect(() => marginGrid(worked, { x: { ...axis, points: 1000 }, y: { field: 'atmosphere.cn2', from: 0, to: 1e-13, points: 251 } })).toThrow(
      `marginGrid: y.points: x.points × y.points must be at most ${MAX_GRID_POINTS} (got 251000)`,
    );
    expect(() => marginGrid(worked, { x: axis, y: { field: 'atmosphere.visibilityM', from: 0, to: 100, points: 3 } })).toThrow(/y\.from: must be greater than 0 \(as atmosphere\.visibilityM\)/);
  });
});
