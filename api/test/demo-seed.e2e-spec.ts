import type { INestApplication } from '@nestjs/common';
import { randomBytes } from 'node:crypto';
import request from 'supertest';
import { DataSource } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { evaluateLink, LinkDesignSchema, type LinkDesign } from '@beamwright/link-core';
import { LinkDetailSchema, LinkListResponseSchema } from '@beamwright/link-core/contracts';
import { readDemoFixtures, type DemoFixtures } from '../src/database/seeds/demo-fixtures.js';
import { seedDemo } from '../src/database/seeds/demo-seed.js';
import { Organisation } from '../src/organisations/organisation.entity.js';
import { createTestApp } from './utils/test-app.js';

/**
 * The real demo fixtures, seeded under a private organisation slug and private e-mails so the test
 * neither meets nor leaves behind the demo organisation of a database that `npm start` uses.
 */
function privateCopy(fixtures: DemoFixtures, suffix: string): DemoFixtures {
  const email = (address: string) => address.replace('@demo.test', `.${suffix}@seed-check.test`);
  return {
    ...fixtures,
    organisation: { slug: `seed-check-${suffix}`, name: `${fixtures.organisation.name} (seed check)` },
    users: fixtures.users.map((user) => ({ ...user, email: email(user.email) })),
    links: fixtures.links.map((link) => ({
      ...link,
      owner: email(link.owner),
      history: link.history.map((event) => (event.type === 'revision' ? { ...event, author: email(event.author) } : { ...event, actor: email(event.actor) })),
    })),
  };
}

describe('demo seed (e2e)', () => {
  let app: INestApplication;
  let fixtures: DemoFixtures;
  let organisationId: string | undefined;
  const password = 'seed-check-password';

  beforeAll(async () => {
    app = await createTestApp();
    fixtures = privateCopy(readDemoFixtures(), randomBytes(4).toString('hex'));
  });

  afterAll(async () => {
    if (organisationId) {
      const dataSource = app.get(DataSource);
      await dataSource.query('DELETE FROM link WHERE organisation_id = $1', [organisationId]);
      await dataSource.getRepository(Organisation).delete(organisationId);
    }
    await app?.close();
  });

  it('seeds a lived-in organisation once, and nothing more on a second run', async () => {
    const dataSource = app.get(DataSource);
    const first = await seedDemo(dataSource, { demoPassword: password, fixtures });
    organisationId = first.organisationId;
    expect(first).toMatchObject({ usersCreated: 4, sitesCreated: fixtures.sites.length, equipmentCreated: fixtures.equipment.length, linksCreated: fixtures.links.length });
    const second = await seedDemo(dataSource, { demoPassword: password, fixtures });
    expect(second).toEqual({ organisationId, usersCreated: 0, usersUpdated: 0, sitesCreated: 0, equipmentCreated: 0, linksCreated: 0 });

    const engineer = fixtures.users.find((user) => user.role === 'engineer')!;
    const login = await request(app.getHttpServer()).post('/api/auth/login').send({ email: engineer.email, password }).expect(200);
    const auth: [string, string] = ['Authorization', `Bearer ${login.body.accessToken}`];
    const list = LinkListResponseSchema.parse((await request(app.getHttpServer()).get('/api/links?pageSize=50').set(...auth).expect(200)).body);
    expect(new Set(list.items.map((item) => item.status))).toEqual(new Set(['draft', 'in_review', 'approved', 'installed']));
    expect(new Set(list.items.map((item) => Math.round(item.wavelengthM * 1e9)))).toEqual(new Set([785, 850, 1550]));
    for (const item of list.items) {
      expect(item.rangeM).toBeGreaterThanOrEqual(400);
      expect(item.rangeM).toBeLessThanOrEqual(3000);
      const revisions = (await request(app.getHttpServer()).get(`/api/links/${item.id}/revisions`).set(...auth).expect(200)).body.items;
      expect(revisions.map((revision: { revision: number }) => revision.revision)).toEqual(Array.from({ length: item.revision }, (_, index) => index + 1));
      const detail = (await request(app.getHttpServer()).get(`/api/links/${item.id}`).set(...auth).expect(200)).body;
      expect(detail.budget).toStrictEqual(JSON.parse(JSON.stringify(evaluateLink(LinkDesignSchema.parse(detail.design)))));
      for (const variant of detail.variants) {
        expect(variant.budget).toStrictEqual(JSON.parse(JSON.stringify(evaluateLink(LinkDesignSchema.parse(variant.design)))));
      }
    }

    // one link's latest revision carries the wavelength set: the same optics at the four usual wavelengths
    const withSet = list.items.filter((item) => item.name === 'Harbour Office to North Water Tower');
    expect(withSet).toHaveLength(1);
    const detail = LinkDetailSchema.parse((await request(app.getHttpServer()).get(`/api/links/${withSet[0]!.id}`).set(...auth).expect(200)).body);
    expect(detail.variants!.map((variant) => [variant.name, Math.round(variant.design.transmitter.wavelengthM * 1e9)])).toEqual([
      ['785 nm', 785],
      ['850 nm', 850],
      ['1310 nm', 1310],
      ['1550 nm', 1550],
    ]);
    const withoutWavelength = (design: LinkDesign) => ({ ...design, transmitter: { ...design.transmitter, wavelengthM: 0 } });
    for (const variant of detail.variants!) expect(withoutWavelength(variant.design)).toEqual(withoutWavelength(detail.design));
    const earlier = (await request(app.getHttpServer()).get(`/api/links/${detail.id}/revisions/1`).set(...auth).expect(200)).body;
    expect(earlier.variants).toEqual([]);
  });
});
