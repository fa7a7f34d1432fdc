import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Role } from '@beamwright/link-core/contracts';
import { createTestApp } from './utils/test-app.js';
import { workedExampleDesign } from './utils/designs.js';
import { bearer, createTestOrganisation, type TestOrganisation } from './utils/test-organisation.js';

/**
 * Every text field of every write route, and the link search, with a NUL character: PostgreSQL
 * cannot store NUL in text, so before the shared text-field schema these reached the database and
 * answered 500. Each must now be a 400 naming the field in `issues[].path`.
 */
describe('control characters in text fields (e2e)', () => {
  let app: INestApplication;
  let org: TestOrganisation;
  let linkId: string;
  let siteId: string;
  let equipmentId: string;

  const http = () => request(app.getHttpServer());
  const site = { name: 'Text roof', latitudeDeg: 51.5, longitudeDeg: -0.1, groundElevationM: 10, mountHeightM: 20 };
  const transmitter = { kind: 'transmitter', name: 'Text Tx', spec: { wavelengthM: 1.55e-6, powerDbm: 20, beamSize: { kind: 'waist-radius', waistRadiusM: 0.025 }, opticsLossDb: 1 } };
  const receiver = { kind: 'receiver', name: 'Text Rx', spec: { apertureDiameterM: 0.1, opticsLossDb: 1, sensitivityDbm: -30, dataRateBps: 1e9 } };

  beforeAll(async () => {
    app = await createTestApp();
    org = await createTestOrganisation(app, 'text');
    const engineer = bearer(org.members.engineer);
    linkId = (await http().post('/api/links').set(...engineer).send({ name: 'Text link', design: workedExampleDesign() }).expect(201)).body.id;
    siteId = (await http().post('/api/sites').set(...engineer).send(site).expect(201)).body.id;
    equipmentId = (await http().post('/api/equipment').set(...engineer).send(receiver).expect(201)).body.id;
  });

  afterAll(async () => {
    await org?.remove();
    await app?.close();
  });

  // [route, role allowed to call it, method, path, a valid body, the text fields of that body]
  const routes: [string, Role, 'post' | 'patch', () => string, Record<string, unknown>, string[]][] = [
    ['create link', 'engineer', 'post', () => '/api/links', { name: 'L', design: workedExampleDesign() }, ['name', 'note']],
    ['rename link', 'engineer', 'patch', () => `/api/links/${linkId}`, {}, ['name']],
    ['new revision', 'engineer', 'post', () => `/api/links/${linkId}/revisions`, { baseRevision: 1, design: workedExampleDesign() }, ['note']],
    ['create site', 'engineer', 'post', () => '/api/sites', site, ['name', 'notes']],
    ['edit site', 'engineer', 'patch', () => `/api/sites/${siteId}`, {}, ['name', 'notes']],
    ['create transmitter', 'engineer', 'post', () => '/api/equipment', transmitter, ['name', 'maker', 'notes']],
    ['create receiver', 'engineer', 'post', () => '/api/equipment', receiver, ['name', 'maker', 'notes']],
    ['edit equipment', 'engineer', 'patch', () => `/api/equipment/${equipmentId}`, {}, ['name', 'maker', 'notes']],
    ['submit for review', 'engineer', 'post', () => `/api/links/${linkId}/revisions/1/submit`, {}, ['comment']],
    ['approve', 'reviewer', 'post', () => `/api/links/${linkId}/revisions/1/approve`, {}, ['comment']],
    ['return', 'reviewer', 'post', () => `/api/links/${linkId}/revisions/1/return`, { comment: 'x' }, ['comment']],
    ['record installation', 'installer', 'post', () => `/api/links/${linkId}/revisions/1/install`, {}, ['comment']],
  ];
  const cases = routes.flatMap(([route, role, method, path, body, fields]) => fields.map((field) => [route, field, role, method, path, body] as const));

  it.each(cases)('%s: a NUL in %s answers 400 naming the field', async (_route, field, role, method, path, body) => {
    const response = await http()[method](path()).set(...bearer(org.members[role])).send({ ...body, [field]: `before\u0000after` });
    expect(response.status).toBe(400);
    expect(response.body.issues).toContainEqual({ path: field, message: expect.stringMatching(/^must not contain control characters/) });
  });

  it('covers the 21 text fields of the write routes', () => {
    expect(cases).toHaveLength(21);
  });

  it('a NUL in the link search (?q=) answers 400 naming q', async () => {
    const response = await http().get('/api/links').query({ q: 'Text\u0000' }).set(...bearer(org.members.installer));
    expect(response.status).toBe(400);
    expect(response.body.issues).toContainEqual({ path: 'q', message: expect.stringMatching(/^must not contain control characters/) });
  });

  it('stores names in NFC, so the decomposed spelling finds the composed one', async () => {
    const engineer = bearer(org.members.engineer);
    const created = await http().post('/api/sites').set(...engineer).send({ ...site, name: 'Cafe\u0301 roof', notes: 'line 1\r\nline 2' }).expect(201);
    expect(created.body.name).toBe('Caf\u00e9 roof');
    expect(created.body.notes).toBe('line 1\nline 2');
    await http().post('/api/links').set(...engineer).send({ name: 'Caf\u00e9 hop', design: workedExampleDesign(), siteAId: created.body.id }).expect(201);
    const found = await http().get('/api/links').query({ q: 'Cafe\u0301' }).set(...engineer).expect(200);
    expect(found.body.items.map((item: { name: string }) => item.name)).toContain('Caf\u00e9 hop');
  });

  it('refuses a line break in a one-line field but keeps it in a note', async () => {
    const engineer = bearer(org.members.engineer);
    const refused = await http().patch(`/api/links/${linkId}`).set(...engineer).send({ name: 'two\nlines' }).expect(400);
    expect(refused.body.issues).toEqual([{ path: 'name', message: 'must not contain control characters (U+000A at character 4)' }]);
    const saved = await http().post(`/api/links/${linkId}/revisions`).set(...engineer).send({ baseRevision: 1, design: workedExampleDesign(), note: 'first\nsecond' }).expect(201);
    expect(saved.body.note).toBe('first\nsecond');
  });
});
