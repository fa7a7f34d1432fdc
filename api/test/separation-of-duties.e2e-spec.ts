import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import { DataSource } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { workedExampleDesign } from './utils/designs.js';
import { bearer, createTestOrganisation, type TestMember, type TestOrganisation } from './utils/test-organisation.js';
import { createTestApp } from './utils/test-app.js';

/** Finding 5 of the outside probe: the admin could submit, approve and install alone. */
describe('separation of duties (e2e)', () => {
  let app: INestApplication;
  let org: TestOrganisation;

  beforeAll(async () => {
    app = await createTestApp();
    org = await createTestOrganisation(app, 'duties');
  });

  afterAll(async () => {
    await org?.remove();
    await app?.close();
  });

  const http = () => request(app.getHttpServer());
  const act = (member: TestMember, linkId: string, revision: number, action: string, body: object = {}) =>
    http().post(`/api/links/${linkId}/revisions/${revision}/${action}`).set(...bearer(member)).send(body);

  async function createLink(name: string): Promise<string> {
    const response = await http().post('/api/links').set(...bearer(org.members.engineer)).send({ name, design: workedExampleDesign() }).expect(201);
    return response.body.id as string;
  }

  it('refuses the admin every step of the review: submit, approve, return and install (403)', async () => {
    const { admin, engineer, reviewer } = org.members;
    const id = await createLink('Admin may not review');
    const submit = await act(admin, id, 1, 'submit').expect(403);
    expect(submit.body.message).toMatch(/engineer/);
    await act(engineer, id, 1, 'submit').expect(200);
    const approve = await act(admin, id, 1, 'approve').expect(403);
    expect(approve.body.message).toMatch(/reviewer/);
    await act(admin, id, 1, 'return', { comment: 'no' }).expect(403);
    await act(reviewer, id, 1, 'approve').expect(200);
    const install = await act(admin, id, 1, 'install').expect(403);
    expect(install.body.message).toMatch(/installer/);
    // the refusals changed nothing: the link is approved, and the installer can still install it
    await act(org.members.installer, id, 1, 'install').expect(200);
  });

  it('refuses the admin link designs (create, revise, rename) but keeps sites and equipment open to admins', async () => {
    const { admin } = org.members;
    await http().post('/api/links').set(...bearer(admin)).send({ name: 'By the admin', design: workedExampleDesign() }).expect(403);
    const id = await createLink('Engineer owned');
    await http().post(`/api/links/${id}/revisions`).set(...bearer(admin)).send({ baseRevision: 1, design: workedExampleDesign() }).expect(403);
    await http().patch(`/api/links/${id}`).set(...bearer(admin)).send({ name: 'Renamed by admin' }).expect(403);
    const site = await http().post('/api/sites').set(...bearer(admin)).send({ name: 'Admin roof', latitudeDeg: 1, longitudeDeg: 1, groundElevationM: 1, mountHeightM: 1 }).expect(201);
    await http().patch(`/api/sites/${site.body.id}`).set(...bearer(admin)).send({ notes: 'checked' }).expect(200);
    // everyone still reads
    await http().get(`/api/links/${id}`).set(...bearer(admin)).expect(200);
  });

  it('keeps the no-self-approval rule for a reviewer who authored the revision', async () => {
    const { engineer, reviewer } = org.members;
    const id = await createLink('Authored by a later reviewer');
    await act(engineer, id, 1, 'submit').expect(200);
    // a member who wrote a revision as an engineer and has since become a reviewer
    await app.get(DataSource).query('UPDATE link_revision SET author_id = $1 WHERE link_id = $2', [reviewer.id, id]);
    const self = await act(reviewer, id, 1, 'approve').expect(403);
    expect(self.body.message).toMatch(/own revision/);
    // returning one's own revision is still allowed (it only sends it back)
    await act(reviewer, id, 1, 'return', { comment: 'I will ask someone else' }).expect(200);
  });
});
