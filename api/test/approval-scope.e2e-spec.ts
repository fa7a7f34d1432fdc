import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { workedExampleDesign } from './utils/designs.js';
import { bearer, createTestOrganisation, type TestMember, type TestOrganisation } from './utils/test-organisation.js';
import { createTestApp } from './utils/test-app.js';

interface TrailEntry {
  action: string;
  fromStatus: string;
  toStatus: string;
  comment: string;
  revision: number;
  actor: { id: string };
}

/** Finding 6 of the outside probe: an approved link could be renamed or moved and stay approved. */
describe('an approval covers what was approved (e2e)', () => {
  let app: INestApplication;
  let org: TestOrganisation;

  beforeAll(async () => {
    app = await createTestApp();
    org = await createTestOrganisation(app, 'scope');
  });

  afterAll(async () => {
    await org?.remove();
    await app?.close();
  });

  const http = () => request(app.getHttpServer());
  const act = (member: TestMember, linkId: string, action: string) => http().post(`/api/links/${linkId}/revisions/1/${action}`).set(...bearer(member)).send({});
  const trail = async (linkId: string): Promise<TrailEntry[]> => (await http().get(`/api/links/${linkId}/reviews`).set(...bearer(org.members.installer)).expect(200)).body.items;
  const detail = async (linkId: string) => (await http().get(`/api/links/${linkId}`).set(...bearer(org.members.installer)).expect(200)).body;

  let siteCount = 0;
  async function site(name: string) {
    siteCount += 1;
    const body = { name, latitudeDeg: 50 + siteCount / 100, longitudeDeg: 4, groundElevationM: 10, mountHeightM: 12 };
    return (await http().post('/api/sites').set(...bearer(org.members.engineer)).send(body).expect(201)).body as { id: string; name: string };
  }

  /** A link between two new sites, taken to `until` through the real review steps. */
  async function linkAt(until: 'approved' | 'installed', name: string) {
    const a = await site(`${name} A`);
    const b = await site(`${name} B`);
    const { engineer, reviewer, installer } = org.members;
    const created = await http().post('/api/links').set(...bearer(engineer)).send({ name, design: workedExampleDesign(), siteAId: a.id, siteBId: b.id }).expect(201);
    const id = created.body.id as string;
    await act(engineer, id, 'submit').expect(200);
    await act(reviewer, id, 'approve').expect(200);
    if (until === 'installed') await act(installer, id, 'install').expect(200);
    return { id, a, b };
  }

  it('sends an approved link back to draft when its sites change, saying so on the trail', async () => {
    const { id, a, b } = await linkAt('approved', 'Moved approved');
    const c = await site('Moved approved C');
    const moved = await http().patch(`/api/links/${id}`).set(...bearer(org.members.engineer)).send({ siteBId: c.id }).expect(200);
    expect(moved.body).toMatchObject({ status: 'draft', siteB: { id: c.id }, approval: null });
    const last = (await trail(id)).at(-1)!;
    expect(last).toMatchObject({ action: 'path_changed', fromStatus: 'approved', toStatus: 'draft', revision: 1, actor: { id: org.members.engineer.id } });
    expect(last.comment).toBe(`Sites changed from ${a.name} ↔ ${b.name} to ${a.name} ↔ ${c.name} since the approval of revision 1`);
    // it needs a new review: submit and approve again
    await act(org.members.engineer, id, 'submit').expect(200);
    await act(org.members.reviewer, id, 'approve').expect(200);
  });

  it('sends an approved link back to draft when it is renamed, with the old and new names on the trail', async () => {
    const { id } = await linkAt('approved', 'Old approved name');
    const renamed = await http().patch(`/api/links/${id}`).set(...bearer(org.members.engineer)).send({ name: 'New approved name' }).expect(200);
    expect(renamed.body).toMatchObject({ name: 'New approved name', status: 'draft' });
    const last = (await trail(id)).at(-1)!;
    expect(last).toMatchObject({ action: 'renamed', fromStatus: 'approved', toStatus: 'draft' });
    expect(last.comment).toBe('Renamed from "Old approved name" to "New approved name" since the approval of revision 1');
  });

  it('accepts a rename of an installed link with a trail entry and keeps it installed', async () => {
    const { id } = await linkAt('installed', 'Installed old name');
    const renamed = await http().patch(`/api/links/${id}`).set(...bearer(org.members.engineer)).send({ name: 'Installed new name' }).expect(200);
    expect(renamed.body).toMatchObject({ name: 'Installed new name', status: 'installed' });
    expect((await trail(id)).at(-1)).toMatchObject({ action: 'renamed', fromStatus: 'installed', toStatus: 'installed' });
  });

  it('refuses to move an installed link to other sites (409) and changes nothing', async () => {
    const { id, b } = await linkAt('installed', 'Installed on its roofs');
    const c = await site('Installed elsewhere');
    const before = await trail(id);
    const refused = await http().patch(`/api/links/${id}`).set(...bearer(org.members.engineer)).send({ siteBId: c.id, name: 'Also renamed' }).expect(409);
    expect(refused.body.message).toMatch(/installed/);
    expect(refused.body.message).toMatch(/archive/i);
    expect(await detail(id)).toMatchObject({ status: 'installed', siteB: { id: b.id }, name: 'Installed on its roofs' });
    expect(await trail(id)).toHaveLength(before.length);
  });

  it('marks approved and installed links changed since approval when a site they use is moved, until the next approval', async () => {
    const approved = await linkAt('approved', 'Geometry approved');
    const installed = await linkAt('installed', 'Geometry installed');
    const draft = await http()
      .post('/api/links')
      .set(...bearer(org.members.engineer))
      .send({ name: 'Geometry draft', design: workedExampleDesign(), siteAId: approved.a.id })
      .expect(201);
    expect(await detail(approved.id)).toMatchObject({ changedSinceApproval: false, pathChangedAt: null });

    // notes and the name are not geometry: no mark
    await http().patch(`/api/sites/${approved.a.id}`).set(...bearer(org.members.engineer)).send({ notes: 'key at the desk' }).expect(200);
    expect((await detail(approved.id)).changedSinceApproval).toBe(false);

    await http().patch(`/api/sites/${approved.a.id}`).set(...bearer(org.members.engineer)).send({ mountHeightM: 15 }).expect(200);
    await http().patch(`/api/sites/${installed.b.id}`).set(...bearer(org.members.admin)).send({ latitudeDeg: 51.2 }).expect(200);

    const marked = await detail(approved.id);
    expect(marked).toMatchObject({ status: 'approved', changedSinceApproval: true });
    expect(Date.parse(marked.pathChangedAt)).not.toBeNaN();
    expect((await trail(approved.id)).at(-1)).toMatchObject({ action: 'path_changed', fromStatus: 'approved', toStatus: 'approved' });
    expect((await trail(approved.id)).at(-1)!.comment).toMatch(/mount height 12 m → 15 m since the approval of revision 1/);
    expect((await detail(installed.id)).changedSinceApproval).toBe(true);
    expect((await detail(draft.body.id)).changedSinceApproval).toBe(false);

    // the list shows the mark too
    const list = (await http().get('/api/links?q=Geometry').set(...bearer(org.members.reviewer)).expect(200)).body.items as { id: string; changedSinceApproval: boolean }[];
    expect(Object.fromEntries(list.map((item) => [item.id, item.changedSinceApproval]))).toEqual({ [approved.id]: true, [installed.id]: true, [draft.body.id]: false });

    // a new revision and its approval clear it
    await http().post(`/api/links/${approved.id}/revisions`).set(...bearer(org.members.engineer)).send({ baseRevision: 1, design: workedExampleDesign(), note: 'checked the new mast' }).expect(201);
    await http().post(`/api/links/${approved.id}/revisions/2/submit`).set(...bearer(org.members.engineer)).send({}).expect(200);
    await http().post(`/api/links/${approved.id}/revisions/2/approve`).set(...bearer(org.members.reviewer)).send({}).expect(200);
    expect(await detail(approved.id)).toMatchObject({ changedSinceApproval: false, pathChangedAt: null });
  });
});
