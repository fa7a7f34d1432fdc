import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  EquipmentImportResultSchema,
  EquipmentListResponseSchema,
  EquipmentResponseSchema,
  OrganisationSettingsSchema,
  RevisionSchema,
  SiteInUseBodySchema,
  SiteResponseSchema,
} from '@beamwright/link-core/contracts';
import { FADE_PROBABILITY_MESSAGE } from '@beamwright/link-core';
import { workedExampleDesign } from './utils/designs.js';
import { createTestApp } from './utils/test-app.js';
import { bearer, createTestOrganisation, type TestOrganisation } from './utils/test-organisation.js';

const roof = { name: 'Test roof', latitudeDeg: 56, longitudeDeg: 10, groundElevationM: 12, mountHeightM: 9, notes: 'Flat roof' };

const CSV_HEADER = 'kind,name,maker,notes,wavelengthM,powerDbm,beamSize.kind,beamSize.waistRadiusM,beamSize.diameterM,beamSize.definition,divergence.angleRad,divergence.angle,divergence.definition,m2,opticsLossDb,apertureDiameterM,obscurationRatio,sensitivityDbm,dataRateBps,overloadDbm,fieldOfViewRad';
const CSV_TRANSMITTER = 'transmitter,CSV emitter 1550,CSV optics,,1.55e-6,20,waist-radius,0.025,,,0.001,half,1/e2,1,1,,,,,,';
const CSV_RECEIVER = 'receiver,"CSV receiver, 100 mm",CSV optics,"two\nlines",,,,,,,,,,,1.5,0.1,0,-36,1.25e9,-5,';
// line 4: a wavelength that is not a number; line 5: an unknown beam-size kind and a missing loss
const CSV_BAD_NUMBER = 'transmitter,Bad wavelength,,,1550nm,20,waist-radius,0.025,,,,,,,1,,,,,,';
const CSV_BAD_SPEC = 'transmitter,Bad beam,,,1.55e-6,20,top-hat,0.025,,,,,,,,,,,,,';

describe('sites, the equipment catalogue and the organisation settings (e2e)', () => {
  let app: INestApplication;
  let org: TestOrganisation;
  let other: TestOrganisation;

  beforeAll(async () => {
    app = await createTestApp();
    org = await createTestOrganisation(app, 'orgdata');
    other = await createTestOrganisation(app, 'orgdata-rival');
  });

  afterAll(async () => {
    await org?.remove();
    await other?.remove();
    await app?.close();
  });

  const http = () => request(app.getHttpServer());

  describe('sites', () => {
    it('creates, reads, edits and deletes a site; engineers and admins write, others read', async () => {
      const created = SiteResponseSchema.parse((await http().post('/api/sites').set(...bearer(org.members.engineer)).send(roof).expect(201)).body);
      expect(created).toMatchObject(roof);
      await http().post('/api/sites').set(...bearer(org.members.reviewer)).send(roof).expect(403);
      await http().post('/api/sites').set(...bearer(org.members.installer)).send(roof).expect(403);
      const read = await http().get(`/api/sites/${created.id}`).set(...bearer(org.members.installer)).expect(200);
      expect(read.body.name).toBe('Test roof');
      const edited = await http().patch(`/api/sites/${created.id}`).set(...bearer(org.members.admin)).send({ mountHeightM: 11, notes: 'Moved to the stair core' }).expect(200);
      expect(edited.body).toMatchObject({ mountHeightM: 11, notes: 'Moved to the stair core', latitudeDeg: 56 });
      await http().patch(`/api/sites/${created.id}`).set(...bearer(org.members.reviewer)).send({ name: 'x' }).expect(403);
      await http().delete(`/api/sites/${created.id}`).set(...bearer(org.members.engineer)).expect(204);
      await http().get(`/api/sites/${created.id}`).set(...bearer(org.members.engineer)).expect(404);
    });

    it('takes coordinates in degrees, minutes and seconds and stores decimal degrees', async () => {
      const body = { ...roof, name: 'DMS roof', latitudeDeg: '56°00′47.808″N', longitudeDeg: "10d01'09.156\"E" };
      const created = SiteResponseSchema.parse((await http().post('/api/sites').set(...bearer(org.members.engineer)).send(body).expect(201)).body);
      // 56 + 47.808/3600 = 56.01328; 10 + 1/60 + 9.156/3600 = 10.019210 (hand arithmetic)
      expect(created.latitudeDeg).toBeCloseTo(56.01328, 9);
      expect(created.longitudeDeg).toBeCloseTo(10.01921, 6);
      const south = await http().patch(`/api/sites/${created.id}`).set(...bearer(org.members.engineer)).send({ latitudeDeg: '37 57 3.7203 S' }).expect(200);
      expect(south.body.latitudeDeg).toBeCloseTo(-(37 + 57 / 60 + 3.7203 / 3600), 9);
    });

    it('answers 400 with the field path for a bad coordinate', async () => {
      const response = await http()
        .post('/api/sites')
        .set(...bearer(org.members.engineer))
        .send({ ...roof, latitudeDeg: '56°61′N', longitudeDeg: '10°E', mountHeightM: -1 })
        .expect(400);
      const issues = Object.fromEntries((response.body.issues as { path: string; message: string }[]).map((issue) => [issue.path, issue.message]));
      expect(Object.keys(issues).sort()).toEqual(['latitudeDeg', 'mountHeightM']);
      expect(issues.latitudeDeg).toMatch(/^is not an angle in decimal degrees or degrees, minutes and seconds/);
      const wrongAxis = await http().post('/api/sites').set(...bearer(org.members.engineer)).send({ ...roof, longitudeDeg: '10°N' }).expect(400);
      expect(wrongAxis.body.issues.map((issue: { path: string }) => issue.path)).toEqual(['longitudeDeg']);
    });

    it('refuses to delete a site a link uses, naming the links (409)', async () => {
      const a = SiteResponseSchema.parse((await http().post('/api/sites').set(...bearer(org.members.engineer)).send({ ...roof, name: 'Used roof A' }).expect(201)).body);
      const b = SiteResponseSchema.parse((await http().post('/api/sites').set(...bearer(org.members.engineer)).send({ ...roof, name: 'Used roof B', latitudeDeg: 56.01 }).expect(201)).body);
      const first = (await http().post('/api/links').set(...bearer(org.members.engineer)).send({ name: 'Roof A to B', design: workedExampleDesign(), siteAId: a.id, siteBId: b.id }).expect(201)).body;
      const second = (await http().post('/api/links').set(...bearer(org.members.engineer)).send({ name: 'A spare path', design: workedExampleDesign(), siteAId: a.id }).expect(201)).body;

      const refused = SiteInUseBodySchema.parse((await http().delete(`/api/sites/${a.id}`).set(...bearer(org.members.admin)).expect(409)).body);
      expect(refused.links).toEqual([
        { id: second.id, name: 'A spare path' },
        { id: first.id, name: 'Roof A to B' },
      ]);
      expect(refused.message).toContain('“Roof A to B”');
      await http().get(`/api/sites/${a.id}`).set(...bearer(org.members.admin)).expect(200);

      // once its links are gone, it goes
      await http().delete(`/api/links/${second.id}`).set(...bearer(org.members.engineer)).expect(204);
      const stillOne = SiteInUseBodySchema.parse((await http().delete(`/api/sites/${a.id}`).set(...bearer(org.members.admin)).expect(409)).body);
      expect(stillOne.links.map((link) => link.name)).toEqual(['Roof A to B']);
      await http().delete(`/api/links/${first.id}`).set(...bearer(org.members.engineer)).expect(204);
      await http().delete(`/api/sites/${a.id}`).set(...bearer(org.members.admin)).expect(204);
    });

    it('answers 404 to another organisation for every site route', async () => {
      const site = SiteResponseSchema.parse((await http().post('/api/sites').set(...bearer(org.members.engineer)).send({ ...roof, name: 'Private roof' }).expect(201)).body);
      await http().get(`/api/sites/${site.id}`).set(...bearer(other.members.engineer)).expect(404);
      await http().patch(`/api/sites/${site.id}`).set(...bearer(other.members.engineer)).send({ name: 'Taken' }).expect(404);
      await http().delete(`/api/sites/${site.id}`).set(...bearer(other.members.admin)).expect(404);
      const theirs = await http().get('/api/sites').set(...bearer(other.members.engineer)).expect(200);
      expect(theirs.body.items.map((item: { id: string }) => item.id)).not.toContain(site.id);
      await http().get(`/api/sites/${site.id}`).set(...bearer(org.members.engineer)).expect(200);
    });
  });

  describe('equipment catalogue', () => {
    const importCsv = (csv: string, mode?: string) =>
      http().post('/api/equipment/import').set(...bearer(org.members.engineer)).send(mode ? { csv, mode } : { csv });
    const names = async () =>
      EquipmentListResponseSchema.parse((await http().get('/api/equipment?includeRetired=true').set(...bearer(org.members.engineer)).expect(200)).body).items.map((item) => item.name);

    it('imports nothing from a CSV with bad rows unless asked to import only the valid ones', async () => {
      const csv = [CSV_HEADER, CSV_TRANSMITTER, CSV_RECEIVER, CSV_BAD_NUMBER, CSV_BAD_SPEC].join('\n');
      const before = await names();

      const checked = EquipmentImportResultSchema.parse((await importCsv(csv, 'check').expect(200)).body);
      expect(checked).toMatchObject({ mode: 'check', totalRows: 4, validRows: 2, imported: 0, items: [] });

      // the default refuses the whole file, with every problem by line and column
      const refused = await importCsv(csv).expect(422);
      expect(refused.body).toMatchObject({ totalRows: 4, validRows: 2, imported: 0 });
      // the receiver's quoted notes span two lines (3 and 4), so the bad rows are lines 5 and 6
      expect(refused.body.errors).toEqual([
        { line: 5, column: 'wavelengthM', reason: 'must be a number in decimal notation' },
        { line: 6, column: 'beamSize.kind', reason: expect.stringContaining('waist-radius') },
        { line: 6, column: 'opticsLossDb', reason: 'is required' },
      ]);
      expect(await names()).toEqual(before);

      const partial = EquipmentImportResultSchema.parse((await importCsv(csv, 'valid-rows').expect(200)).body);
      expect(partial).toMatchObject({ imported: 2, validRows: 2, totalRows: 4 });
      expect(partial.errors).toHaveLength(3);
      const receiver = partial.items.find((item) => item.kind === 'receiver');
      expect(receiver).toMatchObject({ name: 'CSV receiver, 100 mm', notes: 'two\nlines', spec: { apertureDiameterM: 0.1, sensitivityDbm: -36, dataRateBps: 1.25e9, overloadDbm: -5 } });
      expect((await names()).filter((name) => !before.includes(name)).sort()).toEqual(['CSV emitter 1550', 'CSV receiver, 100 mm']);

      // a clean file goes in whole with the default
      const clean = EquipmentImportResultSchema.parse((await importCsv([CSV_HEADER, CSV_TRANSMITTER.replace('CSV emitter 1550', 'CSV emitter two')].join('\r\n')).expect(200)).body);
      expect(clean).toMatchObject({ imported: 1, errors: [] });
    });

    it('refuses a header with unknown columns, a broken file and too many rows, importing nothing', async () => {
      const before = await names();
      const header = await importCsv('kind,name,colour\ntransmitter,x,blue', 'valid-rows').expect(200);
      expect(header.body).toMatchObject({ imported: 0, errors: [{ line: 1, column: 'colour' }] });
      const broken = await importCsv(`${CSV_HEADER}\ntransmitter,"unterminated`, 'valid-rows').expect(200);
      expect(broken.body.imported).toBe(0);
      expect(broken.body.errors[0].reason).toMatch(/^the file is not valid CSV/);
      const long = [CSV_HEADER, ...Array.from({ length: 501 }, (_, index) => CSV_TRANSMITTER.replace('CSV emitter 1550', `Bulk ${index}`))].join('\n');
      const tooLong = await importCsv(long, 'valid-rows').expect(200);
      expect(tooLong.body).toMatchObject({ imported: 0, errors: [{ line: 502, reason: expect.stringContaining('more than 500') }] });
      await importCsv('', 'check').expect(400);
      const badMode = await importCsv('kind,name', 'sometimes').expect(400);
      expect(badMode.body.issues[0].path).toBe('mode');
      await http().post('/api/equipment/import').set(...bearer(org.members.reviewer)).send({ csv: CSV_HEADER }).expect(403);
      expect(await names()).toEqual(before);
    });

    it('retires a model: gone from the pickers, still readable, and the revisions that used it unchanged', async () => {
      const imported = EquipmentImportResultSchema.parse((await importCsv([CSV_HEADER, CSV_TRANSMITTER.replace('CSV emitter 1550', 'Soon retired')].join('\n')).expect(200)).body);
      const model = imported.items[0]!;
      if (model.kind !== 'transmitter') throw new Error('expected a transmitter');
      // a revision made from the model's figures (the workspace copies them into the design)
      const design = workedExampleDesign();
      design.transmitter.wavelengthM = model.spec.wavelengthM;
      design.transmitter.powerDbm = model.spec.powerDbm;
      const link = (await http().post('/api/links').set(...bearer(org.members.engineer)).send({ name: 'Built on a retired model', design }).expect(201)).body;

      await http().patch(`/api/equipment/${model.id}`).set(...bearer(org.members.reviewer)).send({ retired: true }).expect(403);
      const retired = EquipmentResponseSchema.parse((await http().patch(`/api/equipment/${model.id}`).set(...bearer(org.members.engineer)).send({ retired: true }).expect(200)).body);
      expect(retired.retiredAt).toEqual(expect.any(String));
      const pickerList = EquipmentListResponseSchema.parse((await http().get('/api/equipment?kind=transmitter').set(...bearer(org.members.engineer)).expect(200)).body);
      expect(pickerList.items.map((item) => item.id)).not.toContain(model.id);
      expect(await names()).toContain('Soon retired');
      const readable = EquipmentResponseSchema.parse((await http().get(`/api/equipment/${model.id}`).set(...bearer(org.members.installer)).expect(200)).body);
      expect(readable).toMatchObject({ name: 'Soon retired', spec: { wavelengthM: 1.55e-6, powerDbm: 20 } });
      const revision = RevisionSchema.parse((await http().get(`/api/links/${link.id}/revisions/1`).set(...bearer(org.members.reviewer)).expect(200)).body);
      expect(revision.design.transmitter).toMatchObject({ wavelengthM: 1.55e-6, powerDbm: 20 });

      const reinstated = await http().patch(`/api/equipment/${model.id}`).set(...bearer(org.members.admin)).send({ retired: false }).expect(200);
      expect(reinstated.body.retiredAt).toBeNull();
      const bad = await http().patch(`/api/equipment/${model.id}`).set(...bearer(org.members.admin)).send({ retired: 'yes' }).expect(400);
      expect(bad.body.issues).toEqual([{ path: 'retired', message: 'must be true or false' }]);
      await http().patch(`/api/equipment/${model.id}`).set(...bearer(other.members.engineer)).send({ retired: true }).expect(404);
      await http().get(`/api/equipment/${model.id}`).set(...bearer(other.members.engineer)).expect(404);
    });
  });

  describe('organisation settings', () => {
    it('lets every member read the settings and only an admin change them', async () => {
      const initial = OrganisationSettingsSchema.parse((await http().get('/api/organisation/settings').set(...bearer(org.members.installer)).expect(200)).body);
      expect(initial).toMatchObject({ id: org.id, name: org.name, requiredMarginDb: 3, fadeProbability: 1e-3, visibilityDefinition: 'contrast-2-percent', distanceUnit: 'km' });
      for (const role of ['engineer', 'reviewer', 'installer'] as const) {
        await http().patch('/api/organisation/settings').set(...bearer(org.members[role])).send({ requiredMarginDb: 6 }).expect(403);
      }
      const changed = OrganisationSettingsSchema.parse(
        (await http().patch('/api/organisation/settings').set(...bearer(org.members.admin)).send({ name: 'Renamed test organisation', requiredMarginDb: 6, fadeProbability: 1e-4, visibilityDefinition: 'mor-5-percent', distanceUnit: 'm' }).expect(200)).body,
      );
      expect(changed).toMatchObject({ name: 'Renamed test organisation', requiredMarginDb: 6, fadeProbability: 1e-4, visibilityDefinition: 'mor-5-percent', distanceUnit: 'm' });
      const me = await http().get('/api/auth/me').set(...bearer(org.members.engineer)).expect(200);
      expect(me.body.organisation.name).toBe('Renamed test organisation');
      // the other organisation is untouched
      const theirs = OrganisationSettingsSchema.parse((await http().get('/api/organisation/settings').set(...bearer(other.members.admin)).expect(200)).body);
      expect(theirs).toMatchObject({ id: other.id, name: other.name, requiredMarginDb: 3 });
    });

    it('answers 400 with the field paths for bad settings and changes nothing', async () => {
      const response = await http()
        .patch('/api/organisation/settings')
        .set(...bearer(other.members.admin))
        .send({ name: '', requiredMarginDb: 'six', fadeProbability: 0.9, visibilityDefinition: 'fog', distanceUnit: 'ft', organisationId: org.id })
        .expect(400);
      const issues = Object.fromEntries((response.body.issues as { path: string; message: string }[]).map((issue) => [issue.path, issue.message]));
      expect(Object.keys(issues).sort()).toEqual(['distanceUnit', 'fadeProbability', 'name', 'organisationId', 'requiredMarginDb', 'visibilityDefinition']);
      expect(issues.fadeProbability).toBe(FADE_PROBABILITY_MESSAGE);
      expect(issues.distanceUnit).toBe('must be one of m, km, mi');
      const unchanged = OrganisationSettingsSchema.parse((await http().get('/api/organisation/settings').set(...bearer(other.members.admin)).expect(200)).body);
      expect(unchanged).toMatchObject({ name: other.name, requiredMarginDb: 3, distanceUnit: 'km' });
    });
  });
});
