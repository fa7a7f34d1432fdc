import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import { DataSource } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { evaluateLink, LINK_CORE_VERSION, LinkDesignSchema, type LinkBudget, type LinkDesignInput } from '@beamwright/link-core';
import {
  ErrorBodySchema,
  LinkDetailSchema,
  RevisionConflictBodySchema,
  RevisionListResponseSchema,
  RevisionSchema,
  type LinkDetail,
} from '@beamwright/link-core/contracts';
import { createTestApp } from './utils/test-app.js';
import { workedExampleDesign } from './utils/designs.js';
import { bearer, createTestOrganisation, type TestOrganisation } from './utils/test-organisation.js';

/** JSON has no -0: what evaluateLink returns, as the API carries it. */
function asJson<T>(value: T): T {
  return JSON.parse(JSON.stringify(value)) as T;
}

/** The worked example (LB-01, link-core/METHODS.md §10.1) with only the wavelength changed. */
function atWavelength(wavelengthM: number): LinkDesignInput {
  const design = workedExampleDesign();
  design.transmitter.wavelengthM = wavelengthM;
  return design;
}

/** The budget the API must store for a design: link-core's evaluateLink of the parsed design. */
function expectedBudget(design: LinkDesignInput): LinkBudget {
  return asJson(evaluateLink(LinkDesignSchema.parse(design)));
}

const WAVELENGTH_SET = [
  { name: '785 nm', design: atWavelength(785e-9) },
  { name: '850 nm', design: atWavelength(850e-9) },
  { name: '1310 nm', design: atWavelength(1310e-9) },
];

describe('variants of a revision and their promotion (e2e)', () => {
  let app: INestApplication;
  let org: TestOrganisation;
  let other: TestOrganisation;

  beforeAll(async () => {
    app = await createTestApp();
    org = await createTestOrganisation(app, 'variants');
    other = await createTestOrganisation(app, 'variants-elsewhere');
  });

  afterAll(async () => {
    await org?.remove();
    await other?.remove();
    await app?.close();
  });

  const http = () => request(app.getHttpServer());
  const engineer = () => bearer(org.members.engineer);

  async function createLink(name: string, extra: Record<string, unknown> = {}): Promise<LinkDetail> {
    const response = await http().post('/api/links').set(...engineer()).send({ name, design: workedExampleDesign(), ...extra }).expect(201);
    return LinkDetailSchema.parse(response.body);
  }

  /** A link whose revision 2 carries the 785/850/1310 nm set beside the 1550 nm worked example. */
  async function linkWithWavelengthSet(name: string): Promise<LinkDetail> {
    const link = await createLink(name);
    const saved = await http()
      .post(`/api/links/${link.id}/revisions`)
      .set(...engineer())
      .send({ baseRevision: 1, design: workedExampleDesign(), note: 'wavelength set', variants: WAVELENGTH_SET })
      .expect(201);
    return LinkDetailSchema.parse(saved.body);
  }

  /** Variant rows stored for any revision of the link, straight from the table. */
  async function storedVariantCount(linkId: string): Promise<number> {
    const rows = (await app
      .get(DataSource)
      .query('SELECT count(*)::int AS n FROM link_revision_variant v JOIN link_revision r ON r.id = v.revision_id WHERE r.link_id = $1', [linkId])) as { n: number }[];
    return rows[0]!.n;
  }

  async function revisionNumbers(linkId: string): Promise<number[]> {
    const list = RevisionListResponseSchema.parse((await http().get(`/api/links/${linkId}/revisions`).set(...engineer()).expect(200)).body);
    return list.items.map((item) => item.revision);
  }

  it('round-trips variants with the budgets link-core computes for them, in their order, on every read', async () => {
    const saved = await linkWithWavelengthSet('Round trip');
    expect(saved.revision).toBe(2);
    expect(saved.variants).toHaveLength(3);
    saved.variants!.forEach((variant, index) => {
      expect(variant).toStrictEqual({
        index,
        name: WAVELENGTH_SET[index]!.name,
        design: LinkDesignSchema.parse(WAVELENGTH_SET[index]!.design),
        budget: expectedBudget(WAVELENGTH_SET[index]!.design),
        linkCoreVersion: LINK_CORE_VERSION,
        currentEngine: null,
      });
    });
    // the wavelength moves the budget: each variant's margin is its own, not the primary's
    const margins = saved.variants!.map((variant) => variant.budget.linkMarginDb);
    expect(new Set([...margins, saved.budget.linkMarginDb]).size).toBe(4);

    const revision = RevisionSchema.parse((await http().get(`/api/links/${saved.id}/revisions/2`).set(...bearer(org.members.reviewer)).expect(200)).body);
    expect(revision.variants).toStrictEqual(saved.variants);
    const detail = LinkDetailSchema.parse((await http().get(`/api/links/${saved.id}`).set(...bearer(org.members.installer)).expect(200)).body);
    expect(detail.variants).toStrictEqual(saved.variants);
    const first = RevisionSchema.parse((await http().get(`/api/links/${saved.id}/revisions/1`).set(...engineer()).expect(200)).body);
    expect(first.variants).toEqual([]);
    const list = RevisionListResponseSchema.parse((await http().get(`/api/links/${saved.id}/revisions`).set(...engineer()).expect(200)).body);
    expect(list.items.map((item) => [item.revision, item.variantCount])).toEqual([
      [1, 0],
      [2, 3],
    ]);
    expect(list.items[1]).not.toHaveProperty('variants');

    // a new link may carry variants from revision 1; names come back trimmed
    const created = await createLink('Created with variants', { variants: [{ name: '  850 nm  ', design: atWavelength(850e-9) }] });
    expect(created.variants).toEqual([expect.objectContaining({ index: 0, name: '850 nm', budget: expectedBudget(atWavelength(850e-9)) })]);

    // a revision carries only the variants its body sends
    const next = await http().post(`/api/links/${saved.id}/revisions`).set(...engineer()).send({ baseRevision: 2, design: workedExampleDesign() }).expect(201);
    expect(next.body.variants).toEqual([]);
    expect(RevisionSchema.parse((await http().get(`/api/links/${saved.id}/revisions/2`).set(...engineer()).expect(200)).body).variants).toHaveLength(3);
  });

  it('answers 400 naming the variant of a bad field, 9 variants and a repeated name, and saves nothing', async () => {
    const link = await createLink('Refused variants');
    const broken = atWavelength(-850e-9);
    const badField = await http()
      .post(`/api/links/${link.id}/revisions`)
      .set(...engineer())
      .send({ baseRevision: 1, design: workedExampleDesign(), variants: [...WAVELENGTH_SET.slice(0, 2), { name: 'broken', design: broken }] })
      .expect(400);
    const badBody = ErrorBodySchema.parse(badField.body);
    expect(badBody.issues).toEqual([{ path: 'variants.2.design.transmitter.wavelengthM', message: 'must be at least 200 nm' }]);
    expect(badBody.message).toBe('variants.2.design.transmitter.wavelengthM must be at least 200 nm');

    const nine = Array.from({ length: 9 }, (_, index) => ({ name: `variant ${index + 1}`, design: workedExampleDesign() }));
    const tooMany = await http().post(`/api/links/${link.id}/revisions`).set(...engineer()).send({ baseRevision: 1, design: workedExampleDesign(), variants: nine }).expect(400);
    expect(ErrorBodySchema.parse(tooMany.body).issues).toEqual([{ path: 'variants', message: 'must hold at most 8 variants' }]);
    // eight are accepted on another link (the limit is 8, not fewer)
    const eight = await createLink('Eight variants', { variants: nine.slice(0, 8) });
    expect(eight.variants).toHaveLength(8);

    const repeated = await http()
      .post(`/api/links/${link.id}/revisions`)
      .set(...engineer())
      .send({ baseRevision: 1, design: workedExampleDesign(), variants: [...WAVELENGTH_SET, { name: '850 NM ', design: atWavelength(860e-9) }] })
      .expect(400);
    expect(ErrorBodySchema.parse(repeated.body).issues).toEqual([
      { path: 'variants.3.name', message: 'must differ from the name of variant 1 ("850 nm"); names are compared regardless of case' },
    ]);

    const unnamed = await http()
      .post('/api/links')
      .set(...engineer())
      .send({ name: 'Unnamed variant', design: workedExampleDesign(), variants: [{ name: ' ', design: workedExampleDesign() }] })
      .expect(400);
    expect(ErrorBodySchema.parse(unnamed.body).issues).toEqual([{ path: 'variants.0.name', message: 'is required' }]);
    const named = (await http().get('/api/links?q=Unnamed%20variant').set(...engineer()).expect(200)).body;
    expect(named.total).toBe(0);

    expect(await revisionNumbers(link.id)).toEqual([1]);
    expect(await storedVariantCount(link.id)).toBe(0);
    const detail = LinkDetailSchema.parse((await http().get(`/api/links/${link.id}`).set(...engineer()).expect(200)).body);
    expect(detail.revision).toBe(1);
  });

  it('writes no variant of a save that loses the race (409)', async () => {
    const link = await linkWithWavelengthSet('Stale save with variants');
    const before = await storedVariantCount(link.id);
    const stale = await http()
      .post(`/api/links/${link.id}/revisions`)
      .set(...engineer())
      .send({ baseRevision: 1, design: workedExampleDesign(), variants: WAVELENGTH_SET })
      .expect(409);
    const conflict = RevisionConflictBodySchema.parse(stale.body);
    expect(conflict.latest.variants?.map((variant) => variant.name)).toEqual(['785 nm', '850 nm', '1310 nm']);
    expect(await storedVariantCount(link.id)).toBe(before);
    expect(await revisionNumbers(link.id)).toEqual([1, 2]);
  });

  it("promotes a variant: revision n+1 has its design, the other designs as variants, a fresh draft status, and n is unchanged", async () => {
    const link = await linkWithWavelengthSet('Promoted');
    await http().post(`/api/links/${link.id}/revisions/2/submit`).set(...engineer()).send({}).expect(200);

    const response = await http().post(`/api/links/${link.id}/revisions/2/variants/1/promote`).set(...engineer()).send({}).expect(201);
    const promoted = LinkDetailSchema.parse(response.body);
    expect(promoted).toMatchObject({ revision: 3, status: 'draft', wavelengthM: 850e-9, author: { id: org.members.engineer.id } });
    expect(promoted.design).toStrictEqual(LinkDesignSchema.parse(atWavelength(850e-9)));
    expect(promoted.budget).toStrictEqual(expectedBudget(atWavelength(850e-9)));
    expect(promoted.linkMarginDb).toBe(promoted.budget.linkMarginDb);
    expect(promoted.note).toBe('Promoted the variant "850 nm" of revision 2; the design of revision 2 is kept as the variant "Primary of revision 2".');
    // the former design takes the promoted variant's place; the others keep theirs
    expect(promoted.variants!.map((variant) => [variant.index, variant.name, variant.design.transmitter.wavelengthM])).toEqual([
      [0, '785 nm', 785e-9],
      [1, 'Primary of revision 2', 1550e-9],
      [2, '1310 nm', 1310e-9],
    ]);
    for (const variant of promoted.variants!) {
      expect(variant.budget).toStrictEqual(expectedBudget(variant.design));
      expect(variant.linkCoreVersion).toBe(LINK_CORE_VERSION);
    }

    // revision 2 is as it was saved
    const second = RevisionSchema.parse((await http().get(`/api/links/${link.id}/revisions/2`).set(...engineer()).expect(200)).body);
    expect(second.design.transmitter.wavelengthM).toBe(1550e-9);
    expect(second.variants!.map((variant) => variant.name)).toEqual(['785 nm', '850 nm', '1310 nm']);
    expect(await revisionNumbers(link.id)).toEqual([1, 2, 3]);

    // promoting back with a name for the former design and a note of one's own
    const back = await http()
      .post(`/api/links/${link.id}/revisions/3/variants/1/promote`)
      .set(...engineer())
      .send({ primaryName: '850 nm', note: 'Back to 1550 nm for eye safety.' })
      .expect(201);
    const third = LinkDetailSchema.parse(back.body);
    expect(third).toMatchObject({ revision: 4, note: 'Back to 1550 nm for eye safety.', wavelengthM: 1550e-9 });
    expect(third.variants!.map((variant) => variant.name)).toEqual(['785 nm', '850 nm', '1310 nm']);
    const diff = (await http().get(`/api/links/${link.id}/diff?from=2&to=4`).set(...engineer()).expect(200)).body;
    expect(diff.changes).toEqual([]);
  });

  it('answers 409 with the latest revision when the promoted revision is no longer the latest, and lets one of two concurrent promotions win', async () => {
    const link = await linkWithWavelengthSet('Contended promotion');
    const attempts = await Promise.all([0, 2].map((index) => http().post(`/api/links/${link.id}/revisions/2/variants/${index}/promote`).set(...engineer()).send({})));
    expect(attempts.map((response) => response.status).sort()).toEqual([201, 409]);
    const winner = attempts.find((response) => response.status === 201)!;
    expect(winner.body.revision).toBe(3);

    const stale = await http().post(`/api/links/${link.id}/revisions/2/variants/0/promote`).set(...engineer()).send({}).expect(409);
    const conflict = RevisionConflictBodySchema.parse(stale.body);
    expect(conflict.latestRevision).toBe(3);
    expect(conflict.latest.design).toStrictEqual(winner.body.design);
    expect(conflict.message).toMatch(/Revision 2 is not the latest/);
    expect(await revisionNumbers(link.id)).toEqual([1, 2, 3]);
  });

  it('lets only the roles that save revisions promote (403), refuses unknown variants (404), bad indices and names (400) and archived links (409)', async () => {
    const link = await linkWithWavelengthSet('Guarded promotion');
    for (const role of ['reviewer', 'installer', 'admin'] as const) {
      const refused = await http().post(`/api/links/${link.id}/revisions/2/variants/0/promote`).set(...bearer(org.members[role])).send({}).expect(403);
      expect(ErrorBodySchema.parse(refused.body).statusCode).toBe(403);
    }
    await http().post(`/api/links/${link.id}/revisions/2/variants/0/promote`).send({}).expect(401);
    await http().post(`/api/links/${link.id}/revisions/2/variants/0/promote`).set(...bearer(other.members.engineer)).send({}).expect(404);

    const missing = await http().post(`/api/links/${link.id}/revisions/2/variants/3/promote`).set(...engineer()).send({}).expect(404);
    expect(missing.body.message).toBe('Revision 2 has no variant 3: its variants are numbered 0 to 2');
    const none = await http().post(`/api/links/${link.id}/revisions/1/variants/0/promote`).set(...engineer()).send({}).expect(404);
    expect(none.body.message).toBe('Revision 1 has no variant 0: it has none');
    await http().post(`/api/links/${link.id}/revisions/9/variants/0/promote`).set(...engineer()).send({}).expect(404);
    for (const index of ['8', '-1', 'one', '1.5']) {
      const bad = await http().post(`/api/links/${link.id}/revisions/2/variants/${index}/promote`).set(...engineer()).send({}).expect(400);
      expect(bad.body.issues).toEqual([{ path: 'index', message: 'must be a whole number from 0 to 7' }]);
    }
    const clash = await http().post(`/api/links/${link.id}/revisions/2/variants/0/promote`).set(...engineer()).send({ primaryName: '1310 NM' }).expect(400);
    expect(clash.body.issues).toEqual([{ path: 'primaryName', message: 'must differ from the name of variant 2 ("1310 nm"); names are compared regardless of case' }]);
    const unknownField = await http().post(`/api/links/${link.id}/revisions/2/variants/0/promote`).set(...engineer()).send({ baseRevision: 2 }).expect(400);
    expect(unknownField.body.issues).toEqual([{ path: 'baseRevision', message: 'is not a known field' }]);

    await http().post(`/api/links/${link.id}/archive`).set(...engineer()).expect(200);
    const archived = await http().post(`/api/links/${link.id}/revisions/2/variants/0/promote`).set(...engineer()).send({}).expect(409);
    expect(archived.body.message).toMatch(/archived/);
    expect(await revisionNumbers(link.id)).toEqual([1, 2]);
  });

  it('answers 422 naming the stored field when a stored design no longer passes the design checks, and saves nothing', async () => {
    const link = await linkWithWavelengthSet('Stored design refused');
    // a row as a looser schema of the past might have accepted it (test set-up only)
    await app
      .get(DataSource)
      .query(
        `UPDATE link_revision_variant v SET design = jsonb_set(v.design, '{rangeM}', '-5') FROM link_revision r WHERE r.id = v.revision_id AND r.link_id = $1 AND v.position = 2`,
        [link.id],
      );
    const refused = await http().post(`/api/links/${link.id}/revisions/2/variants/0/promote`).set(...engineer()).send({}).expect(422);
    const body = ErrorBodySchema.parse(refused.body);
    expect(body.issues).toEqual([{ path: 'variants.2.design.rangeM', message: expect.stringMatching(/greater than|at least/) }]);
    expect(body.message).toMatch(/revision 2 no longer passes the design checks .*nothing was saved/);
    expect(await revisionNumbers(link.id)).toEqual([1, 2]);
  });

  it("reads a variant an older engine stored with its own budget, and promotes its design as that engine meant it", async () => {
    const link = await linkWithWavelengthSet('Older engine variant');
    // The variant row as engine 0.1.0 would have stored it: its own margin, no turbulence model in
    // the design (read as the spherical wave). Test set-up only; the api never rewrites a row.
    const storedMarginDb = 7.5;
    const legacyBudget = { ...expectedBudget(atWavelength(785e-9)), linkMarginDb: storedMarginDb };
    await app
      .get(DataSource)
      .query(
        `UPDATE link_revision_variant v SET link_core_version = '0.1.0', budget = $1 FROM link_revision r WHERE r.id = v.revision_id AND r.link_id = $2 AND v.position = 0`,
        [JSON.stringify(legacyBudget), link.id],
      );
    const revision = RevisionSchema.parse((await http().get(`/api/links/${link.id}/revisions/2`).set(...engineer()).expect(200)).body);
    const legacy = revision.variants![0]!;
    expect(legacy.linkCoreVersion).toBe('0.1.0');
    expect(legacy.budget.linkMarginDb).toBe(storedMarginDb);
    const spherical = evaluateLink(LinkDesignSchema.parse({ ...atWavelength(785e-9), atmosphere: { ...atWavelength(785e-9).atmosphere, turbulenceModel: 'spherical-wave' } }));
    expect(legacy.currentEngine).toEqual({
      linkCoreVersion: LINK_CORE_VERSION,
      linkMarginDb: spherical.linkMarginDb,
      receivedPowerDbm: spherical.receivedPowerDbm,
      marginChangeDb: spherical.linkMarginDb - storedMarginDb,
      belowRequiredMargin: spherical.linkMarginDb < 3,
    });
    expect(revision.variants![1]!.currentEngine).toBeNull();

    const promoted = LinkDetailSchema.parse((await http().post(`/api/links/${link.id}/revisions/2/variants/0/promote`).set(...engineer()).send({}).expect(201)).body);
    expect(promoted.design.atmosphere.turbulenceModel).toBe('spherical-wave');
    expect(promoted.budget).toStrictEqual(asJson(spherical));
    expect(promoted.linkCoreVersion).toBe(LINK_CORE_VERSION);
  });
});
