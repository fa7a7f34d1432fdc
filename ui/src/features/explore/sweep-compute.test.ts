import { describe, expect, it } from 'vitest';
import { evaluateLink, workedExampleDesign } from '@beamwright/link-core';
import { sweepAxisValues, withDesignValue } from '@beamwright/link-core';
import { computeGridSweep, computeLineSweep, type SweepAxis } from '@/features/explore/sweep-compute';
import { marginContours } from '@/features/explore/charts/heat-map-chart';
import { exploreSettingsSchema, defaultExploreSettings } from '@/features/explore/explore-settings';

const design = workedExampleDesign();

describe('sweep samples', () => {
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
    const expected = evaluateLink(withDesignValue(withDesignValue(design, 'atmosphere.visibilityM', grid.ySi[iy]!), 'rangeM', grid.xSi[ix]!)).linkMarginDb;
    expect(grid.marginDb[iy * 4 + ix]).toBeCloseTo(expected, 12);
  });
});

describe('margin contours', () => {
  // a plane, margin = x − 6 dB on x = 1…11 km: the 0 dB line is x = 6 km and the 3 dB line x = 9 km
  const nx = 11;
  const ny = 6;
  const xAxis = { field: 'rangeM', fromSi: 1000, toSi: 11_000, points: nx, spacing: 'linear' } as const;
  const yAxis = { field: 'atmosphere.visibilityM', fromSi: 1000, toSi: 6000, points: ny, spacing: 'linear' } as const;
  const marginDb = new Float64Array(nx * ny);
  for (let iy = 0; iy < ny; iy++) for (let ix = 0; ix < nx; ix++) marginDb[iy * nx + ix] = ix - 5;
  const values = (axis: SweepAxis) => sweepAxisValues({ field: axis.field, from: axis.fromSi, to: axis.toSi, points: axis.points, spacing: axis.spacing }).values;
  const result = { xSi: values(xAxis), ySi: values(yAxis), marginDb, computeMs: 0 };

  it('draws each level where the margin crosses it, without the grid-edge stretches', () => {
    const [zero, required] = marginContours({ xAxis, yAxis, result }, [0, 3]);
    const zeroPoints = zero!.lines.flat();
    const requiredPoints = required!.lines.flat();
    expect(zeroPoints.length).toBeGreaterThan(3);
        for (const [x] of zeroPoints) expect(x).toBeCloseTo(6, 6);
    for (const [x] of requiredPoints) expect(x).toBeCloseTo(9, 6);
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

  it('keeps each end inside the design schema’s bounds, said in the unit shown', () => {
    const settings = defaultExploreSettings(design);
    const parsed = exploreSettingsSchema.safeParse({ ...settings, x: { ...settings.x, to: '500' } });
    const issues = parsed.success ? [] : parsed.error.issues.map((issue) => `${issue.path.join('.')}: ${issue.message}`);
    expect(issues).toEqual(['x.to: must be at most 100 km']);
  });
});
