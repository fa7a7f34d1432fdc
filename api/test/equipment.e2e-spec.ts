import type { INestApplication } from '@nestjs/common';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { EquipmentListResponseSchema, EquipmentResponseSchema } from '@beamwright/link-core/contracts';
import { createTestApp } from './utils/test-app.js';
import { bearer, createTestOrganisation, type TestOrganisation } from './utils/test-organisation.js';

const transmitter = {
  kind: 'transmitter',
  name: 'Test emitter 850',
  maker: 'Test optics',
  spec: {
    wavelengthM: 850e-9,
    powerDbm: 16,
    beamSize: { kind: 'exit-diameter', diameterM: 0.04, definition: '1/e2' },
    divergence: { angleRad: 2e-3, angle: 'full', definition: '1/e2' },
    opticsLossDb: 1.5,
  },
};

const receiver = {
  kind: 'receiver',
  name: 'Test receiver 100',
  spec: { apertureDiameterM: 0.1, opticsLossDb: 1, sensitivityDbm: -30, dataRateBps: 1.25e9, overloadDbm: -3 },
};

describe('equipment catalogue (e2e)', () => {
  let app: INestApplication;
  let org: TestOrganisation;
  let other: TestOrganisation;

  beforeAll(async () => {
    app = await createTestApp();
    org = await createTestOrganisation(app, 'equipment');
    other = await createTestOrganisation(app, 'rival');
  });

  afterAll(async () => {
    await org?.remove();
    await other?.remove();
    await app?.close();
  });

  const http = () => request(app.getHttpServer());

  it('lets engineers and admins add models, everyone in the organisation read them', async () => {
    const created = EquipmentResponseSchema.parse((await http().post('/api/equipment').set(...bearer(org.members.engineer)).send(transmitter).expect(201)).body);
    expect(created).toMatchObject({ kind: 'transmitter', name: 'Test emitter 850', illustrative: false, spec: { m2: 1 } });
    await http().post('/api/equipment').set(...bearer(org.members.admin)).send(receiver).expect(201);
    await http().post('/api/equipment').set(...bearer(org.members.installer)).send(receiver).expect(403);
    await http().post('/api/equipment').set(...bearer(org.members.reviewer)).send(receiver).expect(403);

    const receivers = EquipmentListResponseSchema.parse((await http().get('/api/equipment?kind=receiver').set(...bearer(org.members.installer)).expect(200)).body);
    expect(receivers.items.map((item) => item.name)).toEqual(['Test receiver 100']);
    await http().get(`/api/equipment/${created.id}`).set(...bearer(other.members.admin)).expect(404);
    await http().patch(`/api/equipment/${created.id}`).set(...bearer(other.members.engineer)).send({ name: 'x' }).expect(404);
  });

  it('rejects bad figures with the field path, also when a spec is replaced', async () => {
    const bad = { ...transmitter, spec: { ...transmitter.spec, wavelengthM: 0, beamSize: { kind: 'exit-diameter', diameterM: 0.04 } } };
    const response = await http().post('/api/equipment').set(...bearer(org.members.engineer)).send(bad).expect(400);
    expect(response.body.issues.map((issue: { path: string }) => issue.path).sort()).toEqual(['spec.beamSize.definition', 'spec.wavelengthM']);

    const model = (await http().post('/api/equipment').set(...bearer(org.members.engineer)).send(receiver).expect(201)).body;
    const patch = await http()
      .patch(`/api/equipment/${model.id}`)
      .set(...bearer(org.members.engineer))
      .send({ spec: { ...receiver.spec, overloadDbm: -40 } })
      .expect(400);
    expect(patch.body.issues).toEqual([{ path: 'spec.overloadDbm', message: 'must be greater than the sensitivity' }]);
    const renamed = await http().patch(`/api/equipment/${model.id}`).set(...bearer(org.members.engineer)).send({ name: 'Renamed receiver' }).expect(200);
    expect(renamed.body.name).toBe('Renamed receiver');
    await http().delete(`/api/equipment/${model.id}`).set(...bearer(org.members.admin)).expect(204);
    await http().get(`/api/equipment/${model.id}`).set(...bearer(org.members.admin)).expect(404);
  });
});
