import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { evaluateLink, LINK_CORE_VERSION, LinkDesignSchema } from '@beamwright/link-core';
import {
  ErrorBodySchema,
  LinkDetailSchema,
  LinkListResponseSchema,
  RevisionConflictBodySchema,
  RevisionDiffResponseSchema,
  RevisionListResponseSchema,
  RevisionSchema,
} from '@beamwright/link-core/contracts';
import { createTestApp } from './utils/test-app.js';
import { designWith, workedExampleDesign } from './utils/designs.js';
import { bearer, createTestOrganisation, type TestOrganisation } from './utils/test-organisation.js';

/**
 * What evaluateLink returns, as JSON carries it: the API speaks JSON, which has no -0 (a zero
 * allowance comes out of link-core as -0 and arrives as 0). Every other number is carried exactly.
 */
function asJson<T>(value: T): T {
  return JSON.parse(JSON.stringify(value)) as T;
}

describe('links and immutable revisions (e2e)', () => {
  let app: INestApplication;
  let org: TestOrganisation;
  let other: TestOrganisation;

  beforeAll(async () => {
    app = await createTestApp();
    org = await createTestOrganisation(app, 'links');
    other = await createTestOrganisation(app, 'elsewhere');
  });

  afterAll(async () => {
    await org?.remove();
    await other?.remove();
    await app?.close();
  });

  const http = () => request(app.getHttpServer());

  async function createLink(name = 'Test link', design = workedExampleDesign(), extra: Record<string, unknown> = {}) {
    const response = await http().post('/api/links').set(...bearer(org.members.engineer)).send({ name, design, ...extra }).expect(201);
    return LinkDetailSchema.parse(response.body);
  }

  it('creates a link at revision 1 with the design (defaults applied) and its budget', async () => {
    const link = await createLink('Harbour to depot');
    expect(link).toMatchObject({ name: 'Harbour to depot', revision: 1, status: 'draft', owner: { id: org.members.engineer.id }, linkCoreVersion: LINK_CORE_VERSION });
    expect(link.design).toEqual(LinkDesignSchema.parse(workedExampleDesign()));
    expect(link.design.transmitter.m2).toBe(1); // a default the client did not send
    expect(link.rangeM).toBe(2000);
    expect(link.wavelengthM).toBe(1550e-9);
  });

  it('stores exactly the budget that link-core evaluateLink computes for the stored design', async () => {
    const link = await createLink('Budget check');
    const expected = asJson(evaluateLink(LinkDesignSchema.parse(workedExampleDesign())));
    const detail = await http().get(`/api/links/${link.id}`).set(...bearer(org.members.installer)).expect(200);
    const revision = await http().get(`/api/links/${link.id}/revisions/1`).set(...bearer(org.members.reviewer)).expect(200);
    expect(detail.body.budget).toStrictEqual(expected);
    expect(RevisionSchema.parse(revision.body).budget).toStrictEqual(expected);
    expect(detail.body.linkMarginDb).toBe(expected.linkMarginDb);
    // sanity against the worked example LB-01 (link-core/METHODS.md §10.1): margin 12.33 dB
    expect(evaluateLink({ ...detail.body.design, atmosphere: { ...detail.body.design.atmosphere, turbulenceModel: 'spherical-wave' } }).linkMarginDb).toBeCloseTo(12.33, 1);
  });

  it('saves revision n+1 on the latest base and answers 409 with the latest revision on a stale base', async () => {
    const link = await createLink('Revised link');
    const second = await http()
      .post(`/api/links/${link.id}/revisions`)
      .set(...bearer(org.members.engineer))
      .send({ baseRevision: 1, design: designWith({ rangeM: 2500 }), note: 'longer path' })
      .expect(201);
    expect(LinkDetailSchema.parse(second.body)).toMatchObject({ id: link.id, revision: 2, note: 'longer path', rangeM: 2500, author: { id: org.members.engineer.id } });
    expect(second.body.budget).toStrictEqual(asJson(evaluateLink(LinkDesignSchema.parse(designWith({ rangeM: 2500 })))));

    const stale = await http()
      .post(`/api/links/${link.id}/revisions`)
      .set(...bearer(org.members.engineer))
      .send({ baseRevision: 1, design: designWith({ powerDbm: 23 }), note: 'more power' })
      .expect(409);
    const conflict = RevisionConflictBodySchema.parse(stale.body);
    expect(conflict.latestRevision).toBe(2);
    expect(conflict.latest.revision).toBe(2);
    expect(conflict.latest.design.rangeM).toBe(2500);
    expect(conflict.message).toMatch(/not the latest/);

    const revisions = RevisionListResponseSchema.parse((await http().get(`/api/links/${link.id}/revisions`).set(...bearer(org.members.engineer)).expect(200)).body);
    expect(revisions.items.map((item) => item.revision)).toEqual([1, 2]);
    // revision 1 is unchanged by the later save
    const first = await http().get(`/api/links/${link.id}/revisions/1`).set(...bearer(org.members.engineer)).expect(200);
    expect(first.body.design.rangeM).toBe(2000);
  });

  it('lets exactly one of 20 concurrent saves on the same base win; none is lost or duplicated', async () => {
    const link = await createLink('Contended link');
    const attempts = Array.from({ length: 20 }, (_, index) =>
      http()
        .post(`/api/links/${link.id}/revisions`)
        .set(...bearer(org.members.engineer))
        .send({ baseRevision: 1, design: designWith({ rangeM: 1000 + index }), note: `attempt ${index}` })
        .then((response) => response),
    );
    const responses = await Promise.all(attempts);
    const statuses = responses.map((response) => response.status);
    expect(statuses.filter((status) => status === 201)).toHaveLength(1);
    expect(statuses.filter((status) => status === 409)).toHaveLength(19);
    const winner = responses.find((response) => response.status === 201)!;
    expect(winner.body.revision).toBe(2);
    for (const loser of responses.filter((response) => response.status === 409)) {
      expect(loser.body.latestRevision).toBe(2);
      expect(loser.body.latest.note).toBe(winner.body.note);
    }

    const revisions = (await http().get(`/api/links/${link.id}/revisions`).set(...bearer(org.members.engineer)).expect(200)).body;
    expect(revisions.items.map((item: { revision: number }) => item.revision)).toEqual([1, 2]);
    const stored = (await http().get(`/api/links/${link.id}/revisions/2`).set(...bearer(org.members.engineer)).expect(200)).body;
    expect(stored.note).toBe(winner.body.note);
    expect(stored.design.rangeM).toBe(1000 + Number(winner.body.note.replace('attempt ', '')));
    const detail = (await http().get(`/api/links/${link.id}`).set(...bearer(org.members.engineer)).expect(200)).body;
    expect(detail.revision).toBe(2);
    expect(detail.rangeM).toBe(stored.design.rangeM);
  });

  it('diffs two revisions field by field', async () => {
    const link = await createLink('Diffed link');
    await http().post(`/api/links/${link.id}/revisions`).set(...bearer(org.members.engineer)).send({ baseRevision: 1, design: designWith({ rangeM: 1500 }), note: '' }).expect(201);
    await http()
      .post(`/api/links/${link.id}/revisions`)
      .set(...bearer(org.members.engineer))
      .send({ baseRevision: 2, design: designWith({ rangeM: 1500, powerDbm: 17, visibilityM: 2000 }), note: '' })
      .expect(201);
    const response = await http().get(`/api/links/${link.id}/diff?from=1&to=3`).set(...bearer(org.members.installer)).expect(200);
    expect(RevisionDiffResponseSchema.parse(response.body)).toEqual({
      linkId: link.id,
      from: 1,
      to: 3,
      changes: [
        { path: 'atmosphere.visibilityM', from: 5000, to: 2000 },
        { path: 'rangeM', from: 2000, to: 1500 },
        { path: 'transmitter.powerDbm', from: 20, to: 17 },
      ],
    });
    const same = await http().get(`/api/links/${link.id}/diff?from=2&to=2`).set(...bearer(org.members.installer)).expect(200);
    expect(same.body.changes).toEqual([]);
    await http().get(`/api/links/${link.id}/diff?from=1&to=9`).set(...bearer(org.members.installer)).expect(404);
    const bad = await http().get(`/api/links/${link.id}/diff?from=0&to=x`).set(...bearer(org.members.installer)).expect(400);
    expect(bad.body.issues.map((issue: { path: string }) => issue.path)).toEqual(['from', 'to']);
  });

  it('answers 400 with the field path for an invalid design, and saves nothing', async () => {
    const design = workedExampleDesign();
    design.transmitter.wavelengthM = -850e-9;
    const response = await http().post('/api/links').set(...bearer(org.members.engineer)).send({ name: 'Broken', design }).expect(400);
    const body = ErrorBodySchema.parse(response.body);
    expect(body.issues).toContainEqual({ path: 'design.transmitter.wavelengthM', message: 'must be at least 200 nm' });
    expect(body.message).toContain('design.transmitter.wavelengthM');

    const link = await createLink('Validated revisions');
    const invalid = await http()
      .post(`/api/links/${link.id}/revisions`)
      .set(...bearer(org.members.engineer))
      .send({ baseRevision: 1, design: { ...workedExampleDesign(), rangeM: 0, typo: 1 }, note: 'bad' })
      .expect(400);
    expect(invalid.body.issues).toEqual(
      expect.arrayContaining([
        { path: 'design.rangeM', message: expect.stringMatching(/greater than|at least/) },
        { path: 'design.typo', message: 'is not a known field' },
      ]),
    );
    const missingBase = await http().post(`/api/links/${link.id}/revisions`).set(...bearer(org.members.engineer)).send({ design: workedExampleDesign() }).expect(400);
    expect(missingBase.body.issues).toContainEqual({ path: 'baseRevision', message: 'is required' });
    const list = (await http().get(`/api/links/${link.id}/revisions`).set(...bearer(org.members.engineer)).expect(200)).body;
    expect(list.items).toHaveLength(1);
  });

  it('answers 400 for malformed JSON, 404 for unknown ids and revisions, 400 for ids that are not UUIDs', async () => {
    const malformed = await http().post('/api/links').set(...bearer(org.members.engineer)).set('Content-Type', 'application/json').send('{"name": "x", "design": {').expect(400);
    expect(malformed.body).toEqual({ statusCode: 400, error: 'Bad Request', message: 'The request body is not valid JSON' });
    const unknown = '00000000-0000-4000-8000-000000000000';
    expect((await http().get(`/api/links/${unknown}`).set(...bearer(org.members.engineer)).expect(404)).body.message).toBe('Link not found');
    await http().post(`/api/links/${unknown}/revisions`).set(...bearer(org.members.engineer)).send({ baseRevision: 1, design: workedExampleDesign() }).expect(404);
    const link = await createLink('Known link');
    await http().get(`/api/links/${link.id}/revisions/7`).set(...bearer(org.members.engineer)).expect(404);
    const notNumber = await http().get(`/api/links/${link.id}/revisions/first`).set(...bearer(org.members.engineer)).expect(400);
    expect(notNumber.body.issues).toEqual([{ path: 'revision', message: 'must be a whole number of at least 1' }]);
    await http().get('/api/links/12345').set(...bearer(org.members.engineer)).expect(400);
  });

  it('lets installers and reviewers read but not write designs (403)', async () => {
    const link = await createLink('Read-only for some');
    for (const role of ['installer', 'reviewer'] as const) {
      await http().post('/api/links').set(...bearer(org.members[role])).send({ name: 'Nope', design: workedExampleDesign() }).expect(403);
      await http().post(`/api/links/${link.id}/revisions`).set(...bearer(org.members[role])).send({ baseRevision: 1, design: workedExampleDesign() }).expect(403);
      await http().patch(`/api/links/${link.id}`).set(...bearer(org.members[role])).send({ name: 'Renamed' }).expect(403);
      await http().get(`/api/links/${link.id}`).set(...bearer(org.members[role])).expect(200);
      await http().get('/api/links').set(...bearer(org.members[role])).expect(200);
    }
    await http().get('/api/links').expect(401);
  });

  it("hides another organisation's links and sites: 404 everywhere, never 403", async () => {
    const link = await createLink('Private link');
    const outsider = other.members.admin;
    await http().get(`/api/links/${link.id}`).set(...bearer(outsider)).expect(404);
    await http().get(`/api/links/${link.id}/revisions`).set(...bearer(outsider)).expect(404);
    await http().get(`/api/links/${link.id}/revisions/1`).set(...bearer(outsider)).expect(404);
    await http().get(`/api/links/${link.id}/diff?from=1&to=1`).set(...bearer(outsider)).expect(404);
    await http().get(`/api/links/${link.id}/reviews`).set(...bearer(outsider)).expect(404);
    await http().post(`/api/links/${link.id}/revisions`).set(...bearer(other.members.engineer)).send({ baseRevision: 1, design: workedExampleDesign() }).expect(404);
    await http().patch(`/api/links/${link.id}`).set(...bearer(other.members.engineer)).send({ name: 'Mine now' }).expect(404);
    await http().post(`/api/links/${link.id}/revisions/1/submit`).set(...bearer(other.members.engineer)).send({}).expect(404);
    const list = LinkListResponseSchema.parse((await http().get('/api/links?pageSize=100').set(...bearer(outsider)).expect(200)).body);
    expect(list.items.map((item) => item.id)).not.toContain(link.id);

    // a site of another organisation cannot be attached
    const foreignSite = await http()
      .post('/api/sites')
      .set(...bearer(other.members.engineer))
      .send({ name: 'Foreign roof', latitudeDeg: 10, longitudeDeg: 10, groundElevationM: 0, mountHeightM: 5 })
      .expect(201);
    const attach = await http().post('/api/links').set(...bearer(org.members.engineer)).send({ name: 'Sneaky', design: workedExampleDesign(), siteAId: foreignSite.body.id }).expect(400);
    expect(attach.body.issues).toEqual([{ path: 'siteAId', message: 'is not a site of your organisation' }]);
  });

  it('lists links paged, sorted and filtered by status, site and text', async () => {
    const admin = org.members.admin;
    const siteA = (await http().post('/api/sites').set(...bearer(admin)).send({ name: 'Quarry Tower', latitudeDeg: 1, longitudeDeg: 1, groundElevationM: 10, mountHeightM: 20 }).expect(201)).body;
    const siteB = (await http().post('/api/sites').set(...bearer(admin)).send({ name: 'Ferry House', latitudeDeg: 1.01, longitudeDeg: 1, groundElevationM: 5, mountHeightM: 8 }).expect(201)).body;
    const tag = `zeta${Date.now()}`;
    const short = await createLink(`${tag} short`, designWith({ rangeM: 600 }), { siteAId: siteA.id, siteBId: siteB.id });
    const long = await createLink(`${tag} long`, designWith({ rangeM: 2900 }));
    const middle = await createLink(`${tag} middle`, designWith({ rangeM: 1400 }));
    await http().post(`/api/links/${middle.id}/revisions/1/submit`).set(...bearer(org.members.engineer)).send({}).expect(200);

    const byRange = LinkListResponseSchema.parse((await http().get(`/api/links?q=${tag}&sort=rangeM&order=asc`).set(...bearer(admin)).expect(200)).body);
    expect(byRange.items.map((item) => item.id)).toEqual([short.id, middle.id, long.id]);
    expect(byRange.total).toBe(3);
    expect(byRange.items[0]).toMatchObject({ siteA: { id: siteA.id, name: 'Quarry Tower' }, siteB: { id: siteB.id, name: 'Ferry House' } });
    expect(byRange.items[0]!.linkMarginDb).toBeGreaterThan(byRange.items[2]!.linkMarginDb);

    const paged = (await http().get(`/api/links?q=${tag}&sort=rangeM&order=desc&page=2&pageSize=2`).set(...bearer(admin)).expect(200)).body;
    expect(paged).toMatchObject({ page: 2, pageSize: 2, total: 3 });
    expect(paged.items.map((item: { id: string }) => item.id)).toEqual([short.id]);

    const inReview = (await http().get(`/api/links?q=${tag}&status=in_review`).set(...bearer(admin)).expect(200)).body;
    expect(inReview.items.map((item: { id: string }) => item.id)).toEqual([middle.id]);
    const bySite = (await http().get(`/api/links?siteId=${siteB.id}`).set(...bearer(admin)).expect(200)).body;
    expect(bySite.items.map((item: { id: string }) => item.id)).toEqual([short.id]);
    const bySiteName = (await http().get('/api/links?q=ferry%20house').set(...bearer(admin)).expect(200)).body;
    expect(bySiteName.items.map((item: { id: string }) => item.id)).toContain(short.id);
    const wildcard = (await http().get(`/api/links?q=${tag}%25`).set(...bearer(admin)).expect(200)).body;
    expect(wildcard.total).toBe(0); // % is matched literally

    const bad = await http().get('/api/links?sort=colour&pageSize=500').set(...bearer(admin)).expect(400);
    expect(bad.body.issues.map((issue: { path: string }) => issue.path).sort()).toEqual(['pageSize', 'sort']);

    // a site in use by a link cannot be deleted
    await http().delete(`/api/sites/${siteB.id}`).set(...bearer(admin)).expect(409);
  });

  it('renames a link and moves its ends without a new revision', async () => {
    const admin = org.members.admin;
    const site = (await http().post('/api/sites').set(...bearer(admin)).send({ name: 'Granary loft', latitudeDeg: 2, longitudeDeg: 2, groundElevationM: 7, mountHeightM: 11 }).expect(201)).body;
    const link = await createLink('Unnamed hop');
    const patched = await http().patch(`/api/links/${link.id}`).set(...bearer(org.members.engineer)).send({ name: 'Granary hop', siteAId: site.id }).expect(200);
    expect(LinkDetailSchema.parse(patched.body)).toMatchObject({ name: 'Granary hop', revision: 1, siteA: { id: site.id, name: 'Granary loft' }, siteB: null });
    const cleared = await http().patch(`/api/links/${link.id}`).set(...bearer(org.members.engineer)).send({ siteAId: null }).expect(200);
    expect(cleared.body).toMatchObject({ name: 'Granary hop', siteA: null });
    const same = await http().patch(`/api/links/${link.id}`).set(...bearer(org.members.engineer)).send({ siteAId: site.id, siteBId: site.id }).expect(400);
    expect(same.body.issues).toEqual([{ path: 'siteBId', message: 'must be a different site from siteAId' }]);
    const renamedSite = await http().patch(`/api/sites/${site.id}`).set(...bearer(admin)).send({ mountHeightM: 13.5, notes: 'new mast' }).expect(200);
    expect(renamedSite.body).toMatchObject({ name: 'Granary loft', mountHeightM: 13.5, notes: 'new mast' });
    const badSite = await http().patch(`/api/sites/${site.id}`).set(...bearer(admin)).send({ latitudeDeg: 95 }).expect(400);
    expect(badSite.body.issues).toEqual([{ path: 'latitudeDeg', message: 'must be at most 90' }]);
  });

  it('evaluates a design without storing it, with the same numbers as link-core', async () => {
    const response = await http().post('/api/evaluate').set(...bearer(org.members.installer)).send({ design: workedExampleDesign() }).expect(200);
    expect(response.body).toStrictEqual(asJson(evaluateLink(LinkDesignSchema.parse(workedExampleDesign()))));
    const invalid = await http().post('/api/evaluate').set(...bearer(org.members.installer)).send({ design: { ...workedExampleDesign(), rangeM: -5 } }).expect(400);
    expect(invalid.body.issues[0].path).toBe('design.rangeM');
    await http().post('/api/evaluate').send({ design: workedExampleDesign() }).expect(401);
  });
});
