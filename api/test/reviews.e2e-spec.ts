import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { LinkDetailSchema, ReviewActionResponseSchema, ReviewListResponseSchema, RevisionSchema } from '@beamwright/link-core/contracts';
import { createTestApp } from './utils/test-app.js';
import { designWith, workedExampleDesign } from './utils/designs.js';
import { bearer, createTestOrganisation, type TestMember, type TestOrganisation } from './utils/test-organisation.js';

describe('review of revisions (e2e)', () => {
  let app: INestApplication;
  let org: TestOrganisation;

  beforeAll(async () => {
    app = await createTestApp();
    org = await createTestOrganisation(app, 'review');
  });

  afterAll(async () => {
    await org?.remove();
    await app?.close();
  });

  const http = () => request(app.getHttpServer());

  async function createLink(author: TestMember, name: string) {
    const response = await http().post('/api/links').set(...bearer(author)).send({ name, design: workedExampleDesign(), note: 'first cut' }).expect(201);
    return LinkDetailSchema.parse(response.body);
  }

  function act(member: TestMember, linkId: string, revision: number, action: string, body: object = {}) {
    return http().post(`/api/links/${linkId}/revisions/${revision}/${action}`).set(...bearer(member)).send(body);
  }

  it('walks a revision from draft through review and approval to installed, recording the trail', async () => {
    const { engineer, reviewer, installer } = org.members;
    const link = await createLink(engineer, 'Walked link');

    const submitted = ReviewActionResponseSchema.parse((await act(engineer, link.id, 1, 'submit', { comment: 'ready' }).expect(200)).body);
    expect(submitted).toMatchObject({ status: 'in_review', review: { action: 'submit', fromStatus: 'draft', toStatus: 'in_review', revision: 1, comment: 'ready', actor: { id: engineer.id } } });

    // returning needs a comment that says what to change
    const noComment = await act(reviewer, link.id, 1, 'return', {}).expect(400);
    expect(noComment.body.issues).toEqual([{ path: 'comment', message: 'is required' }]);
    await act(reviewer, link.id, 1, 'return', { comment: 'check the receiver overload' }).expect(200);
    expect((await http().get(`/api/links/${link.id}`).set(...bearer(installer)).expect(200)).body.status).toBe('draft');

    await act(engineer, link.id, 1, 'submit').expect(200);
    const approved = ReviewActionResponseSchema.parse((await act(reviewer, link.id, 1, 'approve', { comment: 'fine' }).expect(200)).body);
    expect(approved.status).toBe('approved');

    const revision = RevisionSchema.parse((await http().get(`/api/links/${link.id}/revisions/1`).set(...bearer(installer)).expect(200)).body);
    expect(revision.approval).toMatchObject({ by: { id: reviewer.id } });
    expect(Date.parse(revision.approval!.at)).toBeGreaterThanOrEqual(Date.parse(revision.createdAt));

    // approving twice is a state conflict
    await act(reviewer, link.id, 1, 'approve').expect(409);
    const installed = ReviewActionResponseSchema.parse((await act(installer, link.id, 1, 'install', { comment: 'aligned, -14.2 dBm measured' }).expect(200)).body);
    expect(installed.status).toBe('installed');

    const trail = ReviewListResponseSchema.parse((await http().get(`/api/links/${link.id}/reviews`).set(...bearer(installer)).expect(200)).body);
    expect(trail.items.map((entry) => `${entry.action}:${entry.fromStatus}->${entry.toStatus}`)).toEqual([
      'submit:draft->in_review',
      'return:in_review->draft',
      'submit:draft->in_review',
      'approve:in_review->approved',
      'install:approved->installed',
    ]);
    expect(trail.items[1]!.comment).toBe('check the receiver overload');
  });

  it('stops engineers and admins approving or returning (403); a reviewer approves', async () => {
    const { admin, engineer, reviewer } = org.members;
    const link = await createLink(engineer, 'Engineer-authored');
    await act(engineer, link.id, 1, 'submit').expect(200);
    await act(engineer, link.id, 1, 'approve').expect(403);
    await act(engineer, link.id, 1, 'return', { comment: 'no' }).expect(403);
    await act(admin, link.id, 1, 'approve').expect(403);
    await act(reviewer, link.id, 1, 'approve').expect(200);
  });

  it('keeps an approved revision unchanged; a new revision starts a new draft', async () => {
    const { engineer, reviewer, installer } = org.members;
    const link = await createLink(engineer, 'Approved then revised');
    await act(engineer, link.id, 1, 'submit').expect(200);
    await act(reviewer, link.id, 1, 'approve').expect(200);
    const before = (await http().get(`/api/links/${link.id}/revisions/1`).set(...bearer(engineer)).expect(200)).body;

    const revised = await http()
      .post(`/api/links/${link.id}/revisions`)
      .set(...bearer(engineer))
      .send({ baseRevision: 1, design: designWith({ powerDbm: 18 }), note: 'lower power' })
      .expect(201);
    expect(revised.body).toMatchObject({ revision: 2, status: 'draft', approval: null });

    const after = (await http().get(`/api/links/${link.id}/revisions/1`).set(...bearer(engineer)).expect(200)).body;
    expect(after).toEqual(before);
    // the old revision cannot be acted on any more, the new one must go through review itself
    await act(installer, link.id, 1, 'install').expect(409);
    await act(installer, link.id, 2, 'install').expect(409);
    await act(reviewer, link.id, 2, 'approve').expect(409);
    await act(engineer, link.id, 2, 'submit').expect(200);
  });

  it('answers 404 for a revision that does not exist and 403 for roles without the action', async () => {
    const { engineer, reviewer, installer } = org.members;
    const link = await createLink(engineer, 'Role checks');
    await act(engineer, link.id, 5, 'submit').expect(404);
    await act(installer, link.id, 1, 'submit').expect(403);
    await act(reviewer, link.id, 1, 'submit').expect(403);
    await act(engineer, link.id, 1, 'install').expect(403);
    await act(reviewer, link.id, 1, 'install').expect(403);
    // installing needs an approved revision
    await act(installer, link.id, 1, 'install').expect(409);
  });
});
