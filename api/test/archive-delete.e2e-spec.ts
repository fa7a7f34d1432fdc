import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import { DataSource } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { workedExampleDesign } from './utils/designs.js';
import { upsertUser } from '../src/database/seeds/demo-seed.js';
import { bearer, createTestOrganisation, TEST_PASSWORD, type TestMember, type TestOrganisation } from './utils/test-organisation.js';
import { createTestApp } from './utils/test-app.js';

/** Finding 9 (second half): links could be neither deleted nor archived. */
describe('deleting and archiving links (e2e)', () => {
  let app: INestApplication;
  let org: TestOrganisation;

  beforeAll(async () => {
    app = await createTestApp();
    org = await createTestOrganisation(app, 'archive');
  });

  afterAll(async () => {
    await org?.remove();
    await app?.close();
  });

  const http = () => request(app.getHttpServer());
  const create = async (name: string, by: TestMember = org.members.engineer) =>
    (await http().post('/api/links').set(...bearer(by)).send({ name, design: workedExampleDesign() }).expect(201)).body.id as string;
  const act = (member: TestMember, linkId: string, action: string, body: object = {}) => http().post(`/api/links/${linkId}/revisions/1/${action}`).set(...bearer(member)).send(body);

  it('deletes a never-approved draft of its owner with its revisions and reviews (204)', async () => {
    const { engineer, reviewer } = org.members;
    const id = await create('Scratch link');
    await act(engineer, id, 'submit').expect(200);
    await act(reviewer, id, 'return', { comment: 'not needed' }).expect(200);
    await http().delete(`/api/links/${id}`).set(...bearer(engineer)).expect(204);
    await http().get(`/api/links/${id}`).set(...bearer(engineer)).expect(404);
    const left = await app.get(DataSource).query('SELECT (SELECT count(*) FROM link_revision WHERE link_id = $1)::int AS revisions, (SELECT count(*) FROM link_review WHERE link_id = $1)::int AS reviews', [id]);
    expect(left).toEqual([{ revisions: 0, reviews: 0 }]);
  });

  it('refuses to delete a link that was approved or is in review (409, archive instead), and non-owners or other roles', async () => {
    const { engineer, reviewer, admin } = org.members;
    const approved = await create('Approved, not deletable');
    await act(engineer, approved, 'submit').expect(200);
    await act(reviewer, approved, 'approve').expect(200);
    const refused = await http().delete(`/api/links/${approved}`).set(...bearer(engineer)).expect(409);
    expect(refused.body.message).toMatch(/archive/i);

    // approved once, then revised back to a draft: still not deletable
    await http().post(`/api/links/${approved}/revisions`).set(...bearer(engineer)).send({ baseRevision: 1, design: workedExampleDesign() }).expect(201);
    expect((await http().get(`/api/links/${approved}`).set(...bearer(engineer)).expect(200)).body.status).toBe('draft');
    await http().delete(`/api/links/${approved}`).set(...bearer(engineer)).expect(409);

    const inReview = await create('In review');
    await act(engineer, inReview, 'submit').expect(200);
    await http().delete(`/api/links/${inReview}`).set(...bearer(engineer)).expect(409);

    const draft = await create('Someone else\u2019s draft');
    await http().delete(`/api/links/${draft}`).set(...bearer(admin)).expect(403);
    await http().delete(`/api/links/${draft}`).set(...bearer(reviewer)).expect(403);
    await http().get(`/api/links/${draft}`).set(...bearer(engineer)).expect(200);
  });

  it('refuses delete by an engineer who does not own the draft (403)', async () => {
    // a second engineer of the same organisation
    const email = `second.engineer.${org.id.slice(0, 8)}@archive.test`;
    await app.get(DataSource).transaction((manager) => upsertUser(manager, org.id, { email, displayName: 'Second engineer', role: 'engineer', password: TEST_PASSWORD }));
    const login = await http().post('/api/auth/login').send({ email, password: TEST_PASSWORD }).expect(200);
    const other = { token: login.body.accessToken as string } as TestMember;
    const id = await create('Owned by the first engineer');
    const refused = await http().delete(`/api/links/${id}`).set(...bearer(other)).expect(403);
    expect(refused.body.message).toMatch(/owner/);
  });

  it('archives a link (readable, hidden from the default list, read-only) and restores it', async () => {
    const { engineer, reviewer } = org.members;
    const id = await create('Archive me');
    await act(engineer, id, 'submit').expect(200);
    await act(reviewer, id, 'approve').expect(200);
    await http().post(`/api/links/${id}/archive`).set(...bearer(reviewer)).expect(403);
    const archived = await http().post(`/api/links/${id}/archive`).set(...bearer(engineer)).expect(200);
    expect(archived.body).toMatchObject({ id, archived: true, status: 'approved' });
    expect(Date.parse(archived.body.archivedAt)).not.toBeNaN();
    await http().post(`/api/links/${id}/archive`).set(...bearer(engineer)).expect(409);

    await http().get(`/api/links/${id}`).set(...bearer(reviewer)).expect(200);
    const ids = async (query: string) => ((await http().get(`/api/links?q=Archive%20me${query}`).set(...bearer(reviewer)).expect(200)).body.items as { id: string }[]).map((item) => item.id);
    expect(await ids('')).toEqual([]);
    expect(await ids('&archived=include')).toEqual([id]);
    expect(await ids('&archived=only')).toEqual([id]);
    const bad = await http().get('/api/links?archived=maybe').set(...bearer(reviewer)).expect(400);
    expect(bad.body.issues[0].path).toBe('archived');

    // an archived link takes no changes until restored
    await http().patch(`/api/links/${id}`).set(...bearer(engineer)).send({ name: 'Changed while archived' }).expect(409);
    await http().post(`/api/links/${id}/revisions`).set(...bearer(engineer)).send({ baseRevision: 1, design: workedExampleDesign() }).expect(409);
    await act(org.members.installer, id, 'install').expect(409);

    const restored = await http().post(`/api/links/${id}/unarchive`).set(...bearer(engineer)).expect(200);
    expect(restored.body).toMatchObject({ archived: false, archivedAt: null, status: 'approved' });
    expect(await ids('')).toEqual([id]);
    const trail = (await http().get(`/api/links/${id}/reviews`).set(...bearer(reviewer)).expect(200)).body.items as { action: string }[];
    expect(trail.map((entry) => entry.action).slice(-2)).toEqual(['archived', 'restored']);
  });
});
