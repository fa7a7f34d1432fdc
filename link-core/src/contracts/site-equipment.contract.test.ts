import { describe, expect, it } from 'vitest';
import { formatZodIssues } from '../schemas/format-zod-issues.js';
import { CreateEquipmentRequestSchema, equipmentCsvColumnOf, equipmentCsvRecordToRequest } from './equipment.contract.js';
import { CreateSiteRequestSchema } from './sites.contract.js';

const site = { name: 'Roof', groundElevationM: 10, mountHeightM: 5 };

describe('site coordinates', () => {
  it('reads decimal degrees and DMS text (ISO 6709 sexagesimal forms)', () => {
    // 56°00′47.808″ = 56 + 0/60 + 47.808/3600 = 56.01328° (hand arithmetic)
    const parsed = CreateSiteRequestSchema.parse({ ...site, latitudeDeg: '56°00′47.808″N', longitudeDeg: '10 01 09.156 E' });
    expect(parsed.latitudeDeg).toBeCloseTo(56.01328, 9);
    expect(parsed.longitudeDeg).toBeCloseTo(10 + 1 / 60 + 9.156 / 3600, 9);
    expect(CreateSiteRequestSchema.parse({ ...site, latitudeDeg: '-37.95', longitudeDeg: 144.5 }).latitudeDeg).toBe(-37.95);
    expect(CreateSiteRequestSchema.parse({ ...site, latitudeDeg: '37 57 0 S', longitudeDeg: '144d30\'W' }).longitudeDeg).toBe(-144.5);
  });

  it('refuses a hemisphere of the other axis, minutes past 60 and out-of-range angles, naming the field', () => {
    const result = CreateSiteRequestSchema.safeParse({ ...site, latitudeDeg: '10°E', longitudeDeg: '10°61′' });
    expect(formatZodIssues(result.error!).map((issue) => issue.path).sort()).toEqual(['latitudeDeg', 'longitudeDeg']);
    const range = CreateSiteRequestSchema.safeParse({ ...site, latitudeDeg: 91, longitudeDeg: '181' });
    expect(formatZodIssues(range.error!)).toEqual([
      { path: 'latitudeDeg', message: 'must be at most 90' },
      { path: 'longitudeDeg', message: 'must be at most 180' },
    ]);
  });
});

describe('equipment CSV rows', () => {
  it('builds a create request from a transmitter row', () => {
    const row = equipmentCsvRecordToRequest({ kind: 'transmitter', name: 'T1', maker: '', wavelengthM: '1.55e-6', powerDbm: '20', 'beamSize.kind': 'waist-radius', 'beamSize.waistRadiusM': '0.025', opticsLossDb: '1' });
    expect(row.ok).toBe(true);
    const request = CreateEquipmentRequestSchema.parse(row.ok ? row.request : null);
    expect(request).toMatchObject({ kind: 'transmitter', spec: { wavelengthM: 1.55e-6, beamSize: { kind: 'waist-radius', waistRadiusM: 0.025 }, m2: 1 } });
  });

  it('names the cells that are not numbers or belong to the other kind', () => {
    const row = equipmentCsvRecordToRequest({ kind: 'receiver', name: 'R1', apertureDiameterM: '0x10', wavelengthM: '1e-6', sensitivityDbm: ' ' });
    expect(row).toEqual({
      ok: false,
      errors: [
        { column: 'wavelengthM', reason: 'must be empty for a receiver' },
        { column: 'apertureDiameterM', reason: 'must be a number in decimal notation' },
      ],
    });
    expect(equipmentCsvColumnOf('spec.beamSize.diameterM')).toBe('beamSize.diameterM');
  });
});
