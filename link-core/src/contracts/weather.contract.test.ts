import { describe, expect, it } from 'vitest';
import { formatZodIssues } from '../schemas/format-zod-issues.js';
import {
  detectDelimiter,
  guessWeatherMapping,
  isMissingValue,
  parseMeasurement,
  parseObservationTime,
  readWeatherRow,
  resolveWeatherColumns,
} from './weather-columns.js';
import { RevisionAvailabilityQuerySchema, WeatherColumnMappingSchema, WeatherDatasetUploadFieldsSchema, type WeatherColumnMapping } from './weather.contract.js';

const mapping: WeatherColumnMapping = { timestampColumn: 'time', visibilityColumn: 'vis_km', visibilityUnit: 'km', visibilityDefinition: 'mor-5-percent' };

function issuesOf(schema: { safeParse: (value: unknown) => { success: boolean; error?: unknown } }, value: unknown) {
  const result = schema.safeParse(value);
  return result.success ? [] : formatZodIssues(result.error as never);
}

describe('the upload fields', () => {
  it('reads the mapping from its JSON text and defaults onRowErrors to reject', () => {
    const parsed = WeatherDatasetUploadFieldsSchema.parse({ name: ' Harbour 2019 ', mapping: JSON.stringify(mapping), siteId: '' });
    expect(parsed).toEqual({ name: 'Harbour 2019', notes: '', mapping, onRowErrors: 'reject', siteId: undefined });
  });

  it('names the field of every mistake, inside the mapping too', () => {
    expect(issuesOf(WeatherDatasetUploadFieldsSchema, { name: '', mapping: '{not json', onRowErrors: 'maybe' })).toEqual([
      { path: 'name', message: 'is required' },
      { path: 'onRowErrors', message: 'must be one of reject, skip' },
      { path: 'mapping', message: 'must be the JSON text of the column mapping (it is not valid JSON)' },
    ]);
    const wrongUnit = issuesOf(WeatherDatasetUploadFieldsSchema, { name: 'x', mapping: JSON.stringify({ ...mapping, visibilityUnit: 'yards' }) });
    expect(wrongUnit).toEqual([{ path: 'mapping.visibilityUnit', message: 'must be one of m, km, mi, ft' }]);
    expect(issuesOf(WeatherDatasetUploadFieldsSchema, { name: 'x' })).toEqual([{ path: 'mapping', message: 'is required' }]);
  });

  it('refuses one column for two quantities', () => {
    expect(issuesOf(WeatherColumnMappingSchema, { ...mapping, rainRateColumn: 'vis_km' })).toEqual([
      { path: 'rainRateColumn', message: 'is the column already chosen for visibilityColumn' },
    ]);
  });

  it('reads the availability query from text, with the required margin defaulting to 0 dB', () => {
    const id = '6f1c0a4e-58a2-4a4d-9a40-6a0d1b3c2e11';
    expect(RevisionAvailabilityQuerySchema.parse({ datasetId: id })).toEqual({ datasetId: id, requiredMarginDb: 0 });
    expect(RevisionAvailabilityQuerySchema.parse({ datasetId: id, requiredMarginDb: '3' }).requiredMarginDb).toBe(3);
    expect(issuesOf(RevisionAvailabilityQuerySchema, { requiredMarginDb: 'lots' }).map((issue) => issue.path)).toEqual(['datasetId', 'requiredMarginDb']);
  });
});

describe('reading cells', () => {
  it('reads ISO 8601 timestamps, without a zone as UTC', () => {
    expect(parseObservationTime('2024-03-01T06:00')).toEqual({ ok: true, value: Date.UTC(2024, 2, 1, 6) });
    expect(parseObservationTime('2024-03-01 06:00:00Z')).toEqual({ ok: true, value: Date.UTC(2024, 2, 1, 6) });
    expect(parseObservationTime('2024-03-01T07:30+01:30')).toEqual({ ok: true, value: Date.UTC(2024, 2, 1, 6) });
    expect(parseObservationTime('2024-03-01T01:00-0500')).toEqual({ ok: true, value: Date.UTC(2024, 2, 1, 6) });
    expect(parseObservationTime('2024-03-01')).toEqual({ ok: true, value: Date.UTC(2024, 2, 1) });
    expect(parseObservationTime('2024-03-01T06:00:00.250Z')).toEqual({ ok: true, value: Date.UTC(2024, 2, 1, 6, 0, 0, 250) });
  });

  it('refuses what is not a date and time, saying why', () => {
    expect(parseObservationTime('01/03/2024 06:00')).toMatchObject({ ok: false, message: expect.stringMatching(/not an ISO 8601/) });
    expect(parseObservationTime('2023-02-29T00:00Z')).toEqual({ ok: false, message: '2023-02-29 is not a date' });
    expect(parseObservationTime('2024-03-01T25:00Z')).toMatchObject({ ok: false, message: expect.stringMatching(/not a time of day/) });
  });

  it('reads numbers with a point, the usual missing markers as null, and refuses comma decimals', () => {
    expect(parseMeasurement(' 1500 ')).toEqual({ ok: true, value: 1500 });
    expect(parseMeasurement('1.2e-14')).toEqual({ ok: true, value: 1.2e-14 });
    for (const missing of ['', 'NA', 'M', '////', 'null', '-']) expect(isMissingValue(missing)).toBe(true);
    expect(parseMeasurement('M')).toEqual({ ok: true, value: null });
    expect(parseMeasurement('1,5')).toMatchObject({ ok: false, message: expect.stringMatching(/comma/) });
    expect(parseMeasurement('fog')).toEqual({ ok: false, message: '"fog" is not a number' });
  });

  it('finds the delimiter outside quotes', () => {
    expect(detectDelimiter('time,vis')).toBe(',');
    expect(detectDelimiter('"a,b";time;vis')).toBe(';');
    expect(detectDelimiter('time\tvis\train')).toBe('\t');
  });
});

describe('rows against the mapping', () => {
  const header = ['\uFEFFtime', 'vis_km', 'rain'];

  it('names a mapped column the header lacks, under its mapping field', () => {
    expect(resolveWeatherColumns(header, { ...mapping, visibilityColumn: 'visibility' })).toEqual({
      issues: [{ path: 'mapping.visibilityColumn', message: 'names the column "visibility", which is not in the file\'s header ("time", "vis_km", "rain")' }],
    });
  });

  it('converts the visibility to metres and keeps a missing reading as null', () => {
    const resolved = resolveWeatherColumns(header, { ...mapping, rainRateColumn: 'rain' });
    if (!('columns' in resolved)) throw new Error('expected the columns');
    expect(readWeatherRow(['2024-01-01T00:00Z', '0.35', '1.5'], resolved.columns)).toEqual({
      ok: true,
      row: { observedAtMs: Date.UTC(2024, 0, 1), visibilityM: 350, rainRateMmPerH: 1.5, snowRateMmPerH: null, temperatureC: null, cn2: null },
    });
    expect(readWeatherRow(['2024-01-01T01:00Z', 'NA', ''], resolved.columns)).toMatchObject({ ok: true, row: { visibilityM: null, rainRateMmPerH: null } });
  });

  it('gives every unreadable cell its own error, and a row of the wrong length one', () => {
    const resolved = resolveWeatherColumns(header, { ...mapping, rainRateColumn: 'rain' });
    if (!('columns' in resolved)) throw new Error('expected the columns');
    expect(readWeatherRow(['yesterday', '-2', '900'], resolved.columns)).toEqual({
      ok: false,
      errors: [
        { column: 'time', message: '"yesterday" is not an ISO 8601 date and time (e.g. 2024-03-01T06:00Z)' },
        { column: 'vis_km', message: 'visibility must be greater than 0 (a 0 from a sensor means "below its lowest step": give that step, e.g. 50 m)' },
        { column: 'rain', message: 'rain rate 900 mm/h is outside 0 … 500 mm/h' },
      ],
    });
    expect(readWeatherRow(['2024-01-01T00:00Z'], resolved.columns)).toEqual({ ok: false, errors: [{ column: null, message: 'has 1 field where the header has 3' }] });
  });
});

describe('the column guess', () => {
  it('reads the names, the unit and MOR from an airport-style export', () => {
    expect(guessWeatherMapping(['valid', 'vsby', 'tmpc'], [['2024-01-01 00:00', '6.00', '3.1']])).toEqual({
      timestampColumn: 'valid',
      visibilityColumn: 'vsby',
      visibilityUnit: 'mi',
      visibilityDefinition: 'mor-5-percent',
      temperatureColumn: 'tmpc',
    });
  });

  it('falls back on the figures: a median above 100 is metres, and finds timestamps by their cells', () => {
    const guess = guessWeatherMapping(['stamp', 'visibility'], [['2024-01-01T00:00Z', '9999'], ['2024-01-01T01:00Z', '350']]);
    expect(guess).toMatchObject({ timestampColumn: 'stamp', visibilityColumn: 'visibility', visibilityUnit: 'm' });
    expect(guessWeatherMapping(['time', 'vis'], [['2024-01-01T00:00Z', '12.5']]).visibilityUnit).toBe('km');
  });
});
