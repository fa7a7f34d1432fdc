import { describe, expect, it } from 'vitest';
import { availabilityFromRecords } from '../budget/availability.js';
import { VisibilityClimatologySchema, VisibilityRecordsSchema } from './availability.schema.js';
import { formatZodIssues } from './format-zod-issues.js';

describe('VisibilityClimatologySchema', () => {
  it('accepts the synthetic table of LB-03', () => {
    const table = { visibilityM: [50, 100, 200, 500, 1000, 2000, 5000, 10000], probabilityBelow: [0.0005, 0.001, 0.002, 0.005, 0.01, 0.03, 0.1, 0.3] };
    expect(VisibilityClimatologySchema.parse(table)).toEqual(table);
  });

  it('names the level that breaks the order and the non-finite value', () => {
    const result = VisibilityClimatologySchema.safeParse({ visibilityM: [100, 50, Number.NaN], probabilityBelow: [0.2, 0.1, 0.3] });
    expect(formatZodIssues(result.error!)).toEqual([{ path: 'visibilityM.2', message: 'must be a finite number' }]);
    const order = VisibilityClimatologySchema.safeParse({ visibilityM: [100, 50], probabilityBelow: [0.2, 0.1] });
    expect(formatZodIssues(order.error!)).toEqual([
      { path: 'visibilityM.1', message: 'must be greater than the previous level' },
      { path: 'probabilityBelow.1', message: 'must not be less than the previous probability' },
    ]);
  });
});

describe('VisibilityRecordsSchema', () => {
  it('accepts nulls for missing readings, which availabilityFromRecords counts as missing', () => {
    const records = VisibilityRecordsSchema.parse({ visibilityM: [10_000, null, 300], timestampsMs: [0, 3_600_000, 7_200_000] });
    const design = {
      rangeM: 1000,
      transmitter: { wavelengthM: 1.55e-6, powerDbm: 20, waistRadiusM: 0.025, halfAngleDivergenceRad: 1e-3, opticsLossDb: 1 },
      receiver: { apertureDiameterM: 0.1, sensitivityDbm: -36, opticsLossDb: 1.5 },
      pointing: { jitterSigmaPerAxisRad: 50e-6, staticErrorRad: 100e-6 },
      atmosphere: { visibilityM: 5000, cn2: 5e-14 },
    };
    const result = availabilityFromRecords(design, { ...records, visibilityM: records.visibilityM.map((v) => v ?? Number.NaN) });
    expect(result).toMatchObject({ usableCount: 2, missingCount: 1, unavailableHours: 1 });
  });

  it('rejects timestamps that do not increase, with the index', () => {
    const result = VisibilityRecordsSchema.safeParse({ visibilityM: [1, 2, 3], timestampsMs: [0, 10, 10] });
    expect(formatZodIssues(result.error!)).toEqual([{ path: 'timestampsMs.2', message: 'timestamps must increase strictly' }]);
  });
});
