import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { gzipSync } from 'node:zlib';
import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import { DataSource } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { availabilityFromRecords, evaluateLink, type LinkDesignInput } from '@beamwright/link-core';
import { meanPointingLossDb } from '@beamwright/link-core/physics';
import {
  ClimatologyAvailabilityResponseSchema,
  ErrorBodySchema,
  LinkDetailSchema,
  RevisionAvailabilitySchema,
  WEATHER_UPLOAD_LIMITS,
  WeatherDatasetListResponseSchema,
  WeatherImportJobSchema,
  WeatherImportResultSchema,
  WeatherRowErrorsBodySchema,
} from '@beamwright/link-core/contracts';
import { CHECKOUT_ROOT } from '../src/config/checkout-paths.js';
import { createTestApp } from './utils/test-app.js';
import { workedExampleDesign } from './utils/designs.js';
import { bearer, createTestOrganisation, type TestOrganisation } from './utils/test-organisation.js';
import { HOURLY_MAPPING, hourlyCsv, uploadWeather, waitForImportEnd } from './utils/weather.js';

/**
 * Weather data sets through the API: multipart upload (201, 202 + polling), row errors (422 and
 * nothing stored, or skipped), limits (413) and content checks (415), organisation scoping, and the
 * availability of a revision over the imported rows.
 */
describe('weather data sets (e2e)', () => {
  let app: INestApplication;
  let org: TestOrganisation;
  let other: TestOrganisation;
  let dataSource: DataSource;

  beforeAll(async () => {
    app = await createTestApp();
    dataSource = app.get(DataSource);
    org = await createTestOrganisation(app, 'weather');
    other = await createTestOrganisation(app, 'weather-other');
  });

  afterAll(async () => {
    await org?.remove();
    await other?.remove();
    await app?.close();
  });

  const http = () => request(app.getHttpServer());
  const engineer = () => org.members.engineer;
  const datasetsOf = async (organisation: TestOrganisation) =>
    WeatherDatasetListResponseSchema.parse((await http().get('/api/weather-datasets').set(...bearer(organisation.members.reviewer)).expect(200)).body).items;
  const recordCount = async () => Number((await dataSource.query(`SELECT count(*) AS n FROM weather_record r JOIN weather_dataset d ON d.id = r.dataset_id WHERE d.organisation_id = $1`, [org.id]))[0].n);
  const leftoverChunks = async () => Number((await dataSource.query(`SELECT count(*) AS n FROM weather_import_chunk c JOIN weather_import i ON i.id = c.import_id WHERE i.organisation_id = $1`, [org.id]))[0].n);

  async function createLink(design: LinkDesignInput = workedExampleDesign()) {
    const response = await http().post('/api/links').set(...bearer(engineer())).send({ name: `Weather link ${Math.random()}`, design }).expect(201);
    return LinkDetailSchema.parse(response.body);
  }

  describe('the availability of a small record set, counted by hand', () => {
    // 50 m fog takes far more than the ~30 dB clear-air margin of the worked example over 1 km; 20 km
    // visibility a fraction of a dB. From 31 January 22:00 UTC, hourly:
    // up, up | down, down, up, (no reading), down, up  ->  7 covered hours, 3 down, 2 outages, longest 2 h.
    const visibilities = [20000, 20000, 50, 50, 20000, 'NA', 50, 20000];
    const csv = hourlyCsv('2021-01-31T22:00:00Z', visibilities);

    it('imports the rows (201) and gives the hand-counted availability, equal to availabilityFromRecords on them', async () => {
      const upload = await uploadWeather(app, engineer(), csv, { name: 'Hand-counted hours' }).expect(201);
      const result = WeatherImportResultSchema.parse(upload.body);
      expect(result).toMatchObject({ rowsImported: 8, rowErrors: [], rowErrorCount: 0, missingVisibilityCount: 1 });

      const link = await createLink({ ...workedExampleDesign(), rangeM: 1000 });
      const answer = await http()
        .get(`/api/links/${link.id}/revisions/1/availability`)
        .query({ datasetId: result.id, requiredMarginDb: 0 })
        .set(...bearer(org.members.installer))
        .expect(200);
      const availability = RevisionAvailabilitySchema.parse(answer.body);
      expect(availability).toMatchObject({ coveredHours: 7, unavailableHours: 3, outageCount: 2, longestOutageH: 2, missingCount: 1, recordCount: 8 });
      expect(availability.availability).toBeCloseTo(4 / 7, 12);
      expect(availability.months).toEqual([
        { month: 1, availability: 1, coveredHours: 2, unavailableHours: 0 },
        { month: 2, availability: 0.4, coveredHours: 5, unavailableHours: 3 },
      ]);

      const start = Date.parse('2021-01-31T22:00:00Z');
      const expected = availabilityFromRecords(link.design, {
        visibilityM: visibilities.map((value) => (typeof value === 'number' ? value : Number.NaN)),
        timestampsMs: visibilities.map((_, i) => start + i * 3_600_000),
        visibilityDefinition: 'mor-5-percent',
      });
      expect(availability.availability).toBe(expected.availability);
      expect(availability.clearAirMarginDb).toBe(expected.clearAirMarginDb);
      expect(availability.minimumVisibilityM).toBeGreaterThan(50);
      expect(availability.minimumVisibilityM).toBeLessThan(20000);
      expect(availability.method.assumptions.join(' ')).toMatch(/fog and strong turbulence rarely coincide/);
      expect(availability.method.assumptions.join(' ')).toMatch(/not the visibility on the rooftops/);
    });
  });

  it('equals availabilityFromRecords on a year of seeded hourly rows, with a required margin, MOR and gzip', async () => {
    let state = 7;
    const random = () => ((state = (state * 1103515245 + 12345) % 2147483648) / 2147483648);
    const start = Date.UTC(2022, 0, 1);
    const visibilityM: number[] = [];
    let fog = 0;
    for (let i = 0; i < 8760; i++) {
      if (fog === 0 && random() < 0.01) fog = 1 + Math.floor(random() * 12);
      visibilityM.push(Math.round(fog > 0 ? 60 + random() * 1500 : 3000 + random() * 40000));
      if (fog > 0) fog--;
    }
    const csv = `when;vis_km\n${visibilityM.map((v, i) => `${new Date(start + i * 3_600_000).toISOString().slice(0, 16)};${v / 1000}`).join('\n')}\n`;
    const mapping = { timestampColumn: 'when', visibilityColumn: 'vis_km', visibilityUnit: 'km', visibilityDefinition: 'mor-5-percent' } as const;
    const upload = await uploadWeather(app, engineer(), gzipSync(csv), { name: 'A seeded year', fileName: 'year.csv.gz', mapping }).expect(201);
    const { id, rowsImported } = WeatherImportResultSchema.parse(upload.body);
    expect(rowsImported).toBe(8760);

    const link = await createLink();
    const answer = await http().get(`/api/links/${link.id}/revisions/1/availability`).query({ datasetId: id, requiredMarginDb: 3 }).set(...bearer(engineer())).expect(200);
    const availability = RevisionAvailabilitySchema.parse(answer.body);
    const expected = availabilityFromRecords(
      link.design,
      { visibilityM: visibilityM.map((v) => (v / 1000) * 1000), timestampsMs: visibilityM.map((_, i) => start + i * 3_600_000), visibilityDefinition: 'mor-5-percent' },
      { requiredMarginDb: 3 },
    );
    expect(availability.availability).toBe(expected.availability);
    expect(availability).toMatchObject({
      unavailableHours: expected.unavailableHours,
      coveredHours: expected.coveredHours,
      outageCount: expected.outageCount,
      longestOutageH: expected.longestOutageH,
      clearAirMarginDb: expected.clearAirMarginDb,
    });
    expect(availability.months).toHaveLength(12);
    expect(availability.rangesForAvailability!.map((range) => range.targetAvailability)).toEqual([0.99, 0.999, 0.9999]);
    expect(availability.marginDistribution.bins.reduce((sum, bin) => sum + bin.hours, 0) + availability.marginDistribution.belowHours).toBeCloseTo(expected.coveredHours, 6);
  });

  it('analyses a variant of the revision instead of its design when asked (?variant=N), and 404s an unknown one', async () => {
    const visibilityM = [20000, 20000, 800, 800, 20000, 300, 20000, 20000];
    const upload = await uploadWeather(app, engineer(), hourlyCsv('2023-05-01T00:00:00Z', visibilityM), { name: 'Variant hours' }).expect(201);
    const { id } = WeatherImportResultSchema.parse(upload.body);
    const primary = { ...workedExampleDesign(), rangeM: 1000 };
    const longer = { ...primary, rangeM: 3000 };
    const response = await http()
      .post('/api/links')
      .set(...bearer(engineer()))
      .send({ name: `Weather variants ${Math.random()}`, design: primary, variants: [{ name: '3 km instead', design: longer }] })
      .expect(201);
    const link = LinkDetailSchema.parse(response.body);
    const read = async (query: Record<string, unknown>) =>
      RevisionAvailabilitySchema.parse((await http().get(`/api/links/${link.id}/revisions/1/availability`).query({ datasetId: id, ...query }).set(...bearer(engineer())).expect(200)).body);
    const own = await read({});
    const variant = await read({ variant: 0 });
    expect(own.variant).toBeNull();
    expect(variant.variant).toEqual({ index: 0, name: '3 km instead' });
    const timestampsMs = visibilityM.map((_, index) => Date.parse('2023-05-01T00:00:00Z') + index * 3_600_000);
    const expectedOf = (design: LinkDesignInput) => availabilityFromRecords(design, { visibilityM, timestampsMs, visibilityDefinition: 'mor-5-percent' }).availability;
    expect(own.availability).toBe(expectedOf(link.design));
    expect(variant.availability).toBe(expectedOf(link.variants![0]!.design));
    expect(variant.clearAirMarginDb).toBeLessThan(own.clearAirMarginDb);
    await http().get(`/api/links/${link.id}/revisions/1/availability`).query({ datasetId: id, variant: 3 }).set(...bearer(engineer())).expect(404);
    const bad = await http().get(`/api/links/${link.id}/revisions/1/availability`).query({ datasetId: id, variant: 9 }).set(...bearer(engineer())).expect(400);
    expect(bad.body.issues).toEqual([{ path: 'variant', message: 'must be at most 7' }]);
  });

  describe('availability from a typed cumulative table', () => {
    interface ReferenceCase {
      id: string;
      inputs: Record<string, number | number[] | string | boolean>;
      expected: Record<string, number>;
      tolerance: { rel: number; abs: number };
    }
    // Check case LB-03 of fixtures/reference/check-values.json: a synthetic climatology (test data, not
    // a real site) over 1 km, computed independently with scipy/numpy (fixtures/reference/SOURCES.md).
    const cases = JSON.parse(readFileSync(resolve(CHECKOUT_ROOT, 'fixtures', 'reference', 'check-values.json'), 'utf8')) as ReferenceCase[];
    const lb03 = cases.find((entry) => entry.id === 'LB-03')!;
    const within = (value: number, expected: number) => expect(Math.abs(value - expected)).toBeLessThanOrEqual(Math.max(lb03.tolerance.abs, lb03.tolerance.rel * Math.abs(expected)));

    it('equals check case LB-03 through POST …/availability/climatology', async () => {
      const inputs = lb03.inputs as Record<string, number & number[]>;
      const design: LinkDesignInput = {
        rangeM: inputs.L_m,
        transmitter: { wavelengthM: inputs.wavelength_m, powerDbm: inputs.P_tx_dBm, waistRadiusM: inputs.W0_1e2_m, halfAngleDivergenceRad: inputs.half_angle_divergence_1e2_rad, opticsLossDb: inputs.tx_optics_loss_dB },
        receiver: { apertureDiameterM: inputs.rx_diameter_m, sensitivityDbm: inputs.sensitivity_dBm, opticsLossDb: inputs.rx_optics_loss_dB },
        pointing: { jitterSigmaPerAxisRad: inputs.jitter_sigma_per_axis_rad, staticErrorRad: inputs.static_pointing_error_rad },
        atmosphere: { model: 'kim', visibilityM: 10_000, cn2: inputs['Cn2_m^-2/3'], turbulenceModel: 'spherical-wave' },
        scintillation: { include: false, probability: inputs.fade_probability },
      };
      // LB-03's chain budgets the small-receiver mean pointing loss; the difference to the engine's exact
      // capture (3e-4 dB here) goes into the system allowance, as link-core/test/reference-adapters/budget.ts does
      const budget = evaluateLink(design);
      const shiftDb = meanPointingLossDb(budget.beamRadiusAtReceiverM, inputs.jitter_sigma_per_axis_rad * inputs.L_m, inputs.static_pointing_error_rad * inputs.L_m) - budget.pointingLossDb;
      const link = await createLink({ ...design, systemMarginDb: shiftDb });
      const response = await http()
        .post(`/api/links/${link.id}/revisions/1/availability/climatology`)
        .set(...bearer(org.members.reviewer))
        .send({ climatology: { visibilityM: inputs.climatology_visibility_km.map((km: number) => km * 1000), probabilityBelow: inputs.climatology_prob_visibility_below } })
        .expect(200);
      const answer = ClimatologyAvailabilityResponseSchema.parse(response.body);
      within(answer.clearAirMarginDb, lb03.expected.clear_air_margin_dB!);
      within(answer.maxSpecificAttenuationDbPerKm, lb03.expected.max_specific_attenuation_dB_per_km!);
      within(answer.minimumVisibilityM!, lb03.expected.V_min_m!);
      within(answer.unavailability, lb03.expected.unavailability!);
      within(answer.availability, lb03.expected.availability!);
      expect(answer.rangesForAvailability.map((range) => range.status)).toEqual(['found', 'found', 'not-achievable']);
      expect(answer.method.assumptions.join(' ')).toMatch(/fog and strong turbulence rarely coincide/);
    });

    it('names the bad cell of a table (400)', async () => {
      const link = await createLink();
      const response = await http()
        .post(`/api/links/${link.id}/revisions/1/availability/climatology`)
        .set(...bearer(engineer()))
        .send({ climatology: { visibilityM: [100, 50], probabilityBelow: [0.01, 0.02] } })
        .expect(400);
      expect(response.body.issues).toEqual([{ path: 'climatology.visibilityM.1', message: 'must be greater than the previous level' }]);
    });
  });

  describe('rows that cannot be read', () => {
    // line 1 is the header; line 3 has a bad time, line 5 a negative visibility, line 6 repeats line 2's time
    const csv = [
      'time,visibility_m',
      '2024-05-01T00:00Z,8000',
      '01/05/2024 01:00,8000',
      '2024-05-01T02:00Z,7000',
      '2024-05-01T03:00Z,-20',
      '2024-05-01T00:00Z,6000',
      '2024-05-01T04:00Z,9000',
    ].join('\n');

    it('are each reported with line, column and reason, and nothing is stored (422) unless asked', async () => {
      const before = await datasetsOf(org);
      const recordsBefore = await recordCount();
      const response = await uploadWeather(app, engineer(), csv, { name: 'Bad rows' }).expect(422);
      const body = WeatherRowErrorsBodySchema.parse(response.body);
      expect(body.rowErrorCount).toBe(3);
      expect(body.rowErrors).toEqual([
        { line: 3, column: 'time', message: '"01/05/2024 01:00" is not an ISO 8601 date and time (e.g. 2024-03-01T06:00Z)' },
        { line: 5, column: 'visibility_m', message: expect.stringMatching(/must be greater than 0/) },
        { line: 6, column: 'time', message: 'repeats the time of line 2' },
      ]);
      expect(body.message).toMatch(/nothing was imported/);
      expect(await datasetsOf(org)).toEqual(before);
      expect(await recordCount()).toBe(recordsBefore);
      expect(await leftoverChunks()).toBe(0);
    });

    it('are skipped with onRowErrors "skip": the valid rows are imported and the others listed', async () => {
      const response = await uploadWeather(app, engineer(), csv, { name: 'Valid rows only', onRowErrors: 'skip' }).expect(201);
      const result = WeatherImportResultSchema.parse(response.body);
      expect(result).toMatchObject({ rowsImported: 3, rowErrorCount: 3 });
      expect(result.rowErrors.map((error) => error.line)).toEqual([3, 5, 6]);
    });
  });

  describe('limits and content', () => {
    it('refuses a file over 50 MB with 413 while it streams, and stores nothing', async () => {
      const big = Buffer.alloc(WEATHER_UPLOAD_LIMITS.maxBytes + 1, '2024-01-01T00:00Z,1000\n');
      big.write('time,visibility_m\n');
      const response = await uploadWeather(app, engineer(), big, { name: 'Too big' }).expect(413);
      expect(ErrorBodySchema.parse(response.body).message).toMatch(/larger than 50 MB/);
      expect(await leftoverChunks()).toBe(0);
    });

    it('refuses a declared body over the limit with 413 before reading it', async () => {
      const response = await http()
        .post('/api/weather-datasets')
        .set(...bearer(engineer()))
        .set('Content-Type', 'multipart/form-data; boundary=x')
        .set('Content-Length', String(WEATHER_UPLOAD_LIMITS.maxBytes * 2))
        .send('--x--')
        .catch((error: { response?: request.Response }) => error.response!);
      expect(response.status).toBe(413);
    });

    it('refuses what is not CSV by its content, whatever its name (415)', async () => {
      const png = Buffer.from('89504e470d0a1a0a0000000d4948445200000001000000010806000000', 'hex');
      const asPng = await uploadWeather(app, engineer(), png, { fileName: 'records.csv' }).expect(415);
      expect(ErrorBodySchema.parse(asPng.body).message).toMatch(/not CSV text: its content is image\/png/);
      await uploadWeather(app, engineer(), '{"time": "2024-01-01", "visibility": 1000}', { fileName: 'records.csv' }).expect(415);
      await uploadWeather(app, engineer(), gzipSync(png), { fileName: 'records.csv.gz' }).expect(415);
      await uploadWeather(app, engineer(), 'just one column\n1\n', { fileName: 'records.csv' }).expect(415);
      expect(await leftoverChunks()).toBe(0);
    });

    it('takes a CSV whatever its name says', async () => {
      await uploadWeather(app, engineer(), hourlyCsv('2024-01-01T00:00Z', [5000, 6000]), { fileName: 'export.bin', name: 'Odd name' }).expect(201);
    });
  });

  describe('bad fields: 400 naming the field', () => {
    const csv = hourlyCsv('2024-01-01T00:00Z', [5000, 6000]);

    it('names the missing file, a missing or malformed mapping, and a column the file lacks', async () => {
      const noFile = await http().post('/api/weather-datasets').set(...bearer(engineer())).field('name', 'x').field('mapping', JSON.stringify(HOURLY_MAPPING)).expect(400);
      expect(noFile.body.issues).toEqual([{ path: 'file', message: 'is required' }]);
      const noMapping = await uploadWeather(app, engineer(), csv, { mapping: null }).expect(400);
      expect(noMapping.body.issues).toEqual([{ path: 'mapping', message: 'is required' }]);
      const badUnit = await uploadWeather(app, engineer(), csv, { mapping: JSON.stringify({ ...HOURLY_MAPPING, visibilityUnit: 'leagues' }) }).expect(400);
      expect(badUnit.body.issues).toEqual([{ path: 'mapping.visibilityUnit', message: 'must be one of m, km, mi, ft' }]);
      const absent = await uploadWeather(app, engineer(), csv, { mapping: { ...HOURLY_MAPPING, visibilityColumn: 'vis' } }).expect(400);
      expect(absent.body.issues[0].path).toBe('mapping.visibilityColumn');
      expect(absent.body.issues[0].message).toMatch(/not in the file's header \("time", "visibility_m"\)/);
      const site = await uploadWeather(app, engineer(), csv, { siteId: '6f1c0a4e-58a2-4a4d-9a40-6a0d1b3c2e11' }).expect(400);
      expect(site.body.issues).toEqual([{ path: 'siteId', message: 'is not a site of your organisation' }]);
      expect(await leftoverChunks()).toBe(0);
    });

    it('names a bad query of the availability', async () => {
      const link = await createLink();
      const response = await http().get(`/api/links/${link.id}/revisions/1/availability`).query({ requiredMarginDb: 'lots' }).set(...bearer(engineer())).expect(400);
      expect(response.body.issues.map((issue: { path: string }) => issue.path)).toEqual(['datasetId', 'requiredMarginDb']);
    });
  });

  describe('who sees and changes what', () => {
    it('keeps every data set inside its organisation: another one is a 404', async () => {
      const upload = await uploadWeather(app, other.members.engineer, hourlyCsv('2024-01-01T00:00Z', [5000, 6000]), { name: 'Theirs' }).expect(201);
      const theirs = WeatherImportResultSchema.parse(upload.body).id;
      expect((await datasetsOf(org)).map((dataset) => dataset.id)).not.toContain(theirs);
      expect((await datasetsOf(other)).map((dataset) => dataset.id)).toContain(theirs);
      await http().get(`/api/weather-datasets/${theirs}`).set(...bearer(engineer())).expect(404);
      await http().delete(`/api/weather-datasets/${theirs}`).set(...bearer(engineer())).expect(404);
      const link = await createLink();
      await http().get(`/api/links/${link.id}/revisions/1/availability`).query({ datasetId: theirs }).set(...bearer(engineer())).expect(404);
    });

    it('lets engineers and admins upload and delete, not reviewers or installers (403)', async () => {
      await uploadWeather(app, org.members.reviewer, hourlyCsv('2024-01-01T00:00Z', [5000])).expect(403);
      await uploadWeather(app, org.members.installer, hourlyCsv('2024-01-01T00:00Z', [5000])).expect(403);
      const upload = await uploadWeather(app, org.members.admin, hourlyCsv('2024-01-01T00:00Z', [5000, 7000]), { name: 'To delete' }).expect(201);
      const { id } = WeatherImportResultSchema.parse(upload.body);
      await http().delete(`/api/weather-datasets/${id}`).set(...bearer(org.members.reviewer)).expect(403);
      await http().delete(`/api/weather-datasets/${id}`).set(...bearer(engineer())).expect(204);
      await http().get(`/api/weather-datasets/${id}`).set(...bearer(engineer())).expect(404);
      expect(Number((await dataSource.query('SELECT count(*) AS n FROM weather_record WHERE dataset_id = $1', [id]))[0].n)).toBe(0);
    });
  });

  describe('the import as a job', () => {
    it('answers 202 with the job on Prefer: respond-async, which ends with the 201 body', async () => {
      const response = await uploadWeather(app, engineer(), hourlyCsv('2024-02-01T00:00Z', [900, 1200, 2500]), { name: 'Polled', prefer: 'respond-async' }).expect(202);
      const job = WeatherImportJobSchema.parse(response.body);
      expect(response.headers.location).toBe(job.statusUrl);
      expect(job.statusUrl).toBe(`/api/weather-datasets/imports/${job.jobId}`);
      const ended = await waitForImportEnd(app, engineer(), job.jobId);
      expect(ended.state).toBe('succeeded');
      expect(WeatherImportResultSchema.parse(ended.result)).toMatchObject({ rowsImported: 3, rowErrors: [] });
      expect(ended.progress).toBe(1);
      // another organisation cannot see the job
      await http().get(job.statusUrl).set(...bearer(other.members.engineer)).expect(404);
    });

    it('reports row errors through the job as well (failed, with the 422 body)', async () => {
      const response = await uploadWeather(app, engineer(), 'time,visibility_m\nnot-a-time,100\n', { prefer: 'respond-async' }).expect(202);
      const ended = await waitForImportEnd(app, engineer(), WeatherImportJobSchema.parse(response.body).jobId);
      expect(ended.state).toBe('failed');
      expect(ended.error).toMatchObject({ statusCode: 422, rowErrorCount: 1, rowErrors: [{ line: 2, column: 'time' }] });
    });

    it('cancels a running import: it rolls back and stores nothing', async () => {
      // hold the import at its last write (the records), so the cancel arrives while it runs
      const blocker = dataSource.createQueryRunner();
      await blocker.connect();
      await blocker.startTransaction();
      await blocker.query('LOCK TABLE weather_record IN SHARE MODE');
      let jobId: string;
      try {
        const response = await uploadWeather(app, engineer(), hourlyCsv('2024-03-01T00:00Z', [900, 1200, 2500]), { name: 'Cancelled', prefer: 'respond-async' }).expect(202);
        jobId = WeatherImportJobSchema.parse(response.body).jobId;
        for (let i = 0; i < 100; i++) {
          const [row] = await dataSource.query(`SELECT state FROM weather_import WHERE id = $1`, [jobId]);
          if (row.state === 'running') break;
          await new Promise((resolve) => setTimeout(resolve, 50));
        }
        const cancelled = http().post(`/api/weather-datasets/imports/${jobId}/cancel`).set(...bearer(engineer()));
        setTimeout(() => void blocker.commitTransaction(), 300);
        expect((await cancelled.expect(200)).body.state).toMatch(/running|cancelled/);
      } finally {
        if (blocker.isTransactionActive) await blocker.commitTransaction();
        await blocker.release();
      }
      const ended = await waitForImportEnd(app, engineer(), jobId);
      expect(ended.state).toBe('cancelled');
      expect((await datasetsOf(org)).map((dataset) => dataset.name)).not.toContain('Cancelled');
      await http().post(`/api/weather-datasets/imports/${jobId}/cancel`).set(...bearer(engineer())).expect(409);
    });
  });
});
