import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { evaluateLink, FADE_PROBABILITY_MESSAGE, LinkBudgetSchema, LinkDesignSchema } from '@beamwright/link-core';
import { createTestApp } from './utils/test-app.js';
import { workedExampleDesign } from './utils/designs.js';
import { bearer, createTestOrganisation, type TestOrganisation } from './utils/test-organisation.js';

describe('POST /api/evaluate (e2e)', () => {
  let app: INestApplication;
  let org: TestOrganisation;
  const http = () => request(app.getHttpServer());

  beforeAll(async () => {
    app = await createTestApp();
    org = await createTestOrganisation(app, 'evaluate');
  });

  afterAll(async () => {
    await org?.remove();
    await app?.close();
  });

  it("answers link-core's budget to any signed-in role", async () => {
    const response = await http().post('/api/evaluate').set(...bearer(org.members.installer)).send({ design: workedExampleDesign() }).expect(200);
    expect(LinkBudgetSchema.parse(response.body).linkMarginDb).toBeCloseTo(evaluateLink(LinkDesignSchema.parse(workedExampleDesign())).linkMarginDb, 12);
  });

  it('refuses a fade probability of 1e-17 with a 400 naming the field, at once (it once stalled for 10 s and answered an infinite margin)', async () => {
    const design = { ...workedExampleDesign(), scintillation: { include: true, probability: 1e-17 } };
    const started = Date.now();
    const response = await http().post('/api/evaluate').set(...bearer(org.members.installer)).send({ design });
    expect(response.status).toBe(400);
    expect(response.body.issues).toEqual([{ path: 'design.scintillation.probability', message: FADE_PROBABILITY_MESSAGE }]);
    expect(Date.now() - started).toBeLessThan(5000);
  });

  it('refuses the same probability when saving a link, and stores nothing', async () => {
    const design = { ...workedExampleDesign(), scintillation: { include: true, probability: 1e-17 } };
    const response = await http().post('/api/links').set(...bearer(org.members.engineer)).send({ name: 'Stalling fade', design }).expect(400);
    expect(response.body.issues.map((issue: { path: string }) => issue.path)).toEqual(['design.scintillation.probability']);
    const list = await http().get('/api/links').query({ q: 'Stalling fade' }).set(...bearer(org.members.engineer)).expect(200);
    expect(list.body.total).toBe(0);
  });

  it('answers a finite budget at both bounds of the fade probability', async () => {
    for (const probability of [1e-9, 0.5]) {
      const design = { ...workedExampleDesign(), scintillation: { include: true, probability } };
      const response = await http().post('/api/evaluate').set(...bearer(org.members.engineer)).send({ design }).expect(200);
      expect(Number.isFinite(response.body.scintillationFadeMarginDb)).toBe(true);
      expect(Number.isFinite(response.body.linkMarginDb)).toBe(true);
    }
  });
});
