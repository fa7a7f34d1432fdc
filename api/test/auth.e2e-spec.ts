import type { INestApplication } from '@nestjs/common';
import { JwtService } from '@nestjs/jwt';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ErrorBodySchema, LoginResponseSchema, MeResponseSchema } from '@beamwright/link-core/contracts';
import { createTestApp } from './utils/test-app.js';
import { bearer, createTestOrganisation, TEST_PASSWORD, type TestOrganisation } from './utils/test-organisation.js';

describe('sign-in, tokens and roles (e2e)', () => {
  let app: INestApplication;
  let north: TestOrganisation;
  let south: TestOrganisation;

  beforeAll(async () => {
    app = await createTestApp();
    north = await createTestOrganisation(app, 'north');
    south = await createTestOrganisation(app, 'south');
  });

  afterAll(async () => {
    await north?.remove();
    await south?.remove();
    await app?.close();
  });

  const http = () => request(app.getHttpServer());

  it('signs in with the right password and returns a token with its lifetime', async () => {
    const response = await http().post('/api/auth/login').send({ email: north.members.engineer.email, password: TEST_PASSWORD }).expect(200);
    const body = LoginResponseSchema.parse(response.body);
    expect(body.expiresInS).toBe(15 * 60);
    expect(body.accessToken.split('.')).toHaveLength(3);
  });

  it('accepts the e-mail in any letter case', async () => {
    await http().post('/api/auth/login').send({ email: north.members.engineer.email.toUpperCase(), password: TEST_PASSWORD }).expect(200);
  });

  it('answers 401 with one message for a wrong password and for an unknown user', async () => {
    const wrongPassword = await http().post('/api/auth/login').send({ email: north.members.engineer.email, password: 'not-the-password' }).expect(401);
    const unknownUser = await http().post('/api/auth/login').send({ email: 'nobody@nowhere.test', password: TEST_PASSWORD }).expect(401);
    expect(ErrorBodySchema.parse(wrongPassword.body)).toEqual({ statusCode: 401, error: 'Unauthorized', message: 'E-mail or password is incorrect' });
    expect(unknownUser.body).toEqual(wrongPassword.body);
    expect(wrongPassword.body).not.toHaveProperty('accessToken');
  });

  it('answers 400 with field paths for a malformed sign-in body', async () => {
    const response = await http().post('/api/auth/login').send({ email: 'not-an-email' }).expect(400);
    const body = ErrorBodySchema.parse(response.body);
    expect(body.issues).toEqual(
      expect.arrayContaining([
        { path: 'email', message: 'must be an e-mail address' },
        { path: 'password', message: 'is required' },
      ]),
    );
  });

  it('answers 400 in the error shape for malformed JSON', async () => {
    const response = await http().post('/api/auth/login').set('Content-Type', 'application/json').send('{"email": "a@b.test",').expect(400);
    expect(response.body).toEqual({ statusCode: 400, error: 'Bad Request', message: 'The request body is not valid JSON' });
  });

  it('tells the caller who they are, with organisation and role', async () => {
    const response = await http().get('/api/auth/me').set(...bearer(north.members.reviewer)).expect(200);
    const me = MeResponseSchema.parse(response.body);
    expect(me).toEqual({
      user: { id: north.members.reviewer.id, email: north.members.reviewer.email, displayName: 'reviewer north' },
      organisation: { id: north.id, name: north.name },
      role: 'reviewer',
    });
  });

  it('answers 401 on data routes without a token or with a forged one', async () => {
    await http().get('/api/auth/me').expect(401);
    await http().get('/api/sites').expect(401);
    const forged = new JwtService({ secret: 'some-other-secret-entirely' }).sign({ sub: north.members.admin.id, org: north.id, role: 'admin' });
    const response = await http().get('/api/sites').set('Authorization', `Bearer ${forged}`).expect(401);
    expect(ErrorBodySchema.parse(response.body).statusCode).toBe(401);
  });

  it('rejects an expired token', async () => {
    const jwt = new JwtService({ secret: process.env.JWT_SECRET });
    const nowS = Math.floor(Date.now() / 1000);
    // the claims of a real sign-in (its session is live), re-signed with other times
    const { sub, org, sid } = jwt.decode<{ sub: string; org: string; sid: string }>(north.members.engineer.token);
    const claims = { sub, org, sid };
    const expired = jwt.sign({ ...claims, iat: nowS - 120, exp: nowS - 60 });
    const response = await http().get('/api/auth/me').set('Authorization', `Bearer ${expired}`).expect(401);
    expect(response.body.message).toMatch(/expired/);
    // the same claims, still valid, pass: the rejection above is about the expiry only
    const valid = jwt.sign({ ...claims, iat: nowS, exp: nowS + 60 });
    await http().get('/api/auth/me').set('Authorization', `Bearer ${valid}`).expect(200);
  });

  it('answers 403 when the role lacks the right', async () => {
    const site = { name: 'Roof', latitudeDeg: 51.5, longitudeDeg: -0.1, groundElevationM: 20, mountHeightM: 12 };
    for (const role of ['installer', 'reviewer'] as const) {
      const response = await http().post('/api/sites').set(...bearer(north.members[role])).send(site).expect(403);
      expect(ErrorBodySchema.parse(response.body).error).toBe('Forbidden');
    }
    const created = await http().post('/api/sites').set(...bearer(north.members.engineer)).send(site).expect(201);
    // readers may still read
    await http().get(`/api/sites/${created.body.id}`).set(...bearer(north.members.installer)).expect(200);
  });

  it("never shows one organisation's data to another: 404, not 403", async () => {
    const site = { name: 'North mast', latitudeDeg: 52.1, longitudeDeg: 5.1, groundElevationM: 3, mountHeightM: 30 };
    const created = await http().post('/api/sites').set(...bearer(north.members.admin)).send(site).expect(201);
    const id = created.body.id as string;

    const read = await http().get(`/api/sites/${id}`).set(...bearer(south.members.admin)).expect(404);
    expect(read.body).toEqual({ statusCode: 404, error: 'Not Found', message: 'Site not found' });
    await http().patch(`/api/sites/${id}`).set(...bearer(south.members.engineer)).send({ name: 'Taken over' }).expect(404);
    await http().delete(`/api/sites/${id}`).set(...bearer(south.members.admin)).expect(404);
    const southList = await http().get('/api/sites').set(...bearer(south.members.installer)).expect(200);
    expect(southList.body.items.map((item: { id: string }) => item.id)).not.toContain(id);

    // untouched for its owners
    const again = await http().get(`/api/sites/${id}`).set(...bearer(north.members.installer)).expect(200);
    expect(again.body.name).toBe('North mast');
  });

  it('answers 400 naming the parameter for an id that is not a UUID', async () => {
    const response = await http().get('/api/sites/not-a-uuid').set(...bearer(north.members.admin)).expect(400);
    expect(response.body.issues).toEqual([{ path: 'id', message: 'must be a UUID' }]);
  });

  it('serves the OpenAPI document without a token', async () => {
    const response = await http().get('/api/docs-json').expect(200);
    expect(Object.keys(response.body.paths)).toEqual(expect.arrayContaining(['/api/auth/login', '/api/auth/me', '/api/health', '/api/sites']));
  });

  it('answers an unknown /api route with a JSON 404 and says the UI is not built when it is missing', async () => {
    const missing = await http().get('/api/no-such-route').expect(404);
    expect(ErrorBodySchema.parse(missing.body).statusCode).toBe(404);
    const root = await http().get('/').expect(200);
    expect(root.text).toContain('UI is not built');
  });
});
