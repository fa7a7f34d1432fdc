import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import { DataSource } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { evaluateLink, LINK_CORE_VERSION, type LinkBudget } from '@beamwright/link-core';
import { LinkDetailSchema, RevisionListResponseSchema, RevisionSchema } from '@beamwright/link-core/contracts';
import { createTestApp } from './utils/test-app.js';
import { workedExampleDesign } from './utils/designs.js';
import { bearer, createTestOrganisation, type TestOrganisation } from './utils/test-organisation.js';

/**
 * A revision saved by an engine before 0.2.0 keeps its stored budget and margin; the api reads its
 * design as that engine meant it (no turbulence model = spherical wave) and shows the current
 * engine's margin beside it, with the difference.
 */
describe('revisions of an older engine (e2e)', () => {
  let app: INestApplication;
  let org: TestOrganisation;

  beforeAll(async () => {
    app = await createTestApp();
    org = await createTestOrganisation(app, 'engine-version');
  });

  afterAll(async () => {
    await org?.remove();
    await app?.close();
  });

  const http = () => request(app.getHttpServer());

  it('keeps the stored margin of a revision saved before the change and shows the current engine beside it', async () => {
    const created = LinkDetailSchema.parse(
      (await http().post('/api/links').set(...bearer(org.members.engineer)).send({ name: 'Saved by 0.1.0', design: workedExampleDesign() }).expect(201)).body,
    );
    expect(created.linkCoreVersion).toBe(LINK_CORE_VERSION);
    expect(created.currentEngine).toBeNull();
    expect(created.design.atmosphere.turbulenceModel).toBeUndefined();

    // The row as engine 0.1.0 stored it: its own budget (no beam-spread term, no turbulence model
    // fields) with the margin that engine printed. Written once here as test set-up; the api never
    // rewrites a stored revision.
    const spherical = evaluateLink({ ...created.design, atmosphere: { ...created.design.atmosphere, turbulenceModel: 'spherical-wave' } });
    const { turbulenceModel: _model, longTermBeamRadiusM: _radius, beamWanderRmsM: _wander, ...legacyFields } = spherical;
    const storedMarginDb = 12.33230208; // LB-01's margin under the small-receiver pointing form of 0.1.0
    const legacyBudget: LinkBudget = { ...legacyFields, terms: spherical.terms.filter((t) => t.key !== 'turbulenceBeamSpread'), linkMarginDb: storedMarginDb };
    await app
      .get(DataSource)
      .query(`UPDATE link_revision SET link_core_version = '0.1.0', budget = $1 WHERE link_id = $2`, [JSON.stringify(legacyBudget), created.id]);

    const detail = LinkDetailSchema.parse((await http().get(`/api/links/${created.id}`).set(...bearer(org.members.engineer)).expect(200)).body);
    expect(detail.linkCoreVersion).toBe('0.1.0');
    expect(detail.budget.linkMarginDb).toBe(storedMarginDb); // the stored figure, unchanged
    expect(detail.budget.terms.map((t) => t.key)).not.toContain('turbulenceBeamSpread');
    expect(detail.design.atmosphere.turbulenceModel).toBeUndefined(); // the row is not edited
    expect(detail.currentEngine).toEqual({
      linkCoreVersion: LINK_CORE_VERSION,
      linkMarginDb: spherical.linkMarginDb, // read as the spherical wave it was computed with
      receivedPowerDbm: spherical.receivedPowerDbm,
      marginChangeDb: spherical.linkMarginDb - storedMarginDb,
      belowRequiredMargin: false,
    });
    expect(Math.abs(detail.currentEngine!.marginChangeDb)).toBeLessThan(1e-3); // exact capture: +7.6e-5 dB here

    const revision = RevisionSchema.parse((await http().get(`/api/links/${created.id}/revisions/1`).set(...bearer(org.members.engineer)).expect(200)).body);
    expect(revision.budget.linkMarginDb).toBe(storedMarginDb);
    expect(revision.currentEngine?.linkMarginDb).toBe(spherical.linkMarginDb);
    const history = RevisionListResponseSchema.parse((await http().get(`/api/links/${created.id}/revisions`).set(...bearer(org.members.engineer)).expect(200)).body);
    expect(history.items[0]!.linkMarginDb).toBe(storedMarginDb);
    expect(history.items[0]!.currentEngine?.marginChangeDb).toBeCloseTo(spherical.linkMarginDb - storedMarginDb, 12);
  });
});
