import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import { DataSource } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { evaluateLink, LINK_CORE_VERSION, REQUIRED_LINK_MARGIN_DB, type LinkBudget, type LinkDesignInput } from '@beamwright/link-core';
import { LinkDetailSchema, LinkListResponseSchema } from '@beamwright/link-core/contracts';
import { createTestApp } from './utils/test-app.js';
import { designWith } from './utils/designs.js';
import { bearer, createTestOrganisation, type TestOrganisation } from './utils/test-organisation.js';

/**
 * The links list flags an approved or installed link whose latest revision an older engine
 * computed and whose margin under the current engine falls below the required margin.
 */
describe('links list: current-engine margin of signed-off links (e2e)', () => {
  let app: INestApplication;
  let org: TestOrganisation;

  beforeAll(async () => {
    app = await createTestApp();
    org = await createTestOrganisation(app, 'engine-flag');
  });

  afterAll(async () => {
    await org?.remove();
    await app?.close();
  });

  const http = () => request(app.getHttpServer());
  const act = (linkId: string, action: 'submit' | 'approve') =>
    http()
      .post(`/api/links/${linkId}/revisions/1/${action}`)
      .set(...bearer(action === 'submit' ? org.members.engineer : org.members.reviewer))
      .send({})
      .expect(200);

  /**
   * A link whose revision 1 is rewritten as engine 0.1.0 stored it (test set-up only; the api
   * never rewrites a revision): the design without a turbulence model and a budget whose margin is
   * `storedMarginDb` (also the link row's copy of it). Returns the current engine's budget for that design, read as the spherical
   * wave 0.1.0 computed it with.
   */
  async function legacyLink(name: string, design: LinkDesignInput, storedMarginDb: number, signOff: boolean) {
    const created = LinkDetailSchema.parse((await http().post('/api/links').set(...bearer(org.members.engineer)).send({ name, design }).expect(201)).body);
    expect(created.design.atmosphere.turbulenceModel).toBeUndefined();
    if (signOff) {
      await act(created.id, 'submit');
      await act(created.id, 'approve');
    }
    const spherical = evaluateLink({ ...created.design, atmosphere: { ...created.design.atmosphere, turbulenceModel: 'spherical-wave' } });
    const { turbulenceModel: _model, longTermBeamRadiusM: _radius, beamWanderRmsM: _wander, ...legacyFields } = spherical;
    const legacyBudget: LinkBudget = { ...legacyFields, terms: spherical.terms.filter((t) => t.key !== 'turbulenceBeamSpread'), linkMarginDb: storedMarginDb };
    const database = app.get(DataSource);
    await database.query(`UPDATE link_revision SET link_core_version = '0.1.0', budget = $1 WHERE link_id = $2`, [JSON.stringify(legacyBudget), created.id]);
    // the list's copy of the latest revision's figures, as that save wrote it
    await database.query(`UPDATE link SET latest_link_margin_db = $1 WHERE id = $2`, [storedMarginDb, created.id]);
    return { id: created.id, current: spherical };
  }

  const listRow = async (id: string) => {
    const list = LinkListResponseSchema.parse((await http().get('/api/links?pageSize=100').set(...bearer(org.members.engineer)).expect(200)).body);
    const row = list.items.find((item) => item.id === id);
    expect(row).toBeDefined();
    return row!;
  };

  // LB-01 (METHODS.md §10.1, margin about 12.3 dB) with 10 dB less transmit power: about 2.3 dB
  // with the current engine, below the required 3 dB.
  const thinDesign = () => designWith({ powerDbm: 10 });
  // The stored margin of the set-up rows: above 3 dB, so only the current engine's figure can flag them.
  const storedMarginDb = 4.5;

  it('flags an approved link that the current engine puts below the required margin, with its figures', async () => {
    const { id, current } = await legacyLink('Approved, thin with the current engine', thinDesign(), storedMarginDb, true);
    expect(current.linkMarginDb).toBeLessThan(REQUIRED_LINK_MARGIN_DB);
    const row = await listRow(id);
    expect(row.status).toBe('approved');
    expect(row.linkMarginDb).toBe(storedMarginDb); // the stored figure stays the row's margin
    expect(row.currentEngine).toEqual({
      linkCoreVersion: LINK_CORE_VERSION,
      linkMarginDb: current.linkMarginDb,
      receivedPowerDbm: current.receivedPowerDbm,
      marginChangeDb: current.linkMarginDb - storedMarginDb,
      belowRequiredMargin: true,
    });
  });

  it('does not flag an approved link that keeps the required margin with the current engine', async () => {
    const { id, current } = await legacyLink('Approved, comfortable', designWith({}), 12, true);
    expect(current.linkMarginDb).toBeGreaterThan(REQUIRED_LINK_MARGIN_DB);
    const row = await listRow(id);
    expect(row.currentEngine?.belowRequiredMargin).toBe(false);
    expect(row.currentEngine?.linkMarginDb).toBe(current.linkMarginDb);
  });

  it('leaves drafts and revisions of the current engine without current-engine figures', async () => {
    const draft = await legacyLink('Draft, thin with the current engine', thinDesign(), storedMarginDb, false);
    expect((await listRow(draft.id)).currentEngine).toBeNull();

    const fresh = LinkDetailSchema.parse((await http().post('/api/links').set(...bearer(org.members.engineer)).send({ name: 'Approved by the current engine', design: thinDesign() }).expect(201)).body);
    await act(fresh.id, 'submit');
    await act(fresh.id, 'approve');
    const row = await listRow(fresh.id);
    expect(row.status).toBe('approved');
    expect(row.currentEngine).toBeNull();
  });
});
