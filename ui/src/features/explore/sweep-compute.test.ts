import { describe, expect, it } from 'vitest';
import { evaluateLink, workedExampleDesign } from '@beamwright/link-core';
import { axisValuesSi, computeGridSweep, computeLineSweep, withInput } from '@/features/explore/sweep-compute';
import { marginContours } from '@/features/explore/charts/heat-map-chart';
import { exploreSettingsSchema, defaultExploreSettings } from '@/features/explore/explore-settings';

const design = workedExampleDesign();

describe('sweep samples', () => {
  it('spaces linear and logarithmic axes with both ends included', () => {
    expect(Array.from(axisValuesSi({ field: 'rangeM', fromSi: 1000, toSi: 3000, points: 5, spacing: 'linear' }))).toEqual([1000, 1500, 2000, 2500, 3000]);
    const log = axisValuesSi({ field: 'atmosphere.visibilityM', fromSi: 100, toSi: 10_000, points: 3, spacing: 'log' });
    expect(log[0]).toBeCloseTo(100, 9);
    expect(log[1]).toBeCloseTo(1000, 9);
    expect(log[2]).toBeCloseTo(10_000, 9);
  });

  it('computes each point with the engine, everything but the swept input as designed', () => {
    const axis = { field: 'transmitter.powerDbm', fromSi: 0, toSi: 20, points: 3, spacing: 'linear' } as const;
    const sweep = computeLineSweep(design, axis);
    sweep.xSi.forEach((powerDbm, index) => {
      const expected = evaluateLink({ ...design, transmitter: { ...design.transmitter, powerDbm } }).linkMarginDb;
      expect(sweep.marginDb[index]).toBeCloseTo(expected, 12);
    });
    // a power step moves the margin dB for dB (every other term is independent of the power)
    expect(sweep.marginDb[2]! - sweep.marginDb[0]!).toBeCloseTo(20, 9);
  });

  it('lays a heat map out row by row (vertical input outer, horizontal inner)', () => {
    const x = { field: 'rangeM', fromSi: 500, toSi: 2000, points: 4, spacing: 'linear' } as const;
    const y = { field: 'atmosphere.visibilityM', fromSi: 500, toSi: 20_000, points: 3, spacing: 'log' } as const;
    const grid = computeGridSweep(design, x, y);
    expect(grid.marginDb.length).toBe(12);
    const iy = 2;
    const ix = 1;
    const expected = evaluateLink(withInput(withInput(design, 'atmosphere.visibilityM', grid.ySi[iy]!), 'rangeM', grid.xSi[ix]!)).linkMarginDb;
    expect(grid.marginDb[iy * 4 + ix]).toBeCloseTo(expected, 12);
  });

  it('leaves a point the engine refuses as NaN instead of failing the sweep', () => {
    const sweep = computeLineSweep(design, { field: 'rangeM', fromSi: -100, toSi: 1000, points: 2, spacing: 'linear' });
    expect(Number.isNaN(sweep.marginDb[0])).toBe(true);
    expect(Number.isFinite(sweep.marginDb[1])).toBe(true);
  });
});

describe('margin contours', () => {
  // a plane, margin = x − 5 dB on x = 0…10: the 0 dB line is x = 5 and the 3 dB line x = 8
  const nx = 11;
  const ny = 6;
  const xAxis = { field: 'rangeM', fromSi: 0, toSi: 10_000, points: nx, spacing: 'linear' } as const;
  const yAxis = { field: 'atmosphere.visibilityM', fromSi: 1000, toSi: 6000, points: ny, spacing: 'linear' } as const;
  const marginDb = new Float64Array(nx * ny);
  for (let iy = 0; iy < ny; iy++) for (let ix = 0; ix < nx; ix++) marginDb[iy * nx + ix] = ix - 5;
  const result = { xSi: axisValuesSi(xAxis), ySi: axisValuesSi(yAxis), marginDb, computeMs: 0 };

  it('draws each level where the margin crosses it, without the grid-edge stretches', () => {
    const [zero, required] = marginContours({ xAxis, yAxis, result }, [0, 3]);
    const zeroPoints = zero!.lines.flat();
    const requiredPoints = required!.lines.flat();
    expect(zeroPoints.length).toBeGreaterThan(3);
    // display unit of the range axis is km: x = 5 km and 8 km
    for (const [x] of zeroPoints) expect(x).toBeCloseTo(5, 6);
    for (const [x] of requiredPoints) expect(x).toBeCloseTo(8, 6);
    // the line spans the vertical axis (1…6 km visibility) and no point sits on the left or right edge
    const ys = zeroPoints.map(([, y]) => y);
    expect(Math.min(...ys)).toBeCloseTo(1, 6);
    expect(Math.max(...ys)).toBeCloseTo(6, 6);
  });
});

describe('explorer settings', () => {
  it('starts from a valid line sweep along the path length', () => {
    const parsed = exploreSettingsSchema.safeParse(defaultExploreSettings(design));
    expect(parsed.success).toBe(true);
    expect(parsed.success && parsed.data.x.field).toBe('rangeM');
  });

  it('names the field and the reason for a bad setting', () => {
    const settings = defaultExploreSettings(design);
    const bad = { ...settings, mode: 'grid', x: { ...settings.x, spacing: 'log', from: '-1' }, y: { ...settings.y, field: 'rangeM' } };
    const parsed = exploreSettingsSchema.safeParse(bad);
    expect(parsed.success).toBe(false);
    const issues = parsed.success ? [] : parsed.error.issues.map((issue) => `${issue.path.join('.')}: ${issue.message}`);
    expect(issues).toContain('x.from: must be above 0 on a logarithmic scale');
    expect(issues).toContain('y.field: must differ from the horizontal input');
  });
});
